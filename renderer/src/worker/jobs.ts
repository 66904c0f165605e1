/**
 * The jobs the compute worker runs, as plain functions of plain data (so they also run inline in tests):
 * layout (sizing, copper geometry, paths and phase, fabrication checks) and response (a sweep of the sized
 * network). All physics and geometry come from the core; this file only sequences the calls and reports progress.
 */
import type { DesignDoc } from '../../../core/index.ts';
import type { BoardGeometry, DrillHit, Region } from '../../../core/index.ts';
import { initPolygons } from '../../../core/index.ts';
import { sizeDesign, asMadeLineOptions, LineCache, designPaths, boardGeometryOf, checkBoard, pieceOutlines, type SizedDesign, type PathReport } from '../../../core/index.ts';
import type { PieceOutline } from '../../../core/index.ts';
import type { Finding } from '../../../core/index.ts';
import { netlistFromSized, sweepNetwork, bandSweep, magnitudeDb, phaseDeg, groupDelay, smith, type NetworkResponse } from '../../../core/index.ts';
import { InputError, exhaustive } from '../../../core/index.ts';
import { runYield, type YieldResult } from '../../../core/index.ts';
import { EXPORT_FILE_NAMES, toDxf, toSvg, toGerber, toExcellon, toMask, exportGcode, planDesignMilling, millingPreviewSvg, type ExportLayer } from '../../../core/index.ts';
import type { MilledPiece, MillFinding, MillingOptions } from '../../../core/index.ts';
import type { JobKind } from './protocol.ts';
import type { Progress } from './client.ts';
import { regionsPath } from '../board/paths.ts';
import { sectionJob, type SectionInput } from './section-job.ts';

export interface LayoutInput { doc: DesignDoc; /** Also work out each path's phase sensitivity to εr, h and W (slower). */ sensitivities?: boolean }
/**
 * The live layout: sized pieces and each piece's own copper (no union, so it needs no polygon engine and stays
 * fast while dragging). The united board geometry is built only for outputs (geometryJob).
 */
export interface LayoutOutput { sized: SizedDesign; outlines: (PieceOutline & { d: string })[]; drills: DrillHit[]; paths: PathReport[]; geometryError: string | null }

export interface ResponseInput { doc: DesignDoc; points?: number }
/** Plot-ready series: for every (i, j) pair |S| in dB, phase in degrees and group delay in s; reflections for Smith. */
export interface ResponseOutput {
  freqs: number[];
  ports: string[];
  input: number;
  traces: { i: number; j: number; db: number[]; phase: number[]; delay: number[] }[];
  smith: { i: number; re: number[]; im: number[] }[];
  warnings: string[];
}

export interface CheckOutput { findings: Finding[]; /** Ground copper left after clearing around the network. */ ground: Region[] }

/** How the polygon engine finds its wasm: the worker passes Vite's asset URL; Node needs nothing. */
let polygonInit: (() => Promise<void>) | null = null;
let polygonsReady: Promise<void> | null = null;

export function setPolygonInit(init: () => Promise<void>): void { polygonInit = init; }

function polygons(): Promise<void> {
  polygonsReady ??= (polygonInit ?? (() => initPolygons()))();
  return polygonsReady;
}

// One line cache per substrate and line-model choice: re-sizing on every keystroke then costs Map lookups.
let cache: { key: string; cache: LineCache } | null = null;
function lineCache(doc: DesignDoc): LineCache {
  const key = JSON.stringify([doc.substrate, doc.asMade ?? null, doc.asMade?.sizing === 'as-made' ? doc.process : null, doc.asMade?.sizing === 'as-made' ? doc.areas : null]);
  if (!cache || cache.key !== key) cache = { key, cache: new LineCache(doc.substrate, asMadeLineOptions(doc)) };
  return cache.cache;
}

export async function runJob(kind: JobKind, input: unknown, progress: (p: Progress) => void, signal?: AbortSignal): Promise<unknown> {
  switch (kind) {
    case 'yield': return yieldJob(input as YieldInput, progress, signal);
    case 'layout': return layoutJob(input as LayoutInput, progress);
    case 'geometry': return geometryJob(input as LayoutInput);
    case 'export': return exportJob(input as ExportInput);
    case 'check': return checkJob(input as LayoutInput);
    case 'response': return responseJob(input as ResponseInput, progress);
    case 'section': return sectionJob(input as SectionInput);
    case 'milling': return millingJob(input as MillingInput);
    default: return exhaustive(kind, 'job');
  }
}

export async function layoutJob(input: LayoutInput, progress: (p: Progress) => void): Promise<LayoutOutput> {
  progress({ done: 0, total: 2, label: 'sizing' });
  const sized = sizeDesign(input.doc, { cache: lineCache(input.doc) });
  progress({ done: 1, total: 2, label: 'copper' });
  let outlines: (PieceOutline & { d: string })[] = [];
  let drills: DrillHit[] = [];
  let geometryError: string | null = null;
  try {
    const made = pieceOutlines(sized);
    outlines = made.outlines.map((o) => ({ ...o, d: regionsPath(o.regions) }));
    drills = made.drills;
  } catch (err) {
    // The sizes are still worth showing when the copper cannot be drawn (an unplaced piece, for example).
    geometryError = errorText(err);
  }
  let paths: PathReport[] = [];
  if (!sized.problems.length) {
    try { paths = designPaths(sized, { sensitivities: input.sensitivities === true }); } catch (err) { geometryError ??= errorText(err); }
  }
  progress({ done: 2, total: 2, label: 'done' });
  return { sized, outlines, drills, paths, geometryError };
}

/** The united board geometry for outputs (copper, ground, clearance, drills), from the polygon engine. */
export async function geometryJob(input: LayoutInput): Promise<BoardGeometry> {
  const sized = sizeDesign(input.doc, { cache: lineCache(input.doc) });
  if (!sized.problems.length) await polygons();
  return boardGeometryOf(sized);
}

export function errorText(err: unknown): string {
  return err instanceof InputError ? `${err.field}: expected ${err.expected}, got ${err.got}` : err instanceof Error ? err.message : String(err);
}

export type OutputKind = 'dxf' | 'svg' | 'gerber' | 'drill' | 'mask' | 'gcode';

export interface ExportInput {
  doc: DesignDoc;
  layers: ExportLayer[];
  mirror: boolean;
  /** Which files to write; none gives only the preview. */
  kinds: OutputKind[];
  /** Base of the file names. */
  base: string;
  version: string;
  /** Machining settings for 'gcode' (defaults for the rest). */
  milling?: Partial<MillingOptions>;
}

export interface ExportOutput { preview: string; files: { name: string; data: string }[]; notes: string[] }

/** The preview (an SVG of the chosen layers, mirrored as asked) and the chosen files, from the core's exporters. */
export async function exportJob(input: ExportInput): Promise<ExportOutput> {
  const g = await geometryJob(input);
  const sw = { application: 'Stripwright', version: input.version };
  const preview = toSvg(g, { layers: input.layers, mirror: input.mirror });
  const files: { name: string; data: string }[] = [];
  const notes: string[] = [];
  for (const k of input.kinds) {
    switch (k) {
      case 'dxf': files.push({ name: EXPORT_FILE_NAMES.dxf(input.base), data: toDxf(g, { layers: input.layers, mirror: input.mirror }) }); break;
      case 'svg': files.push({ name: EXPORT_FILE_NAMES.svg(input.base), data: preview }); break;
      case 'gerber': {
        const gb = toGerber(g, { mirror: input.mirror, ...sw });
        files.push(
          { name: EXPORT_FILE_NAMES.gerberCopperTop(input.base), data: gb.copper },
          { name: EXPORT_FILE_NAMES.gerberCopperBottom(input.base), data: gb.bottom },
          { name: EXPORT_FILE_NAMES.gerberProfile(input.base), data: gb.profile },
        );
        break;
      }
      case 'drill': {
        const ex = toExcellon(g, { mirror: input.mirror, ...sw });
        if (ex.plated) files.push({ name: EXPORT_FILE_NAMES.drillPlated(input.base), data: ex.plated });
        if (ex.nonPlated) files.push({ name: EXPORT_FILE_NAMES.drillNonPlated(input.base), data: ex.nonPlated });
        if (!ex.plated && !ex.nonPlated) notes.push('No holes: no drill file written.');
        break;
      }
      case 'mask': {
        const m = toMask(g, { mirror: input.mirror, title: input.doc.name });
        files.push({ name: EXPORT_FILE_NAMES.maskSvg(input.base), data: m.svg });
        notes.push(...m.warnings.map((w) => w.message));
        break;
      }
      case 'gcode': {
        // The same core call as `stripwright export --format gcode`; it refuses (an error) when the plan has errors.
        const gc = exportGcode(input.doc, input.milling ?? {}, { base: input.base, application: 'Stripwright', version: input.version });
        files.push(...gc.files.map((f) => ({ name: f.name, data: f.text })));
        notes.push(`G-code: ${gc.files.length} file(s), one per tool, about ${Math.ceil(gc.plan.seconds / 60)} min of machining; run them in tool order.`);
        break;
      }
      default: exhaustive(k, 'output');
    }
  }
  return { preview, files, notes };
}

/** Fabrication findings: the core's checks on the united copper (needs the polygon engine). */
export async function checkJob(input: LayoutInput): Promise<CheckOutput> {
  const sized = sizeDesign(input.doc, { cache: lineCache(input.doc) });
  if (!sized.problems.length) await polygons();
  const { findings, geometry } = checkBoard(sized);
  return { findings, ground: geometry?.groundCopper ?? [] };
}

/** A sweep of the sized network over the band (and f0), chunked so progress reaches the editor. */
export async function responseJob(input: ResponseInput, progress: (p: Progress) => void): Promise<ResponseOutput> {
  const sized = sizeDesign(input.doc, { cache: lineCache(input.doc) });
  const net = netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {});
  const settings = bandSweep(input.doc.frequency.band, input.doc.frequency.f0, input.points ?? 201);
  const r: NetworkResponse = await sweepNetwork(net, settings, {
    onProgress: (done, total) => progress({ done, total, label: 'sweeping' }),
    yieldTo: () => new Promise((ok) => setTimeout(ok, 0)),
  });
  const P = r.ports.length;
  const traces: ResponseOutput['traces'] = [];
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    traces.push({ i, j, db: [...magnitudeDb(r, i, j)], phase: [...phaseDeg(r, i, j)], delay: [...groupDelay(r, i, j)] });
  }
  const sm = Array.from({ length: P }, (_, i) => { const s = smith(r, i); return { i, re: [...s.re], im: [...s.im] }; });
  return { freqs: [...r.freqs], ports: r.ports.map((p) => p.name), input: net.input, traces, smith: sm, warnings: [...net.warnings, ...r.warnings].map((w) => w.message) };
}

export interface MillingInput {
  doc: DesignDoc;
  options: Partial<MillingOptions>;
  /** Also write the G-code files (refused, as an error, when the plan has errors). */
  write: boolean;
  base: string;
  version: string;
}

/** The milling plan as the Outputs panel shows it, and the files when asked. */
export interface MillingOutput {
  preview: string;
  /** Total estimated machining time, s, and per tool. */
  seconds: number;
  tools: { number: number; label: string; seconds: number; file: string }[];
  pieces: MilledPiece[];
  findings: MillFinding[];
  /** Copper left after milling, for the board overlay. */
  milled: Region[];
  files: { name: string; data: string }[];
}

/** Plans the milling of the design (core planDesignMilling) or writes its G-code (core exportGcode, which refuses on errors). */
export async function millingJob(input: MillingInput): Promise<MillingOutput> {
  await polygons();
  const info = { base: input.base, application: 'Stripwright', version: input.version };
  const r = input.write ? exportGcode(input.doc, input.options, info) : { ...planDesignMilling(input.doc, input.options), files: [] };
  const { plan, geometry } = r;
  return {
    preview: millingPreviewSvg(plan, geometry),
    seconds: plan.seconds,
    tools: plan.programs.map((p) => ({ number: p.tool.number, label: p.tool.label, seconds: p.seconds, file: EXPORT_FILE_NAMES.gcode(input.base, p.tool) })),
    pieces: plan.milled.pieces,
    findings: plan.findings,
    milled: plan.milled.copper,
    files: r.files.map((f) => ({ name: f.name, data: f.text })),
  };
}

// ---- yield (core/yield): a seeded Monte Carlo of made boards against the design's targets ------------------------

export interface YieldInput { doc: DesignDoc; samples: number; seed: number }
/** The core's result without the per-board values (the histograms carry them), so it crosses to the page quickly. */
export type YieldOutput = Omit<YieldResult, 'targets'> & { targets: Omit<YieldResult['targets'][number], 'values'>[] };

export async function yieldJob(input: YieldInput, progress: (p: Progress) => void, signal?: AbortSignal): Promise<YieldOutput> {
  const r = await runYield(input.doc, {
    samples: input.samples, seed: input.seed, chunk: 8, ...(signal ? { signal } : {}),
    onProgress: (done, total) => progress({ done, total, label: 'making boards' }),
    yieldTo: () => new Promise((ok) => setTimeout(ok, 0)),
  });
  return { ...r, targets: r.targets.map(({ values: _v, ...t }) => t) };
}
