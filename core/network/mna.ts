/**
 * Modified nodal analysis of a netlist at one frequency, giving the full S-matrix of its ports
 * (textbook MNA with two-port ABCD stamps; cf. D. M. Pozar, Microwave Engineering, 4th ed., 2012, §4.3–4.4, from memory).
 *
 * Stamps. Admittances y between a and b: Y[a,a] += y, Y[b,b] += y, Y[a,b] -= y, Y[b,a] -= y (ground rows and
 * columns are left out). A line is stamped as its Y two-port Y11 = Y22 = coth(γl)/Zc, Y12 = Y21 = −1/(Zc sinh γl)
 * (standard nodal analysis). Ports of reference Zk add 1/Zk to their node (Norton form of a source with series Zk).
 *
 * Fast path: the pattern is symmetric and fixed, so a fill-reducing order and the symbolic factorisation are
 * computed once (ordering.ts) and each frequency is one sparse LU without pivoting.
 *
 * Robust path, taken at a frequency when the fast path cannot be trusted:
 *  - a line's Y stamp is singular or nearly so (|sinh γl| < 1e-4: a lossless line at a multiple of a half-wave);
 *  - a pivot of the fixed order is tiny relative to its row (e.g. an open quarter-wave stub at f0 has Y11 = 0).
 * Then the frequency is solved densely with scaled partial pivoting, and the ill-conditioned lines are stamped in
 * the ABCD form instead: two extra unknowns I1 (into end a) and I2 (out of end b) and two rows
 * V_a − A V_b − B I2 = 0, I1 − C V_b − D I2 = 0, which is never singular (ABCD definition as in Pozar, Microwave Engineering, 4th ed., §4.4, from memory).
 * Only a network that is singular in itself (an ideal lossless resonance with no port to damp it) still fails,
 * with an InputError 'singular-network' naming the frequency and the node.
 *
 * S-parameters: power waves with real references (Kurokawa 1965), equal to travelling waves for real Zk.
 * Excite port j with E_j = 2√Zj (incident wave a_j = 1), i.e. inject E_j/Z_j at its node; then
 * S_ij = V_i/√Z_i − δij.
 */
import { InputError } from '../util/errors.ts';
import { cdiv, cmul, type Complex } from './complex.ts';
import { denseLuFactor, denseLuSolve } from './denseLu.ts';
import { GROUND, type NetElement, type Netlist } from './netlist.ts';
import type { GridValues } from './sweepValues.ts';
import { forwardColumns, selectedInverse, sparseFactorInPlace, sparseSolveMany, sparseSolveTransposed, symbolicFactor, type Symbolic } from './ordering.ts';

/** Below this |sinh γl| a line is stamped in ABCD form (the Y stamp loses about 4 digits there). */
const SINH_LIMIT = 1e-4;
/** Below this pivot ratio the fixed-order LU is abandoned for the pivoting dense solve at that frequency. */
const PIVOT_LIMIT = 1e-8;
/** Below this pivot ratio the pivoting solve reports the network as singular. */
const SINGULAR_LIMIT = 1e-13;

/** `key`: the element's values at a frequency are a function of it alone (null: compute them every time). */
type Stamped =
  | { kind: 'y2'; el: NetElement; a: number; b: number; y: (f: number) => Complex; key: null }
  | { kind: 'line'; el: Extract<NetElement, { kind: 'line' }>; a: number; b: number; key: string | null }
  | { kind: 'nport'; el: Extract<NetElement, { kind: 'nport' }>; nodes: number[]; key: string | null };

/** A netlist prepared for repeated solves: nodes merged and numbered, pattern and ordering fixed. */
export interface CompiledNetwork {
  /** Node names by index (after merging wires; a merged node keeps the first name). */
  nodeNames: string[];
  ports: { name: string; node: number; zRef: number; label?: string }[];
  stamped: Stamped[];
  symbolic: Symbolic;
  /** For the fast path: slots per stamped element (aa, bb, ab, ba; −1 where a terminal is ground). */
  slots: Int32Array[];
  /** For the fast path: the port excitations' columns each row can hold in forward substitution (forwardColumns). */
  portColumns: Int32Array;
  /** For the fast path: the right-hand sides, reused at every frequency (solveAt is synchronous). */
  scratch: Float64Array;
}

function requirePositive(field: string, v: number, what: string): void {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) throw new InputError('out-of-range', field, what, String(v));
}

/** Somewhere to keep elimination orders by the network's shape (sweepValues.ts): a drag changes lengths, not shape. */
export interface SymbolicMemo { symbolic(key: string, make: () => Symbolic): Symbolic }

/**
 * Checks, merges zero-length wires, numbers nodes, fixes the elimination order. Throws InputError. With `memo`, the
 * order of a network of the same shape (nodes and who joins whom) is reused: the same computation, the same order.
 */
export function compileNetwork(net: Netlist, memo?: SymbolicMemo): CompiledNetwork {
  if (net.ports.length === 0) throw new InputError('singular-network', 'ports', 'at least one port', 'none');
  // Union-find over node names: zero-length lines, 0 Ω resistors and 0 H inductors are wires.
  const parent = new Map<string, string>();
  const find = (x: string): string => {
    let r = x;
    while (parent.has(r) && parent.get(r) !== r) r = parent.get(r)!;
    parent.set(x, r);
    return r;
  };
  const touch = (x: string) => { if (!parent.has(x)) parent.set(x, x); };
  const union = (a: string, b: string) => {
    const ra = find(a), rb = find(b);
    if (ra === rb) return;
    // Ground always stays the root so a wire to ground grounds the node.
    if (rb === GROUND) parent.set(ra, rb); else parent.set(rb, ra);
  };
  const kept: NetElement[] = [];
  const ids = new Set<string>();
  for (const [i, el] of net.elements.entries()) {
    const f = `elements[${i}]${el.id ? ` (${el.id})` : ''}`;
    if (ids.has(el.id)) throw new InputError('invalid-design', `${f}.id`, 'a unique element id', JSON.stringify(el.id));
    ids.add(el.id);
    const terms = el.kind === 'nport' ? el.nodes : [el.a, el.b];
    for (const t of terms) {
      if (typeof t !== 'string' || t === '') throw new InputError('invalid-design', `${f}.nodes`, 'node names', String(t));
      touch(t);
    }
    switch (el.kind) {
      case 'line':
        requirePositive(`${f}.length`, el.length, 'a length >= 0 m');
        if (el.length === 0) { union(el.a, el.b); continue; }
        break;
      case 'resistor': case 'inductor':
        requirePositive(`${f}.value`, el.value, el.kind === 'resistor' ? 'a resistance >= 0 Ω' : 'an inductance >= 0 H');
        if (el.value === 0) { union(el.a, el.b); continue; }
        break;
      case 'capacitor':
        requirePositive(`${f}.value`, el.value, 'a capacitance >= 0 F');
        if (el.value === 0) continue;
        break;
      case 'series-rl':
        requirePositive(`${f}.l`, el.l, 'an inductance >= 0 H');
        if (typeof el.r === 'number') {
          requirePositive(`${f}.r`, el.r, 'a resistance >= 0 Ω');
          if (el.r === 0 && el.l === 0) { union(el.a, el.b); continue; }
        }
        break;
      case 'admittance': case 'nport': break;
      default: {
        const k = (el as { kind: unknown }).kind;
        throw new InputError('bad-choice', `${f}.kind`, 'line, resistor, capacitor, inductor, series-rl, admittance or nport', String(k));
      }
    }
    kept.push(el);
  }
  touch(GROUND);
  for (const [i, p] of net.ports.entries()) {
    if (!(p.zRef > 0) || !Number.isFinite(p.zRef)) throw new InputError('out-of-range', `ports[${i}].zRef`, 'a real reference impedance > 0 Ω', String(p.zRef));
    if (!parent.has(p.node)) throw new InputError('singular-network', `ports[${i}].node`, 'a node that some element connects to', JSON.stringify(p.node));
    if (find(p.node) === GROUND) throw new InputError('singular-network', `ports[${i}] (${p.name})`, 'a port node not shorted to ground', 'a zero-length connection or 0 Ω part to ground at its node');
  }
  // Number the surviving (root) nodes, ground excluded.
  const index = new Map<string, number>();
  const nodeNames: string[] = [];
  const num = (name: string): number => {
    const r = find(name);
    if (r === GROUND) return -1;
    let k = index.get(r);
    if (k === undefined) { k = nodeNames.length; index.set(r, k); nodeNames.push(r); }
    return k;
  };
  for (const p of net.ports) num(p.node);
  const stamped: Stamped[] = [];
  for (const el of kept) {
    switch (el.kind) {
      case 'line': stamped.push({ kind: 'line', el, a: num(el.a), b: num(el.b), key: el.model.key !== undefined ? `L|${el.model.key}|${el.length}` : null }); break;
      case 'resistor': { const g = 1 / el.value; stamped.push({ kind: 'y2', el, a: num(el.a), b: num(el.b), y: () => ({ re: g, im: 0 }), key: null }); break; }
      case 'capacitor': { const c = el.value; stamped.push({ kind: 'y2', el, a: num(el.a), b: num(el.b), y: (f) => ({ re: 0, im: 2 * Math.PI * f * c }), key: null }); break; }
      case 'inductor': { const l = el.value; stamped.push({ kind: 'y2', el, a: num(el.a), b: num(el.b), y: (f) => ({ re: 0, im: -1 / (2 * Math.PI * f * l) }), key: null }); break; }
      case 'series-rl': {
        const { r, l } = el;
        stamped.push({ kind: 'y2', el, a: num(el.a), b: num(el.b), y: (f) => cdiv({ re: 1, im: 0 }, { re: typeof r === 'number' ? r : r(f), im: 2 * Math.PI * f * l }), key: null });
        break;
      }
      case 'admittance': stamped.push({ kind: 'y2', el, a: num(el.a), b: num(el.b), y: el.y, key: null }); break;
      case 'nport': stamped.push({ kind: 'nport', el, nodes: el.nodes.map(num), key: el.key !== undefined ? `N|${el.nodes.length}|${el.key}` : null }); break;
    }
  }
  const n = nodeNames.length;
  // Every part of the network must reach a port; an island has no defined response (and is a drawing slip).
  const adj: number[][] = Array.from({ length: n }, () => []);
  const link = (a: number, b: number) => { if (a >= 0 && b >= 0 && a !== b) { adj[a].push(b); adj[b].push(a); } };
  for (const s of stamped) {
    if (s.kind === 'nport') { for (const a of s.nodes) for (const b of s.nodes) link(a, b); } else link(s.a, s.b);
  }
  const seen = new Uint8Array(n);
  const stack = net.ports.map((p) => num(p.node));
  for (const s of stack) seen[s] = 1;
  while (stack.length) { const k = stack.pop()!; for (const j of adj[k]) if (!seen[j]) { seen[j] = 1; stack.push(j); } }
  const floating = nodeNames.filter((_, i) => !seen[i]);
  if (floating.length) {
    throw new InputError('singular-network', 'nodes', 'every node connected to a port through some element',
      `node${floating.length > 1 ? 's' : ''} ${floating.slice(0, 6).join(', ')}${floating.length > 6 ? ', …' : ''} floating (reaching no port)`,
      'join them to the network or delete them');
  }
  const symbolic = memo ? memo.symbolic(shapeKey(n, adj), () => symbolicFactor(n, adj)) : symbolicFactor(n, adj);
  const P = symbolic.position;
  const slotOr = (i: number, j: number) => (i < 0 || j < 0 ? -1 : symbolic.slot(P[i], P[j]));
  const slots = stamped.map((s) => {
    if (s.kind === 'nport') {
      const m = s.nodes.length, out = new Int32Array(m * m);
      for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) out[i * m + j] = slotOr(s.nodes[i], s.nodes[j]);
      return out;
    }
    return Int32Array.of(slotOr(s.a, s.a), slotOr(s.b, s.b), slotOr(s.a, s.b), slotOr(s.b, s.a));
  });
  const ports = net.ports.map((p) => ({ name: p.name, node: num(p.node), zRef: p.zRef, ...(p.label !== undefined ? { label: p.label } : {}) }));
  const portColumns = forwardColumns(symbolic, ports.map((p) => symbolic.position[p.node]));
  return { nodeNames, ports, stamped, symbolic, slots, portColumns, scratch: new Float64Array(2 * n * ports.length) };
}

/** The network's shape as text: each node's neighbours in the order symbolicFactor reads them. */
function shapeKey(n: number, adj: number[][]): string {
  let s = `${n}`;
  for (let i = 0; i < n; i++) s += `;${adj[i].join(',')}`;
  return s;
}

/** Element values at one frequency, shared by both paths. */
interface Evaluated {
  /**
   * 8 numbers per element at 8·idx: for admittances and Y-stamped lines y11, y22, y12, y21 (re, im each);
   * for ABCD-stamped lines A, B, C, D. N-ports keep their matrix in `nport[idx]`.
   */
  flat: Float64Array;
  nport: (Float64Array | null)[];
  /** Where each n-port's matrix starts in `nport[idx]` (a kept block holds every frequency's). */
  nportAt: Int32Array;
  abcd: Uint8Array;
  anyAbcd: boolean;
}

/**
 * Buffers one frequency's solve writes and reads, reused at every point (solveAt is synchronous): a fresh typed
 * array per point for each of these cost more than the arithmetic on them.
 */
interface Work { flat: Float64Array; nport: (Float64Array | null)[]; nportAt: Int32Array; abcd: Uint8Array; v: Float64Array; rowScale: Float64Array }
const works = new WeakMap<CompiledNetwork, Work>();
function workOf(cn: CompiledNetwork): Work {
  let w = works.get(cn);
  if (!w) {
    const E = cn.stamped.length;
    w = { flat: new Float64Array(8 * E), nport: new Array<Float64Array | null>(E).fill(null), nportAt: new Int32Array(E), abcd: new Uint8Array(E), v: new Float64Array(2 * cn.symbolic.nnz), rowScale: new Float64Array(cn.symbolic.n) };
    works.set(cn, w);
  }
  return w;
}

function finite(c: Complex, what: string, f: number): Complex {
  if (!Number.isFinite(c.re) || !Number.isFinite(c.im)) {
    throw new InputError('invalid-number', what, 'a finite value from its model', `${c.re} + j${c.im} at ${f} Hz`);
  }
  return c;
}

/**
 * Kept values of one sweep point (sweepValues.ts): per stamped element its block of the grid (null: not kept), and
 * the point's index in the grid.
 */
export interface PointValues { blocks: (Float64Array | null)[]; k: number }

/** Each stamped element's block in a grid's kept values (by its key; null for elements without one). */
export function valueBlocks(cn: CompiledNetwork, grid: GridValues): (Float64Array | null)[] {
  return cn.stamped.map((s) => {
    if (s.key === null) return null;
    return grid.stamp(s.key, s.kind === 'nport' ? 2 * s.nodes.length * s.nodes.length : 8);
  });
}

function evaluate(cn: CompiledNetwork, f: number, kept?: PointValues): Evaluated {
  const E = cn.stamped.length;
  const { flat, nport, nportAt, abcd } = workOf(cn);
  nport.fill(null); nportAt.fill(0); abcd.fill(0);
  let anyAbcd = false;
  for (let idx = 0; idx < E; idx++) {
    const s = cn.stamped[idx], o = 8 * idx;
    const block = kept ? kept.blocks[idx] : null;
    if (block) {
      // A kept value: the same key computed these very numbers at this frequency before (state 1: Y form, 2: ABCD).
      const w = s.kind === 'nport' ? 2 * s.nodes.length * s.nodes.length : 8, at = (w + 1) * kept!.k, state = block[at + w];
      if (state !== 0) {
        if (s.kind === 'nport') { nport[idx] = block; nportAt[idx] = at; }
        else {
          for (let q = 0; q < 8; q++) flat[o + q] = block[at + q];
          if (state === 2) { abcd[idx] = 1; anyAbcd = true; }
        }
        continue;
      }
      evaluateOne(s, idx, f, flat, nport, abcd);
      if (s.kind === 'nport') { block.set(nport[idx]!, at); nport[idx] = block; nportAt[idx] = at; } else block.set(flat.subarray(o, o + 8), at);
      block[at + w] = abcd[idx] ? 2 : 1;
      if (abcd[idx]) anyAbcd = true;
      continue;
    }
    evaluateOne(s, idx, f, flat, nport, abcd);
    if (abcd[idx]) anyAbcd = true;
  }
  return { flat, nport, nportAt, abcd, anyAbcd };
}

/** One element's values at f into the flat arrays (8 numbers at 8·idx, or its n-port matrix). */
function evaluateOne(s: Stamped, idx: number, f: number, flat: Float64Array, nport: (Float64Array | null)[], abcd: Uint8Array): void {
  const o = 8 * idx;
  {
    if (s.kind === 'y2') {
      const y = finite(s.y(f), `${s.el.id}.admittance`, f);
      flat[o] = y.re; flat[o + 1] = y.im; flat[o + 2] = y.re; flat[o + 3] = y.im;
      flat[o + 4] = -y.re; flat[o + 5] = -y.im; flat[o + 6] = -y.re; flat[o + 7] = -y.im;
    } else if (s.kind === 'line') {
      const lc = s.el.model(f);
      const zc = finite(lc.zc, `${s.el.id}.zc`, f), g = finite(lc.gamma, `${s.el.id}.gamma`, f);
      if (zc.re === 0 && zc.im === 0) throw new InputError('out-of-range', `${s.el.id}.zc`, 'a non-zero characteristic impedance', '0');
      // cosh and sinh of γl inline (this loop runs for every line at every frequency).
      const xr = g.re * s.el.length, xi = g.im * s.el.length;
      const c = Math.cos(xi), sn = Math.sin(xi), shr = Math.sinh(xr), chr = Math.cosh(xr);
      const coR = chr * c, coI = shr * sn, siR = shr * c, siI = chr * sn;
      if (siR * siR + siI * siI < SINH_LIMIT * SINH_LIMIT) {
        abcd[idx] = 1;
        const B = cmul(zc, { re: siR, im: siI }), C = cdiv({ re: siR, im: siI }, zc);
        flat[o] = coR; flat[o + 1] = coI; flat[o + 2] = B.re; flat[o + 3] = B.im;
        flat[o + 4] = C.re; flat[o + 5] = C.im; flat[o + 6] = coR; flat[o + 7] = coI;
      } else {
        // y12 = −1/(Zc sinh γl), y11 = cosh γl/(Zc sinh γl) = −cosh·y12.
        const zr = zc.re * siR - zc.im * siI, zi = zc.re * siI + zc.im * siR;
        const d = zr * zr + zi * zi;
        const y12r = -zr / d, y12i = zi / d;
        const y11r = -(coR * y12r - coI * y12i), y11i = -(coR * y12i + coI * y12r);
        flat[o] = y11r; flat[o + 1] = y11i; flat[o + 2] = y11r; flat[o + 3] = y11i;
        flat[o + 4] = y12r; flat[o + 5] = y12i; flat[o + 6] = y12r; flat[o + 7] = y12i;
      }
    } else {
      const y = s.el.y(f);
      const m = s.nodes.length;
      if (y.length !== 2 * m * m) throw new InputError('invalid-design', `${s.el.id}.y`, `a ${m}×${m} admittance matrix`, `${y.length / 2} entries`);
      for (const v of y) if (!Number.isFinite(v)) throw new InputError('invalid-number', `${s.el.id}.y`, 'finite admittances', `a non-finite value at ${f} Hz`);
      nport[idx] = y;
    }
  }
}

/** Result of one frequency: S (P×P, row-major interleaved) and whether the pivoting path was needed. */
export interface PointSolution { s: Float64Array; robust: boolean; pivotRatio: number }

/**
 * Solves the compiled network at frequency f (Hz > 0) and writes S into `out` (2·P·P numbers) when given.
 * `method: 'dense'` forces the pivoting path (for cross-checks). Throws InputError('singular-network') when the
 * network itself is singular at f.
 */
export function solveAt(cn: CompiledNetwork, f: number, out?: Float64Array, opts: { method?: 'auto' | 'dense'; entries?: EntryPlan; kept?: PointValues } = {}): PointSolution {
  if (!(f > 0) || !Number.isFinite(f)) throw new InputError('out-of-range', 'frequency', 'a frequency > 0 Hz', String(f));
  const P = cn.ports.length;
  const s = out ?? new Float64Array(2 * P * P);
  const ev = evaluate(cn, f, opts.kept);
  if (!ev.anyAbcd && opts.method !== 'dense') {
    const r = opts.entries ? solveSparseEntries(cn, ev, s, opts.entries) : solveSparse(cn, ev, s);
    if (r >= PIVOT_LIMIT) return { s, robust: false, pivotRatio: r };
  }
  const ratio = solveDense(cn, ev, f, s);
  return { s, robust: true, pivotRatio: ratio };
}

/** Stamps every element into the fixed pattern and factors it (no pivoting); returns the values and the smallest pivot ratio. */
function assembleAndFactor(cn: CompiledNetwork, ev: Evaluated): { v: Float64Array; minRatio: number } {
  const sym = cn.symbolic;
  const work = workOf(cn);
  const v = work.v;
  v.fill(0);
  const { flat, nport, nportAt } = ev;
  for (let idx = 0; idx < cn.stamped.length; idx++) {
    const sl = cn.slots[idx];
    const x = nport[idx];
    if (x) {
      const x0 = nportAt[idx];
      for (let t = 0; t < sl.length; t++) if (sl[t] >= 0) { v[2 * sl[t]] += x[x0 + 2 * t]; v[2 * sl[t] + 1] += x[x0 + 2 * t + 1]; }
      continue;
    }
    const o = 8 * idx;
    for (let q = 0; q < 4; q++) {
      const slot = sl[q];
      if (slot >= 0) { v[2 * slot] += flat[o + 2 * q]; v[2 * slot + 1] += flat[o + 2 * q + 1]; }
    }
  }
  for (const p of cn.ports) v[2 * sym.diag[sym.position[p.node]]] += 1 / p.zRef;
  const rowScale = work.rowScale;
  rowScale.fill(0);
  const rows = sym.rowOfSlot;
  for (let t = 0; t < sym.nnz; t++) {
    const a = v[2 * t], b = v[2 * t + 1], m = a * a + b * b, r = rows[t];
    if (m > rowScale[r]) rowScale[r] = m;
  }
  for (let r = 0; r < sym.n; r++) rowScale[r] = Math.sqrt(rowScale[r]);
  return { v, minRatio: sparseFactorInPlace(sym, v, rowScale) };
}

function solveSparse(cn: CompiledNetwork, ev: Evaluated, s: Float64Array): number {
  const sym = cn.symbolic;
  const { v, minRatio } = assembleAndFactor(cn, ev);
  if (!(minRatio >= PIVOT_LIMIT)) return minRatio;
  const P = cn.ports.length;
  // All port excitations at once: column j is port j driven with E_j = 2√Z_j (injected current E_j/Z_j).
  const X = cn.scratch;
  X.fill(0);
  for (let j = 0; j < P; j++) X[2 * (sym.position[cn.ports[j].node] * P + j)] += 2 / Math.sqrt(cn.ports[j].zRef);
  sparseSolveMany(sym, v, X, P, cn.portColumns);
  for (let i = 0; i < P; i++) {
    const row = 2 * sym.position[cn.ports[i].node] * P, g = 1 / Math.sqrt(cn.ports[i].zRef);
    for (let j = 0; j < P; j++) {
      const t = 2 * (i * P + j);
      s[t] = X[row + 2 * j] * g - (i === j ? 1 : 0);
      s[t + 1] = X[row + 2 * j + 1] * g;
    }
  }
  return minRatio;
}

/**
 * Which S entries a solve is asked for: whole columns (the excitations j: every S_ij), whole rows (every S_ij of an
 * i, from one solve with the transposed factors) and the diagonal (every reflection S_ii, from the selected inverse).
 * A plot of a feed reads the input's column and row and every port's reflection: three solves' worth per point
 * instead of one per port.
 */
export interface SolveEntries { columns: readonly number[]; rows: readonly number[]; diagonal: boolean }

/** SolveEntries checked and prepared for one compiled network (buffers and the forward-substitution ranges). */
export interface EntryPlan {
  entries: SolveEntries;
  cols: Int32Array;
  ranges: Int32Array;
  rows: Int32Array;
  /** The diagonal needs the selected inverse (some reflection is in no asked column or row). */
  diag: boolean;
  /** fromInverse[i] = 1 where S_ii comes from the selected inverse (in no asked column or row). */
  fromInverse: Uint8Array;
  /** computed[i·P + j]: 0 where S_ij is left out, else its place among the computed entries, from 1 (response.ts). */
  computed: Int32Array;
  /** The dense offsets i·P + j of the computed entries, in their order. */
  gather: Int32Array;
  X: Float64Array;
  Y: Float64Array;
  Z: Float64Array;
}

/** Checks `e` against the network's ports (InputError naming the bad index) and prepares its buffers. */
export function planEntries(cn: CompiledNetwork, e: SolveEntries): EntryPlan {
  const P = cn.ports.length;
  const pick = (xs: readonly number[], field: string) => {
    for (const [k, x] of xs.entries()) if (!Number.isInteger(x) || x < 0 || x >= P) throw new InputError('out-of-range', `entries.${field}[${k}]`, `a port index from 0 to ${P - 1}`, String(x));
    return Int32Array.from(new Set(xs)).sort();
  };
  const cols = pick(e.columns, 'columns'), rows = pick(e.rows, 'rows');
  const computed = new Int32Array(P * P);
  for (const j of cols) for (let i = 0; i < P; i++) computed[i * P + j] = 1;
  for (const i of rows) for (let j = 0; j < P; j++) computed[i * P + j] = 1;
  let diag = false;
  const fromInverse = new Uint8Array(P);
  if (e.diagonal) for (let i = 0; i < P; i++) if (!computed[i * P + i]) { diag = true; fromInverse[i] = 1; computed[i * P + i] = 1; }
  const gather: number[] = [];
  for (let t = 0; t < P * P; t++) if (computed[t]) { gather.push(t); computed[t] = gather.length; }
  const sym = cn.symbolic, n = sym.n;
  return {
    entries: { columns: [...cols], rows: [...rows], diagonal: e.diagonal }, cols, rows, diag, fromInverse, computed, gather: Int32Array.from(gather),
    ranges: forwardColumns(sym, Array.from(cols, (j) => sym.position[cn.ports[j].node])),
    X: new Float64Array(2 * n * cols.length), Y: new Float64Array(2 * n * rows.length), Z: new Float64Array(diag ? 2 * sym.nnz : 0),
  };
}

/** The fast path for some entries only: the asked excitations, transposed solves for the rows, the selected inverse for the diagonal. */
function solveSparseEntries(cn: CompiledNetwork, ev: Evaluated, s: Float64Array, plan: EntryPlan): number {
  const sym = cn.symbolic;
  const { v, minRatio } = assembleAndFactor(cn, ev);
  if (!(minRatio >= PIVOT_LIMIT)) return minRatio;
  const P = cn.ports.length, pos = sym.position, ports = cn.ports;
  const g = (i: number) => 1 / Math.sqrt(ports[i].zRef);
  const { cols, rows, X, Y } = plan;
  const mc = cols.length, mr = rows.length;
  if (mc) {
    // As solveSparse: column c is port cols[c] driven with E_j = 2√Z_j.
    X.fill(0);
    for (let c = 0; c < mc; c++) X[2 * (pos[ports[cols[c]].node] * mc + c)] = 2 / Math.sqrt(ports[cols[c]].zRef);
    sparseSolveMany(sym, v, X, mc, plan.ranges);
    for (let i = 0; i < P; i++) {
      const row = 2 * pos[ports[i].node] * mc, gi = g(i);
      for (let c = 0; c < mc; c++) {
        const j = cols[c], t = 2 * (i * P + j);
        s[t] = X[row + 2 * c] * gi - (i === j ? 1 : 0);
        s[t + 1] = X[row + 2 * c + 1] * gi;
      }
    }
  }
  if (mr) {
    // Row i of A⁻¹ from Aᵀ·y = e_i: S_ij = (A⁻¹)_ij · 2/√Z_j · 1/√Z_i − δ_ij.
    Y.fill(0);
    for (let r = 0; r < mr; r++) Y[2 * (pos[ports[rows[r]].node] * mr + r)] = 1;
    sparseSolveTransposed(sym, v, Y, mr);
    for (let r = 0; r < mr; r++) {
      const i = rows[r], gi = g(i);
      for (let j = 0; j < P; j++) {
        const at = 2 * (pos[ports[j].node] * mr + r), k = (2 / Math.sqrt(ports[j].zRef)) * gi, t = 2 * (i * P + j);
        s[t] = Y[at] * k - (i === j ? 1 : 0);
        s[t + 1] = Y[at + 1] * k;
      }
    }
  }
  if (plan.diag) {
    const Z = plan.Z;
    selectedInverse(sym, v, Z);
    for (let i = 0; i < P; i++) {
      if (!plan.fromInverse[i]) continue;
      const d = 2 * sym.diag[pos[ports[i].node]], k = (2 / Math.sqrt(ports[i].zRef)) * g(i), t = 2 * (i * P + i);
      s[t] = Z[d] * k - 1;
      s[t + 1] = Z[d + 1] * k;
    }
  }
  return minRatio;
}

function solveDense(cn: CompiledNetwork, ev: Evaluated, f: number, s: Float64Array): number {
  const n0 = cn.nodeNames.length;
  const extra: number[] = [];
  let n = n0;
  for (let i = 0; i < cn.stamped.length; i++) { extra.push(ev.abcd[i] ? n : -1); if (ev.abcd[i]) n += 2; }
  const a = new Float64Array(2 * n * n);
  const add = (i: number, j: number, re: number, im: number) => { if (i >= 0 && j >= 0) { const p = 2 * (i * n + j); a[p] += re; a[p + 1] += im; } };
  cn.stamped.forEach((st, idx) => {
    const o = 8 * idx;
    const x = st.kind === 'nport' ? ev.nport[idx]!.subarray(ev.nportAt[idx], ev.nportAt[idx] + 2 * st.nodes.length * st.nodes.length) : ev.flat.subarray(o, o + 8);
    if (st.kind === 'nport') {
      const m = st.nodes.length;
      for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) add(st.nodes[i], st.nodes[j], x[2 * (i * m + j)], x[2 * (i * m + j) + 1]);
      return;
    }
    if (!ev.abcd[idx]) {
      add(st.a, st.a, x[0], x[1]); add(st.b, st.b, x[2], x[3]); add(st.a, st.b, x[4], x[5]); add(st.b, st.a, x[6], x[7]);
      return;
    }
    // ABCD stamp (Pozar, Microwave Engineering, 4th ed., §4.4, from memory): unknowns I1 = column p, I2 = column p + 1.
    const p = extra[idx];
    add(st.a, p, 1, 0); add(st.b, p + 1, -1, 0);
    add(p, st.a, 1, 0); add(p, st.b, -x[0], -x[1]); add(p, p + 1, -x[2], -x[3]);
    add(p + 1, p, 1, 0); add(p + 1, st.b, -x[4], -x[5]); add(p + 1, p + 1, -x[6], -x[7]);
  });
  for (const p of cn.ports) add(p.node, p.node, 1 / p.zRef, 0);
  const fac = denseLuFactor(a, n);
  if (!(fac.minPivotRatio >= SINGULAR_LIMIT)) {
    const row = fac.worstRow;
    const where = row >= 0 && row < n0 ? `node ${cn.nodeNames[row]}` : row >= n0 ? `line ${cn.stamped[extra.findIndex((e) => e >= 0 && (row === e || row === e + 1))]?.el.id ?? '?'}` : 'the network';
    throw new InputError('singular-network', 'network', 'a network with a unique response at every frequency',
      `a singular nodal matrix at ${f} Hz near ${where}`,
      'a lossless resonance that no port damps, or a part connected to nothing: add loss, a port or change the frequency');
  }
  const P = cn.ports.length;
  const b = new Float64Array(2 * n);
  for (let j = 0; j < P; j++) {
    b.fill(0);
    b[2 * cn.ports[j].node] = 2 / Math.sqrt(cn.ports[j].zRef);
    const x = denseLuSolve(fac, b);
    for (let i = 0; i < P; i++) {
      const g = 1 / Math.sqrt(cn.ports[i].zRef), k = cn.ports[i].node, t = 2 * (i * P + j);
      s[t] = x[2 * k] * g - (i === j ? 1 : 0);
      s[t + 1] = x[2 * k + 1] * g;
    }
  }
  return fac.minPivotRatio;
}
