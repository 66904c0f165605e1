/**
 * The one parser and formatter of quantities with units. Every face (CLI flags, batch files, panels, design files
 * written by hand) reads numbers through `parseQuantity`, so "1.6mm", "62 mil", "1oz" or "5.8 GHz" mean the same
 * everywhere. Inside the core everything is SI: metres, hertz, ohms, radians, siemens per metre, farads, henries;
 * decibels stay decibels and ratios stay plain numbers.
 *
 * Unit factors (exact by definition unless noted):
 *  - 1 in = 25.4 mm (international inch, 1959); 1 mil = 1 thou = 0.001 in = 25.4 µm.
 *  - 1 oz copper = 35 µm: the trade's copper weight, 1 oz of copper spread over 1 ft² (34.79 µm, usually rounded
 *    to 35 µm on laminate data sheets) — common practice, value from memory.
 *  - 100 %IACS = 58.0 MS/m: International Annealed Copper Standard (1913), resistivity 1/58 Ω·mm²/m.
 */
import { InputError, describe } from '../util/errors.ts';

export type QuantityKind =
  | 'length' | 'frequency' | 'impedance' | 'angle' | 'db' | 'conductivity'
  | 'ratio' | 'resistance' | 'capacitance' | 'inductance' | 'speed';

export const QUANTITY_KINDS: readonly QuantityKind[] = [
  'length', 'frequency', 'impedance', 'angle', 'db', 'conductivity', 'ratio', 'resistance', 'capacitance', 'inductance', 'speed',
];

/** 1 oz/ft² copper foil thickness used throughout the tool, m (common practice: 35 µm). */
export const OZ_COPPER_M = 35e-6;
/** 100 %IACS conductivity, S/m (International Annealed Copper Standard). */
export const IACS_S_PER_M = 5.8e7;

interface KindRule {
  /** Unit spellings (exact, case-sensitive) → factor to SI. */
  units: Record<string, number>;
  /** Factor for a bare number, or null when a unit is required (a bare non-zero number is refused). */
  bare: number | null;
  /** Spellings also accepted case-insensitively (no clash with another unit of the kind). */
  caseless?: boolean;
  /** Short list for error messages. */
  hint: string;
}

const MICRO = ['µ', 'μ', 'u']; // micro sign U+00B5, Greek mu U+03BC, ASCII u

function withPrefixes(base: string[], prefixes: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const b of base) {
    out[b] = 1;
    for (const [p, k] of Object.entries(prefixes)) {
      if (p === 'µ') for (const m of MICRO) out[m + b] = k;
      else out[p + b] = k;
    }
  }
  return out;
}

const OHM = ['Ω', 'Ω', 'ohm', 'ohms', 'Ohm', 'Ohms']; // U+03A9 Greek capital omega and U+2126 ohm sign

const RULES: Record<QuantityKind, KindRule> = {
  length: {
    units: {
      m: 1, cm: 1e-2, mm: 1e-3, 'µm': 1e-6, 'μm': 1e-6, um: 1e-6, nm: 1e-9,
      mil: 25.4e-6, mils: 25.4e-6, thou: 25.4e-6, in: 25.4e-3, inch: 25.4e-3, '"': 25.4e-3,
      oz: OZ_COPPER_M,
    },
    bare: null,
    hint: 'a length with a unit: m, mm, µm (or um), mil, in, or oz for copper weight, e.g. 1.6mm',
  },
  // A bare frequency is refused: "2.45" is far more often meant as GHz than as hertz, and taking it as 2.45 Hz
  // without a word sized lines for DC. The refusal suggests the likely unit (see bareFrequencyGuess).
  frequency: {
    units: { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9, THz: 1e12 },
    bare: null,
    caseless: true, // nobody means millihertz here: "mhz" is MHz
    hint: 'a frequency with a unit: Hz, kHz, MHz or GHz, e.g. 5.8GHz',
  },
  impedance: {
    units: withPrefixes(OHM, { m: 1e-3, k: 1e3, M: 1e6 }),
    bare: 1,
    hint: 'an impedance: Ω (or ohm), kΩ, e.g. 50ohm (a bare number is ohms)',
  },
  resistance: {
    units: withPrefixes(OHM, { m: 1e-3, k: 1e3, M: 1e6 }),
    bare: 1,
    hint: 'a resistance: mΩ, Ω (or ohm), kΩ, MΩ, e.g. 100ohm (a bare number is ohms)',
  },
  angle: {
    units: { deg: Math.PI / 180, '°': Math.PI / 180, degrees: Math.PI / 180, rad: 1, mrad: 1e-3 },
    bare: Math.PI / 180, // the trade quotes electrical length in degrees
    hint: 'an angle: deg (or °) or rad, e.g. 90deg (a bare number is degrees)',
  },
  db: { units: { dB: 1, db: 1 }, bare: 1, hint: 'a level in dB, e.g. 3dB' },
  conductivity: {
    units: { 'S/m': 1, 'kS/m': 1e3, 'MS/m': 1e6, '%IACS': IACS_S_PER_M / 100 },
    bare: 1,
    hint: 'a conductivity: S/m, MS/m or %IACS, e.g. 58MS/m (a bare number is S/m)',
  },
  ratio: { units: { '%': 1e-2, ppm: 1e-6 }, bare: 1, hint: 'a plain number (or a percentage), e.g. 4.4 or 0.02' },
  capacitance: {
    units: { F: 1, mF: 1e-3, 'µF': 1e-6, 'μF': 1e-6, uF: 1e-6, nF: 1e-9, pF: 1e-12, fF: 1e-15 },
    bare: null,
    hint: 'a capacitance with a unit: pF, nF, µF (or uF), fF, e.g. 1.5pF',
  },
  inductance: {
    units: { H: 1, mH: 1e-3, 'µH': 1e-6, 'μH': 1e-6, uH: 1e-6, nH: 1e-9, pH: 1e-12 },
    bare: null,
    hint: 'an inductance with a unit: nH, µH (or uH), pH, e.g. 2.2nH',
  },
  // Feed rates of a machine tool: the trade quotes them per minute (mm/min, in/min); SI inside is m/s.
  speed: {
    units: { 'm/s': 1, 'mm/s': 1e-3, 'mm/min': 1e-3 / 60, 'm/min': 1 / 60, 'in/min': 25.4e-3 / 60, ipm: 25.4e-3 / 60, 'in/s': 25.4e-3 },
    bare: null,
    hint: 'a feed rate with a unit: mm/min, mm/s, in/min (or ipm), m/s, e.g. 200mm/min',
  },
};

const NUMBER_RE = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/;

function caselessLookup(units: Record<string, number>, u: string): number | undefined {
  const lower = u.toLowerCase();
  for (const [k, v] of Object.entries(units)) if (k.toLowerCase() === lower) return v;
  return undefined;
}

/**
 * Parses a value with a unit into SI. Examples: parseQuantity('1.6mm', 'length') → 0.0016;
 * parseQuantity('5.8 GHz', 'frequency') → 5.8e9; parseQuantity('1oz', 'length') → 35e-6;
 * parseQuantity('90', 'angle') → π/2 (bare angles are degrees).
 * A bare 0 is accepted for every kind. Throws InputError('bad-unit') naming what was expected.
 */
export function parseQuantity(text: string, kind: QuantityKind, field: string = kind): number {
  const rule = RULES[kind];
  if (!rule) throw new InputError('bad-choice', 'kind', `one of ${QUANTITY_KINDS.join(', ')}`, describe(kind));
  if (typeof text !== 'string') throw new InputError('bad-unit', field, rule.hint, describe(text));
  const s = text.trim();
  if (/^[+-]?\d+,\d+/.test(s)) {
    throw new InputError('bad-unit', field, rule.hint, describe(text), 'use a point as the decimal separator');
  }
  const m = NUMBER_RE.exec(s);
  if (!m) throw new InputError('bad-unit', field, rule.hint, describe(text), 'start with a number');
  const num = Number(m[1]);
  const unit = m[2]!.trim();
  if (!Number.isFinite(num)) throw new InputError('bad-unit', field, rule.hint, describe(text), 'the number is too large');
  let factor: number | undefined;
  if (unit === '') {
    if (rule.bare === null && num !== 0) {
      throw new InputError('bad-unit', field, rule.hint, describe(text), kind === 'frequency' ? `add a unit: did you mean ${bareFrequencyGuess(m[1]!, num)}?` : 'add a unit');
    }
    factor = rule.bare ?? 1;
  } else {
    factor = Object.prototype.hasOwnProperty.call(rule.units, unit) ? rule.units[unit] : undefined;
    if (factor === undefined && rule.caseless) factor = caselessLookup(rule.units, unit);
    if (factor === undefined) {
      throw new InputError('bad-unit', field, rule.hint, describe(text), `'${unit}' is not a unit of ${kind}`);
    }
  }
  const v = num * factor;
  if (!Number.isFinite(v)) throw new InputError('bad-unit', field, rule.hint, describe(text), 'the value is too large');
  return v;
}

/**
 * The unit a bare frequency was most likely meant in, for the refusal's "did you mean …?": microstrip work lies
 * between about 1 MHz and 300 GHz, so a small number is GHz, a middling one MHz and a large one hertz.
 */
function bareFrequencyGuess(written: string, num: number): string {
  const mag = Math.abs(num);
  return `${written} ${mag <= 300 ? 'GHz' : mag < 1e6 ? 'MHz' : 'Hz'}`;
}

/** Display units per kind, largest first: [unit, factor to SI, smallest magnitude shown in it (SI)]. */
const DISPLAY: Record<QuantityKind, [string, number, number][]> = {
  length: [['m', 1, 1], ['mm', 1e-3, 1e-4], ['µm', 1e-6, 1e-7], ['nm', 1e-9, 0]],
  frequency: [['THz', 1e12, 1e12], ['GHz', 1e9, 1e9], ['MHz', 1e6, 1e6], ['kHz', 1e3, 1e3], ['Hz', 1, 0]],
  impedance: [['MΩ', 1e6, 1e6], ['kΩ', 1e3, 1e4], ['Ω', 1, 0.1], ['mΩ', 1e-3, 0]],
  resistance: [['MΩ', 1e6, 1e6], ['kΩ', 1e3, 1e3], ['Ω', 1, 1], ['mΩ', 1e-3, 0]],
  angle: [['°', Math.PI / 180, 0]],
  db: [['dB', 1, 0]],
  conductivity: [['MS/m', 1e6, 1e6], ['kS/m', 1e3, 1e3], ['S/m', 1, 0]],
  ratio: [['', 1, 0]],
  capacitance: [['F', 1, 1], ['mF', 1e-3, 1e-3], ['µF', 1e-6, 1e-6], ['nF', 1e-9, 1e-9], ['pF', 1e-12, 1e-12], ['fF', 1e-15, 0]],
  inductance: [['H', 1, 1], ['mH', 1e-3, 1e-3], ['µH', 1e-6, 1e-6], ['nH', 1e-9, 1e-9], ['pH', 1e-12, 0]],
  speed: [['mm/min', 1e-3 / 60, 0]],
};

/**
 * Formats an SI value for people: formatQuantity(0.0015123, 'length') → '1.512 mm'.
 * `unit` forces a unit (any spelling parseQuantity knows for the kind, e.g. 'mil', 'ohm');
 * `digits` is the number of significant digits (default 4). Throws InputError for a non-finite value.
 */
export function formatQuantity(value: number, kind: QuantityKind, opts: { unit?: string; digits?: number } = {}): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError('invalid-number', 'value', 'a finite number to format', describe(value));
  }
  const rule = RULES[kind];
  if (!rule) throw new InputError('bad-choice', 'kind', `one of ${QUANTITY_KINDS.join(', ')}`, describe(kind));
  const digits = opts.digits ?? 4;
  if (!Number.isInteger(digits) || digits < 1 || digits > 17) {
    throw new InputError('out-of-range', 'digits', 'a whole number of significant digits from 1 to 17', String(opts.digits));
  }
  let unit: string;
  let factor: number;
  if (opts.unit !== undefined) {
    const f = rule.units[opts.unit] ?? (opts.unit === '' && rule.bare !== null ? rule.bare : undefined);
    if (f === undefined) throw new InputError('bad-unit', 'unit', rule.hint, describe(opts.unit));
    unit = opts.unit;
    factor = f;
  } else {
    const list = DISPLAY[kind];
    const mag = Math.abs(value);
    let pick = list[list.length - 1]!;
    for (const entry of list) if (mag >= entry[2] * 0.99995) { pick = entry; break; }
    if (mag === 0) pick = list.find((e) => e[1] === 1) ?? pick;
    unit = pick[0]; factor = pick[1];
  }
  const n = value / factor;
  const text = n === 0 ? '0' : String(Number(n.toPrecision(digits)));
  if (unit === '') return text;
  return unit === '°' ? `${text}°` : `${text} ${unit}`;
}
