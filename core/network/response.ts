/**
 * The computed response of a network over frequency: the full S-matrix of all ports at each point.
 */
import { InputError } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import type { Complex } from './complex.ts';

/** A port of a response: `name` is its key (a design's node id, a Touchstone file's port number); `label` what people call it. */
export interface ResponsePort { name: string; zRef: number; label?: string }

/** The port as people know it: its label, else its name. */
export function portLabel(p: { name: string; label?: string | undefined }): string {
  return p.label ?? p.name;
}

export interface NetworkResponse {
  /** Frequencies, Hz, strictly increasing. */
  freqs: Float64Array;
  ports: ResponsePort[];
  /**
   * S[k][i][j] (b_i / a_j at freqs[k]): re at 2·((k·P + i)·P + j), im one after. Power waves, real references.
   * With `computed` (a sweep of some entries only): the computed entries alone, re at 2·(k·C + c − 1) where
   * c = computed[i·P + j] and C the number computed; read it through `entryAt`.
   */
  s: Float64Array;
  warnings: Warning[];
  /**
   * Absent: every S_ij was computed. Present: only some were (a sweep asked for some entries, mna.ts SolveEntries):
   * computed[i·P + j] is 0 for an entry left out, else its place in each point's block, from 1. A read of an entry
   * left out is refused (`entryAt`, `requireEntry`), never read as zero.
   */
  computed?: Int32Array;
}

/** Refuses a read of S_ij that the sweep did not compute (a sweep asked for some entries only). */
export function requireEntry(r: Pick<NetworkResponse, 'ports' | 'computed'>, i: number, j: number): void {
  const P = r.ports.length;
  if (r.computed && !r.computed[i * P + j]) {
    throw new InputError('out-of-range', `S${i + 1},${j + 1}`, 'an S-parameter the sweep computed (this sweep was asked for some entries only)', 'an entry left out', 'sweep with every entry');
  }
}

/**
 * Where S_ij lies in `r.s`: re of point k at base + k·stride, im one after. Refuses an entry the sweep left out.
 */
export function entryAt(r: Pick<NetworkResponse, 'ports' | 'computed'>, i: number, j: number): { base: number; stride: number } {
  requireEntry(r, i, j);
  const P = r.ports.length;
  if (!r.computed) return { base: 2 * (i * P + j), stride: 2 * P * P };
  return { base: 2 * (r.computed[i * P + j]! - 1), stride: 2 * computedCount(r.computed) };
}

/** How many entries each point's block holds (the largest place); kept per map, read for every series of a response. */
function computedCount(computed: Int32Array): number {
  let C = counts.get(computed);
  if (C === undefined) {
    C = 0;
    for (const c of computed) if (c > C) C = c;
    counts.set(computed, C);
  }
  return C;
}
const counts = new WeakMap<Int32Array, number>();

/** Refuses a response whose sweep left some entries out, for readers of the whole matrix (Touchstone, conversions). */
export function requireAll(r: Pick<NetworkResponse, 'ports' | 'computed'>): void {
  const at = r.computed ? r.computed.indexOf(0) : -1;
  if (at >= 0) requireEntry(r, Math.floor(at / r.ports.length), at % r.ports.length);
}

/** S_ij at point k. i, j are zero-based port indices. */
export function sAt(r: NetworkResponse, k: number, i: number, j: number): Complex {
  const { base, stride } = entryAt(r, i, j), t = base + k * stride;
  return { re: r.s[t], im: r.s[t + 1] };
}

/** The P×P matrix at point k (a view, not a copy). */
export function matrixAt(r: NetworkResponse, k: number): Float64Array {
  requireAll(r);
  const P = r.ports.length;
  return r.s.subarray(2 * k * P * P, 2 * (k + 1) * P * P);
}

/** Port index by name, label or 1-based number text ('1', 'p1', 'input'); throws a clear InputError for an unknown port. */
export function portIndex(r: { ports: ResponsePort[] }, ref: string | number, field = 'port'): number {
  if (typeof ref === 'number') {
    if (Number.isInteger(ref) && ref >= 0 && ref < r.ports.length) return ref;
  } else {
    const byName = r.ports.findIndex((p) => p.name === ref);
    if (byName >= 0) return byName;
    const byLabel = r.ports.findIndex((p) => p.label !== undefined && p.label === ref.trim());
    if (byLabel >= 0) return byLabel;
    const num = Number(ref);
    if (Number.isInteger(num) && num >= 1 && num <= r.ports.length) return num - 1;
  }
  throw new InputError('bad-choice', field, `a port label or id (${r.ports.map((p) => (p.label ? `${p.label} = ${p.name}` : p.name)).join(', ')}) or number 1–${r.ports.length}`, String(ref));
}
