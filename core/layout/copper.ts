/**
 * Copper outline primitives in board coordinates (metres, y up): rectangles along a centreline, bend corners
 * (square, mitered, arc), junction patches, circles, and a convex clip. Every ring is returned counter-clockwise.
 * Curves are flattened so no chord strays more than CHORD_TOL from the true curve.
 */
import type { Ring, Vec2 } from '../geometry/types.ts';
import { ringArea } from '../geometry/polygons.ts';

/** Largest distance between a flattened arc and the true arc, m (1 µm; project rule, well below common-practice etch tolerance). */
export const CHORD_TOL = 1e-6;

export const add = (a: Vec2, b: Vec2): Vec2 => ({ x: a.x + b.x, y: a.y + b.y });
export const sub = (a: Vec2, b: Vec2): Vec2 => ({ x: a.x - b.x, y: a.y - b.y });
export const mul = (a: Vec2, k: number): Vec2 => ({ x: a.x * k, y: a.y * k });
export const dot = (a: Vec2, b: Vec2): number => a.x * b.x + a.y * b.y;
export const crossZ = (a: Vec2, b: Vec2): number => a.x * b.y - a.y * b.x;
export const len = (a: Vec2): number => Math.hypot(a.x, a.y);
export const unit = (a: Vec2): Vec2 => { const l = len(a); return { x: a.x / l, y: a.y / l }; };
/** Left normal of a direction. */
export const left = (d: Vec2): Vec2 => ({ x: -d.y, y: d.x });

export function ccw(ring: Ring): Ring { return ringArea(ring) >= 0 ? ring : ring.slice().reverse(); }

/** Rectangle of width W around the segment p0 → p1 (ends square, exactly at p0 and p1). */
export function rectAlong(p0: Vec2, p1: Vec2, W: number): Ring {
  const d = unit(sub(p1, p0));
  const n = mul(left(d), W / 2);
  return [sub(p0, n), sub(p1, n), add(p1, n), add(p0, n)];
}

/** Trapezoid-like outline of a taper: widths w[i] at points along p0 → p1 at fractions f[i] (0…1, increasing). */
export function taperOutline(p0: Vec2, p1: Vec2, fracs: number[], widths: number[]): Ring {
  const d = sub(p1, p0);
  const n = left(unit(d));
  const right: Vec2[] = [], leftSide: Vec2[] = [];
  for (let i = 0; i < fracs.length; i++) {
    const c = add(p0, mul(d, fracs[i]!));
    right.push(sub(c, mul(n, widths[i]! / 2)));
    leftSide.push(add(c, mul(n, widths[i]! / 2)));
  }
  return [...right, ...leftSide.reverse()];
}

/** Number of chords so that a circle of radius r over `sweep` radians stays within CHORD_TOL. */
export function chordCount(r: number, sweep: number, tol = CHORD_TOL): number {
  if (r <= tol) return 1;
  const step = 2 * Math.acos(1 - tol / r);
  return Math.max(1, Math.ceil(Math.abs(sweep) / step));
}

/**
 * A circle as a polygon that CONTAINS the true circle's inscribed polygon of chord error ≤ tol: vertices on the
 * circle (the polygon lies inside the circle by at most tol).
 */
export function circle(c: Vec2, r: number, tol = CHORD_TOL): Ring {
  const n = Math.max(8, chordCount(r, 2 * Math.PI, tol));
  const out: Ring = [];
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n;
    out.push({ x: c.x + r * Math.cos(a), y: c.y + r * Math.sin(a) });
  }
  return out;
}

/** Annular band from angle a0 sweeping `sweep` (signed) with inner radius r0 and outer r1 around c. */
export function arcBand(c: Vec2, r0: number, r1: number, a0: number, sweep: number, tol = CHORD_TOL): Ring {
  const n = chordCount(r1, sweep, tol);
  const outer: Vec2[] = [], inner: Vec2[] = [];
  for (let i = 0; i <= n; i++) {
    const a = a0 + (sweep * i) / n;
    outer.push({ x: c.x + r1 * Math.cos(a), y: c.y + r1 * Math.sin(a) });
    inner.push({ x: c.x + r0 * Math.cos(a), y: c.y + r0 * Math.sin(a) });
  }
  return ccw([...outer, ...inner.reverse()]);
}

/** Keeps the part of a convex ring on the side of the line through `p` where (q − p)·n ≥ 0 (Sutherland–Hodgman). */
export function clipHalfPlane(ring: Ring, p: Vec2, n: Vec2): Ring {
  const out: Ring = [];
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!, b = ring[(i + 1) % ring.length]!;
    const da = dot(sub(a, p), n), db = dot(sub(b, p), n);
    if (da >= 0) out.push(a);
    if ((da >= 0) !== (db >= 0)) {
      const t = da / (da - db);
      out.push(add(a, mul(sub(b, a), t)));
    }
  }
  return out;
}

/** Convex hull (Andrew's monotone chain), counter-clockwise. */
export function convexHull(points: Vec2[]): Ring {
  const p = points.slice().sort((a, b) => a.x - b.x || a.y - b.y);
  if (p.length < 3) return p;
  const lower: Vec2[] = [];
  for (const q of p) {
    while (lower.length >= 2 && crossZ(sub(lower[lower.length - 1]!, lower[lower.length - 2]!), sub(q, lower[lower.length - 2]!)) <= 0) lower.pop();
    lower.push(q);
  }
  const upper: Vec2[] = [];
  for (let i = p.length - 1; i >= 0; i--) {
    const q = p[i]!;
    while (upper.length >= 2 && crossZ(sub(upper[upper.length - 1]!, upper[upper.length - 2]!), sub(q, upper[upper.length - 2]!)) <= 0) upper.pop();
    upper.push(q);
  }
  lower.pop(); upper.pop();
  return lower.concat(upper);
}

export interface CornerGeometry {
  /** Turn angle θ, radians (0 = straight on), always ≥ 0. */
  turn: number;
  /** +1 for a left (counter-clockwise) turn, −1 for a right turn. */
  side: 1 | -1;
  /** Outer corner of the unmitered bend. */
  outer: Vec2;
  /** Inner corner of the unmitered bend. */
  inner: Vec2;
}

/** The corners of a bend of width W at point P, entering along d1 and leaving along d2 (unit vectors). */
export function cornerGeometry(P: Vec2, d1: Vec2, d2: Vec2, W: number): CornerGeometry {
  const c = Math.max(-1, Math.min(1, dot(d1, d2)));
  const turn = Math.acos(c);
  const side: 1 | -1 = crossZ(d1, d2) >= 0 ? 1 : -1;
  // Outer side is to the right of a left turn.
  const o1 = mul(left(d1), -side * W / 2);
  const ext = (W / 2) * Math.tan(turn / 2);
  const outer = add(add(P, o1), mul(d1, ext));
  const inner = sub(mul(P, 2), outer);
  return { turn, side, outer, inner };
}

/** The square (unmitered) corner patch [A, O, B, P] that closes the outer side of two rectangles ending at P. */
export function squareCornerPatch(P: Vec2, d1: Vec2, d2: Vec2, W: number): Ring {
  const g = cornerGeometry(P, d1, d2, W);
  const A = add(P, mul(left(d1), -g.side * W / 2));
  const B = add(P, mul(left(d2), -g.side * W / 2));
  return ccw([A, g.outer, B, P]);
}

/**
 * The cut of a miter: a line perpendicular to the bend diagonal at distance x from the outer corner. Returns a
 * point on the cut and the normal pointing to the copper that is kept.
 */
export function miterCutLine(P: Vec2, d1: Vec2, d2: Vec2, W: number, x: number): { p: Vec2; n: Vec2 } {
  const g = cornerGeometry(P, d1, d2, W);
  const diag = unit(sub(g.inner, g.outer));
  return { p: add(g.outer, mul(diag, x)), n: diag };
}
