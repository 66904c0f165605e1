/**
 * Tune a design to goals: vary chosen quantities of pieces within their ranges until the goals (targets of the
 * design's target schema, each with a weight) are met as well as they can be. The one function behind the app's
 * tuning and `stripwright tune`.
 *
 * Each evaluation sizes the varied design (core/layout, the line cache kept across evaluations), builds its
 * network and solves it at the goals' frequencies (the fast sweep: netlistFromSized + solveNetwork), then scores
 * the goals with evaluateTarget (core/network/targets.ts, the same figures as everywhere). A placed block's numeric
 * parameters are variables too: each step re-generates the block from its spec (`regenerateBlock`, the block
 * registry's, passed by core/blocks `tuneWithBlocks`). The cost of a goal is
 * w·(shortfall² + 0.01·(headroom short of one unit)), in the goal's unit (dB or degrees): a goal that fails costs its
 * squared miss, and a small reward for margin up to one unit keeps the search moving once the limits are met.
 * While searching, the response is solved on 21 points across the band plus every goal band's edge; the before
 * and after tables use the full sweep. The search is the seeded Nelder–Mead simplex of nelder-mead.ts over the variables scaled to [0, 1].
 */
import type { DesignDoc, DesignSegment, Target } from '../../design/types.ts';
import { sizeDesign, LineCache, type SizedDesign } from '../../layout/index.ts';
import { InputError } from '../../util/errors.ts';
import { netlistFromSized } from '../fromSized.ts';
import { solveNetwork, sweepFrequencies, type AbortLike } from '../sweep.ts';
import { evaluateTarget, evaluateTargets, targetFrequencies, type TargetEvaluation } from '../targets.ts';
import { minimiseInBox } from './nelder-mead.ts';

/** What a variable sets on its pieces: line length in degrees at f0 or metres, strip impedance or width, a part's value. */
export type TuneQuantity = 'degrees' | 'length' | 'z0' | 'width' | 'value';

/** A quantity of pieces: the segments take the same value (e.g. both arms of a divider). */
export interface PieceVariable {
  segments: string[];
  quantity: TuneQuantity;
  min: number;
  max: number;
}

/**
 * A numeric parameter of a placed block (design format 8), in the parameter's SI unit: each step re-generates the
 * block from its spec with the new value (through the block registry, `regenerateBlock`), as re-opening it would.
 */
export interface BlockVariable {
  block: string;
  param: string;
  min: number;
  max: number;
}

export type TuneVariable = PieceVariable | BlockVariable;

export const isBlockVariable = (v: TuneVariable): v is BlockVariable => 'block' in v;

/** A placed block re-generated with a new spec (core/blocks supplies it: the registry lives above this layer). */
export type BlockRegenerator = (doc: DesignDoc, block: string, spec: Record<string, number | string | boolean | number[] | { re: number; im: number }>) => DesignDoc;

export interface TuneGoal { target: Target; weight: number }

export interface TuneOptions {
  variables: TuneVariable[];
  /** Goals (default: the design's targets, weight 1). */
  goals?: TuneGoal[];
  seed?: number;
  /** Sweep points across the design band (default 201; every goal band's edges are added). */
  points?: number;
  /** Largest number of evaluations (default 150 per variable, at least 300). */
  maxEvaluations?: number;
  signal?: AbortLike;
  onProgress?: (fraction: number, bestCost: number) => void;
  /** Awaited between iterations so a worker can receive "cancel". */
  yieldTo?: () => Promise<void>;
  /** Re-generates a placed block (needed for block variables; core/blocks `tuneWithBlocks` passes the registry's). */
  regenerateBlock?: BlockRegenerator;
}

export interface TunedVariable {
  name: string;
  /** A piece quantity, or 'block' for a block parameter (then `block` and `param` say which). */
  quantity: TuneQuantity | 'block';
  segments: string[];
  block?: string;
  param?: string;
  before: number; after: number; min: number; max: number;
}

export interface TuneResult {
  doc: DesignDoc;
  /** Layout problems of the tuned design (a loop whose new lengths no longer close on the drawing), in words. */
  layoutProblems: string[];
  variables: TunedVariable[];
  before: TargetEvaluation;
  after: TargetEvaluation;
  costBefore: number;
  costAfter: number;
  evaluations: number;
  stopped: 'converged' | 'evaluations' | 'cancelled';
  seed: number;
}

/** Sweep points across the band while searching (the goal bands' edges are added). */
const SEARCH_POINTS = 21;

const UNITS: Record<TuneQuantity, string> = { degrees: '°', length: 'm', z0: 'Ω', width: 'm', value: '' };

/** The value a segment has now for a quantity, or an InputError saying why it has none. */
export function currentValue(seg: DesignSegment, q: TuneQuantity, sized: SizedDesign, field: string): number {
  const p = sized.pieces.find((x) => x.id === seg.id);
  if (q === 'value') {
    if (seg.kind !== 'lumped') throw new InputError('bad-choice', field, 'a lumped part for quantity "value"', `${seg.id}, a ${seg.kind}`);
    return seg.value;
  }
  if (seg.kind !== 'line') throw new InputError('bad-choice', field, `a line piece for quantity "${q}"`, `${seg.id}, a ${seg.kind}`);
  if (q === 'degrees') return seg.length.by === 'degrees' ? seg.length.deg : (p?.deg ?? 0);
  if (q === 'length') return seg.length.by === 'length' ? seg.length.length : (p?.length ?? 0);
  if (q === 'z0') return seg.width.by === 'z0' ? seg.width.z0 : (p?.z0 ?? 0);
  return seg.width.by === 'width' ? seg.width.width : (p?.width ?? 0);
}

function setValue(seg: DesignSegment, q: TuneQuantity, v: number): DesignSegment {
  if (q === 'value' && seg.kind === 'lumped') return { ...seg, value: v };
  if (seg.kind !== 'line') return seg;
  if (q === 'degrees') return { ...seg, length: { by: 'degrees', deg: v } };
  if (q === 'length') return { ...seg, length: { by: 'length', length: v } };
  if (q === 'z0') return { ...seg, width: { by: 'z0', z0: v } };
  return { ...seg, width: { by: 'width', width: v } };
}

/** A block variable's value now: the number in the placed block's spec. */
export function blockValue(doc: DesignDoc, v: BlockVariable, field: string): number {
  const rec = (doc.blocks ?? []).find((b) => b.id === v.block);
  if (!rec) throw new InputError('bad-choice', field, `a placed block of this design (${(doc.blocks ?? []).map((b) => b.id).join(', ') || 'none'})`, JSON.stringify(v.block));
  const x = rec.spec[v.param];
  if (typeof x !== 'number') throw new InputError('bad-choice', field, `a number parameter of block ${v.block} (${Object.entries(rec.spec).filter(([, y]) => typeof y === 'number').map(([k]) => k).join(', ') || 'none'})`, JSON.stringify(v.param));
  return x;
}

/**
 * The design with the variables set to `values`: blocks re-generated first (one call per block with all its new
 * values), then new segment records only where a value is set.
 */
export function withValues(doc: DesignDoc, vars: readonly TuneVariable[], values: readonly number[], regenerate?: BlockRegenerator): DesignDoc {
  const specs = new Map<string, Record<string, number>>();
  vars.forEach((v, i) => { if (isBlockVariable(v)) specs.set(v.block, { ...specs.get(v.block), [v.param]: values[i]! }); });
  for (const [id, change] of specs) {
    if (!regenerate) throw new InputError('bad-choice', 'variables', 'piece variables (block parameters need the block registry: tuneWithBlocks)', `block ${id}`);
    const rec = (doc.blocks ?? []).find((b) => b.id === id)!;
    doc = regenerate(doc, id, { ...rec.spec, ...change });
  }
  const idx = new Map<string, number[]>();
  vars.forEach((v, i) => { if (isBlockVariable(v)) return; for (const s of v.segments) { const l = idx.get(s); if (l) l.push(i); else idx.set(s, [i]); } });
  return {
    ...doc,
    segments: doc.segments.map((s) => {
      const which = idx.get(s.id);
      if (!which) return s;
      let out = s;
      for (const i of which) out = setValue(out, (vars[i] as PieceVariable).quantity, values[i]!);
      return out;
    }),
  };
}

function checkVariables(doc: DesignDoc, vars: readonly TuneVariable[]): void {
  if (!vars.length) throw new InputError('out-of-range', 'variables', 'at least one variable to tune', 'none', 'choose lengths, widths or impedances of pieces to vary');
  if (vars.length > 32) throw new InputError('out-of-range', 'variables', 'at most 32 variables', String(vars.length));
  vars.forEach((v, i) => {
    const at = `variables[${i}]`;
    if (isBlockVariable(v)) {
      blockValue(doc, v, `${at}.param`);
      if (!(Number.isFinite(v.min) && Number.isFinite(v.max) && v.max > v.min)) throw new InputError('out-of-range', `${at}.min`, 'a range with min < max', `${v.min} … ${v.max}`);
      return;
    }
    if (!(UNITS[v.quantity] !== undefined)) throw new InputError('bad-choice', `${at}.quantity`, 'one of degrees, length, z0, width, value', JSON.stringify(v.quantity));
    if (!v.segments.length) throw new InputError('out-of-range', `${at}.segments`, 'at least one segment id', 'none');
    for (const s of v.segments) if (!doc.segments.some((x) => x.id === s)) throw new InputError('bad-choice', `${at}.segments`, 'ids of segments of this design', JSON.stringify(s));
    if (!(Number.isFinite(v.min) && Number.isFinite(v.max) && v.min > 0 && v.max > v.min)) {
      throw new InputError('out-of-range', `${at}.min`, 'a range with 0 < min < max', `${v.min} … ${v.max}`);
    }
  });
}

export function goalsOf(doc: DesignDoc): TuneGoal[] {
  return doc.targets.map((target) => ({ target, weight: 1 }));
}

export async function tuneDesign(doc: DesignDoc, opts: TuneOptions): Promise<TuneResult> {
  const vars = opts.variables;
  checkVariables(doc, vars);
  const goals = opts.goals ?? goalsOf(doc);
  if (!goals.length) throw new InputError('out-of-range', 'goals', 'at least one goal (a target of the design, or a goals file)', 'none', 'add targets in the response panel or pass --goals');
  goals.forEach((g, i) => { if (!(g.weight > 0) || !Number.isFinite(g.weight)) throw new InputError('out-of-range', `goals[${i}].weight`, 'a weight above 0', String(g.weight)); });
  const seed = opts.seed ?? 1;
  const cache = new LineCache(doc.substrate);
  const sized0 = sizeDesign(doc, { cache });
  const nowValue = (v: TuneVariable, field: string): number => (isBlockVariable(v) ? blockValue(doc, v, field) : currentValue(doc.segments.find((s) => s.id === v.segments[0])!, v.quantity, sized0, field));
  const start = vars.map((v, i) => {
    const now = nowValue(v, `variables[${i}].${isBlockVariable(v) ? 'param' : 'segments'}`);
    return Math.min(1, Math.max(0, (now - v.min) / (v.max - v.min)));
  });
  const regen = opts.regenerateBlock;
  const band = doc.frequency.band;
  const points = opts.points ?? 201;
  sweepFrequencies({ start: band.start, stop: band.stop, points });
  // The search scores a coarser grid (every goal band's edges always in it); the before/after tables use all points.
  const full = targetFrequencies({ start: band.start, stop: band.stop, points }, goals.map((g) => g.target));
  const coarse = targetFrequencies({ start: band.start, stop: band.stop, points: Math.min(points, SEARCH_POINTS) }, goals.map((g) => g.target));
  let freqs = coarse;
  const value = (x: readonly number[]) => x.map((u, i) => vars[i]!.min + u * (vars[i]!.max - vars[i]!.min));
  const respond = (d: DesignDoc) => {
    const s = sizeDesign(d, { cache });
    // A loop that no longer closes on the drawing is still a network; anything else is not.
    if (s.problems.some((p) => p.code !== 'loop-mismatch')) return null;
    return solveNetwork(netlistFromSized(s.problems.length ? { ...s, problems: [] } : s, { line: s.lineOptions }), freqs);
  };
  const costOf = (d: DesignDoc): number => {
    let r;
    try { r = respond(d); } catch (e) { if (e instanceof InputError) return 1e9; throw e; }
    if (!r) return 1e9;
    let c = 0;
    for (const g of goals) {
      const m = evaluateTarget(r, g.target, d).margin;
      c += g.weight * ((m < 0 ? m * m : 0) + 0.01 * Math.max(0, 1 - m));
    }
    return c;
  };
  const evaluateDoc = (d: DesignDoc): TargetEvaluation => {
    freqs = full;
    const r = respond(d);
    if (!r) throw new InputError('impossible-layout', 'design', 'a design that sizes without problems', 'sizing problems', 'fix the layout first');
    return evaluateTargets(r, { targets: goals.map((g) => g.target), phaseGroups: d.phaseGroups });
  };
  const before = evaluateDoc(doc);
  freqs = coarse;
  const costBefore = costOf(doc);
  const maxEvaluations = opts.maxEvaluations ?? Math.max(300, 150 * vars.length);
  const costAt = (x: readonly number[]): number => {
    let d: DesignDoc;
    // A block spec its generator refuses (a value sizing cannot realise) is a bad point, not an error.
    try { d = withValues(doc, vars, value(x), regen); } catch (e) { if (e instanceof InputError) return 1e9; throw e; }
    return costOf(d);
  };
  const res = await minimiseInBox(costAt, start, {
    maxEvaluations, costTolerance: 1e-9, sizeTolerance: 1e-6, seed,
    onIteration: async (best, n) => {
      opts.onProgress?.(Math.min(1, n / maxEvaluations), best);
      if (opts.yieldTo) await opts.yieldTo();
      return !opts.signal?.aborted;
    },
  });
  if (res.stopped === 'cancelled') {
    const reason = opts.signal?.reason;
    throw reason instanceof Error ? reason : Object.assign(new Error('tuning cancelled'), { name: 'AbortError' });
  }
  // Keep the start when the search found nothing better.
  const better = res.cost < costBefore;
  const finalValues = better ? value(res.x) : vars.map((v) => nowValue(v, 'variables'));
  const out = better ? withValues(doc, vars, finalValues, regen) : doc;
  return {
    doc: out, layoutProblems: sizeDesign(out, { cache }).problems.map((p) => p.message),
    variables: vars.map((v, i) => ({
      ...(isBlockVariable(v)
        ? { name: `${v.block} ${v.param}`, quantity: 'block' as const, segments: [], block: v.block, param: v.param }
        : { name: `${v.segments.join('+')} ${v.quantity}`, quantity: v.quantity, segments: v.segments }),
      before: nowValue(v, 'variables'), after: finalValues[i]!, min: v.min, max: v.max,
    })),
    before, after: better ? evaluateDoc(out) : before, costBefore, costAfter: better ? res.cost : costBefore,
    evaluations: res.evaluations, stopped: res.stopped, seed,
  };
}

/**
 * Variables when none are given: every line piece whose length is set in degrees varies its degrees (±30 %) and,
 * when its width is set by impedance, its impedance (±20 %) — the pieces a designer sized on purpose.
 */
export function defaultVariables(doc: DesignDoc): TuneVariable[] {
  const out: TuneVariable[] = [];
  for (const s of doc.segments) {
    if (s.kind !== 'line' || s.length.by !== 'degrees') continue;
    out.push({ segments: [s.id], quantity: 'degrees', min: s.length.deg * 0.7, max: s.length.deg * 1.3 });
    if (s.width.by === 'z0') out.push({ segments: [s.id], quantity: 'z0', min: s.width.z0 * 0.8, max: s.width.z0 * 1.2 });
  }
  return out;
}
