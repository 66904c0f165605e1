/**
 * Statistics of the yield estimate: the Wilson score interval of a proportion (E. B. Wilson, "Probable inference,
 * the law of succession, and statistical inference", Journal of the American Statistical Association 22(158),
 * 209–212, 1927), histograms and summary figures of a sample.
 */

/** z of the two-sided 95 % normal interval, Φ⁻¹(0.975). */
export const Z95 = 1.959963984540054;

export interface Proportion {
  /** Passes over samples. */
  p: number;
  /** 95 % Wilson score interval. */
  lo: number;
  hi: number;
}

/** Wilson score interval for k successes in n trials: (p̂ + z²/2n ± z·√(p̂(1−p̂)/n + z²/4n²)) / (1 + z²/n). */
export function wilson(k: number, n: number, z = Z95): Proportion {
  if (n <= 0) return { p: 0, lo: 0, hi: 1 };
  const p = k / n, z2 = z * z;
  const den = 1 + z2 / n;
  const mid = (p + z2 / (2 * n)) / den;
  const half = (z * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n))) / den;
  // At k = 0 or k = n the interval ends exactly at the observed proportion (mid − half = 0, mid + half = 1 in exact
  // arithmetic; rounding must not put p outside its own interval).
  return { p, lo: k <= 0 ? 0 : Math.max(0, mid - half), hi: k >= n ? 1 : Math.min(1, mid + half) };
}

export interface Histogram {
  /** Bin edges, bins + 1 of them, increasing. */
  edges: number[];
  counts: number[];
}

/** Equal bins over the values and the given marks (limits, nominal), so the marks always fall on the chart. */
export function histogram(values: ArrayLike<number>, marks: number[], bins = 24): Histogram {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < values.length; i++) { const x = values[i]!; if (x < lo) lo = x; if (x > hi) hi = x; }
  for (const m of marks) { if (m < lo) lo = m; if (m > hi) hi = m; }
  if (!(hi > lo)) { const c = Number.isFinite(lo) ? lo : 0; lo = c - 0.5; hi = c + 0.5; }
  const w = (hi - lo) / bins;
  const edges = Array.from({ length: bins + 1 }, (_, i) => lo + i * w);
  edges[bins] = hi;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < values.length; i++) counts[Math.min(bins - 1, Math.max(0, Math.floor((values[i]! - lo) / w)))]!++;
  return { edges, counts };
}

export interface Summary { mean: number; sd: number; min: number; max: number; p05: number; p50: number; p95: number }

/** Mean, sample standard deviation, extremes and the 5/50/95 % points (nearest rank) of a sample. */
export function summary(values: ArrayLike<number>): Summary {
  const n = values.length;
  if (n === 0) return { mean: 0, sd: 0, min: 0, max: 0, p05: 0, p50: 0, p95: 0 };
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i]!;
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) { const d = values[i]! - mean; ss += d * d; }
  const sorted = Float64Array.from(values).sort();
  const at = (q: number) => sorted[Math.min(n - 1, Math.max(0, Math.ceil(q * n) - 1))]!;
  return { mean, sd: n > 1 ? Math.sqrt(ss / (n - 1)) : 0, min: sorted[0]!, max: sorted[n - 1]!, p05: at(0.05), p50: at(0.5), p95: at(0.95) };
}

/** Population variance (for the one-at-a-time ranking). */
export function variance(values: ArrayLike<number>): number {
  const n = values.length;
  if (n < 2) return 0;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i]!;
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) { const d = values[i]! - mean; ss += d * d; }
  return ss / (n - 1);
}
