/**
 * Conductor and dielectric loss of the even and odd modes of a coupled microstrip pair.
 *
 * Conductor loss: Wheeler's incremental-inductance rule (H. A. Wheeler, "Formulas for the skin effect", Proc. IRE,
 * vol. 30, no. 9, pp. 412–424, Sept. 1942) applied to each mode's air-filled impedance of the Kirschning–Jansen
 * 1984 static model. Every wall recedes by dn: each strip's width shrinks by 2dn, the gap grows by 2dn, the height
 * grows by 2dn, so with Z(u, g) the mode's air-line impedance
 *     αc,mode ∝ (Rs/(η0·Zmode))·(−(1 + u)·∂Z/∂u + (1 − g)·∂Z/∂g)/h.
 * That static model is for zero thickness, where the strip's edges make the rule's thickness term unbounded; so the
 * mode's loss is taken as the single line's loss at the same width and copper thickness (wheeler-incremental-
 * inductance.ts, which has the thickness term) times the ratio of the mode's zero-thickness value to the single
 * line's zero-thickness value. This ratio form is our own combination: it reduces to the single line as the gap
 * grows, and puts the odd mode's extra loss (current crowding on the inner edges) in through the gap derivative.
 *
 * Dielectric loss: the filling-factor form per mode (J. D. Welch and H. J. Pratt, NEREM Record, vol. 8,
 * pp. 100–101, 1966; Pucel, Massé and Hartwig, IEEE Trans. MTT 16(6), 1968) with the mode's εe(f).
 * Units: u, g dimensionless; impedances Ω; results Np/m.
 */
import { C0, ETA0 } from '../units/constants.ts';
import { hjZ01Derivative } from './hammerstad-jensen-1980.ts';
import { kjQ, kjQTerms } from './kirschning-jansen-1984-coupled.ts';

const REL = 1e-5;

/**
 * The mode-to-single-line ratio of the zero-thickness Wheeler brackets (−(1 + u)·∂Z/∂u + (1 − g)·∂Z/∂g), for the
 * even (lossRatio.even) and odd (lossRatio.odd) modes: ∂/∂u analytic, ∂/∂g by a forward difference (relative step
 * 1e-5; the loss needs three figures). Multiply by Z0single/Z0mode (dielectric line, static) and by the single
 * line's αc. With Z = Z01/(1 − Z01·Q/η0): ∂Z/∂u = (Z01' + Z01²·Q'/η0)/(1 − Z01·Q/η0)².
 */
export const lossRatio = { even: 1, odd: 1 };
/** `z01` is the zero-thickness single line's air impedance Z01(u), Ω (the static model has it already). */
export function coupledLossRatios(u: number, g: number, z01: number): void {
  const dz01 = hjZ01Derivative(u);
  const k = z01 / ETA0;
  kjQTerms(u, g + g * REL);
  const eG = z01 / (1 - k * kjQ.q4), oG = z01 / (1 - k * kjQ.q10);
  kjQTerms(u, g);
  const q4 = kjQ.q4, q10 = kjQ.q10;
  const de = 1 - k * q4, dO = 1 - k * q10;
  const e0 = z01 / de, o0 = z01 / dO;
  const eU = (dz01 + (z01 * z01 * kjQ.dq4du) / ETA0) / (de * de);
  const oU = (dz01 + (z01 * z01 * kjQ.dq10du) / ETA0) / (dO * dO);
  const dg = g * REL;
  const single = -(1 + u) * dz01;
  lossRatio.even = (-(1 + u) * eU + (1 - g) * (eG - e0) / dg) / single;
  lossRatio.odd = (-(1 + u) * oU + (1 - g) * (oG - o0) / dg) / single;
}

/** Filling-factor dielectric loss of a mode, Np/m. */
export function modeAlphaD(f: number, er: number, epsEff: number, tanDelta: number): number {
  if (f === 0 || tanDelta === 0) return 0;
  return (Math.PI * f * er * (epsEff - 1) * tanDelta) / (C0 * Math.sqrt(epsEff) * (er - 1));
}
