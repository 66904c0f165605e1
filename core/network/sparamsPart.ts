/**
 * A part given by measured or vendor S-parameters (a Touchstone file kept in the design, segment kind 'sparams'),
 * stamped into the nodal solve as its admittance matrix.
 *
 * Between data points S is interpolated linearly in real and imaginary parts (common practice for densely
 * sampled data; it keeps a passive part passive between points). Outside the data's band nothing is guessed:
 * the sweep fails with an InputError naming the part and its band. Y = G⁻¹ (I − S)(I + S)⁻¹ G⁻¹ (Pozar, Microwave Engineering, 4th ed., Table 4.2 (from memory)).
 */
import { InputError } from '../util/errors.ts';
import { sToY } from './conversions.ts';
import { readTouchstone } from './touchstoneRead.ts';
import type { NetworkResponse } from './response.ts';

/** S-matrix of the data at f (Hz), interpolated. */
export function interpolateS(d: NetworkResponse, f: number, field = 'sparams', what = "the part's data"): Float64Array {
  const F = d.freqs.length, P = d.ports.length, m = 2 * P * P;
  const lo = d.freqs[0], hi = d.freqs[F - 1];
  // A relative slack of 1e-9 accepts band edges that went through a unit conversion.
  if (f < lo * (1 - 1e-9) || f > hi * (1 + 1e-9)) {
    throw new InputError('out-of-range', field, `a frequency inside ${what} (${lo / 1e9} – ${hi / 1e9} GHz)`, `${f / 1e9} GHz`, 'narrow the sweep or supply data covering the band');
  }
  if (F === 1 || f <= lo) return d.s.slice(0, m);
  if (f >= hi) return d.s.slice((F - 1) * m, F * m);
  let a = 0, b = F - 1;
  while (b - a > 1) { const c = (a + b) >> 1; if (d.freqs[c] <= f) a = c; else b = c; }
  const x = (f - d.freqs[a]) / (d.freqs[b] - d.freqs[a]);
  const out = new Float64Array(m);
  for (let t = 0; t < m; t++) out[t] = d.s[a * m + t] * (1 - x) + d.s[b * m + t] * x;
  return out;
}

/** Reads a part's Touchstone text (1 or 2 ports) and gives its admittance matrix over frequency. */
export function sparamsAdmittance(touchstone: string, name: string, field = 'sparams'): { ports: number; data: NetworkResponse; y: (f: number) => Float64Array } {
  const ext = /\.s\dp$/i.test(name) ? name : undefined;
  const data = readTouchstone(touchstone, { fileName: ext ?? `${name}`, ports: ext ? undefined : guessPorts(touchstone) });
  const P = data.ports.length;
  if (P !== 1 && P !== 2) throw new InputError('bad-file', field, 'a 1- or 2-port Touchstone file for a part', `${P} ports`);
  const refs = data.ports.map((p) => p.zRef);
  const y = (f: number): Float64Array => {
    const s = interpolateS(data, f, field);
    let out: Float64Array;
    try { out = sToY(s, P, refs); } catch {
      throw new InputError('singular-network', field, 'a part with an admittance matrix', `an ideal short (S = −1) at ${f / 1e9} GHz`, 'use a short segment instead');
    }
    for (const v of out) if (!Number.isFinite(v)) throw new InputError('singular-network', field, 'a part with a finite admittance matrix', `values too large to solve at ${f / 1e9} GHz`, 'check the file; a part this close to an ideal short is better drawn as a short segment');
    return out;
  };
  // Taken in as the sweep will use it: every data point must give an admittance, so data the sweep would refuse is
  // refused here, when the file is chosen, rather than later in the response.
  for (const f of data.freqs) y(f);
  return { ports: P, data, y };
}

/** v1 text without a file name: one record per line with 3 values → 1-port, 9 → 2-port. */
function guessPorts(text: string): number | undefined {
  if (/\[version\]/i.test(text)) return undefined;
  for (const raw of text.split(/\r\n|\r|\n/)) {
    const body = raw.replace(/!.*$/, '').trim();
    if (body === '' || body.startsWith('#')) continue;
    const n = body.split(/[\s,]+/).length;
    return n === 3 ? 1 : n === 9 ? 2 : undefined;
  }
  return undefined;
}
