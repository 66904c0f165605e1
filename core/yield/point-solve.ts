/**
 * One grid point of a made board: element values from the board's columns (board-columns.ts), the nodal matrix, the
 * sparse LU in the fixed elimination order of core/network/ordering.ts, and S from the port excitations. This is
 * core/network/mna.ts's fast path (its `evaluate` and `solveSparse`: the modified nodal stamps, a line as its Y
 * two-port Y11 = coth(γl)/Zc, Y12 = −1/(Zc sinh γl), D. M. Pozar, Microwave Engineering, 4th ed., 2012, §4.4, from
 * memory) with every index and constant worked out once per network and every buffer reused for every point and
 * board: the same operations in the same order, so the same bits. Only the excitations whose S columns are read are
 * solved (each column is independent of the others). S-parameters: power waves with real references (K. Kurokawa,
 * "Power waves and the scattering matrix", IEEE Trans. MTT 13(2), 1965), as in mna.ts.
 */
import { InputError } from '../util/errors.ts';
import { cdiv } from '../network/complex.ts';
import type { CompiledNetwork } from '../network/mna.ts';
import { sparseFactorInPlace, type Symbolic } from '../network/ordering.ts';
import { K_C, K_G, K_L, K_LINE, K_N, K_RL, type Columns } from './board-columns.ts';

/** Below this |sinh γl| mna.ts stamps a line in ABCD form (its pivoting path); the same limit here. */
const SINH_LIMIT = 1e-4;
/** Below this pivot ratio mna.ts abandons the fixed-order LU for its pivoting solve; the same limit here. */
const PIVOT_LIMIT = 1e-8;
/** Largest step from the nominal γl taken by the series (see PointSolver.nominal). */
const REACH = 0.125;
/** Most numbers kept for the nominal board's line arguments (32 MB). */
const NOMINAL_MAX = 4_000_000;
/** Taylor coefficients: sin d = d + d·(S3 d² + S5 d⁴ + …), 1 − cos d = C2 d² + C4 d⁴ + … (sinh, cosh: the same with
 * every sign +, taken by flipping the signs of S3, S7, S11 and C4, C8). */
const S3 = -1 / 6, S5 = 1 / 120, S7 = -1 / 5040, S9 = 1 / 362880, S11 = -1 / 39916800;
const C2 = 1 / 2, C4 = -1 / 24, C6 = 1 / 720, C8 = -1 / 40320, C10 = 1 / 3628800;

export class PointSolver {
  private readonly v: Float64Array;
  private readonly rowScale: Float64Array;
  private readonly X: Float64Array;
  /** Slots aa, bb, ab, ba of each element (−1 where a terminal is ground), four per element. */
  private readonly slot4: Int32Array;
  /** Port k: the diagonal slot of its node, its node's row, 1/Z, the drive 2/√Z and the read-out 1/√Z. */
  private readonly portDiag: Int32Array;
  private readonly portRow: Int32Array;
  private readonly portY: Float64Array;
  private readonly portDrive: Float64Array;
  private readonly portRead: Float64Array;
  /** The ports whose excitation is solved (the columns of S that are read). */
  private readonly columns: Int32Array;

  /** `columns`: the ports to excite (default all); S entries of the other columns are left as they are in `out`. */
  constructor(private readonly cn: CompiledNetwork, private readonly freqs: Float64Array, columns?: readonly number[]) {
    const sym = cn.symbolic, E = cn.stamped.length;
    this.columns = columns ? Int32Array.from(columns) : Int32Array.from(cn.ports, (_, j) => j);
    this.v = new Float64Array(2 * sym.nnz);
    this.rowScale = new Float64Array(sym.n);
    this.X = new Float64Array(2 * sym.n * this.columns.length);
    this.slot4 = new Int32Array(4 * E).fill(-1);
    cn.stamped.forEach((st, idx) => { if (st.kind !== 'nport') this.slot4.set(cn.slots[idx]!, 4 * idx); });
    this.portRow = Int32Array.from(cn.ports, (p) => sym.position[p.node]!);
    this.portDiag = Int32Array.from(this.portRow, (r) => sym.diag[r]!);
    this.portY = Float64Array.from(cn.ports, (p) => 1 / p.zRef);
    this.portDrive = Float64Array.from(cn.ports, (p) => 2 / Math.sqrt(p.zRef));
    this.portRead = Float64Array.from(cn.ports, (p) => 1 / Math.sqrt(p.zRef));
  }

  /**
   * The nominal board's γl of every line at every grid point with its cos, sin, sinh and cosh, as mna.ts takes them
   * (xr, xi, cos xi, sin xi, sinh xr, cosh xr at 6(k·E + idx)); a network too large to keep them (over NOMINAL_MAX)
   * keeps one row of NaN instead.
   * A made board's γl differs from it by a small d (a few per cent of its phase): cos(x0 + d) = cos x0 cos d −
   * sin x0 sin d and the like (the angle-sum identities) with cos d, sin d, cosh d, sinh d from their Taylor series,
   * a few multiplications instead of four calls to Math. For |d| ≤ 1/8 the series below, through d¹¹ and d¹⁰, leave
   * out less than 1e−20 of the result (the next terms, d¹³/13! and d¹²/12!), so the values are those of Math to a few
   * units in the last place; on the nominal board itself (d = 0) they are exactly the nominal ones, the same bits as
   * mna.ts (the zero-spread tests check this). Farther off, Math's functions are called as before.
   */
  private nominal = new Float64Array(0);
  /** Whether `nominal` holds every grid point (else one NaN row that sends every line to Math). */
  private nominalAll = false;

  /** Records the nominal board's line arguments (its columns, with no deviation). */
  setNominal(c: Columns): void {
    const E = c.kind.length, F = this.freqs.length;
    this.nominalAll = 6 * E * F <= NOMINAL_MAX;
    const nom = new Float64Array(this.nominalAll ? 6 * E * F : 6 * E).fill(NaN);
    this.nominal = nom;
    if (!this.nominalAll) return;
    for (let k = 0; k < F; k++) {
      for (let idx = 0; idx < E; idx++) {
        if (c.kind[idx] !== K_LINE || c.delta[idx] !== 0) continue;
        const t = c.table[idx]!, len = c.num[idx]!;
        const xr = t[4 * k + 2]! * len, xi = t[4 * k + 3]! * len, b = 6 * (k * E + idx);
        nom[b] = xr; nom[b + 1] = xi;
        nom[b + 2] = Math.cos(xi); nom[b + 3] = Math.sin(xi); nom[b + 4] = Math.sinh(xr); nom[b + 5] = Math.cosh(xr);
      }
    }
  }

  /** S at grid point k into out[at … at + 2P² − 1]; false where mna.ts would take its pivoting path. */
  solve(c: Columns, k: number, out: Float64Array, at: number): boolean {
    const cn = this.cn, sym = cn.symbolic, v = this.v, f = this.freqs[k]!, slot4 = this.slot4;
    v.fill(0);
    // Every γl is compared with the nominal one (a NaN there, for a network too large to keep them, means Math).
    const E = c.kind.length, nom = this.nominal, nomAt = this.nominalAll ? 6 * k * E : 0;
    for (let idx = 0; idx < E; idx++) {
      const kind = c.kind[idx]!;
      let y11r = 0, y11i = 0, y12r = 0, y12i = 0;
      if (kind === K_LINE) {
        const t = c.table[idx]!, dd = c.deriv[idx], x = c.delta[idx]!, len = c.num[idx]!;
        let zcr = t[4 * k]!, zci = t[4 * k + 1]!, gr = t[4 * k + 2]!, gi = t[4 * k + 3]!;
        if (dd) { zcr += x * dd[4 * k]!; zci += x * dd[4 * k + 1]!; gr += x * dd[4 * k + 2]!; gi += x * dd[4 * k + 3]!; }
        if (!Number.isFinite(zcr) || !Number.isFinite(zci) || !Number.isFinite(gr) || !Number.isFinite(gi)) {
          throw new InputError('invalid-number', `${cn.stamped[idx]!.el.id}.zc`, 'a finite value from its model', `${zcr} + j${zci} at ${f} Hz`);
        }
        if (zcr === 0 && zci === 0) throw new InputError('out-of-range', `${cn.stamped[idx]!.el.id}.zc`, 'a non-zero characteristic impedance', '0');
        // cosh and sinh of γl = xr + j·xi inline, as mna.ts's evaluate: cosh γl = cosh xr cos xi + j sinh xr sin xi,
        // sinh γl = sinh xr cos xi + j cosh xr sin xi, with cos, sin, sinh and cosh from the nominal board's (see
        // `nominal`) or, far from it, from Math as mna.ts takes them.
        const xr = gr * len, xi = gi * len;
        let co = 0, sn = 0, shr = 0, chr = 0;
        const b = nomAt + 6 * idx;
        const di = xi - nom[b + 1]!;
        if (di <= REACH && di >= -REACH) {
          const c0 = nom[b + 2]!, s0 = nom[b + 3]!, z = di * di;
          const sd = di + di * z * (S3 + z * (S5 + z * (S7 + z * (S9 + z * S11))));
          const hd = z * (C2 + z * (C4 + z * (C6 + z * (C8 + z * C10))));
          co = c0 - (c0 * hd + s0 * sd); sn = s0 - (s0 * hd - c0 * sd);
        } else { co = Math.cos(xi); sn = Math.sin(xi); }
        const dr = xr - nom[b]!;
        if (dr <= REACH && dr >= -REACH) {
          const sh0 = nom[b + 4]!, ch0 = nom[b + 5]!, z = dr * dr;
          const sd = dr + dr * z * (-S3 + z * (S5 + z * (-S7 + z * (S9 - z * S11))));
          const hd = z * (C2 + z * (-C4 + z * (C6 + z * (-C8 + z * C10))));
          shr = sh0 + (sh0 * hd + ch0 * sd); chr = ch0 + (ch0 * hd + sh0 * sd);
        } else { shr = Math.sinh(xr); chr = Math.cosh(xr); }
        const coR = chr * co, coI = shr * sn, siR = shr * co, siI = chr * sn;
        if (siR * siR + siI * siI < SINH_LIMIT * SINH_LIMIT) return false;
        // y12 = −1/(Zc sinh γl), y11 = cosh γl/(Zc sinh γl) = −cosh·y12.
        const zr = zcr * siR - zci * siI, zi = zcr * siI + zci * siR;
        const d = zr * zr + zi * zi;
        y12r = -zr / d; y12i = zi / d;
        y11r = -(coR * y12r - coI * y12i); y11i = -(coR * y12i + coI * y12r);
      } else if (kind === K_N) {
        this.addNport(c, idx, f);
        continue;
      } else {
        // Two-terminal admittances, written as mna.ts writes them (same operations, same order, the same signed zeros).
        let re: number, im: number;
        if (kind === K_G) { re = c.num[idx]!; im = 0; }
        else if (kind === K_C) { re = 0; im = 2 * Math.PI * f * c.num[idx]!; }
        else if (kind === K_L) { re = 0; im = -1 / (2 * Math.PI * f * c.num[idx]!); }
        else if (kind === K_RL) { const y = cdiv({ re: 1, im: 0 }, { re: (c.fn[idx] as (f: number) => number)(f), im: 2 * Math.PI * f * c.num[idx]! }); re = y.re; im = y.im; }
        else { const y = (c.fn[idx] as (f: number) => { re: number; im: number })(f); re = y.re; im = y.im; }
        if (!Number.isFinite(re) || !Number.isFinite(im)) throw new InputError('invalid-number', `${cn.stamped[idx]!.el.id}.admittance`, 'a finite value from its model', `${re} + j${im} at ${f} Hz`);
        y11r = re; y11i = im; y12r = -re; y12i = -im;
      }
      // Slots aa, bb, ab, ba in this order, as mna.ts's solveSparse adds them.
      const q = 4 * idx, s0 = slot4[q]!, s1 = slot4[q + 1]!, s2 = slot4[q + 2]!, s3 = slot4[q + 3]!;
      if (s0 >= 0) { v[2 * s0] += y11r; v[2 * s0 + 1] += y11i; }
      if (s1 >= 0) { v[2 * s1] += y11r; v[2 * s1 + 1] += y11i; }
      if (s2 >= 0) { v[2 * s2] += y12r; v[2 * s2 + 1] += y12i; }
      if (s3 >= 0) { v[2 * s3] += y12r; v[2 * s3 + 1] += y12i; }
    }
    const P = this.portY.length;
    for (let p = 0; p < P; p++) v[2 * this.portDiag[p]!] += this.portY[p]!;
    const rowScale = this.rowScale, rows = sym.rowOfSlot, nnz = sym.nnz;
    rowScale.fill(0);
    for (let t = 0; t < nnz; t++) {
      const a = v[2 * t]!, b = v[2 * t + 1]!, m = a * a + b * b, r = rows[t]!;
      if (m > rowScale[r]!) rowScale[r] = m;
    }
    for (let r = 0; r < sym.n; r++) rowScale[r] = Math.sqrt(rowScale[r]!);
    if (!(sparseFactorInPlace(sym, v, rowScale) >= PIVOT_LIMIT)) return false;
    const X = this.X, cols = this.columns, m = cols.length;
    X.fill(0);
    // The port excitations at once: column c is port j = cols[c] driven with E_j = 2√Z_j (injected current E_j/Z_j).
    for (let c = 0; c < m; c++) { const j = cols[c]!; X[2 * (this.portRow[j]! * m + c)] += this.portDrive[j]!; }
    for (let c = 0; c < m; c += 2) {
      if (c + 1 < m) substitutePair(sym, v, X, m, c); else substituteOne(sym, v, X, m, c);
    }
    for (let i = 0; i < P; i++) {
      const row = 2 * this.portRow[i]! * m, g = this.portRead[i]!, base = at + 2 * i * P;
      for (let c = 0; c < m; c++) {
        const j = cols[c]!;
        out[base + 2 * j] = X[row + 2 * c]! * g - (i === j ? 1 : 0);
        out[base + 2 * j + 1] = X[row + 2 * c + 1]! * g;
      }
    }
    return true;
  }

  /** An n-port's admittance matrix at f, added to its slots (checked as mna.ts checks it). */
  private addNport(c: Columns, idx: number, f: number): void {
    const cn = this.cn, v = this.v, sl = cn.slots[idx]!;
    const y = (c.fn[idx] as (f: number) => Float64Array)(f), m = Math.sqrt(sl.length);
    if (y.length !== 2 * m * m) throw new InputError('invalid-design', `${cn.stamped[idx]!.el.id}.y`, `a ${m}×${m} admittance matrix`, `${y.length / 2} entries`);
    for (const x of y) if (!Number.isFinite(x)) throw new InputError('invalid-number', `${cn.stamped[idx]!.el.id}.y`, 'finite admittances', `a non-finite value at ${f} Hz`);
    for (let t = 0; t < sl.length; t++) if (sl[t]! >= 0) { v[2 * sl[t]!] += y[2 * t]!; v[2 * sl[t]! + 1] += y[2 * t + 1]!; }
  }
}

/**
 * Forward and back substitution with the factors of sparseFactorInPlace for columns c and c + 1 of X (row k holds the
 * m columns of unknown k, interleaved re/im): ordering.ts's sparseSolveMany written out for two columns, with every
 * entry updated by the same operations in the same order (the columns do not mix), so the same bits in fewer steps.
 */
function substitutePair(s: Symbolic, v: Float64Array, X: Float64Array, m: number, c: number): void {
  const n = s.n, diag = s.diag, upStart = s.upStart, upper = s.upper, lowSlot = s.lowSlot, upSlot = s.upSlot;
  const w = 2 * m, o = 2 * c;
  for (let k = 0; k < n; k++) {
    const bk = k * w + o;
    const ar = X[bk]!, ai = X[bk + 1]!, br = X[bk + 2]!, bi = X[bk + 3]!;
    for (let t = upStart[k]!; t < upStart[k + 1]!; t++) {
      const q = upper[t]! * w + o, p = 2 * lowSlot[t]!;
      const lr = v[p]!, li = v[p + 1]!;
      X[q] -= lr * ar - li * ai; X[q + 1] -= lr * ai + li * ar;
      X[q + 2] -= lr * br - li * bi; X[q + 3] -= lr * bi + li * br;
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const bk = k * w + o;
    let ar = X[bk]!, ai = X[bk + 1]!, br = X[bk + 2]!, bi = X[bk + 3]!;
    for (let t = upStart[k]!; t < upStart[k + 1]!; t++) {
      const q = upper[t]! * w + o, p = 2 * upSlot[t]!;
      const ur = v[p]!, ui = v[p + 1]!;
      const xr = X[q]!, xi = X[q + 1]!, yr = X[q + 2]!, yi = X[q + 3]!;
      ar -= ur * xr - ui * xi; ai -= ur * xi + ui * xr;
      br -= ur * yr - ui * yi; bi -= ur * yi + ui * yr;
    }
    const d = 2 * diag[k]!;
    const pr = v[d]!, pi = v[d + 1]!, m2 = pr * pr + pi * pi;
    const ir = pr / m2, ii = -pi / m2;
    X[bk] = ar * ir - ai * ii; X[bk + 1] = ar * ii + ai * ir;
    X[bk + 2] = br * ir - bi * ii; X[bk + 3] = br * ii + bi * ir;
  }
}

/** substitutePair for the one column c. */
function substituteOne(s: Symbolic, v: Float64Array, X: Float64Array, m: number, c: number): void {
  const n = s.n, diag = s.diag, upStart = s.upStart, upper = s.upper, lowSlot = s.lowSlot, upSlot = s.upSlot;
  const w = 2 * m, o = 2 * c;
  for (let k = 0; k < n; k++) {
    const bk = k * w + o;
    const ar = X[bk]!, ai = X[bk + 1]!;
    for (let t = upStart[k]!; t < upStart[k + 1]!; t++) {
      const q = upper[t]! * w + o, p = 2 * lowSlot[t]!;
      const lr = v[p]!, li = v[p + 1]!;
      X[q] -= lr * ar - li * ai; X[q + 1] -= lr * ai + li * ar;
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const bk = k * w + o;
    let ar = X[bk]!, ai = X[bk + 1]!;
    for (let t = upStart[k]!; t < upStart[k + 1]!; t++) {
      const q = upper[t]! * w + o, p = 2 * upSlot[t]!;
      const ur = v[p]!, ui = v[p + 1]!;
      const xr = X[q]!, xi = X[q + 1]!;
      ar -= ur * xr - ui * xi; ai -= ur * xi + ui * xr;
    }
    const d = 2 * diag[k]!;
    const pr = v[d]!, pi = v[d + 1]!, m2 = pr * pr + pi * pi;
    const ir = pr / m2, ii = -pi / m2;
    X[bk] = ar * ir - ai * ii; X[bk + 1] = ar * ii + ai * ir;
  }
}
