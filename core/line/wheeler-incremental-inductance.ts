/**
 * Conductor loss by Wheeler's incremental-inductance rule applied to the Hammerstad–Jensen air line (default,
 * conductorLoss: 'wheeler-incremental').
 *
 * Sources: H. A. Wheeler, "Formulas for the skin effect", Proc. IRE, vol. 30, no. 9, pp. 412–424, Sept. 1942
 * (the rule); applied to microstrip by R. A. Pucel, D. J. Massé and C. P. Hartwig, "Losses in microstrip", IEEE
 * Trans. MTT, vol. 16, no. 6, pp. 342–350, June 1968 (correction p. 1064, Dec. 1968). Every conductor wall recedes by
 * dn: dW/dn = −2, dt/dn = −2, dh/dn = +2, so with Z0a(W, h, t) = Z01(u1) the air-line impedance (Hammerstad & Jensen 1980, with εr = 1):
 *     αc = Rs/(η0·Z0) · (∂Z0a/∂h − ∂Z0a/∂W − ∂Z0a/∂t)            [Np/m]
 * Z0a depends on W, h, t only through u = W/h and tn = t/h, so with A = ∂u1/∂u and B = ∂u1/∂tn (analytic):
 *     ∂Z0a/∂h − ∂Z0a/∂W − ∂Z0a/∂t = −(Z01'(u1)/h)·((1 + u)·A + (1 + tn)·B)
 * Z0 is the static impedance (quasi-static rule). Requires t > 0 (the sharp edge of a zero-thickness strip has
 * unbounded loss in this rule). Roughness is applied by the caller. Units: Rs Ω, h m, Z0 Ω, result Np/m.
 */
import { ETA0 } from '../units/constants.ts';
import { hjDeltaU1, hjThickness, hjZ01Derivative } from './hammerstad-jensen-1980.ts';

const FOUR_E = 4 * Math.E;

/**
 * The bracket (∂Z0a/∂h − ∂Z0a/∂W − ∂Z0a/∂t)·h, Ω, from the thickness-correction intermediates of eq. (6)
 * (s = √(6.517u), T = tanh s, X = 4e·T²/tn, lnX1 = ln(1 + X)) and slopeU1 = dZ01/du at u1.
 */
export function wheelerBracket(u: number, tn: number, s: number, T: number, X: number, lnX1: number, slopeU1: number): number {
  const r = 1 / (1 + X);
  const A = 1 + (FOUR_E * 6.517 / Math.PI) * ((T * (1 - T * T)) / s) * r;
  const B = (lnX1 - X * r) * (1 / Math.PI);
  return -slopeU1 * ((1 + u) * A + (1 + tn) * B);
}

/**
 * αc, Np/m, without roughness, for u = W/h and tn = t/h > 0; rs surface resistance Ω, h m, z0Static Ω.
 * (The analysis uses wheelerBracket with the intermediates it already has; this form computes them.)
 */
export function wheelerIncrementalAlphaC(u: number, tn: number, h: number, rs: number, z0Static: number): number {
  const du1 = hjDeltaU1(u, tn);
  const { s, T, X, lnX1 } = hjThickness;
  const slope = hjZ01Derivative(u + du1);
  return (rs / (ETA0 * z0Static)) * (wheelerBracket(u, tn, s, T, X, lnX1, slope) / h);
}
