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
  const { wx, wy } = scratch(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      if (i + 1 < nx) {
        const dx = x[i + 1]! - x[i]!;
        let s = 0;
        if (j > 0) s += eps[(j - 1) * (nx - 1) + i]! * (y[j]! - y[j - 1]!);
        if (j + 1 < ny) s += eps[j * (nx - 1) + i]! * (y[j + 1]! - y[j]!);
        wx[k] = s / (2 * dx);
      } else wx[k] = 0;
      if (j + 1 < ny) {
        const dy = y[j + 1]! - y[j]!;
        let s = 0;
        if (i > 0) s += eps[j * (nx - 1) + i - 1]! * (x[i]! - x[i - 1]!);
        if (i + 1 < nx) s += eps[j * (nx - 1) + i]! * (x[i + 1]! - x[i]!);
        wy[k] = s / (2 * dy);
      } else wy[k] = 0;
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
    // Whole rows of plain substrate or of vacuum: the same values the samples would give, without sampling.
    if (y0 + dy <= material.below) { eps.fill(material.substrate, j * (nx - 1), (j + 1) * (nx - 1)); continue; }
    if (y0 >= material.above) { eps.fill(1, j * (nx - 1), (j + 1) * (nx - 1)); continue; }
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
  g: Grid; fx: Float64Array; fy: Float64Array; diag: Float64Array;
  /** The inverse MIC pivots, and the couplings divided by the pivot of their row (fx/piv, fy/piv): the triangular sweeps
   * are sequential recurrences, and a division on their critical path costs several times a multiplication. */
  ipiv: Float64Array; gx: Float64Array; gy: Float64Array;
}

export function factor(g: Grid): Factored {
  const { nx, ny, wx, wy, owner } = g;
  const n = nx * ny;
  const { fx, fy, diag, ipiv, gx, gy } = scratch(n);
  fx.fill(0); fy.fill(0); diag.fill(0); ipiv.fill(1);
  // Rows 0 and ny − 1 are fixed (ground plane, top); wx is zero at the ends of rows and wy on the top row, so the free
  // rows need no bounds tests.
  const k0 = nx, k1 = n - nx;
  for (let k = k0; k < k1; k++) {
    diag[k] = wx[k]! + wx[k - 1]! + wy[k]! + wy[k - nx]!;
    if (owner[k]! >= 0) continue;
    if (owner[k + 1]! < 0) fx[k] = wx[k]!;
    if (owner[k + nx]! < 0) fy[k] = wy[k]!;
  }
  for (let k = k0; k < k1; k++) {
    if (owner[k]! >= 0) continue;
    const d = diag[k]!, a = fx[k - 1]!, c = fy[k - nx]!;
    const p = d - (a * a + OMEGA * a * fy[k - 1]!) * ipiv[k - 1]! - (c * c + OMEGA * c * fx[k - nx]!) * ipiv[k - nx]!;
    ipiv[k] = 1 / (p > 1e-3 * d ? p : d);
  }
  for (let k = k0; k < k1; k++) { const q = ipiv[k]!; gx[k] = fx[k]! * q; gy[k] = fy[k]! * q; }
  return { g, fx, fy, diag, ipiv, gx, gy };
}

/**
 * Potentials with conductor c at volts[c], by PCG from `guess` (free nodes; conductor nodes are overwritten), or from
 * a column-linear start. Returns the node potentials and the iterations spent. Stops at a residual STOP_REL of the
 * right-hand side's.
 */
export function solve(f: Factored, volts: ArrayLike<number>, guess?: Float64Array): { v: Float64Array; iterations: number } {
  const { g, fx, fy, diag, ipiv, gx, gy } = f;
  const { nx, wx, wy, owner } = g;
  const n = nx * g.ny;
  const v = guess ? Float64Array.from(guess) : new Float64Array(n);
  for (let k = 0; k < n; k++) { const o = owner[k]!; if (o >= 0) v[k] = volts[o]!; }
  if (!guess) columnStart(g, v);
  const { r, z, p, q } = workspace(n);
  const k0 = nx, k1 = n - nx;
  // r = b − A·v on free nodes, where b carries the fixed neighbours (the couplings that are not free-to-free).
  let bNorm = 0;
  for (let k = k0; k < k1; k++) {
    if (owner[k]! >= 0) continue;
    const all = wx[k]! * v[k + 1]! + wx[k - 1]! * v[k - 1]! + wy[k]! * v[k + nx]! + wy[k - nx]! * v[k - nx]!;
    const free = fx[k]! * v[k + 1]! + fx[k - 1]! * v[k - 1]! + fy[k]! * v[k + nx]! + fy[k - nx]! * v[k - nx]!;
    r[k] = all - diag[k]! * v[k]!;
    const b = all - free;
    bNorm += b * b;
  }
  const stop = STOP_REL * STOP_REL * bNorm;
  // The bottom row (the ground plane) and the top row (the domain's top or the lid) are fixed (assemble), and fx, fy
  // are zero at every fixed node and at the ends of rows, so the loops below run over rows 1..ny−2 without bounds or
  // owner tests; z, p and q stay zero at fixed nodes (their r is zero and their couplings vanish).
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
    for (let k = k0; k < kp; k++) {
      p[k + nx] = z[k + nx]! + beta * p[k + nx]!;
      const s = diag[k]! * p[k]! - fx[k]! * p[k + 1]! - fx[k - 1]! * p[k - 1]! - fy[k]! * p[k + nx]! - fy[k - nx]! * p[k - nx]!;
      q[k] = s;
      pq += p[k]! * s;
    }
    for (let k = kp; k < k1; k++) {
      const s = diag[k]! * p[k]! - fx[k]! * p[k + 1]! - fx[k - 1]! * p[k - 1]! - fy[k]! * p[k + nx]! - fy[k - nx]! * p[k - nx]!;
      q[k] = s;
      pq += p[k]! * s;
    }
    const alpha = rz / pq;
    rr = forwardUpdate(f, alpha, v, r, z, p, q);
    if (rr <= stop) { it++; break; }
    const rzNew = backward(z, r, gx, gy, nx, k0, k1);
    beta = rzNew / rz;
    rz = rzNew;
  }
  return { v, iterations: it };
}

/**
 * Work vectors of the iterations, kept between solves of the same size (a cross-section solves two to three grid sizes
 * many times; fresh arrays each time cost as much in collection as a few iterations). Zeroed here: z, p and q must be
 * zero on the fixed rows and nodes, and the recurrences read them before writing.
 */
function workspace(n: number): { r: Float64Array; z: Float64Array; p: Float64Array; q: Float64Array } {
  const w = scratch(n);
  w.r.fill(0); w.z.fill(0); w.p.fill(0); w.q.fill(0);
  return w;
}

/**
 * Arrays of one grid size, reused: a cross-section assembles, factors and solves on two or three grid sizes many
 * times, and fresh arrays each time cost as much in collection as a few iterations. Hence a Grid or Factored is valid
 * only until the next assemble or factor of a grid of the same size (the solver uses each at once; none escapes it).
 */
interface Scratch { wx: Float64Array; wy: Float64Array; fx: Float64Array; fy: Float64Array; diag: Float64Array; ipiv: Float64Array; gx: Float64Array; gy: Float64Array; r: Float64Array; z: Float64Array; p: Float64Array; q: Float64Array }
const pool = new Map<number, Scratch>();
function scratch(n: number): Scratch {
  let w = pool.get(n);
  if (w) return w;
  const a = () => new Float64Array(n);
  w = { wx: a(), wy: a(), fx: a(), fy: a(), diag: a(), ipiv: a(), gx: a(), gy: a(), r: a(), z: a(), p: a(), q: a() };
  if (pool.size >= 4) pool.delete(pool.keys().next().value!);
  pool.set(n, w);
  return w;
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

/*
 * The two triangular sweeps of MIC(0) are recurrences along a row (z[k] needs z[k ∓ 1]) and across rows (z[k ∓ nx]),
 * so one row at a time waits on each multiply-add. Four rows are swept together as a wavefront — row j at column i
 * beside row j + 1 at column i − 1, and so on — which gives the processor four independent chains; every element sees
 * exactly the values it would in row order (the couplings across a row's end are zero), so the result is the same.
 */
const WAVE = 4;

/**
 * v += α·p, r −= α·q on the free rows, and the forward sweep of z = M⁻¹·r fused with it; returns r·r.
 */
function forwardUpdate(f: Factored, alpha: number, v: Float64Array, r: Float64Array, z: Float64Array, p: Float64Array, q: Float64Array): number {
  const { fx, fy, ipiv } = f;
  const { nx, ny } = f.g;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let j = 1;
  for (; j + WAVE - 1 < ny - 1; j += WAVE) {
    const b = j * nx;
    for (let st = 0; st < WAVE - 1; st++) for (let m = 0; m <= st; m++) s0 += forwardOne(b + m * nx + st - m, nx, alpha, v, r, z, p, q, fx, fy, ipiv);
    const d = nx - 1;
    for (let k = b + WAVE - 1, e = b + nx; k < e; k++) {
      v[k] += alpha * p[k]!;
      const r0 = r[k]! - alpha * q[k]!;
      r[k] = r0; s0 += r0 * r0;
      z[k] = (r0 + fx[k - 1]! * z[k - 1]! + fy[k - nx]! * z[k - nx]!) * ipiv[k]!;
      const k1 = k + d;
      v[k1] += alpha * p[k1]!;
      const r1 = r[k1]! - alpha * q[k1]!;
      r[k1] = r1; s1 += r1 * r1;
      z[k1] = (r1 + fx[k1 - 1]! * z[k1 - 1]! + fy[k1 - nx]! * z[k1 - nx]!) * ipiv[k1]!;
      const k2 = k1 + d;
      v[k2] += alpha * p[k2]!;
      const r2 = r[k2]! - alpha * q[k2]!;
      r[k2] = r2; s2 += r2 * r2;
      z[k2] = (r2 + fx[k2 - 1]! * z[k2 - 1]! + fy[k2 - nx]! * z[k2 - nx]!) * ipiv[k2]!;
      const k3 = k2 + d;
      v[k3] += alpha * p[k3]!;
      const r3 = r[k3]! - alpha * q[k3]!;
      r[k3] = r3; s3 += r3 * r3;
      z[k3] = (r3 + fx[k3 - 1]! * z[k3 - 1]! + fy[k3 - nx]! * z[k3 - nx]!) * ipiv[k3]!;
    }
    for (let st = nx; st < nx + WAVE - 1; st++) for (let m = st - nx + 1; m < WAVE; m++) s0 += forwardOne(b + m * nx + st - m, nx, alpha, v, r, z, p, q, fx, fy, ipiv);
  }
  for (; j < ny - 1; j++) for (let k = j * nx, e = k + nx; k < e; k++) s0 += forwardOne(k, nx, alpha, v, r, z, p, q, fx, fy, ipiv);
  return s0 + s1 + s2 + s3;
}

// Top-level helpers, not closures: arrays a closure captures are read through a context object, also in the hot loop.
function forwardOne(k: number, nx: number, alpha: number, v: Float64Array, r: Float64Array, z: Float64Array, p: Float64Array, q: Float64Array, fx: Float64Array, fy: Float64Array, ipiv: Float64Array): number {
  v[k] += alpha * p[k]!;
  const rk = r[k]! - alpha * q[k]!;
  r[k] = rk;
  z[k] = (rk + fx[k - 1]! * z[k - 1]! + fy[k - nx]! * z[k - nx]!) * ipiv[k]!;
  return rk * rk;
}

function backwardOne(k: number, nx: number, z: Float64Array, r: Float64Array, gx: Float64Array, gy: Float64Array): number {
  const zk = z[k]! + gx[k]! * z[k + 1]! + gy[k]! * z[k + nx]!;
  z[k] = zk;
  return r[k]! * zk;
}

/** The backward sweep of the MIC(0) preconditioner, in place on z (after the forward sweep); returns r·z. */
function backward(z: Float64Array, r: Float64Array, gx: Float64Array, gy: Float64Array, nx: number, k0: number, k1: number): number {
  const ny = k1 / nx + 1;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let j = ny - 2; // top free row; groups of WAVE rows downwards, row j − m lagging m columns
  for (; j - (WAVE - 1) >= 1; j -= WAVE) {
    const b = j * nx + nx - 1; // the group's top row, last column
    for (let st = 0; st < WAVE - 1; st++) for (let m = 0; m <= st; m++) s0 += backwardOne(b - m * nx - (st - m), nx, z, r, gx, gy);
    const d = nx - 1;
    for (let k = b - (WAVE - 1), e = j * nx; k >= e; k--) {
      const z0 = z[k]! + gx[k]! * z[k + 1]! + gy[k]! * z[k + nx]!;
      z[k] = z0; s0 += r[k]! * z0;
      const k1 = k - d;
      const z1 = z[k1]! + gx[k1]! * z[k1 + 1]! + gy[k1]! * z[k1 + nx]!;
      z[k1] = z1; s1 += r[k1]! * z1;
      const k2 = k1 - d;
      const z2 = z[k2]! + gx[k2]! * z[k2 + 1]! + gy[k2]! * z[k2 + nx]!;
      z[k2] = z2; s2 += r[k2]! * z2;
      const k3 = k2 - d;
      const z3 = z[k3]! + gx[k3]! * z[k3 + 1]! + gy[k3]! * z[k3 + nx]!;
      z[k3] = z3; s3 += r[k3]! * z3;
    }
    for (let st = nx; st < nx + WAVE - 1; st++) for (let m = st - nx + 1; m < WAVE; m++) s0 += backwardOne(b - m * nx - (st - m), nx, z, r, gx, gy);
  }
  for (; j >= 1; j--) for (let k = j * nx + nx - 1, e = j * nx; k >= e; k--) s0 += backwardOne(k, nx, z, r, gx, gy);
  void k0;
  return s0 + s1 + s2 + s3;
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
