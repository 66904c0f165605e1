/**
 * Pan and zoom maths of the board view, free of the DOM so it can be tested alone.
 * Board space: metres, y up (core convention). Screen space: CSS pixels, y down, origin at the top-left of the board
 * element. The view is a centre (board point shown in the middle) and a scale (pixels per metre).
 */
import type { Box, Vec2 } from '../../../core/index.ts';

export interface View { cx: number; cy: number; scale: number; width: number; height: number }

/** Closest and farthest zoom: 1 px per 10 mm up to 1 px per 0.2 µm (a board-sized view down to copper-edge detail). */
export const MIN_SCALE = 100;
export const MAX_SCALE = 5e6;

export function clampScale(s: number): number {
  return Math.min(MAX_SCALE, Math.max(MIN_SCALE, s));
}

export function toScreen(v: View, p: Vec2): Vec2 {
  return { x: (p.x - v.cx) * v.scale + v.width / 2, y: v.height / 2 - (p.y - v.cy) * v.scale };
}

export function toBoard(v: View, s: Vec2): Vec2 {
  return { x: (s.x - v.width / 2) / v.scale + v.cx, y: (v.height / 2 - s.y) / v.scale + v.cy };
}

/** Zoom by `factor` keeping the board point under screen point `at` fixed (wheel zoom around the cursor). */
export function zoomAt(v: View, at: Vec2, factor: number): View {
  const before = toBoard(v, at);
  const scale = clampScale(v.scale * factor);
  const next = { ...v, scale };
  const after = toBoard(next, at);
  return { ...next, cx: v.cx + (before.x - after.x), cy: v.cy + (before.y - after.y) };
}

/** Move the view by a screen-space drag of (dx, dy) pixels. */
export function panBy(v: View, dx: number, dy: number): View {
  return { ...v, cx: v.cx - dx / v.scale, cy: v.cy + dy / v.scale };
}

/** The view that shows `box` whole with `marginPx` pixels of air on every side. */
export function fitBox(v: View, box: Box, marginPx = 32): View {
  const w = Math.max(box.maxX - box.minX, 1e-4);
  const h = Math.max(box.maxY - box.minY, 1e-4);
  const sx = Math.max(v.width - 2 * marginPx, 10) / w;
  const sy = Math.max(v.height - 2 * marginPx, 10) / h;
  return { ...v, cx: (box.minX + box.maxX) / 2, cy: (box.minY + box.maxY) / 2, scale: clampScale(Math.min(sx, sy)) };
}

/** The board-space rectangle currently on screen. */
export function visibleBox(v: View): Box {
  const a = toBoard(v, { x: 0, y: v.height });
  const b = toBoard(v, { x: v.width, y: 0 });
  return { minX: a.x, minY: a.y, maxX: b.x, maxY: b.y };
}

/** Bounding box of points, or null for none. */
export function boxOf(points: Iterable<Vec2>): Box | null {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const p of points) {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  }
  return Number.isFinite(minX) ? { minX, minY, maxX, maxY } : null;
}
