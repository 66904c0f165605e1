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
 */

export const JK1983_RANGE = { uMin: 0.1, uMax: 10, erMax: 18, fnMax: 15 } as const;

/** exp(−x) with x clamped at 700 so that huge exponents (u⁷ at u = 1000) stay finite. */
function expNeg(x: number): number {
  return Math.exp(-(x > 700 ? 700 : x));
}

/** Z0(f), Ω. */
export function jansenKirschningZ0(u: number, er: number, ee0: number, eef: number, fn: number, z00: number): number {
  const u2 = u * u; const u4 = u2 * u2;
  const R1 = 0.03891 * Math.pow(er, 1.4);
  const R2 = 0.267 * u4 * u2 * u;
  const R3 = 4.766 * Math.exp(-3.228 * Math.pow(u, 0.641));
  const R4 = 0.016 + Math.pow(0.0514 * er, 4.524);
  const a5 = fn / 28.843; const a5_2 = a5 * a5; const a5_4 = a5_2 * a5_2;
  const R5 = a5_4 * a5_4 * a5_4;
  const R6 = 22.2 * Math.pow(u, 1.92);
  const R7 = 1.206 - 0.3144 * expNeg(R1) * (1 - expNeg(R2));
  const R8 = 1 + 1.275 * (1 - expNeg(0.004625 * R3 * Math.pow(er, 1.674) * Math.pow(fn / 18.365, 2.745)));
  const e1 = er - 1; const e2 = e1 * e1; const e6 = e2 * e2 * e2;
  const R9 = ((5.086 * R4 * R5) / (0.3838 + 0.386 * R4)) * (expNeg(R6) / (1 + 1.2992 * R5)) * (e6 / (1 + 10 * e6));
  const R10 = 0.00044 * Math.pow(er, 2.136) + 0.0184;
  const a11 = fn / 19.47; const a11_2 = a11 * a11; const a11_6 = a11_2 * a11_2 * a11_2;
  const R11 = a11_6 / (1 + 0.0962 * a11_6);
  const R12 = 1 / (1 + 0.00245 * u2);
  const R13 = 0.9408 * Math.pow(eef, R8) - 0.9603;
  const R14 = (0.9408 - R9) * Math.pow(ee0, R8) - 0.9603;
  const R15 = 0.707 * R10 * Math.pow(fn / 12.3, 1.097);
  const w15 = u / 15; const w15_2 = w15 * w15;
  const R16 = 1 + 0.0503 * er * er * R11 * (1 - expNeg(w15_2 * w15_2 * w15_2));
  const R17 = R7 * (1 - 1.1241 * (R12 / R16) * expNeg(0.026 * Math.pow(fn, 1.15656) + R15));
  return z00 * Math.pow(R13 / R14, R17);
}
