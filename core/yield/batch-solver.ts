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
import { lineConstantsAt, type LineColumns, type LineOptions } from '../line/index.ts';
import { boardLines, type BoardLines } from './board-lines.ts';
import type { SizedDesign, SizedPiece } from '../layout/types.ts';
import { compileNetwork, solveAt, type CompiledNetwork } from '../network/mna.ts';
import { netlistFromSized, type SizedNetlist } from '../network/fromSized.ts';
import type { LineConstants, LineModel, NetElement } from '../network/netlist.ts';
import type { SampleLaminate } from './made-board.ts';
import { Columns, K_C, K_G, K_L, K_LINE, K_N, K_RL, K_Y } from './board-columns.ts';
import { PointSolver } from './point-solve.ts';

/** Constants of one (laminate, width) at every grid point: zc re, im, γ re, im at 4k … 4k + 3. */
interface TableModel { sub: SubstrateSpec; width: number; table: Float64Array | null }

/** What a line element's model stands for: its table, its piece and its nominal width (for the derivative). */
interface Tag { table: TableModel; piece: number; width: number; model: LineModel; deriv: Float64Array | null; delta: number }

export class BatchSolver {
  private readonly cn: CompiledNetwork;
  /** Index into the netlist's elements of each stamped element. */
  private readonly source: Int32Array;
  private readonly fIndex: Map<number, number>;
  private readonly points: PointSolver;
  /** Piece id → index (a made board keeps the nominal pieces, in order). */
  private readonly pieceIndex: Map<string, number>;
  readonly ports: { name: string; zRef: number }[];
  readonly input: number;

  /** Nominal width of each netlist element that is a line (NaN otherwise), for the derivative tables. */
  private readonly nominalWidth: Float64Array;
  private readonly derivs = new Map<number, Float64Array>();
  private readonly nominalSub: SubstrateSpec;
  /** Each piece's own width deviation for the board being solved (first order). */
  private pieceDw: Float64Array;
  /** The strips' family and the coupled pairs' models, as the nominal board was sized (board-lines.ts). */
  private readonly lines: BoardLines;

  /**
   * `columns`: the ports whose excitation is solved (default all). S entries of the other columns are left as they
   * are in the caller's buffer, except at a point that needed the pivoting solve (all of S is written there).
   */
  constructor(nominal: SizedDesign, readonly freqs: Float64Array, private readonly line?: LineOptions, columns?: readonly number[]) {
    const lam: SampleLaminate = { list: [nominal.doc.substrate], ofPiece: new Int32Array(nominal.pieces.length) };
    this.lines = boardLines(nominal);
    this.nominalSub = nominal.doc.substrate;
    this.pieceDw = new Float64Array(nominal.pieces.length);
    this.pieceIndex = new Map(nominal.pieces.map((p, i) => [p.id, i]));
    const { net, tables, tags } = this.netlist(nominal, lam);
    this.nominalWidth = Float64Array.from(net.elements, (e) => (e.kind === 'line' && tags.has(e.model) ? tags.get(e.model)!.width : NaN));
    this.cn = compileNetwork(net);
    const where = new Map(net.elements.map((e, i) => [e, i]));
    this.source = Int32Array.from(this.cn.stamped, (s) => where.get(s.el)!);
    this.fIndex = new Map(Array.from(freqs, (f, k) => [f, k]));
    this.points = new PointSolver(this.cn, freqs, columns);
    // The nominal board's line arguments, from which every made board's are reached (point-solve.ts).
    this.tabulate(tables);
    this.points.setNominal(this.values(net, tags));
    this.ports = this.cn.ports.map((p) => ({ name: p.name, zRef: p.zRef }));
    this.input = net.input;
  }

  /** The netlist of a made board with tabulated line models (one table per laminate and width). */
  private netlist(made: SizedDesign, lam: SampleLaminate): { net: SizedNetlist; tables: TableModel[]; tags: Map<LineModel, Tag> } {
    const tables = new Map<number, Map<number, TableModel>>();
    const tags = new Map<LineModel, Tag>();
    const index = this.pieceIndex;
    const lineModel = (width: number, piece: SizedPiece): LineModel => {
      const pi = index.get(piece.id)!, s = lam.ofPiece[pi]!;
      // Keyed by laminate index, then width (numbers: no text made of a width per element and board).
      let ofSub = tables.get(s);
      if (!ofSub) { ofSub = new Map(); tables.set(s, ofSub); }
      let table = ofSub.get(width);
      if (!table) { table = { sub: lam.list[s]!, width, table: null }; ofSub.set(width, table); }
      // Each element gets its own model (it carries the element's piece); mna.ts calls it only on a fallback point.
      const scratch: LineConstants = { zc: { re: 0, im: 0 }, gamma: { re: 0, im: 0 } };
      const tag: Tag = { table, piece: pi, width, model: () => scratch, deriv: null, delta: 0 };
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
    const net = netlistFromSized(made, { lineModel, models: this.lines.models, ...(this.line ? { line: this.line } : {}) });
    const list: TableModel[] = [];
    for (const ofSub of tables.values()) for (const t of ofSub.values()) list.push(t);
    return { net, tables: list, tags };
  }

  /** A line's constants at grid point k for the fallback points: its table plus its own width deviation (set by `values`). */
  private constantsAt(tag: Tag, k: number): [number, number, number, number] {
    const t = tag.table.table!, d = tag.deriv, x = tag.delta;
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

  /** Inputs and columns of the batch line analysis, per number of widths analysed together. */
  private readonly batches = new Map<number, { widths: Float64Array; fs: Float64Array; cols: LineColumns | null }>();

  /** Reused tables, one per (laminate, width) slot of the board being solved. */
  private readonly pool: Float64Array[] = [];

  /**
   * Tables of a board's (laminate, width) pairs: one batch analysis per laminate, width after width over the whole
   * grid (the line model keeps its width terms while only the frequency changes; measured faster than the other order).
   */
  private tabulate(tables: TableModel[]): void {
    const F = this.freqs.length;
    let slot = 0;
    const bySub = new Map<SubstrateSpec, TableModel[]>();
    for (const t of tables) { const l = bySub.get(t.sub) ?? []; l.push(t); bySub.set(t.sub, l); }
    for (const [sub, list] of bySub) {
      const K = list.length;
      // The batch's inputs and columns are kept per size and refilled board after board (no new arrays to collect).
      let b = this.batches.get(K);
      if (!b) {
        const fs = new Float64Array(K * F);
        for (let j = 0; j < K; j++) fs.set(this.freqs, j * F);
        b = { widths: new Float64Array(K * F), fs, cols: null };
        this.batches.set(K, b);
      }
      const widths = b.widths;
      for (let j = 0; j < K; j++) widths.fill(list[j]!.width, j * F, (j + 1) * F);
      const c = this.lines.columns(sub, widths, b.fs, this.line, b.cols ?? undefined);
      b.cols = c;
      list.forEach((t, j) => {
        const tab = (this.pool[slot] ??= new Float64Array(4 * F));
        slot++;
        for (let k = 0; k < F; k++) {
          const i = j * F + k;
          lineConstantsAt(c.z0[i]!, c.epsEff[i]!, c.alphaC[i]!, c.alphaD[i]!, this.freqs[k]!, tab, 4 * k);
        }
        t.table = tab;
      });
    }
  }

  /** Line constants of one laminate and width over the grid (the batch analysis, same numbers as lineConstants). */
  private tableOf(sub: SubstrateSpec, width: number): Float64Array {
    const F = this.freqs.length;
    const c = this.lines.columns(sub, new Float64Array(F).fill(width), this.freqs, this.line);
    const t = new Float64Array(4 * F);
    for (let k = 0; k < F; k++) {
      lineConstantsAt(c.z0[k]!, c.epsEff[k]!, c.alphaC[k]!, c.alphaD[k]!, this.freqs[k]!, t, 4 * k);
    }
    return t;
  }

  /** Element values of a made board, in stamped order, as columns (one kind code and its numbers per element). */
  private cols: Columns | null = null;

  private values(net: SizedNetlist, tags: Map<LineModel, Tag>): Columns {
    if (net.elements.length !== this.nominalWidth.length) throw new InputError('invalid-design', 'design', 'a made board with the nominal board\'s network', 'a different network');
    const E = this.source.length;
    // One record refilled for every board: each element keeps its kind, so every field it reads is written again.
    const c = (this.cols ??= new Columns(E));
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
          tag.deriv = deriv; tag.delta = delta;
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
    this.tabulate(tables);
    this.pieceDw = pieceDw;
    const vals = this.values(net, tags);
    const P = this.cn.ports.length, F = this.freqs.length, PP = 2 * P * P;
    let fallback: CompiledNetwork | null = null, robust = 0;
    for (let k = 0; k < F; k++) {
      if (!this.points.solve(vals, k, out, PP * k)) {
        fallback ??= compileNetwork(net);
        solveAt(fallback, this.freqs[k]!, out.subarray(PP * k, PP * (k + 1)));
        robust++;
      }
    }
    return robust;
  }
}

function constant(r: number): (f: number) => number { return () => r; }
