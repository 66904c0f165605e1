/**
 * The block picker's preview, as a worker job (block-preview.worker.ts; inline in component tests): the block made
 * for the open design's laminate, process and f0 exactly as placing makes it (core blockPlacement, which generates,
 * folds into the footprint or refuses), put into an empty copy of the design (core withBlock), its copper (each
 * piece's own outline, core pieceOutlines) and a coarse sweep over the block's own band with the core's one sweep
 * (`sweepDesign`, as the response panel uses after placing), plus f0 itself, so the figures beside the plot are the
 * placed block's sweep at f0. Nothing here computes physics; it only sequences core calls.
 */
import { blockPlacement, withBlock, sweepDesign, magnitudeDb, phaseDeg, pieceOutlines, DesignPipeline, type DesignDoc } from '../../../core/index.ts';
import { regionsPath } from '../board/paths.ts';

/** The open design (only its laminate, process, f0, junctions and settings are read) and the spec as typed. */
export interface BlockPreviewInput { host: DesignDoc; kind: string; raw: Record<string, unknown> }

export interface PreviewTrace { kind: 'match' | 'transmission' | 'isolation'; /** e.g. "in → out3". */ label: string; db: number[] }

export interface BlockPreviewOutput {
  name: string;
  notes: string[];
  /** Each piece's copper as SVG path text in board mm, and their extent, m. */
  copper: string[];
  box: { x0: number; y0: number; x1: number; y1: number };
  /** The coarse sweep: PREVIEW_POINTS over the block's band and f0 among them, Hz; `band` is its span. */
  freqs: number[];
  band: { start: number; stop: number };
  f0: number;
  traces: PreviewTrace[];
  /** The same sweep at f0: input match, each output's level and phase from the input, isolations the block names. */
  atF0: { match: number; levels: { port: string; db: number; deg: number }[]; isolation: { ports: [string, string]; db: number }[] };
}

/** Points of the coarse sweep over the block's band (f0 is added when it is not one of them). */
export const PREVIEW_POINTS = 41;

/** A pipeline of its own: previews of specs typed in a row must not push the design's own stages out of the worker's. */
const pipeline = new DesignPipeline({ capacity: 4 });

/** The design the picker's preview stands for: the open design's settings with no pieces, and the block placed at the origin. */
export function previewDesign(host: DesignDoc, kind: string, raw: Record<string, unknown>): { doc: DesignDoc; id: string; name: string; notes: string[]; band: { start: number; stop: number } } {
  const { app: _app, measured: _m, ...settings } = host as DesignDoc & { app?: unknown; measured?: unknown };
  const empty: DesignDoc = { ...settings, nodes: [], segments: [], areas: [], phaseGroups: [], targets: [], blocks: [] } as DesignDoc;
  const pl = blockPlacement(empty, kind, raw, { x: 0, y: 0 });
  const doc = withBlock(empty, pl);
  // Isolation targets carry port ids; keep them for the plot.
  return { doc, id: pl.record.id, name: pl.name, notes: pl.notes, band: pl.band };
}

export async function blockPreviewJob(input: BlockPreviewInput): Promise<BlockPreviewOutput> {
  const { doc, id, name, notes, band } = previewDesign(input.host, input.kind, input.raw);
  const sized = pipeline.sized(doc);
  const outlines = pieceOutlines(sized).outlines;
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const o of outlines) for (const r of o.regions) for (const p of r.outer) {
    x0 = Math.min(x0, p.x); x1 = Math.max(x1, p.x); y0 = Math.min(y0, p.y); y1 = Math.max(y1, p.y);
  }
  const f0 = doc.frequency.f0;
  // The coarse sweep over the block's band, with f0 itself among its points (the sweep wants them increasing).
  const grid = Array.from({ length: PREVIEW_POINTS }, (_, k) => band.start + ((band.stop - band.start) * k) / (PREVIEW_POINTS - 1));
  const freqs = [...grid.filter((f) => f !== f0), f0].sort((a, b) => a - b);
  const k0 = freqs.indexOf(f0);
  const { response: r, net } = await sweepDesign(pipeline, doc, freqs);
  const P = r.ports.length, input0 = net.input;
  const short = (k: number) => r.ports[k]!.name.replace(`${id}.`, '');
  const index = (nodeId: string) => r.ports.findIndex((p) => p.name === nodeId);
  const curve = (i: number, j: number) => { const v = magnitudeDb(r, i, j); return { band: Array.from(v), atF0: v[k0]! }; };
  const traces: PreviewTrace[] = [];
  const match = curve(input0, input0);
  traces.push({ kind: 'match', label: `${short(input0)} match`, db: match.band });
  const levels: BlockPreviewOutput['atF0']['levels'] = [];
  for (let j = 0; j < P; j++) {
    if (j === input0) continue;
    const c = curve(j, input0);
    traces.push({ kind: 'transmission', label: `${short(input0)} → ${short(j)}`, db: c.band });
    levels.push({ port: short(j), db: c.atF0, deg: phaseDeg(r, j, input0)[k0]! });
  }
  const isolation: BlockPreviewOutput['atF0']['isolation'] = [];
  for (const t of doc.targets) {
    if (t.figure !== 'isolation' || !t.ports || t.ports.length !== 2) continue;
    const a = index(t.ports[0]!), b = index(t.ports[1]!);
    if (a < 0 || b < 0) continue;
    const c = curve(b, a);
    traces.push({ kind: 'isolation', label: `${short(a)} ↔ ${short(b)}`, db: c.band });
    isolation.push({ ports: [short(a), short(b)], db: c.atF0 });
  }
  return {
    name, notes, copper: outlines.map((o) => regionsPath(o.regions)),
    box: Number.isFinite(x0) ? { x0, y0, x1, y1 } : { x0: 0, y0: 0, x1: 0, y1: 0 },
    freqs, band: { start: freqs[0]!, stop: freqs[freqs.length - 1]! }, f0, traces, atF0: { match: match.atF0, levels, isolation },
  };
}
