/**
 * Input checks of the line models: the numbers the tool accepts (InputError outside), separate from the models'
 * published validity ranges (warnings). Written as plain comparisons so that they cost nothing in the hot path;
 * a non-number or NaN fails every comparison and is reported as such.
 */
import { InputError, describe } from '../util/errors.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { validateSubstrate } from '../substrate/validate.ts';
import { CONDUCTOR_LOSS_MODELS, DISPERSION_MODELS, type LineOptions } from './types.ts';
import { dispersionCode, type DispersionCode } from './model.ts';
import { C0 } from '../units/constants.ts';

/**
 * Quasi-TEM line models stop describing the line above the first surface-wave modes; past twice the TE1 onset
 * (common practice) the dispersion fits also leave every range they were made for (the Z0(f) fit turns non-finite
 * there for εr above its range), so such a frequency is refused instead of returning numbers that mean nothing.
 */
const qt = { er: Number.NaN, h: Number.NaN, limit: 0.5 }; // the limit for the last substrate (εr, h)
export function checkQuasiTem(f: number, er: number, h: number): void {
  if (er !== qt.er || h !== qt.h) { qt.er = er; qt.h = h; qt.limit = (2 * C0) / (4 * h * Math.sqrt(er - 1)); }
  const limit = qt.limit;
  if (f > limit) {
    throw new InputError('out-of-range', 'f', `a frequency up to ${Number((limit / 1e9).toPrecision(4))} GHz, twice the TE1 surface-wave onset of this substrate (above it quasi-TEM models do not apply)`,
      `${Number((f / 1e9).toPrecision(4))} GHz`, 'use a thinner or lower-εr substrate');
  }
}

/** Accepted W/h range: the synthesis bracket (Hammerstad & Jensen 1980 synthesis range). */
export const U_MIN = 1e-3;
export const U_MAX = 1e3;
/** Highest frequency accepted, Hz. */
export const F_MAX = 1e12;
/** Lowest non-zero frequency accepted, Hz (below it wavelengths and skin depths overflow). */
export const F_MIN = 1;

function bad(v: unknown): 'out-of-range' | 'invalid-number' {
  return typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number';
}

export function checkSubstrate(sub: SubstrateSpec): void {
  // Fast path for the common case; the full check names the field.
  if (typeof sub === 'object' && sub !== null && sub.dielectricModel === undefined
    && typeof sub.er === 'number' && sub.er >= 1.001 && sub.er <= 128
    && typeof sub.h === 'number' && sub.h >= 1e-6 && sub.h <= 0.1
    && typeof sub.t === 'number' && (sub.t === 0 || sub.t >= 1e-9) && sub.t <= 1e-3 && sub.t <= sub.h
    && typeof sub.tanDelta === 'number' && sub.tanDelta >= 0 && sub.tanDelta <= 0.5
    && typeof sub.sigma === 'number' && sub.sigma >= 1e3 && sub.sigma <= 1e9
    && typeof sub.roughness === 'number' && sub.roughness >= 0 && sub.roughness <= 1e-4) return;
  validateSubstrate(sub);
}

export function checkWidth(width: unknown, h: number): number {
  if (typeof width !== 'number' || !(width >= U_MIN * h && width <= U_MAX * h)) {
    throw new InputError(bad(width), 'width', `a strip width from 0.001·h to 1000·h (${U_MIN * h} m to ${U_MAX * h} m for h = ${h} m)`, describe(width));
  }
  return width;
}

export function checkFrequency(f: unknown): number {
  if (typeof f !== 'number' || !(f === 0 || (f >= F_MIN && f <= F_MAX))) {
    throw new InputError(bad(f), 'f', '0 Hz (static) or a frequency from 1 Hz to 1 THz', describe(f));
  }
  return f;
}

export function checkDispersion(opts: LineOptions | undefined): DispersionCode {
  const d = opts?.dispersion;
  if (d === undefined) return 1;
  if (!DISPERSION_MODELS.includes(d)) throw new InputError('bad-choice', 'dispersion', `one of ${DISPERSION_MODELS.join(', ')}`, describe(d));
  return dispersionCode(d);
}

/** 0 = Wheeler incremental inductance, 1 = current distribution. */
export function checkConductorLoss(opts: LineOptions | undefined): 0 | 1 {
  const c = opts?.conductorLoss;
  if (c === undefined || c === 'wheeler-incremental') return 0;
  if (c === 'current-distribution') return 1;
  throw new InputError('bad-choice', 'conductorLoss', `one of ${CONDUCTOR_LOSS_MODELS.join(', ')}`, describe(c));
}
