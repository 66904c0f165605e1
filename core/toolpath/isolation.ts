/**
 * Isolation and clearing paths: tool-centre loops around every copper island, from the polygon engine's round
 * offset (the set of points at distance δ from the copper is the boundary of copper ⊕ disc(δ)).
 *
 * - Isolation pass k (0-based) runs at δ_k = w/2 + k·w·(1 − overlap) from the copper, w = the tool's cut width, so
 *   pass 1 touches the copper edge and each further pass widens the isolated band. Because every loop is the boundary
 *   of the union's offset, no loop comes closer than δ_k to any copper (islands whose offsets meet share one loop;
 *   the tool then cannot pass between them, which the milled-board check reports).
 * - Clearing: the tool-centre region T = board − (copper ⊕ w/2) is eroded in steps s = w·(1 − clearOverlap) ≤ w/2.
 *   A point of T at depth d lies within d − k·s < s ≤ w/2 of ring k = ⌊d/s⌋, so the rings leave nothing uncut.
 * - Direction: offset regions come out with outer loops counter-clockwise and holes clockwise, so the copper (or the
 *   uncut material) is always on the left of travel. With the spindle turning clockwise seen from above (M3), the
 *   cutting edge on the tool's left then moves with the feed: climb milling (common practice). Conventional reverses
 *   every loop.
 */
import { differenceRegions, offsetRegions, pointInRegion, unionRegions } from '../geometry/polygons.ts';
import type { Region, Ring } from '../geometry/types.ts';
import { InputError } from '../util/errors.ts';
import type { MillingOptions } from './options.ts';
import type { CutPath, OperationKind } from './types.ts';

/** Most clearing rings a job may have: beyond this, clearing with a fine tool would take many hours. */
export const MAX_CLEARING_RINGS = 2000;

function loops(regions: Region[], depth: number, op: OperationKind, o: MillingOptions, keep: (r: Ring) => boolean): CutPath[] {
  const out: CutPath[] = [];
  for (const reg of regions) {
    for (const ring of [reg.outer, ...reg.holes]) {
      if (!keep(ring)) continue;
      out.push({ points: o.direction === 'climb' ? ring : ring.slice().reverse(), closed: true, depth, op });
    }
  }
  return out;
}

/** Loops around all copper (network and ground), innermost pass first for each offset. */
export function isolationPaths(copper: Region[], board: Region, cut: number, depth: number, o: MillingOptions): CutPath[] {
  const united = unionRegions(copper);
  const step = cut * (1 - o.overlap);
  const onBoard = (r: Ring) => r.some((p) => pointInRegion(p, board));
  const out: CutPath[] = [];
  for (let k = 0; k < o.passes; k++) out.push(...loops(offsetRegions(united, cut / 2 + k * step, 'round'), depth, 'isolation', o, onBoard));
  return out;
}

/** Rings that remove every bit of copper on the board that is not part of the design. */
export function clearingPaths(copper: Region[], board: Region, cut: number, depth: number, o: MillingOptions): CutPath[] {
  const grown = offsetRegions(unionRegions(copper), cut / 2, 'round');
  const free = differenceRegions([board], grown);
  const step = cut * (1 - o.clearOverlap);
  const out: CutPath[] = [];
  for (let k = 0; ; k++) {
    const ring = k === 0 ? free : offsetRegions(free, -k * step, 'round');
    if (!ring.length) break;
    if (k >= MAX_CLEARING_RINGS) {
      throw new InputError('out-of-range', 'clear', `a board the ${(cut * 1e3).toFixed(3)} mm cut can clear in at most ${MAX_CLEARING_RINGS} rings`, 'more rings',
        'clear with a wider tool (an end mill process) or leave clearing off: isolation alone makes a working board');
    }
    out.push(...loops(ring, depth, 'clearing', o, () => true));
  }
  return out;
}
