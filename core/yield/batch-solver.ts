/**
 * Solves many made boards of one design over one frequency grid. Every board has the same netlist shape (the board
 * is made as drawn), so the nodal solver's compiled structure (node merging, elimination order, symbolic LU; see
 * core/network/mna.ts) is built once from the nominal board and reused; each board brings only its element values:
 * line constants tabulated per (laminate, width) over the whole grid with the batch line analysis, part values,
 * end capacitances and via inductances.
 *
 * A piece's own width deviation (a per-piece tolerance) enters its lines to first order: Zc and γ of the board's
 * width plus δ·∂/∂W, the derivative taken once per nominal width on the nominal laminate by a central difference
 * (step 1e-4·W) of the line model; board-wide changes (laminate, etch, tool) are analysed exactly. For 10 µm on a
 * 1.5 mm strip the neglected second-order term is about (δ/W)² ≈ 4e-5 of the constants.
 *
 * The per-point arithmetic is that of mna.ts's fast path, term for term and in the same order (the modified nodal
 * stamps of Ho, Ruehli & Brennan 1975, IEEE Trans. Circuits Syst. 22(6), from memory, the fixed-order sparse LU of ordering.ts), so a board with no deviation gives the nominal sweep to
 * the last bit (test/unit/yield.test.ts checks this). Where mna.ts would take its pivoting path (a line near a
 * multiple of a half wave, a tiny pivot) this solver hands that point to mna.ts's `solveAt` itself.
 */
import { InputError } from '../util/errors.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { microstripColumns, lineConstantsFrom, type LineOptions } from '../line/index.ts';
import type { SizedDesign, SizedPiece } from '../layout/types.ts';
import { compileNetwork, solveAt, type CompiledNetwork } from '../network/mna.ts';
import { sparseFactor, sparseSolveMany } from '../network/ordering.ts';
import { cdiv } from '../network/complex.ts';
import { netlistFromSized, type SizedNetlist } from '../network/fromSized.ts';
import type { LineConstants, LineModel, NetElement } from '../network/netlist.ts';
import type { SampleLaminate } from './made-board.ts';

const SINH_LIMIT = 1e-4;
const PIVOT_LIMIT = 1e-8;

/** Constants of one (laminate, width) at every grid point: zc re, im, γ re, im at 4k … 4k + 3. */
interface TableModel { key: string; sub: SubstrateSpec; width: number; table: Float64Array | null }

/** What a line element's model stands for: its table, its piece and its nominal width (for the derivative). */
interface Tag { table: TableModel; piece: number; width: number; model: LineModel }

const K_LINE = 0, K_G = 1, K_C = 2, K_L = 3, K_RL = 4, K_Y = 5, K_N = 6;

/**
 * A made board's element values in stamped order: a kind code each, and per kind — line: its table, derivative table,
 * own width deviation and length (num); resistor: 1/R; capacitor: C; inductor: L; series R-L: L and R(f);
 * admittance and n-port: their function.
 */
interface Columns {
  kind: Int8Array;
  table: (Float64Array | null)[];
  deriv: (Float64Array | null)[];
  delta: Float64Array;
  num: Float64Array;
  fn: (((f: number) => unknown) | null)[];
}

export class BatchSolver {
  private readonly cn: CompiledNetwork;
  /** Index into the netlist's elements of each stamped element. */
  private readonly source: Int32Array;
  private readonly fIndex: Map<number, number>;
  private readonly v: Float64Array;
  private readonly rowScale: Float64Array;
  private readonly X: Float64Array;
  readonly ports: { name: string; zRef: number }[];
  readonly input: number;

  /** Nominal width of each netlist element that is a line (NaN otherwise), for the derivative tables. */
  private readonly nominalWidth: Float64Array;
  private readonly derivs = new Map<number, Float64Array>();
  private readonly nominalSub: SubstrateSpec;
  /** Each piece's own width deviation for the board being solved (first order). */
  private pieceDw: Float64Array;

  constructor(nominal: SizedDesign, readonly freqs: Float64Array, private readonly line?: LineOptions) {
    const lam: SampleLaminate = { list: [nominal.doc.substrate], ofPiece: new Int32Array(nominal.pieces.length) };
    this.nominalSub = nominal.doc.substrate;
    this.pieceDw = new Float64Array(nominal.pieces.length);
    const { net, tags } = this.netlist(nominal, lam);
    this.nominalWidth = Float64Array.from(net.elements, (e) => (e.kind === 'line' && tags.has(e.model) ? tags.get(e.model)!.width : NaN));
    this.cn = compileNetwork(net);
    const where = new Map(net.elements.map((e, i) => [e, i]));
    this.source = Int32Array.from(this.cn.stamped, (s) => where.get(s.el)!);
    this.fIndex = new Map(Array.from(freqs, (f, k) => [f, k]));
    const sym = this.cn.symbolic;
    this.v = new Float64Array(2 * sym.nnz);
    this.rowScale = new Float64Array(sym.n);
    this.X = new Float64Array(2 * sym.n * this.cn.ports.length);
    this.ports = this.cn.ports.map((p) => ({ name: p.name, zRef: p.zRef }));
    this.input = net.input;
  }

  /** The netlist of a made board with tabulated line models (one table per laminate and width). */
  private netlist(made: SizedDesign, lam: SampleLaminate): { net: SizedNetlist; tables: Map<string, TableModel>; tags: Map<LineModel, Tag> } {
    const tables = new Map<string, TableModel>();
    const tags = new Map<LineModel, Tag>();
    const index = new Map(made.pieces.map((p, i) => [p.id, i]));
    const lineModel = (width: number, piece: SizedPiece): LineModel => {
      const pi = index.get(piece.id)!, s = lam.ofPiece[pi]!;
      const key = `${s}|${width}`;
      let table = tables.get(key);
      if (!table) { table = { key, sub: lam.list[s]!, width, table: null }; tables.set(key, table); }
      // Each element gets its own model (it carries the element's piece); mna.ts calls it only on a fallback point.
      const scratch: LineConstants = { zc: { re: 0, im: 0 }, gamma: { re: 0, im: 0 } };
      const tag: Tag = { table, piece: pi, width, model: () => scratch };
      tag.model = (f) => {
        const k = this.fIndex.get(f);
        if (k === undefined || !table.table) throw new InputError('out-of-range', 'frequency', 'a frequency of the yield grid', String(f));
        const c = this.constantsAt(tag, k);
        scratch.zc.re = c[0]; scratch.zc.im = c[1]; scratch.gamma.re = c[2]; scratch.gamma.im = c[3];
        return scratch;
      };
      tags.set(tag.model, tag);
      return tag.model;
    };
    return { net: netlistFromSized(made, { lineModel, ...(this.line ? { line: this.line } : {}) }), tables, tags };
  }

  /** Tag → the element's nominal width is resolved per solve (see `values`); this serves the fallback points. */
  private fallbackDelta = new Map<Tag, { deriv: Float64Array | null; delta: number }>();

  private constantsAt(tag: Tag, k: number): [number, number, number, number] {
    const t = tag.table.table!, fd = this.fallbackDelta.get(tag);
    const d = fd?.deriv ?? null, x = fd?.delta ?? 0;
    if (!d || x === 0) return [t[4 * k]!, t[4 * k + 1]!, t[4 * k + 2]!, t[4 * k + 3]!];
    return [t[4 * k]! + x * d[4 * k]!, t[4 * k + 1]! + x * d[4 * k + 1]!, t[4 * k + 2]! + x * d[4 * k + 2]!, t[4 * k + 3]! + x * d[4 * k + 3]!];
  }

  /** ∂(zc, γ)/∂W over the grid at nominal width w on the nominal laminate (central difference), cached. */
  private derivative(w: number): Float64Array {
    let d = this.derivs.get(w);
    if (d) return d;
    const h = 1e-4 * w;
    const up = this.tableOf(this.nominalSub, w + h), dn = this.tableOf(this.nominalSub, w - h);
    d = new Float64Array(up.length);
    for (let i = 0; i < d.length; i++) d[i] = (up[i]! - dn[i]!) / (2 * h);
    this.derivs.set(w, d);
    return d;
  }

  /** Reused tables, one per (laminate, width) slot of the board being solved. */
  private readonly pool: Float64Array[] = [];

  /**
   * Tables of a board's (laminate, width) pairs: one batch analysis per laminate, width after width over the whole
   * grid (the line model keeps its width terms while only the frequency changes; measured faster than the other order).
   */
  private tabulate(tables: TableModel[]): void {
    const F = this.freqs.length;
    const out: LineConstants = { zc: { re: 0, im: 0 }, gamma: { re: 0, im: 0 } };
    let slot = 0;
    const bySub = new Map<SubstrateSpec, TableModel[]>();
    for (const t of tables) { const l = bySub.get(t.sub) ?? []; l.push(t); bySub.set(t.sub, l); }
    for (const [sub, list] of bySub) {
      const K = list.length;
      const widths = new Float64Array(K * F), fs = new Float64Array(K * F);
      for (let j = 0; j < K; j++) for (let k = 0; k < F; k++) { widths[j * F + k] = list[j]!.width; fs[j * F + k] = this.freqs[k]!; }
      const c = microstripColumns(sub, widths, fs, this.line);
      list.forEach((t, j) => {
        const tab = (this.pool[slot] ??= new Float64Array(4 * F));
        slot++;
        for (let k = 0; k < F; k++) {
          const i = j * F + k;
          lineConstantsFrom(c.z0[i]!, c.epsEff[i]!, c.alphaC[i]!, c.alphaD[i]!, this.freqs[k]!, out);
          tab[4 * k] = out.zc.re; tab[4 * k + 1] = out.zc.im; tab[4 * k + 2] = out.gamma.re; tab[4 * k + 3] = out.gamma.im;
        }
        t.table = tab;
      });
    }
  }

  /** Line constants of one laminate and width over the grid (the batch analysis, same numbers as lineConstants). */
  private tableOf(sub: SubstrateSpec, width: number): Float64Array {
    const F = this.freqs.length;
    const out: LineConstants = { zc: { re: 0, im: 0 }, gamma: { re: 0, im: 0 } };
    const c = microstripColumns(sub, new Float64Array(F).fill(width), this.freqs, this.line);
    const t = new Float64Array(4 * F);
    for (let k = 0; k < F; k++) {
      lineConstantsFrom(c.z0[k]!, c.epsEff[k]!, c.alphaC[k]!, c.alphaD[k]!, this.freqs[k]!, out);
      t[4 * k] = out.zc.re; t[4 * k + 1] = out.zc.im; t[4 * k + 2] = out.gamma.re; t[4 * k + 3] = out.gamma.im;
    }
    return t;
  }

  /** Element values of a made board, in stamped order, as columns (one kind code and its numbers per element). */
  private values(net: SizedNetlist, tags: Map<LineModel, Tag>): Columns {
    if (net.elements.length !== this.nominalWidth.length) throw new InputError('invalid-design', 'design', 'a made board with the nominal board\'s network', 'a different network');
    this.fallbackDelta.clear();
    const E = this.source.length;
    const c: Columns = { kind: new Int8Array(E), table: new Array(E).fill(null), deriv: new Array(E).fill(null), delta: new Float64Array(E), num: new Float64Array(E), fn: new Array(E).fill(null) };
    for (let idx = 0; idx < E; idx++) {
      const i = this.source[idx]!;
      const el: NetElement = net.elements[i]!;
      const want = this.cn.stamped[idx]!.el.kind;
      if (el.kind !== want) throw new InputError('invalid-design', 'design', 'a made board with the nominal board\'s network', `${el.kind} where ${want} was`);
      switch (el.kind) {
        case 'line': {
          const tag = tags.get(el.model)!;
          const delta = this.pieceDw[tag.piece] ?? 0;
          const deriv = delta !== 0 ? this.derivative(this.nominalWidth[i]!) : null;
          this.fallbackDelta.set(tag, { deriv, delta });
          c.kind[idx] = K_LINE; c.table[idx] = tag.table.table!; c.deriv[idx] = deriv; c.delta[idx] = delta; c.num[idx] = el.length;
          break;
        }
        case 'resistor': c.kind[idx] = K_G; c.num[idx] = 1 / el.value; break;
        case 'capacitor': c.kind[idx] = K_C; c.num[idx] = el.value; break;
        case 'inductor': c.kind[idx] = K_L; c.num[idx] = el.value; break;
        case 'series-rl': c.kind[idx] = K_RL; c.num[idx] = el.l; c.fn[idx] = typeof el.r === 'number' ? constant(el.r) : el.r; break;
        case 'admittance': c.kind[idx] = K_Y; c.fn[idx] = el.y; break;
        case 'nport': c.kind[idx] = K_N; c.fn[idx] = el.y; break;
      }
    }
    return c;
  }

  /**
   * S of a made board at every grid point into `out` (2·P·P per point, as NetworkResponse.s). Returns how many points
   * needed the pivoting solve.
   */
  solve(made: SizedDesign, lam: SampleLaminate, pieceDw: Float64Array, out: Float64Array): number {
    const { net, tables, tags } = this.netlist(made, lam);
    this.tabulate([...tables.values()]);
    this.pieceDw = pieceDw;
    const vals = this.values(net, tags);
    const P = this.cn.ports.length, F = this.freqs.length;
    let fallback: CompiledNetwork | null = null, robust = 0;
    for (let k = 0; k < F; k++) {
      const s = out.subarray(2 * P * P * k, 2 * P * P * (k + 1));
      if (!this.solvePoint(vals, k, s)) {
        fallback ??= compileNetwork(net);
        solveAt(fallback, this.freqs[k]!, s);
        robust++;
      }
    }
    return robust;
  }

  /** mna.ts's evaluate + solveSparse at point k, on reused buffers; false where mna.ts would pivot instead. */
  private solvePoint(c: Columns, k: number, s: Float64Array): boolean {
    const cn = this.cn, sym = cn.symbolic, v = this.v, f = this.freqs[k]!;
    v.fill(0);
    const E = c.kind.length;
    for (let idx = 0; idx < E; idx++) {
      const kind = c.kind[idx]!, sl = cn.slots[idx]!;
      let y11r: number, y11i: number, y12r: number, y12i: number;
      if (kind === K_LINE) {
        const t = c.table[idx]!, dd = c.deriv[idx], x = c.delta[idx]!, len = c.num[idx]!;
        let zcr = t[4 * k]!, zci = t[4 * k + 1]!, gr = t[4 * k + 2]!, gi = t[4 * k + 3]!;
        if (dd) { zcr += x * dd[4 * k]!; zci += x * dd[4 * k + 1]!; gr += x * dd[4 * k + 2]!; gi += x * dd[4 * k + 3]!; }
        if (!Number.isFinite(zcr) || !Number.isFinite(zci) || !Number.isFinite(gr) || !Number.isFinite(gi)) {
          throw new InputError('invalid-number', `${cn.stamped[idx]!.el.id}.zc`, 'a finite value from its model', `${zcr} + j${zci} at ${f} Hz`);
        }
        if (zcr === 0 && zci === 0) throw new InputError('out-of-range', `${cn.stamped[idx]!.el.id}.zc`, 'a non-zero characteristic impedance', '0');
        const xr = gr * len, xi = gi * len;
        const co = Math.cos(xi), sn = Math.sin(xi), shr = Math.sinh(xr), chr = Math.cosh(xr);
        const coR = chr * co, coI = shr * sn, siR = shr * co, siI = chr * sn;
        if (siR * siR + siI * siI < SINH_LIMIT * SINH_LIMIT) return false;
        const zr = zcr * siR - zci * siI, zi = zcr * siI + zci * siR;
        const d = zr * zr + zi * zi;
        y12r = -zr / d; y12i = zi / d;
        y11r = -(coR * y12r - coI * y12i); y11i = -(coR * y12i + coI * y12r);
      } else if (kind === K_N) {
        const y = (c.fn[idx] as (f: number) => Float64Array)(f), m = Math.sqrt(sl.length);
        if (y.length !== 2 * m * m) throw new InputError('invalid-design', `${cn.stamped[idx]!.el.id}.y`, `a ${m}×${m} admittance matrix`, `${y.length / 2} entries`);
        for (const x of y) if (!Number.isFinite(x)) throw new InputError('invalid-number', `${cn.stamped[idx]!.el.id}.y`, 'finite admittances', `a non-finite value at ${f} Hz`);
        for (let t = 0; t < sl.length; t++) if (sl[t]! >= 0) { v[2 * sl[t]!] += y[2 * t]!; v[2 * sl[t]! + 1] += y[2 * t + 1]!; }
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
      // Slots aa, bb, ab, ba in this order, as solveSparse adds them.
      const s0 = sl[0]!, s1 = sl[1]!, s2 = sl[2]!, s3 = sl[3]!;
      if (s0 >= 0) { v[2 * s0] += y11r; v[2 * s0 + 1] += y11i; }
      if (s1 >= 0) { v[2 * s1] += y11r; v[2 * s1 + 1] += y11i; }
      if (s2 >= 0) { v[2 * s2] += y12r; v[2 * s2 + 1] += y12i; }
      if (s3 >= 0) { v[2 * s3] += y12r; v[2 * s3 + 1] += y12i; }
    }
    for (const p of cn.ports) v[2 * sym.diag[sym.position[p.node]!]!] += 1 / p.zRef;
    const rowScale = this.rowScale;
    rowScale.fill(0);
    const rows = sym.rowOfSlot;
    for (let t = 0; t < sym.nnz; t++) {
      const a = v[2 * t]!, b = v[2 * t + 1]!, m = a * a + b * b, r = rows[t]!;
      if (m > rowScale[r]!) rowScale[r] = m;
    }
    for (let r = 0; r < sym.n; r++) rowScale[r] = Math.sqrt(rowScale[r]!);
    const { minRatio } = sparseFactor(sym, v, rowScale);
    if (!(minRatio >= PIVOT_LIMIT)) return false;
    const P = cn.ports.length, X = this.X;
    X.fill(0);
    for (let j = 0; j < P; j++) X[2 * (sym.position[cn.ports[j]!.node]! * P + j)] += 2 / Math.sqrt(cn.ports[j]!.zRef);
    sparseSolveMany(sym, v, X, P, cn.portColumns);
    for (let i = 0; i < P; i++) {
      const row = 2 * sym.position[cn.ports[i]!.node]! * P, g = 1 / Math.sqrt(cn.ports[i]!.zRef);
      for (let j = 0; j < P; j++) {
        const t = 2 * (i * P + j);
        s[t] = X[row + 2 * j]! * g - (i === j ? 1 : 0);
        s[t + 1] = X[row + 2 * j + 1]! * g;
      }
    }
    return true;
  }
}

function constant(r: number): (f: number) => number { return () => r; }
