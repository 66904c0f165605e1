/**
 * Numeric command-line options, all read through the core's one units parser (core/units): "5deg", "2dB", "50ohm"
 * and "201" mean what they mean in a design file or a panel. Bare numbers stay accepted where the quantity has a
 * natural unit (degrees, dB, ohms, plain counts and ratios); a bare frequency or length is refused by the parser
 * itself, with a suggestion. A value outside the option's range is a usage error naming the range.
 */
import { parseQuantity, formatQuantity, InputError, type QuantityKind } from '../core/index.ts';
import { UsageError } from './registry.ts';

export interface OptionRange { min: number; max: number; minExclusive?: boolean }

/** Parses `--flag` as a quantity of `kind` (SI), within the range; undefined when the flag is absent. */
export function quantityOption(flag: string, text: string | undefined, kind: QuantityKind, range?: OptionRange): number | undefined {
  if (text === undefined) return undefined;
  let v: number;
  try { v = parseQuantity(text, kind, `--${flag}`); } catch (e) {
    if (e instanceof InputError) throw new UsageError(`--${flag}: expected ${e.expected}, got ${e.got}${e.hint ? ` (${e.hint})` : ''}`);
    throw e;
  }
  if (range && (v > range.max || (range.minExclusive ? v <= range.min : v < range.min))) {
    const show = (x: number) => (kind === 'ratio' ? String(x) : formatQuantity(x, kind));
    throw new UsageError(`--${flag} expects ${range.minExclusive ? 'above' : 'at least'} ${show(range.min)} and up to ${show(range.max)}, got '${text}'`);
  }
  return v;
}

/** An angle option in degrees ("5", "5deg", "5°" or "0.087rad"), within [min, max] degrees. */
export function degreesOption(flag: string, text: string | undefined, range: OptionRange): number | undefined {
  const rad = quantityOption(flag, text, 'angle', { ...range, min: (range.min * Math.PI) / 180, max: (range.max * Math.PI) / 180 });
  return rad === undefined ? undefined : (rad * 180) / Math.PI;
}

/** A whole-number option (a count, a seed): read by the units parser as a plain number, then checked whole. */
export function countOption(flag: string, text: string | undefined, min: number, max: number): number | undefined {
  if (text === undefined) return undefined;
  let v: number;
  try { v = parseQuantity(text, 'ratio', `--${flag}`); } catch { v = Number.NaN; }
  if (!Number.isInteger(v) || v < min || v > max || /%|ppm/.test(text)) throw new UsageError(`--${flag} expects a whole number from ${min} to ${max}, got '${text}'`);
  return v;
}
