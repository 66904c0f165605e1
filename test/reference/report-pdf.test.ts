/**
 * The design report read by an outside implementation: poppler (Debian poppler-utils) — pdfinfo for the page size
 * and metadata, pdffonts for the embedded font, pdftotext for the words, pdftoppm for a rendered page. The plotted
 * |S11| curve is found in the rendered pixels by its colour and read back through the plot's axes; it must agree with
 * the response the app shows (the same core sweep, run here in-process) to within the drawn line's width.
 * ISO 216 A4 is 210 × 297 mm = 595.276 × 841.89 pt (1 pt = 1/72 in).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDesign, initPolygons, designReport, designHash, sizeDesign, netlistFromSized, sweepNetwork, bandSweep, magnitudeDb, type DesignDoc } from '../../core/index.ts';
import pkg from '../../package.json' with { type: 'json' };

const ROOT = join(import.meta.dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'sw-report-'));
const FONT = new Uint8Array(readFileSync(join(ROOT, 'node_modules', 'dejavu-fonts-ttf', 'ttf', 'DejaVuSans.ttf')));
const APP = `stripwright ${pkg.version}`;

/** The CLI from source, as test/cli does (not imported from there, so its tests do not run again here). */
function cli(args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'cli', 'main.ts'), ...args], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

function load(name: string): DesignDoc {
  const p = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', name), 'utf8'));
  if (!p.ok) throw new Error(`${name} does not load`);
  return p.doc;
}

function tool(name: string, args: string[]): string {
  const r = spawnSync(name, args, { encoding: 'utf8' });
  if (r.error) throw new Error(`${name} not found: apt-get install poppler-utils`);
  expect(r.status, r.stderr).toBe(0);
  expect(r.stderr).toBe('');
  return r.stdout;
}

beforeAll(() => initPolygons());

describe('stripwright report (read back with poppler)', () => {
  const out = join(dir, 'demo.pdf');
  let doc: DesignDoc;
  beforeAll(() => {
    doc = load('demo.json');
    const r = cli(['report', join(ROOT, 'assets', 'examples', 'demo.json'), '--out', out]);
    expect(r.code, r.stderr).toBe(0);
  }, 60_000);

  it('is A4 on every page, with the design hash and the version in the metadata and no date', () => {
    const info = tool('pdfinfo', ['-l', '99', out]);
    const sizes = [...info.matchAll(/Page\s+\d+ size:\s+([\d.]+) x ([\d.]+) pts/g)];
    expect(sizes.length).toBeGreaterThanOrEqual(3);
    for (const s of sizes) { expect(Number(s[1])).toBeCloseTo(595.276, 2); expect(Number(s[2])).toBeCloseTo(841.89, 1); }
    expect(info).toContain(`design-hash:${designHash(doc)}`);
    expect(info).toMatch(new RegExp(`Producer:\\s+${APP}`));
    expect(info).not.toMatch(/CreationDate|ModDate/);
  });

  it('embeds DejaVu Sans with a Unicode map (pdffonts)', () => {
    const rows = tool('pdffonts', [out]).split('\n').slice(2).filter(Boolean);
    expect(rows.length).toBe(1);
    expect(rows[0]).toMatch(/DejaVuSans\S*\s+CID TrueType\s+Identity-H\s+yes\s+no\s+yes/);
  });

  it('holds every section, the Greek letters and each piece as the sizing gives it (pdftotext)', () => {
    const t = tool('pdftotext', ['-layout', out, '-']);
    for (const h of ['Board', 'Laminate and process', 'Pieces (at f0)', 'Path ledger', 'Shop check', 'Response (simulated)', 'Smith chart', 'Models used', 'Not modelled', 'Cautions']) expect(t).toContain(h);
    for (const c of ['Ω', 'εr', 'Γ', '°', 'tan δ']) expect(t).toContain(c);
    for (const c of ['RF exposure', 'Glass-fibre dust', 'Etchants', 'Spindles', 'local']) expect(t).toContain(c);
    expect(t).toMatch(/Radiation/);
    expect(t).toMatch(/enclosure/);
    expect(t).toContain('Hammerstad');
    const sized = sizeDesign(doc);
    for (const p of sized.pieces) {
      const row = new RegExp(`${p.z0.toFixed(2)}\\s+${(p.width * 1000).toFixed(4)}\\s+${(p.length * 1000).toFixed(4)}\\s+${p.effectiveDeg.toFixed(2)}`);
      expect(t, p.id).toMatch(row);
    }
  });

  it('is the same bytes as the core call the app makes, and the same again on a second run', async () => {
    const a = await designReport(doc, { font: FONT, app: APP });
    expect(Buffer.from(a.pdf).equals(readFileSync(out))).toBe(true);
    const b = await designReport(doc, { font: FONT, app: APP });
    expect(Buffer.from(b.pdf).equals(Buffer.from(a.pdf))).toBe(true);
  }, 30_000);

  it('plots |S11| where the sweep puts it: the rendered curve read back through the axes (pdftoppm)', async () => {
    const rep = await designReport(doc, { font: FONT, app: APP });
    const plot = rep.plots.find((p) => p.name === 'magnitude')!;
    const s11 = plot.traces.find((t) => t.i === t.j)!;
    const DPI = 150, PX = DPI / 25.4;
    tool('pdftoppm', ['-r', String(DPI), '-f', String(plot.page + 1), '-l', String(plot.page + 1), '-singlefile', out, join(dir, 'page')]);
    const buf = readFileSync(join(dir, 'page.ppm'));
    const m = /^P6\s+(\d+)\s+(\d+)\s+(\d+)\s/.exec(buf.subarray(0, 40).toString('latin1'))!; // Netpbm PPM header
    const w = Number(m[1]), px = buf.subarray(m[0].length);
    const want = s11.colour.map((c) => Math.round(c * 255));
    // Per pixel column inside the plot area: the rows of the trace's colour; their middle is the curve.
    const a = plot.area, dbAt = (row: number) => plot.yRange[1] - ((row / PX - a.y) / a.h) * (plot.yRange[1] - plot.yRange[0]);
    const read: { f: number; db: number }[] = [];
    for (let x = Math.ceil((a.x + 1) * PX); x < (a.x + a.w - 1) * PX; x += 3) {
      const rows: number[] = [];
      for (let y = Math.ceil(a.y * PX); y < (a.y + a.h) * PX; y++) {
        const o = 3 * (y * w + x);
        if (Math.abs(px[o]! - want[0]!) + Math.abs(px[o + 1]! - want[1]!) + Math.abs(px[o + 2]! - want[2]!) < 60) rows.push(y);
      }
      if (rows.length) read.push({ f: plot.xRange[0] + ((x / PX - a.x) / a.w) * (plot.xRange[1] - plot.xRange[0]), db: dbAt((rows[0]! + rows[rows.length - 1]!) / 2) });
    }
    expect(read.length).toBeGreaterThan(100);
    // The app's figures: the same sizing and sweep the app's worker runs, in-process here.
    const sized = sizeDesign(doc);
    const net = netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {});
    const r = await sweepNetwork(net, bandSweep(doc.frequency.band, doc.frequency.f0, 401));
    const db = magnitudeDb(r, net.input, net.input);
    const at = (f: number) => { let k = 0; while (k < r.freqs.length - 2 && r.freqs[k + 1]! < f) k++; const t = (f - r.freqs[k]!) / (r.freqs[k + 1]! - r.freqs[k]!); return db[k]! * (1 - t) + db[k + 1]! * t; };
    // Tolerance: one pixel and half the 0.35 mm line, in dB of this axis.
    const tol = ((1 / PX + 0.2) / a.h) * (plot.yRange[1] - plot.yRange[0]);
    let worst = 0;
    for (const p of read) worst = Math.max(worst, Math.abs(p.db - at(p.f)));
    expect(worst).toBeLessThan(tol);
    expect(Math.max(...read.map((p) => p.db))).toBeCloseTo(Math.max(...db), 0);
  }, 60_000);

  it('draws a small board at full size and says so', async () => {
    const rep = await designReport(load('wilkinson-2g45.json'), { font: FONT, app: APP });
    expect(rep.boardScale).toBe(1);
    const file = join(dir, 'wilk.pdf');
    writeFileSync(file, rep.pdf);
    expect(tool('pdftotext', [file, '-'])).toContain('full size (1:1)');
  }, 30_000);

  it('refuses to replace a file without --force and needs --out', () => {
    expect(cli(['report', join(ROOT, 'assets', 'examples', 'demo.json'), '--out', out]).code).toBe(1);
    expect(cli(['report', join(ROOT, 'assets', 'examples', 'demo.json')]).code).toBe(2);
  });
});
