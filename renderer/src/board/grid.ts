/**
 * Grid and ruler ticks: which lines to draw for the current view, in mm or mil.
 * 1 mil = 25.4 µm exactly (the inch is 25.4 mm by definition: international yard and pound agreement, 1959).
 */
import type { View } from './viewport.ts';
import { visibleBox } from './viewport.ts';

export type LengthUnit = 'mm' | 'mil';
export const UNIT_METRES: Record<LengthUnit, number> = { mm: 1e-3, mil: 25.4e-6 };

/** Nice steps per unit: 1-2-5 decades for mm, and the mil steps boards are usually drawn on (common practice). */
const STEPS: Record<LengthUnit, number[]> = {
  mm: [0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 50, 100],
  mil: [1, 2, 5, 10, 25, 50, 100, 250, 500, 1000, 2000, 5000],
};

/** The smallest nice step (in metres) whose lines are at least `minPx` apart on screen. */
export function niceStep(unit: LengthUnit, scale: number, minPx: number): number {
  const u = UNIT_METRES[unit];
  for (const s of STEPS[unit]) if (s * u * scale >= minPx) return s * u;
  return STEPS[unit][STEPS[unit].length - 1] * u;
}

export interface GridLines { step: number; xs: number[]; ys: number[] }

/**
 * Board-space positions of the grid lines on screen. The drawn step is the snap step, coarsened in powers of its
 * nice sequence while lines would crowd closer than `minPx` (so the grid never turns into a grey fill).
 */
export function gridLines(v: View, snapStep: number, unit: LengthUnit, minPx = 8): GridLines {
  let step = snapStep;
  if (!(step > 0) || step * v.scale < minPx) step = Math.max(step > 0 ? step : 0, niceStep(unit, v.scale, minPx));
  // Keep coarsening in whole multiples of the snap step so every drawn line is a snap line.
  if (snapStep > 0) step = Math.ceil(step / snapStep - 1e-9) * snapStep;
  const b = visibleBox(v);
  const xs: number[] = [], ys: number[] = [];
  const max = 400;
  for (let i = Math.ceil(b.minX / step); i * step <= b.maxX && xs.length < max; i++) xs.push(i * step);
  for (let i = Math.ceil(b.minY / step); i * step <= b.maxY && ys.length < max; i++) ys.push(i * step);
  return { step, xs, ys };
}

/**
 * Ruler steps in the display unit: the labelled step is the smallest 1-2-5 multiple of a power of ten (in mm or
 * mil) at least `minPx` apart on screen; minor ticks divide it in 5 (steps of 1 and 5) or 4 (steps of 2). Both are
 * returned in metres.
 */
export function rulerSteps(unit: LengthUnit, scale: number, minPx: number): { step: number; minor: number } {
  const u = UNIT_METRES[unit];
  const want = minPx / (scale * u); // the smallest step in the unit that is far enough apart
  let decade = Math.pow(10, Math.floor(Math.log10(Math.max(want, 1e-9))));
  for (let guard = 0; guard < 40; guard++) {
    for (const m of [1, 2, 5]) {
      const st = m * decade;
      if (st >= want * (1 - 1e-9)) return { step: st * u, minor: (st / (m === 2 ? 4 : 5)) * u };
    }
    decade *= 10;
  }
  return { step: decade * u, minor: (decade / 5) * u };
}

/** Ruler label of a board coordinate in the chosen unit, without trailing zeros. */
export function rulerLabel(value: number, unit: LengthUnit, step: number): string {
  const inUnit = value / UNIT_METRES[unit];
  const stepInUnit = step / UNIT_METRES[unit];
  const decimals = Math.max(0, Math.min(4, Math.ceil(-Math.log10(stepInUnit) - 1e-9)));
  const text = inUnit.toFixed(decimals === 0 ? 0 : decimals);
  return text === '-0' || /^-0\.0*$/.test(text) ? text.slice(1) : text;
}
