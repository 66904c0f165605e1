/**
 * Frequency-dependent characteristic impedance Z0(f), power–current definition.
 *
 * Source: R. H. Jansen and M. Kirschning, "Arguments and an accurate model for the power-current formulation of
 * microstrip characteristic impedance", Archiv für Elektronik und Übertragungstechnik (AEÜ), vol. 37, pp. 108–112,
 * 1983, R1…R17 (constants as in methods.md §2.2). R8 keeps the frequency term inside the exponential: every other
 * frequency term vanishes as fn → 0, and so must this one (methods.md §12.3 D3).
 * Inputs: u = W_eff/h, εr, εe0 static and εef at f (from kirschning-jansen-1982.ts), fn = f·h in GHz·mm,
 * z00 the static impedance in Ω. Validity (as usually quoted, range to be verified against the paper):
 * 0.1 ≤ u ≤ 10, 1 ≤ εr ≤ 18, fn ≤ 15 GHz·mm.
 *
 *   R1 = 0.03891 εr^1.4        R2 = 0.267 u^7              R3 = 4.766 exp(−3.228 u^0.641)
 *   R4 = 0.016 + (0.0514 εr)^4.524                         R5 = (fn/28.843)^12          R6 = 22.2 u^1.92
 *   R7 = 1.206 − 0.3144 exp(−R1)(1 − exp(−R2))
 *   R8 = 1 + 1.275 (1 − exp(−0.004625 R3 εr^1.674 (fn/18.365)^2.745))
 *   R9 = 5.086 R4 R5/(0.3838 + 0.386 R4) · exp(−R6)/(1 + 1.2992 R5) · (εr − 1)^6/(1 + 10 (εr − 1)^6)
 *   R10 = 0.00044 εr^2.136 + 0.0184    R11 = (fn/19.47)^6/(1 + 0.0962 (fn/19.47)^6)    R12 = 1/(1 + 0.00245 u²)
 *   R13 = 0.9408 εef^R8 − 0.9603       R14 = (0.9408 − R9) εe0^R8 − 0.9603          R15 = 0.707 R10 (fn/12.3)^1.097
 *   R16 = 1 + 0.0503 εr² R11 (1 − exp(−(u/15)^6))
 *   R17 = R7 (1 − 1.1241 (R12/R16) exp(−0.026 fn^1.15656 − R15))
 *   Z0(f) = Z00 (R13/R14)^R17
 * The code groups the terms by what they depend on (εr, fn, u) so that sweeps reuse them; the values are the same.
 */

export const JK1983_RANGE = { uMin: 0.1, uMax: 10, erMax: 18, fnMax: 15 } as const;

/** exp(−x), skipping the call where it underflows to 0 anyway (u⁷ at u = 1000 gives x ≈ 3e20). */
function expNeg(x: number): number {
  return x > 746 ? 0 : Math.exp(-x);
}
const LN_18365 = Math.log(18.365);
const LN_123 = Math.log(12.3);

// Terms of εr only, of fn only, and of both, remembered for the last values (pure functions of their inputs). Kept in
// one object of number fields rather than module-level `let`s: V8 boxes a double stored in a module variable on every
// write, but updates an object's double field in place.
const m = {
  er: Number.NaN, eR1: 0.5, R4: 0.5, er1674: 0.5, R10: 0.5, eTerm: 0.5, er2: 0.5,
  fn: Number.NaN, R5: 0.5, R11: 0.5, fn2745: 0.5, fnEr: Number.NaN, R9: 0.5, e17: 0.5,
  u: Number.NaN, ee0: Number.NaN, R3: 0.5, R7: 0.5, eR6: 0.5, R12: 0.5, w15Term: 0.5, lnEe0: 0.5,
};

/** Z0(f), Ω (fn > 0). */
export function jansenKirschningZ0(u: number, er: number, ee0: number, eef: number, fn: number, z00: number): number {
  return jansenKirschningZ0Ln(u, Math.log(u), er, ee0, eef, fn, Math.log(fn), z00);
}

/** As jansenKirschningZ0, with lnU = ln u and lnFn = ln fn supplied by a caller that already has them. */
export function jansenKirschningZ0Ln(u: number, lnU: number, er: number, ee0: number, eef: number, fn: number, lnFn: number, z00: number): number {
  let newEr = false;
  if (er !== m.er) {
    m.er = er; newEr = true;
    const lnEr = Math.log(er);
    m.eR1 = expNeg(0.03891 * Math.exp(1.4 * lnEr));            // exp(−R1)
    m.R4 = 0.016 + Math.exp(4.524 * Math.log(0.0514 * er));
    m.er1674 = Math.exp(1.674 * lnEr);
    m.R10 = 0.00044 * Math.exp(2.136 * lnEr) + 0.0184;
    const e1 = er - 1; const e2 = e1 * e1; const e6 = e2 * e2 * e2;
    m.eTerm = e6 / (1 + 10 * e6);
    m.er2 = er * er;
  }
  if (fn !== m.fn) {
    m.fn = fn;
    const a5 = fn / 28.843; const a5_2 = a5 * a5; const a5_4 = a5_2 * a5_2;
    m.R5 = a5_4 * a5_4 * a5_4;
    const a11 = fn / 19.47; const a11_2 = a11 * a11; const a11_6 = a11_2 * a11_2 * a11_2;
    m.R11 = a11_6 / (1 + 0.0962 * a11_6);
    m.fn2745 = Math.exp(2.745 * (lnFn - LN_18365));
    m.fnEr = Number.NaN; // the (εr, fn) terms below must be redone
  }
  if (newEr || m.fnEr !== fn) {
    m.fnEr = fn;
    const R4 = m.R4; const R5 = m.R5;
    m.R9 = ((5.086 * R4 * R5) / (0.3838 + 0.386 * R4)) / (1 + 1.2992 * R5) * m.eTerm; // × exp(−R6) per width
    const R15 = 0.707 * m.R10 * Math.exp(1.097 * (lnFn - LN_123));
    m.e17 = Math.exp(-0.026 * Math.exp(1.15656 * lnFn) - R15); // the frequency factor of R17
  }
  if (u !== m.u || ee0 !== m.ee0 || newEr) {
    // Terms of the width (and εe0) only: a frequency sweep of one line reuses them.
    m.u = u; m.ee0 = ee0;
    const u2 = u * u; const u4 = u2 * u2;
    m.R3 = 4.766 * Math.exp(-3.228 * Math.exp(0.641 * lnU));
    // 1 − exp(−R2) with R2 = 0.267·u⁷: above R2 = 38 (u > 2.03) exp(−R2) < 2⁻⁵⁴ and the difference rounds to 1 exactly.
    m.R7 = 1.206 - 0.3144 * m.eR1 * (u > 2.04 ? 1 : 1 - expNeg(0.267 * u4 * u2 * u));
    // exp(−R6) with R6 = 22.2·u^1.92 only enters as R9·exp(−R6) subtracted from 0.9408, and R9 < 5.086/(0.386·1.2992)
    // ·0.1 ≈ 1.01 for any εr and fn; above R6 = 40 (u > 1.37) the product is below 4.4e-18, under half an ulp of 0.9408
    // (5.6e-17), so the difference is 0.9408 exactly: exp(−R6) is taken as 0.
    m.eR6 = u > 1.37 ? 0 : expNeg(22.2 * Math.exp(1.92 * lnU));
    m.R12 = 1 / (1 + 0.00245 * u2);
    const w15 = u / 15; const w15_2 = w15 * w15;
    m.w15Term = 1 - expNeg(w15_2 * w15_2 * w15_2);
    m.lnEe0 = Math.log(ee0);
  }
  const R8 = 1 + 1.275 * (1 - expNeg(0.004625 * m.R3 * m.er1674 * m.fn2745));
  const R13 = 0.9408 * Math.exp(R8 * Math.log(eef)) - 0.9603;
  const R14 = (0.9408 - m.R9 * m.eR6) * Math.exp(R8 * m.lnEe0) - 0.9603;
  const R16 = 1 + 0.0503 * m.er2 * m.R11 * m.w15Term;
  const R17 = m.R7 * (1 - 1.1241 * (m.R12 / R16) * m.e17);
  return z00 * Math.exp(R17 * Math.log(R13 / R14));
}
