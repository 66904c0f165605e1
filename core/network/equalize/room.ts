/**
 * Room for a meander: its new copper (every stretch but the two lead-ins, which lie on the old run) must keep
 *  - an edge gap of at least `gap` to every other piece's copper (the coupling limit, default 3h);
 *  - the same gap to the board outline's inside (so the copper stays on the board, with room for the cut);
 *  - the keep-out's clearance (or `gap` when it gives none) from every keep-out area, and stay outside it.
 * Distances are between centrelines, less half of each width: plain segment geometry of our own.
 */
import type { Vec2 } from '../../geometry/types.ts';
import type { SizedDesign } from '../../layout/index.ts';

export interface RoomContext {
  /** Segments of other copper: centreline ends and half-width. */
  others: { p: Vec2; q: Vec2; half: number; piece: string }[];
  outline: Vec2[] | null;
  keepOuts: { polygon: Vec2[]; clearance: number }[];
}

export function roomContext(sized: SizedDesign, skipPiece: string, gap: number): RoomContext {
  const others: RoomContext['others'] = [];
  for (const p of sized.pieces) {
    if (p.id === skipPiece || !Number.isFinite(p.width)) continue;
    const line = sized.centrelines[p.id];
    if (!line || line.length < 2) continue;
    const half = Math.max(p.width, p.widthB ?? 0, p.part ? p.part.footprint.padAcross : 0) / 2;
    for (let i = 1; i < line.length; i++) others.push({ p: line[i - 1]!, q: line[i]!, half, piece: p.id });
  }
  const keepOuts = sized.doc.areas.filter((a) => a.kind === 'keep-out').map((a) => ({ polygon: a.polygon, clearance: a.clearance ?? gap }));
  return { others, outline: sized.doc.board?.outline ?? null, keepOuts };
}

/** Distance between segments p0p1 and q0q1, m. */
export function segmentDistance(p0: Vec2, p1: Vec2, q0: Vec2, q1: Vec2): number {
  if (segmentsCross(p0, p1, q0, q1)) return 0;
  return Math.min(pointSegment(p0, q0, q1), pointSegment(p1, q0, q1), pointSegment(q0, p0, p1), pointSegment(q1, p0, p1));
}

function pointSegment(x: Vec2, a: Vec2, b: Vec2): number {
  const dx = b.x - a.x, dy = b.y - a.y, L2 = dx * dx + dy * dy;
  const t = L2 > 0 ? Math.max(0, Math.min(1, ((x.x - a.x) * dx + (x.y - a.y) * dy) / L2)) : 0;
  return Math.hypot(x.x - a.x - t * dx, x.y - a.y - t * dy);
}

function orient(a: Vec2, b: Vec2, c: Vec2): number { return (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x); }

function segmentsCross(p0: Vec2, p1: Vec2, q0: Vec2, q1: Vec2): boolean {
  const d1 = orient(q0, q1, p0), d2 = orient(q0, q1, p1), d3 = orient(p0, p1, q0), d4 = orient(p0, p1, q1);
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
}

export function insidePolygon(x: Vec2, poly: readonly Vec2[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const a = poly[i]!, b = poly[j]!;
    if ((a.y > x.y) !== (b.y > x.y) && x.x < ((b.x - a.x) * (x.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}

/**
 * Why the new stretches of a meander (polyline from a to b through its corners; the first and last stretch are the
 * lead-ins on the old run) do not fit, or null when they do.
 */
export function roomProblem(ctx: RoomContext, path: readonly Vec2[], width: number, gap: number): string | null {
  const half = width / 2;
  for (let i = 2; i < path.length - 1; i++) {
    const p = path[i - 1]!, q = path[i]!;
    for (const o of ctx.others) {
      if (segmentDistance(p, q, o.p, o.q) < gap + half + o.half - 1e-9) return `it would come within ${(gap * 1e3).toFixed(2)} mm of ${o.piece}`;
    }
    if (ctx.outline) {
      if (!insidePolygon(p, ctx.outline) || !insidePolygon(q, ctx.outline)) return 'it would leave the board outline';
      const ol = ctx.outline;
      for (let k = 0; k < ol.length; k++) {
        if (segmentDistance(p, q, ol[k]!, ol[(k + 1) % ol.length]!) < gap + half) return 'it would come too close to the board edge';
      }
    }
    for (const ko of ctx.keepOuts) {
      if (insidePolygon(p, ko.polygon) || insidePolygon(q, ko.polygon)) return 'it would enter a keep-out area';
      const pg = ko.polygon;
      for (let k = 0; k < pg.length; k++) {
        if (segmentDistance(p, q, pg[k]!, pg[(k + 1) % pg.length]!) < ko.clearance + half) return 'it would come too close to a keep-out area';
      }
    }
  }
  return null;
}
