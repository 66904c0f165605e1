/**
 * How many made boards meet the design's targets: a seeded Monte Carlo over the design's tolerances.
 *
 * Method (docs/yield.md has the long form):
 *  1. The design is sized once at its nominal laminate; the board is then made as drawn for every sample: lengths,
 *     positions and pads stay where the layout put them, and the draws change the laminate, the copper widths and the
 *     part values (made-board.ts).
 *  2. Every sample is analysed in full: each line's Z0(f), εe(f) and losses from the line model on the sample's laminate
 *     and width at every grid point, end capacitances and via inductances re-evaluated, the network solved by nodal
 *     analysis (batch-solver.ts), and the targets evaluated by core/network/targets.ts — the same function `build`
 *     and the response panel use.
 *  3. Yield of each target and of all together = passing samples / samples, with the 95 % Wilson score interval
 *     (stats.ts). Histograms of each target's worst value per sample, envelopes (min, mean, max) of the |S| the targets
 *     read, and a ranking of the tolerances.
 *  4. Ranking: one at a time. For each tolerance the first `rankingSamples` samples are made again with only that
 *     tolerance's draws (the same numbers as in the full run, thanks to one stream per tolerance), and the variance of
 *     each target's worst value is taken. A tolerance's share for a target is its variance over the sum of all
 *     tolerances' variances (interactions are left out); its overall score is its mean share over the targets.
 * Random numbers: xoshiro128** seeded by SplitMix64, normals by inversion (AS 241); see prng.ts and normal.ts.
 */
import { InputError, describe } from '../util/errors.ts';
import { hypot } from '../util/hypot.ts';
import { warn, type Warning } from '../util/warnings.ts';
import type { DesignDoc, Target, Tolerance, ToleranceQuantity } from '../design/types.ts';
import type { FigureUnit } from '../design/targets.ts';
import type { LineModels, LineOptions } from '../line/index.ts';
import { sizeDesign } from '../layout/sizing.ts';
import type { SizedDesign } from '../layout/types.ts';
import { netlistFromSized } from '../network/fromSized.ts';
import { solveNetwork, bandSweep, type AbortLike } from '../network/sweep.ts';
import type { NetworkResponse } from '../network/response.ts';
import { toDb } from '../network/figures.ts';
import { evaluateTargets, prepareTargets, targetFrequencies, targetText, type TargetEvaluation, type TargetResult } from '../network/targets.ts';
import { ToleranceDraws } from './draws.ts';
import { MadeBoard, applicableTolerances } from './made-board.ts';
import { BatchSolver } from './batch-solver.ts';
import { histogram, summary, variance, wilson, type Histogram, type Proportion, type Summary } from './stats.ts';

export const YIELD_GENERATOR = 'xoshiro128** (Blackman & Vigna 2021) seeded by SplitMix64; normals by inversion, AS 241 (Wichura 1988)';
export const MAX_SAMPLES = 1_000_000;

export interface YieldOptions {
  /** Boards to make, 1 … 1 000 000. */
  samples: number;
  /** Whole number 0 … 2^32 − 1; the same seed gives the same result everywhere. */
  seed: number;
  /** Points of the band sweep (default 201; every target band's edges are added). */
  points?: number;
  /** Samples per tolerance for the one-at-a-time ranking (default min(samples, 100); 0 skips the ranking). */
  rankingSamples?: number;
  line?: LineOptions;
  /** Line models to size and solve every board with (the line-model interface; default the core's). */
  models?: LineModels;
  onProgress?: (done: number, total: number) => void;
  signal?: AbortLike;
  /** Awaited between chunks so a host can deliver messages (a worker passes a timer). */
  yieldTo?: () => Promise<void>;
  /** Samples between progress reports (default 16). */
  chunk?: number;
}

export interface TargetYield {
  id: string;
  name: string;
  text: string;
  unit: FigureUnit;
  limit: { min?: number; max?: number };
  nominal: TargetResult;
  passes: number;
  yield: Proportion;
  /** Worst value over the band, per sample (in sample order). */
  values: number[];
  stats: Summary;
  histogram: Histogram;
}

export interface Envelope {
  /** S_ij, zero-based port indices, and its label by port names, e.g. "S(o1,in)". */
  i: number; j: number; label: string;
  /** |S| in dB at each grid point: nominal, and the smallest, mean and largest over the samples. */
  nominal: number[]; min: number[]; mean: number[]; max: number[];
}

export interface RankEntry {
  quantity: ToleranceQuantity;
  scope: Tolerance['scope'];
  /** Mean share over the targets (0 … 1). */
  score: number;
  /** Share of each target's variance, in the order of `targets`. */
  shares: number[];
}

export interface YieldResult {
  design: string;
  samples: number;
  seed: number;
  generator: string;
  freqs: number[];
  ports: string[];
  targets: TargetYield[];
  overall: { passes: number; yield: Proportion };
  envelopes: Envelope[];
  ranking: { method: string; samples: number; entries: RankEntry[] };
  tolerances: Tolerance[];
  ignored: { quantity: ToleranceQuantity; why: string }[];
  /** Points that needed the pivoting solve, over all samples. */
  robustPoints: number;
  warnings: Warning[];
}

function abortError(signal: AbortLike): Error {
  if (signal.reason instanceof Error) return signal.reason;
  const e = new Error('the yield estimate was cancelled');
  e.name = 'AbortError';
  return e;
}

function checkOptions(o: YieldOptions): void {
  if (!Number.isInteger(o.samples) || o.samples < 1 || o.samples > MAX_SAMPLES) throw new InputError('out-of-range', 'samples', `a whole number of boards from 1 to ${MAX_SAMPLES}`, describe(o.samples));
  if (!Number.isInteger(o.seed) || o.seed < 0 || o.seed > 0xffffffff) throw new InputError('out-of-range', 'seed', 'a whole number from 0 to 4294967295', describe(o.seed));
  if (o.rankingSamples !== undefined && (!Number.isInteger(o.rankingSamples) || o.rankingSamples < 0)) throw new InputError('out-of-range', 'rankingSamples', 'a whole number of samples, 0 or more', describe(o.rankingSamples));
}

/** S-parameters the targets read: [to, from] pairs as zero-based port indices. */
function envelopePairs(targets: readonly Target[], doc: DesignDoc, ports: string[], input: number): [number, number][] {
  const out: [number, number][] = [];
  const add = (i: number, j: number) => { if (i >= 0 && j >= 0 && !out.some(([a, b]) => a === i && b === j)) out.push([i, j]); };
  const at = (id: string | undefined) => (id === undefined ? -1 : ports.indexOf(id));
  for (const t of targets) {
    const p = t.ports ?? [];
    if (t.figure === 'return-loss') add(at(p[0]), at(p[0]));
    else if (t.figure === 'isolation') add(at(p[0]), at(p[1]));
    else if (p.length === 2) add(at(p[1]), at(p[0]));
    else {
      const g = doc.phaseGroups.find((x) => x.id === t.group);
      if (g) for (const o of g.to) add(at(o), at(g.from));
    }
  }
  if (!out.length) { add(input, input); for (let k = 0; k < ports.length; k++) if (k !== input) add(k, input); }
  return out.slice(0, 12);
}

/**
 * The ports whose excitation the targets and the envelopes read (S_ij is read from column j): only those are solved
 * for every board. The figures' port order is that of core/network/targets.ts: return loss S_pp, insertion loss and
 * transmission S_ba, isolation S_ab, group figures S_o,from.
 */
function columnsRead(targets: readonly Target[], doc: DesignDoc, ports: string[], pairs: [number, number][]): number[] {
  const cols = new Set<number>(pairs.map(([, j]) => j));
  const add = (id: string | undefined) => { const k = id === undefined ? -1 : ports.indexOf(id); if (k >= 0) cols.add(k); };
  for (const t of targets) {
    const p = t.ports ?? [];
    switch (t.figure) {
      case 'return-loss': case 'insertion-loss': case 'transmission': case 'transmission-phase': add(p[0]); break;
      case 'isolation': add(p[1]); break;
      case 'amplitude-balance': case 'phase-balance': case 'phase-spread': add(doc.phaseGroups.find((x) => x.id === t.group)?.from); break;
    }
  }
  return [...cols].sort((a, b) => a - b);
}

/** The solver, the one S buffer every board is solved into, and the targets set up once on that buffer. */
interface RunState { solver: BatchSolver; s: Float64Array; targets: () => TargetEvaluation }

/** One made board: its S over the grid (in state.s) and each target's worst value. */
function evaluateBoard(st: RunState, board: MadeBoard, only: number | null): { results: TargetResult[]; robust: number } {
  const { made, laminate, pieceDw } = board.make(only);
  const robust = st.solver.solve(made, laminate, pieceDw, st.s);
  return { results: st.targets().results, robust };
}

export async function runYield(doc: DesignDoc, opts: YieldOptions): Promise<YieldResult> {
  checkOptions(opts);
  const targets = doc.targets ?? [];
  if (!targets.length) {
    throw new InputError('out-of-range', 'targets', 'at least one target (what a good board must meet)', 'none', 'add targets to the design (the yield panel\'s target table, or the file\'s "targets" list)');
  }
  const sized = sizeDesign(doc, sizeOptions(opts));
  const nominalNet = netlistFromSized(sized, opts.line ? { line: opts.line } : {});
  const freqs = targetFrequencies(bandSweep(doc.frequency.band, doc.frequency.f0, opts.points ?? 201), targets);
  const nominal = solveNetwork(nominalNet, freqs);
  const nominalEval = evaluateTargets(nominal, doc);
  // Made boards use the lines the sizing used (a design sized as made carries its cross-section tables).
  const portIds = nominalNet.ports.map((p) => p.name);
  const pairs = envelopePairs(targets, doc, portIds, nominalNet.input);
  const solver = new BatchSolver(sized, freqs, opts.line ?? sized.lineOptions, columnsRead(targets, doc, portIds, pairs));
  const P = solver.ports.length, F = freqs.length, N = opts.samples;
  const s = new Float64Array(2 * P * P * F);
  const response: NetworkResponse = { freqs, ports: solver.ports, s, warnings: [] };
  const st: RunState = { solver, s, targets: prepareTargets(response, doc) };
  const { tolerances, ignored } = applicableTolerances(sized);
  const warnings: Warning[] = [...nominalNet.warnings.filter((w) => w.severity !== 'info')];
  for (const x of ignored) warnings.push(warn('note', `tolerance ${x.quantity} is not used: ${x.why}`, { severity: 'info', source: 'yield' }));
  if (!opts.line && sized.lineOptions?.crossSection) {
    warnings.push(warn('validity', 'the lines are sized as made from field-solution tables of the nominal laminate: on made boards their widths vary, but laminate εr and thickness tolerances do not move their static Z0 and εeff, so the spread they cause is understated', { severity: 'info', source: 'yield' }));
  }

  const rankingN = Math.min(N, opts.rankingSamples ?? 100);
  const ranked = rankingN > 0 ? tolerances.filter((t) => t.spread > 0) : [];
  const total = N + ranked.length * rankingN;
  let done = 0;
  const chunk = Math.max(1, Math.floor(opts.chunk ?? 16));
  const pause = opts.yieldTo ?? (() => Promise.resolve());
  const step = async () => {
    done++;
    if (done % chunk === 0 || done === total) {
      opts.onProgress?.(done, total);
      if (done < total) await pause();
    }
    if (opts.signal?.aborted) throw abortError(opts.signal);
  };
  if (opts.signal?.aborted) throw abortError(opts.signal);

  // ---- the main run
  const T = targets.length;
  const values = targets.map(() => new Float64Array(N));
  const passes = new Int32Array(T);
  let allPass = 0, robust = 0;
  const envMin = pairs.map(() => new Float64Array(F).fill(Infinity));
  const envMax = pairs.map(() => new Float64Array(F).fill(-Infinity));
  const envSum = pairs.map(() => new Float64Array(F));
  const draws = new ToleranceDraws(tolerances, sized.pieces.length, opts.seed);
  const board = new MadeBoard(sized, draws);
  for (let n = 0; n < N; n++) {
    draws.next();
    const ev = evaluateBoard(st, board, null);
    robust += ev.robust;
    let ok = true;
    ev.results.forEach((r, t) => { values[t]![n] = r.worst.value; if (r.pass) passes[t]!++; else ok = false; });
    if (ok) allPass++;
    pairs.forEach(([i, j], e) => {
      const mn = envMin[e]!, mx = envMax[e]!, sm = envSum[e]!;
      for (let k = 0; k < F; k++) {
        const t = 2 * ((k * P + i) * P + j);
        const d = toDb(hypot(st.s[t]!, st.s[t + 1]!));
        if (d < mn[k]!) mn[k] = d;
        if (d > mx[k]!) mx[k] = d;
        sm[k] += d;
      }
    });
    await step();
  }

  // ---- one-at-a-time ranking
  const entries: RankEntry[] = [];
  const rankVar: number[][] = [];
  for (const tol of ranked) {
    const k = tolerances.indexOf(tol);
    const d1 = new ToleranceDraws(tolerances, sized.pieces.length, opts.seed);
    const b1 = new MadeBoard(sized, d1);
    const vals = targets.map(() => new Float64Array(rankingN));
    for (let n = 0; n < rankingN; n++) {
      d1.next();
      const ev = evaluateBoard(st, b1, k);
      ev.results.forEach((r, t) => { vals[t]![n] = r.worst.value; });
      await step();
    }
    rankVar.push(vals.map((v) => variance(v)));
  }
  ranked.forEach((tol, r) => {
    const shares = targets.map((_, t) => {
      const sum = rankVar.reduce((s, v) => s + v[t]!, 0);
      return sum > 0 ? rankVar[r]![t]! / sum : 0;
    });
    entries.push({ quantity: tol.quantity, scope: tol.scope, shares, score: shares.reduce((a, b) => a + b, 0) / Math.max(1, T) });
  });
  entries.sort((a, b) => b.score - a.score);

  if (board.floored) warnings.push(warn('note', `${board.floored} draw(s) of tanδ or copper thickness fell below 0 and were taken as 0`, { severity: 'info', source: 'yield' }));
  if (robust) warnings.push(warn('network', `${robust} of ${N * F} points needed the pivoting solve (handled by the nodal solver's own robust path)`, { severity: 'info', source: 'yield' }));

  const portNames = solver.ports.map((p) => p.name);
  return {
    design: doc.name, samples: N, seed: opts.seed, generator: YIELD_GENERATOR,
    freqs: [...freqs], ports: portNames,
    targets: targets.map((t, i) => {
      const v = values[i]!;
      const nom = nominalEval.results[i]!;
      const marks = [nom.worst.value, ...(t.limit.min !== undefined ? [t.limit.min] : []), ...(t.limit.max !== undefined ? [t.limit.max] : [])];
      return {
        id: t.id, name: nom.name, text: targetText(t), unit: nom.unit, limit: { ...t.limit }, nominal: nom,
        passes: passes[i]!, yield: wilson(passes[i]!, N), values: [...v], stats: summary(v), histogram: histogram(v, marks),
      };
    }),
    overall: { passes: allPass, yield: wilson(allPass, N) },
    envelopes: pairs.map(([i, j], e) => ({
      i, j, label: `S(${portNames[i]},${portNames[j]})`,
      nominal: Array.from({ length: F }, (_, k) => { const t = 2 * ((k * P + i) * P + j); return toDb(hypot(nominal.s[t]!, nominal.s[t + 1]!)); }),
      min: [...envMin[e]!], mean: [...envSum[e]!].map((x) => x / N), max: [...envMax[e]!],
    })),
    ranking: { method: 'one-at-a-time variance of each target\'s worst value (shares of the summed variances, interactions left out)', samples: rankingN, entries },
    tolerances, ignored, robustPoints: robust, warnings,
  };
}

/**
 * The made boards of a run, one by one: each board's draws (one list per tolerance: one number, or one per piece in
 * piece order) and its S over the grid, from the same generator, board maker and solver as runYield. For checks
 * against an independent rebuild (test/reference/yield-skrf.test.ts) and for anyone who wants the raw boards.
 */
export function madeBoardResponses(doc: DesignDoc, opts: { samples: number; seed: number; points?: number; line?: LineOptions; models?: LineModels }): {
  freqs: Float64Array; ports: { name: string; zRef: number }[]; tolerances: Tolerance[]; boards: { draws: number[][]; s: Float64Array }[];
} {
  checkOptions({ samples: opts.samples, seed: opts.seed });
  const sized = sizeDesign(doc, sizeOptions(opts));
  const freqs = targetFrequencies(bandSweep(doc.frequency.band, doc.frequency.f0, opts.points ?? 201), doc.targets ?? []);
  const solver = new BatchSolver(sized, freqs, opts.line ?? sized.lineOptions);
  const { tolerances } = applicableTolerances(sized);
  const draws = new ToleranceDraws(tolerances, sized.pieces.length, opts.seed);
  const board = new MadeBoard(sized, draws);
  const P = solver.ports.length;
  const boards: { draws: number[][]; s: Float64Array }[] = [];
  for (let n = 0; n < opts.samples; n++) {
    draws.next();
    const { made, laminate, pieceDw } = board.make();
    const s = new Float64Array(2 * P * P * freqs.length);
    solver.solve(made, laminate, pieceDw, s);
    boards.push({ draws: draws.values.map((v) => [...v]), s });
  }
  return { freqs, ports: solver.ports, tolerances, boards };
}

/** Sizing options of a run: the caller's line options and line models, if any (board-lines.ts reads them back). */
function sizeOptions(opts: { line?: LineOptions; models?: LineModels }): { line?: LineOptions; models?: LineModels } {
  return { ...(opts.line ? { line: opts.line } : {}), ...(opts.models ? { models: opts.models } : {}) };
}
