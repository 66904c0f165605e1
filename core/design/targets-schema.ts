/**
 * The valibot schemas of targets and tolerances (format 3), kept beside design/schema.ts so the two lists stay easy to
 * find and change together. Loose objects: fields this version does not know are kept.
 */
import * as v from 'valibot';
import { TARGET_FIGURES, TOLERANCE_QUANTITIES } from './targets.ts';

const ID_WHAT = 'an id of 1 to 64 letters, digits, \'_\', \'-\', \'.\' or \':\'';
const id = v.pipe(v.string(ID_WHAT), v.regex(/^[A-Za-z0-9_.:-]{1,64}$/, ID_WHAT));

function num(what: string, min: number, max: number) {
  return v.pipe(v.number(what), v.finite(what), v.minValue(min, what), v.maxValue(max, what));
}

const FREQ = 'a frequency in hertz from 1 MHz to 300 GHz (2.45 GHz is 2450000000)';
const LIMIT = 'a limit in dB or degrees within ±1000';

export const MAX_TARGETS = 200;

export const targetSchema = v.looseObject({
  id,
  name: v.optional(v.pipe(v.string('a name'), v.maxLength(200, 'a name of at most 200 characters'))),
  figure: v.picklist(TARGET_FIGURES, `a figure: ${TARGET_FIGURES.map((f) => `"${f}"`).join(', ')}`),
  ports: v.optional(v.pipe(v.array(id, 'a list of port ids'), v.minLength(1, 'at least one port id'), v.maxLength(2, 'at most two port ids'))),
  group: v.optional(id),
  band: v.looseObject({ start: num(FREQ, 1e6, 300e9), stop: num(FREQ, 1e6, 300e9) }, 'a band {start, stop} in hertz'),
  limit: v.pipe(
    v.looseObject({ min: v.optional(num(LIMIT, -1000, 1000)), max: v.optional(num(LIMIT, -1000, 1000)) }, 'a limit {min?, max?}'),
    v.check((l) => l.min !== undefined || l.max !== undefined, 'a limit with a min, a max or both'),
    v.check((l) => l.min === undefined || l.max === undefined || l.min <= l.max, 'a limit whose min is not above its max'),
  ),
}, 'a target {id, figure, ports or group, band, limit}');

/** Widest spread accepted per quantity: sanity bounds that catch unit slips (a tolerance of 0.05 meaning mm). */
const SPREAD_MAX = 1;

export const toleranceSchema = v.looseObject({
  quantity: v.picklist(TOLERANCE_QUANTITIES, `a quantity: ${TOLERANCE_QUANTITIES.map((q) => `"${q}"`).join(', ')}`),
  distribution: v.picklist(['normal', 'uniform'], 'a distribution "normal" (spread = σ) or "uniform" (spread = ±half-width)'),
  spread: num('a spread from 0 to 1 in the quantity\'s unit (m, none, or a fraction for parts: 0.01 = 1 %)', 0, SPREAD_MAX),
  scope: v.picklist(['board', 'piece'], 'a scope "board" (one draw per board) or "piece" (a draw per piece)'),
}, 'a tolerance {quantity, distribution, spread, scope}');

export const targetsSchema = v.pipe(v.array(targetSchema, 'a list of targets'), v.maxLength(MAX_TARGETS, `at most ${MAX_TARGETS} targets`));
export const tolerancesSchema = v.pipe(v.array(toleranceSchema, 'a list of tolerances'), v.maxLength(100, 'at most 100 tolerances'));
