/**
 * Higher-order-mode and surface-wave thresholds of a microstrip on a grounded slab.
 *
 *  - TE1 surface-wave onset of the grounded dielectric slab (textbook result, e.g. D. M. Pozar, Microwave
 *    Engineering, 4th ed., 2012, §3.6):  f_TE1 = c0/(4 h √(εr − 1)). The common rule of thumb for the highest
 *    usable microstrip frequency is the same expression (common practice).
 *  - Strong coupling of the quasi-TEM mode to the TM0 surface wave: G. D. Vendelin, "Limitations on stripline Q",
 *    Microwave Journal, vol. 13, pp. 63–69, May 1970:  f_TM0 = (c0/(2π h))·√(2/(εr − 1))·arctan(εr).
 *  - First transverse resonance of the strip: f_CT = c0/(√εr·(2W + 0.8h)), commonly credited to Vendelin 1970
 *    (attribution to be verified).
 * Policy (not published; the project's own rule): caution above warnAt = 0.5·min(f_TE1, f_CT), error above
 * errorAt = min(f_TE1, f_CT). Units: h, W in m; frequencies in Hz.
 */
import { C0 } from '../units/constants.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { validateSubstrate } from '../substrate/validate.ts';
import { requireRange } from '../util/errors.ts';

export interface ModeThresholds {
  /** Rule of thumb c0/(4h√(εr−1)), Hz (common practice; equals the TE1 onset). */
  ruleOfThumb: number;
  /** TE1 surface-wave cutoff of the grounded slab, Hz. */
  te1: number;
  /** Vendelin's TM0 surface-wave coupling frequency, Hz. */
  surfaceWave: number;
  /** First transverse resonance for the strip width, Hz (only when a width is known). */
  transverseResonance?: number;
  /** Caution above this frequency, Hz. */
  warnAt: number;
  /** Error above this frequency, Hz. */
  errorAt: number;
}

// Substrate-only terms, remembered for the last substrate (number fields of one object rather than module `let`s).
const m = { er: Number.NaN, h: Number.NaN, te1: 0.5, surfaceWave: 0.5, sqrtEr: 0.5 };

/** Recomputes m for (er, h); callers check `er !== m.er || h !== m.h` first, so the common case makes no call. */
function substrateTerms(er: number, h: number): void {
  m.er = er; m.h = h;
  const root = Math.sqrt(er - 1);
  m.te1 = C0 / (4 * h * root);
  m.surfaceWave = (C0 / (2 * Math.PI * h)) * Math.sqrt(2 / (er - 1)) * Math.atan(er);
  m.sqrtEr = Math.sqrt(er);
}

/** Thresholds from εr and h (m), and the strip width (m) when known. Inputs assumed validated. */
export function thresholdsFor(er: number, h: number, width?: number): ModeThresholds {
  if (er !== m.er || h !== m.h) substrateTerms(er, h);
  const te1 = m.te1; const surfaceWave = m.surfaceWave;
  if (width === undefined) return { ruleOfThumb: te1, te1, surfaceWave, warnAt: 0.5 * te1, errorAt: te1 };
  thresholdLimits(er, h, width);
  return { ruleOfThumb: te1, te1, surfaceWave, transverseResonance: limits.transverseResonance, warnAt: limits.warnAt, errorAt: limits.errorAt };
}

/** Written by thresholdLimits: the transverse resonance and the caution and error frequencies of thresholdsFor, Hz. */
export const limits = { transverseResonance: 0.5, warnAt: 0.5, errorAt: 0.5 };

/** The width-dependent part of thresholdsFor(er, h, width), into `limits` without building the record (hot path). */
export function thresholdLimits(er: number, h: number, width: number): void {
  if (er !== m.er || h !== m.h) substrateTerms(er, h);
  const te1 = m.te1;
  const transverseResonance = C0 / (m.sqrtEr * (2 * width + 0.8 * h));
  const lim = transverseResonance < te1 ? transverseResonance : te1;
  limits.transverseResonance = transverseResonance; limits.warnAt = 0.5 * lim; limits.errorAt = lim;
}

/**
 * Mode thresholds of a substrate (and optionally a strip width, which adds the transverse resonance).
 * Throws InputError for an invalid substrate or width.
 */
export function modeThresholds(sub: SubstrateSpec, width?: number): ModeThresholds {
  validateSubstrate(sub);
  if (width !== undefined) requireRange('width', width, 0, 10, 'a strip width above 0 m and up to 10 m', { minExclusive: true });
  return thresholdsFor(sub.er, sub.h, width);
}
