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
  warnings: Warning[];
}

const SMALL_DEG = 0.01;
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
  const reason = new Map<string, string>();
  const eligible = (id: string): boolean => {
    const seg = segById.get(id), p = pieceById.get(id);
    if (!seg || !p) return false;
    if (opts.pieces && !opts.pieces.includes(id)) return false;
    if (seg.kind !== 'line' || seg.length.by !== 'drawn') { reason.set(id, 'only a straight run drawn to length can carry a meander'); return false; }
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
      const fit = fitShape(piece, extra);
      if (fit) return { ...fit, shareDeg, extra };
      reason.set(id, `no room for ${(extra * 1e3).toFixed(2)} mm`);
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
    const pitch = gap + W, hMin = 2 * W, leadMin = 2 * W;
    const ctx = roomContext(s0, piece.id, gap);
    const seg = segById.get(piece.id)!;
    const sides: (1 | -1)[] = only ? [only.side] : [1, -1];
    const tryShape = (shape: MeanderShape): Omit<Plan, 'shareDeg' | 'extra'> | null => {
      const free = L - meanderSpan(shape);
      if (free < 2 * leadMin) return null;
      // Centred first, then as far toward either end as the corners allow.
      const leads = only?.lead !== undefined ? [only.lead] : [free / 2, leadMin, free - leadMin, free / 4, (3 * free) / 4];
      for (const lead of leads) {
        if (lead < leadMin - 1e-12 || free - lead < leadMin - 1e-12) continue;
        for (const side of sides) {
          const path = [from, ...meanderCorners({ a: from, b: to, side, shape, lead }), to];
          if (!roomProblem(ctx, path, W, gap)) return { piece, seg, shape, side, lead, from, to, shift };
        }
      }
      return null;
    };
    if (extra >= 2 * hMin) {
      const k0 = style === 'serpentine' ? 2 : 1, k1 = style === 'trombone' ? 1 : maxBumps;
      for (let k = only?.bumps ?? k0; k <= (only?.bumps ?? k1); k++) {
        const height = extra / (2 * k);
        if (height < hMin) break;
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
    }
    return null;
  }

  function refuse(unmet: Map<string, number>): never {
    const [worst, deg] = [...unmet].sort((a, b) => b[1] - a[1])[0]!;
    const path = before.paths.find((p) => p.to === worst)!;
    // Millimetres of the line a meander would be made of (an eligible run of the path), else of its first line.
    const betaOf = (id: string) => pieceById.get(id)?.line?.beta ?? 0;
    const beta = path.pieces.filter((id) => eligible(id)).map(betaOf).find((b) => b > 0) ?? path.pieces.map(betaOf).find((b) => b > 0) ?? 0;
    const mm = beta > 0 ? ((deg * Math.PI) / 180 / beta) * 1e3 : 0;
    const onPath = path.pieces.filter((id) => !opts.pieces || opts.pieces.includes(id));
    const room = onPath.map((id) => capacity(id)).reduce((a, b) => Math.max(a, b), 0) * 1e3;
    const why = onPath.map((id) => reason.get(id) ? `${id}: ${reason.get(id)}` : '').filter(Boolean).slice(-4).join('; ');
    if (room >= mm) {
      // Room enough for more, but not for this little: the corners need legs of two strip widths or long ramps.
      throw new InputError('impossible-layout', 'group',
        `room for meanders on the paths of ${g.name}`,
        `path ${g.from} → ${worst} needs ${deg.toFixed(1)}° (${mm.toFixed(2)} mm of line) more, less than the smallest meander that fits its runs (legs of at least two strip widths; up to ${room.toFixed(2)} mm fit)${why ? ` (${why})` : ''}`,
        'choose a longer or narrower run on that path, or lengthen the group\'s long path so the others need more');
    }
    throw new InputError('impossible-layout', 'group',
      `room for meanders on the paths of ${g.name}`,
      `path ${g.from} → ${worst} needs ${deg.toFixed(1)}° (${mm.toFixed(2)} mm of line) more; the most one of its runs takes is ${room.toFixed(2)} mm, so ${Math.max(0, mm - room).toFixed(2)} mm is missing${why ? ` (${why})` : ''}`,
      'make room beside a drawn run on that path (move other copper, widen the board), choose other pieces, or lower the leg gap');
  }

  /** The most one piece could take (any side, any bump count), m: bisection on the height. */
  function capacity(id: string): number {
    if (!eligible(id)) return 0;
    const piece = pieceById.get(id)!;
    let best = 0;
    for (let k = 1; k <= (style === 'trombone' ? 1 : maxBumps); k++) {
      let lo = 2 * piece.width, hi = BOARD_SIZE_LIMIT;
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
