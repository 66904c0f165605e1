/** Small helper shared by the discontinuity models: a validity warning when an input leaves a model's range. */
import { warn, type Warning } from '../util/warnings.ts';

export function rangeWarning(source: string, what: string, value: number, min: number, max: number, subjects?: string[]): Warning | null {
  if (value >= min && value <= max) return null;
  return warn('validity', `${what} = ${fmt(value)} is outside ${rangeWords(min, max)}; the value is an extrapolation`, { source, ...(subjects ? { subjects } : {}) });
}

/** The model's range in words; an open end is said as 'at least' / 'at most' (never 'Infinity' in front of a user). */
function rangeWords(min: number, max: number): string {
  if (!Number.isFinite(max)) return `this model's range (at least ${fmt(min)})`;
  if (!Number.isFinite(min)) return `this model's range (at most ${fmt(max)})`;
  return `the range ${fmt(min)}–${fmt(max)} of this model`;
}

function fmt(x: number): string {
  return Number.isFinite(x) ? (Math.abs(x) >= 1e4 || Math.abs(x) < 1e-3 ? x.toExponential(3) : String(Number(x.toPrecision(4)))) : String(x);
}
