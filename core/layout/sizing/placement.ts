/**
 * Sizing step 6, placement: nodes placed from the anchor port (or the first node) along each piece's drawn direction
 * by its span, breadth first, fixed-length pieces before drawn ones so that a loop closes through a drawn piece
 * when it has one (that piece takes the distance its ends are placed apart). A loop of fixed pieces that misses by
 * more than CLOSE_TOL is a 'loop-mismatch' problem naming the loop. The strips of a coupled pair place each other
 * at the pair's pitch across (coupledPair.ts pairLinks). Parts of the network the anchor does not reach are placed
 * from their own drawn positions (noted).
 */
import type { DesignDoc, DesignNode } from '../../design/types.ts';
import type { Vec2 } from '../../geometry/types.ts';
import { warn } from '../../util/warnings.ts';
import { add, dot, len, mul, sub, unit } from '../copper.ts';
import { pairLinks } from '../coupledPair.ts';
import type { SizedNode } from '../types.ts';
import { deg, dirFrom, mm, type SizingContext, type Work } from './context.ts';
import { pieceBeta } from './spans.ts';
import type { Adjacency } from './topology.ts';

/** Loop closure tolerance, m. */
export const CLOSE_TOL = 1e-6;

type Links = ReturnType<typeof pairLinks>;

/** Per strip end, the copper its applied end corrections removed (open ends, vias). */
export function cutAt(byId: Map<string, Work>, pieceId: string, node: string): number {
  const w = byId.get(pieceId);
  if (!w) return 0;
  let c = 0;
  for (const x of w.piece.compensations) if (x.applied && x.node === node && (x.model === 'open-end' || x.model === 'via')) c += x.amount_m;
  return c;
}

/** Places every reachable node; returns the anchor node's id (null for an empty design). */
export function placeDesign(ctx: SizingContext, works: Work[], byId: Map<string, Work>, adj: Adjacency, nodeOut: Map<string, SizedNode>): string | null {
  // The pair keeps its strips' cut ends apart along the run (coupledPair.ts).
  for (const w of works) if (w.piece.pair) w.piece.pair.cuts = { near: cutAt(byId, w.seg.id, w.seg.a), far: cutAt(byId, w.seg.id, w.seg.b) };
  const links = pairLinks(ctx.doc.segments, (id) => ctx.nodeById.get(id)?.at, (id) => { const d = ctx.pairs.get(id); return d ? d.width + d.gap : undefined; }, (p, n) => cutAt(byId, p, n));
  const doc: DesignDoc = ctx.doc;
  const anchorNode = doc.nodes.find((n) => n.kind === 'port') ?? doc.nodes[0];
  if (!anchorNode) return null;
  const st: PlaceState = { ctx, byId, adj, nodeOut, links, parentSeg: new Map() };
  placeFrom(st, anchorNode);
  for (const n of doc.nodes) {
    if (st.parentSeg.has(n.id) || (adj.get(n.id) ?? []).length === 0) continue;
    ctx.warnings.push(warn('note', `node ${n.id} is not connected to the anchor port ${anchorNode.id}; its part of the network is placed from its drawn position`, { subjects: [n.id], severity: 'info' }));
    placeFrom(st, n);
  }
  return anchorNode.id;
}

interface PlaceState {
  ctx: SizingContext;
  byId: Map<string, Work>;
  adj: Adjacency;
  nodeOut: Map<string, SizedNode>;
  links: Links;
  /** The piece each placed node was reached by (null for a start). */
  parentSeg: Map<string, string | null>;
}

const isDrawn = (w: Work) => (w.seg.kind === 'line' || w.seg.kind === 'taper') && w.seg.length.by === 'drawn';

/** Breadth-first placement from one start node. */
function placeFrom(st: PlaceState, start: DesignNode): void {
  st.nodeOut.get(start.id)!.pos = { ...start.at };
  st.parentSeg.set(start.id, null);
  const fixedQ: [string, string][] = [], drawnQ: [string, string][] = [];
  let fi = 0, di = 0;
  const enqueue = (n: string) => {
    for (const sid of st.adj.get(n) ?? []) {
      const w = st.byId.get(sid);
      if (w && w.ok) (isDrawn(w) ? drawnQ : fixedQ).push([n, sid]);
    }
  };
  const reported = new Set<string>();
  const reach = (n: string) => { enqueue(n); placeBeside(st, n, reported, reach); };
  reach(start.id);
  const done = new Set<string>();
  while (fi < fixedQ.length || di < drawnQ.length) {
    const [n, sid] = (fi < fixedQ.length ? fixedQ[fi++] : drawnQ[di++])!;
    if (done.has(sid)) continue;
    done.add(sid);
    placeAlong(st, n, sid, reach);
  }
}

/** A placed end of a coupled strip places the end beside it on the other strip (the pair's pitch across). */
function placeBeside(st: PlaceState, n: string, reported: Set<string>, reach: (n: string) => void): void {
  for (const l of st.links.get(n) ?? []) {
    const target = add(st.nodeOut.get(n)!.pos, l.offset);
    const on = st.nodeOut.get(l.to)!;
    if (!st.parentSeg.has(l.to)) { on.pos = target; st.parentSeg.set(l.to, null); reach(l.to); continue; }
    const miss = len(sub(on.pos, target));
    if (miss > CLOSE_TOL && !reported.has(l.seg)) {
      reported.add(l.seg);
      st.ctx.problem('loop-mismatch', `the strips of pair ${l.seg} do not stay side by side: node ${l.to} is placed ${mm(miss)} mm from where the pair puts it beside ${n}; give both strips the same end corrections (e.g. open ends at opposite ends) or change the pieces around it`, [l.seg]);
    }
  }
}

/** Places the far end of piece sid from node n, or closes a loop there. */
function placeAlong(st: PlaceState, n: string, sid: string, reach: (n: string) => void): void {
  const w = st.byId.get(sid)!;
  const o = w.seg.a === n ? w.seg.b : w.seg.a;
  const d = dirFrom(st.ctx, n, w.seg);
  if (!d) return;
  const from = st.nodeOut.get(n)!.pos;
  const target = add(from, mul(d, w.piece.span));
  const on = st.nodeOut.get(o)!;
  if (!st.parentSeg.has(o)) { on.pos = target; st.parentSeg.set(o, sid); reach(o); return; }
  const miss = len(sub(on.pos, target));
  if (miss <= CLOSE_TOL) return;
  if (isDrawn(w)) { redrawToClose(st, w, from, on.pos, d); return; }
  const loop = loopThrough(n, o, st.parentSeg, st.byId);
  st.ctx.problem('loop-mismatch', `the loop ${[...loop, sid].join(' → ')} does not close: ${sid} needs its far end ${mm(miss)} mm from where the rest of the loop puts node ${o}; adjust the lengths or make one piece of the loop 'drawn'`, [...loop, sid]);
}

/** A drawn piece closing a loop takes the distance its ends are placed apart. */
function redrawToClose(st: PlaceState, w: Work, from: Vec2, to: Vec2, d: Vec2): void {
  const sid = w.seg.id;
  const actual = len(sub(to, from));
  const delta = actual - w.piece.span;
  w.piece.span += delta; w.piece.nominalLength += delta; w.piece.length += delta;
  const beta = pieceBeta(w.piece);
  w.piece.deg = (w.piece.length * beta * 180) / Math.PI;
  w.piece.effectiveDeg = (w.piece.nominalLength * beta * 180) / Math.PI;
  const dirActual = unit(sub(to, from));
  if (dot(dirActual, d) < Math.cos(Math.PI / 180)) {
    w.piece.warnings.push(warn('note', `${sid} closes a loop and was redrawn from its placed ends; its direction differs from the drawing by ${deg(Math.acos(Math.min(1, dot(dirActual, d))))}°`, { subjects: [sid], severity: 'info' }));
  }
  if (!(w.piece.length > 0)) st.ctx.problem('too-short', `piece ${sid} closes a loop but its ends are placed ${mm(actual)} mm apart, less than its end corrections`, [sid]);
}

/** Segments on the tree paths from a and b to their common ancestor. */
export function loopThrough(a: string, b: string, parentSeg: Map<string, string | null>, byId: Map<string, Work>): string[] {
  const up = (n: string): { nodes: string[]; segs: string[] } => {
    const nodes = [n], segs: string[] = [];
    let cur = n;
    for (let guard = 0; guard < 1e6; guard++) {
      const s = parentSeg.get(cur);
      if (!s) break;
      segs.push(s);
      const w = byId.get(s)!;
      cur = w.seg.a === cur ? w.seg.b : w.seg.a;
      nodes.push(cur);
    }
    return { nodes, segs };
  };
  const pa = up(a), pb = up(b);
  const inB = new Map(pb.nodes.map((n, i) => [n, i]));
  let ia = pa.nodes.findIndex((n) => inB.has(n));
  if (ia < 0) ia = pa.nodes.length - 1;
  const ib = inB.get(pa.nodes[ia]!) ?? pb.segs.length;
  return [...pa.segs.slice(0, ia), ...pb.segs.slice(0, ib).reverse()];
}
