/**
 * Simulation against measurement (or any two responses of the same ports): per S-parameter, the largest vector
 * difference |S_a − S_b|, the largest difference in |S| (dB) and in phase (degrees, wrapped), over the frequencies of
 * `b` (`a` is interpolated there, linearly in real and imaginary parts, and must cover them).
 * dB and phase differences are only counted where both magnitudes are above `floorDb` (default −30 dB): the
 * phase of a deep null is noise in any measurement (common practice).
 */
import { InputError } from '../util/errors.ts';
import type { NetworkResponse } from './response.ts';
import { interpolateS } from './sparamsPart.ts';
import { wrap180 } from './figures.ts';

export interface EntryDifference {
  i: number; j: number;
  /** max |S_a − S_b| and where. */
  vector: { value: number; freq: number };
  /** max | |S_a|dB − |S_b|dB | and where (NaN-free: 0 when never above the floor). */
  db: { value: number; freq: number };
  /** max |∠S_a − ∠S_b| (wrapped) and where. */
  deg: { value: number; freq: number };
  /** Per frequency of `b`: |S_a| − |S_b| in dB (signed, every point; the floor applies only to the maxima above). */
  dbSeries: Float64Array;
  /** Per frequency of `b`: |S_a − S_b|. */
  vectorSeries: Float64Array;
}

export interface ResponseDifference {
  freqs: Float64Array;
  entries: EntryDifference[];
  /** The entry with the largest vector difference. */
  worst: EntryDifference;
}

export function compareResponses(a: NetworkResponse, b: NetworkResponse, opts: { floorDb?: number } = {}): ResponseDifference {
  const P = a.ports.length;
  if (b.ports.length !== P) throw new InputError('out-of-range', 'compare', `a response with ${P} port(s), like the simulation`, `${b.ports.length} port(s)`);
  for (let i = 0; i < P; i++) {
    if (a.ports[i].zRef !== b.ports[i].zRef) {
      throw new InputError('out-of-range', `compare.ports[${i}].zRef`, `the same reference impedance on port ${i + 1} (${a.ports[i].zRef} Ω)`, `${b.ports[i].zRef} Ω`, 'renormalise one of them first');
    }
  }
  const floor = Math.pow(10, (opts.floorDb ?? -30) / 20);
  const entries: EntryDifference[] = [];
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) entries.push({ i, j, vector: { value: 0, freq: b.freqs[0] }, db: { value: 0, freq: b.freqs[0] }, deg: { value: 0, freq: b.freqs[0] }, dbSeries: new Float64Array(b.freqs.length), vectorSeries: new Float64Array(b.freqs.length) });
  for (let k = 0; k < b.freqs.length; k++) {
    const f = b.freqs[k];
    const sa = interpolateS(a, f, 'compare', 'the first response');
    for (let t = 0; t < P * P; t++) {
      const ar = sa[2 * t], ai = sa[2 * t + 1];
      const br = b.s[2 * (k * P * P + t)], bi = b.s[2 * (k * P * P + t) + 1];
      const e = entries[t];
      const v = Math.hypot(ar - br, ai - bi);
      if (v > e.vector.value) e.vector = { value: v, freq: f };
      const ma = Math.hypot(ar, ai), mb = Math.hypot(br, bi);
      e.vectorSeries[k] = v;
      // dB floors at −400 like the figures (figures.ts), so a perfect null gives no Infinity.
      e.dbSeries[k] = 20 * Math.log10(Math.max(ma, 1e-20)) - 20 * Math.log10(Math.max(mb, 1e-20));
      if (ma > floor && mb > floor) {
        const d = Math.abs(20 * Math.log10(ma / mb));
        if (d > e.db.value) e.db = { value: d, freq: f };
        const p = Math.abs(wrap180(((Math.atan2(ai, ar) - Math.atan2(bi, br)) * 180) / Math.PI));
        if (p > e.deg.value) e.deg = { value: p, freq: f };
      }
    }
  }
  const worst = entries.reduce((w, e) => (e.vector.value > w.vector.value ? e : w), entries[0]);
  return { freqs: b.freqs, entries, worst };
}
