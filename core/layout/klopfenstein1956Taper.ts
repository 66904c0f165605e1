/**
 * Klopfenstein impedance taper (optimum Chebyshev-like taper for a given length).
 *
 * Source: R. W. Klopfenstein, "A transmission line taper of improved design", Proc. IRE, vol. 44, no. 1,
 * pp. 31–35, Jan. 1956:
 *   Γ0 = ½ ln(ZL/Z0),  A = arccosh(Γ0/Γm)
 *   ln Z(z) = ½ ln(Z0 ZL) + (Γ0/cosh A) A² φ(2z/L − 1, A),   0 ≤ z ≤ L
 *   φ(x, A) = ∫0^x I1(A √(1 − y²)) / (A √(1 − y²)) dy,  |x| ≤ 1
 *   |Γ| = Γ0 |cos √((βL)² − A²)| / cosh A  (≤ Γm for βL ≥ A)
 * φ by the rapidly converging series of C. Grossberg, "Extremely rapid computation of the Klopfenstein impedance
 * taper", Proc. IEEE, vol. 56, no. 9, pp. 1629–1630, Sept. 1968:
 *   φ(x, A) = Σ a_k b_k,  a_0 = 1, a_k = a_{k−1} (A²/4)/(k (k+1));  b_0 = x/2, b_k = ((x/2)(1 − x²)^k + 2k b_{k−1})/(2k + 1)
 * The ends carry small steps (ln Z jumps by Γm there), as in the paper.
 * Units: impedances in Ω, Γm as a magnitude (0 < Γm < |Γ0|); z/L dimensionless.
 */
import { InputError, requireRange } from '../util/errors.ts';

export const KLOPFENSTEIN_SOURCE = 'klopfenstein-1956';

export function grossbergPhi(x: number, A: number): number {
  const q = (A * A) / 4;
  let a = 1, b = x / 2, sum = a * b;
  const s = 1 - x * x;
  let sk = 1;
  for (let k = 1; k < 200; k++) {
    a = (a * q) / (k * (k + 1));
    sk *= s;
    b = ((x / 2) * sk + 2 * k * b) / (2 * k + 1);
    const term = a * b;
    sum += term;
    if (Math.abs(term) < 1e-16 * Math.max(1e-300, Math.abs(sum))) break;
  }
  return sum;
}

export interface KlopfensteinProfile {
  A: number;
  gamma0: number;
  /** Z at a fraction 0…1 of the taper length, Ω. */
  z(frac: number): number;
  /** Shortest length for |Γ| ≤ Γm: βL ≥ A, i.e. L = A/β at the lowest frequency. */
  minBetaL: number;
}

export function klopfensteinProfile(z0: number, zl: number, gammaM: number): KlopfensteinProfile {
  requireRange('z0', z0, 0, Infinity, 'an impedance above 0 Ω', { minExclusive: true });
  requireRange('zl', zl, 0, Infinity, 'an impedance above 0 Ω', { minExclusive: true });
  const gamma0 = 0.5 * Math.log(zl / z0);
  requireRange('rippleDb', gammaM, 0, Infinity, 'a ripple reflection above 0', { minExclusive: true });
  if (gammaM >= Math.abs(gamma0)) {
    throw new InputError('out-of-range', 'rippleDb', `a pass-band ripple below the reflection of the bare step (|Γ0| = ${Math.abs(gamma0).toFixed(4)})`, String(gammaM), 'lower the ripple or use a straight line: the impedances are too close for a taper');
  }
  const A = Math.acosh(Math.abs(gamma0) / gammaM);
  const mid = 0.5 * Math.log(z0 * zl);
  const k = (gamma0 / Math.cosh(A)) * A * A;
  return { A, gamma0, minBetaL: A, z: (frac) => Math.exp(mid + k * grossbergPhi(2 * frac - 1, A)) };
}
