/**
 * Drilling grouped by tool, and holes too large for any drill on hand milled as circles.
 * - Sizes are grouped to 10 µm (drill sizes are sold in 0.05 mm or finer steps; common practice).
 * - Depth = board thickness (dielectric + copper) + breakthrough, so the tip clears the bottom copper.
 * - Pecking: feed down one peck, retract to the travel height to clear chips, return rapidly to 0.1 mm above the
 *   last depth, repeat (the usual peck cycle, written out as G0/G1 because small-router controllers often lack
 *   canned cycles; common practice).
 * - A milled hole: circles of radius (D − d)/2 about the hole centre, one per step-down, as two half-circle arcs (G2
 *   for climb: the board to keep lies outside the circle, on the left of clockwise travel with an M3 spindle).
 */
import type { DrillHit, Vec2 } from '../geometry/types.ts';
import { InputError } from '../util/errors.ts';
import type { MillingOptions } from './options.ts';
import type { Move, Vec3 } from './types.ts';

export interface DrillGroup { diameter: number; hits: DrillHit[] }

/** Drill sizes with their holes (smallest first), and the holes to mill. */
export function groupDrills(drills: DrillHit[], o: MillingOptions): { groups: DrillGroup[]; milled: DrillHit[] } {
  const byKey = new Map<number, DrillGroup>();
  const milled: DrillHit[] = [];
  for (const d of drills) {
    if (d.diameter > o.maxDrill + 1e-9) { milled.push(d); continue; }
    const key = Math.round(d.diameter / 1e-5);
    const g = byKey.get(key);
    if (g) g.hits.push(d); else byKey.set(key, { diameter: key * 1e-5, hits: [d] });
  }
  if (milled.length && o.cutoutTool >= Math.min(...milled.map((d) => d.diameter)) - 1e-9) {
    const d = milled.reduce((a, b) => (b.diameter < a.diameter ? b : a));
    throw new InputError('out-of-range', 'cutoutTool', `a cutout tool narrower than the ${(d.diameter * 1e3).toFixed(2)} mm hole of ${d.owner} (it is milled, being larger than the largest drill)`,
      `${(o.cutoutTool * 1e3).toFixed(2)} mm`, 'use a thinner cutout tool or raise the largest drill (maxDrill)');
  }
  return { groups: [...byKey.values()].sort((a, b) => a.diameter - b.diameter), milled };
}

/** The moves that drill one hole from the travel height (tool above the hole) back to the travel height. */
export function drillMoves(at: Vec2, depth: number, o: MillingOptions): Move[] {
  const moves: Move[] = [];
  const p = (z: number): Vec3 => ({ x: at.x, y: at.y, z });
  const levels: number[] = [];
  if (o.peckDepth > 0) for (let d = o.peckDepth; d < depth - 1e-9; d += o.peckDepth) levels.push(d);
  levels.push(depth);
  let last = 0;
  for (const d of levels) {
    if (last > 0) moves.push({ kind: 'rapid', to: p(-last + 0.1e-3) });
    moves.push({ kind: 'line', to: p(-d), feed: o.drillFeed });
    moves.push({ kind: 'rapid', to: p(o.travelHeight) });
    last = d;
  }
  return moves;
}

/** The moves that mill a round hole of diameter D with the cutout tool; starts and ends above (x + R, y). */
export function holeMillMoves(hit: DrillHit, depth: number, o: MillingOptions): { start: Vec2; moves: Move[] } {
  const R = (hit.diameter - o.cutoutTool) / 2;
  const c = hit.at;
  const start = { x: c.x + R, y: c.y };
  const opposite = { x: c.x - R, y: c.y };
  const clockwise = o.direction === 'climb';
  const moves: Move[] = [];
  const levels: number[] = [];
  for (let d = o.stepDown; d < depth - 1e-9; d += o.stepDown) levels.push(d);
  levels.push(depth);
  for (const d of levels) {
    moves.push({ kind: 'line', to: { ...start, z: -d }, feed: o.plungeFeed });
    moves.push({ kind: 'arc', to: { ...opposite, z: -d }, centre: c, clockwise, feed: o.cutoutFeed });
    moves.push({ kind: 'arc', to: { ...start, z: -d }, centre: c, clockwise, feed: o.cutoutFeed });
  }
  moves.push({ kind: 'rapid', to: { ...start, z: o.travelHeight } });
  return { start, moves };
}
