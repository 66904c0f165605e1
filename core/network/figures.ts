/**
 * Figures derived from a response, per frequency and as the worst value over the band. Definitions are the usual
 * ones of the trade (e.g. D. M. Pozar, Microwave Engineering, 4th ed., §4.3 and §2.3):
 *  - |S_ij| in dB = 20·log10|S_ij|;
 *  - phase in degrees, unwrapped along frequency (no 360° jumps);
 *  - group delay τg = −dφ/dω (s), central differences on the unwrapped phase (one-sided at the ends);
 *  - return loss RL = −20·log10|S_ii| (dB, positive for a passive port), VSWR = (1 + |S_ii|)/(1 − |S_ii|);
 *  - insertion loss IL = −20·log10|S_ji| (dB);
 *  - isolation between ports a and b = −20·log10|S_ab| (dB);
 *  - amplitude balance between outputs a and b fed from port i: |S_ai|dB − |S_bi|dB; phase balance:
 *    ∠S_ai − ∠S_bi − expected, wrapped into (−180°, 180°];
 *  - Smith-chart data: Γ = S_ii as re/im (the chart is the Γ plane; normalised impedance z = (1 + Γ)/(1 − Γ)).
 */
import { entryAt, type NetworkResponse } from './response.ts';

const DB_FLOOR = -400; // |S| = 0 exactly (an ideal null) shows as −400 dB instead of −∞.

export function toDb(mag: number): number {
  return mag > 0 ? Math.max(DB_FLOOR, 20 * Math.log10(mag)) : DB_FLOOR;
}

function series(r: NetworkResponse, i: number, j: number): { re: Float64Array; im: Float64Array } {
  const { base, stride } = entryAt(r, i, j), F = r.freqs.length;
  const re = new Float64Array(F), im = new Float64Array(F);
  for (let k = 0; k < F; k++) { const t = base + k * stride; re[k] = r.s[t]; im[k] = r.s[t + 1]; }
  return { re, im };
}

export function magnitude(r: NetworkResponse, i: number, j: number): Float64Array {
  const { re, im } = series(r, i, j);
  return re.map((x, k) => Math.hypot(x, im[k]));
}

export function magnitudeDb(r: NetworkResponse, i: number, j: number): Float64Array {
  return magnitude(r, i, j).map(toDb);
}

/** Unwrapped phase of S_ij in degrees; the first point lies in (−180, 180]. */
export function phaseDeg(r: NetworkResponse, i: number, j: number): Float64Array {
  const { re, im } = series(r, i, j);
  return unwrapDeg(re.map((x, k) => (Math.atan2(im[k], x) * 180) / Math.PI));
}

/** Removes 360° jumps between neighbours (a step larger than 180° is taken as a wrap). */
export function unwrapDeg(p: Float64Array): Float64Array {
  const out = new Float64Array(p.length);
  let offset = 0;
  for (let k = 0; k < p.length; k++) {
    if (k > 0) {
      const d = p[k] + offset - out[k - 1];
      offset -= 360 * Math.round(d / 360);
    }
    out[k] = p[k] + offset;
  }
  return out;
}

/** Group delay of S_ij, s: −dφ/dω with φ the unwrapped phase (central differences; NaN-free, 0 for one point). */
export function groupDelay(r: NetworkResponse, i: number, j: number): Float64Array {
  return groupDelayOfPhase(r.freqs, phaseDeg(r, i, j));
}

/** Group delay, s, from the unwrapped phase `ph` (degrees) at frequencies `f` (Hz): groupDelay's arithmetic, for a caller that has the phase already. */
export function groupDelayOfPhase(f: Float64Array, ph: Float64Array): Float64Array {
  const F = f.length;
  const out = new Float64Array(F);
  if (F < 2) return out;
  for (let k = 0; k < F; k++) {
    // Central difference over the nearest points of another frequency (measured data may repeat one); data at a
    // single frequency has no slope, and 0 is shown as for one point.
    let a = Math.max(0, k - 1), b = Math.min(F - 1, k + 1);
    while (a > 0 && f[a] === f[k]) a--;
    while (b < F - 1 && f[b] === f[k]) b++;
    out[k] = f[b] > f[a] ? -((ph[b] - ph[a]) * Math.PI / 180) / (2 * Math.PI * (f[b] - f[a])) : 0;
  }
  return out;
}

export function vswr(r: NetworkResponse, i: number): Float64Array {
  // |Γ| >= 1 (an ideal open, short or an active port) has no finite VSWR; Infinity is kept out of the core.
  return magnitude(r, i, i).map((g) => (g < 1 ? (1 + g) / (1 - g) : 1e12));
}

export function returnLoss(r: NetworkResponse, i: number): Float64Array { return magnitudeDb(r, i, i).map((x) => -x); }
export function insertionLoss(r: NetworkResponse, from: number, to: number): Float64Array { return magnitudeDb(r, to, from).map((x) => -x); }
export function isolation(r: NetworkResponse, a: number, b: number): Float64Array { return magnitudeDb(r, a, b).map((x) => -x); }

/** |S_a,in|dB − |S_b,in|dB. */
export function amplitudeBalance(r: NetworkResponse, input: number, a: number, b: number): Float64Array {
  const da = magnitudeDb(r, a, input), db = magnitudeDb(r, b, input);
  return da.map((x, k) => x - db[k]);
}

/** ∠S_a,in − ∠S_b,in − expectedDeg, wrapped into (−180°, 180°]. */
export function phaseBalance(r: NetworkResponse, input: number, a: number, b: number, expectedDeg = 0): Float64Array {
  const pa = phaseDeg(r, a, input), pb = phaseDeg(r, b, input);
  return pa.map((x, k) => wrap180(x - pb[k] - expectedDeg));
}

export function wrap180(d: number): number {
  const w = d - 360 * Math.floor((d + 180) / 360);
  return w === -180 ? 180 : w;
}

/** Γ = S_ii as re/im for the Smith chart. */
export function smith(r: NetworkResponse, i: number): { re: Float64Array; im: Float64Array } { return series(r, i, i); }

export interface Worst { value: number; freq: number }

/** Largest (or smallest) value of a series and where it occurs. */
export function worst(freqs: Float64Array, v: Float64Array, kind: 'max' | 'min' | 'maxAbs'): Worst {
  let best = 0, at = -1;
  for (let k = 0; k < v.length; k++) {
    const x = kind === 'maxAbs' ? Math.abs(v[k]) : v[k];
    if (at < 0 || (kind === 'min' ? x < best : x > best)) { best = x; at = k; }
  }
  return { value: at < 0 ? 0 : (kind === 'maxAbs' ? v[at] : best), freq: at < 0 ? 0 : freqs[at] };
}

/** Per-port and per-path figures with their worst values over the band, for the summary table and JSON. */
export interface FigureSummary {
  /** Index of the port taken as the input. */
  input: number;
  ports: {
    name: string;
    /** Worst (smallest) return loss, dB, and worst (largest) VSWR over the band. */
    returnLoss: Worst;
    vswr: Worst;
  }[];
  /** From the input to each other port. */
  paths: { to: string; insertionLoss: { best: Worst; worst: Worst }; groupDelayAtMid: number; groupDelay: { min: Worst; max: Worst } }[];
  /** Between each pair of outputs (ports other than the input). */
  pairs: { a: string; b: string; isolation: Worst; amplitudeBalance: Worst; phaseBalance: Worst }[];
}

export function summarize(r: NetworkResponse, input = 0): FigureSummary {
  const P = r.ports.length, f = r.freqs;
  const mid = Math.floor((f.length - 1) / 2);
  const ports = r.ports.map((p, i) => ({ name: p.name, returnLoss: worst(f, returnLoss(r, i), 'min'), vswr: worst(f, vswr(r, i), 'max') }));
  const paths: FigureSummary['paths'] = [];
  const outs: number[] = [];
  for (let j = 0; j < P; j++) if (j !== input) outs.push(j);
  for (const j of outs) {
    const il = insertionLoss(r, input, j);
    const gd = groupDelay(r, j, input);
    paths.push({ to: r.ports[j].name, insertionLoss: { best: worst(f, il, 'min'), worst: worst(f, il, 'max') }, groupDelayAtMid: gd[mid], groupDelay: { min: worst(f, gd, 'min'), max: worst(f, gd, 'max') } });
  }
  const pairs: FigureSummary['pairs'] = [];
  for (let x = 0; x < outs.length; x++) for (let y = x + 1; y < outs.length; y++) {
    const a = outs[x], b = outs[y];
    pairs.push({
      a: r.ports[a].name, b: r.ports[b].name,
      isolation: worst(f, isolation(r, a, b), 'min'),
      amplitudeBalance: worst(f, amplitudeBalance(r, input, a, b), 'maxAbs'),
      phaseBalance: worst(f, phaseBalance(r, input, a, b), 'maxAbs'),
    });
  }
  return { input, ports, paths, pairs };
}
