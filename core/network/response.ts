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
  /** S[k][i][j] (b_i / a_j at freqs[k]): re at 2·((k·P + i)·P + j), im one after. Power waves, real references. */
  s: Float64Array;
  warnings: Warning[];
}

/** S_ij at point k. i, j are zero-based port indices. */
export function sAt(r: NetworkResponse, k: number, i: number, j: number): Complex {
  const P = r.ports.length, t = 2 * ((k * P + i) * P + j);
  return { re: r.s[t], im: r.s[t + 1] };
}

/** The P×P matrix at point k (a view, not a copy). */
export function matrixAt(r: NetworkResponse, k: number): Float64Array {
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
