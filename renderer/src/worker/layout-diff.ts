/**
 * Lists sent as changes against a list the other side already holds, so a drag does not clone the whole sized
 * design (about 1 MB for a 64-output feed, most of it correction and warning text that does not change) from the
 * worker to the page on every pointer move. Transport only: the values are the core's own, passed through as they
 * are; decodeList(base, encodeList(base, next)) equals `next` entry for entry.
 *
 * An entry is one of
 *  - a number k: the same as base[k] (the page reuses its own object, so keyed drawing sees it unchanged);
 *  - { at: k, set, drop? }: base[k] with the top-level fields in `set` replaced and those in `drop` removed
 *    (a node that only moved sends its position, not its bend's notes);
 *  - { item }: a new entry, sent whole.
 */

export type ListEntry<T> = number | { at: number; set: Partial<T>; drop?: string[] } | { item: T };

/** Deep equality of plain data (numbers, strings, booleans, null, arrays, plain objects), as structured clone keeps it. */
export function sameData(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameData(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b)) return false;
  // for…in rather than Object.keys: no key arrays made (this runs over a whole sized design per drag move).
  const ob = b as Record<string, unknown>, oa = a as Record<string, unknown>;
  let n = 0;
  for (const k in oa) {
    n++;
    const x = oa[k], y = ob[k];
    if (x !== y && !sameData(x, y)) return false;
    if (y === undefined && !(k in ob)) return false;
  }
  for (const _k in ob) n--;
  return n === 0;
}

const isPlain = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);

/**
 * `next` as entries against `base`, matching entries by `key` (an id), else by position.
 * @param key an entry's identity; entries with the same key are compared field by field
 */
export function encodeList<T>(base: readonly T[] | null, next: readonly T[], key: (t: T, i: number) => string): ListEntry<T>[] {
  if (!base) return next.map((item) => ({ item }));
  const where = new Map<string, number>();
  base.forEach((t, i) => where.set(key(t, i), i));
  return next.map((item, i): ListEntry<T> => {
    const k = where.get(key(item, i));
    if (k === undefined) return { item };
    const old = base[k]!;
    if (sameData(old, item)) return k;
    const was: unknown = old, now: unknown = item;
    if (!isPlain(was) || !isPlain(now)) return { item };
    const set: Record<string, unknown> = {};
    const drop: string[] = [];
    for (const f of Object.keys(now)) if (!sameData(was[f], now[f])) set[f] = now[f];
    for (const f of Object.keys(was)) if (!(f in now)) drop.push(f);
    return drop.length ? { at: k, set: set as Partial<T>, drop } : { at: k, set: set as Partial<T> };
  });
}

/** The list `entries` stands for, reusing the objects of `base` where nothing changed. */
export function decodeList<T>(base: readonly T[] | null, entries: readonly ListEntry<T>[]): T[] {
  return entries.map((e) => {
    if (typeof e === 'number') return fromBase(base, e);
    if ('item' in e) return e.item;
    const out = { ...(fromBase(base, e.at) as Record<string, unknown>), ...(e.set as Record<string, unknown>) };
    for (const f of e.drop ?? []) delete out[f];
    return out as T;
  });
}

function fromBase<T>(base: readonly T[] | null, k: number): T {
  const t = base?.[k];
  // The worker encodes only against a list it knows the page holds; a missing one is a bug in the pairing.
  if (t === undefined) throw new Error(`layout transport: entry ${k} of a list the page does not hold`);
  return t;
}
