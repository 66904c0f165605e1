/**
 * Two-port matrices of a uniform line of length l with constants Zc, γ (D. M. Pozar,
 * Microwave Engineering, 4th ed., Wiley, 2012, §4.4, Table 4.1):
 *   ABCD = [cosh γl, Zc sinh γl; sinh γl / Zc, cosh γl]     (I2 leaving port 2)
 *   S (reference Z0): with Γ = (Zc − Z0)/(Zc + Z0), P = e^(−γl):
 *   S11 = S22 = Γ(1 − P²)/(1 − Γ²P²),  S21 = S12 = P(1 − Γ²)/(1 − Γ²P²).
 */
import { cadd, ccoshSinh, cdiv, cexp, cmul, csub, cscale, type Complex } from './complex.ts';
import type { LineConstants } from './netlist.ts';
import { lineConstantsFrom } from '../line/index.ts';
import type { ModeFigures } from '../line/line-model.ts';
import { InputError } from '../util/errors.ts';

/**
 * Zc and γ of one line mode at f (Hz, > 0) from the line-model interface's figures (core/line/line-model.ts):
 * R' = 2Z0αc, L' = Z0√εe/c0, G' = 2αd/Z0, C' = √εe/(Z0c0), the arithmetic of core/line lineConstants to the last bit.
 */
export function lineConstantsOfMode(m: ModeFigures, f: number): LineConstants {
  if (f === 0) {
    throw new InputError('out-of-range', 'f', 'a frequency above 0 Hz for the line constants', '0', 'at DC a line is its series resistance; use a small frequency');
  }
  const out = { zc: { re: 0, im: 0 }, gamma: { re: 0, im: 0 } };
  lineConstantsFrom(m.z0, m.epsEff, m.alphaC, m.alphaD, f, out);
  return out;
}

/** The same mode without loss: real Zc = Z0(f), γ = jβ(f). */
export function losslessConstantsOfMode(m: ModeFigures): LineConstants {
  return { zc: { re: m.z0, im: 0 }, gamma: { re: 0, im: m.beta } };
}

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
