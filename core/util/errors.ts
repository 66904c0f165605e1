/**
 * Typed errors of the core. Invalid input never yields NaN or Infinity: it raises an InputError that names the
 * field, says what was expected and what was given, so every face can show it next to the field.
 */
export type ErrorCode =
  | 'invalid-number'      // not a finite number
  | 'out-of-range'        // finite, but outside what the model or the tool accepts
  | 'unreachable-target'  // a synthesis target the model cannot reach
  | 'bad-unit'            // a value with a unit that could not be parsed or does not fit the quantity
  | 'bad-choice'          // an unknown name among fixed choices
  | 'invalid-design'      // the design file fails validation
  | 'unsupported-version' // a design file newer than the app
  | 'impossible-layout'   // sizing or geometry cannot be realised as asked
  | 'singular-network'    // the network cannot be solved
  | 'bad-file';           // an imported file (Touchstone, ...) is malformed

export class InputError extends Error {
  override name = 'InputError';
  constructor(
    readonly code: ErrorCode,
    /** Path of the offending field, e.g. 'substrate.h' or 'pieces[3].z0'. */
    readonly field: string,
    /** What would have been accepted, in words, e.g. 'a thickness between 1 µm and 100 mm'. */
    readonly expected: string,
    /** What was given, as text. */
    readonly got: string,
    /** Optional hint on how to fix it. */
    readonly hint?: string,
  ) {
    super(`${field}: expected ${expected}, got ${got}${hint ? ` (${hint})` : ''}`);
  }
}

/** Throws InputError unless `value` is a finite number. Returns it typed. */
export function requireFinite(field: string, value: unknown, expected = 'a finite number'): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError('invalid-number', field, expected, describe(value));
  }
  return value;
}

/** Throws InputError unless min <= value <= max (either bound may be exclusive). */
export function requireRange(
  field: string, value: unknown, min: number, max: number, expected: string,
  opts: { minExclusive?: boolean; maxExclusive?: boolean } = {},
): number {
  const v = requireFinite(field, value, expected);
  const lowOk = opts.minExclusive ? v > min : v >= min;
  const highOk = opts.maxExclusive ? v < max : v <= max;
  if (!lowOk || !highOk) throw new InputError('out-of-range', field, expected, String(v));
  return v;
}

/** Short text of any value, for error messages. */
export function describe(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value.length > 60 ? value.slice(0, 57) + '...' : value);
  if (typeof value === 'number') return String(value);
  if (value === null) return 'null';
  if (value === undefined) return 'nothing';
  if (Array.isArray(value)) return `a list of ${value.length}`;
  return typeof value === 'object' ? 'an object' : String(value);
}

/** For `switch` over a union: a compile error when a case is missing, a clear error at run time. */
export function exhaustive(x: never, what: string): never {
  throw new InputError('bad-choice', what, 'one of the known choices', describe(x));
}
