/**
 * Dense complex LU with partial (row) pivoting (Gaussian elimination with partial pivoting as in G. H. Golub and
 * C. F. Van Loan, Matrix Computations, 4th ed., 2013, §3.4) on an interleaved row-major Float64Array (entry (i, j) at
 * 2*(i*n + j)). Used for small matrices (port-sized conversions) and as the robust fall-back of the nodal solve.
 */
export interface DenseLu {
  n: number;
  /** Factors in place: unit-lower L below the diagonal, U on and above. */
  lu: Float64Array;
  /** Row permutation: row k of the factors is row perm[k] of the input. */
  perm: Int32Array;
  /** Smallest |pivot| / largest |entry| of its original row; near 0 means (numerically) singular. */
  minPivotRatio: number;
  /** Index (in input rows) where the smallest pivot ratio occurred. */
  worstRow: number;
}

/** Factors a copy of `a` (n×n complex). Never throws; callers judge `minPivotRatio`. */
export function denseLuFactor(a: Float64Array, n: number): DenseLu {
  const lu = a.slice();
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  const rowScale = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let m = 0;
    for (let j = 0; j < n; j++) { const p = 2 * (i * n + j); m = Math.max(m, Math.hypot(lu[p], lu[p + 1])); }
    rowScale[i] = m;
  }
  let minRatio = Infinity, worstRow = -1;
  for (let k = 0; k < n; k++) {
    // Scaled partial pivoting: choose the row whose candidate is largest relative to its own row scale.
    let best = -1, bestVal = -1;
    for (let i = k; i < n; i++) {
      const p = 2 * (i * n + k);
      const s = rowScale[perm[i]] || 1;
      const v = Math.hypot(lu[p], lu[p + 1]) / s;
      if (v > bestVal) { bestVal = v; best = i; }
    }
    if (bestVal < minRatio) { minRatio = bestVal; worstRow = perm[best]; }
    if (best !== k) {
      for (let j = 0; j < n; j++) {
        const p = 2 * (k * n + j), q = 2 * (best * n + j);
        const tr = lu[p], ti = lu[p + 1];
        lu[p] = lu[q]; lu[p + 1] = lu[q + 1]; lu[q] = tr; lu[q + 1] = ti;
      }
      const t = perm[k]; perm[k] = perm[best]; perm[best] = t;
    }
    const pk = 2 * (k * n + k);
    const pr = lu[pk], pi = lu[pk + 1];
    const d = pr * pr + pi * pi;
    if (d === 0) continue;
    const ir = pr / d, ii = -pi / d;
    for (let i = k + 1; i < n; i++) {
      const p = 2 * (i * n + k);
      const lr = lu[p] * ir - lu[p + 1] * ii, li = lu[p] * ii + lu[p + 1] * ir;
      lu[p] = lr; lu[p + 1] = li;
      if (lr === 0 && li === 0) continue;
      for (let j = k + 1; j < n; j++) {
        const q = 2 * (k * n + j), t = 2 * (i * n + j);
        lu[t] -= lr * lu[q] - li * lu[q + 1];
        lu[t + 1] -= lr * lu[q + 1] + li * lu[q];
      }
    }
  }
  return { n, lu, perm, minPivotRatio: minRatio, worstRow };
}

/** Solves A x = b for one right-hand side (length 2n, interleaved); returns x. */
export function denseLuSolve(f: DenseLu, b: Float64Array): Float64Array {
  const { n, lu, perm } = f;
  const x = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) { x[2 * i] = b[2 * perm[i]]; x[2 * i + 1] = b[2 * perm[i] + 1]; }
  for (let i = 0; i < n; i++) {
    let sr = x[2 * i], si = x[2 * i + 1];
    for (let j = 0; j < i; j++) {
      const p = 2 * (i * n + j);
      sr -= lu[p] * x[2 * j] - lu[p + 1] * x[2 * j + 1];
      si -= lu[p] * x[2 * j + 1] + lu[p + 1] * x[2 * j];
    }
    x[2 * i] = sr; x[2 * i + 1] = si;
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = x[2 * i], si = x[2 * i + 1];
    for (let j = i + 1; j < n; j++) {
      const p = 2 * (i * n + j);
      sr -= lu[p] * x[2 * j] - lu[p + 1] * x[2 * j + 1];
      si -= lu[p] * x[2 * j + 1] + lu[p + 1] * x[2 * j];
    }
    const p = 2 * (i * n + i);
    const d = lu[p] * lu[p] + lu[p + 1] * lu[p + 1];
    x[2 * i] = (sr * lu[p] + si * lu[p + 1]) / d;
    x[2 * i + 1] = (si * lu[p] - sr * lu[p + 1]) / d;
  }
  return x;
}

/** Inverse of an n×n complex matrix, or null when a pivot ratio falls below `tol`. */
export function denseInverse(a: Float64Array, n: number, tol = 1e-13): Float64Array | null {
  const f = denseLuFactor(a, n);
  if (!(f.minPivotRatio > tol)) return null;
  const out = new Float64Array(2 * n * n);
  const e = new Float64Array(2 * n);
  for (let j = 0; j < n; j++) {
    e.fill(0); e[2 * j] = 1;
    const x = denseLuSolve(f, e);
    for (let i = 0; i < n; i++) { out[2 * (i * n + j)] = x[2 * i]; out[2 * (i * n + j) + 1] = x[2 * i + 1]; }
  }
  return out;
}

/** C = A B for n×n complex matrices. */
export function denseMul(a: Float64Array, b: Float64Array, n: number): Float64Array {
  const c = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) {
    const p = 2 * (i * n + k), ar = a[p], ai = a[p + 1];
    if (ar === 0 && ai === 0) continue;
    for (let j = 0; j < n; j++) {
      const q = 2 * (k * n + j), t = 2 * (i * n + j);
      c[t] += ar * b[q] - ai * b[q + 1];
      c[t + 1] += ar * b[q + 1] + ai * b[q];
    }
  }
  return c;
}
