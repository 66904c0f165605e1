/**
 * Read-back of Gerber and Excellon files through third-party parsers (gerber-parser + gerber-plotter,
 * npm), and rendering through gerber-to-svg → @resvg/resvg-js → pngjs for an area measured in pixels.
 * Each catches different faults (the project's own rule: two independent readers). Warnings the parser gives for X2 attributes it does not
 * implement ("... was not recognized and was ignored" for %TF/%TA/%TD) are separated from real warnings.
 */
import gerberParser from 'gerber-parser';
import gerberPlotter from 'gerber-plotter';
import gerberToSvg from 'gerber-to-svg';
import { darkArea, type DarkArea } from './svg-raster.ts';

export interface ReadBack {
  units: string | null;
  /** Image extent [xmin, ymin, xmax, ymax] in the file's units. */
  box: number[] | null;
  /** Warnings other than the ignored X2 attribute blocks. */
  warnings: string[];
  /** X2 attribute blocks the parser skipped (expected: it does not implement X2). */
  ignoredAttributes: string[];
  /** Plotter objects other than 'size' (shapes, pads, fills, polarity). */
  objects: { type: string; [k: string]: unknown }[];
  /** The parser reached the end-of-file command (M02 / M30). */
  done: boolean;
}

export function readBack(text: string): Promise<ReadBack> {
  return new Promise((resolve, reject) => {
    const parser = (gerberParser as unknown as (o: object) => NodeJS.ReadWriteStream)({});
    const plotter = (gerberPlotter as unknown as (o: object) => NodeJS.ReadWriteStream)({});
    const r: ReadBack = { units: null, box: null, warnings: [], ignoredAttributes: [], objects: [], done: false };
    parser.on('warning', (w: { line: number; message: string }) => {
      if (/^block "%T[FAOD].*" was not recognized and was ignored$/.test(w.message)) r.ignoredAttributes.push(w.message);
      else r.warnings.push(`parser line ${w.line}: ${w.message}`);
    });
    parser.on('data', (o: { type: string }) => { if (o.type === 'done') r.done = true; });
    plotter.on('warning', (w: { line: number; message: string }) => r.warnings.push(`plotter line ${w.line}: ${w.message}`));
    plotter.on('data', (o: { type: string; box?: number[]; units?: string }) => {
      if (o.type === 'size') { r.box = o.box ?? null; r.units = o.units ?? null; } else r.objects.push(o);
    });
    plotter.on('error', reject);
    parser.on('error', reject);
    plotter.on('end', () => resolve(r));
    parser.pipe(plotter);
    parser.end(text);
  });
}

/** gerber-to-svg's rendering of a file (viewBox in µm when the file is in mm). */
export function gerberSvg(text: string): Promise<string> {
  return new Promise((resolve, reject) => {
    (gerberToSvg as unknown as (t: string, o: object, cb: (e: Error | null, s: string) => void) => void)(
      text, { id: 'oracle', color: '#000' }, (err, svg) => (err ? reject(err) : resolve(svg)));
  });
}

/** Dark area of a Gerber file rendered by gerber-to-svg and rasterised by resvg at `pxPerMm`. */
export async function gerberDarkArea(text: string, pxPerMm = 20): Promise<DarkArea> {
  return darkArea(await gerberSvg(text), pxPerMm);
}

// Command line use: `npx tsx scripts/oracles/gerber-read.ts FILE...` prints units, extent, warnings and the
// rendered dark area of each Gerber or Excellon file.
if (import.meta.url === `file://${process.argv[1]}`) {
  const { readFileSync } = await import('node:fs');
  for (const f of process.argv.slice(2)) {
    const text = readFileSync(f, 'utf8');
    const r = await readBack(text);
    const a = await gerberDarkArea(text, 20);
    console.log(`${f}: units ${r.units}, box [${r.box?.join(', ')}], ${r.objects.length} objects, end ${r.done ? 'found' : 'MISSING'}, dark area ${a.areaMm2.toFixed(3)} mm²`);
    for (const w of r.warnings) console.log(`  warning: ${w}`);
  }
}
