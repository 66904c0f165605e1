/**
 * Defaults for the fields a user may leave out: 35 µm copper (1 oz, common practice), annealed copper
 * σ = 5.8e7 S/m (100 %IACS, International Annealed Copper Standard), a lossless dielectric and smooth copper.
 */
import type { SubstrateSpec } from './types.ts';
import { validateSubstrate } from './validate.ts';

export const DEFAULT_COPPER_T = 35e-6;
export const ANNEALED_COPPER_SIGMA = 5.8e7;

/** A complete, validated SubstrateSpec from εr and h (m) plus any other fields. Throws InputError when invalid. */
export function substrateWithDefaults(s: Pick<SubstrateSpec, 'er' | 'h'> & Partial<SubstrateSpec>): SubstrateSpec {
  const spec: SubstrateSpec = { t: DEFAULT_COPPER_T, tanDelta: 0, sigma: ANNEALED_COPPER_SIGMA, roughness: 0, ...s };
  return validateSubstrate(spec);
}
