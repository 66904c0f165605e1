/**
 * Two-port matrices of a uniform line of length l with constants Zc, γ (D. M. Pozar,
 * Microwave Engineering, 4th ed., §4.4, Table 4.1):
 *   ABCD = [cosh γl, Zc sinh γl; sinh γl / Zc, cosh γl]     (I2 leaving port 2)
 *   S (reference Z0): with Γ = (Zc − Z0)/(Zc + Z0), P = e^(−γl):
 *   S11 = S22 = Γ(1 − P²)/(1 − Γ²P²),  S21 = S12 = P(1 − Γ²)/(1 − Γ²P²).
 */
import { cadd, ccoshSinh, cdiv, cexp, cmul, csub, cscale, type Complex } from './complex.ts';
import type { LineConstants } from './netlist.ts';

export function lineAbcd(c: LineConstants, length: number): { A: Complex; B: Complex; C: Complex; D: Complex } {
  const { cosh, sinh } = ccoshSinh(cscale(c.gamma, length));
  return { A: cosh, B: cmul(c.zc, sinh), C: cdiv(sinh, c.zc), D: cosh };
}

/** S11, S21 (= S12), S22 (= S11) of the line for a real reference z0. */
export function lineS(c: LineConstants, length: number, z0: number): { s11: Complex; s21: Complex } {
  const g = cdiv(csub(c.zc, { re: z0, im: 0 }), cadd(c.zc, { re: z0, im: 0 }));
  const p = cexp(cscale(c.gamma, -length));
  const p2 = cmul(p, p), g2 = cmul(g, g);
  const den = csub({ re: 1, im: 0 }, cmul(g2, p2));
  return {
    s11: cdiv(cmul(g, csub({ re: 1, im: 0 }, p2)), den),
    s21: cdiv(cmul(p, csub({ re: 1, im: 0 }, g2)), den),
  };
}
