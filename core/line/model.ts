/**
 * The line model's impedance and permittivity path, shared by analysis and synthesis so that synthesis inverts
 * exactly the numbers the analysis reports. One straight function, plain numbers, no allocation: results go to a
 * module-level scratch record (the core is single-threaded; nothing calls back into it during a run).
 */
import { hjDeltaU1, hjDeltaUr, hjEpsEff, hjSlope, hjThickness, hjZ01Ln, hjZ01WithSlope } from './hammerstad-jensen-1980.ts';
import { kirschningJansenEpsEffLn } from './kirschning-jansen-1982.ts';
import { jansenKirschningZ0Ln } from './jansen-kirschning-1983.ts';
import { hjDispersionEpsEff, hjDispersionZ0 } from './hammerstad-jensen-1980-dispersion.ts';
import type { DispersionModel } from './types.ts';

/** 0 = none, 1 = Kirschning–Jansen, 2 = Hammerstad–Jensen. */
export type DispersionCode = 0 | 1 | 2;

export function dispersionCode(d: DispersionModel): DispersionCode {
  return d === 'kirschning-jansen' ? 1 : d === 'hammerstad-jensen' ? 2 : 0;
}

export interface ModelScratch {
  z0s: number; ees: number; u1: number; ur: number; z0f: number; eef: number;
  /** Thickness-correction intermediates and dZ01/du at u1, for Wheeler's rule (valid when tn > 0). */
  s: number; T: number; X: number; lnX1: number; slopeU1: number;
}

/** Filled by evaluateModel. */
export const scratch: ModelScratch = { z0s: 0, ees: 0, u1: 0, ur: 0, z0f: 0, eef: 0, s: 0, T: 0, X: 0, lnX1: 0, slopeU1: 0 };

// The static part depends only on (u, tn, εr): a frequency sweep of one line reuses it (with ln ur, which the static
// and the dispersive Z0 both need). The whole result is reused when the same line is asked again at the same
// frequency (a synthesis ends that way). Number fields of one object: V8 boxes a double written to a module-level
// `let` on every write, and updates an object's double field in place.
const m = { u: Number.NaN, tn: Number.NaN, er: Number.NaN, lnUr: 0.5, f: Number.NaN, h: Number.NaN, disp: -1, fn: Number.NaN, lnFn: 0.5 };


/**
 * Static HJ model with thickness, then dispersion at f (Hz). u = W/h, tn = t/h, h in m.
 * Writes scratch and returns Z0 at f (Ω).
 */
export function evaluateModel(u: number, tn: number, er: number, h: number, f: number, disp: DispersionCode): number {
  if (u === m.u && tn === m.tn && er === m.er && f === m.f && h === m.h && disp === m.disp) return scratch.z0f;
  if (u !== m.u || tn !== m.tn || er !== m.er) {
    const du1 = hjDeltaU1(u, tn);
    const u1 = u + du1;
    const ur = du1 === 0 ? u : u + hjDeltaUr(du1, er);
    const lnUr = Math.log(ur);
    const z01r = hjZ01Ln(ur, lnUr);
    const eer = hjEpsEff(ur, er);
    let ees = eer;
    if (du1 !== 0) {
      const k = hjZ01WithSlope(u1) / z01r;
      ees = eer * k * k;
      scratch.slopeU1 = hjSlope.value;
      scratch.s = hjThickness.s; scratch.T = hjThickness.T; scratch.X = hjThickness.X; scratch.lnX1 = hjThickness.lnX1;
    }
    scratch.z0s = z01r / Math.sqrt(eer); scratch.ees = ees; scratch.u1 = u1; scratch.ur = ur;
    m.u = u; m.tn = tn; m.er = er; m.lnUr = lnUr;
  }
  const z0s = scratch.z0s; const ees = scratch.ees; const ur = scratch.ur;
  let z0f = z0s;
  let eef = ees;
  if (f > 0 && disp !== 0) {
    if (disp === 1) {
      const fn = f * h * 1e-6;
      if (fn !== m.fn) { m.fn = fn; m.lnFn = Math.log(fn); }
      const lnFn = m.lnFn;
      eef = kirschningJansenEpsEffLn(ur, er, ees, fn, lnFn);
      z0f = jansenKirschningZ0Ln(ur, m.lnUr, er, ees, eef, fn, lnFn, z0s);
    } else {
      eef = hjDispersionEpsEff(er, ees, z0s, h, f);
      z0f = hjDispersionZ0(ees, eef, z0s);
    }
  }
  scratch.z0f = z0f; scratch.eef = eef;
  m.f = f; m.h = h; m.disp = disp;
  return z0f;
}
