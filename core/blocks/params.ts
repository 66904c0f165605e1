/**
 * Parameters of a block: each declares its name, unit, range, default and a one-line meaning, and `readSpec` turns
 * what a face passes (text with units from a form or the command line, or SI numbers from a file) into a checked
 * spec in SI. Every refusal is an InputError naming the field, what was expected, what was found and how to fix it.
 */
import { parseQuantity, type QuantityKind } from '../units/index.ts';
import { InputError, describe } from '../util/errors.ts';

export type ParamValue = number | string | boolean | number[] | { re: number; im: number };

interface ParamBase {
  /** Spec key; the command line option is its kebab-case form (`ratioDb` → `--ratio-db`). */
  name: string;
  /** One line: what it means. */
  meaning: string;
  /** Only asked when `when` holds for the other values (e.g. ripple only for an equal-ripple response). */
  when?: (spec: Record<string, ParamValue>) => boolean;
}
export type ParamDef = ParamBase & (
  | { type: 'number'; unit: QuantityKind | 'none'; min: number; max: number; default?: number; optional?: boolean }
  | { type: 'integer'; min: number; max: number; default: number }
  | { type: 'choice'; choices: readonly string[]; default: string }
  /** A list of numbers in `unit` (e.g. per-output dB), at most `max` entries; empty allowed when optional. */
  | { type: 'list'; unit: QuantityKind; max: number; optional: true }
  /** A complex impedance, `30-20j` Ω. */
  | { type: 'complex'; optional?: boolean }
  /** Text (e.g. a Touchstone file's contents). */
  | { type: 'text'; optional: true; maxChars: number }
);

/** `ratioDb` → `ratio-db` */
export function optionName(name: string): string { return name.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`); }

/** Unit words for forms and help. */
export const UNIT_WORDS: Record<QuantityKind | 'none', string> = {
  length: 'mm', frequency: 'GHz', impedance: 'Ω', angle: '°', db: 'dB', conductivity: 'S/m', ratio: '', resistance: 'Ω',
  capacitance: 'pF', inductance: 'nH', speed: 'm/s', none: '',
};

/** The range of a numeric parameter in words, in display units. */
export function rangeText(p: ParamDef): string {
  if (p.type === 'integer') return `${p.min} to ${p.max}`;
  if (p.type !== 'number') return '';
  const s = displayScale(p.unit);
  return `${+(p.min / s).toPrecision(4)} to ${+(p.max / s).toPrecision(4)}${UNIT_WORDS[p.unit] ? ' ' + UNIT_WORDS[p.unit] : ''}`;
}
export function displayScale(unit: QuantityKind | 'none'): number {
  return unit === 'length' ? 1e-3 : unit === 'frequency' ? 1e9 : unit === 'capacitance' ? 1e-12 : unit === 'inductance' ? 1e-9 : 1;
}
/** A default in display units, for forms and help. */
export function defaultText(p: ParamDef): string {
  if (p.type === 'number') return p.default === undefined ? '' : `${+(p.default / displayScale(p.unit)).toPrecision(6)}${UNIT_WORDS[p.unit] ? ' ' + UNIT_WORDS[p.unit] : ''}`;
  if (p.type === 'integer' || p.type === 'choice') return String(p.default);
  return '';
}

/** Parses `30-20j`, `30 - 20j`, `50`, `-5j` (Ω). */
export function parseComplex(text: string, field: string): { re: number; im: number } {
  const s = text.replace(/\s+/g, '').replace(/(Ω|ohms?)$/i, '').replace(/(Ω|ohms?)(?=[+-])/i, '');
  const m = /^([+-]?\d+(?:\.\d*)?(?:e[+-]?\d+)?)?(?:([+-])(\d+(?:\.\d*)?(?:e[+-]?\d+)?)?j)?$/i.exec(s);
  if (!s || !m || (m[1] === undefined && m[2] === undefined)) {
    throw new InputError('bad-unit', field, 'a complex impedance in ohms such as 30-20j or 75', describe(text), 'write the real part, then + or − and the imaginary part followed by j');
  }
  const re = m[1] === undefined ? 0 : Number(m[1]);
  const im = m[2] === undefined ? 0 : (m[2] === '-' ? -1 : 1) * (m[3] === undefined ? 1 : Number(m[3]));
  return { re, im };
}

function numberOf(p: ParamDef & { type: 'number' }, raw: unknown, field: string): number {
  const v = typeof raw === 'string' ? (p.unit === 'none' ? Number(raw.trim()) : parseQuantity(raw, p.unit, field)) : raw;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError('invalid-number', field, `a number from ${rangeText(p)}`, describe(raw), `give ${p.meaning.toLowerCase()}`);
  if (v < p.min || v > p.max) throw new InputError('out-of-range', field, `a value from ${rangeText(p)}`, describe(raw), `choose a value in that range (${p.meaning.toLowerCase()})`);
  return v;
}

/**
 * Checks `raw` against `params` and fills defaults: the returned spec has every asked parameter in SI. Unknown keys
 * are refused (a misspelt option must not be silently ignored).
 */
export function readSpec(block: string, params: readonly ParamDef[], raw: Record<string, unknown>): Record<string, ParamValue> {
  if (raw === null || typeof raw !== 'object') throw new InputError('invalid-design', block, 'a block spec (an object of parameters)', describe(raw));
  const known = new Set(params.map((p) => p.name));
  for (const k of Object.keys(raw)) {
    if (!known.has(k)) throw new InputError('bad-choice', `${block}.${k}`, `one of the block's parameters: ${params.map((p) => p.name).join(', ')}`, describe(k), `see 'stripwright block ${block} --help'`);
  }
  const out: Record<string, ParamValue> = {};
  for (const p of params) {
    if (p.when && !p.when(out)) continue;
    const field = `${block}.${p.name}`;
    const v = raw[p.name];
    if (v === undefined || v === '') {
      if ('default' in p && p.default !== undefined) out[p.name] = p.default;
      else if (!('optional' in p && p.optional)) throw new InputError('invalid-number', field, p.meaning, 'nothing', `give --${optionName(p.name)}`);
      continue;
    }
    switch (p.type) {
      case 'number': out[p.name] = numberOf(p, v, field); break;
      case 'integer': {
        const n = typeof v === 'string' ? Number(v.trim()) : v;
        if (typeof n !== 'number' || !Number.isInteger(n) || n < p.min || n > p.max) throw new InputError('out-of-range', field, `a whole number from ${p.min} to ${p.max}`, describe(v), `give ${p.meaning.toLowerCase()}`);
        out[p.name] = n; break;
      }
      case 'choice': {
        if (typeof v !== 'string' || !p.choices.includes(v)) throw new InputError('bad-choice', field, `one of ${p.choices.join(', ')}`, describe(v), p.meaning);
        out[p.name] = v; break;
      }
      case 'list': {
        const items = typeof v === 'string' ? v.split(/[,;\s]+/).filter(Boolean) : Array.isArray(v) ? v : null;
        if (!items) throw new InputError('invalid-number', field, `a list of numbers separated by commas (${UNIT_WORDS[p.unit]})`, describe(v));
        if (items.length > p.max) throw new InputError('out-of-range', field, `at most ${p.max} values`, `${items.length} values`, 'give one value per output');
        out[p.name] = items.map((x, i) => {
          const n = typeof x === 'string' ? parseQuantity(x, p.unit, `${field}[${i}]`) : x;
          if (typeof n !== 'number' || !Number.isFinite(n)) throw new InputError('invalid-number', `${field}[${i}]`, 'a number', describe(x));
          return n;
        });
        break;
      }
      case 'complex': {
        const z = typeof v === 'string' ? parseComplex(v, field) : v as { re: number; im: number };
        if (!z || typeof z !== 'object' || !Number.isFinite(z.re) || !Number.isFinite(z.im)) throw new InputError('invalid-number', field, 'a complex impedance such as 30-20j', describe(v));
        if (!(z.re > 0 && z.re <= 1e4 && Math.abs(z.im) <= 1e4)) throw new InputError('out-of-range', field, 'a passive load: real part above 0 Ω and at most 10 kΩ, imaginary part within ±10 kΩ', `${z.re}${z.im < 0 ? '-' : '+'}${Math.abs(z.im)}j`, 'a load with no resistance cannot be matched by lossless stubs');
        out[p.name] = { re: z.re, im: z.im }; break;
      }
      case 'text': {
        if (typeof v !== 'string' || v.length > p.maxChars) throw new InputError('out-of-range', field, `text of at most ${p.maxChars} characters`, describe(v));
        out[p.name] = v; break;
      }
    }
  }
  return out;
}
