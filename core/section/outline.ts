/**
 * The cross-section as drawable outlines (metres, y up from the ground plane's top): substrate with its trenches,
 * copper bodies, the cover's surface (to be drawn as a band of the cover's thickness on each side), and the lid.
 */
import { buildShapes, FLOATING, GROUND, STRIP_1, STRIP_2, trenchDepth } from './shapes.ts';
import type { SectionSpec } from './types.ts';

export interface SectionOutline {
  /** View window, m. */
  window: { x0: number; x1: number; y0: number; y1: number };
  substrate: number[][];
  copper: { role: 'strip' | 'ground' | 'floating'; ring: number[][] }[];
  /** Surfaces the cover coats (open polylines); draw each with a stroke of twice the cover thickness, below the solids. */
  coverPaths: number[][][];
  coverThickness: number;
  lid: number | null;
}

export function sectionOutline(spec: SectionSpec): SectionOutline {
  const s0 = buildShapes(spec);
  const margin = Math.max(1.5 * spec.h, 0.5 * spec.width);
  const side = spec.side;
  const reach = side ? (Number.isFinite(side.width) ? s0.halfExtent : s0.halfExtent + Math.max(1.5 * spec.h, spec.width)) : s0.halfExtent;
  const x1 = reach + margin;
  const s = buildShapes(spec, 0, x1);
  const h = spec.h;
  const tr = spec.trench && spec.trench.depth > 0 ? spec.trench : null;
  const half = tr && tr.angleDeg !== undefined ? Math.tan(((tr.angleDeg / 2) * Math.PI) / 180) : 0;
  const top: number[][] = [[-x1, h]];
  if (tr) for (const g of s.gaps) {
    const d = trenchDepth(g, tr.depth, half);
    top.push([g.x0, h], [g.x0 + d * half, h - d], [g.x1 - d * half, h - d], [g.x1, h]);
  }
  top.push([x1, h]);
  const substrate = [[-x1, 0], [x1, 0], ...top.slice().reverse()];
  const copper = s.bodies.map((b) => {
    const xl = Math.max(b.xl, -x1), xr = Math.min(b.xr, x1);
    const tt = Math.max(b.t, h * 0.004); // a thin sheet is drawn with a hairline thickness
    const ring = [[xl, b.y0], [xr, b.y0], [xr - tt * b.sr, b.y0 + tt], [xl + tt * b.sl, b.y0 + tt]];
    const role: 'strip' | 'ground' | 'floating' = b.id === STRIP_1 || b.id === STRIP_2 ? 'strip' : b.id === FLOATING ? 'floating' : 'ground';
    return { role, ring };
  });
  void GROUND;
  const c = spec.cover && spec.cover.thickness > 0 ? spec.cover.thickness : 0;
  const coverPaths = c > 0 ? [top, ...copper.map((k) => [...k.ring, k.ring[0]!])] : [];
  const yTop = spec.lid !== undefined ? spec.lid : h + spec.t + c + Math.max(h, spec.width) * 0.8;
  return { window: { x0: -x1, x1, y0: -0.15 * h, y1: yTop }, substrate, copper, coverPaths, coverThickness: c, lid: spec.lid ?? null };
}
