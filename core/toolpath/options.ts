/**
 * Machining settings for the G-code export, with defaults for small desktop routers and bounds taken from the range
 * of real tools and spindles (common practice, values from memory; a machine's own manual has the last word).
 * SI inside: lengths in metres, feed rates in m/s (the faces parse "200mm/min" with core/units), spindle speed in
 * revolutions per minute (the name says so). Every bad value is an InputError naming the option.
 */
import { InputError, describe } from '../util/errors.ts';

const MM = 1e-3;
const MM_PER_MIN = 1e-3 / 60;

export type MillingUnits = 'mm' | 'inch';
export type MillingDirection = 'climb' | 'conventional';

export interface MillingOptions {
  /** G21 (mm) or G20 (inch) in the written files. */
  units: MillingUnits;
  /** Isolation passes around every copper island. */
  passes: number;
  /** Fraction of the cut width each further isolation pass overlaps the previous one. */
  overlap: number;
  /** Climb (spindle turning clockwise, M3: copper on the cutter's left) or conventional. */
  direction: MillingDirection;
  /** Remove all copper that is not part of the design (rings until nothing is left), with the isolation tool. */
  clear: boolean;
  /** Overlap of the clearing rings; at least one half so no copper is left between rings. */
  clearOverlap: number;
  /** Feed rate of isolation and clearing, m/s. */
  feed: number;
  /** Plunge (downward) feed rate of every tool except drills, m/s. */
  plungeFeed: number;
  spindleRpm: number;
  /** Height above the copper for the start, the end and tool changes, m. */
  safeHeight: number;
  /** Height above the copper for moves between cuts, m. */
  travelHeight: number;
  /** Drill the design's holes (one file per drill size). */
  drill: boolean;
  /** Drilling feed rate (downward), m/s. */
  drillFeed: number;
  /** Depth per peck, m; 0 drills each hole in one stroke. */
  peckDepth: number;
  /** How far drills and the cutout go below the bottom of the board, m (into the spoil board). */
  breakthrough: number;
  /** Largest drill on hand, m: larger holes are milled as circles with the cutout tool. */
  maxDrill: number;
  /** Cut the board out along its profile. */
  cutout: boolean;
  /** Diameter of the cutout end mill, m. */
  cutoutTool: number;
  /** Feed rate of the cutout (and of milled holes), m/s. */
  cutoutFeed: number;
  /** Depth per cutout pass, m. */
  stepDown: number;
  /** Holding tabs left on the cutout. */
  tabs: number;
  /** Length of board edge each tab keeps, m. */
  tabWidth: number;
  /** Thickness of board material a tab keeps, m. */
  tabHeight: number;
  /** Write a tool-change line (T… M6) at the start of each file. */
  toolChange: boolean;
  /** The machine's usable travel, m. */
  workArea: { width: number; height: number };
  /** Where the board's lower-left corner (X0 Y0 of the files) sits inside the work area, m. */
  boardAt: { x: number; y: number };
  /** Rapid-move speed used for the time estimate only, m/s. */
  rapidRate: number;
}

export const MILLING_DEFAULTS: Readonly<MillingOptions> = Object.freeze({
  units: 'mm', passes: 2, overlap: 0.4, direction: 'climb', clear: false, clearOverlap: 0.5,
  feed: 200 * MM_PER_MIN, plungeFeed: 50 * MM_PER_MIN, spindleRpm: 10000,
  safeHeight: 5 * MM, travelHeight: 1 * MM,
  drill: true, drillFeed: 60 * MM_PER_MIN, peckDepth: 0.5 * MM, breakthrough: 0.3 * MM, maxDrill: 3 * MM,
  cutout: true, cutoutTool: 1 * MM, cutoutFeed: 120 * MM_PER_MIN, stepDown: 0.4 * MM,
  tabs: 4, tabWidth: 2 * MM, tabHeight: 0.6 * MM,
  toolChange: false,
  workArea: Object.freeze({ width: 200 * MM, height: 150 * MM }), boardAt: Object.freeze({ x: 5 * MM, y: 5 * MM }),
  rapidRate: 1000 * MM_PER_MIN,
}) as Readonly<MillingOptions>;

/** Bounds per numeric option: [min, max, unit shown in messages, factor SI → shown unit]. */
const BOUNDS: Record<string, [number, number, string, number]> = {
  passes: [1, 10, '', 1],
  overlap: [0.1, 0.9, '', 1],
  clearOverlap: [0.5, 0.9, '', 1],
  feed: [10 * MM_PER_MIN, 3000 * MM_PER_MIN, 'mm/min', 1 / MM_PER_MIN],
  plungeFeed: [5 * MM_PER_MIN, 1000 * MM_PER_MIN, 'mm/min', 1 / MM_PER_MIN],
  spindleRpm: [1000, 60000, 'rpm', 1],
  safeHeight: [1 * MM, 50 * MM, 'mm', 1 / MM],
  travelHeight: [0.2 * MM, 20 * MM, 'mm', 1 / MM],
  drillFeed: [5 * MM_PER_MIN, 1000 * MM_PER_MIN, 'mm/min', 1 / MM_PER_MIN],
  peckDepth: [0, 5 * MM, 'mm', 1 / MM],
  breakthrough: [0, 2 * MM, 'mm', 1 / MM],
  maxDrill: [0.3 * MM, 6.5 * MM, 'mm', 1 / MM],
  cutoutTool: [0.5 * MM, 6.35 * MM, 'mm', 1 / MM],
  cutoutFeed: [10 * MM_PER_MIN, 3000 * MM_PER_MIN, 'mm/min', 1 / MM_PER_MIN],
  stepDown: [0.05 * MM, 3 * MM, 'mm', 1 / MM],
  tabs: [0, 16, '', 1],
  tabWidth: [0.5 * MM, 10 * MM, 'mm', 1 / MM],
  tabHeight: [0.1 * MM, 5 * MM, 'mm', 1 / MM],
  rapidRate: [100 * MM_PER_MIN, 20000 * MM_PER_MIN, 'mm/min', 1 / MM_PER_MIN],
};
const INTEGER = new Set(['passes', 'tabs']);
const AREA: [number, number] = [20 * MM, 2000 * MM];
const AT: [number, number] = [0, 1000 * MM];

function range(field: string, v: unknown, [lo, hi, unit, k]: [number, number, string, number]): string {
  const f = (x: number) => `${Number((x * k).toPrecision(6))}${unit ? ` ${unit}` : ''}`;
  return `${INTEGER.has(field) ? 'a whole number' : 'a value'} from ${f(lo)} to ${f(hi)}`;
}

/**
 * Defaults filled in and every value checked. Throws InputError('out-of-range' | 'bad-choice') naming the option
 * (as `field`), the accepted range in the unit people use (mm, mm/min), and what was given.
 */
export function resolveMillingOptions(given: Partial<MillingOptions> = {}): MillingOptions {
  if (given === null || typeof given !== 'object') throw new InputError('bad-choice', 'milling', 'an object of machining options', describe(given));
  const o: MillingOptions = { ...MILLING_DEFAULTS, ...given, workArea: { ...MILLING_DEFAULTS.workArea, ...(given.workArea ?? {}) }, boardAt: { ...MILLING_DEFAULTS.boardAt, ...(given.boardAt ?? {}) } };
  for (const [field, b] of Object.entries(BOUNDS)) {
    const v = (o as unknown as Record<string, unknown>)[field];
    const ok = typeof v === 'number' && Number.isFinite(v) && v >= b[0] && v <= b[1] && (!INTEGER.has(field) || Number.isInteger(v));
    const zeroPeck = field === 'peckDepth' && v === 0;
    if (!ok && !zeroPeck) throw new InputError('out-of-range', field, range(field, v, b), typeof v === 'number' && Number.isFinite(v) ? `${Number((v * b[3]).toPrecision(6))}${b[2] ? ` ${b[2]}` : ''}` : describe(v));
    if (field === 'peckDepth' && typeof v === 'number' && v > 0 && v < 0.1 * MM) {
      throw new InputError('out-of-range', field, '0 (no pecking) or a peck from 0.1 mm to 5 mm', `${v / MM} mm`);
    }
  }
  for (const [field, v, [lo, hi]] of [['workArea.width', o.workArea.width, AREA], ['workArea.height', o.workArea.height, AREA], ['boardAt.x', o.boardAt.x, AT], ['boardAt.y', o.boardAt.y, AT]] as const) {
    if (typeof v !== 'number' || !Number.isFinite(v) || v < lo || v > hi) throw new InputError('out-of-range', field, `a length from ${lo / MM} mm to ${hi / MM} mm`, describe(v));
  }
  if (o.units !== 'mm' && o.units !== 'inch') throw new InputError('bad-choice', 'units', "'mm' (G21) or 'inch' (G20)", describe(o.units));
  if (o.direction !== 'climb' && o.direction !== 'conventional') throw new InputError('bad-choice', 'direction', "'climb' or 'conventional'", describe(o.direction));
  for (const k of ['clear', 'drill', 'cutout', 'toolChange'] as const) {
    if (typeof o[k] !== 'boolean') throw new InputError('bad-choice', k, 'true or false', describe(o[k]));
  }
  if (o.travelHeight > o.safeHeight) {
    throw new InputError('out-of-range', 'travelHeight', `a travel height no higher than the safe height (${o.safeHeight / MM} mm)`, `${o.travelHeight / MM} mm`, 'lower the travel height or raise the safe height');
  }
  return o;
}
