/**
 * Moving what a drag translates with one transform per layer instead of new coordinates on every element.
 *
 * The live layout (core liveLayout) says which copper it translated, and by how much since that copper was last
 * drawn afresh (`by` of a scene piece). The board draws such copper once, in a group whose transform is that
 * translation; a later move only sets the group's transform. Marks (centrelines, node marks, port labels) follow the
 * same vector, the drift: a mark whose new place is where it was written plus the drift joins the drift group of its
 * layer, and keeps the coordinates it was written with. Anything else is written afresh in place.
 *
 * Exactness: a translated piece's true copper is its base outline plus `by` (core, to about 1e-15 m); the group
 * draws the base's path text under `translate(by)`, so the two differ by the rounding of the mm conversion only
 * (test/unit/board-drift.test.ts). Marks are matched to DRIFT_EPS of a millimetre: far below a pixel at any zoom.
 */
import type { Vec2 } from '../../../core/index.ts';

/** How close (in the layer's own units: mm on the board, px on screen) a mark must be to count as moved by the drift. */
export const DRIFT_EPS = 1e-6;

/** The translation in board millimetres of a shift given in metres. */
export function driftMm(by: Vec2 | null | undefined): { x: number; y: number } | null {
  return by ? { x: by.x * 1000, y: by.y * 1000 } : null;
}

/** The SVG transform of a translation in the layer's units. */
export function translateText(d: { x: number; y: number }): string {
  return `translate(${d.x} ${d.y})`;
}

/**
 * The shift most translated pieces share (the one the marks follow): pieces moved together carry the very same
 * vector object (core liveLayout), so counting by identity is enough.
 */
export function commonShift(pieces: readonly { by?: Vec2 }[]): Vec2 | null {
  const count = new Map<Vec2, number>();
  let best: Vec2 | null = null, most = 0;
  for (const p of pieces) {
    if (!p.by) continue;
    const n = (count.get(p.by) ?? 0) + 1;
    count.set(p.by, n);
    if (n > most) { most = n; best = p.by; }
  }
  return best;
}

/**
 * Whether points `now` (x, y pairs in the layer's units) are the points `written` plus `off` (or equal to them when
 * `off` is null), each coordinate to DRIFT_EPS.
 */
export function movedBy(now: ArrayLike<number>, written: ArrayLike<number>, off: { x: number; y: number } | null): boolean {
  if (now.length !== written.length) return false;
  const ox = off?.x ?? 0, oy = off?.y ?? 0;
  for (let i = 0; i < now.length; i += 2) {
    if (Math.abs(now[i]! - ox - written[i]!) > DRIFT_EPS || Math.abs(now[i + 1]! - oy - written[i + 1]!) > DRIFT_EPS) return false;
  }
  return true;
}

/**
 * Where a mark goes this scene: into (or left in) the drift group as written ('drift'), left where it is ('stay'),
 * written afresh in the drift group at its place less the drift ('write-drift': it moved while a drag drifts, so it
 * will most likely move with the drift from now on), or written afresh on the board ('write').
 * Coordinates written in the drift group are board coordinates less the drift of that moment, so a mark that moved
 * exactly by the drift since it was written, in the group or not, is drawn right by the group as it stands.
 */
export type MarkPlace = 'drift' | 'stay' | 'write-drift' | 'write';

export function placeMark(now: ArrayLike<number>, written: ArrayLike<number>, inDrift: boolean, drift: { x: number; y: number } | null): MarkPlace {
  if (drift && movedBy(now, written, drift)) return 'drift';
  if (!inDrift && movedBy(now, written, null)) return 'stay';
  return drift ? 'write-drift' : 'write';
}

/** placeMark for points in metres drawn in millimetres, without making the mm list (most marks stay or drift). */
export function placeMarkMm(now: readonly Vec2[], written: ArrayLike<number>, inDrift: boolean, drift: { x: number; y: number } | null): MarkPlace {
  if (now.length * 2 !== written.length) return drift ? 'write-drift' : 'write';
  const near = (ox: number, oy: number): boolean => {
    for (let i = 0; i < now.length; i++) {
      const p = now[i]!;
      if (Math.abs(p.x * 1000 - ox - written[2 * i]!) > DRIFT_EPS || Math.abs(p.y * 1000 - oy - written[2 * i + 1]!) > DRIFT_EPS) return false;
    }
    return true;
  };
  if (drift && near(drift.x, drift.y)) return 'drift';
  if (!inDrift && near(0, 0)) return 'stay';
  return drift ? 'write-drift' : 'write';
}

/** x, y pairs less an offset (the coordinates a mark is written with inside the drift group). */
export function less(flat: number[], off: { x: number; y: number } | null): number[] {
  if (!off) return flat;
  const out = flat.slice();
  for (let i = 0; i < out.length; i += 2) { out[i]! -= off.x; out[i + 1]! -= off.y; }
  return out;
}
