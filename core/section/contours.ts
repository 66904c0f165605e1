/**
 * Equipotential lines of a potential map by marching squares (each grid cell's crossing points joined by a segment;
 * the saddle case split by the cell's mean). Output in metres, clipped to a window, as flat segment lists
 * [x0, y0, x1, y1, …] per level — what an SVG path needs, and cheap to send from the worker.
 */
import type { PotentialMap } from './types.ts';

export interface Polyline { level: number; segments: number[] }

export interface Window { x0: number; x1: number; y0: number; y1: number }

export function equipotentials(p: PotentialMap, levels: number[], win: Window): Polyline[] {
  const { x, y, v } = p;
  const nx = x.length;
  const out: Polyline[] = levels.map((level) => ({ level, segments: [] }));
  let i0 = 0, i1 = nx - 1, j0 = 0, j1 = y.length - 1;
  while (i0 + 1 < nx && x[i0 + 1]! < win.x0) i0++;
  while (i1 > 1 && x[i1 - 1]! > win.x1) i1--;
  while (j0 + 1 < y.length && y[j0 + 1]! < win.y0) j0++;
  while (j1 > 1 && y[j1 - 1]! > win.y1) j1--;
  const cross = (xa: number, ya: number, va: number, xb: number, yb: number, vb: number, l: number): [number, number] => {
    const f = (l - va) / (vb - va);
    return [xa + f * (xb - xa), ya + f * (yb - ya)];
  };
  for (let j = j0; j < j1; j++) {
    for (let i = i0; i < i1; i++) {
      const k = j * nx + i;
      const a = v[k]!, b = v[k + 1]!, c = v[k + 1 + nx]!, d = v[k + nx]!;
      const lo = Math.min(a, b, c, d), hi = Math.max(a, b, c, d);
      const xa = x[i]!, xb = x[i + 1]!, ya = y[j]!, yb = y[j + 1]!;
      levels.forEach((l, li) => {
        if (l <= lo || l >= hi) return;
        const pts: [number, number][] = [];
        if ((a < l) !== (b < l)) pts.push(cross(xa, ya, a, xb, ya, b, l));
        if ((b < l) !== (c < l)) pts.push(cross(xb, ya, b, xb, yb, c, l));
        if ((c < l) !== (d < l)) pts.push(cross(xb, yb, c, xa, yb, d, l));
        if ((d < l) !== (a < l)) pts.push(cross(xa, yb, d, xa, ya, a, l));
        const s = out[li]!.segments;
        if (pts.length === 2) s.push(pts[0]![0], pts[0]![1], pts[1]![0], pts[1]![1]);
        else if (pts.length === 4) {
          const mid = (a + b + c + d) / 4;
          if ((mid < l) === (a < l)) s.push(...pts[0]!, ...pts[1]!, ...pts[2]!, ...pts[3]!);
          else s.push(...pts[0]!, ...pts[3]!, ...pts[1]!, ...pts[2]!);
        }
      });
    }
  }
  return out;
}
