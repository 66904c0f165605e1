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

// Terms of εr only, of fn only, and of both, remembered for the last values (pure functions of their inputs).
let mEr = Number.NaN; let eR1 = 0; let R4 = 0; let er1674 = 0; let R10 = 0; let eTerm = 0; let er2 = 0;
let mFn = Number.NaN; let lnFn = 0; let R5 = 0; let R11 = 0; let fn2745 = 0; let mFnEr = Number.NaN;
let R9 = 0; let e17 = 0;
let mU = Number.NaN; let mEe0 = Number.NaN; let R3 = 0; let R7 = 0; let eR6 = 0; let R12 = 0; let w15Term = 0; let lnEe0 = 0;

/** Z0(f), Ω (fn > 0). */
export function jansenKirschningZ0(u: number, er: number, ee0: number, eef: number, fn: number, z00: number): number {
  let newEr = false;
  if (er !== mEr) {
    mEr = er; newEr = true;
    eR1 = expNeg(0.03891 * Math.exp(1.4 * Math.log(er)));            // exp(−R1)
    R4 = 0.016 + Math.exp(4.524 * Math.log(0.0514 * er));
    er1674 = Math.exp(1.674 * Math.log(er));
    R10 = 0.00044 * Math.exp(2.136 * Math.log(er)) + 0.0184;
    const e1 = er - 1; const e2 = e1 * e1; const e6 = e2 * e2 * e2;
    eTerm = e6 / (1 + 10 * e6);
    er2 = er * er;
  }
  if (fn !== mFn) {
    mFn = fn;
    lnFn = Math.log(fn);
    const a5 = fn / 28.843; const a5_2 = a5 * a5; const a5_4 = a5_2 * a5_2;
    R5 = a5_4 * a5_4 * a5_4;
    const a11 = fn / 19.47; const a11_2 = a11 * a11; const a11_6 = a11_2 * a11_2 * a11_2;
    R11 = a11_6 / (1 + 0.0962 * a11_6);
    fn2745 = Math.exp(2.745 * (lnFn - LN_18365));
    mFnEr = Number.NaN; // the (εr, fn) terms below must be redone
  }
  if (newEr || mFnEr !== mFn) {
    mFnEr = mFn;
    R9 = ((5.086 * R4 * R5) / (0.3838 + 0.386 * R4)) / (1 + 1.2992 * R5) * eTerm; // × exp(−R6) per width
    const R15 = 0.707 * R10 * Math.exp(1.097 * (lnFn - LN_123));
    e17 = Math.exp(-0.026 * Math.exp(1.15656 * lnFn) - R15); // the frequency factor of R17
  }
  if (u !== mU || ee0 !== mEe0 || newEr) {
    // Terms of the width (and εe0) only: a frequency sweep of one line reuses them.
    mU = u; mEe0 = ee0;
    const lnU = Math.log(u);
    const u2 = u * u; const u4 = u2 * u2;
    const R2 = 0.267 * u4 * u2 * u;
    R3 = 4.766 * Math.exp(-3.228 * Math.exp(0.641 * lnU));
    const R6 = 22.2 * Math.exp(1.92 * lnU);
    R7 = 1.206 - 0.3144 * eR1 * (1 - expNeg(R2));
    eR6 = expNeg(R6);
    R12 = 1 / (1 + 0.00245 * u2);
    const w15 = u / 15; const w15_2 = w15 * w15;
    w15Term = 1 - expNeg(w15_2 * w15_2 * w15_2);
    lnEe0 = Math.log(ee0);
  }
  const R8 = 1 + 1.275 * (1 - expNeg(0.004625 * R3 * er1674 * fn2745));
  const R13 = 0.9408 * Math.exp(R8 * Math.log(eef)) - 0.9603;
  const R14 = (0.9408 - R9 * eR6) * Math.exp(R8 * lnEe0) - 0.9603;
  const R16 = 1 + 0.0503 * er2 * R11 * w15Term;
  const R17 = R7 * (1 - 1.1241 * (R12 / R16) * e17);
  return z00 * Math.exp(R17 * Math.log(R13 / R14));
}
