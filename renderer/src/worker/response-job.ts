/**
 * The response job: a sweep of the design's network and the plot series, the figure table and the targets' pass/fail
 * from the core. Runs in the response worker (response.worker.ts), apart from layout, so a sweep never delays copper;
 * also inline in tests and in the compute worker's job table.
 *
 * The sweep is the core's one `sweepDesign` (core/pipeline/sweep.ts): the revision's network from the worker's
 * pipeline, element values kept across revisions, and — for a live pass without the figure table — only the entries
 * the view reads (core viewEntries: the input's column and row and every reflection, plus what the targets read).
 */
import type { DesignDoc, DesignPipeline } from '../../../core/index.ts';
import { namer, magnitudeDb, phaseDeg, groupDelayOfPhase, smith, SweepCache, responseCacheKey, designSweepSettings, targetFrequencies, evaluateTargets, figureTable, viewEntries, sweepDesign, type NetworkResponse, type SweepSettings, type FigureTable, type TargetEvaluation } from '../../../core/index.ts';
import { InputError, errorWords } from '../../../core/index.ts';
import type { Progress } from './client.ts';
import { pipeline } from './worker-pipeline.ts';
import { yieldToHost } from './response-yield.ts';

/** The design, and settings that override its own (absent: core designSweepSettings). */
export interface ResponseInput {
  doc: DesignDoc; settings?: SweepSettings;
  /** false: leave out the derived figure table (a live pass while the table is not on screen; it costs a quarter of a pass). */
  figures?: boolean;
}
/** Plot-ready series: for every (i, j) pair |S| in dB, phase in degrees and group delay in s; reflections for Smith. */
export interface ResponseOutput {
  freqs: number[];
  ports: string[];
  input: number;
  traces: { i: number; j: number; db: number[]; phase: number[]; delay: number[] }[];
  smith: { i: number; re: number[]; im: number[] }[];
  warnings: string[];
  /** Each port's label in the design (its node id where it has none), its reference impedance (Ω). */
  labels: string[];
  zRef: number[];
  /** The settings swept (targets' band edges are added to their frequencies) and whether the cache answered. */
  settings: SweepSettings;
  cached: boolean;
  /** The derived figures (core figureTable); null when the request left them out. */
  figures: FigureTable | null;
  /** The design's targets on this sweep (core evaluateTargets, as `build`), null without targets or on an error. */
  targets: TargetEvaluation | null;
  targetError: string | null;
}

/** Recent sweeps by design physics, settings and entries (core SweepCache): a repeated sweep, or undo back, costs nothing. */
const sweepCache = new SweepCache(8);
/** The netlist's input port and notes of each cached sweep (the cache keeps only the response). */
const sweepMeta = new Map<string, { input: number; warnings: string[] }>();

/** A typed array as a list (a plain loop: spreading walks it through the iterator protocol, several times slower). */
function list(xs: Float64Array): number[] {
  const out = new Array<number>(xs.length);
  for (let k = 0; k < xs.length; k++) out[k] = xs[k]!;
  return out;
}

function errorText(err: unknown): string {
  return err instanceof InputError ? errorWords(err) : err instanceof Error ? err.message : String(err);
}

/**
 * A sweep of the sized network at the design's own settings (core designSweepSettings, the frequencies the CLI
 * uses) plus every target band edge, chunked so progress reaches the editor and a cancel stops it between chunks;
 * then the plot series, the derived figures and the targets' pass/fail from the core.
 */
export async function responseJob(input: ResponseInput, progress: (p: Progress) => void, signal?: AbortSignal, on: DesignPipeline = pipeline): Promise<ResponseOutput> {
  const r = await responseSeries(input, progress, signal, on);
  return {
    ...r,
    traces: r.traces.map((t) => ({ i: t.i, j: t.j, db: list(t.db), phase: list(t.phase), delay: list(t.delay) })),
    smith: r.smith.map((t) => ({ i: t.i, re: list(t.re), im: list(t.im) })),
  };
}

/** The response with its series as the core computes them (typed arrays), for a face that packs them (response-post.ts) instead of making lists. */
export interface ResponseSeries extends Omit<ResponseOutput, 'traces' | 'smith'> {
  traces: { i: number; j: number; db: Float64Array; phase: Float64Array; delay: Float64Array }[];
  smith: { i: number; re: Float64Array; im: Float64Array }[];
}

/** responseJob with the series left as typed arrays (the response worker packs them as they are). */
export async function responseSeries(input: ResponseInput, progress: (p: Progress) => void, signal?: AbortSignal, on: DesignPipeline = pipeline): Promise<ResponseSeries> {
  const pipeline = on;
  const doc = input.doc;
  const settings = input.settings ?? designSweepSettings(doc);
  const base = responseCacheKey(doc, settings);
  const whole = `${base}|all`, live = `${base}|view`;
  const wantAll = input.figures !== false;
  // A whole sweep answers a live request too; a live one only a live request.
  const key = wantAll || sweepCache.get(whole) ? whole : live;
  let cached = true;
  const r: NetworkResponse = await sweepCache.getOrSweep(key, async () => {
    cached = false;
    const net = pipeline.netlist(doc);
    sweepMeta.set(key, { input: net.input, warnings: net.warnings.map((w) => w.message) });
    if (sweepMeta.size > 32) sweepMeta.delete(sweepMeta.keys().next().value as string);
    const entries = key === live ? viewEntries(net, doc) : undefined;
    const { response } = await sweepDesign(pipeline, doc, targetFrequencies(settings, doc.targets ?? []), {
      chunk: 64, ...(signal ? { signal } : {}), ...(entries ? { entries } : {}),
      onProgress: (done, total) => progress({ done, total, label: 'sweeping' }),
      yieldTo: yieldToHost,
    });
    return response;
  });
  const meta = sweepMeta.get(key) ?? { input: 0, warnings: [] };
  const inputPort = meta.input;
  const P = r.ports.length;
  const ids = r.ports.map((p) => p.name);
  const traces: ResponseSeries['traces'] = [];
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    // Large networks: the input's row and column (what the panel offers); S itself stays in the cache.
    if (P > 4 && i !== inputPort && j !== inputPort) continue;
    // The phase once, for its trace and its delay (core groupDelay's own arithmetic on it).
    const phase = phaseDeg(r, i, j);
    traces.push({ i, j, db: magnitudeDb(r, i, j), phase, delay: groupDelayOfPhase(r.freqs, phase) });
  }
  const sm = Array.from({ length: P }, (_, i) => ({ i, ...smith(r, i) }));
  let targets: TargetEvaluation | null = null, targetError: string | null = null;
  if (doc.targets?.length) {
    try { targets = evaluateTargets(r, doc); } catch (err) { targetError = errorText(err); }
  }
  return {
    freqs: [...r.freqs], ports: ids, labels: ids.map(namer(doc)), zRef: r.ports.map((p) => p.zRef), input: inputPort,
    settings, cached, traces, smith: sm,
    figures: input.figures === false ? null : figureTable(r, doc, inputPort), targets, targetError,
    warnings: [...meta.warnings, ...r.warnings.map((w) => w.message)],
  };
}
