/**
 * The jobs the compute worker runs, as plain functions of plain data (so they also run inline in tests):
 * layout (sizing, copper geometry, paths and phase, fabrication checks) and response (a sweep of the sized
 * network). All physics and geometry come from the core; this file only sequences the calls and reports progress.
 */
import type { DesignDoc } from '../../../core/index.ts';
import type { BoardGeometry, DrillHit, Region } from '../../../core/index.ts';
import { initPolygons } from '../../../core/index.ts';
import { pieceOutlines, problemFindings, type SizedDesign, type PathReport } from '../../../core/index.ts';
import type { PieceOutline } from '../../../core/index.ts';
import type { Finding } from '../../../core/index.ts';
import { InputError, errorWords, exhaustive } from '../../../core/index.ts';
import { runYield, type YieldResult } from '../../../core/index.ts';
import { EXPORT_FILE_NAMES, millingPreviewSvg } from '../../../core/index.ts';
import { exportDesign, type ExportRequest } from '../../../core/index.ts';
import { pipeline } from './worker-pipeline.ts';
import { responseJob, type ResponseInput } from './response-job.ts';
export { responseJob } from './response-job.ts';
import type { MilledPiece, MillFinding, MillingOptions } from '../../../core/index.ts';
import type { JobKind } from './protocol.ts';
import type { Progress } from './client.ts';
import { regionsPath } from '../board/paths.ts';
import { sectionJob, type SectionInput } from './section-job.ts';
import { equalizeJob, tuneJob, type EqualizeInput, type TuneInput } from './equalize-job.ts';
import { compareJob, touchstoneFile, reportFile, type CompareInput } from './measured-job.ts';
import { LayoutSender, type LayoutPost } from './layout-post.ts';
import { sameData } from './layout-diff.ts';
import { packResponse } from './response-post.ts';
import { blockPreviewJob, type BlockPreviewInput } from './block-preview-job.ts';

/** The sized design as it crosses to the page: without the document, which the editor already holds. */
export type SizedView = Omit<SizedDesign, 'doc'>;

export interface LayoutInput { doc: DesignDoc; /** Also work out each path's phase sensitivity to εr, h and W (slower). */ sensitivities?: boolean }
/**
 * The live layout: sized pieces and each piece's own copper (no union, so it needs no polygon engine and stays
 * fast while dragging). The united board geometry is built only for outputs (geometryJob).
 */
export interface LayoutOutput { sized: SizedView; outlines: (PieceOutline & { d: string })[]; drills: DrillHit[]; paths: PathReport[]; geometryError: string | null }

export type { ResponseInput, ResponseOutput } from './response-job.ts';

export interface CheckOutput { findings: Finding[]; /** Ground copper left after clearing around the network. */ ground: Region[] }

/** How the polygon engine finds its wasm: the worker passes Vite's asset URL; Node needs nothing. */
let polygonInit: (() => Promise<void>) | null = null;
let polygonsReady: Promise<void> | null = null;

export function setPolygonInit(init: () => Promise<void>): void { polygonInit = init; }

function polygons(): Promise<void> {
  polygonsReady ??= (polygonInit ?? (() => initPolygons()))();
  return polygonsReady;
}

/** The worker's one pipeline (worker-pipeline.ts), shared by every job of one revision. */
export { pipeline };

export async function runJob(kind: JobKind, input: unknown, progress: (p: Progress) => void, signal?: AbortSignal): Promise<unknown> {
  switch (kind) {
    case 'yield': return yieldJob(input as YieldInput, progress, signal);
    case 'layout': return layoutPostJob(input as LayoutPostInput, progress);
    case 'geometry': return geometryJob(input as LayoutInput);
    case 'export': return exportJob(input as ExportInput);
    case 'check': return checkJob(input as LayoutInput);
    case 'response': return packResponse(await responseJob(input as ResponseInput, progress, signal));
    case 'section': return sectionJob(input as SectionInput);
    case 'milling': return millingJob(input as MillingInput);
    case 'equalize': return equalizeJob(input as EqualizeInput);
    case 'tune': return tuneJob(input as TuneInput, progress, signal);
    case 'compare': return compareJob(input as CompareInput, progress);
    case 'block-preview': return blockPreviewJob(input as BlockPreviewInput);
    default: return exhaustive(kind, 'job');
  }
}

/** The live layout's request from the page: the token of the result it holds (absent: send it whole). */
export type LayoutPostInput = LayoutInput & { base?: number };

/** The worker's recent live layouts, so each new one crosses to the page as changes (layout-post.ts). */
const layoutSender = new LayoutSender();

/** The live layout job as the page runs it: layoutJob, sent as changes against the result the page holds. */
export async function layoutPostJob(input: LayoutPostInput, progress: (p: Progress) => void): Promise<LayoutPost> {
  const { base, ...rest } = input;
  const out = await layoutJob(rest, progress, layoutSender.held(base));
  return layoutSender.encode(out, base);
}

/**
 * @param prior a result of an earlier revision: a piece whose copper is unchanged keeps its path text from it
 */
export async function layoutJob(input: LayoutInput, progress: (p: Progress) => void, prior: LayoutOutput | null = null): Promise<LayoutOutput> {
  progress({ done: 0, total: 2, label: 'sizing' });
  const sized = pipeline.sized(input.doc);
  progress({ done: 1, total: 2, label: 'copper' });
  let outlines: (PieceOutline & { d: string })[] = [];
  let drills: DrillHit[] = [];
  let geometryError: string | null = null;
  try {
    const made = pieceOutlines(sized);
    const before = new Map((prior?.outlines ?? []).map((o) => [o.id, o]));
    outlines = made.outlines.map((o) => {
      const was = before.get(o.id);
      return { ...o, d: was && sameData(was.regions, o.regions) ? was.d : regionsPath(o.regions) };
    });
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
  return err instanceof InputError ? errorWords(err) : err instanceof Error ? err.message : String(err);
}

/** The file formats of the core's one table (core/pipeline/formats.ts), and the app's two response files. */
import type { ExportFormat } from '../../../core/index.ts';
/** Files of the response and the report, written by the same core functions as `sweep --touchstone` and `report`. */
export type AppOutput = 'touchstone' | 'report';
export type OutputKind = ExportFormat | AppOutput;

/** The design and the same request the CLI's export makes (formats and every option), plus the response files. */
export type ExportInput = ExportRequest & { doc: DesignDoc; extras?: AppOutput[]; /** The design's file name (Touchstone header). */ fileName?: string };

export interface ExportOutput { preview: string; files: { name: string; data: string }[]; notes: string[]; /** Binary files (the design report). */ binary?: { name: string; data: Uint8Array }[] }

/** The preview (the SVG file of the chosen layers) and the chosen files, from the core's one export pipeline. */
export async function exportJob(input: ExportInput): Promise<ExportOutput> {
  await polygons();
  const { doc, extras = [], fileName, ...request } = input;
  const r = exportDesign(pipeline, doc, request);
  const binary: { name: string; data: Uint8Array }[] = [];
  const files = r.files.map((f) => ({ name: f.name, data: f.text }));
  for (const k of extras) {
    if (k === 'touchstone') files.push(await touchstoneFile(doc, fileName ?? `${request.base}.json`, `stripwright ${request.version}`));
    else binary.push(await reportFile(doc, request.base, `stripwright ${request.version}`));
  }
  return {
    preview: r.preview,
    files,
    notes: r.messages.map((m) => `${m.severity === 'info' ? 'Note' : m.severity === 'warning' ? 'Warning' : 'Error'}: ${m.text}`),
    ...(binary.length ? { binary } : {}),
  };
}

/** Fabrication findings: the core's checks on the united copper (needs the polygon engine). */
export async function checkJob(input: LayoutInput): Promise<CheckOutput> {
  const sized = pipeline.sized(input.doc);
  if (sized.problems.length) return { findings: problemFindings(sized), ground: [] };
  await polygons();
  return { findings: pipeline.findings(input.doc), ground: pipeline.board(input.doc).groundCopper };
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
