/**
 * JSON output of every command. A result never carries null, NaN or Infinity (JSON.stringify would print null
 * for the last two): a field that is not applicable (null in the core's records, e.g. a path report of no phase
 * group) is left out, and a number that is not finite means the command could not produce that value, so it fails
 * (exit 1) naming the field instead of printing something that looks like a result.
 */
import { InputError } from '../core/index.ts';

/** The first path in `value` holding a non-finite number or a null list item, or null when there is none. */
export function firstNonFinite(value: unknown, path = '$'): string | null {
  if (value === null) return path;
  if (typeof value === 'number') return Number.isFinite(value) ? null : path;
  if (typeof value !== 'object') return null;
  if (ArrayBuffer.isView(value)) {
    const a = value as unknown as ArrayLike<number>;
    for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) return `${path}[${i}]`;
    return null;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) { const p = firstNonFinite(value[i], `${path}[${i}]`); if (p) return p; }
    return null;
  }
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
    if (v === undefined || v === null) continue; // left out when printed
    const p = firstNonFinite(v, `${path}.${k}`);
    if (p) return p;
  }
  return null;
}

/** JSON text of a result, or an InputError naming the first field that has no finite value. */
export function resultJson(value: unknown, indent?: number): string {
  const bad = firstNonFinite(value);
  if (bad) throw new InputError('invalid-number', bad.replace(/^\$\.?/, '') || 'result', 'a finite number', 'no value (the input leads to a quantity that cannot be computed)', 'check the input; nothing was printed for this result');
  return JSON.stringify(value, (_k, v: unknown) => (v !== null && typeof v === 'object' && !Array.isArray(v) && !ArrayBuffer.isView(v) ? withoutNulls(v as Record<string, unknown>) : v), indent);
}

function withoutNulls(o: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(o)) if (v !== null) out[k] = v;
  return out;
}
