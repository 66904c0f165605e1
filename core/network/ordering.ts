/**
 * Fill-reducing elimination order and symbolic factorisation for the nodal solve.
 *
 * The nodal matrix of a drawn network has a symmetric pattern (every element couples its nodes both ways), so
 * one symbolic step serves every frequency. Minimum degree (eliminate the node with the fewest neighbours,
 * then join its neighbours: scheme 2 of W. F. Tinney and J. W. Walker, "Direct solutions of sparse network
 * equations by optimally ordered triangular factorization", Proc. IEEE 55(11), 1967, pp. 1801–1809) removes a tree or a feed from its leaves inward with no fill at all; loops and
 * bridged resistors add only their own small cliques. Plain O(n²) selection: networks here have hundreds of
 * nodes, not millions.
 */
export interface Symbolic {
  n: number;
  /** order[k] = original node index eliminated k-th. */
  order: Int32Array;
  /** position[node] = k. */
  position: Int32Array;
  /** Entries of the filled pattern in elimination coordinates; entryOf(i, j) gives the slot. */
  nnz: number;
  /** Slot of the diagonal (k, k). */
  diag: Int32Array;
  /** For pivot k: later neighbours u = upper[upStart[k] .. upStart[k + 1]), with slots lowSlot (u, k) and upSlot (k, u). */
  upStart: Int32Array;
  upper: Int32Array;
  lowSlot: Int32Array;
  upSlot: Int32Array;
  /** Schur updates for pivot k: ops[3t..3t+2] = (target, lower, upper) slots, t in opStart[k] .. opStart[k + 1]. */
  opStart: Int32Array;
  ops: Int32Array;
  /** Row (elimination coordinates) of every slot, for row scaling. */
  rowOfSlot: Int32Array;
  slot: (i: number, j: number) => number;
}

/** `adjacency[i]` lists the original neighbours of node i (no self entries needed). */
export function symbolicFactor(n: number, adjacency: Iterable<number>[]): Symbolic {
  const nb: Set<number>[] = [];
  for (let i = 0; i < n; i++) { nb.push(new Set<number>()); }
  for (let i = 0; i < n; i++) for (const j of adjacency[i]) if (j !== i) { nb[i].add(j); nb[j].add(i); }
  const order = new Int32Array(n), position = new Int32Array(n).fill(-1);
  const alive = new Uint8Array(n).fill(1);
  for (let k = 0; k < n; k++) {
    let best = -1, bestDeg = Infinity;
    for (let i = 0; i < n; i++) if (alive[i] && nb[i].size < bestDeg) { bestDeg = nb[i].size; best = i; }
    order[k] = best; position[best] = k; alive[best] = 0;
    const list = [...nb[best]];
    for (const a of list) {
      nb[a].delete(best);
      for (const b of list) if (a !== b) nb[a].add(b);
    }
    // Keep the neighbour set at elimination time (needed below) in nb[best]; it is no longer consulted.
  }
  // Rebuild the later-neighbour lists in elimination coordinates by replaying the elimination.
  const later: Set<number>[] = [];
  for (let k = 0; k < n; k++) later.push(new Set<number>());
  for (let i = 0; i < n; i++) for (const j of adjacency[i]) if (j !== i) {
    const a = position[i], b = position[j];
    if (a < b) later[a].add(b); else later[b].add(a);
  }
  for (let k = 0; k < n; k++) {
    const list = [...later[k]].sort((x, y) => x - y);
    for (let x = 0; x < list.length; x++) for (let y = x + 1; y < list.length; y++) later[list[x]].add(list[y]);
  }
  const slots = new Map<number, number>();
  const rows: number[] = [];
  const slot = (i: number, j: number): number => {
    const key = i * n + j;
    let s = slots.get(key);
    if (s === undefined) { s = rows.length; slots.set(key, s); rows.push(i); }
    return s;
  };
  const diag = new Int32Array(n);
  for (let k = 0; k < n; k++) diag[k] = slot(k, k);
  const upStart = new Int32Array(n + 1);
  const upperL: number[] = [], lowL: number[] = [], upL: number[] = [];
  const sortedLater: number[][] = [];
  for (let k = 0; k < n; k++) {
    const list = [...later[k]].sort((x, y) => x - y);
    sortedLater.push(list);
    upStart[k] = upperL.length;
    for (const u of list) { upperL.push(u); lowL.push(slot(u, k)); upL.push(slot(k, u)); }
  }
  upStart[n] = upperL.length;
  const opStart = new Int32Array(n + 1);
  const opsL: number[] = [];
  for (let k = 0; k < n; k++) {
    opStart[k] = opsL.length / 3;
    const list = sortedLater[k];
    for (const i of list) for (const j of list) opsL.push(slot(i, j), slot(i, k), slot(k, j));
  }
  opStart[n] = opsL.length / 3;
  return {
    n, order, position, nnz: rows.length, diag, upStart,
    upper: Int32Array.from(upperL), lowSlot: Int32Array.from(lowL), upSlot: Int32Array.from(upL),
    opStart, ops: Int32Array.from(opsL), rowOfSlot: Int32Array.from(rows),
    slot: (i, j) => { const s = slots.get(i * n + j); if (s === undefined) throw new Error(`no slot (${i}, ${j})`); return s; },
  };
}

/** Where the last sparseFactorInPlace met its smallest pivot ratio (a field of one record: no allocation per call). */
const lastFactor = { at: -1 };

/**
 * Numeric LU (no pivoting) of the values `v` (2 * nnz, interleaved) on the symbolic pattern, in place.
 * Returns the smallest |pivot| relative to its row's largest original entry, and where it happened, so the
 * caller can fall back to a pivoting solve when the order met a (near-)zero pivot.
 */
export function sparseFactor(s: Symbolic, v: Float64Array, rowScale: Float64Array): { minRatio: number; at: number } {
  const minRatio = sparseFactorInPlace(s, v, rowScale);
  return { minRatio, at: lastFactor.at };
}

/**
 * sparseFactor returning only the smallest pivot ratio (its place in `lastFactor`): the form for loops that factor
 * many matrices (the yield estimate solves hundreds of thousands), where a result object per call is garbage.
 */
export function sparseFactorInPlace(s: Symbolic, v: Float64Array, rowScale: Float64Array): number {
  const { n, diag, upStart, lowSlot, opStart, ops } = s;
  let minRatio = Infinity, at = -1;
  for (let k = 0; k < n; k++) {
    const d = 2 * diag[k];
    const pr = v[d], pi = v[d + 1];
    const m2 = pr * pr + pi * pi;
    const ratio = Math.sqrt(m2) / (rowScale[k] || 1);
    if (ratio < minRatio) { minRatio = ratio; at = k; }
    if (m2 === 0) { lastFactor.at = k; return 0; }
    const ir = pr / m2, ii = -pi / m2;
    for (let t = upStart[k]; t < upStart[k + 1]; t++) {
      const p = 2 * lowSlot[t];
      const a = v[p], b = v[p + 1];
      v[p] = a * ir - b * ii; v[p + 1] = a * ii + b * ir;
    }
    for (let t = opStart[k]; t < opStart[k + 1]; t++) {
      const q = 2 * ops[3 * t], l = 2 * ops[3 * t + 1], u = 2 * ops[3 * t + 2];
      const lr = v[l], li = v[l + 1], ur = v[u], ui = v[u + 1];
      v[q] -= lr * ur - li * ui;
      v[q + 1] -= lr * ui + li * ur;
    }
  }
  lastFactor.at = at;
  return minRatio;
}

/**
 * Which right-hand-side columns can be non-zero in each row during forward substitution, when column j starts
 * non-zero only in row `rows[j]` (elimination coordinates): `[lo, hi)` per row at 2k, 2k + 1 (lo ≥ hi: none).
 * A row's columns reach every later row it updates, so the ranges follow the elimination tree from the leaves up.
 * Outside its range a row holds exact zeros, which the forward step would only subtract as zeros; skipping them
 * changes no bit of the result. A port at a leaf of a feed touches only its path to the root, not every row.
 */
export function forwardColumns(s: Symbolic, rows: ArrayLike<number>): Int32Array {
  const { n, upStart, upper } = s;
  const r = new Int32Array(2 * n);
  for (let k = 0; k < n; k++) { r[2 * k] = rows.length; r[2 * k + 1] = 0; }
  for (let j = 0; j < rows.length; j++) {
    const k = rows[j];
    if (j < r[2 * k]) r[2 * k] = j;
    if (j + 1 > r[2 * k + 1]) r[2 * k + 1] = j + 1;
  }
  for (let k = 0; k < n; k++) {
    const lo = r[2 * k], hi = r[2 * k + 1];
    if (lo >= hi) continue;
    for (let t = upStart[k]; t < upStart[k + 1]; t++) {
      const u = upper[t];
      if (lo < r[2 * u]) r[2 * u] = lo;
      if (hi > r[2 * u + 1]) r[2 * u + 1] = hi;
    }
  }
  return r;
}

/**
 * Solves with the factors from sparseFactor for `m` right-hand sides at once: `X` (2·n·m, row k holds the m values
 * of unknown k in elimination coordinates) holds B on entry and the solution on exit. Forward substitution with the
 * unit-lower L, then back substitution with U; the inner loops run over contiguous columns, several times faster
 * than one right-hand side at a time for the many port excitations of a feed. `cols` (forwardColumns of where B
 * is non-zero) limits the forward step to the columns each row can hold; the result is the same to the bit.
 */
export function sparseSolveMany(s: Symbolic, v: Float64Array, X: Float64Array, m: number, cols?: Int32Array): void {
  const { n, diag, upStart, upper, lowSlot, upSlot } = s;
  const w = 2 * m;
  for (let k = 0; k < n; k++) {
    const bk = k * w;
    const c0 = cols ? 2 * cols[2 * k] : 0, c1 = cols ? 2 * cols[2 * k + 1] : w;
    if (c0 >= c1) continue;
    for (let t = upStart[k]; t < upStart[k + 1]; t++) {
      const bi = upper[t] * w, p = 2 * lowSlot[t];
      const lr = v[p], li = v[p + 1];
      for (let c = c0; c < c1; c += 2) {
        const xr = X[bk + c], xi = X[bk + c + 1];
        X[bi + c] -= lr * xr - li * xi;
        X[bi + c + 1] -= lr * xi + li * xr;
      }
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const bk = k * w;
    for (let t = upStart[k]; t < upStart[k + 1]; t++) {
      const bj = upper[t] * w, p = 2 * upSlot[t];
      const ur = v[p], ui = v[p + 1];
      for (let c = 0; c < w; c += 2) {
        const xr = X[bj + c], xi = X[bj + c + 1];
        X[bk + c] -= ur * xr - ui * xi;
        X[bk + c + 1] -= ur * xi + ui * xr;
      }
    }
    const d = 2 * diag[k];
    const pr = v[d], pi = v[d + 1], m2 = pr * pr + pi * pi;
    const ir = pr / m2, ii = -pi / m2;
    for (let c = 0; c < w; c += 2) {
      const xr = X[bk + c], xi = X[bk + c + 1];
      X[bk + c] = xr * ir - xi * ii;
      X[bk + c + 1] = xr * ii + xi * ir;
    }
  }
}

/**
 * Solves Aᵀ·Y = B with the factors from sparseFactor (A = L·U, L unit lower at lowSlot, U with the pivots on its
 * diagonal and U_ku at upSlot), for `m` right-hand sides laid out as in sparseSolveMany. Row i of A⁻¹ is the
 * solution for the i-th unit vector, so one such solve gives every S_ij of one row i (every excitation j) without
 * solving each excitation. Forward with Uᵀ (lower, pivots on the diagonal), then back with Lᵀ (unit upper).
 */
export function sparseSolveTransposed(s: Symbolic, v: Float64Array, Y: Float64Array, m: number): void {
  const { n, diag, upStart, upper, lowSlot, upSlot } = s;
  const w = 2 * m;
  for (let k = 0; k < n; k++) {
    const bk = k * w;
    const d = 2 * diag[k];
    const pr = v[d], pi = v[d + 1], m2 = pr * pr + pi * pi;
    const ir = pr / m2, ii = -pi / m2;
    for (let c = 0; c < w; c += 2) {
      const xr = Y[bk + c], xi = Y[bk + c + 1];
      Y[bk + c] = xr * ir - xi * ii;
      Y[bk + c + 1] = xr * ii + xi * ir;
    }
    for (let t = upStart[k]; t < upStart[k + 1]; t++) {
      const bi = upper[t] * w, p = 2 * upSlot[t];
      const ur = v[p], ui = v[p + 1];
      for (let c = 0; c < w; c += 2) {
        const xr = Y[bk + c], xi = Y[bk + c + 1];
        Y[bi + c] -= ur * xr - ui * xi;
        Y[bi + c + 1] -= ur * xi + ui * xr;
      }
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const bk = k * w;
    for (let t = upStart[k]; t < upStart[k + 1]; t++) {
      const bj = upper[t] * w, p = 2 * lowSlot[t];
      const lr = v[p], li = v[p + 1];
      for (let c = 0; c < w; c += 2) {
        const xr = Y[bj + c], xi = Y[bj + c + 1];
        Y[bk + c] -= lr * xr - li * xi;
        Y[bk + c + 1] -= lr * xi + li * xr;
      }
    }
  }
}

/**
 * The entries of A⁻¹ on the filled pattern of its factors (diagonal included), from the factors of sparseFactor, into
 * `Z` (2·nnz, slot by slot like `v`). The recurrences of K. Takahashi, J. Fagan and M.-S. Chen, "Formation of a sparse
 * bus impedance matrix and its application to short circuit study", Proc. 8th PICA Conference, 1973, as set out by
 * A. M. Erisman and W. F. Tinney, "On computing certain elements of the inverse of a sparse matrix", Communications
 * of the ACM 18(3), 1975, pp. 177–179: with A = L·D·Ũ (Ũ = D⁻¹·U unit upper), for k from the last pivot down and
 * j among k's later neighbours,
 *   Z_kj = −Σ_u Ũ_ku·Z_uj,   Z_jk = −Σ_u Z_ju·L_uk,   Z_kk = 1/d_k − Σ_u Ũ_ku·Z_uk   (u over k's later neighbours).
 * Every Z_uj these read lies in the filled pattern (k's later neighbours form a clique there), so the whole diagonal
 * of A⁻¹ — each port's driving-point impedance, hence every reflection S_ii — costs about one more factorisation,
 * instead of one solve per port. The symbolic `ops` of pivot k list (i, j) over its sorted later neighbours i, j in
 * row-major order, which gives each Z_uj's slot without a lookup.
 */
export function selectedInverse(s: Symbolic, v: Float64Array, Z: Float64Array): void {
  const { n, diag, upStart, lowSlot, upSlot, opStart, ops } = s;
  for (let k = n - 1; k >= 0; k--) {
    const d = 2 * diag[k];
    const pr = v[d], pi = v[d + 1], m2 = pr * pr + pi * pi;
    const ir = pr / m2, ii = -pi / m2;
    const u0 = upStart[k], m = upStart[k + 1] - u0, o0 = opStart[k];
    for (let b = 0; b < m; b++) {
      let kr = 0, ki = 0, jr = 0, ji = 0;
      for (let a = 0; a < m; a++) {
        // Ũ_ku = U_ku / d_k; Z_uj at op (a, b); Z_ju at op (b, a); L_uk is stored already divided by d_k.
        const up = 2 * upSlot[u0 + a], ur0 = v[up], ui0 = v[up + 1];
        const ur = ur0 * ir - ui0 * ii, ui = ur0 * ii + ui0 * ir;
        const zuj = 2 * ops[3 * (o0 + a * m + b)], zr = Z[zuj], zi = Z[zuj + 1];
        kr -= ur * zr - ui * zi; ki -= ur * zi + ui * zr;
        const zju = 2 * ops[3 * (o0 + b * m + a)], yr = Z[zju], yi = Z[zju + 1];
        const lp = 2 * lowSlot[u0 + a], lr = v[lp], li = v[lp + 1];
        jr -= yr * lr - yi * li; ji -= yr * li + yi * lr;
      }
      const kj = 2 * upSlot[u0 + b], jk = 2 * lowSlot[u0 + b];
      Z[kj] = kr; Z[kj + 1] = ki; Z[jk] = jr; Z[jk + 1] = ji;
    }
    let dr = ir, di = ii;
    for (let a = 0; a < m; a++) {
      const up = 2 * upSlot[u0 + a], ur0 = v[up], ui0 = v[up + 1];
      const ur = ur0 * ir - ui0 * ii, ui = ur0 * ii + ui0 * ir;
      const zuk = 2 * lowSlot[u0 + a], zr = Z[zuk], zi = Z[zuk + 1];
      dr -= ur * zr - ui * zi; di -= ur * zi + ui * zr;
    }
    Z[d] = dr; Z[d + 1] = di;
  }
}
