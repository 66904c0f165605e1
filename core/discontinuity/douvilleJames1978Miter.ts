/**
 * Optimal miter of a symmetric 90° microstrip bend.
 *
 * Source: R. J. P. Douville and D. S. James, "Experimental study of symmetric microstrip bends and their
 * compensation", IEEE Trans. MTT, vol. 26, no. 3, pp. 175–182, March 1978 (methods.md §6.2a).
 *   M = 52 + 65 exp(−1.35 W/h)  [percent],  M = x/d,  d = W √2 (the bend's diagonal)
 *   x = distance from the outer corner of the unmitered bend to the cut, along the diagonal
 *   the cut removes a right triangle whose legs along the two outer edges are x √2 = 2 M W.
 * Validity: W/h ≥ 0.25, er ≤ 25 (measurement-based, low frequency). The fit is for 90° bends; for other angles the
 * same fraction of the diagonal is used (common practice, not covered by the paper — a validity warning is raised).
 * Electrical length: no closed form adopted; the path is measured along the centreline through the corner point.
 */
import { requireRange } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { warn } from '../util/warnings.ts';
import { rangeWarning } from './validity.ts';

export const MITER_SOURCE = 'douville-james-1978';
export const MITER_CITATION = 'Douville, James, IEEE Trans. MTT 26(3), 1978, pp. 175–182';

/** Optimal miter fraction M (0…1) of the diagonal for a 90° bend. */
export function optimalMiterFraction(u: number): number {
  requireRange('u', u, 0, Infinity, 'a width-to-height ratio W/h above 0', { minExclusive: true });
  return (52 + 65 * Math.exp(-1.35 * u)) / 100;
}

export interface MiterCut {
  /** Fraction of the diagonal removed, 0…1. */
  fraction: number;
  /** x, the cut's distance from the outer corner along the diagonal, m (90° bend). */
  x: number;
  /** Legs of the removed triangle along the outer edges, m (90° bend: 2 M W). */
  leg: number;
  warnings: Warning[];
}

/**
 * Miter of a bend of width W turning by `turnRad` (π/2 for a right-angle bend). `fraction` defaults to the optimal
 * one. For a general turn θ the outer corner of the unmitered bend lies W/(2 cos(θ/2)) from the corner point and the
 * inner corner as far on the other side; the diagonal between them is d = W / cos(θ/2), which is W √2 at 90°.
 * The cut is perpendicular to the diagonal at x = M d from the outer corner; its legs along the outer edges are
 * x / cos((π − θ)/2) = x / sin(θ/2) (→ x √2 = 2 M W at 90°).
 */
export function miterCut(p: { W: number; h: number; er: number; turnRad: number; fraction?: number }): MiterCut {
  const W = requireRange('W', p.W, 0, Infinity, 'a strip width above 0 m', { minExclusive: true });
  const h = requireRange('h', p.h, 0, Infinity, 'a substrate height above 0 m', { minExclusive: true });
  const th = requireRange('turnRad', Math.abs(p.turnRad), 0, Math.PI * 0.75, 'a turn between 0° and 135°', { minExclusive: true });
  const u = W / h;
  const warnings: Warning[] = [];
  let fraction: number;
  if (p.fraction === undefined) {
    fraction = optimalMiterFraction(u);
    const w1 = rangeWarning(MITER_SOURCE, 'W/h', u, 0.25, Infinity); if (w1) warnings.push(w1);
    const w2 = rangeWarning(MITER_SOURCE, 'εr', p.er, 1, 25); if (w2) warnings.push(w2);
    if (Math.abs(th - Math.PI / 2) > 1e-6) warnings.push(warn('validity', `the optimal-miter fit is measured for 90° bends; this bend turns ${(th * 180 / Math.PI).toFixed(1)}°, the same fraction of its diagonal is used`, { source: MITER_SOURCE }));
  } else {
    fraction = requireRange('fraction', p.fraction, 0, 1, 'a miter fraction between 0 and 1', { maxExclusive: true });
  }
  const d = W / Math.cos(th / 2);
  const x = fraction * d;
  return { fraction, x, leg: x / Math.sin(th / 2), warnings };
}
