/**
 * The design's proximity limit (format 11): runs of different paths closer than this, edge to edge, get a coupling
 * estimate in the shop check. Kept as the user gave it — a multiple of the substrate height (so it follows a change
 * of laminate) or a length — and turned into metres only where it is used. Absent means three substrate heights, the
 * distance beyond which the single-line model is taken to hold (common practice). 0 switches the check off.
 *
 * One parser for every face: the app's field and the CLI's `--proximity-limit` read text with
 * `proximityLimitSettingFrom`, and the check reads the limit with `proximityLimitFor` (an override from the command
 * line wins over the design's setting). The schema lives here too so the format change stays in one place.
 */
import * as v from 'valibot';
import { InputError, describe } from '../util/errors.ts';
import { parseQuantity, formatQuantity } from '../units/quantity.ts';

export type ProximityLimitSetting =
  | { by: 'heights'; heights: number }
  | { by: 'length'; length: number };

/** The limit a design without its own setting is checked with: three substrate heights (common practice). */
export const DEFAULT_PROXIMITY_LIMIT: ProximityLimitSetting = { by: 'heights', heights: 3 };
/** Beyond about this many heights runs barely couple; a larger limit is a typing slip (our own bound). */
export const PROXIMITY_MAX_HEIGHTS = 50;
/** The largest length limit the file accepts, m (a sanity bound; the check itself also caps it at 50 h). */
const MAX_LENGTH = 0.1;

const HEIGHTS = `a multiple of the substrate height from 0 to ${PROXIMITY_MAX_HEIGHTS}`;
const LENGTH = 'a length in metres from 0 to 0.1 (1 mm is 0.001)';
export const proximityLimitSchema = v.variant('by', [
  v.looseObject({ by: v.literal('heights'), heights: v.pipe(v.number(HEIGHTS), v.finite(HEIGHTS), v.minValue(0, HEIGHTS), v.maxValue(PROXIMITY_MAX_HEIGHTS, HEIGHTS)) }),
  v.looseObject({ by: v.literal('length'), length: v.pipe(v.number(LENGTH), v.finite(LENGTH), v.minValue(0, LENGTH), v.maxValue(MAX_LENGTH, LENGTH)) }),
], 'a proximity limit: by "heights" with heights (3 = three substrate heights), or by "length" with length in metres');

const EXPECTED = 'a multiple of the substrate height such as 3h, or a length such as 1mm (0 switches the check off)';

/** Text as typed in any face ("2.5h", "1mm", "40mil", "0") to a setting; refuses anything else in the user's words. */
export function proximityLimitSettingFrom(text: string, field = 'proximityLimit'): ProximityLimitSetting {
  const m = /^\s*([+]?(?:\d+(?:\.\d*)?|\.\d+))\s*h\s*$/i.exec(typeof text === 'string' ? text : '');
  if (m) {
    const heights = Number(m[1]);
    if (!(Number.isFinite(heights) && heights <= PROXIMITY_MAX_HEIGHTS)) throw new InputError('out-of-range', field, `${EXPECTED}, at most ${PROXIMITY_MAX_HEIGHTS}h`, describe(text), 'beyond a few heights runs barely couple; use a smaller limit');
    return { by: 'heights', heights };
  }
  let length: number;
  try {
    length = parseQuantity(text, 'length', field);
  } catch (e) {
    if (e instanceof InputError) throw new InputError('bad-unit', field, EXPECTED, describe(text), e.hint);
    throw e;
  }
  if (!(Number.isFinite(length) && length >= 0)) throw new InputError('out-of-range', field, EXPECTED, describe(text));
  if (length > MAX_LENGTH) throw new InputError('out-of-range', field, `${EXPECTED}, at most 100 mm`, describe(text), 'beyond a few heights runs barely couple; use a smaller limit');
  return { by: 'length', length };
}

/** A setting in metres on a substrate of height h (m), capped at 50 h. */
export function proximityLimitMetres(setting: ProximityLimitSetting, h: number): number {
  const m = setting.by === 'heights' ? setting.heights * h : setting.length;
  return Math.min(Math.max(m, 0), PROXIMITY_MAX_HEIGHTS * h);
}

/**
 * The proximity limit the shop check uses for `doc`, in metres: the override text when given (the CLI's
 * `--proximity-limit`, named by `field` in errors), else the design's own setting, else three heights.
 */
export function proximityLimitFor(doc: { substrate: { h: number }; proximityLimit?: ProximityLimitSetting }, override?: string, field = 'proximityLimit'): number {
  const h = doc.substrate.h;
  if (override !== undefined) {
    const s = proximityLimitSettingFrom(override, field);
    const metres = s.by === 'heights' ? s.heights * h : s.length;
    if (metres > PROXIMITY_MAX_HEIGHTS * h) throw new InputError('out-of-range', field, `${EXPECTED}, at most ${PROXIMITY_MAX_HEIGHTS}h (${(PROXIMITY_MAX_HEIGHTS * h * 1e3).toFixed(1)} mm here)`, describe(override), 'beyond a few heights runs barely couple; use a smaller limit');
    return metres;
  }
  return proximityLimitMetres(doc.proximityLimit ?? DEFAULT_PROXIMITY_LIMIT, h);
}

/** The setting as text a face shows and the parser reads back ("3h", "1.2 mm", "40 mil"). */
export function proximityLimitText(setting: ProximityLimitSetting, unit: 'mm' | 'mil' = 'mm'): string {
  if (setting.by === 'heights') return `${Number(setting.heights.toPrecision(6))}h`;
  return setting.length === 0 ? '0' : formatQuantity(setting.length, 'length', { unit, digits: 4 });
}
