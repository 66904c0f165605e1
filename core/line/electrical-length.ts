/**
 * Electrical ↔ physical length at the result's frequency (Pozar, Microwave Engineering 4th ed., §2.1, §3.8, from memory):
 *   θ[deg] = 360·f·√εe(f)·l/c0 = 360·l/λg,   l = θ·λg/360.
 * Units: degrees and metres. Needs a result at f > 0 (there is no wavelength at DC).
 */
import { InputError, describe } from '../util/errors.ts';
import { C0 } from '../units/constants.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { analyzeLine } from './analyze.ts';
import type { LineOptions, LineResult } from './types.ts';

/** What an electrical length needs of a line: its frequency and guided wavelength (a LineResult or a LineAt). */
type Wave = Pick<LineResult, 'f' | 'lambdaG'>;

function needWave(r: Wave): number {
  if (!(r.f > 0 && r.lambdaG > 0)) {
    throw new InputError('out-of-range', 'f', 'a line result at a frequency above 0 Hz (electrical length needs a wavelength)', String(r.f),
      'analyse or size the line at the design frequency');
  }
  return r.lambdaG;
}

/** Physical length (m) of `deg` electrical degrees. */
export function lengthForDegrees(r: Wave, deg: number): number {
  const lg = needWave(r);
  if (typeof deg !== 'number' || !(deg >= 0 && deg <= 1e6)) {
    throw new InputError('out-of-range', 'deg', 'an electrical length from 0 to 1e6 degrees', describe(deg));
  }
  return (deg / 360) * lg;
}

/** Electrical length (degrees) of `length` metres. */
export function degreesForLength(r: Wave, length: number): number {
  const lg = needWave(r);
  if (typeof length !== 'number' || !(length >= 0 && length <= 100)) {
    throw new InputError('out-of-range', 'length', 'a length from 0 to 100 m', describe(length));
  }
  return (360 * length) / lg;
}

/**
 * Group delay per metre, s/m (derivative of the phase constant: group velocity, Pozar 4th ed., §3.9 "Wave velocities and dispersion", from memory): τg = (1/c0)·d(f·√εe(f))/df = (√εe + f·(dεe/df)/(2√εe))/c0, with dεe/df
 * by a central difference of the dispersion model (relative step 1e-4). Equals the phase delay without dispersion.
 * Needs f > 0; throws InputError for invalid input like analyzeLine.
 */
export function groupDelayPerM(sub: SubstrateSpec, width: number, f: number, opts?: LineOptions): number {
  const r = analyzeLine(sub, width, f, opts);
  needWave(r);
  const df = 1e-4 * f;
  const lo = analyzeLine(sub, width, f - df, opts).epsEff;
  const hi = analyzeLine(sub, width, f + df, opts).epsEff;
  const sq = Math.sqrt(r.epsEff);
  return (sq + (f * (hi - lo)) / (2 * df) / (2 * sq)) / C0;
}
