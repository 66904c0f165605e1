/**
 * Snapping while drawing: to the grid, and the heading of a new run to 45° or 90° steps.
 * Pure functions over board coordinates (metres).
 */
import type { Vec2 } from '../../../core/index.ts';

/** Heading rule for a run being drawn: 45° steps, 90° steps, or any angle. */
export type HeadingRule = 'deg45' | 'deg90' | 'free';

/** Nearest grid point; a step of 0 or less turns snapping off. */
export function snapToGrid(p: Vec2, step: number): Vec2 {
  if (!(step > 0)) return p;
  return { x: Math.round(p.x / step) * step, y: Math.round(p.y / step) * step };
}

/**
 * Where the next vertex of a run goes: from `from` towards the cursor, with the heading rounded to the rule's step
 * and the length rounded to the grid step (so a snapped end stays on the grid for axis headings).
 */
export function snapHeading(from: Vec2, cursor: Vec2, rule: HeadingRule, gridStep: number): Vec2 {
  if (rule === 'free') return snapToGrid(cursor, gridStep);
  const dx = cursor.x - from.x, dy = cursor.y - from.y;
  const dist = Math.hypot(dx, dy);
  if (dist === 0) return from;
  const step = rule === 'deg45' ? Math.PI / 4 : Math.PI / 2;
  const heading = Math.round(Math.atan2(dy, dx) / step) * step;
  const ux = Math.cos(heading), uy = Math.sin(heading);
  // Length of the cursor's projection on the snapped heading, rounded to the grid step.
  let len = dx * ux + dy * uy;
  if (gridStep > 0) len = Math.round(len / gridStep) * gridStep;
  len = Math.max(len, 0);
  // Diagonal headings: cos(45°) is irrational, so remove float dust on the axis parts.
  const clean = (v: number) => (Math.abs(v) < 1e-15 ? 0 : v);
  return { x: from.x + clean(ux * len), y: from.y + clean(uy * len) };
}

/** Heading rule from the pointer's modifier keys: Shift limits to 90°, Alt frees the angle. */
export function headingRuleFor(mods: { shiftKey: boolean; altKey: boolean }): HeadingRule {
  if (mods.altKey) return 'free';
  return mods.shiftKey ? 'deg90' : 'deg45';
}

/** Distance from point p to segment ab. */
export function distToSegment(p: Vec2, a: Vec2, b: Vec2): number {
  const abx = b.x - a.x, aby = b.y - a.y;
  const len2 = abx * abx + aby * aby;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * abx + (p.y - a.y) * aby) / len2));
  return Math.hypot(p.x - (a.x + t * abx), p.y - (a.y + t * aby));
}

/** Projection of p on segment ab, clamped to the segment, and its parameter t in [0, 1]. */
export function projectOnSegment(p: Vec2, a: Vec2, b: Vec2): { at: Vec2; t: number } {
  const abx = b.x - a.x, aby = b.y - a.y;
  const len2 = abx * abx + aby * aby;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * abx + (p.y - a.y) * aby) / len2));
  return { at: { x: a.x + t * abx, y: a.y + t * aby }, t };
}
