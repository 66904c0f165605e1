/**
 * Ordering to keep travel short: nearest neighbour, then 2-opt (reverse a stretch of the order when that shortens the
 * tour; Croes 1958, "A method for solving traveling-salesman problems", Operations Research 6(6)). Every item here
 * starts and ends at the same point (closed loops, holes), so reversing a stretch never changes an item; a closed
 * loop is entered at its vertex nearest to where the tool is.
 */
import type { Vec2 } from '../geometry/types.ts';

/** Above this many items 2-opt is skipped (its cost grows with the square of the count). */
export const TWO_OPT_LIMIT = 1500;

const d = (a: Vec2, b: Vec2) => Math.hypot(a.x - b.x, a.y - b.y);

/** Index of the vertex of `pts` nearest to `from`. */
export function nearestVertex(pts: Vec2[], from: Vec2): number {
  let bi = 0, bd = Infinity;
  for (let i = 0; i < pts.length; i++) { const v = d(pts[i]!, from); if (v < bd) { bd = v; bi = i; } }
  return bi;
}

/** A closed loop rotated to start at vertex `i`. */
export function rotateLoop<T>(pts: T[], i: number): T[] { return i === 0 ? pts : [...pts.slice(i), ...pts.slice(0, i)]; }

/**
 * Order of `items` (each a set of candidate entry points; the item is left where it was entered) from `home`:
 * returns the visiting order and, per visited item, the chosen entry index.
 */
export function orderItems(items: Vec2[][], home: Vec2): { order: number[]; entry: number[] } {
  const n = items.length;
  const done = new Uint8Array(n);
  const order: number[] = [], entry: number[] = new Array(n).fill(0);
  let at = home;
  for (let k = 0; k < n; k++) {
    let best = -1, bestV = 0, bestD = Infinity;
    for (let i = 0; i < n; i++) {
      if (done[i]) continue;
      const pts = items[i]!;
      for (let j = 0; j < pts.length; j++) { const v = d(pts[j]!, at); if (v < bestD) { bestD = v; best = i; bestV = j; } }
    }
    done[best] = 1; order.push(best); entry[best] = bestV; at = items[best]![bestV]!;
  }
  if (n > 3 && n <= TWO_OPT_LIMIT) twoOpt(order, (i) => items[i]![entry[i]!]!, home);
  return { order, entry };
}

/** 2-opt on an open tour that starts at `home` (fixed) and ends anywhere. */
function twoOpt(order: number[], pt: (i: number) => Vec2, home: Vec2): void {
  const P = (k: number) => (k < 0 ? home : pt(order[k]!));
  const n = order.length;
  for (let sweep = 0, improved = true; improved && sweep < 50; sweep++) {
    improved = false;
    for (let i = 0; i < n - 1; i++) {
      for (let j = i + 1; j < n; j++) {
        // Reverse order[i..j]: edges (i-1, i) and (j, j+1) become (i-1, j) and (i, j+1).
        const a = P(i - 1), b = P(i), c = P(j);
        const before = d(a, b) + (j + 1 < n ? d(c, P(j + 1)) : 0);
        const after = d(a, c) + (j + 1 < n ? d(b, P(j + 1)) : 0);
        if (after < before - 1e-12) {
          for (let l = i, r = j; l < r; l++, r--) { const t = order[l]!; order[l] = order[r]!; order[r] = t; }
          improved = true;
        }
      }
    }
  }
}

/** Length of the rapid moves of a tour from `home` through the given points, m. */
export function tourLength(points: Vec2[], home: Vec2): number {
  let at = home, s = 0;
  for (const p of points) { s += d(at, p); at = p; }
  return s;
}
