/**
 * Four-port admittance matrix of a uniform coupled pair of lines from its even and odd modes.
 *
 * Each mode is a uniform line with its own Zc and γ (from Z0, εe, αc, αd of the mode through R', L', G', C' as for
 * a single line, methods of D. M. Pozar, Microwave Engineering, 4th ed., 2012, §2.7), whose two-port admittances are
 * y11 = coth(γl)/Zc and y12 = −csch(γl)/Zc. A symmetric pair driven with strip voltages splits into the two modes
 * (even = half sum, odd = half difference), so with terminals ordered [1 = strip 1 near end, 2 = strip 1 far end,
 * 3 = strip 2 near end, 4 = strip 2 far end]:
 *     Y11 = Y22 = Y33 = Y44 = (y11e + y11o)/2     Y13 = Y24 = (y11e − y11o)/2
 *     Y12 = Y34 = (y12e + y12o)/2                 Y14 = Y23 = (y12e − y12o)/2
 * (the even/odd decomposition of a symmetric four-port: J. Reed and G. J. Wheeler, "A method of analysis of
 * symmetrical four-port networks", IRE Trans. MTT, vol. 4, no. 4, pp. 246–252, Oct. 1956; the coupled-line form as in
 * Pozar §7.6). Output: 4×4 row-major, interleaved re/im, S.
 */
import type { Complex } from './complex.ts';
import { C0 } from '../units/constants.ts';
import type { CoupledModeName, ModalFigures } from '../line/line-model.ts';

/** Zc and γ of one mode from its Z0 (Ω), εe, αc and αd (Np/m) at f (Hz): R' = 2Z0αc, L' = Z0√εe/c0, G' = 2αd/Z0, C' = √εe/(Z0 c0). */
export function modeConstants(z0: number, epsEff: number, alphaC: number, alphaD: number, f: number): { zc: Complex; gamma: Complex } {
  const w = 2 * Math.PI * f;
  const sq = Math.sqrt(epsEff);
  const zr = 2 * z0 * alphaC, zi = (w * z0 * sq) / C0;
  const yr = (2 * alphaD) / z0, yi = (w * sq) / (z0 * C0);
  const gamma = csqrt(zr * yr - zi * yi, zr * yi + zi * yr);
  const d = yr * yr + yi * yi;
  const zc = csqrt((zr * yr + zi * yi) / d, (zi * yr - zr * yi) / d);
  return { zc, gamma };
}

function csqrt(re: number, im: number): Complex {
  const m = Math.hypot(re, im);
  const r = Math.sqrt((m + re) / 2);
  const i = Math.sqrt(Math.max(0, (m - re) / 2));
  return { re: r, im: im < 0 ? -i : i };
}

/** y11 = coth(γl)/Zc and y12 = −csch(γl)/Zc of one mode, written to out[0..3] as (re, im, re, im). */
function modeY(zc: Complex, gamma: Complex, length: number, out: Float64Array, at: number): void {
  const x = gamma.re * length, y = gamma.im * length;
  // sinh(x + jy) = sinh x cos y + j cosh x sin y; cosh(x + jy) = cosh x cos y + j sinh x sin y.
  const ex = Math.exp(x), emx = 1 / ex;
  const sh = (ex - emx) / 2, ch = (ex + emx) / 2, c = Math.cos(y), s = Math.sin(y);
  const sr = sh * c, si = ch * s, cr = ch * c, ci = sh * s;
  // d = Zc·sinh(γl); y11 = cosh/d, y12 = −1/d
  const dr = zc.re * sr - zc.im * si, di = zc.re * si + zc.im * sr;
  const dd = dr * dr + di * di;
  out[at] = (cr * dr + ci * di) / dd; out[at + 1] = (ci * dr - cr * di) / dd;
  out[at + 2] = -dr / dd; out[at + 3] = di / dd;
}

const ye = new Float64Array(4), yo = new Float64Array(4);

/** The 4×4 admittance matrix (interleaved re/im, 32 numbers) of the pair over `length` m. */
export function coupledPairY(even: { zc: Complex; gamma: Complex }, odd: { zc: Complex; gamma: Complex }, length: number): Float64Array {
  modeY(even.zc, even.gamma, length, ye, 0);
  modeY(odd.zc, odd.gamma, length, yo, 0);
  const selfR = (ye[0]! + yo[0]!) / 2, selfI = (ye[1]! + yo[1]!) / 2;
  const sideR = (ye[0]! - yo[0]!) / 2, sideI = (ye[1]! - yo[1]!) / 2;
  const thruR = (ye[2]! + yo[2]!) / 2, thruI = (ye[3]! + yo[3]!) / 2;
  const crossR = (ye[2]! - yo[2]!) / 2, crossI = (ye[3]! - yo[3]!) / 2;
  // Rows/columns in the order [1, 2, 3, 4] = [strip 1 near, strip 1 far, strip 2 near, strip 2 far]:
  // kind index per (row, col) with 0 = self, 1 = through (same strip), 2 = beside (same end), 3 = cross.
  const K = [
    [0, 1, 2, 3],
    [1, 0, 3, 2],
    [2, 3, 0, 1],
    [3, 2, 1, 0],
  ];
  const re = [selfR, thruR, sideR, crossR], im = [selfI, thruI, sideI, crossI];
  const out = new Float64Array(32);
  for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
    const k = K[i]![j]!;
    out[2 * (i * 4 + j)] = re[k]!; out[2 * (i * 4 + j) + 1] = im[k]!;
  }
  return out;
}

/**
 * The pair's 4×4 admittance matrix from its even and odd modes as the line-model interface gives them
 * (core/line/line-model.ts); `lossless` drops both modes' attenuation.
 */
export function coupledPairYOfModes(modal: ModalFigures<CoupledModeName>, length: number, lossless: boolean): Float64Array {
  const e = modal.modes.even, o = modal.modes.odd, f = modal.f;
  const k = lossless ? 0 : 1;
  return coupledPairY(modeConstants(e.z0, e.epsEff, k * e.alphaC, k * e.alphaD, f), modeConstants(o.z0, o.epsEff, k * o.alphaC, k * o.alphaD, f), length);
}
