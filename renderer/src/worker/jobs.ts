/**
 * The jobs the compute worker runs, as plain functions of plain data (so they also run inline in tests):
 * layout (sizing, copper geometry, paths and phase, fabrication checks) and response (a sweep of the sized
 * network). All physics and geometry come from the core; this file only sequences the calls and reports progress.
 */
import type { DesignDoc } from '../../../core/design/types.ts';
import type { BoardGeometry, DrillHit, Region } from '../../../core/geometry/types.ts';
import { initPolygons } from '../../../core/geometry/index.ts';
import { pieceOutlines, problemFindings, type SizedDesign, type PathReport } from '../../../core/layout/index.ts';
import type { PieceOutline } from '../../../core/layout/geometry.ts';
import type { Finding } from '../../../core/layout/checks.ts';
import { sweepNetwork, bandSweep, magnitudeDb, phaseDeg, groupDelay, smith, type NetworkResponse } from '../../../core/network/index.ts';
import { InputError, exhaustive } from '../../../core/util/errors.ts';
import { runYield, type YieldResult } from '../../../core/yield/index.ts';
import { EXPORT_FILE_NAMES, millingPreviewSvg } from '../../../core/export/index.ts';
import { DesignPipeline, exportDesign, type ExportRequest } from '../../../core/index.ts';
import type { MilledPiece, MillFinding, MillingOptions } from '../../../core/toolpath/index.ts';
import type { JobKind } from './protocol.ts';
import type { Progress } from './client.ts';
import { regionsPath } from '../board/paths.ts';
import { sectionJob, type SectionInput } from './section-job.ts';

/** The sized design as it crosses to the page: without the document, which the editor already holds. */
export type SizedView = Omit<SizedDesign, 'doc'>;

export interface LayoutInput { doc: DesignDoc; /** Also work out each path's phase sensitivity to εr, h and W (slower). */ sensitivities?: boolean }
/**
 * The live layout: sized pieces and each piece's own copper (no union, so it needs no polygon engine and stays
 * fast while dragging). The united board geometry is built only for outputs (geometryJob).
 */
export interface LayoutOutput { sized: SizedView; outlines: (PieceOutline & { d: string })[]; drills: DrillHit[]; paths: PathReport[]; geometryError: string | null }

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

/**
 * The worker's one pipeline (core/pipeline): every job of one design revision shares its sizing, board, paths,
 * plan and network, whichever job asks first. Bounded, so a long session keeps only recent revisions.
 */
export const pipeline = new DesignPipeline({ capacity: 48 });

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
  const sized = pipeline.sized(input.doc);
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
    try { paths = pipeline.paths(input.doc, { sensitivities: input.sensitivities === true }); } catch (err) { geometryError ??= errorText(err); }
  }
  progress({ done: 2, total: 2, label: 'done' });
  const { doc: _doc, ...view } = sized;
  return { sized: view, outlines, drills, paths, geometryError };
}

/** The united board geometry for outputs (copper, ground, clearance, drills), from the polygon engine. */
export async function geometryJob(input: LayoutInput): Promise<BoardGeometry> {
  await polygons();
  return pipeline.board(input.doc);
}

export function errorText(err: unknown): string {
  return err instanceof InputError ? `${err.field}: expected ${err.expected}, got ${err.got}` : err instanceof Error ? err.message : String(err);
}

/** The file formats of the core's one table (core/pipeline/formats.ts). */
export type { ExportFormat as OutputKind } from '../../../core/index.ts';

/** The design and the same request the CLI's export makes (formats and every option). */
export type ExportInput = ExportRequest & { doc: DesignDoc };

export interface ExportOutput { preview: string; files: { name: string; data: string }[]; notes: string[] }

/** The preview (the SVG file of the chosen layers) and the chosen files, from the core's one export pipeline. */
export async function exportJob(input: ExportInput): Promise<ExportOutput> {
  await polygons();
  const { doc, ...request } = input;
  const r = exportDesign(pipeline, doc, request);
  return {
    preview: r.preview,
    files: r.files.map((f) => ({ name: f.name, data: f.text })),
    notes: r.messages.map((m) => `${m.severity === 'info' ? 'Note' : m.severity === 'warning' ? 'Warning' : 'Error'}: ${m.text}`),
  };
}

/** Fabrication findings: the core's checks on the united copper (needs the polygon engine). */
export async function checkJob(input: LayoutInput): Promise<CheckOutput> {
  const sized = pipeline.sized(input.doc);
  if (sized.problems.length) return { findings: problemFindings(sized), ground: [] };
  await polygons();
  return { findings: pipeline.findings(input.doc), ground: pipeline.board(input.doc).groundCopper };
}

/** A sweep of the sized network over the band (and f0), chunked so progress reaches the editor. */
export async function responseJob(input: ResponseInput, progress: (p: Progress) => void): Promise<ResponseOutput> {
  const net = pipeline.netlist(input.doc);
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
  const plan = pipeline.plan(input.doc, input.options);
  const geometry = pipeline.board(input.doc);
  const files = input.write ? exportDesign(pipeline, input.doc, { formats: ['gcode'], base: input.base, version: input.version, milling: input.options }).files : [];
  return {
    preview: millingPreviewSvg(plan, geometry),
    seconds: plan.seconds,
    tools: plan.programs.map((p) => ({ number: p.tool.number, label: p.tool.label, seconds: p.seconds, file: EXPORT_FILE_NAMES.gcode(input.base, p.tool) })),
    pieces: plan.milled.pieces,
    findings: plan.findings,
    milled: plan.milled.copper,
    files: files.map((f) => ({ name: f.name, data: f.text })),
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
