/**
 * Frequency sweeps of a netlist: the grid, the solve in chunks with progress and cancellation, and a cache
 * keyed by design revision + settings so replotting is instant.
 */
import { InputError } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { compileNetwork, planEntries, solveAt, valueBlocks, type CompiledNetwork, type SolveEntries } from './mna.ts';
import type { SweepValues } from './sweepValues.ts';
import type { Netlist } from './netlist.ts';
import type { NetworkResponse } from './response.ts';

export interface SweepSettings {
  /** Hz, > 0. */
  start: number;
  /** Hz, >= start (equal only with points = 1). */
  stop: number;
  /** Number of points, 1 … 100 001. */
  points: number;
  /** Logarithmic spacing (default linear). */
  log?: boolean;
}

export const MAX_POINTS = 100_001;

/** The frequencies of a sweep, Hz. Throws InputError naming the bad setting. */
export function sweepFrequencies(s: SweepSettings): Float64Array {
  const { start, stop, points } = s;
  if (!(start > 0) || !Number.isFinite(start)) throw new InputError('out-of-range', 'sweep.start', 'a start frequency > 0 Hz', String(start));
  if (!Number.isFinite(stop) || stop < start) throw new InputError('out-of-range', 'sweep.stop', `a stop frequency >= the start (${start} Hz)`, String(stop));
  if (!Number.isInteger(points) || points < 1 || points > MAX_POINTS) throw new InputError('out-of-range', 'sweep.points', `a whole number of points from 1 to ${MAX_POINTS}`, String(points));
  if (points > 1 && stop === start) throw new InputError('out-of-range', 'sweep.stop', 'a stop frequency above the start when more than one point is asked for', String(stop));
  const f = new Float64Array(points);
  if (points === 1) { f[0] = start; return f; }
  for (let k = 0; k < points; k++) {
    const x = k / (points - 1);
    f[k] = s.log ? start * Math.pow(stop / start, x) : start + (stop - start) * x;
  }
  f[points - 1] = stop;
  return f;
}

/** Default sweep of a design band: 201 linear points, widened to include f0 when f0 lies outside. */
export function bandSweep(band: { start: number; stop: number }, f0?: number, points = 201): SweepSettings {
  let start = band.start, stop = band.stop;
  if (f0 !== undefined && f0 > 0) { start = Math.min(start, f0); stop = Math.max(stop, f0); }
  return { start, stop, points };
}

/** The part of an AbortSignal the sweep reads (the pure core has no DOM types). */
export interface AbortLike { readonly aborted: boolean; readonly reason?: unknown }

export interface SweepOptions {
  /** Called after each chunk with the fraction done (0 … 1). */
  onProgress?: (done: number, total: number) => void;
  signal?: AbortLike;
  /** Points per chunk (default 64). */
  chunk?: number;
  /**
   * Awaited between chunks so a host can deliver messages (a worker passes `() => new Promise(r => setTimeout(r))`).
   * Default: a resolved promise (no host timer in the pure core).
   */
  yieldTo?: () => Promise<void>;
  /** Only these S entries (absent: all); the response's `computed` says which. See mna.ts SolveEntries. */
  entries?: SolveEntries;
  /** Element values kept from earlier sweeps (sweepValues.ts): same numbers, computed once per key and frequency. */
  values?: SweepValues;
}

/** What solveNetwork may be asked besides the frequencies (see SweepOptions). */
export type NetworkSolveOptions = Pick<SweepOptions, 'entries' | 'values'>;

/** Solves at every frequency (synchronous); `opts.entries` asks for some S entries only (absent: all). */
export function solveNetwork(net: Netlist | CompiledNetwork, freqs: ArrayLike<number>, opts: NetworkSolveOptions = {}): NetworkResponse {
  const cn = 'symbolic' in net ? net : compileNetwork(net);
  const fr = Float64Array.from(freqs);
  checkIncreasing(fr);
  const acc = newAccumulator();
  const how = pointSolver(cn, fr, opts);
  for (let k = 0; k < fr.length; k++) acc.note(fr[k], how.solve(k));
  return responseOf(cn, fr, how.s, acc, how.computed);
}

/**
 * The points of a sweep: each solved with the entry plan and its kept values, into the response's array. A sweep of
 * some entries keeps only those (response.ts layout): each point is solved into one reused P×P block and its
 * computed entries copied out, so a 65-port feed's response is a few hundred kB instead of 14 MB per sweep.
 */
function pointSolver(cn: CompiledNetwork, fr: Float64Array, opts: NetworkSolveOptions) {
  const P = cn.ports.length, F = fr.length;
  const plan = opts.entries ? planEntries(cn, opts.entries) : undefined;
  const blocks = opts.values ? valueBlocks(cn, opts.values.grid(fr)) : undefined;
  // A plan that reaches every entry (a small network asked for its input's row and column) is a whole response.
  const partial = plan && plan.gather.length < P * P ? plan : undefined;
  const C = partial ? partial.gather.length : P * P;
  const s = new Float64Array(2 * C * F);
  const block = partial ? new Float64Array(2 * P * P) : null;
  const solve = (k: number) => {
    const how = { ...(plan ? { entries: plan } : {}), ...(blocks ? { kept: { blocks, k } } : {}) };
    if (!block || !partial) return solveAt(cn, fr[k], s.subarray(2 * P * P * k, 2 * P * P * (k + 1)), how);
    const r = solveAt(cn, fr[k], block, how);
    const g = partial.gather, o = 2 * C * k;
    for (let c = 0; c < C; c++) { s[o + 2 * c] = block[2 * g[c]]; s[o + 2 * c + 1] = block[2 * g[c] + 1]; }
    return r;
  };
  return { s, solve, computed: partial?.computed };
}

function responseOf(cn: CompiledNetwork, freqs: Float64Array, s: Float64Array, acc: ReturnType<typeof newAccumulator>, computed: Int32Array | undefined): NetworkResponse {
  const ports = cn.ports.map((p) => ({ name: p.name, zRef: p.zRef, ...(p.label !== undefined ? { label: p.label } : {}) }));
  return { freqs, ports, s, warnings: acc.warnings(), ...(computed ? { computed } : {}) };
}

/** Solves a sweep in chunks, reporting progress and stopping with an AbortError when the signal fires. */
export async function sweepNetwork(net: Netlist | CompiledNetwork, settings: SweepSettings | ArrayLike<number>, opts: SweepOptions = {}): Promise<NetworkResponse> {
  const fr = 'points' in settings ? sweepFrequencies(settings) : Float64Array.from(settings);
  checkIncreasing(fr);
  const cn = 'symbolic' in net ? net : compileNetwork(net);
  const F = fr.length, chunk = Math.max(1, Math.floor(opts.chunk ?? 64));
  const acc = newAccumulator();
  const pause = opts.yieldTo ?? (() => Promise.resolve());
  const how = pointSolver(cn, fr, opts);
  for (let k0 = 0; k0 < F; k0 += chunk) {
    if (opts.signal?.aborted) throw abortError(opts.signal);
    const k1 = Math.min(F, k0 + chunk);
    for (let k = k0; k < k1; k++) acc.note(fr[k], how.solve(k));
    opts.onProgress?.(k1, F);
    if (k1 < F) await pause();
  }
  return responseOf(cn, fr, how.s, acc, how.computed);
}

function abortError(signal: AbortLike): Error {
  const reason = signal.reason;
  if (reason instanceof Error) return reason;
  const e = new Error('the sweep was cancelled');
  e.name = 'AbortError';
  return e;
}

function checkIncreasing(f: Float64Array): void {
  if (f.length === 0) throw new InputError('out-of-range', 'frequencies', 'at least one frequency', 'none');
  for (let k = 0; k < f.length; k++) {
    if (!(f[k] > 0) || !Number.isFinite(f[k])) throw new InputError('out-of-range', `frequencies[${k}]`, 'a frequency > 0 Hz', String(f[k]));
    if (k > 0 && !(f[k] > f[k - 1])) throw new InputError('out-of-range', `frequencies[${k}]`, 'strictly increasing frequencies', `${f[k]} after ${f[k - 1]}`);
  }
}

function newAccumulator() {
  let worst = Infinity, worstF = 0, robust = 0;
  return {
    note(f: number, r: { robust: boolean; pivotRatio: number }) {
      if (r.robust) robust++;
      if (r.pivotRatio < worst) { worst = r.pivotRatio; worstF = f; }
    },
    warnings(): Warning[] {
      const out: Warning[] = [];
      // A pivot ratio this small still solves, but the last digits of S are uncertain there.
      if (worst < 1e-10) out.push(warn('network', `the nodal matrix is ill-conditioned near ${(worstF / 1e9).toPrecision(6)} GHz (pivot ratio ${worst.toExponential(1)}); values there carry fewer digits`, { source: 'mna' }));
      if (robust > 0) out.push({ code: 'network', severity: 'info', source: 'mna', message: `${robust} point(s) needed the pivoting solve (a line at a multiple of a half-wave or a zero pivot, e.g. an open quarter-wave stub at f0)` });
      return out;
    },
  };
}

/**
 * Keeps recent sweep results by design revision and settings. The key is built by the caller from a
 * revision (or `designHash`) and the sweep settings, so a replot with the same inputs does no work.
 */
export class SweepCache {
  private map = new Map<string, NetworkResponse>();
  private inFlight = new Map<string, Promise<NetworkResponse>>();
  constructor(private readonly limit = 16) {}
  static key(revision: string | number, settings: SweepSettings, extra = ''): string {
    return `${revision}|${settings.start}|${settings.stop}|${settings.points}|${settings.log ? 'log' : 'lin'}|${extra}`;
  }
  get(key: string): NetworkResponse | undefined {
    const v = this.map.get(key);
    if (v) { this.map.delete(key); this.map.set(key, v); }
    return v;
  }
  set(key: string, value: NetworkResponse): void {
    this.map.delete(key);
    this.map.set(key, value);
    while (this.map.size > this.limit) this.map.delete(this.map.keys().next().value as string);
  }
  /**
   * Returns the cached response or computes, stores and returns it. Calls for the same key while a sweep runs
   * share that sweep. A failed or cancelled sweep stores nothing.
   */
  async getOrSweep(key: string, compute: () => Promise<NetworkResponse>): Promise<NetworkResponse> {
    const hit = this.get(key);
    if (hit) return hit;
    const running = this.inFlight.get(key);
    if (running) return running;
    const p = compute().then(
      (v) => { this.inFlight.delete(key); this.set(key, v); return v; },
      (e: unknown) => { this.inFlight.delete(key); throw e; },
    );
    this.inFlight.set(key, p);
    return p;
  }
  get size(): number { return this.map.size; }
  clear(): void { this.map.clear(); }
}

/**
 * A stable hash of any JSON-able value (FNV-1a 32-bit over canonical JSON with sorted keys), as a hex string.
 * For cache keys only; not for security.
 */
export function designHash(value: unknown): string {
  return fnv(canonical(value, null));
}

/**
 * designHash of a design document or a value made of its parts, which are never changed in place (an edit makes new
 * records for what it changes and keeps the others): each object's canonical text is kept by the object, so a
 * revision that changed one node writes out only that node afresh. Same hash as designHash.
 */
export function documentHash(value: unknown): string {
  return fnv(canonical(value, documentTexts));
}
const documentTexts = new WeakMap<object, string>();

function fnv(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) { h ^= text.charCodeAt(i); h = Math.imul(h, 0x01000193) >>> 0; }
  return h.toString(16).padStart(8, '0') + ':' + text.length.toString(36);
}

function canonical(v: unknown, memo: WeakMap<object, string> | null): string {
  if (v === null || typeof v !== 'object') return JSON.stringify(v) ?? 'null';
  let text = memo?.get(v);
  if (text !== undefined) return text;
  if (Array.isArray(v)) text = `[${v.map((x) => canonical(x, memo)).join(',')}]`;
  else {
    const o = v as Record<string, unknown>;
    text = `{${Object.keys(o).sort().filter((k) => o[k] !== undefined).map((k) => `${JSON.stringify(k)}:${canonical(o[k], memo)}`).join(',')}}`;
  }
  memo?.set(v, text);
  return text;
}
