/**
 * Quasi-static microstrip: characteristic impedance and effective permittivity with the strip-thickness correction.
 *
 * Source: E. Hammerstad and Ø. Jensen, "Accurate models for microstrip computer-aided design", IEEE MTT-S
 * International Microwave Symposium Digest, 1980, pp. 407–409 — eqs. (1)–(2) air line Z01(u) with f(u),
 * eqs. (3)–(5) εe(u, εr) with a(u), b(εr), eqs. (6)–(8) thickness correction Δu1, Δur (paper form, t normalised to h).
 * Symbols as in the paper: u = W/h, tn = t/h, Z01 the air-filled line, ee the effective permittivity.
 *
 * Validity and accuracy (as reported by the authors): Z01 better than 0.01 % for u ≤ 1 and 0.03 % for u ≤ 1000;
 * εe better than 0.2 % for εr ≤ 128 and 0.01 ≤ u ≤ 100. No bound is stated for the thickness correction; a 2-D
 * field-solver check agrees within 1 % for t/h ≤ 0.28 (the project's own check).
 * Units: u, tn, εr dimensionless; impedances in Ω.
 */
import { ETA0 } from '../units/constants.ts';

const TWO_PI = 2 * Math.PI;
const E = Math.E;
const LN_30666 = Math.log(30.666);
const Z_SCALE = ETA0 / TWO_PI;

// Powers are written as exp(k·ln x) (same value to ~1e-15, about twice as fast as Math.pow here).

/** Air-filled, zero-thickness line impedance Z01(u), Ω — eq. (1), with f(u) = 6 + (2π − 6)·exp(−(30.666/u)^0.7528). */
export function hjZ01(u: number): number {
  const lnU = Math.log(u);
  const f = 6 + (TWO_PI - 6) * Math.exp(-Math.exp(0.7528 * (LN_30666 - lnU)));
  return Z_SCALE * Math.log(f / u + Math.sqrt(1 + 4 / (u * u)));
}

/** dZ01/du, Ω — analytic derivative of eq. (1) (used by Wheeler's rule). */
export function hjZ01Derivative(u: number): number {
  const q = Math.exp(0.7528 * (LN_30666 - Math.log(u)));
  const eq = Math.exp(-q);
  const f = 6 + (TWO_PI - 6) * eq;
  const df = (TWO_PI - 6) * eq * 0.7528 * q / u;
  const r = Math.sqrt(1 + 4 / (u * u));
  return Z_SCALE * (df / u - f / (u * u) - 4 / (u * u * u * r)) / (f / u + r);
}

// Substrate-only terms remembered for the last εr, as number fields of one object (V8 boxes a double written to a
// module-level `let` on every write, and updates an object's double field in place).
const m = { bEr: Number.NaN, bVal: 0.5, cEr: Number.NaN, cVal: 0.5 };

/** b(εr) of eq. (5), remembered for the last εr (substrate-only term). */
function bOf(er: number): number {
  if (er !== m.bEr) { m.bEr = er; m.bVal = 0.564 * Math.exp(0.053 * Math.log((er - 0.9) / (er + 3))); }
  return m.bVal;
}

/**
 * The width part of eq. (3)'s exponent, a(u)·ln(1 + 10/u) (eq. 4), so that εe = (εr + 1)/2 + ((εr − 1)/2)·
 * exp(−a(u)·b(εr)·ln(1 + 10/u)). A function of u alone: the analysis reads it from a table (term-tables.ts).
 */
export function hjEpsEffExponent(u: number): number {
  const u2 = u * u;
  const u4 = u2 * u2;
  const a = 1 + Math.log((u4 + u2 / 2704) / (u4 + 0.432)) / 49 + Math.log(1 + (u * u2) / 5929.741) / 18.7;
  return a * Math.log(1 + 10 / u);
}

/** εe of eq. (3) from the width exponent of hjEpsEffExponent. */
export function hjEpsEffFromExponent(exponent: number, er: number): number {
  if (er !== m.bEr) bOf(er); // remembered in m.bVal; read as a field, not a returned (boxed) double
  return (er + 1) / 2 + ((er - 1) / 2) * Math.exp(-exponent * m.bVal);
}

/** Effective permittivity εe(u, εr) of the zero-thickness line — eqs. (3)–(5). */
export function hjEpsEff(u: number, er: number): number {
  return hjEpsEffFromExponent(hjEpsEffExponent(u), er);
}

/** Intermediate values of the thickness correction, kept for Wheeler's rule (eq. 6: s = √(6.517u), T = tanh s), and
 * Δu1 itself; filled by hjThicknessTerms. */
export const hjThickness = { s: 0, T: 0, X: 0, lnX1: 0, du1: 0 };

/** Fills hjThickness for u and normalised thickness tn (all 0 when tn = 0). A void function: hot callers read the
 * fields, which avoids boxing a returned double. */
export function hjThicknessTerms(u: number, tn: number): void {
  if (tn <= 0) { hjThickness.du1 = 0; return; }
  const s = Math.sqrt(6.517 * u);
  hjThickness.s = s;
  hjThickness.T = s > 20 ? 1 : 1 - 2 / (Math.exp(2 * s) + 1); // tanh s
  hjThicknessFromFields(tn);
}

/** The rest of eq. (6) from hjThickness.s and hjThickness.T already set (tn > 0): the hot path's form, whose only
 * argument is tn (a double argument to a call that is not inlined is boxed on the heap). */
export function hjThicknessFromFields(tn: number): void {
  const T = hjThickness.T;
  const X = (4 * E * T * T) / tn;
  const lnX1 = Math.log(1 + X);
  hjThickness.X = X; hjThickness.lnX1 = lnX1;
  hjThickness.du1 = (tn / Math.PI) * lnX1;
}

/** Δu1 of eq. (6): the air line's width increment for normalised thickness tn (0 when tn = 0). */
export function hjDeltaU1(u: number, tn: number): number {
  hjThicknessTerms(u, tn);
  return hjThickness.du1;
}

/** Δur of eq. (7): the dielectric line's width increment (its εr factor remembered for the last εr). */
export function hjDeltaUr(du1: number, er: number): number {
  return hjDeltaUrFactor(er) * du1;
}

/** Δur/Δu1 = (1 + sech √(εr − 1))/2 of eq. (7), remembered for the last εr. */
export function hjDeltaUrFactor(er: number): number {
  if (er !== m.cEr) { m.cEr = er; m.cVal = 0.5 * (1 + 1 / Math.cosh(Math.sqrt(er - 1))); }
  return m.cVal;
}

/** Static result of the model. */
export interface HjStatic {
  /** Characteristic impedance, Ω. */
  z0: number;
  /** Effective permittivity. */
  epsEff: number;
  /** u1 = u + Δu1 (air line) and ur = u + Δur (dielectric line). */
  u1: number;
  ur: number;
}

/**
 * Z0 and εe with the thickness correction (eq. 8): Z0 = Z01(ur)/√εe(ur), εe = εe(ur)·(Z01(u1)/Z01(ur))².
 * Note Z0·√εe = Z01(u1): the air line uses u1. For speed, callers in the hot path use the scalar pieces directly.
 */
export function hammerstadJensenStatic(u: number, tn: number, er: number): HjStatic {
  const du1 = hjDeltaU1(u, tn);
  const u1 = u + du1;
  const ur = u + hjDeltaUr(du1, er);
  const z01r = hjZ01(ur);
  const eer = hjEpsEff(ur, er);
  const z0 = z01r / Math.sqrt(eer);
  const ratio = du1 === 0 ? 1 : hjZ01(u1) / z01r;
  return { z0, epsEff: eer * ratio * ratio, u1, ur };
}
