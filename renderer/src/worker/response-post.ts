/**
 * The response as it crosses from the worker to the page. A 64-output feed has 129 S-parameter traces (the input's
 * row and column) of three series each plus 65 reflections for the Smith chart: about 1 MB as lists of numbers,
 * cloned number by number on every pass of a drag, while the plot draws eight of them. Here every series goes in one
 * Float64Array (one block copy), and the page turns a series into a list only when something reads it.
 * Transport only: the numbers are the core's (magnitudeDb, phaseDeg, groupDelay, smith), bit for bit.
 */
import type { ResponseOutput } from './jobs.ts';

export interface ResponsePost {
  /** Everything but the series. */
  head: Omit<ResponseOutput, 'traces' | 'smith'>;
  /** Which (i, j) each trace is and which port each reflection is, in the order their series are packed. */
  traces: { i: number; j: number }[];
  smith: number[];
  /** Per trace db, phase, delay; then per reflection re, im; each freqs.length long. */
  series: Float64Array;
}

/** A response whose series are any list of numbers (the core's typed arrays in the response worker). */
type AnySeries = Omit<ResponseOutput, 'traces' | 'smith'> & {
  traces: { i: number; j: number; db: ArrayLike<number>; phase: ArrayLike<number>; delay: ArrayLike<number> }[];
  smith: { i: number; re: ArrayLike<number>; im: ArrayLike<number> }[];
};

/** The worker's side: one block of numbers. */
export function packResponse(r: AnySeries): ResponsePost {
  const { traces, smith, ...head } = r;
  const n = r.freqs.length;
  const series = new Float64Array(n * (3 * traces.length + 2 * smith.length));
  let at = 0;
  const put = (xs: ArrayLike<number>) => { series.set(xs, at); at += n; };
  for (const t of traces) { put(t.db); put(t.phase); put(t.delay); }
  for (const s of smith) { put(s.re); put(s.im); }
  return { head, traces: traces.map((t) => ({ i: t.i, j: t.j })), smith: smith.map((s) => s.i), series };
}

/** The page's side: the response, each series made a list the first time it is read. */
export function unpackResponse(p: ResponsePost): ResponseOutput {
  const n = p.head.freqs.length;
  let at = 0;
  // A plain loop: Array.from over a typed array walks it through the iterator protocol, ten times slower.
  const next = () => { const k = at; at += n; return () => { const out = new Array<number>(n); for (let i = 0; i < n; i++) out[i] = p.series[k + i]!; return out; }; };
  const traces = p.traces.map(({ i, j }) => {
    const db = next(), phase = next(), delay = next();
    return lazy({ i, j }, { db, phase, delay }) as ResponseOutput['traces'][number];
  });
  const smith = p.smith.map((i) => {
    const re = next(), im = next();
    return lazy({ i }, { re, im }) as ResponseOutput['smith'][number];
  });
  return { ...p.head, traces, smith };
}

/** `base` with each of `make`'s fields computed on first read and kept (enumerable, so copies and snapshots see it). */
function lazy<T extends object>(base: T, make: Record<string, () => number[]>): T {
  for (const [k, f] of Object.entries(make)) {
    let v: number[] | null = null;
    Object.defineProperty(base, k, { enumerable: true, configurable: true, get: () => (v ??= f()) });
  }
  return base;
}
