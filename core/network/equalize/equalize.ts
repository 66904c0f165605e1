/**
 * Equalize a phase group: lengthen the shorter paths with meanders until every path has the same electrical length
 * at f0 (or the offsets the group asks for). The one function behind the app's button and `stripwright equalize`.
 *
 * How: the paths are traced on the sized design (core/layout paths.ts: the ledger's own phases); each path's
 * deficit to the longest is shared out over the tree of paths (allocate.ts: as few branches as will do, nearest the
 * start); on each chosen branch one straight drawn run is replaced by a meander (meander.ts) that fits the room
 * (room.ts: board outline, keep-outs, other copper, legs at least `gap` apart). The meander's corners are vertices
 * with optimal miters, so sizing compensates every bend (Douville & James 1978, core/discontinuity). Its realised
 * phase is then measured on the re-sized design by the ledger itself and the height corrected (a few rounds, slope
 * one); the ledger counts the legs' coupling (core/layout folds.ts, coupled-line model), as the sweep does, so the
 * three agree. Ports and all other pieces keep their
 * place: a meander starts and ends where its run did, leaving in the run's direction.
 */
import type { DesignDoc, DesignNode, DesignSegment, PhaseGroup } from '../../design/types.ts';
import { sizeDesign, tracePaths, foldsOf, foldShareRad, BOARD_SIZE_LIMIT, type PathReport, type SizedDesign, type SizedPiece } from '../../layout/index.ts';
import type { Vec2 } from '../../geometry/types.ts';
import { InputError } from '../../util/errors.ts';
import { lineModels, pairAt } from '../../line/index.ts';
import { miterCut } from '../../discontinuity/douvilleJames1978Miter.ts';
import { matchedLeads, sweepSpreadDeg } from './sweep-check.ts';
import { warn, type Warning } from '../../util/warnings.ts';
import { allocate, type Branch } from './allocate.ts';
import { doglegHeight, meanderCorners, meanderExtra, meanderSpan, type MeanderShape } from './meander.ts';
import { roomContext, roomProblem } from './room.ts';
import { meanderCouplingDeg } from './coupling.ts';

export type MeanderStyle = 'auto' | 'serpentine' | 'trombone';

export interface EqualizeOptions {
  /** The phase group, by id or name. */
  group: string;
  /** Pieces that may carry a meander (default: the tool chooses among straight drawn runs of the group's paths). */
  pieces?: string[];
  /** 'trombone': one U; 'serpentine': two bumps or more; 'auto' (default): the fewest bumps that fit. */
  style?: MeanderStyle;
  /** Least edge gap between legs and to other copper, m (default 3h: coupling kept low, common practice). */
  gap?: number;
  /**
   * Instead of a gap: the most coupling two neighbouring legs may have, dB (e.g. −30): the gap is the least that keeps
   * the pair's coupling factor (Kirschning–Jansen 1984 modes at f0) at or below it, and never below 3h unless `gap` says so.
   */
  couplingLimitDb?: number;
  /** Count the legs' coupling in the meander's electrical length (default true). */
  coupling?: boolean;
  /** Most bumps in one serpentine (default 12). */
  maxBumps?: number;
  /**
   * Equal-phase groups: the sweep's band-edge phase spread above which meanders the tool placed move to matched port
   * leads, degrees (default 1).
   */
  sweepLimitDeg?: number;
}

export interface MeanderReport {
  /** The run that became the meander (its first stretch keeps the id). */
  piece: string;
  shape: MeanderShape;
  side: 1 | -1;
  /** Electrical length added at f0, degrees (as the ledger measures it, the legs' coupling included). */
  addedDeg: number;
  /** Centreline length added through the corner points, m. */
  extraLength: number;
  /** The legs' coupling share of addedDeg at band start, f0 and band stop, degrees. */
  couplingDeg: [number, number, number];
  nodes: string[];
  segments: string[];
}

export interface EqualizedPath {
  to: string;
  /** Ledger phase at band start, f0, stop, degrees (the meanders' coupling included, core/layout folds.ts). */
  ledgerDeg: [number, number, number];
  /** The same electrical length (kept for readers of earlier reports: the ledger now counts the coupling itself). */
  electricalDeg: [number, number, number];
  /** Wanted offset to the first path, degrees. */
  offsetDeg: number;
}

export interface EqualizeResult {
  doc: DesignDoc;
  group: PhaseGroup;
  meanders: MeanderReport[];
  before: PathReport;
  after: PathReport;
  paths: EqualizedPath[];
  /** Largest minus smallest (electrical length − offset) at f0, degrees; the same from the ledger alone. */
  spreadDeg: number;
  ledgerSpreadDeg: number;
  /** The same spread at the band's start and stop, degrees: for an offset group, the band-edge error its length offsets imply. */
  bandSpreadDeg: [number, number];
  /** Equal-phase groups with meanders: the sweep's own S21 phase spread at band start, f0 and stop, degrees. */
  sweepSpreadDeg?: [number, number, number];
  warnings: Warning[];
}

const SMALL_DEG = 0.01;
/** Band-edge phase spread of the sweep above which the tool moves its meanders to matched leads, degrees (issue's aim). */
export const SWEEP_LIMIT_DEG = 1;

const ITERATIONS = 6;

export function findGroup(doc: DesignDoc, key: string): PhaseGroup {
  const g = doc.phaseGroups.find((x) => x.id === key) ?? doc.phaseGroups.find((x) => x.name === key);
  if (!g) {
    const list = doc.phaseGroups.map((x) => `${x.id} (${x.name})`).join(', ');
    throw new InputError('bad-choice', 'group', list ? `the id or name of a phase group of this design: ${list}` : 'a phase group (this design has none; add one in the path ledger)', JSON.stringify(key));
  }
  return g;
}

function sized(doc: DesignDoc): SizedDesign {
  const s = sizeDesign(doc);
  const p = s.problems[0];
  if (p) throw new InputError('impossible-layout', 'design', 'a design that sizes without problems', p.message, 'fix the layout problems first');
  return s;
}

function trace(s: SizedDesign, g: PhaseGroup): PathReport {
  return tracePaths(s, g.from, g.to, { sensitivities: false, toleranceDeg: g.toleranceDeg, group: g.id, name: g.name, ...(g.offsetsDeg ? { offsetsDeg: g.offsetsDeg } : {}) });
}

/**
 * Electrical length of one run (the route between a piece's two nodes; `ids` its pieces now), degrees at f0, with the
 * share of every fold it makes with the copper just beyond its ends (a meander's first leg running back beside the
 * piece before it): the group's paths count those folds too (core/layout folds.ts), the run's own route does not.
 */
function runDeg(s: SizedDesign, a: string, b: string, ids: readonly string[]): number {
  const own = tracePaths(s, a, [b], { sensitivities: false, matched: false }).paths[0]?.degAtF0 ?? 0;
  const mine = new Set(ids);
  let edge = 0;
  for (const fold of foldsOf(s)) {
    const parts = [fold.legs[0], fold.legs[1], fold.joinPiece];
    const inside = parts.filter((id) => mine.has(id)).length;
    if (inside > 0 && inside < 3) edge += foldShareRad(s.doc.substrate, fold, s.f0);
  }
  return own + (edge * 180) / Math.PI;
}

interface Plan { piece: SizedPiece; seg: DesignSegment; shape: MeanderShape; side: 1 | -1; lead: number; shareDeg: number; extra: number; from: Vec2; to: Vec2; shift: Vec2 }

export function equalizeGroup(doc: DesignDoc, opts: EqualizeOptions): EqualizeResult {
  const g = findGroup(doc, opts.group);
  const s0 = sized(doc);
  const before = trace(s0, g);
  if (before.paths.length !== g.to.length) {
    const missing = g.to.filter((t) => !before.paths.some((p) => p.to === t));
    throw new InputError('impossible-layout', 'group', `every port of the group joined to ${g.from}`, `no route to ${missing.join(', ')}`);
  }
  const h = doc.substrate.h;
  const gap = opts.gap ?? (opts.couplingLimitDb !== undefined ? gapForCoupling(doc, s0, opts.couplingLimitDb) : 3 * h);
  if (!(gap > 0) || !Number.isFinite(gap) || gap > 0.1) throw new InputError('out-of-range', 'gap', 'an edge gap above 0 and at most 100 mm', String(gap));
  const style = opts.style ?? 'auto';
  const maxBumps = opts.maxBumps ?? 12;
  const withCoupling = opts.coupling !== false;
  const offsets = g.to.map((_, i) => g.offsetsDeg?.[i] ?? 0);
  const segById = new Map(doc.segments.map((x) => [x.id, x]));
  const pieceById = new Map(s0.pieces.map((x) => [x.id, x]));
  if (opts.pieces) {
    for (const id of opts.pieces) if (!segById.has(id)) throw new InputError('bad-choice', 'pieces', 'ids of segments of this design', JSON.stringify(id));
  }
  const leads = matchedLeads(s0, before);
  const first = attempt(false);
  // The ledger counts lengths; the sweep also sees what the line a meander sits on reflects at its two ends. A meander
  // on a mismatched line (a tee's arm before a quarter-wave transformer) moves those reflections' phase off f0, so an
  // equal-phase group the tool placed is checked in the sweep at the band's start, f0 and stop; past the limit, its
  // meanders move to the matched port leads, whose length is all they add (more meanders, each on a matched line).
  const limit = opts.sweepLimitDeg ?? SWEEP_LIMIT_DEG;
  const equalPhase = offsets.every((o) => o === 0);
  if (!equalPhase || !first.meanders.length) return first;
  try { first.sweepSpreadDeg = sweepSpreadDeg(first.doc, g); } catch (e) {
    // A design the sweep cannot solve (its own refusal names why) keeps the ledger's result, unchecked.
    if (!(e instanceof InputError)) throw e;
    first.warnings.push(warn('phase', `not checked in the sweep: ${e.message}`, { subjects: [g.id], severity: 'info' }));
    return first;
  }
  const worst1 = Math.max(...first.sweepSpreadDeg);
  if (worst1 <= limit) return first;
  const mismatchWarning = (why: string): EqualizeResult => {
    first.warnings.push(warn('phase', `the sweep's S21 phase spread of ${g.name} is ${worst1.toFixed(2)}° across the band, above ${limit}°: the meanders on ${first.meanders.filter((m) => !leads.has(m.piece)).map((m) => m.piece).join(', ')} sit on lines not matched at both ends, whose reflections off f0 a length cannot follow; ${why}`, { subjects: first.meanders.map((m) => m.piece), severity: 'warning' }));
    return first;
  };
  if (first.meanders.every((m) => leads.has(m.piece))) {
    first.warnings.push(warn('phase', `the sweep's S21 phase spread of ${g.name} is ${worst1.toFixed(2)}° across the band, above ${limit}°, with every meander on a matched port lead: what the junctions and parts on the paths reflect off f0 differs from path to path`, { subjects: [g.id], severity: 'warning' }));
    return first;
  }
  if (opts.pieces) return mismatchWarning('choose pieces on lines matched to their ports (a port lead of the port\'s impedance), or let the tool choose');
  let second: EqualizeResult;
  try { second = attempt(true); } catch (e) {
    if (!(e instanceof InputError)) throw e;
    return mismatchWarning('the port leads, which are matched, have no room for them');
  }
  second.sweepSpreadDeg = sweepSpreadDeg(second.doc, g);
  if (Math.max(...second.sweepSpreadDeg) >= worst1) return mismatchWarning(`on the matched port leads it would be ${Math.max(...second.sweepSpreadDeg).toFixed(2)}°, no better`);
  second.warnings.push(warn('phase', `meanders on the port leads (matched lines), not on ${first.meanders.map((m) => m.piece).join(', ')}: there the sweep's phase spread across the band was ${Math.max(...first.sweepSpreadDeg).toFixed(2)}°, above ${limit}°; now ${Math.max(...second.sweepSpreadDeg).toFixed(2)}°`, { subjects: second.meanders.map((m) => m.piece), severity: 'info' }));
  return second;

  function attempt(matchedOnly: boolean): EqualizeResult {
  const reason = new Map<string, string>();
  /** Why the last shape tried on a piece did not fit (room or run length), for the refusal. */
  const lastProblem = new Map<string, string>();
  const eligible = (id: string): boolean => {
    const seg = segById.get(id), p = pieceById.get(id);
    if (!seg || !p) return false;
    if (opts.pieces && !opts.pieces.includes(id)) return false;
    if (matchedOnly && !leads.has(id)) { reason.set(id, 'not a matched port lead'); return false; }
    if (seg.kind !== 'line' || !(seg.length.by === 'drawn' || (seg.length.by === 'length' && drawnAsLong(id)))) { reason.set(id, 'only a straight run drawn to length can carry a meander'); return false; }
    if ((s0.centrelines[id]?.length ?? 0) !== 2) { reason.set(id, 'the run is not straight'); return false; }
    return true;
  };
  // Deficits: every path should reach the largest (phase − offset).
  const level = before.paths.map((p, i) => p.degAtF0 - offsets[i]!);
  const top = Math.max(...level);
  const treePaths = before.paths.map((p, i) => ({ to: p.to, pieces: p.pieces, deficitDeg: top - level[i]! }));
  const blocked = new Set<string>();
  const plans = new Map<Branch, Plan>();
  const usable = (b: Branch): boolean => b.pieces.some((id) => eligible(id) && !blocked.has(id));
  let alloc = allocate(treePaths, usable, SMALL_DEG);
  for (let round = 0; round < 64; round++) {
    let changed = false;
    plans.clear();
    for (const share of alloc.shares) {
      const plan = planBranch(share.branch, share.deg);
      if (plan) plans.set(share.branch, plan);
      else { for (const id of share.branch.pieces) blocked.add(id); changed = true; }
    }
    if (!changed) break;
    alloc = allocate(treePaths, usable, SMALL_DEG);
  }
  if (alloc.unmet.size) refuse(alloc.unmet);

  function planBranch(b: Branch, shareDeg: number): Plan | null {
    const candidates = b.pieces.filter((id) => eligible(id) && !blocked.has(id))
      .sort((x, y) => pieceById.get(y)!.span - pieceById.get(x)!.span);
    for (const id of candidates) {
      const piece = pieceById.get(id)!;
      const beta = piece.line?.beta ?? 0;
      if (!(beta > 0)) continue;
      const extra = ((shareDeg * Math.PI) / 180) / beta;
      lastProblem.delete(id);
      const fit = fitShape(piece, extra);
      if (fit) return { ...fit, shareDeg, extra };
      const least = smallestExtra(piece);
      reason.set(id, extra < least
        ? `${(extra * 1e3).toFixed(2)} mm is less than the smallest ${styleWord()} there adds (${(least * 1e3).toFixed(2)} mm)${style === 'auto' ? `, and a shallow dogleg does not fit: ${lastProblem.get(id) ?? 'the run is too short for its ramps'}` : ''}`
        : `no room for ${(extra * 1e3).toFixed(2)} mm: ${lastProblem.get(id) ?? 'no shape fits'}`);
    }
    return null;
  }

  function ends(piece: SizedPiece): { from: Vec2; to: Vec2; shift: Vec2 } {
    const line = s0.centrelines[piece.id]!;
    const na = doc.nodes.find((n) => n.id === piece.a)!;
    return { from: line[0]!, to: line[1]!, shift: { x: na.at.x - line[0]!.x, y: na.at.y - line[0]!.y } };
  }

  function fitShape(piece: SizedPiece, extra: number, only?: { side: 1 | -1; bumps?: number; lead?: number }): Omit<Plan, 'shareDeg' | 'extra'> | null {
    const { from, to, shift } = ends(piece);
    const W = piece.width, L = Math.hypot(to.x - from.x, to.y - from.y);
    // Two strip widths of straight line before the first corner keep the corners' copper apart (our rule); the
    // room check keeps the legs clear of the neighbours at the run's ends.
    // A serpentine's legs and joins run between two right-angle miters, each cutting back along the line (sizing
    // refuses a piece shorter than its two cuts): they are at least two strip widths and the two cuts long.
    const legMin = legLeast(W);
    const pitch = Math.max(gap + W, legMin), hMin = 2 * W, leadMin = 2 * W;
    const ctx = roomContext(s0, piece.id, gap);
    const seg = segById.get(piece.id)!;
    const sides: (1 | -1)[] = only ? [only.side] : [1, -1];
    const tryShape = (shape: MeanderShape): Omit<Plan, 'shareDeg' | 'extra'> | null => {
      const free = L - meanderSpan(shape);
      if (free < 2 * leadMin) { if (!lastProblem.has(piece.id)) lastProblem.set(piece.id, `the run is ${(L * 1e3).toFixed(2)} mm long, too short for the meander's ${(meanderSpan(shape) * 1e3).toFixed(2)} mm along it and its straight ends`); return null; }
      // Centred first, then as far toward either end as the corners allow.
      const leads = only?.lead !== undefined ? [only.lead] : [free / 2, leadMin, free - leadMin, free / 4, (3 * free) / 4];
      for (const lead of leads) {
        if (lead < leadMin - 1e-12 || free - lead < leadMin - 1e-12) continue;
        for (const side of sides) {
          const path = [from, ...meanderCorners({ a: from, b: to, side, shape, lead }), to];
          const problem = roomProblem(ctx, path, W, gap);
          if (!problem) return { piece, seg, shape, side, lead, from, to, shift };
          if (!lastProblem.has(piece.id)) lastProblem.set(piece.id, problem);
        }
      }
      return null;
    };
    if (extra >= 2 * legMin) {
      const k0 = style === 'serpentine' ? 2 : 1, k1 = style === 'trombone' ? 1 : maxBumps;
      for (let k = only?.bumps ?? k0; k <= (only?.bumps ?? k1); k++) {
        const height = extra / (2 * k);
        if (height < legMin) break;
        const hit = tryShape({ kind: 'serpentine', bumps: k, height, pitch });
        if (hit) return hit;
      }
      if (only?.bumps) return null;
    }
    if (extra < 4 * hMin && style === 'auto') {
      // Longer ramps keep the dogleg low; shorter ones keep it away from the run's neighbours.
      const most = (L - 2 * leadMin - pitch) / 2 - 1e-9;
      for (const reach of [most, most / 2, most / 4, 2 * hMin]) {
        if (!(reach >= hMin) || reach > most) continue;
        const hit = tryShape({ kind: 'dogleg', reach, height: doglegHeight(extra, reach), top: pitch });
        if (hit) return hit;
      }
      // A short run (a port lead): a steeper dogleg with a top of two strip widths, ramps reaching at least one width.
      const top = legMin, steep = (L - 2 * leadMin - top) / 2 - 1e-9;
      for (const reach of [steep, (steep + W) / 2, W]) {
        if (!(reach >= W) || reach > steep) continue;
        const hit = tryShape({ kind: 'dogleg', reach, height: doglegHeight(extra, reach), top });
        if (hit) return hit;
      }
    }
    return null;
  }

  /** The style's name as people say it. */
  function styleWord(): string { return style === 'serpentine' ? 'serpentine (two bumps or more)' : style === 'trombone' ? 'trombone (one U)' : 'U-shaped meander'; }

  /**
   * Least length the chosen style adds on a piece, m: legs of at least two strip widths (our rule, so the two bends of
   * a leg stay apart), 2 legs a bump; a serpentine has two bumps or more. 'auto' also has the shallow dogleg, which
   * adds any small amount where the run is long enough, so its least is that of a U.
   */
  function smallestExtra(piece: SizedPiece): number {
    return (style === 'serpentine' ? 4 : 2) * legLeast(piece.width);
  }

  /** Least leg of a serpentine of strip width W, m: two strip widths, and no less than two right-angle miters cut. */
  function legLeast(W: number): number {
    let cut = 0;
    try {
      const c = miterCut({ W, h: doc.substrate.h, er: doc.substrate.er, turnRad: Math.PI / 2 });
      cut = Math.max(0, c.leg - W / 2);
    } catch (e) { if (!(e instanceof InputError)) throw e; }
    return Math.max(2 * W, 2 * cut * 1.02);
  }

  function refuse(unmet: Map<string, number>): never {
    const [worst, deg] = [...unmet].sort((a, b) => b[1] - a[1])[0]!;
    const path = before.paths.find((p) => p.to === worst)!;
    // Millimetres of the line a meander would be made of (an eligible run of the path), else of its first line.
    const onPath = path.pieces.filter((id) => !opts.pieces || opts.pieces.includes(id));
    const usableRuns = onPath.filter((id) => eligible(id));
    // Of the runs tried first (their line is what a meander there is made of).
    const tried = usableRuns.filter((id) => reason.has(id));
    const betaOf = (id: string) => pieceById.get(id)?.line?.beta ?? 0;
    const beta = [...tried, ...usableRuns, ...path.pieces].map(betaOf).find((b) => b > 0) ?? 0;
    const mm = beta > 0 ? ((deg * Math.PI) / 180 / beta) * 1e3 : 0;
    const short = `path ${g.from} → ${worst} is ${deg.toFixed(1)}° (${mm.toFixed(2)} mm of line) short`;
    const why = (ids: string[]) => ids.filter((id) => reason.has(id)).slice(0, 4).map((id) => `${id}: ${reason.get(id)}`).join('; ');
    if (!usableRuns.length) {
      throw new InputError('impossible-layout', 'group', `a straight run on the paths of ${g.name} that can carry a meander`,
        `${short}, and none of its pieces${opts.pieces ? ' among those chosen' : ''} is a straight run drawn to length${why(onPath) ? ` (${why(onPath)})` : ''}`,
        opts.pieces ? 'choose a straight run on that path (or let the tool choose)' : 'draw a straight run on that path (a line drawn to its length), then equalize again');
    }
    const runs = tried.length ? tried : usableRuns;
    const least = Math.min(...runs.map((id) => smallestExtra(pieceById.get(id)!))) * 1e3;
    // ('auto' has the shallow dogleg for small needs: there a refusal is about room, below.)
    if (style !== 'auto' && mm < least) {
      // Too little for the style: no room is missing, the shape is too big for the need.
      const other = style === 'serpentine' ? 'the meander style auto (a shallow dogleg adds small amounts) or trombone (one U, from half as much)' : 'the meander style auto (a shallow dogleg adds small amounts)';
      throw new InputError('impossible-layout', 'group', `a lengthening the chosen meander style can make on the paths of ${g.name}`,
        `${short}, but the smallest ${styleWord()} on its runs (${runs.slice(0, 6).join(', ')}) adds ${least.toFixed(2)} mm: each leg is at least ${(Math.min(...runs.map((id) => legLeast(pieceById.get(id)!.width))) * 1e3).toFixed(2)} mm long (two strip widths, and longer than its two corners' miter cuts)`,
        `choose ${other}, or lengthen the group's longest path by at least ${(least - mm).toFixed(2)} mm so the others need ${least.toFixed(2)} mm or more`);
    }
    const caps = runs.map((id) => ({ id, mm: capacity(id) * 1e3 })).sort((a, b) => b.mm - a.mm);
    const best = caps[0]!;
    if (best.mm >= mm) {
      // Room enough for more, but not for this little: the corners need legs of two strip widths or long ramps.
      throw new InputError('impossible-layout', 'group',
        `room for meanders on the paths of ${g.name}`,
        `${short}, less than the smallest meander that fits its runs (legs of at least ${(legLeast(pieceById.get(best.id)!.width) * 1e3).toFixed(2)} mm; up to ${best.mm.toFixed(2)} mm fit on ${best.id})${why(runs) ? ` (${why(runs)})` : ''}`,
        'choose a longer or narrower run on that path, or lengthen the group\'s long path so the others need more');
    }
    throw new InputError('impossible-layout', 'group',
      `room for meanders on the paths of ${g.name}`,
      `${short}; ${best.mm < 0.01 ? `none of the runs it could use (${runs.slice(0, 6).join(', ')}) has room for a ${styleWord()}, so all ${mm.toFixed(2)} mm is missing` : `the most one of its runs takes is ${best.mm.toFixed(2)} mm (${best.id}), so ${Math.max(0, mm - best.mm).toFixed(2)} mm is missing`}${why(runs) ? ` (${why(runs)})` : ''}`,
      'make room beside a drawn run on that path (move other copper, widen the board), choose other pieces, or lower the leg gap');
  }

  /** The most one piece could take (any side, any bump count), m: bisection on the height. */
  function capacity(id: string): number {
    if (!eligible(id)) return 0;
    const piece = pieceById.get(id)!;
    let best = 0;
    for (let k = style === 'serpentine' ? 2 : 1; k <= (style === 'trombone' ? 1 : maxBumps); k++) {
      let lo = legLeast(piece.width), hi = BOARD_SIZE_LIMIT;
      if (!fitShape(piece, 2 * k * lo, { side: 1, bumps: k }) && !fitShape(piece, 2 * k * lo, { side: -1, bumps: k })) continue;
      for (let i = 0; i < 30; i++) {
        const mid = (lo + hi) / 2;
        if (fitShape(piece, 2 * k * mid, { side: 1, bumps: k }) || fitShape(piece, 2 * k * mid, { side: -1, bumps: k })) lo = mid; else hi = mid;
      }
      best = Math.max(best, 2 * k * lo);
    }
    return best;
  }

  // Build, measure, correct.
  const list = [...plans.values()];
  const f = [s0.band.start, s0.f0, s0.band.stop];
  const sub = doc.substrate;
  const baseDeg = new Map(list.map((p) => [p.piece.id, runDeg(s0, p.piece.a, p.piece.b, [p.piece.id])]));
  let out = doc;
  let s1 = s0;
  const couplingOf = (p: Plan, fk: number) => (withCoupling ? meanderCouplingDeg(sub, p.piece.width, p.shape, fk) : 0);
  for (let it = 0; it < ITERATIONS; it++) {
    out = withMeanders(doc, list);
    s1 = sized(out);
    let worst = 0;
    for (const p of list) {
      const realised = runDeg(s1, p.piece.a, p.piece.b, meanderIds(doc, p).segments) - baseDeg.get(p.piece.id)!;
      const err = p.shareDeg - realised;
      worst = Math.max(worst, Math.abs(err));
      if (Math.abs(err) < 1e-3) continue;
      p.extra += ((err * Math.PI) / 180) / (p.piece.line?.beta ?? 1);
      const fit = fitShape(p.piece, p.extra, { side: p.side, ...(p.shape.kind === 'serpentine' ? { bumps: p.shape.bumps } : {}) }) ?? fitShape(p.piece, p.extra);
      if (!fit) refuse(new Map([[before.paths.find((x) => x.pieces.includes(p.piece.id))!.to, Math.abs(err)]]));
      Object.assign(p, fit);
    }
    if (worst < 1e-3 && it > 0) break;
  }
  out = withMeanders(doc, list);
  s1 = sized(out);
  const after = trace(s1, g);
  const meanders: MeanderReport[] = list.map((p) => {
    const c = f.map((fk) => couplingOf(p, fk)) as [number, number, number];
    const ids = meanderIds(doc, p);
    return { piece: p.piece.id, shape: p.shape, side: p.side, addedDeg: runDeg(s1, p.piece.a, p.piece.b, ids.segments) - baseDeg.get(p.piece.id)!, extraLength: meanderExtra(p.shape), couplingDeg: c, nodes: ids.nodes, segments: ids.segments };
  });
  const paths: EqualizedPath[] = after.paths.map((e, i) => {
    const ledger = [e.band[0]!.deg, e.band[1]!.deg, e.band[2]!.deg] as [number, number, number];
    return { to: e.to, ledgerDeg: ledger, electricalDeg: [...ledger], offsetDeg: offsets[i]! };
  });
  const spread = (k: number, key: 'ledgerDeg' | 'electricalDeg') => {
    const v = paths.map((p) => p[key][k]! - p.offsetDeg);
    return Math.max(...v) - Math.min(...v);
  };
  const warnings: Warning[] = [];
  if (!list.length) warnings.push(warn('phase', `the paths of ${g.name} already match within ${SMALL_DEG}°: nothing to lengthen`, { subjects: [g.id], severity: 'info' }));
  for (const m of meanders) {
    if (Math.abs(m.couplingDeg[1]) > 0.05) warnings.push(warn('phase', `meander on ${m.piece}: its legs' coupling adds ${m.couplingDeg[1].toFixed(2)}° at f0 (counted by the ledger and the sweep)`, { subjects: [m.piece], severity: 'info' }));
  }
  return {
    doc: out, group: g, meanders, before, after, paths,
    spreadDeg: spread(1, 'electricalDeg'), ledgerSpreadDeg: spread(1, 'ledgerDeg'),
    bandSpreadDeg: [spread(0, 'electricalDeg'), spread(2, 'electricalDeg')], warnings,
  };
  }

  /** A run given by length whose drawn ends already lie that far apart: its meander keeps both ends in place. */
  function drawnAsLong(id: string): boolean {
    const seg = segById.get(id);
    if (!seg || seg.kind !== 'line' || seg.length.by !== 'length') return false;
    const a = doc.nodes.find((n) => n.id === seg.a), b = doc.nodes.find((n) => n.id === seg.b);
    return !!a && !!b && Math.abs(Math.hypot(b.at.x - a.at.x, b.at.y - a.at.y) - seg.length.length) < 1e-7;
  }
}

/** The least edge gap (at least 3h) at which the narrowest line of the design couples no more than `limitDb`, m. */
function gapForCoupling(doc: DesignDoc, s: SizedDesign, limitDb: number): number {
  if (!(limitDb < 0) || !Number.isFinite(limitDb)) throw new InputError('out-of-range', 'couplingLimitDb', 'a coupling limit below 0 dB, e.g. −30', String(limitDb));
  const h = doc.substrate.h;
  const widths = s.pieces.filter((p) => p.kind === 'line' && Number.isFinite(p.width)).map((p) => p.width);
  if (!widths.length) return 3 * h;
  const w = Math.max(...widths); // wider strips couple more at one gap
  const pairs = (s.lineModels ?? lineModels).coupled();
  const couples = (gap: number) => -pairAt(pairs, doc.substrate, w, gap, s.f0).couplingDb; // dB, negative
  let lo = 3 * h, hi = 100 * h;
  if (couples(lo) <= limitDb) return lo;
  if (couples(hi) > limitDb) throw new InputError('out-of-range', 'couplingLimitDb', `a limit the lines reach within 100 substrate heights (${couples(hi).toFixed(1)} dB there)`, `${limitDb} dB`);
  for (let i = 0; i < 40; i++) { const mid = (lo + hi) / 2; if (couples(mid) > limitDb) lo = mid; else hi = mid; }
  return hi;
}

function meanderIds(doc: DesignDoc, p: Plan): { nodes: string[]; segments: string[] } {
  const taken = new Set<string>([...doc.nodes.map((n) => n.id), ...doc.segments.map((x) => x.id), ...doc.areas.map((a) => a.id), ...doc.phaseGroups.map((x) => x.id)]);
  const count = meanderCorners({ a: p.from, b: p.to, side: p.side, shape: p.shape, lead: p.lead }).length;
  const fresh = (prefix: string): string => { let k = 1; while (taken.has(`${prefix}${k}`)) k++; taken.add(`${prefix}${k}`); return `${prefix}${k}`; };
  const nodes = Array.from({ length: count }, () => fresh(`${p.seg.id}-m`));
  const segments = [p.seg.id, ...Array.from({ length: count }, () => fresh(`${p.seg.id}-s`))];
  return { nodes, segments };
}

const snap = (x: number) => { const r = Math.round(x * 1e9) / 1e9; return Object.is(r, -0) ? 0 : r; };

/** The design with each plan's run replaced by its meander (same width spec, drawn lengths, optimal miters). */
function withMeanders(doc: DesignDoc, plans: readonly Plan[]): DesignDoc {
  if (!plans.length) return doc;
  const byId = new Map(plans.map((p) => [p.seg.id, p]));
  const nodes: DesignNode[] = [...doc.nodes];
  const segments: DesignSegment[] = [];
  let working = doc;
  for (const seg of doc.segments) {
    const p = byId.get(seg.id);
    if (!p || seg.kind !== 'line') { segments.push(seg); continue; }
    const corners = meanderCorners({ a: p.from, b: p.to, side: p.side, shape: p.shape, lead: p.lead });
    const ids = meanderIds(working, p);
    ids.nodes.forEach((id, i) => {
      const c = corners[i]!;
      nodes.push({ id, kind: 'vertex', bend: { style: 'miter-optimal' }, at: { x: snap(c.x + p.shift.x), y: snap(c.y + p.shift.y) } });
    });
    const chain = [seg.a, ...ids.nodes, seg.b];
    ids.segments.forEach((id, i) => {
      const { label, ...rest } = seg;
      segments.push({ ...rest, ...(i === 0 && label !== undefined ? { label } : {}), id, a: chain[i]!, b: chain[i + 1]!, width: seg.width, length: { by: 'drawn' } } as DesignSegment);
    });
    working = { ...working, nodes, segments: [...segments, ...doc.segments] };
  }
  return { ...doc, nodes, segments };
}
