/**
 * Independent geometry oracles for the geometry and layout tests: written from first principles (coordinate
 * compression for the area of a union of rectangles, brute-force segment intersection), sharing no code with
 * core/geometry so a bug there cannot hide itself.
 */
import type { Region, Ring, Vec2 } from '../../core/geometry/types.ts';

/** Exact area of the union of axis-aligned rectangles by coordinate compression. */
export function unionAreaOfRects(rects: { x0: number; y0: number; x1: number; y1: number }[]): number {
  const xs = [...new Set(rects.flatMap((r) => [r.x0, r.x1]))].sort((a, b) => a - b);
  const ys = [...new Set(rects.flatMap((r) => [r.y0, r.y1]))].sort((a, b) => a - b);
  let area = 0;
  for (let i = 0; i + 1 < xs.length; i++) {
    for (let j = 0; j + 1 < ys.length; j++) {
      const cx = (xs[i]! + xs[i + 1]!) / 2, cy = (ys[j]! + ys[j + 1]!) / 2;
      if (rects.some((r) => cx > r.x0 && cx < r.x1 && cy > r.y0 && cy < r.y1)) area += (xs[i + 1]! - xs[i]!) * (ys[j + 1]! - ys[j]!);
    }
  }
  return area;
}

/** Shoelace signed area (positive counter-clockwise), written again here on purpose. */
export function shoelace(ring: Ring): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i]!, q = ring[(i + 1) % ring.length]!;
    s += (q.x - p.x) * (q.y + p.y);
  }
  return -s / 2;
}

function cross(o: Vec2, a: Vec2, b: Vec2): number { return (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x); }

/** True when two non-adjacent edges of the ring cross or touch (brute force, O(n²)). */
export function selfIntersects(ring: Ring, eps = 1e-8): boolean {
  // eps is a distance, m: a vertex within the polygon engine's 10 nm snapping grid of another edge touches it (a
  // pinch point the union may leave where two lobes meet), it does not cross it. The side tests are distances of a
  // point from a line (cross product over the segment's length), so the tolerance does not depend on edge lengths.
  const n = ring.length;
  const side = (p: Vec2, q: Vec2, r: Vec2) => cross(p, q, r) / (Math.hypot(q.x - p.x, q.y - p.y) || 1);
  for (let i = 0; i < n; i++) {
    const a = ring[i]!, b = ring[(i + 1) % n]!;
    for (let j = i + 1; j < n; j++) {
      if (j === i || (j + 1) % n === i || (i + 1) % n === j) continue;
      const c = ring[j]!, d = ring[(j + 1) % n]!;
      const d1 = side(c, d, a), d2 = side(c, d, b), d3 = side(a, b, c), d4 = side(a, b, d);
      if (((d1 > eps && d2 < -eps) || (d1 < -eps && d2 > eps)) && ((d3 > eps && d4 < -eps) || (d3 < -eps && d4 > eps))) return true;
    }
  }
  return false;
}

export function regionAreaOracle(r: Region): number {
  return Math.abs(shoelace(r.outer)) - r.holes.reduce((s, h) => s + Math.abs(shoelace(h)), 0);
}

/** Distance from point p to segment ab. */
export function distToSegment(p: Vec2, a: Vec2, b: Vec2): number {
  const dx = b.x - a.x, dy = b.y - a.y;
  const l2 = dx * dx + dy * dy;
  const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / l2));
  return Math.hypot(p.x - a.x - t * dx, p.y - a.y - t * dy);
}
