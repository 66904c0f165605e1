/**
 * Laplace's equation ∇·(ε∇V) = 0 on a non-uniform rectangular grid, by the five-point box (finite-volume) scheme,
 * solved with conjugate gradients preconditioned by modified incomplete Cholesky (MIC(0)).
 *
 * Scheme: each grid cell carries one relative permittivity (the mean of 2 × 2 samples inside it); the coupling of two
 * neighbouring nodes is ε·(width of the half-cells on each side)/(distance), summed over the two cells beside the
 * edge. On a rectangle this is exactly the linear finite-element stiffness of the two right triangles each cell is
 * split into (the diagonal edge couples nothing), so the discrete energy is that of an admissible potential and the
 * computed capacitance falls towards the exact one as the grid is refined (an upper bound, for uniform ε per cell).
 * The domain's sides are open (zero normal field: natural boundary); the ground plane, the top of the domain (or the
 * lid) and every conductor node are fixed potentials.
 *
 * Preconditioner: I. Gustafsson, "A class of first order factorization methods", BIT 18 (1978), pp. 142–156 (MIC,
 * here with relaxation ω = 0.95); conjugate gradients: M. R. Hestenes and E. Stiefel, J. Res. NBS 49 (1952).
 */
import { conductorAt, type Shapes } from './shapes.ts';
import type { Material } from './materials.ts';

export interface Grid {
  nx: number; ny: number;
  x: Float64Array; y: Float64Array;
  /** Coupling of node k = j·nx + i to its east neighbour (k + 1), and to its north neighbour (k + nx). */
  wx: Float64Array; wy: Float64Array;
  /** Conductor id of each node, −1 for a free node. */
  owner: Int8Array;
}

const OMEGA = 0.95;
/**
 * PCG stops at this residual relative to the right-hand side's. Capacitances come from the energy form (`energy`),
 * whose error is second order in the iteration error: stopping at 1e-5 instead of 1e-6 moved Z0 and εeff by at most
 * 2e-5 relative on the benchmark's cross-sections (a V-bit gap is the slowest to settle), for a third to a half fewer
 * iterations.
 */
const STOP_REL = 1e-5;

/** Couplings and conductor map of the grid x × y for the shapes, with `material` (null = vacuum everywhere); with
 * `wallAtZero` the line x = 0 is held at 0 V (the odd mode's symmetry plane). */
export function assemble(x: Float64Array, y: Float64Array, shapes: Shapes, material: Material | null, wallAtZero = false, cache?: AssemblyCache): Grid {
  const nx = x.length, ny = y.length;
  let eps = cache?.eps.get(material);
  if (!eps) { eps = cellPermittivity(x, y, material); cache?.eps.set(material, eps); }
  let owner = cache?.owner.get(wallAtZero);
  if (!owner) { owner = ownerMap(x, y, shapes, wallAtZero); cache?.owner.set(wallAtZero, owner); }
  const wx = new Float64Array(nx * ny), wy = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      if (i + 1 < nx) {
        const dx = x[i + 1]! - x[i]!;
        let s = 0;
        if (j > 0) s += eps[(j - 1) * (nx - 1) + i]! * (y[j]! - y[j - 1]!);
        if (j + 1 < ny) s += eps[j * (nx - 1) + i]! * (y[j + 1]! - y[j]!);
        wx[k] = s / (2 * dx);
      }
      if (j + 1 < ny) {
        const dy = y[j + 1]! - y[j]!;
        let s = 0;
        if (i > 0) s += eps[j * (nx - 1) + i - 1]! * (x[i]! - x[i - 1]!);
        if (i + 1 < nx) s += eps[j * (nx - 1) + i]! * (x[i + 1]! - x[i]!);
        wy[k] = s / (2 * dy);
      }
    }
  }
  return { nx, ny, x, y, wx, wy, owner };
}

/** What the solves on one grid share: the cells' permittivity per material (null = vacuum) and the conductor map
 * per symmetry wall. */
export interface AssemblyCache { eps: Map<Material | null, Float64Array>; owner: Map<boolean, Int8Array> }

export function assemblyCache(): AssemblyCache {
  return { eps: new Map(), owner: new Map() };
}

/** Each cell's relative permittivity: the mean of 2 × 2 samples inside it (copper samples carry no field). */
function cellPermittivity(x: Float64Array, y: Float64Array, material: Material | null): Float64Array {
  const nx = x.length, ny = y.length;
  const eps = new Float64Array((nx - 1) * (ny - 1));
  if (!material) return eps.fill(1);
  for (let j = 0; j + 1 < ny; j++) {
    const y0 = y[j]!, dy = y[j + 1]! - y0;
    for (let i = 0; i + 1 < nx; i++) {
      const x0 = x[i]!, dx = x[i + 1]! - x0;
      let sum = 0, n = 0;
      for (let a = 0; a < 2; a++) for (let b = 0; b < 2; b++) {
        const e = material(x0 + dx * (0.25 + 0.5 * a), y0 + dy * (0.25 + 0.5 * b));
        if (e === e) { sum += e; n++; } // NaN (copper) carries no field
      }
      eps[j * (nx - 1) + i] = n ? sum / n : 1;
    }
  }
  return eps;
}

/** Conductor id of every node (−1 free); the top row is grounded, and with `wallAtZero` the line x = 0 too. */
function ownerMap(x: Float64Array, y: Float64Array, shapes: Shapes, wallAtZero: boolean): Int8Array {
  const nx = x.length, ny = y.length;
  let minCell = Infinity;
  for (let i = 0; i + 1 < nx; i++) minCell = Math.min(minCell, x[i + 1]! - x[i]!);
  for (let j = 0; j + 1 < ny; j++) minCell = Math.min(minCell, y[j + 1]! - y[j]!);
  const tol = 1e-6 * minCell;
  const owner = new Int8Array(nx * ny);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) {
    owner[j * nx + i] = j === ny - 1 || (wallAtZero && Math.abs(x[i]!) <= tol) ? 0 : conductorAt(shapes, x[i]!, y[j]!, tol);
  }
  return owner;
}

/** Free-to-free couplings, the diagonal and the MIC(0) pivots of a grid: everything the iterations need, built once. */
export interface Factored {
  g: Grid; fx: Float64Array; fy: Float64Array; diag: Float64Array; piv: Float64Array;
  /** 1/piv, and the couplings divided by the pivot of their row (fx/piv, fy/piv): the triangular sweeps are sequential
   * recurrences, and a division on their critical path costs several times a multiplication. */
  ipiv: Float64Array; gx: Float64Array; gy: Float64Array;
}

export function factor(g: Grid): Factored {
  const { nx, ny, wx, wy, owner } = g;
  const n = nx * ny;
  const fx = new Float64Array(n), fy = new Float64Array(n), diag = new Float64Array(n), piv = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const i = k % nx;
    let d = 0;
    if (i + 1 < nx) d += wx[k]!;
    if (i > 0) d += wx[k - 1]!;
    if (k + nx < n) d += wy[k]!;
    if (k >= nx) d += wy[k - nx]!;
    diag[k] = d;
    if (owner[k]! >= 0) continue;
    if (i + 1 < nx && owner[k + 1]! < 0) fx[k] = wx[k]!;
    if (k + nx < n && owner[k + nx]! < 0) fy[k] = wy[k]!;
  }
  for (let k = 0; k < n; k++) {
    if (owner[k]! >= 0) { piv[k] = 1; continue; }
    let p = diag[k]!;
    const i = k % nx;
    if (i > 0) { const w = fx[k - 1]!; if (w) p -= (w * w + OMEGA * w * fy[k - 1]!) / piv[k - 1]!; }
    if (k >= nx) { const w = fy[k - nx]!; if (w) p -= (w * w + OMEGA * w * (k - nx + 1 < n ? fx[k - nx]! : 0)) / piv[k - nx]!; }
    piv[k] = p > 1e-3 * diag[k]! ? p : diag[k]!;
  }
  const ipiv = new Float64Array(n), gx = new Float64Array(n), gy = new Float64Array(n);
  for (let k = 0; k < n; k++) { const q = 1 / piv[k]!; ipiv[k] = q; gx[k] = fx[k]! * q; gy[k] = fy[k]! * q; }
  return { g, fx, fy, diag, piv, ipiv, gx, gy };
}

/**
 * Potentials with conductor c at volts[c], by PCG from `guess` (free nodes; conductor nodes are overwritten).
 * Returns the node potentials and the iterations spent. Stops at a residual 1e-6 of the right-hand side's.
 */
export function solve(f: Factored, volts: ArrayLike<number>, guess?: Float64Array): { v: Float64Array; iterations: number } {
  const { g, fx, fy, diag, ipiv, gx, gy } = f;
  const { nx, wx, wy, owner } = g;
  const n = nx * g.ny;
  const v = guess ? Float64Array.from(guess) : new Float64Array(n);
  for (let k = 0; k < n; k++) { const o = owner[k]!; if (o >= 0) v[k] = volts[o]!; }
  if (!guess) columnStart(g, v);
  // r = b − A·v on free nodes, where b carries the fixed neighbours: r_k = Σ_nbr w·v_nbr − diag·v_k.
  const r = new Float64Array(n), z = new Float64Array(n), p = new Float64Array(n), q = new Float64Array(n);
  let bNorm = 0;
  for (let k = 0; k < n; k++) {
    if (owner[k]! >= 0) continue;
    const i = k % nx;
    let s = 0, b = 0;
    if (i + 1 < nx) { s += wx[k]! * v[k + 1]!; if (owner[k + 1]! >= 0) b += wx[k]! * v[k + 1]!; }
    if (i > 0) { s += wx[k - 1]! * v[k - 1]!; if (owner[k - 1]! >= 0) b += wx[k - 1]! * v[k - 1]!; }
    if (k + nx < n) { s += wy[k]! * v[k + nx]!; if (owner[k + nx]! >= 0) b += wy[k]! * v[k + nx]!; }
    if (k >= nx) { s += wy[k - nx]! * v[k - nx]!; if (owner[k - nx]! >= 0) b += wy[k - nx]! * v[k - nx]!; }
    r[k] = s - diag[k]! * v[k]!;
    bNorm += b * b;
  }
  const stop = STOP_REL * STOP_REL * bNorm;
  // The bottom row (the ground plane) and the top row (the domain's top or the lid) are fixed (assemble), and fx, fy
  // are zero at every fixed node and at the ends of rows, so the loops below run over rows 1..ny−2 without bounds or
  // owner tests; z, p and q stay zero at fixed nodes (their r is zero and their couplings vanish).
  const k0 = nx, k1 = n - nx;
  let rr = 0;
  for (let k = 0; k < n; k++) rr += r[k]! * r[k]!;
  if (rr <= stop || bNorm === 0) return { v, iterations: 0 };
  // z = M⁻¹·r: forward sweep (the first, separately; later fused with the update of v and r), then backward.
  for (let k = k0; k < k1; k++) z[k] = (r[k]! + fx[k - 1]! * z[k - 1]! + fy[k - nx]! * z[k - nx]!) * ipiv[k]!;
  let rz = backward(z, r, gx, gy, nx, k0, k1);
  let beta = 0;
  let it = 0;
  // The loops are fused where data allow (p's update into the product q = A·p, the update of v and r into the
  // forward sweep): the sweeps are sequential recurrences, and independent work beside them costs little.
  for (; it < 20000; it++) {
    // p ← z + β·p, a row ahead of the product, which reads p one row up and down.
    for (let k = k0; k < k0 + nx; k++) p[k] = z[k]! + beta * p[k]!;
    let pq = 0;
    const kp = k1 - nx;
    for (let k = k0; k < k1; k++) {
      if (k < kp) p[k + nx] = z[k + nx]! + beta * p[k + nx]!;
      const s = diag[k]! * p[k]! - fx[k]! * p[k + 1]! - fx[k - 1]! * p[k - 1]! - fy[k]! * p[k + nx]! - fy[k - nx]! * p[k - nx]!;
      q[k] = s;
      pq += p[k]! * s;
    }
    const alpha = rz / pq;
    rr = 0;
    for (let k = k0; k < k1; k++) {
      v[k] += alpha * p[k]!;
      const rk = r[k]! - alpha * q[k]!;
      r[k] = rk;
      rr += rk * rk;
      z[k] = (rk + fx[k - 1]! * z[k - 1]! + fy[k - nx]! * z[k - nx]!) * ipiv[k]!;
    }
    if (rr <= stop) { it++; break; }
    const rzNew = backward(z, r, gx, gy, nx, k0, k1);
    beta = rzNew / rz;
    rz = rzNew;
  }
  return { v, iterations: it };
}

/**
 * A start without a coarser solution: in each column, the potential linear in y between the fixed nodes below and
 * above each free node. Far from the strip's edges that is the field of parallel plates, which is where conjugate
 * gradients are slowest to find it (a smooth, domain-wide potential such as floating copper's at 1 V); near the edges
 * the iterations correct it.
 */
function columnStart(g: Grid, v: Float64Array): void {
  const { nx, ny, y, owner } = g;
  for (let i = 0; i < nx; i++) {
    let jl = 0; // last fixed row below (row 0 is always fixed)
    for (let j = 1; j < ny; j++) {
      const k = j * nx + i;
      if (owner[k]! < 0) continue;
      if (j > jl + 1) {
        const va = v[jl * nx + i]!, vb = v[k]!, ya = y[jl]!, span = y[j]! - ya;
        for (let m = jl + 1; m < j; m++) v[m * nx + i] = va + ((vb - va) * (y[m]! - ya)) / span;
      }
      jl = j;
    }
  }
}

/** The backward sweep of the MIC(0) preconditioner, in place on z (after the forward sweep); returns r·z. */
function backward(z: Float64Array, r: Float64Array, gx: Float64Array, gy: Float64Array, nx: number, k0: number, k1: number): number {
  let rz = 0;
  for (let k = k1 - 1; k >= k0; k--) {
    const zk = z[k]! + gx[k]! * z[k + 1]! + gy[k]! * z[k + nx]!;
    z[k] = zk;
    rz += r[k]! * zk;
  }
  return rz;
}

/** Charge on each conductor id 0..count−1 of the potential v, in units of ε0 (C/m per ε0): Σ w·(V_k − V_nbr). */
export function charges(g: Grid, v: Float64Array, count: number): Float64Array {
  const { nx, ny, wx, wy, owner } = g;
  const n = nx * ny;
  const q = new Float64Array(count);
  for (let k = 0; k < n; k++) {
    const o = owner[k]!;
    if (o < 0) continue;
    const i = k % nx;
    const vk = v[k]!;
    let s = 0;
    if (i + 1 < nx) s += wx[k]! * (vk - v[k + 1]!);
    if (i > 0) s += wx[k - 1]! * (vk - v[k - 1]!);
    if (k + nx < n) s += wy[k]! * (vk - v[k + nx]!);
    if (k >= nx) s += wy[k - nx]! * (vk - v[k - nx]!);
    q[o] += s;
  }
  return q;
}

/**
 * Energy bilinear form Σ over grid edges of w·(a_k − a_n)·(b_k − b_n), in units of ε0: for two solutions with unit
 * potentials on conductors A and B it is the Maxwell capacitance K_AB. It equals the charge sum at convergence, but its
 * error is of second order in the iteration error (the error of each solution is zero on conductors and the other
 * solution is discrete-harmonic at free nodes), so the iterations may stop earlier for the same accuracy.
 */
export function energy(g: Grid, a: Float64Array, b: Float64Array): number {
  const { nx, ny, wx, wy } = g;
  const n = nx * ny;
  let s = 0;
  for (let k = 0; k < n; k++) {
    const ak = a[k]!, bk = b[k]!;
    if ((k + 1) % nx !== 0) s += wx[k]! * (ak - a[k + 1]!) * (bk - b[k + 1]!);
    if (k + nx < n) s += wy[k]! * (ak - a[k + nx]!) * (bk - b[k + nx]!);
  }
  return s;
}

/** The finer grid's starting potential from the coarse solution (linear between coarse nodes; the grids are nested). */
export function prolong(coarse: Float64Array, cnx: number, cny: number): Float64Array {
  const nx = 2 * cnx - 1, ny = 2 * cny - 1;
  const out = new Float64Array(nx * ny);
  for (let j = 0; j < cny; j++) {
    for (let i = 0; i < cnx; i++) {
      const c = coarse[j * cnx + i]!;
      out[2 * j * nx + 2 * i] = c;
      if (i + 1 < cnx) out[2 * j * nx + 2 * i + 1] = (c + coarse[j * cnx + i + 1]!) / 2;
    }
  }
  for (let j = 1; j < ny; j += 2) {
    for (let i = 0; i < nx; i++) out[j * nx + i] = (out[(j - 1) * nx + i]! + out[(j + 1) * nx + i]!) / 2;
  }
  return out;
}
