/**
 * Worker jobs of the measured-data and report features: the comparison of the design with a measured file (swept at
 * the file's own frequencies, then the core's compareMeasured — the same call as `stripwright sweep --compare`), the
 * Touchstone file of the design (the same bytes as `stripwright sweep --out` for the same file name), and the design
 * report (the core's designReport, as `stripwright report`).
 */
import type { DesignDoc, MeasuredFile } from '../../../core/index.ts';
import { sizeDesign } from '../../../core/index.ts';
import { netlistFromSized, sweepNetwork, bandSweep, readTouchstone, compareMeasured, writeTouchstone, magnitudeDb } from '../../../core/index.ts';
import { designReport } from '../../../core/index.ts';
import type { Progress } from './client.ts';

export interface CompareInput { doc: DesignDoc; measured: MeasuredFile }
export interface CompareOutput {
  freqs: number[];
  ports: string[];
  input: number;
  entries: { i: number; j: number; sim: number[]; meas: number[]; diffDb: number[]; worstVector: { value: number; freq: number }; worstDb: { value: number; freq: number } }[];
  warnings: string[];
}

const yieldTo = () => new Promise<void>((ok) => setTimeout(ok, 0));

export async function compareJob(input: CompareInput, progress: (p: Progress) => void): Promise<CompareOutput> {
  const sized = sizeDesign(input.doc);
  const net = netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {});
  const freqs = readTouchstone(input.measured.touchstone, { fileName: input.measured.name }).freqs;
  const sim = await sweepNetwork(net, freqs, { onProgress: (done, total) => progress({ done, total, label: 'sweeping' }), yieldTo });
  const c = compareMeasured(sim, input.measured);
  return {
    freqs: [...c.diff.freqs], ports: sim.ports.map((p) => p.name), input: net.input,
    entries: c.diff.entries.map((e) => ({
      i: e.i, j: e.j, sim: [...magnitudeDb(sim, e.i, e.j)], meas: [...magnitudeDb(c.measured, e.i, e.j)], diffDb: [...e.dbSeries].map((d) => -d),
      worstVector: e.vector, worstDb: e.db,
    })),
    warnings: [...sim.warnings, ...c.warnings].map((w) => w.message),
  };
}

/**
 * The design's Touchstone file as `stripwright sweep FILE --out NAME.sNp` writes it (band widened to f0, 201 points, RI,
 * GHz): version 1.1 when every port has the same reference, else 2.0, which keeps each port's own (`--touchstone 2.0`).
 */
export async function touchstoneFile(doc: DesignDoc, fileName: string, app: string): Promise<{ name: string; data: string }> {
  const sized = sizeDesign(doc);
  const net = netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {});
  const r = await sweepNetwork(net, bandSweep(doc.frequency.band, doc.frequency.f0, 201), { yieldTo });
  const base = fileName.replace(/\.json$/i, '');
  const mixed = r.ports.some((p) => p.zRef !== r.ports[0]!.zRef);
  return { name: `${base}.s${r.ports.length}p`, data: writeTouchstone(r, { app, design: doc.name, comments: [`from ${fileName}`], ...(mixed ? { version: '2.0' as const } : {}) }) };
}

/** Where the report font comes from: the worker fetches Vite's asset URL; tests pass bytes. */
let fontLoader: (() => Promise<Uint8Array>) | null = null;
let fontBytes: Promise<Uint8Array> | null = null;
export function setReportFont(load: () => Promise<Uint8Array>): void { fontLoader = load; fontBytes = null; }

export async function reportFile(doc: DesignDoc, base: string, app: string): Promise<{ name: string; data: Uint8Array }> {
  if (!fontLoader) throw new Error('the report font is not available here (setReportFont was not called)');
  fontBytes ??= fontLoader();
  const r = await designReport(doc, { font: await fontBytes, app });
  return { name: `${base}-report.pdf`, data: r.pdf };
}
