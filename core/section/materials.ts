/**
 * Relative permittivity at a point of the cross-section: substrate (less any trench cut into it), cover coat within
 * its thickness of anything solid, vacuum elsewhere. Copper points are reported as NaN (they carry no field).
 */
import { conductorAt, trenchDepth, type Shapes } from './shapes.ts';
import type { SectionSpec } from './types.ts';

interface Seg { ax: number; ay: number; bx: number; by: number }

/**
 * Relative permittivity at (x, y), NaN in copper. Every point with 0 < y < `below` is plain substrate (`substrate`),
 * every point above `above` is vacuum (`1`): cells wholly in those bands need no sampling.
 */
export type Material = ((x: number, y: number) => number) & { below: number; above: number; substrate: number };

function distToSeg(s: Seg, x: number, y: number): number {
  const dx = s.bx - s.ax, dy = s.by - s.ay;
  const l2 = dx * dx + dy * dy;
  let u = l2 > 0 ? ((x - s.ax) * dx + (y - s.ay) * dy) / l2 : 0;
  u = u < 0 ? 0 : u > 1 ? 1 : u;
  const ex = s.ax + u * dx - x, ey = s.ay + u * dy - y;
  return Math.sqrt(ex * ex + ey * ey);
}

/** The material function of `spec` on its shapes (built with recede = 0). `tol` as in conductorAt. */
export function materialOf(spec: SectionSpec, s: Shapes, tol: number): Material {
  const h = spec.h;
  const er = spec.er;
  const tr = spec.trench && spec.trench.depth > 0 ? spec.trench : null;
  const half = tr && tr.angleDeg !== undefined ? Math.tan(((tr.angleDeg / 2) * Math.PI) / 180) : 0;
  const notches = tr ? s.gaps.map((g) => ({ g, d: trenchDepth(g, tr.depth, half) })) : [];
  const inTrench = (x: number, y: number): boolean => {
    for (const { g, d } of notches) {
      const z = h - y;
      if (z > d) continue;
      if (x >= g.x0 + z * half && x <= g.x1 - z * half) return true;
    }
    return false;
  };
  const cover = spec.cover && spec.cover.thickness > 0 ? spec.cover : null;
  const segs: Seg[] = [];
  if (cover) {
    // The substrate's top: flat, with the trench notches; then each copper body's outline.
    const BIG = 1e3;
    let x = -BIG;
    for (const { g, d } of notches) {
      segs.push({ ax: x, ay: h, bx: g.x0, by: h });
      const p = [[g.x0, h], [g.x0 + d * half, h - d], [g.x1 - d * half, h - d], [g.x1, h]] as const;
      for (let k = 0; k < 3; k++) segs.push({ ax: p[k]![0], ay: p[k]![1], bx: p[k + 1]![0], by: p[k + 1]![1] });
      x = g.x1;
    }
    segs.push({ ax: x, ay: h, bx: BIG, by: h });
    for (const b of s.bodies) {
      const xl = Math.max(b.xl, -BIG), xr = Math.min(b.xr, BIG);
      const tl = xl + b.t * b.sl, trr = xr - b.t * b.sr, top = b.y0 + b.t;
      segs.push({ ax: xl, ay: b.y0, bx: tl, by: top }, { ax: tl, ay: top, bx: trr, by: top }, { ax: trr, ay: top, bx: xr, by: b.y0 });
    }
  }
  const reach = cover ? cover.thickness : 0;
  const topOfAll = h + spec.t + reach;
  const at = (x: number, y: number): number => {
    if (conductorAt(s, x, y, tol) >= 0) return Number.NaN;
    if (y < h && !inTrench(x, y)) return er;
    if (!cover || y > topOfAll) return 1;
    for (const sg of segs) {
      // Most segments are far from the point: a bounding-box test first spares the distance.
      if (x < Math.min(sg.ax, sg.bx) - reach || x > Math.max(sg.ax, sg.bx) + reach || y < Math.min(sg.ay, sg.by) - reach || y > Math.max(sg.ay, sg.by) + reach) continue;
      if (distToSeg(sg, x, y) <= reach) return cover.er;
    }
    return 1;
  };
  const deepest = notches.reduce((m, n) => Math.max(m, n.d), 0);
  // Copper starts at h (bodies stand on the substrate) and ends at h + t; the cover reaches `reach` above anything.
  return Object.assign(at, { below: h - deepest - tol, above: Math.max(h, topOfAll) + tol, substrate: er });
}
