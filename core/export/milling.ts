/**
 * Milling outlines for CAM programs that want tool paths or outlines rather than copper: the closed path of the
 * tool centre around all copper, offset outward by the tool radius. Along a straight edge the cutter's side then
 * touches the copper edge exactly; around convex corners the centre follows an arc of the tool radius (round
 * joins: the set of points at distance r from a polygon is its round offset — Minkowski sum with a disc, see
 * Steiner 1840 for the area formula A + P·r + π·r² used in the tests).
 *
 * Needs the polygon engine: `await initPolygons()` (core/geometry) once before calling.
 */
import { InputError, describe } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { offsetRegions, unionRegions } from '../geometry/polygons.ts';
import { PROCESS_LIMITS } from '../design/limits.ts';
import type { ExportGeometry } from './layers.ts';

export interface Isolated { geometry: ExportGeometry; warnings: Warning[] }

/** Adds `isolation` (tool-centre outlines) to the geometry for a cutter of diameter `toolDiameter` metres. */
export function withIsolation(g: ExportGeometry, toolDiameter: number): Isolated {
  // The same bound as the design's end-mill process (PROCESS_LIMITS: what end mills are).
  const max = PROCESS_LIMITS.endMillDiameterMax;
  if (typeof toolDiameter !== 'number' || !Number.isFinite(toolDiameter) || toolDiameter <= 0 || toolDiameter > max) {
    throw new InputError('out-of-range', 'toolDiameter', `a cutter diameter above 0 and up to ${max * 1e3} mm`, describe(toolDiameter),
      'give the cut width at your depth, e.g. 0.2mm for a fine V-bit');
  }
  const warnings: Warning[] = [];
  const copper = unionRegions([...g.copper, ...g.groundCopper]);
  const isolation = offsetRegions(copper, toolDiameter / 2, 'round');
  if (isolation.length < copper.length) {
    warnings.push(warn('fabrication', `Some gaps between copper areas are narrower than the ${(toolDiameter * 1000).toFixed(3)} mm tool: the tool cannot pass there and the outlines of those areas merged. Use a smaller tool or widen the gaps.`, { source: 'isolation-outline' }));
  }
  return { geometry: { ...g, isolation }, warnings };
}
