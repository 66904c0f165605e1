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

/** Field names people know, for the last key of an internal path (`args.spec.width.z0` → "Z0"). */
const FIELD_WORDS: Record<string, string> = {
  z0: 'Z0', zRef: 'reference impedance', deg: 'electrical length', toleranceDeg: 'phase tolerance', er: 'εr', h: 'height',
  t: 'copper thickness', tanDelta: 'tan δ', sigma: 'conductivity', f0: 'f0', fMeasure: 'measurement frequency',
  tipWidth: 'tip width', angleDeg: 'angle', toolDiameter: 'tool diameter', edgeBias: 'edge bias', minFeature: 'smallest feature',
  padWidth: 'pad width', padLength: 'pad length', pinDrill: 'pin drill', offsetsDeg: 'phase offsets', rippleDb: 'ripple',
};

/**
 * The field of an error as people know it: the last key of an internal path, in words ("args.spec.length.length"
 * → "length", "nodes[3].zRef" → "reference impedance", "args.spec.width.z0" → "Z0").
 */
export function fieldWords(field: string): string {
  const keys = field.replace(/\[[^\]]*\]/g, '').split('.').filter((k) => k && k !== 'args' && k !== 'spec');
  const last = keys[keys.length - 1] ?? field;
  return FIELD_WORDS[last] ?? last.replace(/([a-z])([A-Z])/g, (_, a: string, b: string) => `${a} ${b.toLowerCase()}`);
}

/** An InputError as one sentence in the user's words: "length: expected …, found …, fix: …" (no internal paths). */
export function errorWords(e: InputError): string {
  return `${fieldWords(e.field)}: expected ${e.expected}, found ${e.got}${e.hint ? `, fix: ${e.hint}` : ''}`;
}
