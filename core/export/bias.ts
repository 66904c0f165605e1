/**
 * Etch bias (artwork compensation): every copper edge moves outward by `bias` metres (inward when negative), so
 * that after the etchant undercuts the edge by about that much the finished copper lands on the design.
 * Undercut per side is of the order of the copper thickness for 35 µm copper (common practice);
 * the right figure is the one measured on your own process, so the value is always the user's.
 *
 * Miter joins keep straight edges straight and square corners square: a 1 mm line biased by +35 µm is exactly
 * 1.070 mm wide. The clearance layer is recomputed as (board − biased copper) so it stays consistent.
 * Needs the polygon engine: `await initPolygons()` (core/geometry) once before calling.
 */
import { InputError, describe } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { differenceRegions, offsetRegions, unionRegions } from '../geometry/polygons.ts';
import type { Region } from '../geometry/types.ts';
import { ringsBox } from './frame.ts';
import type { ExportGeometry } from './layers.ts';

/** Largest bias accepted, m: beyond half a millimetre it is no longer a compensation but a different design. */
export const MAX_BIAS = 0.5e-3;

export interface Biased { geometry: ExportGeometry; warnings: Warning[] }

export function withEtchBias(g: ExportGeometry, bias: number): Biased {
  if (typeof bias !== 'number' || !Number.isFinite(bias) || Math.abs(bias) > MAX_BIAS) {
    throw new InputError('out-of-range', 'bias', 'an etch bias between −0.5 mm and +0.5 mm per edge', describe(bias),
      'a typical value is about the copper thickness, e.g. 0.035mm for 1 oz copper');
  }
  if (bias === 0) return { geometry: g, warnings: [] };
  const warnings: Warning[] = [];
  const copper = offsetRegions(g.copper, bias, 'miter');
  const ground = offsetRegions(g.groundCopper, bias, 'miter');
  if (bias < 0 && (copper.length < g.copper.length || ground.length < g.groundCopper.length)) {
    warnings.push(warn('fabrication', `An etch bias of ${fmt(bias)} removes copper narrower than ${fmt(-2 * bias)}: some copper areas vanished from the artwork. Use a smaller bias or wider copper.`, { source: 'etch-bias' }));
  }
  if (copper.length > 0 && ground.length > 0) {
    const joined = unionRegions([...copper, ...ground]).length;
    const apart = unionRegions(copper).length + unionRegions(ground).length;
    if (joined < apart) {
      warnings.push(warn('fabrication', `With an etch bias of ${fmt(bias)} the network copper touches the ground copper: a gap is narrower than ${fmt(2 * bias)}. Widen the clearance or reduce the bias.`, { source: 'etch-bias', severity: 'error' }));
    }
  }
  const board: Region[] = unionRegions([...g.clearance, ...g.copper, ...g.groundCopper]);
  const clearance = differenceRegions(board, [...copper, ...ground]);
  const all = [...copper, ...ground, ...clearance, ...(g.outline ? [g.outline] : [])].map((r) => r.outer);
  const b = all.length > 0 ? ringsBox(all) : g.extent;
  return { geometry: { ...g, copper, groundCopper: ground, clearance, extent: b }, warnings };
}

function fmt(m: number): string {
  return `${(m * 1000).toFixed(3)} mm`;
}
