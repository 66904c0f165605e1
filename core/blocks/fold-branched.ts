/**
 * Folding a block with branches (tees, a ring, stubs, a resistor across a loop) into a footprint: the lines that can
 * change shape without moving anything they do not carry are folded, one kind of line at a time, until the copper
 * fits. A line can change shape freely when it is a bridge of the network (removing it splits the network in two):
 * the part beyond it then moves with it, whole, and no loop has to close again. Lines inside a loop (a branch-line
 * or rat-race ring, a Wilkinson's arms) keep their shape; the lines leading to them fold.
 *
 * Three shapes, every corner a mitered bend inside the line (sizing compensates it with the bend model the sweep
 * uses, and the line's degrees, or its length, are shared between its parts in proportion, so its electrical length
 * is kept):
 * - a tab (four bends): the line steps aside, runs a row pitch along, and steps back; its ends stay on their axis,
 *   so what it carries only moves closer, by twice the step;
 * - an ell (one bend) and a hook (two bends, a U) for a line that ends in an open or shorted end (a stub).
 * Lines alike (same width, same length, same direction: the twins of a symmetric feed) fold alike, so paths that
 * were matched stay matched by construction.
 *
 * A fold is kept only when it adds no crowding: no new pair of runs side by side closer than the proximity limit
 * (3h, the distance beyond which the single-line model is taken to hold, common practice; core/layout/proximity.ts),
 * and no new pair of pieces closer than twice the process's cut (at least 0.5 mm, our margin over the shop check).
 *
 * The search is greedy and bounded: each step tries every kind of line, shape and side on the drawing (the nodes
 * move; nothing is sized), puts first the folds whose centrelines crowd nothing new and then those whose moved nodes
 * overflow least, and sizes and checks only the first `SIZED_PER_STEP` of them; at most `MAX_STEPS` steps. So a
 * footprint that cannot be reached is refused after a bounded number of sizings, and a fold a wider search would find
 * may be missed.
 */
import type { DesignDoc, DesignNode, DesignSegment } from '../design/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import { cutWidth } from '../layout/checks.ts';
import { pieceOutlines } from '../layout/geometry.ts';
import { DEFAULT_PROXIMITY_LIMIT_H, proximityHits } from '../layout/proximity.ts';
import { netlistFromSized } from '../network/fromSized.ts';
import { solveNetwork } from '../network/sweep.ts';
import { sizeDesign } from '../layout/sizing.ts';
import type { SizedDesign } from '../layout/types.ts';
import { placeAsSized } from './drawn.ts';

export interface Box { w: number; h: number }

/** Marks the ids a fold made, so a part is not folded again. */
const FOLD_MARK = '.fold';

/** Width and height of the copper of a sized design (pieces and node patches before their union), m. */
export function copperBox(sized: SizedDesign): Box {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const o of pieceOutlines(sized).outlines) for (const r of o.regions) for (const p of r.outer) {
    x0 = Math.min(x0, p.x); x1 = Math.max(x1, p.x); y0 = Math.min(y0, p.y); y1 = Math.max(y1, p.y);
  }
  return Number.isFinite(x0) ? { w: x1 - x0, h: y1 - y0 } : { w: 0, h: 0 };
}

/** How much a box overflows a footprint, summed over the two sides, m. */
const overflow = (b: Box, fp: Box) => Math.max(0, b.w - fp.w) + Math.max(0, b.h - fp.h);

/**
 * Folds the branched block `doc` (placed as sized) until its copper fits `fp`, in place. Returns the number of lines
 * folded and the copper's size when it fits; otherwise leaves `doc` as it was and returns the smallest copper the
 * folds reached (`fits: false`).
 */
export function foldBranched(doc: DesignDoc, kind: string, fp: Box): { fits: boolean; folded: number; size: Box } {
  const start = snapshot(doc);
  let sized = sizeDesign(doc);
  let size = copperBox(sized), folded = 0;
  for (let step = 0; step < MAX_STEPS && overflow(size, fp) > 1e-9; step++) {
    const next = bestFold(doc, sized, size, fp);
    if (!next) break;
    doc.nodes = next.doc.nodes; doc.segments = next.doc.segments;
    placeAsSized(doc, kind);
    sized = sizeDesign(doc); size = copperBox(sized); folded += next.count;
  }
  if (overflow(size, fp) <= 1e-9 && folded > 0) {
    settlePhases(doc, kind, start);
    sized = sizeDesign(doc); size = copperBox(sized);
  }
  if (overflow(size, fp) > 1e-9) {
    const reached = size;
    doc.nodes = start.nodes; doc.segments = start.segments;
    return { fits: false, folded: 0, size: reached };
  }
  return { fits: true, folded, size };
}

/** Tabs anchored at the start or the end of the line, near (bend room) or far (3h from the node's other pieces). */
/**
 * Each folded line's transmission phase at f0 on its own (a lossless sweep of the line between two ports, with the
 * bend models and the coupling of its U's legs that the sweep uses, core/layout/folds.ts) is brought back to the
 * unfolded line's by its last part: the bends and the legs' coupling add phase that sizing does not see. Two passes
 * (the coupling moves a little with the lengths).
 */
function settlePhases(doc: DesignDoc, kind: string, original: DesignDoc): void {
  for (let pass = 0; pass < 2; pass++) {
    let moved = false;
    const sized = sizeDesign(doc);
    for (const chain of foldedChains(doc)) {
      // The same run unfolded: the original lines its pieces came from.
      const bases = new Set(chain.map((x) => x.id.split(FOLD_MARK)[0]!));
      const orig = original.segments.filter((x) => bases.has(x.id));
      const last = [...chain].reverse().find((x) => x.id.includes(`${FOLD_MARK}-part`))!;
      const piece = sized.pieces.find((x) => x.id === last.id);
      if (last.kind !== 'line' || last.length.by === 'drawn' || !piece || !(piece.nominalLength > 0)) continue;
      const d = phaseAlone(original, orig) - phaseAlone(doc, chain), lag = ((((d + 180) % 360) + 360) % 360) - 180;
      // lag > 0: the folded run is electrically longer by that many degrees.
      if (!Number.isFinite(lag) || Math.abs(lag) < 1e-3 || !(piece.effectiveDeg > lag)) continue;
      if (last.length.by === 'degrees') last.length = { by: 'degrees', deg: round9(last.length.deg - lag) };
      else last.length = { by: 'length', length: round9(last.length.length - (lag * piece.nominalLength) / piece.effectiveDeg) };
      moved = true;
    }
    if (!moved) return;
    placeAsSized(doc, kind);
  }
}

/**
 * Runs of lines through plain corners (vertices of two lines) that hold a folded line, in order: a fold's legs may
 * couple with the next line of the run (a port line drawn as an L), so the run is what keeps its phase.
 */
function foldedChains(doc: DesignDoc): DesignSegment[][] {
  const touching = new Map<string, DesignSegment[]>();
  for (const s of doc.segments) for (const e of endsOf(s)) pushTo(touching, e, s);
  const kindOf = new Map(doc.nodes.map((n) => [n.id, n.kind]));
  const through = (node: string) => kindOf.get(node) === 'vertex' && (touching.get(node) ?? []).length === 2 && touching.get(node)!.every((x) => x.kind === 'line');
  const seen = new Set<string>();
  const out: DesignSegment[][] = [];
  for (const s of doc.segments) {
    if (!s.id.includes(FOLD_MARK) || seen.has(s.id)) continue;
    const run: DesignSegment[] = [s];
    seen.add(s.id);
    for (const [end, front] of [[s.b, true], [s.a, false]] as const) {
      let node: string = end, cur: DesignSegment = s;
      while (through(node)) {
        const next = touching.get(node)!.find((x) => x.id !== cur.id)!;
        if (seen.has(next.id)) break;
        seen.add(next.id);
        if (front) run.push(next); else run.unshift(next);
        node = next.a === node ? next.b : next.a; cur = next;
      }
    }
    out.push(run);
  }
  return out;
}

/** Phase of S21 at f0 (degrees) of a chain of line pieces of `doc` alone, its two ends made ports. */
function phaseAlone(doc: DesignDoc, chain: DesignSegment[]): number {
  const count = new Map<string, number>();
  for (const s of chain) for (const e of endsOf(s)) count.set(e, (count.get(e) ?? 0) + 1);
  const ends = [...count].filter(([, c]) => c === 1).map(([id]) => id);
  if (ends.length !== 2) return NaN;
  const zRef = doc.nodes.find((n) => n.kind === 'port')?.kind === 'port' ? (doc.nodes.find((n) => n.kind === 'port') as { zRef: number }).zRef : 50;
  const nodes: DesignNode[] = doc.nodes.filter((n) => count.has(n.id)).map((n) => (ends.includes(n.id) ? { id: n.id, kind: 'port', zRef, heading: 0, at: n.at } : n));
  const alone: DesignDoc = { ...doc, nodes, segments: chain, phaseGroups: [], targets: [], blocks: [] };
  const sized = sizeDesign(alone);
  if (sized.problems.length) return NaN;
  const r = solveNetwork(netlistFromSized(sized, { lossless: true }), new Float64Array([doc.frequency.f0]));
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === ends[1]), j = r.ports.findIndex((p) => p.name === ends[0]);
  const t = 2 * (i * P + j);
  const deg = (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI;
  return deg;
}

type Shape = 'tab-sn' | 'tab-sf' | 'tab-en' | 'tab-ef' | 'ell' | 'hook';
/** A fixed side; away from or toward the block's middle; or away from the other pieces at the line's ends ('clear'). */
type Side = 1 | -1 | 'out' | 'in' | 'clear';

/** A line that may fold: oriented from `a` (its end toward the rest of the block) to `b`. */
interface Foldable {
  seg: DesignSegment; a: string; b: string; A: Vec2; B: Vec2; w: number; leaf: boolean; key: string;
  /** Straight run kept from each end before a bend: near (room for the bend) and far (3h clear of the node's other pieces), m. */
  cA: number; cB: number; fA: number; fB: number;
}

/**
 * How many folded copies one step sizes and checks at most. Every kind of line, shape and side is tried on the drawing
 * (cheap: the nodes move), ranked by the copper the moved nodes would give, and only the most promising are sized and
 * checked for crowding: the search is bounded, so a footprint that cannot be reached is refused after at most
 * `MAX_STEPS` × `SIZED_PER_STEP` sizings, not after every combination.
 */
export const SIZED_PER_STEP = 8;
/** Steps (one kind of line folded per step) before the search stops. */
export const MAX_STEPS = 24;

/** Extent of the copper of a sized design (pieces and node patches before their union), m. */
function copperExtent(sized: SizedDesign): { x0: number; y0: number; x1: number; y1: number } {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const o of pieceOutlines(sized).outlines) for (const r of o.regions) for (const p of r.outer) {
    x0 = Math.min(x0, p.x); x1 = Math.max(x1, p.x); y0 = Math.min(y0, p.y); y1 = Math.max(y1, p.y);
  }
  return Number.isFinite(x0) ? { x0, y0, x1, y1 } : { x0: 0, y0: 0, x1: 0, y1: 0 };
}

function nodeExtent(nodes: DesignNode[]): { x0: number; y0: number; x1: number; y1: number } {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const n of nodes) { x0 = Math.min(x0, n.at.x); x1 = Math.max(x1, n.at.x); y0 = Math.min(y0, n.at.y); y1 = Math.max(y1, n.at.y); }
  return { x0, y0, x1, y1 };
}

/**
 * Tries every kind of line, shape and side on the drawing; sizes the most promising few (those whose centrelines
 * crowd nothing new, by the overflow their moved nodes give) and returns the one that overflows least and crowds
 * nothing, or null.
 */
function bestFold(doc: DesignDoc, sized: SizedDesign, size: Box, fp: Box): { doc: DesignDoc; count: number } | null {
  const groups = new Map<string, Foldable[]>();
  for (const f of foldables(doc, sized)) groups.set(f.key, [...(groups.get(f.key) ?? []), f]);
  const centre = centroid(doc.nodes.map((n) => n.at));
  const now = overflow(size, fp);
  // The copper reaches beyond the outermost nodes by pads, widths and junction patches: kept as margins for the estimate.
  const c = copperExtent(sized), n0 = nodeExtent(doc.nodes);
  const margin = { x0: n0.x0 - c.x0, y0: n0.y0 - c.y0, x1: c.x1 - n0.x1, y1: c.y1 - n0.y1 };
  const guess = (d: DesignDoc) => { const e = nodeExtent(d.nodes); return overflow({ w: e.x1 + margin.x1 - (e.x0 - margin.x0), h: e.y1 + margin.y1 - (e.y0 - margin.y0) }, fp); };
  // Crowding as drawn (centrelines between nodes), to put first the folds that will likely pass the real check.
  const widths = new Map(sized.pieces.map((p) => [p.id, Number.isFinite(p.width) ? Math.max(p.width, p.widthB ?? 0) : 0]));
  const limit = DEFAULT_PROXIMITY_LIMIT_H * doc.substrate.h;
  const minGap = Math.max(2 * cutWidth(doc.process), 0.5e-3);
  const drawnBefore = drawnCrowding(doc, widths, limit, minGap);
  const trials: { doc: DesignDoc; guess: number; clear: boolean; count: number }[] = [];
  const seen = new Set<string>();
  for (const members of groups.values()) {
    const d = unit(sub(members[0]!.B, members[0]!.A));
    // What is missing along the line's own direction: a fold shortens the extent along it.
    const want = Math.abs(d.x) * Math.max(0, size.w - fp.w) + Math.abs(d.y) * Math.max(0, size.h - fp.h);
    if (want < 1e-6) continue;
    const shapes: Shape[] = members[0]!.leaf ? ['ell', 'hook', 'tab-sn', 'tab-sf'] : ['tab-sn', 'tab-sf', 'tab-en', 'tab-ef'];
    const sides: Side[] = members.length > 1 ? [1, -1, 'out', 'in', 'clear'] : [1, -1];
    // Each fold takes what is missing (with a little to spare), or all the line allows: the compensated bends move the
    // copper a little, so the first can fall just short.
    for (const shape of shapes) for (const side of sides) for (const take of [want, Infinity]) {
      const trial = shallow(doc);
      let ok = true;
      for (const m of members) ok &&= foldLine(trial, m, shape, sideOf(doc, m, side, centre), take, doc.substrate.h);
      if (!ok) continue;
      // The same drawing reached another way (a side that resolves to the same, all the line allows) is tried once.
      const key = trial.nodes.map((x) => `${x.id}:${x.at.x.toFixed(7)},${x.at.y.toFixed(7)}`).join(';');
      if (seen.has(key)) continue;
      seen.add(key);
      trials.push({ doc: trial, guess: guess(trial), clear: !crowdsMore(drawnBefore, drawnCrowding(trial, widths, limit, minGap)), count: members.length });
    }
  }
  // Likely clear first, then by the overflow the moved nodes give.
  trials.sort((x, y) => Number(y.clear) - Number(x.clear) || x.guess - y.guess);
  let before: Map<string, number> | null = null;
  let best: { doc: DesignDoc; over: number; count: number } | null = null;
  for (const t of trials.slice(0, SIZED_PER_STEP)) {
    const s = sizeDesign(t.doc);
    if (s.problems.length) continue;
    const over = overflow(copperBox(s), fp);
    if (!(over < now - 0.05e-3) || (best && over >= best.over)) continue;
    before ??= crowding(doc, sized);
    if (crowdsMore(before, crowding(t.doc, s))) continue;
    best = { doc: t.doc, over, count: t.count };
    if (over <= 1e-9) break; // it fits: nothing does better
  }
  return best ? { doc: best.doc, count: best.count } : null;
}

/** The lines that may fold: bridges given by degrees or length, not yet folded, with their end clearances. */
function foldables(doc: DesignDoc, sized: SizedDesign): Foldable[] {
  const at = new Map(doc.nodes.map((n) => [n.id, n]));
  const widths = new Map(sized.pieces.map((p) => [p.id, Math.max(p.width, p.widthB ?? 0)]));
  const touching = new Map<string, DesignSegment[]>();
  for (const s of doc.segments) for (const end of ends(s)) pushTo(touching, end, s);
  const widest = (node: string) => Math.max(0, ...(touching.get(node) ?? []).map((s) => widths.get(s.id) ?? 0));
  const hops = hopsFromAnchor(doc, touching);
  const out: Foldable[] = [];
  for (const s of doc.segments) {
    if (s.kind !== 'line' || s.length.by === 'drawn' || s.id.includes(FOLD_MARK) || !isBridge(doc, s, touching)) continue;
    const w = widths.get(s.id);
    if (!(w !== undefined && w > 0 && Number.isFinite(w))) continue;
    const leafEnd = [s.a, s.b].find((id) => (touching.get(id) ?? []).length === 1 && (at.get(id)?.kind === 'open' || at.get(id)?.kind === 'short'));
    const a = leafEnd ? (leafEnd === s.a ? s.b : s.a) : (hops.get(s.a) ?? 0) <= (hops.get(s.b) ?? 0) ? s.a : s.b;
    const b = a === s.a ? s.b : s.a;
    const A = at.get(a)!.at, B = at.get(b)!.at;
    if (!(Math.hypot(B.x - A.x, B.y - A.y) > 0)) continue;
    const d = unit(sub(B, A));
    // Steps, pads and junctions keep their own straight copper: half the node's widest piece, the line's width and
    // 0.5 mm before a bend (our choice: the bend's compensation needs about a width); or, far, the proximity limit.
    const near = (node: string) => widest(node) / 2 + w + 0.5e-3;
    const far = (node: string) => (widest(node) + w) / 2 + DEFAULT_PROXIMITY_LIMIT_H * doc.substrate.h * 1.1;
    const cA = near(a), cB = near(b), fA = Math.max(cA, far(a)), fB = Math.max(cB, far(b));
    const key = JSON.stringify([s.width, s.length, Math.round(Math.abs(d.x) * 1e4), Math.round(Math.abs(d.y) * 1e4), !!leafEnd]);
    out.push({ seg: s, a, b, A, B, w, cA, cB, fA, fB, leaf: !!leafEnd, key });
  }
  return out;
}

/**
 * Replaces line `f` in `doc` by its folded parts, moving everything beyond its far end with it. `want` is how much
 * shorter the block should be along the line; the fold takes what it can of it. False when the line is too short.
 */
function foldLine(doc: DesignDoc, g: Foldable, shape: Shape, side: 1 | -1, want: number, h: number): boolean {
  // Where its ends are now (an earlier twin in series may have moved this one).
  const pos = new Map(doc.nodes.map((nd) => [nd.id, nd.at]));
  const f = { ...g, A: pos.get(g.a)!, B: pos.get(g.b)! };
  const L = Math.hypot(f.B.x - f.A.x, f.B.y - f.A.y);
  const d = unit(sub(f.B, f.A)), n = { x: -d.y * side, y: d.x * side };
  // Row pitch of a U: its two legs keep the proximity limit (3h) apart edge to edge, with 10 % to spare for the
  // bends' compensation, which shortens the join a little.
  const pitch = f.w + DEFAULT_PROXIMITY_LIMIT_H * h * 1.1;
  const minRun = f.w + 1e-3;
  let moves: Vec2[]; // the centreline from A as steps
  if (shape === 'ell' || shape === 'hook') {
    const rest = Math.max(minRun, 0); // the last part, beyond the last bend, at least this long
    if (shape === 'ell') {
      const a = Math.min(L - rest, Math.max(f.cA, L - want - f.w - 0.5e-3));
      if (!(a >= f.cA - 1e-12)) return false;
      moves = [mul(d, a), mul(n, L - a)];
    } else {
      // Forward a, across a pitch, back r = L − a − pitch; the back leg stops short of the first one's start.
      const aMin = Math.max(f.cA, (L - pitch + f.cA) / 2);
      const a = Math.max(aMin, L - want - f.w - 0.5e-3);
      const r = L - a - pitch;
      if (!(r >= rest)) return false;
      moves = [mul(d, a), mul(n, pitch), mul(d, -r)];
    }
  } else {
    // Anchored at one end, `near` or far from it; the other end keeps at least its near room.
    const fromStart = shape === 'tab-sn' || shape === 'tab-sf', farEnd = shape === 'tab-sf' || shape === 'tab-ef';
    const anchor = fromStart ? (farEnd ? f.fA : f.cA) : (farEnd ? f.fB : f.cB);
    const other = fromStart ? f.cB : f.cA;
    const sMax = (L - anchor - other - pitch) / 2;
    if (!(sMax >= minRun)) return false;
    const s = Math.min(sMax, Math.max(minRun, want / 2 + 0.3e-3));
    const free = L - pitch - 2 * s; // the straight length left for the two ends together
    const a = fromStart ? anchor : free - anchor;
    moves = [mul(d, a), mul(n, s), mul(d, pitch), mul(n, -s), mul(d, free - a)];
  }
  const pts = [f.A];
  for (const m of moves) pts.push(add(pts[pts.length - 1]!, m));
  const lens = moves.map((m) => Math.hypot(m.x, m.y));
  const total = lens.reduce((x, y) => x + y, 0);
  // Everything beyond the far end moves with it (the line is a bridge, so that side carries nothing else).
  const shift = sub(pts[pts.length - 1]!, f.B);
  const beyond = sideOfBridge(doc, f.seg, f.b);
  doc.nodes = doc.nodes.map((nd) => (beyond.has(nd.id) ? { ...nd, at: add(nd.at, shift) } : nd));
  const seg = f.seg as Extract<DesignSegment, { kind: 'line' }>;
  const parts: DesignSegment[] = [], bends: DesignNode[] = [];
  let prev = f.a;
  lens.forEach((l, k) => {
    const last = k === lens.length - 1;
    const next = last ? f.b : `${seg.id}${FOLD_MARK}${k + 1}`;
    if (!last) bends.push({ id: next, kind: 'vertex', bend: { style: 'miter-optimal' }, at: pts[k + 1]! });
    const frac = l / total;
    const length = seg.length.by === 'degrees' ? { by: 'degrees' as const, deg: round9(seg.length.deg * frac) } : { by: 'length' as const, length: round9((seg.length as { length: number }).length * frac) };
    parts.push({ ...seg, id: k === 0 ? seg.id : `${seg.id}${FOLD_MARK}-part${k + 1}`, a: prev, b: next, length });
    prev = next;
  });
  // The first part keeps the line's id (a block's hooks name it, e.g. the output line its phase match lengthened).
  const i = doc.segments.findIndex((x) => x.id === seg.id);
  doc.segments = [...doc.segments.slice(0, i), ...parts, ...doc.segments.slice(i + 1)];
  doc.nodes = [...doc.nodes, ...bends];
  return true;
}

/** The side a member folds to: fixed, away from (out) or toward (in) the middle of the block, or clear of its neighbours. */
function sideOf(doc: DesignDoc, f: Foldable, side: Side, centre: Vec2): 1 | -1 {
  if (side === 1 || side === -1) return side;
  const d = unit(sub(f.B, f.A)), n = { x: -d.y, y: d.x }, mid = mul(add(f.A, f.B), 0.5);
  if (side === 'clear') {
    // The other pieces at its two ends: fold to the side they do not lean to.
    const at = new Map(doc.nodes.map((nd) => [nd.id, nd.at]));
    let lean = 0;
    for (const s of doc.segments) {
      if (s.id === f.seg.id || s.kind === 'coupled') continue;
      for (const [node, o] of [[s.a, s.b], [s.b, s.a]] as const) {
        if (node !== f.a && node !== f.b) continue;
        const u = unit(sub(at.get(o)!, at.get(node)!));
        lean += n.x * u.x + n.y * u.y;
      }
    }
    return lean > 1e-9 ? -1 : 1;
  }
  const away = n.x * (mid.x - centre.x) + n.y * (mid.y - centre.y) >= 0 ? 1 : -1;
  return side === 'out' ? away : (-away as 1 | -1);
}

/**
 * Pairs of lines crowding each other as drawn, by the rules of `crowding` on centrelines straight from node to node
 * (a folded part counts with the width of the line it came from): runs parallel within 10° side by side over at
 * least the narrower width, closer than `limit` edge to edge ('run'), or any two closer than `minGap` ('gap'). A cheap
 * stand-in for `crowding`, used only to order the folds tried; the sized check decides.
 */
function drawnCrowding(doc: DesignDoc, widths: Map<string, number>, limit: number, minGap: number): Map<string, number> {
  const at = new Map(doc.nodes.map((n) => [n.id, n.at]));
  const sticks: { id: string; a: string; b: string; p: Vec2; q: Vec2; w: number; x0: number; y0: number; x1: number; y1: number }[] = [];
  for (const s of doc.segments) {
    if (s.kind === 'coupled') continue;
    const p = at.get(s.a), q = at.get(s.b);
    if (!p || !q) continue;
    const w = widths.get(s.id) ?? widths.get(s.id.split(FOLD_MARK)[0]!) ?? 0;
    sticks.push({ id: s.id, a: s.a, b: s.b, p, q, w, x0: Math.min(p.x, q.x) - w / 2, y0: Math.min(p.y, q.y) - w / 2, x1: Math.max(p.x, q.x) + w / 2, y1: Math.max(p.y, q.y) + w / 2 });
  }
  const reach = Math.max(limit, minGap);
  const out = new Map<string, number>();
  for (let i = 0; i < sticks.length; i++) for (let j = i + 1; j < sticks.length; j++) {
    const u = sticks[i]!, v = sticks[j]!;
    if (u.x0 > v.x1 + reach || v.x0 > u.x1 + reach || u.y0 > v.y1 + reach || v.y0 > u.y1 + reach) continue;
    if (u.a === v.a || u.a === v.b || u.b === v.a || u.b === v.b) continue;
    const side = besideDrawn(u.p, u.q, v.p, v.q);
    const run = side && side.overlap >= Math.min(u.w, v.w) ? side.distance - (u.w + v.w) / 2 : Infinity;
    if (run > 0 && run < limit) out.set(`run:${pairKey(u.id, v.id)}`, run);
    const gap = segGap(u.p, u.q, v.p, v.q) - (u.w + v.w) / 2;
    if (gap < minGap) out.set(`gap:${pairKey(u.id, v.id)}`, Math.max(0, gap));
  }
  return out;
}

/** Centreline distance and overlap of two segments parallel within 10°, or null. */
function besideDrawn(p0: Vec2, p1: Vec2, q0: Vec2, q1: Vec2): { distance: number; overlap: number } | null {
  const L = Math.hypot(p1.x - p0.x, p1.y - p0.y), M = Math.hypot(q1.x - q0.x, q1.y - q0.y);
  if (!(L > 0) || !(M > 0)) return null;
  const ux = (p1.x - p0.x) / L, uy = (p1.y - p0.y) / L;
  if (Math.abs((ux * (q1.x - q0.x) + uy * (q1.y - q0.y)) / M) < Math.cos((10 * Math.PI) / 180)) return null;
  const t0 = (q0.x - p0.x) * ux + (q0.y - p0.y) * uy, t1 = (q1.x - p0.x) * ux + (q1.y - p0.y) * uy;
  const overlap = Math.min(L, Math.max(t0, t1)) - Math.max(0, Math.min(t0, t1));
  if (!(overlap > 0)) return null;
  const mx = (q0.x + q1.x) / 2 - p0.x, my = (q0.y + q1.y) / 2 - p0.y;
  return { distance: Math.abs(mx * -uy + my * ux), overlap };
}

/**
 * Pairs of pieces or node patches crowding each other, by ids, with their gap: runs side by side within 3h ('run'),
 * copper within the gap ('gap').
 */
function crowding(doc: DesignDoc, sized: SizedDesign): Map<string, number> {
  const out = new Map<string, number>();
  for (const hit of proximityHits(sized, DEFAULT_PROXIMITY_LIMIT_H * doc.substrate.h)) out.set(`run:${pairKey(hit.a, hit.b)}`, hit.gap);
  const minGap = Math.max(2 * cutWidth(doc.process), 0.5e-3);
  const ends = new Map(doc.segments.map((s) => [s.id, new Set(endsOf(s))]));
  const joined = (x: string, y: string): boolean => {
    const ex = ends.get(x), ey = ends.get(y);
    if (ex && ey) return [...ex].some((e) => ey.has(e));
    if (ex) return ex.has(y);
    if (ey) return ey.has(x);
    return doc.segments.some((s) => { const e = endsOf(s); return e.includes(x) && e.includes(y); });
  };
  const shapes = pieceOutlines(sized).outlines.map((o) => ({ id: o.id, rings: o.regions.map((r) => r.outer), box: boxOf(o.regions.flatMap((r) => r.outer)) }));
  for (let i = 0; i < shapes.length; i++) for (let j = i + 1; j < shapes.length; j++) {
    const p = shapes[i]!, q = shapes[j]!;
    if (p.box.x0 > q.box.x1 + minGap || q.box.x0 > p.box.x1 + minGap || p.box.y0 > q.box.y1 + minGap || q.box.y0 > p.box.y1 + minGap) continue;
    if (joined(p.id, q.id)) continue;
    const g = ringsGap(p.rings, q.rings);
    if (g < minGap) out.set(`gap:${pairKey(p.id, q.id)}`, g);
  }
  return out;
}

/** A pair crowding that did not before, or closer than it was (a pair already close may stay as close, no closer). */
const crowdsMore = (before: Map<string, number>, after: Map<string, number>) => [...after].some(([k, g]) => !(g >= (before.get(k) ?? Infinity) - 1e-6));
const pairKey = (a: string, b: string) => (a < b ? `${a}|${b}` : `${b}|${a}`);

/** Smallest distance between two sets of rings (0 when they touch or one holds the other), m. */
function ringsGap(P: Vec2[][], Q: Vec2[][]): number {
  let best = Infinity;
  for (const p of P) for (const q of Q) {
    if (inside(p[0]!, q) || inside(q[0]!, p)) return 0;
    for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) {
      best = Math.min(best, segGap(p[i]!, p[(i + 1) % p.length]!, q[j]!, q[(j + 1) % q.length]!));
      if (best === 0) return 0;
    }
  }
  return best;
}

function inside(pt: Vec2, ring: Vec2[]): boolean {
  let c = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const a = ring[i]!, b = ring[j]!;
    if ((a.y > pt.y) !== (b.y > pt.y) && pt.x < ((b.x - a.x) * (pt.y - a.y)) / (b.y - a.y) + a.x) c = !c;
  }
  return c;
}

/** Distance between segments pq and rs (0 when they cross). */
function segGap(p: Vec2, q: Vec2, r: Vec2, s: Vec2): number {
  const cross = (o: Vec2, a: Vec2, b: Vec2) => (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
  const d1 = cross(r, s, p), d2 = cross(r, s, q), d3 = cross(p, q, r), d4 = cross(p, q, s);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return 0;
  return Math.min(ptSeg(p, r, s), ptSeg(q, r, s), ptSeg(r, p, q), ptSeg(s, p, q));
}

function ptSeg(p: Vec2, a: Vec2, b: Vec2): number {
  const dx = b.x - a.x, dy = b.y - a.y, l2 = dx * dx + dy * dy;
  const t = l2 > 0 ? Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / l2)) : 0;
  return Math.hypot(p.x - a.x - t * dx, p.y - a.y - t * dy);
}

function boxOf(pts: Vec2[]): { x0: number; y0: number; x1: number; y1: number } {
  const xs = pts.map((p) => p.x), ys = pts.map((p) => p.y);
  return { x0: Math.min(...xs), y0: Math.min(...ys), x1: Math.max(...xs), y1: Math.max(...ys) };
}

function endsOf(s: DesignSegment): string[] { return s.kind === 'coupled' ? [s.a, s.b, s.c, s.d] : [s.a, s.b]; }
const ends = endsOf;

/** Whether removing `s` splits the network (so the far side can move with it). */
function isBridge(doc: DesignDoc, s: DesignSegment, touching: Map<string, DesignSegment[]>): boolean {
  if (s.kind === 'coupled') return false;
  return !reach(s.a, s, touching).has(s.b);
}

/** The nodes on `from`'s side of `cut` (reached from `from` without it). */
function sideOfBridge(doc: DesignDoc, cut: DesignSegment, from: string): Set<string> {
  const touching = new Map<string, DesignSegment[]>();
  for (const s of doc.segments) for (const e of endsOf(s)) pushTo(touching, e, s);
  return reach(from, cut, touching);
}

/** Adds `s` to the list kept under `key` (in place: rebuilding the list per entry made folding quadratic). */
function pushTo(m: Map<string, DesignSegment[]>, key: string, s: DesignSegment): void {
  const l = m.get(key);
  if (l) l.push(s); else m.set(key, [s]);
}

function reach(from: string, cut: DesignSegment, touching: Map<string, DesignSegment[]>): Set<string> {
  const seen = new Set([from]), todo = [from];
  while (todo.length) {
    const n = todo.pop()!;
    for (const s of touching.get(n) ?? []) {
      if (s.id === cut.id) continue;
      for (const e of endsOf(s)) if (!seen.has(e)) { seen.add(e); todo.push(e); }
    }
  }
  return seen;
}

/** Hops from the first port (the anchor sizing places from), to orient each line from the anchor's side. */
function hopsFromAnchor(doc: DesignDoc, touching: Map<string, DesignSegment[]>): Map<string, number> {
  const first = doc.nodes.find((n) => n.kind === 'port') ?? doc.nodes[0];
  const hops = new Map<string, number>();
  if (!first) return hops;
  hops.set(first.id, 0);
  const queue = [first.id];
  while (queue.length) {
    const n = queue.shift()!;
    for (const s of touching.get(n) ?? []) for (const e of endsOf(s)) if (!hops.has(e)) { hops.set(e, hops.get(n)! + 1); queue.push(e); }
  }
  return hops;
}

/** A copy whose lists can be replaced without touching `doc` (foldLine replaces records, it never edits them). */
function shallow(doc: DesignDoc): DesignDoc {
  return { ...doc, nodes: [...doc.nodes], segments: [...doc.segments] };
}

function snapshot(doc: DesignDoc): DesignDoc {
  return { ...doc, nodes: JSON.parse(JSON.stringify(doc.nodes)) as DesignNode[], segments: JSON.parse(JSON.stringify(doc.segments)) as DesignSegment[] };
}
function centroid(ps: Vec2[]): Vec2 { return ps.length ? mul(ps.reduce(add, { x: 0, y: 0 }), 1 / ps.length) : { x: 0, y: 0 }; }
function add(a: Vec2, b: Vec2): Vec2 { return { x: a.x + b.x, y: a.y + b.y }; }
function sub(a: Vec2, b: Vec2): Vec2 { return { x: a.x - b.x, y: a.y - b.y }; }
function mul(a: Vec2, k: number): Vec2 { return { x: a.x * k, y: a.y * k }; }
function unit(v: Vec2): Vec2 { const l = Math.hypot(v.x, v.y) || 1; return { x: v.x / l, y: v.y / l }; }
function round9(x: number): number { return Math.round(x * 1e9) / 1e9; }
