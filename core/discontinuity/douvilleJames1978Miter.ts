/**
 * Optimal miter of a symmetric 90° microstrip bend.
 *
 * Source: R. J. P. Douville and D. S. James, "Experimental study of symmetric microstrip bends and their
 * compensation", IEEE Trans. MTT, vol. 26, no. 3, pp. 175–182, March 1978.
 *   M = 52 + 65 exp(−1.35 W/h)  [percent],  M = x/d,  d = W √2 (the bend's diagonal)
 *   x = distance from the outer corner of the unmitered bend to the cut, along the diagonal
 *   the cut removes a right triangle whose legs along the two outer edges are x √2 = 2 M W.
 * Validity: W/h ≥ 0.25, er ≤ 25 (measurement-based, low frequency), 90° bends only.
 * Other angles (our own rule, not from the paper; a validity warning says so): the cut depth follows the corner's
 * protrusion beyond the chord of the outer edges, (W/2)·sin²(θ/2)/cos(θ/2), scaled so that it equals Douville–James
 * at 90°: x(θ) = 2·M·W·sin²(θ/2)/cos(θ/2). It vanishes for a straight run, as it must; the same fraction of the
 * diagonal (x = M·W/cos(θ/2)) would notch a nearly straight line by more than half its width.
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
  /** x, the cut's distance from the outer corner along the diagonal, m. */
  x: number;
  /** Legs of the removed triangle along the outer edges, m (90° bend: 2 M W). */
  leg: number;
  warnings: Warning[];
}

/**
 * Miter of a bend of width W turning by `turnRad` (π/2 for a right-angle bend). `fraction` (M, as a fraction of the
 * diagonal of a 90° bend) defaults to the optimal one. For a turn θ the outer corner of the unmitered bend lies
 * W/(2 cos(θ/2)) from the corner point and the inner corner as far on the other side (diagonal d = W/cos(θ/2),
 * W √2 at 90°). The cut is perpendicular to the diagonal at x = 2 M W sin²(θ/2)/cos(θ/2) from the outer corner
 * (= M d at 90°; see above for other angles); its legs along the outer edges are x / sin(θ/2) (→ 2 M W at 90°).
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
    if (Math.abs(th - Math.PI / 2) > 1e-6) warnings.push(warn('validity', `the optimal-miter fit is measured for 90° bends; this bend turns ${(th * 180 / Math.PI).toFixed(1)}°, so its cut is scaled with the corner (our own rule, equal to the fit at 90°)`, { source: MITER_SOURCE }));
  } else {
    fraction = requireRange('fraction', p.fraction, 0, 1, 'a miter fraction between 0 and 1', { maxExclusive: true });
  }
  const half = th / 2;
  const x = (2 * fraction * W * Math.sin(half) ** 2) / Math.cos(half);
  return { fraction, x, leg: x / Math.sin(half), warnings };
}
