/**
 * A second, independent transcription of the junction models for the reference tests — it shares no code with
 * core/discontinuity and is written in a different form:
 *
 * Tee: E. Hammerstad, "Computer-aided design of microstrip couplers with accurate discontinuity models", IEEE MTT-S
 * Int. Microwave Symp. Digest 1981, pp. 54–56, as reproduced in K. C. Gupta, R. Garg, I. Bahl, P. Bhartia,
 * "Microstrip Lines and Slotlines", 2nd ed., Artech House 1996, ch. 3 (T-junction) — written here from memory of
 * that reproduction, in its parallel-plate reading: each line is a parallel-plate guide of width D = η h / Z with
 * η = η0/√εe the wave impedance in the medium, and fp1 = c0 / (2 D1 √εe1) is the cutoff of the main guide's first
 * higher-order mode (the same number as Z1/(2 μ0 h), since η0 = μ0 c0).
 *
 * Step: R. Garg, I. J. Bahl, "Microstrip discontinuities", Int. J. Electronics 45(1), 1978, pp. 81–87 (also Gupta
 * et al. 1996, ch. 3, step in width), in pF/m and nH/m as printed.
 */
const C0 = 299_792_458;
const MU0 = 4e-7 * Math.PI * 1.00000000055; // CODATA 2018 μ0 (about 1.25663706212e-6 H/m)
const ETA0 = MU0 * C0;

export interface OracleTee { D1: number; D2: number; fp1: number; d1: number; d2: number; n2: number }

export function oracleTee(Z1: number, Z2: number, ee1: number, ee2: number, h: number, f: number): OracleTee {
  const D1 = ((ETA0 / Math.sqrt(ee1)) * h) / Z1;
  const D2 = ((ETA0 / Math.sqrt(ee2)) * h) / Z2;
  const fp1 = C0 / (2 * D1 * Math.sqrt(ee1));
  const ratio = Z1 / Z2;
  const ff = (f / fp1) * (f / fp1);
  const d1 = 0.055 * D2 * ratio - 0.11 * D2 * ratio * ratio * ff; // 0.055 D2 r (1 − 2 r F), expanded
  const inner = 0.05 + 0.7 / Math.exp(1.6 * ratio) + 0.25 * ratio * ff - 0.17 * Math.log(ratio);
  const d2 = D1 / 2 - D1 * ratio * inner;
  const offset = 0.5 - d2 / D1;
  const n2 = 1 - Math.PI * ff * (ratio * ratio / 12 + offset * offset);
  return { D1, D2, fp1, d1, d2, n2 };
}

export interface OracleStep { Cs: number; Ls: number; L1: number; L2: number }

/** W1 > W2 (m), h (m), static Z and εe of each side. */
export function oracleStep(W1: number, W2: number, h: number, er: number, Z1: number, Z2: number, ee1: number, ee2: number): OracleStep {
  const k = W1 / W2;
  const lg = Math.log(er) / Math.LN10;
  const cPfPerM = k <= 3.5 ? (10.1 * lg + 2.33) * k - 12.6 * lg - 3.17 : 130 * (Math.log(k) / Math.LN10) - 44;
  const Cs = Math.max(0, cPfPerM) * Math.sqrt(W1 * W2) * 1e-12;
  const lNhPerM = 40.5 * (k - 1) - 75 * (Math.log(k) / Math.LN10) + 0.2 * (k - 1) * (k - 1);
  const Ls = Math.max(0, lNhPerM) * h * 1e-9;
  // Per-length inductances L' = Z √εe / c0 share Ls in proportion.
  const a = Z1 * Math.sqrt(ee1), b = Z2 * Math.sqrt(ee2);
  return { Cs, Ls, L1: (Ls * a) / (a + b), L2: (Ls * b) / (a + b) };
}
