/**
 * Hit-testing against the scene in board space (never DOM measurements, so it is the same in tests and the app).
 */
import type { Box, Vec2 } from '../../../core/index.ts';
import type { Scene } from './scene.ts';
import { distToSegment, projectOnSegment } from './snap.ts';

export type Hit = { kind: 'node'; id: string } | { kind: 'segment'; id: string } | { kind: 'area'; id: string } | null;

/**
 * The node or segment under board point `p`. `tolerance` is the pick radius in metres (a few pixels at the current
 * zoom); nodes win over segments so a run can be started from its end.
 */
export function hitTest(scene: Scene, p: Vec2, tolerance: number): Hit {
  let best: Hit = null;
  let bestD = Infinity;
  // A part's body is short (a chip between two pads): over its middle it wins over the nodes at its ends.
  for (const s of scene.segments) {
    if (!s.part) continue;
    const proj = projectOnSegment(p, s.a, s.b);
    if (proj.t > 0.2 && proj.t < 0.8 && distToSegment(p, s.a, s.b) <= Math.max(tolerance, s.part.body.across / 2)) return { kind: 'segment', id: s.id };
  }
  for (const n of scene.nodes) {
    const d = Math.hypot(n.at.x - p.x, n.at.y - p.y);
    if (d <= tolerance * 1.5 && d < bestD) { best = { kind: 'node', id: n.id }; bestD = d; }
  }
  if (best) return best;
  for (const s of scene.segments) {
    const line = s.centreline && s.centreline.length >= 2 ? s.centreline : [s.a, s.b];
    const reach = Math.max(tolerance, (s.width ?? 0) / 2);
    for (let i = 0; i + 1 < line.length; i++) {
      const d = distToSegment(p, line[i], line[i + 1]);
      if (d <= reach && d < bestD) { best = { kind: 'segment', id: s.id }; bestD = d; }
    }
  }
  if (best) return best;
  // Areas last: inside the polygon (even-odd), the smallest area first so a keep-out inside ground copper wins.
  let bestArea = Infinity;
  for (const a of scene.areas) {
    if (!insidePolygon(p, a.polygon)) continue;
    const area = Math.abs(signedArea(a.polygon));
    if (area < bestArea) { best = { kind: 'area', id: a.id }; bestArea = area; }
  }
  return best;
}

/** Ids of nodes inside the box and of segments whose both drawn ends are inside it. */
export function boxSelect(scene: Scene, box: Box): string[] {
  const inside = (q: Vec2) => q.x >= box.minX && q.x <= box.maxX && q.y >= box.minY && q.y <= box.maxY;
  const ids: string[] = [];
  for (const n of scene.nodes) if (inside(n.at)) ids.push(n.id);
  for (const s of scene.segments) if (inside(s.a) && inside(s.b)) ids.push(s.id);
  for (const a of scene.areas) if (a.polygon.every(inside)) ids.push(a.id);
  return ids;
}

/** Even-odd point in polygon (ray casting along +x). */
export function insidePolygon(p: Vec2, poly: readonly Vec2[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const a = poly[i]!, b = poly[j]!;
    if ((a.y > p.y) !== (b.y > p.y) && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}

/** Shoelace formula: positive for counter-clockwise rings. */
export function signedArea(poly: readonly Vec2[]): number {
  let s = 0;
  for (let i = 0; i < poly.length; i++) { const a = poly[i]!, b = poly[(i + 1) % poly.length]!; s += a.x * b.y - b.x * a.y; }
  return s / 2;
}
