/**
 * Curved (swept) bend treated as a line of its centreline arc length — common practice for centreline radius
 * R ≥ 3 W (project rule: not a published bound). Geometry only: turning by θ with radius R, the arc replaces
 * R tan(θ/2) of straight run on each side of the corner point (the tangent length) with an arc of length R θ.
 */
import { InputError, requireRange } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';

export const ARC_BEND_SOURCE = 'centreline-arc (common practice)';

export interface ArcBend {
  /** Straight run each neighbour gives up to the arc, m: R tan(θ/2). */
  tangent: number;
  /** Centreline arc length, m: R θ. */
  arcLength: number;
  warnings: Warning[];
}

export function arcBend(p: { R: number; W: number; turnRad: number }): ArcBend {
  const R = requireRange('radius', p.R, 0, Infinity, 'a centreline radius above 0 m', { minExclusive: true });
  const th = requireRange('turnRad', Math.abs(p.turnRad), 0, Math.PI * 0.999, 'a turn between 0° and 180°');
  const warnings: Warning[] = [];
  if (R <= p.W / 2) {
    // The inner edge would fold over itself.
    throw new InputError('impossible-layout', 'radius', `a centreline radius above half the strip width (${(p.W / 2 * 1e3).toFixed(3)} mm)`, `${(R * 1e3).toFixed(3)} mm`, 'use a radius of at least 3 W');
  }
  if (R < 3 * p.W) warnings.push(warn('validity', `arc radius ${(R * 1e3).toFixed(3)} mm is below 3 W (${(3 * p.W * 1e3).toFixed(3)} mm): treating the bend as a line of its centreline length is a rough approximation there`, { source: ARC_BEND_SOURCE }));
  return { tangent: R * Math.tan(th / 2), arcLength: R * th, warnings };
}
