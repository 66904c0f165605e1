/**
 * Frequency-dependent effective permittivity εe(f).
 *
 * Source: M. Kirschning and R. H. Jansen, "Accurate model for effective dielectric constant of microstrip with
 * validity up to millimetre-wave frequencies", Electronics Letters, vol. 18, no. 6, pp. 272–273, March 1982,
 * eqs. (1)–(2) with P1…P4 (constants as in the paper).
 *   P1 = 0.27488 + (0.6315 + 0.525/(1 + 0.0157 fn)^20) u − 0.065683 exp(−8.7513 u)
 *   P2 = 0.33622 (1 − exp(−0.03442 εr)),  P3 = 0.0363 exp(−4.6 u)(1 − exp(−(fn/38.7)^4.97))
 *   P4 = 1 + 2.751 (1 − exp(−(εr/15.916)^8)),  P = P1 P2 ((0.1844 + P3 P4) fn)^1.5763
 *   εe(f) = εr − (εr − εe0)/(1 + P)
 * fn = f·h in GHz·mm. u = W_eff/h (ur of the thickness correction; the paper is for t = 0, this is the usual
 * extension). Validity (as usually quoted): 0.1 ≤ u ≤ 100, 1 ≤ εr ≤ 20, h/λ0 ≤ 0.13 (fn ≤ 38.97 GHz·mm);
 * accuracy better than 0.6 % against the authors' full-wave data.
 */

/** KJ validity bounds. */
export const KJ1982_RANGE = { uMin: 0.1, uMax: 100, erMax: 20, fnMax: 0.13 * 299.792458 } as const;

// Terms of one variable. The analysis reads them from tables (term-tables.ts) and the formula here is what the tables
// are fitted from; 1 − exp(−x) is written −expm1(−x), the same quantity without the cancellation.

/**
 * Above this u the P1 width term is taken as 0: 0.065683·exp(−8.7513u) < 1.8e-17 there, below half an ulp (2.2e-16)
 * of 0.27488 + c1·u (≥ 2.86 as c1 > 0.63), so subtracting it leaves P1 unchanged.
 */
export const KJ_P1_WIDTH_TERM_NEGLIGIBLE_ABOVE = 4.1;

/** 0.065683·exp(−8.7513u), the width term of P1. */
export function kjP1WidthTerm(u: number): number { return 0.065683 * Math.exp(-8.7513 * u); }
/** 0.0363·exp(−4.6u), the width factor of P3. */
export function kjP3WidthTerm(u: number): number { return 0.0363 * Math.exp(-4.6 * u); }
/** 1 − exp(−(fn/38.7)^4.97), the frequency factor of P3. */
export function kjP3FrequencyFactor(fn: number): number { return -Math.expm1(-Math.pow(fn / 38.7, 4.97)); }
/** fn^1.5763, the frequency factor of P. */
export function kjFnPower(fn: number): number { return Math.pow(fn, 1.5763); }

/** The inputs of kirschningJansenEpsEffWithTerms (one-variable terms as the functions above give them) and its output. */
export interface KjTerms {
  /** W/h (the thickness-corrected ur in the analysis), εr, static εe0, fn = f·h in GHz·mm. */
  u: number; er: number; ee0: number; fn: number;
  p1Width: number; p3Width: number; p3Freq: number; fnPower: number;
  /** Output: εe(f). */
  eef: number;
}

/** εe(f) from the static εe0 (u dimensionless, er relative permittivity, fn in GHz·mm > 0): the paper's formula. */
export function kirschningJansenEpsEff(u: number, er: number, ee0: number, fn: number): number {
  const q: KjTerms = { u, er, ee0, fn, p1Width: kjP1WidthTerm(u), p3Width: kjP3WidthTerm(u), p3Freq: kjP3FrequencyFactor(fn), fnPower: kjFnPower(fn), eef: 0 };
  kirschningJansenEpsEffWithTerms(q);
  return q.eef;
}

// Terms of εr alone, remembered for the last εr (number fields of one object: V8 boxes a double written to a
// module-level `let` on every write, and updates an object's double field in place).
const m = { er: Number.NaN, P2: 0.5, P4: 0.5 };
const K0 = Math.pow(0.1844, 1.5763);
const A = 1.5763;
// Binomial coefficients of (1 + w)^1.5763 for the short series below.
const B1 = A; const B2 = (B1 * (A - 1)) / 2; const B3 = (B2 * (A - 2)) / 3; const B4 = (B3 * (A - 3)) / 4; const B5 = (B4 * (A - 4)) / 5;

/**
 * εe(f) from the one-variable terms (as the functions above give them): P = P1·P2·fn^1.5763·(0.1844 + P3·P4)^1.5763,
 * the paper's ((0.1844 + P3·P4)·fn)^1.5763 split in two. With w = P3·P4/0.1844 below 1e-3 (f·h below about
 * 9 GHz·mm) the second factor is 0.1844^1.5763·(1 + w)^1.5763 by its binomial series to w⁵ (remainder < 1e-18).
 * Into q.eef; inputs and output in one record (a double passed to a call that is not inlined is boxed on the heap).
 */
export function kirschningJansenEpsEffWithTerms(q: KjTerms): void {
  const u = q.u; const er = q.er; const fn = q.fn;
  if (er !== m.er) {
    m.er = er;
    m.P2 = 0.33622 * (1 - Math.exp(-0.03442 * er));
    const x = er / 15.916; const x2 = x * x; const x4 = x2 * x2;
    m.P4 = 1 + 2.751 * (1 - Math.exp(-(x4 * x4)));
  }
  const c1 = 0.6315 + 0.525 / pow20(1 + 0.0157 * fn);
  const P1 = 0.27488 + c1 * u - (u > KJ_P1_WIDTH_TERM_NEGLIGIBLE_ABOVE ? 0 : q.p1Width);
  const z = q.p3Width * q.p3Freq * m.P4;
  const w = z / 0.1844;
  const tail = w < 1e-3 ? K0 * (1 + w * (B1 + w * (B2 + w * (B3 + w * (B4 + w * B5))))) : Math.exp(A * Math.log(0.1844 + z));
  const P = P1 * m.P2 * q.fnPower * tail;
  q.eef = er - (er - q.ee0) / (1 + P);
}

function pow20(d: number): number {
  const d2 = d * d; const d4 = d2 * d2; const d5 = d4 * d; const d10 = d5 * d5;
  return d10 * d10;
}
