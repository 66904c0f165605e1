/**
 * The report's drawing vocabulary: what a page holds, in page millimetres with y down from the top-left corner
 * (the way a reader measures a printed page). The PDF writer (pdf.ts) is the only file that knows PDF; layout and
 * plots only make these items, so the pages can be checked as data.
 */

/** Red, green, blue from 0 to 1. */
export type Rgb = readonly [number, number, number];

export type DrawItem =
  | { kind: 'text'; x: number; y: number; /** pt */ size: number; text: string; anchor: 'start' | 'middle' | 'end'; colour: Rgb }
  | { kind: 'stroke'; points: readonly (readonly [number, number])[]; closed: boolean; /** mm */ width: number; colour: Rgb; /** mm on, mm off */ dash?: readonly [number, number] }
  | { kind: 'fill'; /** even-odd rule: holes are subpaths too */ subpaths: readonly (readonly (readonly [number, number])[])[]; colour: Rgb };

export interface ReportPage {
  /** mm */
  width: number;
  height: number;
  items: DrawItem[];
}

/** Text width in mm for a size in pt: the writer's font metrics, passed to the layout so lines wrap where they print. */
export type Measure = (text: string, sizePt: number) => number;

export const INK: Rgb = [0.1, 0.1, 0.12];
export const GREY: Rgb = [0.45, 0.45, 0.48];
export const RULE: Rgb = [0.8, 0.8, 0.82];
export const COPPER: Rgb = [0.72, 0.42, 0.18];

/** Trace colours of the plots; each is used only by traces, so a rendered page can be searched for it. */
export const TRACE_COLOURS: readonly Rgb[] = [
  [0.85, 0.1, 0.1], [0.1, 0.35, 0.85], [0.05, 0.6, 0.2], [0.6, 0.2, 0.7], [0.9, 0.55, 0.0], [0.0, 0.6, 0.65],
];

export const PT_PER_MM = 72 / 25.4;

export function text(x: number, y: number, size: number, s: string, anchor: 'start' | 'middle' | 'end' = 'start', colour: Rgb = INK): DrawItem {
  return { kind: 'text', x, y, size, text: s, anchor, colour };
}

export function line(x1: number, y1: number, x2: number, y2: number, width = 0.2, colour: Rgb = INK, dash?: readonly [number, number]): DrawItem {
  return { kind: 'stroke', points: [[x1, y1], [x2, y2]], closed: false, width, colour, ...(dash ? { dash } : {}) };
}

export function rect(x: number, y: number, w: number, h: number, width = 0.2, colour: Rgb = INK): DrawItem {
  return { kind: 'stroke', points: [[x, y], [x + w, y], [x + w, y + h], [x, y + h]], closed: true, width, colour };
}
