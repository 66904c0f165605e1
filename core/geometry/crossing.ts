/**
 * Does a closed outline cross or touch itself? A sweep line over x (Shamos & Hoey, "Geometric intersection
 * problems", 17th IEEE Symposium on Foundations of Computer Science, 1976): edges enter an ordered list (by y at the
 * sweep) at their left end and leave at their right end; before the first crossing the order never changes, so the
 * first crossing is between two edges that are next to each other in the list at some event. O(n log n) comparisons
 * plus the list's inserts and removals (array moves, fast in practice) — it runs on every outline, at any size.
 *
 * Edges that share a point of the ring (neighbours) are never a crossing. Beside the list's neighbours, each test
 * also looks past up to two more entries on each side, so a neighbour edge lying in between (they meet at a common
 * point) never hides a crossing; touching and collinear overlap count as crossing, as in the pairwise test.
 */
import type { Vec2 } from './types.ts';

/** Orientation of c against the line a→b: 1 left, −1 right, 0 on it (within 1e-18 m², far below the 10 nm grid). */
function orient(a: Vec2, b: Vec2, c: Vec2): number {
  const v = (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
  return Math.abs(v) < 1e-18 ? 0 : Math.sign(v);
}

function onBox(p: Vec2, q: Vec2, r: Vec2): boolean {
  return Math.min(p.x, q.x) <= r.x && r.x <= Math.max(p.x, q.x) && Math.min(p.y, q.y) <= r.y && r.y <= Math.max(p.y, q.y);
}

/** Proper crossing or touching of two edges (collinear overlap counts). */
export function segmentsCross(a: Vec2, b: Vec2, c: Vec2, d: Vec2): boolean {
  const o1 = orient(a, b, c), o2 = orient(a, b, d), o3 = orient(c, d, a), o4 = orient(c, d, b);
  if (o1 !== o2 && o3 !== o4 && o1 !== 0 && o2 !== 0 && o3 !== 0 && o4 !== 0) return true;
  return (o1 === 0 && onBox(a, b, c)) || (o2 === 0 && onBox(a, b, d)) || (o3 === 0 && onBox(c, d, a)) || (o4 === 0 && onBox(c, d, b));
}

/**
 * The first crossing found between two non-neighbouring edges of the closed ring (edge k runs from point k to point
 * k + 1, the last back to point 0), as edge indices i < j; null when the outline is simple.
 */
export function findSelfCrossing(ring: readonly Vec2[]): { i: number; j: number } | null {
  const n = ring.length;
  if (n < 4) return null; // three edges are all neighbours
  // Left and right end of every edge (by x, then y).
  const lx = new Float64Array(n), ly = new Float64Array(n), rx = new Float64Array(n), ry = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const p = ring[k]!, q = ring[(k + 1) % n]!;
    const pFirst = p.x < q.x || (p.x === q.x && p.y <= q.y);
    const a = pFirst ? p : q, b = pFirst ? q : p;
    lx[k] = a.x; ly[k] = a.y; rx[k] = b.x; ry[k] = b.y;
  }
  // Events 2k (edge k enters at its left end) and 2k + 1 (it leaves at its right end); at one point, entries first.
  const events = Array.from({ length: 2 * n }, (_, e) => e);
  const ex = (e: number) => ((e & 1) === 0 ? lx[e >> 1]! : rx[e >> 1]!);
  const ey = (e: number) => ((e & 1) === 0 ? ly[e >> 1]! : ry[e >> 1]!);
  events.sort((a, b) => ex(a) - ex(b) || ey(a) - ey(b) || (a & 1) - (b & 1) || a - b);

  const neighbours = (i: number, j: number) => { const d = Math.abs(i - j); return d === 1 || d === n - 1; };
  const cross = (i: number, j: number) => !neighbours(i, j) && segmentsCross(ring[i]!, ring[(i + 1) % n]!, ring[j]!, ring[(j + 1) % n]!);
  /** y of edge k at x (a vertical edge: the query y held to its span, so anything on it compares equal). */
  const yAt = (k: number, x: number, y: number) => {
    const dx = rx[k]! - lx[k]!;
    if (dx === 0) return Math.min(Math.max(y, ly[k]!), ry[k]!);
    const t = (x - lx[k]!) / dx;
    return ly[k]! + (ry[k]! - ly[k]!) * Math.min(1, Math.max(0, t));
  };
  const slope = (k: number) => { const dx = rx[k]! - lx[k]!; return dx === 0 ? Infinity : (ry[k]! - ly[k]!) / dx; };

  const active: number[] = [];
  const found = (i: number, j: number) => (i < j ? { i, j } : { i: j, j: i });
  /** Tests edge s against up to three list entries on each side of position `at` (s itself excluded). */
  const around = (s: number, at: number): { i: number; j: number } | null => {
    for (let k = at - 1; k >= 0 && k >= at - 3; k--) if (active[k] !== s && cross(s, active[k]!)) return found(s, active[k]!);
    for (let k = at; k < active.length && k < at + 4; k++) if (active[k] !== s && cross(s, active[k]!)) return found(s, active[k]!);
    return null;
  };

  for (const e of events) {
    const k = e >> 1;
    if ((e & 1) === 0) {
      const x = lx[k]!, y = ly[k]!, m = slope(k);
      // First position whose edge lies above the new one at this x (ties broken by slope: lower slope below).
      let lo = 0, hi = active.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        const t = active[mid]!;
        const yt = yAt(t, x, y);
        const below = yt < y || (yt === y && slope(t) < m);
        if (below) lo = mid + 1; else hi = mid;
      }
      active.splice(lo, 0, k);
      const hit = around(k, lo);
      if (hit) return hit;
    } else {
      const at = active.indexOf(k);
      if (at < 0) continue;
      active.splice(at, 1);
      // The entries now meeting across the gap: every pair among three below and three above it.
      for (let a = at - 1; a >= 0 && a >= at - 3; a--) {
        for (let b = at; b < active.length && b < at + 3; b++) if (cross(active[a]!, active[b]!)) return found(active[a]!, active[b]!);
      }
    }
  }
  return null;
}
