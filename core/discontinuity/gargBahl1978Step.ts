/**
 * Width step: shunt capacitance and series inductance (curve fits), as a T of L1 – Cs – L2 at the step.
 *
 * Source: R. Garg and I. J. Bahl, "Microstrip discontinuities", International Journal of Electronics, vol. 45,
 * no. 1, pp. 81–87, 1978; reproduced in K. C. Gupta, R. Garg, I. Bahl, P. Bhartia, "Microstrip Lines and
 * Slotlines", 2nd ed., Artech House, 1996 (chapter 3, step in width). W1 > W2:
 *   Cs/√(W1 W2) [pF/m] = (10.1 log10 er + 2.33) W1/W2 − 12.6 log10 er − 3.17     (er ≤ 10, 1.5 ≤ W1/W2 ≤ 3.5)
 *   Cs/√(W1 W2) [pF/m] = 130 log10(W1/W2) − 44                                    (er = 9.6, 3.5 ≤ W1/W2 ≤ 10)
 *   Ls/h [nH/m] = 40.5 (W1/W2 − 1) − 75 log10(W1/W2) + 0.2 (W1/W2 − 1)²            (W1/W2 ≤ 5)
 *   L1 = Ls Lw1/(Lw1 + Lw2), L2 = Ls Lw2/(Lw1 + Lw2), Lwi = Z0i √ee_i / c0 (per-length inductances)
 * Units: W, h in m, Z in Ω (static, as the per-length inductances are quasi-static); results in F and H.
 * Stated accuracy: C within about 10 %, L within about 5 %.
 *
 * "Within validity": each part is used only inside its own fit range. `cValid` / `lValid` say whether the
 * capacitance / inductance fit holds for this step; outside, that part is left out of the network (not
 * extrapolated) and a validity warning says so. Below W1/W2 = 1.5 the capacitance fit even turns negative.
 */
import { warn, type Warning } from '../util/warnings.ts';
import { rangeWarning } from './validity.ts';

export const STEP_SOURCE = 'garg-bahl-1978-step';
export const STEP_CITATION = 'Garg, Bahl, Int. J. Electronics 45(1), 1978, pp. 81–87 (also Gupta, Garg, Bahl, Bhartia 1996, ch. 3)';
const C0 = 299_792_458;

export interface StepModel {
  Cs: number; Ls: number; L1: number; L2: number;
  /** The capacitance fit holds for this step (else Cs is left out of the network). */
  cValid: boolean;
  /** The inductance fit holds for this step (else Ls is left out of the network). */
  lValid: boolean;
  warnings: Warning[];
}

/** Side 1 is the wide side. */
export function widthStep(p: { W1: number; W2: number; h: number; er: number; z1: number; z2: number; ee1: number; ee2: number }): StepModel {
  const { W1, W2, h, er } = p;
  const ratio = W1 / W2;
  const warnings: Warning[] = [];
  let cPerM: number;
  let cValid: boolean;
  if (ratio <= 3.5) {
    cPerM = (10.1 * Math.log10(er) + 2.33) * ratio - 12.6 * Math.log10(er) - 3.17;
    const w = rangeWarning(STEP_SOURCE, 'W1/W2 (capacitance)', ratio, 1.5, 3.5); if (w) warnings.push(w);
    const w2 = rangeWarning(STEP_SOURCE, 'εr (capacitance)', er, 1, 10); if (w2) warnings.push(w2);
    cValid = !w && !w2;
  } else {
    cPerM = 130 * Math.log10(ratio) - 44;
    const off = Math.abs(er - 9.6) > 0.5;
    if (off) warnings.push(warn('validity', `the wide-ratio step capacitance fit is for εr = 9.6 (here ${er})`, { source: STEP_SOURCE }));
    const w = rangeWarning(STEP_SOURCE, 'W1/W2 (capacitance)', ratio, 3.5, 10); if (w) warnings.push(w);
    cValid = !off && !w;
  }
  const Cs = Math.max(0, cPerM) * 1e-12 * Math.sqrt(W1 * W2);
  const lPerM = 40.5 * (ratio - 1) - 75 * Math.log10(ratio) + 0.2 * (ratio - 1) ** 2;
  const Ls = Math.max(0, lPerM) * 1e-9 * h;
  const wl = rangeWarning(STEP_SOURCE, 'W1/W2 (inductance)', ratio, 1, 5); if (wl) warnings.push(wl);
  const Lw1 = (p.z1 * Math.sqrt(p.ee1)) / C0, Lw2 = (p.z2 * Math.sqrt(p.ee2)) / C0;
  return { Cs, Ls, L1: (Ls * Lw1) / (Lw1 + Lw2), L2: (Ls * Lw2) / (Lw1 + Lw2), cValid, lValid: !wl, warnings };
}
