/**
 * Copper geometry of a sized design: per-piece outlines (rectangles, taper outlines, pads), per-node patches
 * (square, mitered and arc bends, junction squares, via pads, launch pads), drills, then the union into clean simple
 * polygons with holes, ground copper with its clearance cut out, and the clearance (copper to remove).
 *
 * Conventions:
 * - A line's rectangle runs between its placed nodes; at an arc bend it stops at the tangent point, at a mitered
 *   bend it is clipped by the miter cut (so the union shows the exact Douville–James cut: R. J. P. Douville and D. S. James, IEEE Trans. MTT 26(3), 1978).
 * - Node copper is listed in BoardGeometry.pieces under the node's id (bends, junctions, vias, launch pads), so a
 *   face can hit-test it like a piece.
 * - Ground copper keeps `clearance` from the network (default max(h, 2·Wmax): common practice)
 *   and gives way to keep-outs.
 * - Without a board outline, the clearance layer covers the copper extent plus BOARD_MARGIN.
 */
import type { BoardGeometry, Box, DrillHit, Region, Ring, Vec2 } from '../geometry/types.ts';
import { differenceRegions, offsetRegions, unionRegions, rectRing, isCounterClockwise, ringArea } from '../geometry/polygons.ts';
import type { SizedDesign, SizedNode, SizedPiece } from './types.ts';
import { InputError } from '../util/errors.ts';
import { BOARD_SIZE_LIMIT } from './sizing.ts';
import {
  add, sub, mul, unit, left, dot, len, rectAlong, taperOutline, circle, arcBand, clipHalfPlane, convexHull,
  squareCornerPatch, miterCutLine, cornerGeometry, ccw,
} from './copper.ts';

/** Margin around the copper when the design has no board outline, m (our choice for a usable blank). */
export const BOARD_MARGIN = 3e-3;

export interface PieceOutline { id: string; regions: Region[]; centreline: Vec2[] }

/** Node copper smaller than this (m², a 1 µm square) is no copper: a hull folded flat onto a line. */
const MIN_PATCH_AREA = 1e-12;

const R = (outer: Ring): Region => ({ outer: ccw(outer), holes: [] });

/** What one piece's or node's outline is drawn from: the sized design's pieces and nodes by id. */
export interface OutlineSite { nodes: Map<string, SizedNode>; pieces: Map<string, SizedPiece> }

export function outlineSite(sized: Pick<SizedDesign, 'nodes' | 'pieces'>): OutlineSite {
  return { nodes: new Map(sized.nodes.map((n) => [n.id, n])), pieces: new Map(sized.pieces.map((p) => [p.id, p])) };
}

const placed = (n: SizedNode | undefined): n is SizedNode => !!n && Number.isFinite(n.pos.x) && Number.isFinite(n.pos.y);
const isLine = (p: SizedPiece) => p.kind === 'line' || p.kind === 'taper' || p.kind === 'coupled';
const widthAt = (p: SizedPiece, node: string) => (p.kind === 'taper' && p.b === node ? p.widthB! : p.width);
/** Unit direction leaving node n along piece p (placed). */
const dirAlong = (site: OutlineSite, n: SizedNode, p: SizedPiece): Vec2 => {
  const o = site.nodes.get(p.a === n.id ? p.b : p.a)!;
  return unit(sub(o.pos, n.pos));
};

/** Outlines of every piece and node, before union. */
export function pieceOutlines(sized: SizedDesign): { outlines: PieceOutline[]; drills: DrillHit[] } {
  const site = outlineSite(sized);
  const outlines: PieceOutline[] = [];
  const drills: DrillHit[] = [];
  for (const p of sized.pieces) { const o = pieceOutline(site, p); if (o) outlines.push(o); }
  for (const n of sized.nodes) { const o = nodeOutline(site, n, drills); if (o) outlines.push(o); }
  return { outlines, drills };
}

/** One piece's own copper (null when it is not placed or has no width or length). */
export function pieceOutline(site: OutlineSite, p: SizedPiece): PieceOutline | null {
  const { nodes, pieces } = site;
  const dirFrom = (n: SizedNode, q: SizedPiece) => dirAlong(site, n, q);
  const na = nodes.get(p.a), nb = nodes.get(p.b);
  if (!placed(na) || !placed(nb) || !Number.isFinite(p.width) || len(sub(nb.pos, na.pos)) < 1e-12) return null;
  const d = unit(sub(nb.pos, na.pos));
  if (p.kind === 'lumped' || p.kind === 'sparams') {
    const regions: Region[] = [];
    if (p.kind === 'lumped') {
      const fp = p.part!.footprint;
      const across = Math.max(fp.padAcross, p.width);
      for (const c of [na.pos, nb.pos]) regions.push(R(rectAlong(sub(c, mul(d, fp.padAlong / 2)), add(c, mul(d, fp.padAlong / 2)), across)));
    } else {
      for (const c of [na.pos, nb.pos]) regions.push(R(rectAlong(sub(c, mul(d, p.width / 2)), add(c, mul(d, p.width / 2)), p.width)));
    }
    return { id: p.id, regions, centreline: [na.pos, nb.pos] };
  }
  // Ends of the straight copper, trimmed at arc bends.
  let p0 = na.pos, p1 = nb.pos;
  if (na.bend?.arc) p0 = add(na.pos, mul(d, na.bend.arc.tangent));
  if (nb.bend?.arc) p1 = sub(nb.pos, mul(d, nb.bend.arc.tangent));
  let ring: Ring;
  if (p.kind === 'taper' && p.taperWidths && p.taperWidths.length > 1) {
    const n = p.taperWidths.length - 1;
    ring = taperOutline(p0, p1, p.taperWidths.map((_, k) => k / n), p.taperWidths);
  } else {
    ring = rectAlong(p0, p1, p.width);
  }
  // Miter cuts at either end.
  for (const end of [na, nb]) {
    if (!end.bend?.miter) continue;
    const [pa, pb] = end.segments.map((id) => pieces.get(id)!);
    if (!pa || !pb || !isLine(pa) || !isLine(pb)) continue;
    const d1 = mul(dirFrom(end, pa), -1), d2 = dirFrom(end, pb);
    const cut = miterCutLine(end.pos, d1, d2, end.bend.width, end.bend.miter.x);
    ring = clipHalfPlane(ring, cut.p, cut.n);
  }
  return { id: p.id, regions: ring.length >= 3 ? [R(ring)] : [], centreline: [na.pos, nb.pos] };
}

/** One node's own copper (bend, junction, via pads, launch pad), its drills added to `drills`; null for none. */
export function nodeOutline(site: OutlineSite, n: SizedNode, drills: DrillHit[]): PieceOutline | null {
  const { nodes, pieces } = site;
  const dirFrom = (m: SizedNode, q: SizedPiece) => dirAlong(site, m, q);
  if (!placed(n)) return null;
  const segs = n.segments.map((id) => pieces.get(id)).filter((p): p is SizedPiece => !!p && Number.isFinite(p.width) && placed(nodes.get(p.a === n.id ? p.b : p.a)));
  const regions: Region[] = [];
  if (n.bend && segs.length === 2 && segs.every(isLine)) {
    const [pa, pb] = segs as [SizedPiece, SizedPiece];
    const d1 = mul(dirFrom(n, pa), -1), d2 = dirFrom(n, pb);
    const W = n.bend.width;
    if (n.bend.arc) {
      const g = cornerGeometry(n.pos, d1, d2, W);
      const t = n.bend.arc.tangent, Rr = n.bend.arc.radius;
      const T1 = sub(n.pos, mul(d1, t));
      const c = add(T1, mul(left(d1), g.side * Rr));
      const a0 = Math.atan2(T1.y - c.y, T1.x - c.x);
      // The band uses each side's own width where they differ: draw with the wider, the narrower is inside it.
      const Wb = Math.max(widthAt(pa, n.id), widthAt(pb, n.id));
      regions.push(R(arcBand(c, Rr - Wb / 2, Rr + Wb / 2, a0, g.side * g.turn)));
    } else {
      let patch = squareCornerPatch(n.pos, d1, d2, W);
      if (n.bend.miter) {
        const cut = miterCutLine(n.pos, d1, d2, W, n.bend.miter.x);
        patch = clipHalfPlane(patch, cut.p, cut.n);
      }
      if (patch.length >= 3) regions.push(R(patch));
    }
  } else if (n.kind === 'junction' && segs.filter(isLine).length >= 2) {
    // Junction square: aligned with the main line, as long as the widest other arm and as wide as the main line,
    // plus the hull of the line arms' end edges so arms at other angles meet without notches. Parts meeting here
    // (a Wilkinson resistor) bring their own pads.
    const arms = segs.filter(isLine);
    const pts: Vec2[] = [];
    for (const p of arms) {
      const d = dirFrom(n, p), nn = mul(left(d), widthAt(p, n.id) / 2);
      pts.push(add(n.pos, nn), sub(n.pos, nn));
    }
    const first = arms[0]!;
    const opposite = arms.find((p) => p !== first && dot(dirFrom(n, p), dirFrom(n, first)) < -0.99);
    const mainIds = n.tee ? n.tee.main : [first.id, ...(opposite ? [opposite.id] : [])];
    const main = arms.find((p) => p.id === mainIds[0]) ?? first;
    const dm = dirFrom(n, main);
    const wMain = Math.max(...arms.filter((p) => mainIds.includes(p.id)).map((p) => widthAt(p, n.id)));
    const others = arms.filter((p) => !mainIds.includes(p.id));
    // The square only where the main line runs straight through: elsewhere it would poke out opposite an arm.
    if (others.length && mainIds.length === 2 && arms.some((p) => p.id === mainIds[1]) && dot(dirFrom(n, main), dirFrom(n, arms.find((p) => p.id === mainIds[1])!)) < -0.99) {
      const wOther = Math.max(...others.map((p) => widthAt(p, n.id)));
      const nm = left(dm);
      for (const sa of [-1, 1]) for (const sb of [-1, 1]) pts.push(add(n.pos, add(mul(dm, sa * wOther / 2), mul(nm, sb * wMain / 2))));
    }
    // A straight line through a junction whose other arms are parts (a resistor to one side) has no corner to fill:
    // the hull of its arms' end edges is then a flat line, which is no copper at all.
    const hull = convexHull(pts);
    if (hull.length >= 3 && Math.abs(ringArea(hull)) > MIN_PATCH_AREA) regions.push(R(hull));
  } else if (n.kind === 'short' && n.via && segs[0]) {
    const d = dirFrom(n, segs[0]);
    const across = left(d);
    const count = Math.max(1, Math.round(n.via.count));
    const pitch = n.via.pad * 1.25;
    const pts: Vec2[] = [];
    for (let i = 0; i < count; i++) {
      const c = add(n.pos, mul(across, (i - (count - 1) / 2) * pitch));
      drills.push({ at: c, diameter: n.via.drill, plated: true, use: 'via', owner: n.id });
      pts.push(...circle(c, n.via.pad / 2));
    }
    regions.push(R(count === 1 ? circle(n.pos, n.via.pad / 2) : convexHull(pts)));
  } else if (n.kind === 'port' && n.port?.launch && segs[0]) {
    const d = dirFrom(n, segs[0]);
    const L = n.port.launch;
    regions.push(R(rectAlong(n.pos, add(n.pos, mul(d, L.padLength)), L.padWidth)));
    if (L.pinDrill) drills.push({ at: add(n.pos, mul(d, L.padLength / 2)), diameter: L.pinDrill, plated: true, use: 'pin', owner: n.id });
  }
  return regions.length ? { id: n.id, regions, centreline: [n.pos] } : null;
}

function boxOf(rings: Ring[]): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const r of rings) for (const p of r) {
    if (p.x < minX) minX = p.x; if (p.x > maxX) maxX = p.x;
    if (p.y < minY) minY = p.y; if (p.y > maxY) maxY = p.y;
  }
  return { minX, minY, maxX, maxY };
}

/** Default clearance between the network and ground copper, m: max(h, 2·Wmax) (common practice). */
export function defaultGroundClearance(sized: SizedDesign): number {
  const wmax = Math.max(0, ...sized.pieces.map((p) => Math.max(p.width || 0, p.widthB || 0)));
  return Math.max(sized.doc.substrate.h, 2 * wmax);
}

/**
 * The board's copper and its companions. Requires `await initPolygons()` (core/geometry) once beforehand.
 */
export function buildBoardGeometry(sized: SizedDesign): BoardGeometry {
  // A board beyond the size limit is refused before any polygon work (sizing found it; see BOARD_SIZE_LIMIT).
  const big = sized.problems.find((p) => p.code === 'too-large');
  if (big) throw new InputError('impossible-layout', big.subjects[0] ?? 'design', `a board within ${BOARD_SIZE_LIMIT * 1e3} mm a side`, big.message, 'raise the design frequency or shorten the pieces named');
  const { outlines, drills } = pieceOutlines(sized);
  const all: Region[] = [];
  for (const o of outlines) for (const r of o.regions) all.push(r);
  const copper = unionRegions(all);
  const doc = sized.doc;
  const ground: Region[] = [];
  const keepouts: Region[] = [];
  const clearanceDefault = defaultGroundClearance(sized);
  for (const a of doc.areas ?? []) {
    if (!a.polygon || a.polygon.length < 3) continue;
    const reg: Region = { outer: isCounterClockwise(a.polygon) ? a.polygon : a.polygon.slice().reverse(), holes: [] };
    if (a.kind === 'keep-out') keepouts.push(reg);
    else {
      const c = a.clearance ?? clearanceDefault;
      const grown = copper.length ? offsetRegions(copper, c, 'round') : [];
      ground.push(...differenceRegions([reg], grown));
    }
  }
  // No copper of any kind inside a keep-out: ground copper gives way too.
  if (keepouts.length && ground.length) { const g2 = differenceRegions(ground, keepouts); ground.length = 0; ground.push(...g2); }
  const outline: Region | null = doc.board && doc.board.outline && doc.board.outline.length >= 3
    ? { outer: isCounterClockwise(doc.board.outline) ? doc.board.outline : doc.board.outline.slice().reverse(), holes: [] }
    : null;
  const rings: Ring[] = [];
  for (const r of copper) rings.push(r.outer);
  for (const r of ground) rings.push(r.outer);
  if (outline) rings.push(outline.outer);
  for (const k of keepouts) rings.push(k.outer);
  let extent = rings.length ? boxOf(rings) : { minX: 0, minY: 0, maxX: 0, maxY: 0 };
  const blank: Region = outline ?? { outer: rectRing(extent.minX - BOARD_MARGIN, extent.minY - BOARD_MARGIN, extent.maxX + BOARD_MARGIN, extent.maxY + BOARD_MARGIN), holes: [] };
  if (!outline) extent = boxOf([blank.outer]);
  const clearance = copper.length || ground.length ? differenceRegions([blank], [...copper, ...ground]) : [blank];
  return {
    copper, groundCopper: ground, outline, clearance, keepouts, drills, extent,
    pieces: outlines.map((o) => ({ id: o.id, regions: o.regions, centreline: o.centreline })),
  };
}
