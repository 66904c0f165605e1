/**
 * Frequency-dependent characteristic impedance Z0(f), power–current definition.
 *
 * Source: R. H. Jansen and M. Kirschning, "Arguments and an accurate model for the power-current formulation of
 * microstrip characteristic impedance", Archiv für Elektronik und Übertragungstechnik (AEÜ), vol. 37, pp. 108–112,
 * 1983, R1…R17 (constants as in the paper). R8 keeps the frequency term inside the exponential: every other
 * frequency term vanishes as fn → 0, and so must this one (the project's own consistency rule).
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

/** 1 − exp(−x) for x ≥ 0: below 1e-3 by its series to x⁵ (remainder below 2e-21 relative), else −expm1(−x). */
function oneMinusExpNeg(x: number): number {
  if (x < 1e-3) return x * (1 - x * (1 / 2 - x * (1 / 6 - x * (1 / 24 - x / 120))));
  return -Math.expm1(-x);
}

/** exp(−x) for small x ≥ 0: below 0.02 by its series to x⁷ (remainder below 1e-18 relative), else Math.exp. */
function expNegSmall(x: number): number {
  if (x < 0.02) return 1 - x * (1 - x * (1 / 2 - x * (1 / 6 - x * (1 / 24 - x * (1 / 120 - x * (1 / 720 - x / 5040))))));
  return Math.exp(-x);
}

// Terms of one variable. The analysis reads them from tables (term-tables.ts); the formulas here are what the tables
// are fitted from, and what the analysis uses outside the tabulated ranges.

/** Above this u, 1 − exp(−R2) (R2 = 0.267·u⁷ > 38) rounds to 1 exactly. */
export const JK_R7_WIDTH_FACTOR_IS_ONE_ABOVE = 2.04;
/**
 * Above this u, R9·exp(−R6) is taken as 0: R9 < 5.086/(0.386·1.2992)·0.1 ≈ 1.01 for any εr and fn, and
 * exp(−R6) < exp(−40) < 4.3e-18 there, below half an ulp of the 0.9408 it is subtracted from.
 */
export const JK_R6_TERM_NEGLIGIBLE_ABOVE = 1.37;

/** R3 = 4.766·exp(−3.228·u^0.641). */
export function jkR3(u: number): number { return 4.766 * Math.exp(-3.228 * Math.pow(u, 0.641)); }
/** 1 − exp(−R2), R2 = 0.267·u⁷ (the width factor of R7). */
export function jkR7WidthFactor(u: number): number { return -Math.expm1(-0.267 * Math.pow(u, 7)); }
/** exp(−R6), R6 = 22.2·u^1.92 (the width factor of R9's term in R14). */
export function jkExpMinusR6(u: number): number { return expNeg(22.2 * Math.pow(u, 1.92)); }
/** 1 − exp(−(u/15)^6) (the width factor of R16). */
export function jkR16WidthFactor(u: number): number { return -Math.expm1(-Math.pow(u / 15, 6)); }
/** (fn/18.365)^2.745 (the frequency factor of R8). */
export function jkR8FrequencyFactor(fn: number): number { return Math.pow(fn / 18.365, 2.745); }
/** (fn/12.3)^1.097 (the frequency factor of R15). */
export function jkR15FrequencyFactor(fn: number): number { return Math.pow(fn / 12.3, 1.097); }
/** exp(−0.026·fn^1.15656) (the frequency factor of R17's exponential without R15). */
export function jkR17FrequencyFactor(fn: number): number { return Math.exp(-0.026 * Math.pow(fn, 1.15656)); }

/** The inputs of jansenKirschningZ0WithTerms (one-variable terms as the functions above give them) and its output. */
export interface JkTerms {
  /** W/h (the thickness-corrected ur in the analysis), εr, ln εe0, εe(f), fn = f·h in GHz·mm, static Z0 in Ω. */
  u: number; er: number; lnEe0: number; eef: number; fn: number; z00: number;
  r3: number; r7Width: number; expMinusR6: number; r16Width: number; r8Freq: number; r15Freq: number; r17Freq: number;
  /** Output: Z0(f), Ω. */
  z0f: number;
}

/** Z0(f), Ω (fn > 0): the paper's formula. */
export function jansenKirschningZ0(u: number, er: number, ee0: number, eef: number, fn: number, z00: number): number {
  const q: JkTerms = {
    u, er, lnEe0: Math.log(ee0), eef, fn, z00,
    r3: jkR3(u), r7Width: jkR7WidthFactor(u), expMinusR6: jkExpMinusR6(u), r16Width: jkR16WidthFactor(u),
    r8Freq: jkR8FrequencyFactor(fn), r15Freq: jkR15FrequencyFactor(fn), r17Freq: jkR17FrequencyFactor(fn), z0f: 0,
  };
  jansenKirschningZ0WithTerms(q);
  return q.z0f;
}

// Terms of εr only and of (εr, fn), remembered for the last values (pure functions of their inputs). Kept in one
// object of number fields rather than module-level `let`s: V8 boxes a double stored in a module variable on every
// write, but updates an object's double field in place.
const m = {
  er: Number.NaN, eR1: 0.5, R4: 0.5, c8: 0.5, R10: 0.5, eTerm: 0.5, er2: 0.5,
  fnEr: Number.NaN, R9: 0.5, R11: 0.5, e17: 0.5,
};

/**
 * Z0(f) from the one-variable terms, into q.z0f. Same formula, grouped by what each part depends on so that sweeps and
 * width searches reuse the rest. Inputs and output travel in one record: a double passed to (or returned from) a call
 * that the compiler does not inline is boxed on the heap, a field of a long-lived record is updated in place.
 */
export function jansenKirschningZ0WithTerms(q: JkTerms): void {
  const u = q.u; const er = q.er; const fn = q.fn;
  let newEr = false;
  if (er !== m.er) {
    m.er = er; newEr = true;
    const lnEr = Math.log(er);
    m.eR1 = expNeg(0.03891 * Math.exp(1.4 * lnEr));            // exp(−R1)
    m.R4 = 0.016 + Math.exp(4.524 * Math.log(0.0514 * er));
    m.c8 = 0.004625 * Math.exp(1.674 * lnEr);                  // 0.004625·εr^1.674 of R8
    m.R10 = 0.00044 * Math.exp(2.136 * lnEr) + 0.0184;
    const e1 = er - 1; const e2 = e1 * e1; const e6 = e2 * e2 * e2;
    m.eTerm = e6 / (1 + 10 * e6);
    m.er2 = er * er;
  }
  if (newEr || fn !== m.fnEr) {
    // Terms of (εr, fn): R9 without exp(−R6), R11, and R17's frequency exponential.
    m.fnEr = fn;
    const a5 = fn / 28.843; const a5_2 = a5 * a5; const a5_4 = a5_2 * a5_2;
    const R5 = a5_4 * a5_4 * a5_4;
    const a11 = fn / 19.47; const a11_2 = a11 * a11; const a11_6 = a11_2 * a11_2 * a11_2;
    m.R11 = a11_6 / (1 + 0.0962 * a11_6);
    const R4 = m.R4;
    m.R9 = ((5.086 * R4 * R5) / (0.3838 + 0.386 * R4)) / (1 + 1.2992 * R5) * m.eTerm;
    m.e17 = q.r17Freq * expNegSmall(0.707 * m.R10 * q.r15Freq); // exp(−0.026·fn^1.15656 − R15)
  }
  const R7 = 1.206 - 0.3144 * m.eR1 * (u > JK_R7_WIDTH_FACTOR_IS_ONE_ABOVE ? 1 : q.r7Width);
  const R8 = 1 + 1.275 * oneMinusExpNeg(q.r3 * m.c8 * q.r8Freq);

  const R13 = 0.9408 * Math.exp(R8 * Math.log(q.eef)) - 0.9603;
  const R14 = (0.9408 - (u > JK_R6_TERM_NEGLIGIBLE_ABOVE ? 0 : m.R9 * q.expMinusR6)) * Math.exp(R8 * q.lnEe0) - 0.9603;
  const R16 = 1 + 0.0503 * m.er2 * m.R11 * q.r16Width;
  const R12overR16 = 1 / ((1 + 0.00245 * u * u) * R16); // R12 = 1/(1 + 0.00245 u²)
  const R17 = R7 * (1 - 1.1241 * R12overR16 * m.e17);
  q.z0f = q.z00 * Math.exp(R17 * Math.log(R13 / R14));
}
