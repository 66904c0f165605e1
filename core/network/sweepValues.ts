/**
 * Values a sweep works out per element and frequency, kept from one revision of a design to the next, so that an
 * edit which changes only some lengths (a bend dragged) re-computes only the elements it changed.
 *
 * Each value is keyed by everything it depends on (the key an element carries, built by fromSized.ts):
 *  - line constants (Zc, γ) by cross-section (laminate, width, line options, models) and frequency;
 *  - the elimination order of the nodal matrix by the network's shape (nodes and who joins whom);
 *  - an element's stamp at each frequency of a grid (a line's Y or ABCD values; an n-port's matrix, e.g. a tee's
 *    reference planes and transformer over its arms' lines) by cross-section and length (or the n-port's own key).
 * The same key always gives the same computation, so a value read back is the very number the solver would have
 * computed again: cached and fresh sweeps agree to the bit (test/unit/network-sweep-values.test.ts).
 * Elements without a key (a caller's own models, lumped parts, data blocks) are computed at every sweep.
 * Bounded: a grid keeps at most `maxEntries` stamps and the cache the `maxGrids` most recent grids.
 */
import type { LineConstants } from './netlist.ts';
import type { Symbolic } from './ordering.ts';

/** Stamps of one frequency grid: per element key, `width` numbers per frequency plus one state number. */
export class GridValues {
  /** Per key: F blocks of (width + 1) numbers; the last of a block is 0 until that frequency is filled. */
  readonly stamps = new Map<string, Float64Array>();
  constructor(readonly freqs: Float64Array, private readonly maxEntries: number) {}

  /** The stamp block of `key` (width numbers per point), made empty on first use. */
  stamp(key: string, width: number): Float64Array {
    let a = this.stamps.get(key);
    if (!a || a.length !== (width + 1) * this.freqs.length) {
      if (this.stamps.size >= this.maxEntries) this.stamps.clear();
      a = new Float64Array((width + 1) * this.freqs.length);
      this.stamps.set(key, a);
    }
    return a;
  }
}

export class SweepValues {
  private readonly grids = new Map<string, GridValues>();
  private readonly lines = new Map<string, Map<number, LineConstants>>();
  private readonly orders = new Map<string, Symbolic>();
  constructor(private readonly maxGrids = 4, private readonly maxEntries = 8192, private readonly maxLines = 256) {}

  /** The stamps of a frequency grid (the same frequencies, bit for bit, give the same grid). */
  grid(freqs: Float64Array): GridValues {
    const key = gridKey(freqs);
    let g = this.grids.get(key);
    if (g) { this.grids.delete(key); this.grids.set(key, g); return g; }
    g = new GridValues(freqs, this.maxEntries);
    this.grids.set(key, g);
    while (this.grids.size > this.maxGrids) this.grids.delete(this.grids.keys().next().value as string);
    return g;
  }

  /** Line constants of cross-section `key` at f, computed by `make` the first time. */
  line(key: string, f: number, make: () => LineConstants): LineConstants {
    let byF = this.lines.get(key);
    if (!byF) {
      if (this.lines.size >= this.maxLines) this.lines.clear();
      byF = new Map();
      this.lines.set(key, byF);
    }
    let c = byF.get(f);
    if (!c) { c = make(); byF.set(f, c); }
    return c;
  }

  /** The elimination order of a network of this shape (mna.ts shapeKey), computed the first time. */
  symbolic(key: string, make: () => Symbolic): Symbolic {
    let o = this.orders.get(key);
    if (!o) {
      if (this.orders.size >= 8) this.orders.delete(this.orders.keys().next().value as string);
      o = make();
      this.orders.set(key, o);
    }
    return o;
  }

  clear(): void { this.grids.clear(); this.lines.clear(); this.orders.clear(); }
}

/** Exact text of a grid: its frequencies as the shortest decimal that reads back to the same double. */
function gridKey(freqs: Float64Array): string {
  let s = `${freqs.length}`;
  for (let k = 0; k < freqs.length; k++) s += `,${freqs[k]}`;
  return s;
}

/** A stable small number per object (models sets, caller-made sources), for keys of values that depend on them. */
const ids = new WeakMap<object, number>();
let nextId = 1;
export function objectId(o: object): number {
  let k = ids.get(o);
  if (k === undefined) { k = nextId++; ids.set(o, k); }
  return k;
}
