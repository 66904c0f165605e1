/**
 * Frequency-dependent effective permittivity εe(f).
 *
 * Source: M. Kirschning and R. H. Jansen, "Accurate model for effective dielectric constant of microstrip with
 * validity up to millimetre-wave frequencies", Electronics Letters, vol. 18, no. 6, pp. 272–273, March 1982,
 * eqs. (1)–(2) with P1…P4 (constants as in methods.md §2.1).
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

// Terms that depend only on εr or only on fn are remembered for the last value (sweeps and width searches repeat
// them), in one object of number fields (a double written to a module-level `let` is boxed anew on every write).
const LN_387 = Math.log(38.7);
const m = { er: Number.NaN, P2: 0.5, P4: 0.5, fn: Number.NaN, c1: 0.5, F3: 0.5, u: Number.NaN, eU1: 0.5, eU3: 0.5 };

/** εe(f) from the static εe0 (u dimensionless, er relative permittivity, fn in GHz·mm > 0). */
export function kirschningJansenEpsEff(u: number, er: number, ee0: number, fn: number): number {
  return kirschningJansenEpsEffLn(u, er, ee0, fn, Math.log(fn));
}

/** As kirschningJansenEpsEff, with lnFn = ln fn supplied by a caller that already has it. */
export function kirschningJansenEpsEffLn(u: number, er: number, ee0: number, fn: number, lnFn: number): number {
  if (er !== m.er) {
    m.er = er;
    m.P2 = 0.33622 * (1 - Math.exp(-0.03442 * er));
    const x = er / 15.916; const x2 = x * x; const x4 = x2 * x2;
    m.P4 = 1 + 2.751 * (1 - Math.exp(-(x4 * x4)));
  }
  if (fn !== m.fn) {
    m.fn = fn;
    const d = 1 + 0.0157 * fn;
    const d2 = d * d; const d4 = d2 * d2; const d5 = d4 * d; const d10 = d5 * d5;
    m.c1 = 0.6315 + 0.525 / (d10 * d10);
    m.F3 = 1 - Math.exp(-Math.exp(4.97 * (lnFn - LN_387)));
  }
  if (u !== m.u) { // width-only terms
    m.u = u;
    // Above u = 4.1, 0.065683·exp(−8.7513u) < 1.8e-17 is below half an ulp (2.2e-16) of 0.27488 + c1·u (≥ 2.86 as
    // c1 > 0.63): subtracting it leaves P1 unchanged, so it is taken as 0 without the exp.
    m.eU1 = u > 4.1 ? 0 : 0.065683 * Math.exp(-8.7513 * u);
    m.eU3 = 0.0363 * Math.exp(-4.6 * u);
  }
  const P1 = 0.27488 + m.c1 * u - m.eU1;
  const P3 = m.eU3 * m.F3;
  const P = P1 * m.P2 * Math.exp(1.5763 * Math.log((0.1844 + P3 * m.P4) * fn));
  return er - (er - ee0) / (1 + P);
}
