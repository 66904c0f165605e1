/**
 * What the design's fabrication process cuts: the one place the tool's cut width and the isolation gap come from.
 * The shop check (checks.ts), the milling planner (core/toolpath), as-made sizing (as-made.ts) and the export
 * pipeline's isolation outlines all read it, so the gap a line is sized for is the gap the G-code mills.
 *
 * - End mill: the cut is its diameter.
 * - V-bit: the V's width at the cutting depth, tip + 2·depth·tan(angle/2) (plain geometry).
 * - Etching: no tool; the narrowest gap the artwork can open is the minimum feature grown by the edge bias on both
 *   sides (artwork gaps shrink by 2 × bias).
 * Isolation of a milled design: pass k (0-based) runs with its centre w/2 + k·s from the copper, w the cut, s the
 * stepover w·(1 − overlap) (core/toolpath/isolation.ts), so P passes open a channel of w + (P − 1)·s beside every
 * copper edge. P is the fewest passes whose channel reaches the process's isolation clearance.
 */
import type { FabProcess } from '../design/types.ts';
import { exhaustive } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';

/**
 * Fraction of the cut each further isolation pass overlaps the previous one, unless the milling options say
 * otherwise: 0.4 leaves no copper whisker between passes with round or V tools (common practice).
 */
export const ISOLATION_OVERLAP = 0.4;

/**
 * Isolation clearance of a milled design whose process does not give one: 0.7 mm of bare laminate beside every
 * copper edge (the project's default, chosen for RF lines). Why this width: with the side copper this far from the
 * line, (1) a 1.6 mm glass-epoxy board can still carry lines up to about 128 Ω at the narrowest copper a 30° V-bit
 * leaves (beside one cut: about 78 Ω), so the usual divider, feed and stub-filter impedances can be made; (2) the
 * line's Z0 is about 4 times less sensitive to an error of the cut's width than beside a single 0.11 mm cut (0.19 Ω
 * against 0.76 Ω per 20 µm for a 2.9 mm line, from this project's cross-section solver), so a V-bit cutting a little
 * deep or shallow moves the impedance little; (3) it costs nine passes with the default V-bit, not the hours of
 * clearing all copper. A wider clearance brings lines nearer plain microstrip at the cost of milling time.
 */
export const DEFAULT_ISOLATION_CLEARANCE = 0.7e-3;

/** Width of the cut the process makes (the narrowest gap it can open), m. */
export function cutWidth(p: FabProcess): number {
  switch (p.kind) {
    case 'end-mill': return p.toolDiameter;
    case 'v-bit': return p.tipWidth + 2 * p.depth * Math.tan(((p.angleDeg * Math.PI) / 180) / 2);
    case 'etch': return p.minFeature + 2 * Math.max(0, p.edgeBias);
    default: return exhaustive(p, 'process kind');
  }
}

/** The isolation clearance a milled process asks for, m (its own, or the default). */
export function isolationClearance(p: Exclude<FabProcess, { kind: 'etch' }>): number {
  return typeof p.clearance === 'number' && p.clearance > 0 ? p.clearance : DEFAULT_ISOLATION_CLEARANCE;
}

/**
 * Most isolation passes a plan mills, the bound of the milling options' `passes` too (core/toolpath/options.ts). Kept,
 * for two reasons: every pass is one more loop of the cut around every copper island, so milling time grows with the
 * count while the line's Z0 changes ever less as the side copper moves away (a channel of a few substrate heights is
 * already close to plain microstrip); and a clearance that needs more is the mark of a cut much narrower than the
 * clearance, which a wider tool mills in a fraction of the time. Where the clearance asks for more, the plan mills
 * this many and says so (IsolationPlan.warnings); sizing uses the channel actually milled.
 */
export const MAX_ISOLATION_PASSES = 10;

/** How the isolation is milled: passes, stepover and the channel they open beside the copper (m). */
export interface IsolationPlan {
  passes: number;
  /** Distance between neighbouring passes' centres, m: cut · (1 − overlap). */
  stepover: number;
  /** Width of the bare channel beside every copper edge, m: cut + (passes − 1) · stepover. */
  gap: number;
  /** Why the channel is narrower than the clearance asks (more passes than MAX_ISOLATION_PASSES); empty otherwise. */
  warnings: Warning[];
}

/** Channel that `passes` isolation passes open: cut + (passes − 1)·stepover (what core/toolpath/isolation.ts mills). */
export function isolationGapOf(cut: number, passes: number, overlap = ISOLATION_OVERLAP): number {
  return cut + Math.max(0, passes - 1) * cut * (1 - overlap);
}

/** Passes that reach `clearance` with this cut and overlap (at least one), before the MAX_ISOLATION_PASSES bound. */
export function passesNeeded(cut: number, clearance: number, overlap = ISOLATION_OVERLAP): number {
  const step = cut * (1 - overlap);
  return 1 + Math.max(0, Math.ceil((clearance - cut - 1e-9) / step)); // 1 nm: a clearance written to 1 nm
}

/** Passes that reach `clearance` with this cut and overlap (at least one; at most MAX_ISOLATION_PASSES). */
export function passesFor(cut: number, clearance: number, overlap = ISOLATION_OVERLAP): number {
  return Math.min(MAX_ISOLATION_PASSES, passesNeeded(cut, clearance, overlap));
}

/** The isolation of a milled process; `passes` overrides the count the clearance gives (milling options). */
export function isolationPlan(p: Exclude<FabProcess, { kind: 'etch' }>, overlap = ISOLATION_OVERLAP, passes?: number): IsolationPlan {
  const cut = cutWidth(p);
  const clearance = isolationClearance(p);
  const needed = passesNeeded(cut, clearance, overlap);
  const n = passes ?? Math.min(MAX_ISOLATION_PASSES, needed);
  const gap = isolationGapOf(cut, n, overlap);
  const warnings: Warning[] = [];
  if (passes === undefined && needed > MAX_ISOLATION_PASSES) {
    const mm = (m: number) => `${(m * 1e3).toFixed(3)} mm`;
    warnings.push(warn('fabrication',
      `the isolation clearance of ${mm(clearance)} needs ${needed} passes of the ${mm(cut)} cut; at most ${MAX_ISOLATION_PASSES} are milled, which open ${mm(gap)} beside the copper, and the lines are sized beside that channel. For the full clearance use a wider cut, or give a clearance of at most ${mm(gap)}.`,
      { source: 'isolation-passes' }));
  }
  return { passes: n, stepover: cut * (1 - overlap), gap, warnings };
}

export interface ProcessCut {
  /** The tool's cut width at its depth, m. */
  cutWidth: number;
  /** Width of the channel the isolation passes open beside the copper, m (isolationPlan). */
  isolationGap: number;
  /** Isolation passes that open it. */
  passes: number;
  /** Words for notes and file comments, e.g. "V-bit 30°, 0.10 mm tip, 0.080 mm deep". */
  label: string;
  /** The isolation plan's warnings (a clearance needing more than MAX_ISOLATION_PASSES). */
  warnings: Warning[];
}

/** The cut of a milling process: end mill or V-bit; null for etching, which has no tool. */
export function processCut(p: FabProcess): ProcessCut | null {
  if (p.kind === 'etch') return null;
  const w = cutWidth(p);
  const iso = isolationPlan(p);
  const mm = (m: number) => (m * 1e3).toFixed(3);
  const label = p.kind === 'v-bit'
    ? `V-bit ${p.angleDeg}°, ${mm(p.tipWidth)} mm tip, ${mm(p.depth)} mm deep`
    : `${mm(p.toolDiameter)} mm end mill, ${mm(p.depth)} mm deep`;
  return { cutWidth: w, isolationGap: iso.gap, passes: iso.passes, label, warnings: iso.warnings };
}
