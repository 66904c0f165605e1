/**
 * What a fuzz run counts as a fault, shared by the core fuzz files: library wording in a message (the validation
 * library's, the JavaScript engine's, the polygon engine's), and non-finite numbers in an output.
 */

/** Wording no user should see: valibot's default messages, JavaScript engine errors, wasm aborts, object dumps. */
export const LIBRARY_WORDING = /Invalid (key|type|length|value|option|format|entries)\b|but received|Expected [^ ]+ but|Cannot read propert|is not a function|is not iterable|is not defined|propert(y|ies) [^ ]* ?of (undefined|null)|Maximum call stack|\[object Object\]|\b(Range|Type|Reference|Syntax)Error\b|\bAborted\(|RuntimeError|memory access out of bounds|unreachable executed|internal error/;

/**
 * Internal names no user should see: the polygon engine's own arguments (regions[17].outer, holes[2], delta) where
 * the real problem is a piece of the design (issue 22 item 4: sizing knew better).
 */
export const INTERNAL_WORDING = /\b(regions|a|b)\[\d+\]\.(outer|holes)|\bholes\[\d+\]|^delta:|^join:/;

/** Numbers that must not appear in text output: a non-finite value printed, or a missing one. */
export const NON_FINITE_TEXT = /\bNaN\b|-?Infinity\b|\bundefined\b/;

/** Paths (up to `max`) of non-finite numbers inside a value; `null` is allowed only where `allowNull` says. */
export function nonFinite(value: unknown, where: string, opts: { allowNull?: boolean; max?: number } = {}): string[] {
  const out: string[] = [];
  const max = opts.max ?? 5;
  const seen = new Set<unknown>();
  const walk = (v: unknown, path: string, depth: number): void => {
    if (out.length >= max || depth > 40) return;
    if (typeof v === 'number') { if (!Number.isFinite(v)) out.push(`${path} = ${v}`); return; }
    if (v === null) { if (!opts.allowNull) out.push(`${path} = null`); return; }
    if (typeof v !== 'object' || seen.has(v)) return;
    seen.add(v);
    if (ArrayBuffer.isView(v) && !(v instanceof DataView)) {
      const a = v as unknown as ArrayLike<number>;
      for (let i = 0; i < a.length && out.length < max; i++) if (!Number.isFinite(a[i]!)) out.push(`${path}[${i}] = ${a[i]}`);
      return;
    }
    if (Array.isArray(v)) { v.forEach((x, i) => walk(x, `${path}[${i}]`, depth + 1)); return; }
    for (const [k, x] of Object.entries(v as Record<string, unknown>)) walk(x, `${path}.${k}`, depth + 1);
  };
  walk(value, where, 0);
  return out;
}
