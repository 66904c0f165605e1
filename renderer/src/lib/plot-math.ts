/**
 * The plots' arithmetic, kept free of the DOM so it is unit-tested on its own: axis ticks, the frequency window
 * (zoom and pan), angle wrapping, which traces coincide (so they are drawn with dash patterns and named together),
 * and reading a swept trace at a marker's frequency. Markers read between swept points by straight-line
 * interpolation of the swept values; the traces themselves are drawn only through swept points.
 */
import { wrap180 } from '../../../core/index.ts';

/** Tick values for an axis from lo to hi: steps of 1, 2 or 5 × 10^n, at most about `count` of them. */
export function niceTicks(lo: number, hi: number, count = 6): number[] {
  if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi)) return Number.isFinite(lo) ? [lo] : [];
  const raw = (hi - lo) / Math.max(1, count);
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * p).find((s) => s >= raw * (1 - 1e-9)) ?? 10 * p;
  const out: number[] = [];
  const first = Math.ceil(lo / step - 1e-9);
  for (let k = first; k * step <= hi + step * 1e-9; k++) out.push(Number((k * step).toPrecision(12)));
  return out;
}

/** Decimals that show a tick step of this size without noise (0.25 → 2, 5 → 0). */
export function tickDecimals(ticks: number[]): number {
  if (ticks.length < 2) return 2;
  const step = Math.abs(ticks[1]! - ticks[0]!);
  return Math.max(0, Math.min(6, -Math.floor(Math.log10(step) + 1e-9)));
}

export interface Range { lo: number; hi: number }

/** Smallest window the frequency axis may be zoomed to, as a fraction of the whole sweep. */
const MIN_SPAN = 1e-4;

function clampWindow(lo: number, hi: number, limits: Range): Range {
  const full = limits.hi - limits.lo;
  let span = Math.min(full, Math.max(hi - lo, full * MIN_SPAN));
  if (!(span > 0)) span = full;
  lo = Math.min(Math.max(lo, limits.lo), limits.hi - span);
  return { lo, hi: lo + span };
}

/** Zooms the window about `at` by `factor` (< 1 zooms in), kept inside `limits`. */
export function zoomRange(r: Range, at: number, factor: number, limits: Range): Range {
  const a = Math.min(Math.max(at, r.lo), r.hi);
  return clampWindow(a - (a - r.lo) * factor, a + (r.hi - a) * factor, limits);
}

/** Moves the window by `delta` (data units), kept inside `limits` at the same span. */
export function panRange(r: Range, delta: number, limits: Range): Range {
  return clampWindow(r.lo + delta, r.hi + delta, limits);
}

/** An angle wrapped to (−180°, 180°] (the core's wrap). */
export const wrapDeg = wrap180;

/** Wraps every value of a phase series to (−180°, 180°]. */
export function wrapSeries(deg: ArrayLike<number>): number[] {
  return Array.from(deg, (d) => wrap180(d));
}

/**
 * Whether a wrapped series jumps between points k−1 and k (a wrap, drawn as a break rather than a vertical line
 * through the plot): a step of more than half the wrap span, 180°.
 */
export function wrapsBetween(a: number, b: number): boolean {
  return Math.abs(b - a) > 180;
}

/**
 * Groups of series that coincide: equal within `tol` at every point. Returns, for every series, the index of the
 * first series of its group (itself when it coincides with no earlier one).
 */
export function coincidence(series: ArrayLike<number>[], tol: number): number[] {
  const lead: number[] = [];
  for (let i = 0; i < series.length; i++) {
    lead.push(i);
    for (let j = 0; j < i; j++) {
      if (lead[j] !== j) continue;
      if (sameWithin(series[i]!, series[j]!, tol)) { lead[i] = j; break; }
    }
  }
  return lead;
}

function sameWithin(a: ArrayLike<number>, b: ArrayLike<number>, tol: number): boolean {
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) if (!(Math.abs(a[k]! - b[k]!) <= tol)) return false;
  return true;
}

/** How close two traces must be to count as one on screen: half a pixel of the plot's value span, at least `floor`. */
export function coincidenceTolerance(series: ArrayLike<number>[], plotHeightPx: number, floor = 1e-6): number {
  let lo = Infinity, hi = -Infinity;
  for (const s of series) for (let k = 0; k < s.length; k++) { const v = s[k]!; if (v < lo) lo = v; if (v > hi) hi = v; }
  const span = hi > lo ? hi - lo : 1;
  return Math.max(floor, (0.5 * span) / Math.max(1, plotHeightPx));
}

/** Dash patterns (px) by a trace's rank among the traces it coincides with: the first solid, the others broken. */
export const DASHES: readonly (readonly number[])[] = [[], [7, 5], [2, 4], [10, 3, 2, 3], [4, 8], [1, 2]];
export function dashFor(rank: number): readonly number[] { return DASHES[rank % DASHES.length]!; }

/** Index of the last x ≤ f (binary search over increasing x); −1 below the first. */
export function indexBelow(x: ArrayLike<number>, f: number): number {
  let lo = 0, hi = x.length - 1;
  if (x.length === 0 || f < x[0]!) return -1;
  if (f >= x[hi]!) return hi;
  while (hi - lo > 1) { const m = (lo + hi) >> 1; if (x[m]! <= f) lo = m; else hi = m; }
  return lo;
}

/** Index of the swept point nearest f. */
export function nearestIndex(x: ArrayLike<number>, f: number): number {
  const k = indexBelow(x, f);
  if (k < 0) return 0;
  if (k >= x.length - 1) return x.length - 1;
  return f - x[k]! <= x[k + 1]! - f ? k : k + 1;
}

/**
 * The value of a swept trace at frequency f: straight-line interpolation between the two swept points around it,
 * the end value outside the sweep. Phase is read on the unwrapped series and wrapped afterwards by the caller.
 */
export function valueAt(x: ArrayLike<number>, y: ArrayLike<number>, f: number): number {
  const n = Math.min(x.length, y.length);
  if (n === 0) return 0;
  const k = indexBelow(x, f);
  if (k < 0) return y[0]!;
  if (k >= n - 1) return y[n - 1]!;
  const t = (f - x[k]!) / (x[k + 1]! - x[k]!);
  return y[k]! + t * (y[k + 1]! - y[k]!);
}
