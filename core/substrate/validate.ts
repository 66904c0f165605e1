/**
 * Checks a SubstrateSpec field by field. Invalid input is an InputError naming the field, the accepted range and
 * what was given; the ranges are what the tool accepts (the models' own validity ranges are warnings, see core/line).
 */
import { InputError, describe } from '../util/errors.ts';
import type { SubstrateSpec } from './types.ts';
import { DEBYE_F_HIGH, DEBYE_F_LOW, widebandDebyeEpsInf } from './wideband-debye.ts';

/** Accepted ranges, SI. */
export const SUBSTRATE_LIMITS = {
  er: [1.001, 128],
  h: [1e-6, 0.1],
  t: [0, 1e-3],
  tanDelta: [0, 0.5],
  sigma: [1e3, 1e9],
  roughness: [0, 1e-4],
} as const;

const EXPECTED = {
  er: 'a relative permittivity from 1.001 to 128 (use 1.001 for an air-spaced line)',
  h: 'a dielectric height from 1 µm to 100 mm',
  t: 'a copper thickness of 0 or from 1 nm to 1 mm, not more than the dielectric height',
  tanDelta: 'a loss tangent from 0 to 0.5',
  sigma: 'a conductivity from 1e3 to 1e9 S/m (annealed copper 5.8e7 S/m)',
  roughness: 'an rms roughness from 0 to 100 µm',
} as const;

function check(field: keyof typeof SUBSTRATE_LIMITS, v: unknown, prefix: string): void {
  const [lo, hi] = SUBSTRATE_LIMITS[field];
  if (typeof v !== 'number' || !(v >= lo && v <= hi)) {
    throw new InputError(typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number',
      prefix + field, EXPECTED[field], describe(v));
  }
}

/** Throws InputError for the first bad field; returns the spec unchanged when it is usable. */
export function validateSubstrate(sub: SubstrateSpec, prefix = 'substrate.'): SubstrateSpec {
  if (typeof sub !== 'object' || sub === null) throw new InputError('invalid-number', prefix.replace(/\.$/, ''), 'a substrate object', describe(sub));
  check('er', sub.er, prefix);
  check('h', sub.h, prefix);
  check('t', sub.t, prefix);
  if (sub.t > 0 && sub.t < 1e-9) throw new InputError('out-of-range', prefix + 't', EXPECTED.t, String(sub.t));
  if (sub.t > sub.h) throw new InputError('out-of-range', prefix + 't', `a copper thickness not more than the dielectric height (${sub.h} m)`, String(sub.t));
  check('tanDelta', sub.tanDelta, prefix);
  check('sigma', sub.sigma, prefix);
  check('roughness', sub.roughness, prefix);
  const dm = sub.dielectricModel;
  if (dm !== undefined && dm.kind !== 'constant') {
    if (dm.kind !== 'wideband-debye') throw new InputError('bad-choice', prefix + 'dielectricModel.kind', "'constant' or 'wideband-debye'", describe((dm as { kind: unknown }).kind));
    const fLow = dm.fLow ?? DEBYE_F_LOW;
    const fHigh = dm.fHigh ?? DEBYE_F_HIGH;
    for (const [name, v] of [['fLow', fLow], ['fHigh', fHigh], ['fMeasure', dm.fMeasure]] as const) {
      if (typeof v !== 'number' || !(v > 0 && v <= 1e15)) throw new InputError('out-of-range', `${prefix}dielectricModel.${name}`, 'a frequency above 0 Hz', describe(v));
    }
    if (!(fHigh >= 10 * fLow)) throw new InputError('out-of-range', prefix + 'dielectricModel.fHigh', `a corner at least 10 × fLow (${fLow} Hz)`, String(fHigh));
    if (!(dm.fMeasure > fLow && dm.fMeasure < fHigh)) {
      throw new InputError('out-of-range', prefix + 'dielectricModel.fMeasure', `a measurement frequency between fLow (${fLow} Hz) and fHigh (${fHigh} Hz)`, String(dm.fMeasure));
    }
    const epsInf = widebandDebyeEpsInf(sub.er, sub.tanDelta, dm.fMeasure, fLow, fHigh);
    if (!(epsInf >= 1)) {
      throw new InputError('out-of-range', prefix + 'tanDelta', 'a loss tangent small enough for the wideband Debye fit (its ε∞ must stay ≥ 1)', String(sub.tanDelta),
        'lower tanδ, narrow fLow–fHigh, or switch the dielectric model to constant');
    }
  }
  return sub;
}
