/** The shift of a line sized as made from plain microstrip of the same copper width, for the piece sheet. */
import { stripAt, type CrossSectionSource, type LineAt, type LineOptions, type StripLineFamily } from '../line/index.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import type { AsMadeShift } from './types.ts';

export function plainShift(family: StripLineFamily, sub: SubstrateSpec, r: LineAt, f0: number, plain: LineOptions | undefined, src: CrossSectionSource): AsMadeShift {
  const p = stripAt(family, sub, r.width, f0, plain);
  return { label: src.label, z0Plain: p.z0, epsEffPlain: p.epsEff, z0: r.z0, epsEff: r.epsEff, z0Error: src.staticAt(r.width).z0Error };
}
