/**
 * The line model's impedance and permittivity path, shared by analysis and synthesis so that synthesis inverts
 * exactly the numbers the analysis reports. One straight function, plain numbers, no allocation: results go to a
 * module-level scratch record (the core is single-threaded; nothing calls back into it during a run).
 */
import { hjDeltaU1, hjDeltaUr, hjEpsEff, hjSlope, hjThickness, hjZ01, hjZ01WithSlope } from './hammerstad-jensen-1980.ts';
import { kirschningJansenEpsEff } from './kirschning-jansen-1982.ts';
import { jansenKirschningZ0 } from './jansen-kirschning-1983.ts';
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

// The static part depends only on (u, tn, εr): a frequency sweep of one line reuses it.
let mU = Number.NaN; let mTn = Number.NaN; let mEr = Number.NaN;
// The whole result is reused when the same line is asked again at the same frequency (a synthesis ends that way).
let mF = Number.NaN; let mH = Number.NaN; let mDisp = -1;


/**
 * Static HJ model with thickness, then dispersion at f (Hz). u = W/h, tn = t/h, h in m.
 * Writes scratch and returns Z0 at f (Ω).
 */
export function evaluateModel(u: number, tn: number, er: number, h: number, f: number, disp: DispersionCode): number {
  if (u === mU && tn === mTn && er === mEr && f === mF && h === mH && disp === mDisp) return scratch.z0f;
  if (u !== mU || tn !== mTn || er !== mEr) {
    const du1 = hjDeltaU1(u, tn);
    const u1 = u + du1;
    const ur = du1 === 0 ? u : u + hjDeltaUr(du1, er);
    const z01r = hjZ01(ur);
    const eer = hjEpsEff(ur, er);
    let ees = eer;
    if (du1 !== 0) {
      const k = hjZ01WithSlope(u1) / z01r;
      ees = eer * k * k;
      scratch.slopeU1 = hjSlope.value;
      scratch.s = hjThickness.s; scratch.T = hjThickness.T; scratch.X = hjThickness.X; scratch.lnX1 = hjThickness.lnX1;
    }
    scratch.z0s = z01r / Math.sqrt(eer); scratch.ees = ees; scratch.u1 = u1; scratch.ur = ur;
    mU = u; mTn = tn; mEr = er;
  }
  const z0s = scratch.z0s; const ees = scratch.ees; const ur = scratch.ur;
  let z0f = z0s;
  let eef = ees;
  if (f > 0 && disp !== 0) {
    if (disp === 1) {
      const fn = f * h * 1e-6;
      eef = kirschningJansenEpsEff(ur, er, ees, fn);
      z0f = jansenKirschningZ0(ur, er, ees, eef, fn, z0s);
    } else {
      eef = hjDispersionEpsEff(er, ees, z0s, h, f);
      z0f = hjDispersionZ0(ees, eef, z0s);
    }
  }
  scratch.z0f = z0f; scratch.eef = eef;
  mF = f; mH = h; mDisp = disp;
  return z0f;
}
