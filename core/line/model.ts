/**
 * The line model's impedance and permittivity path, shared by analysis and synthesis so that synthesis inverts
 * exactly the numbers the analysis reports. One straight function, plain numbers, no allocation: results go to a
 * module-level scratch record (the core is single-threaded; nothing calls back into it during a run).
 */
import { hjDeltaU1, hjDeltaUr, hjEpsEff, hjZ01 } from './hammerstad-jensen-1980.ts';
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
}

/** Filled by evaluateModel. */
export const scratch: ModelScratch = { z0s: 0, ees: 0, u1: 0, ur: 0, z0f: 0, eef: 0 };

/**
 * Static HJ model with thickness, then dispersion at f (Hz). u = W/h, tn = t/h, h in m.
 * Writes scratch and returns Z0 at f (Ω).
 */
export function evaluateModel(u: number, tn: number, er: number, h: number, f: number, disp: DispersionCode): number {
  const du1 = hjDeltaU1(u, tn);
  const u1 = u + du1;
  const ur = du1 === 0 ? u : u + hjDeltaUr(du1, er);
  const z01r = hjZ01(ur);
  const eer = hjEpsEff(ur, er);
  const z0s = z01r / Math.sqrt(eer);
  let ees = eer;
  if (du1 !== 0) { const k = hjZ01(u1) / z01r; ees = eer * k * k; }
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
  scratch.z0s = z0s; scratch.ees = ees; scratch.u1 = u1; scratch.ur = ur; scratch.z0f = z0f; scratch.eef = eef;
  return z0f;
}
