/**
 * Complex characteristic impedance and propagation constant for the network solver (telegrapher's equations, Pozar, Microwave Engineering, 4th ed., 2012, §2.1, from memory), from the
 * per-unit-length constants of the analysed line:
 *   L' = Z0·√εe/c0,  C' = √εe/(Z0·c0),  R' = 2·Z0·αc,  G' = 2·αd/Z0  (Z0 = Z0(f), εe = εe(f))
 *   γ = √((R' + jωL')(G' + jωC')),   Zc = √((R' + jωL')/(G' + jωC'))
 * Units: Ω and 1/m (γ = α + jβ with α in Np/m, β in rad/m). Needs f > 0.
 */
import { C0 } from '../units/constants.ts';
import { InputError } from '../util/errors.ts';
import { hypot } from '../util/hypot.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { analyzeLine } from './analyze.ts';
import type { LineOptions } from './types.ts';

export interface Complex { re: number; im: number }

/** Principal square root (re ≥ 0) of re + j·im, written into to[at] (re) and to[at + 1] (im): no record per call
 * (sweeps and the yield estimate call this hundreds of thousands of times; storing into a typed array also spares the
 * engine the boxed numbers an object's fields may need). */
function csqrtAt(re: number, im: number, to: Float64Array, at: number): void {
  const m = hypot(re, im);
  const r = Math.sqrt((m + re) / 2);
  const i = Math.sqrt(Math.max(0, (m - re) / 2));
  to[at] = r; to[at + 1] = im < 0 ? -i : i;
}

export function lineConstants(sub: SubstrateSpec, width: number, f: number, opts?: LineOptions): { zc: Complex; gamma: Complex } {
  if (typeof f === 'number' && f === 0) {
    throw new InputError('out-of-range', 'f', 'a frequency above 0 Hz for the line constants', '0', 'at DC a line is its series resistance; use a small frequency');
  }
  const r = analyzeLine(sub, width, f, opts);
  const out = { zc: { re: 0, im: 0 }, gamma: { re: 0, im: 0 } };
  lineConstantsFrom(r.z0, r.epsEff, r.alphaC, r.alphaD, f, out);
  return out;
}

/** Scratch of lineConstantsFrom: zc re, im, γ re, im. */
const scratch = new Float64Array(4);

/**
 * The same constants from an analysis already made (Z0(f), εe(f), αc and αd in Np/m at f), written into `out`:
 * the form for many lines at once (analyzeLines columns), the same arithmetic to the last bit.
 */
export function lineConstantsFrom(z0: number, epsEff: number, alphaC: number, alphaD: number, f: number, out: { zc: Complex; gamma: Complex }): void {
  lineConstantsAt(z0, epsEff, alphaC, alphaD, f, scratch, 0);
  out.zc.re = scratch[0]!; out.zc.im = scratch[1]!; out.gamma.re = scratch[2]!; out.gamma.im = scratch[3]!;
}

/**
 * lineConstantsFrom into a typed array: zc re, im, γ re, im at to[at … at + 3] (the yield estimate's line tables).
 */
export function lineConstantsAt(z0: number, epsEff: number, alphaC: number, alphaD: number, f: number, to: Float64Array, at: number): void {
  const w = 2 * Math.PI * f;
  const sq = Math.sqrt(epsEff);
  const L = (z0 * sq) / C0; const C = sq / (z0 * C0);
  const R = 2 * z0 * alphaC; const G = (2 * alphaD) / z0;
  // Z = R + jωL, Y = G + jωC
  const zr = R; const zi = w * L; const yr = G; const yi = w * C;
  csqrtAt(zr * yr - zi * yi, zr * yi + zi * yr, to, at + 2);
  const d = yr * yr + yi * yi;
  csqrtAt((zr * yr + zi * yi) / d, (zi * yr - zr * yi) / d, to, at);
}
