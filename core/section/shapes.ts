/**
 * The cross-section as shapes: which points are copper (and of which conductor), and the permittivity everywhere
 * else. Pure geometry, no grid: grid.ts places grid lines on the key coordinates listed here, and laplace.ts samples
 * the materials cell by cell.
 *
 * `recede` > 0 gives the same cross-section with every conductor surface moved into its metal by that much, in
 * vacuum, for Wheeler's incremental-inductance rule (the ground plane's surface moves down by `recede`; everything
 * is then shifted up by `recede` so the ground plane stays at y = 0).
 */
import type { SectionSpec } from './types.ts';

/** Conductor ids: 0 = grounded (ground plane, stitched side copper, lid), 1 = strip, 2 = second strip, 3 = floating side copper. */
export const GROUND = 0;
export const STRIP_1 = 1;
export const STRIP_2 = 2;
export const FLOATING = 3;

/** A copper body bounded by y0 ≤ y ≤ y0 + t, and left/right walls x = xl + (y − y0)·sl, x = xr − (y − y0)·sr. */
export interface Body {
  id: number;
  y0: number; t: number;
  xl: number; xr: number;
  /** Wall slopes dx/dy (cot of the wall angle; 0 = vertical); positive narrows the body upwards. */
  sl: number; sr: number;
}

/** A gap between two copper feet, where a trench may be cut. */
export interface Gap { x0: number; x1: number }

export interface Shapes {
  bodies: Body[];
  /** Height of a grounded lid, m, or Infinity. */
  lid: number;
  /** Gaps (copper foot to copper foot) on the substrate. */
  gaps: Gap[];
  /** Key x and y coordinates, each with whether it is a conductor edge (a field singularity: finest cells). */
  keysX: { at: number; edge: boolean }[];
  keysY: { at: number; edge: boolean }[];
  /** Horizontal extent of the structure (copper and gaps), m: the domain is sized from it. */
  halfExtent: number;
  /** Smallest lateral feature the grid must resolve (width, height, gaps, lid clearance; not the copper thickness), m. */
  feature: number;
}

/** Slope dx/dy of a wall at `angleDeg` to the substrate plane (90° → 0). */
export function wallSlope(angleDeg: number | undefined): number {
  if (angleDeg === undefined || angleDeg === 90) return 0;
  return 1 / Math.tan((angleDeg * Math.PI) / 180);
}

/** Copper bodies, gaps and key coordinates for `spec`, receded by `recede` (m; 0 for the cross-section itself). */
export function buildShapes(spec: SectionSpec, recede = 0, wideEdge = Infinity): Shapes {
  const { h, width: W, t } = spec;
  const slope = wallSlope(spec.etchAngleDeg);
  const angle = ((spec.etchAngleDeg ?? 90) * Math.PI) / 180;
  // A slanted wall receding by d moves d/sinθ sideways at fixed height; the foot rises by d, which moves it d·cotθ more.
  const inset = recede > 0 ? recede / Math.sin(angle) + recede * slope : 0;
  const y0 = h + 2 * recede;
  const tt = Math.max(0, t - 2 * recede);
  const bodies: Body[] = [];
  const pair = spec.spacing !== undefined;
  const centres = pair ? [-(spec.spacing! + W) / 2, (spec.spacing! + W) / 2] : [0];
  centres.forEach((xc, k) => {
    bodies.push({ id: k === 0 ? STRIP_1 : STRIP_2, y0, t: tt, xl: xc - W / 2 + inset, xr: xc + W / 2 - inset, sl: slope, sr: slope });
  });
  const left = centres[0]! - W / 2;
  const right = centres[centres.length - 1]! + W / 2;
  const gaps: Gap[] = [];
  if (pair) gaps.push({ x0: centres[0]! + W / 2, x1: centres[1]! - W / 2 });
  let halfExtent = right;
  const side = spec.side;
  if (side) {
    const id = side.connection === 'floating' ? FLOATING : GROUND;
    const sides = side.sides ?? 'both';
    const reach = Number.isFinite(side.width) ? side.width : Infinity;
    if (sides !== 'left') {
      const xin = right + side.gap;
      bodies.push({ id, y0, t: tt, xl: xin + inset, xr: Math.min(xin + reach, wideEdge) - (Number.isFinite(reach) ? recede : 0), sl: slope, sr: 0 });
      gaps.push({ x0: right, x1: xin });
    }
    if (sides !== 'right') {
      const xin = left - side.gap;
      bodies.push({ id, y0, t: tt, xl: Math.max(xin - reach, -wideEdge) + (Number.isFinite(reach) ? recede : 0), xr: xin - inset, sl: 0, sr: slope });
      gaps.push({ x0: xin, x1: left });
    }
    halfExtent = right + side.gap + (Number.isFinite(reach) ? reach : 0);
  }
  gaps.sort((a, b) => a.x0 - b.x0);

  const keysX: { at: number; edge: boolean }[] = [];
  const keysY: { at: number; edge: boolean }[] = [{ at: 0, edge: false }, { at: y0, edge: true }];
  for (const b of bodies) {
    for (const x of [b.xl, b.xr]) if (Number.isFinite(x) && Math.abs(x) < wideEdge) keysX.push({ at: x, edge: true });
    if (tt > 0) {
      keysX.push({ at: b.xl + tt * b.sl, edge: true }, { at: b.xr - tt * b.sr, edge: true });
    }
  }
  if (tt > 0) keysY.push({ at: y0 + tt, edge: true });
  if (recede === 0) {
    const tr = spec.trench;
    if (tr && tr.depth > 0 && gaps.length) {
      const half = tr.angleDeg === undefined ? 0 : Math.tan(((tr.angleDeg / 2) * Math.PI) / 180);
      for (const g of gaps) {
        const d = trenchDepth(g, tr.depth, half);
        // Fine cells at the trench's corners: they sit within a trench depth of the copper edges, and a coarse key
        // there would cut off the grading towards those edges (gradedAxis grades between neighbouring keys only), which
        // left the field under the strip's edge on coarse cells and slowed convergence beside a wide channel.
        keysY.push({ at: h - d, edge: true });
        keysX.push({ at: g.x0 + d * half, edge: true }, { at: g.x1 - d * half, edge: true });
      }
    }
    const c = spec.cover;
    if (c && c.thickness > 0) {
      // The cover also lines the trenches: its inner faces there are interfaces too (an unkeyed interface cuts cells
      // at a place that moves with refinement, and the convergence study saw C's level-to-level change grow).
      if (tr && tr.depth > 0) {
        const half = tr.angleDeg === undefined ? 0 : Math.tan(((tr.angleDeg / 2) * Math.PI) / 180);
        for (const g of gaps) {
          const d = trenchDepth(g, tr.depth, half);
          if (c.thickness >= d) continue;
          keysY.push({ at: h - d + c.thickness, edge: false });
          if (half === 0 && 2 * c.thickness < g.x1 - g.x0) keysX.push({ at: g.x0 + c.thickness, edge: false }, { at: g.x1 - c.thickness, edge: false });
        }
      }
      keysY.push({ at: h + c.thickness, edge: false });
      if (tt > 0) keysY.push({ at: h + tt + c.thickness, edge: false });
      for (const b of bodies) {
        for (const x of [b.xl - c.thickness, b.xr + c.thickness]) if (Math.abs(x) < wideEdge) keysX.push({ at: x, edge: false });
      }
    }
  } else {
    keysY.push({ at: h, edge: false }); // keeps the vacuum grids of the two solves alike
  }
  const lid = spec.lid !== undefined ? spec.lid + 2 * recede : Infinity;
  const feats = [W, h];
  if (side) feats.push(side.gap);
  if (pair) feats.push(spec.spacing!);
  if (spec.lid !== undefined) feats.push(spec.lid - h - t);
  const feature = Math.min(...feats.filter((x) => x > 0));
  return { bodies, lid, gaps, keysX, keysY, halfExtent, feature };
}

/** Depth a trench actually reaches in gap g: a V-bit's point may stop it short of `depth`. */
export function trenchDepth(g: Gap, depth: number, halfTan: number): number {
  if (halfTan <= 0) return depth;
  return Math.min(depth, (g.x1 - g.x0) / (2 * halfTan));
}

/** The conductor id at (x, y), or −1 for none. `tol` widens every body slightly (grid points on a wall count). */
export function conductorAt(s: Shapes, x: number, y: number, tol: number): number {
  if (y <= tol) return GROUND;
  if (y >= s.lid - tol) return GROUND;
  for (const b of s.bodies) {
    const dy = y - b.y0;
    if (dy < -tol || dy > b.t + tol) continue;
    const yy = Math.min(Math.max(dy, 0), b.t);
    if (x >= b.xl + yy * b.sl - tol && x <= b.xr - yy * b.sr + tol) return b.id;
  }
  return -1;
}
