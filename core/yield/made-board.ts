/**
 * The board as made for one sample of the tolerances: the sized design kept as drawn (lengths, positions and pads
 * where the layout put them; nothing is re-sized), with the laminate, the copper widths and the part values the
 * draws give. Width changes of the process (core/design/targets.ts explains each): etch bias ΔW = −2δ (both edges),
 * tool width ΔW = −δ, V-bit depth ΔW = −2δ·tan(angle/2), width error ΔW = +δ; they apply to every strip, taper section
 * and pad of a piece. End models that depend on the laminate or the width are re-evaluated for the made board: the
 * open-end capacitance (Kirschning, Jansen & Koster 1981, at the drawn cut) and the via inductance (Goldfarb & Pucel
 * 1991); they keep their nominal value when nothing they depend on moved, so a board without tolerances is exactly
 * the nominal one.
 */
import { InputError } from '../util/errors.ts';
import type { FabProcess, SubstrateSpec, Tolerance, ToleranceQuantity } from '../design/types.ts';
import { TOLERANCE_WORDS } from '../design/targets.ts';
import type { SizedDesign, SizedNode, SizedPiece } from '../layout/types.ts';
import { boardLines, type BoardLines } from './board-lines.ts';
import { openEndExtension, openEndCapacitance } from '../discontinuity/kirschningJansenKoster1981OpenEnd.ts';
import { viaGround } from '../discontinuity/goldfarbPucel1991Via.ts';
import type { ToleranceDraws } from './draws.ts';

const LAMINATE: readonly ToleranceQuantity[] = ['er', 'h', 'tanDelta', 't'];
const PART: Partial<Record<ToleranceQuantity, 'resistor' | 'capacitor' | 'inductor'>> = { resistor: 'resistor', capacitor: 'capacitor', inductor: 'inductor' };

/** ΔW per unit δ of a width-changing quantity for this process, or null when the quantity does not apply to it. */
export function widthGain(q: ToleranceQuantity, fab: FabProcess): number | null {
  switch (q) {
    case 'width': return 1;
    case 'etch-bias': return fab.kind === 'etch' ? -2 : null;
    case 'tool-width': return fab.kind === 'etch' ? null : -1;
    case 'mill-depth': return fab.kind === 'v-bit' ? -2 * Math.tan((fab.angleDeg * Math.PI) / 360) : null;
    default: return null;
  }
}

export interface Applicable { tolerances: Tolerance[]; ignored: { quantity: ToleranceQuantity; why: string }[] }

/** The tolerances that change something on this design, and why the others do not. */
export function applicableTolerances(sized: SizedDesign): Applicable {
  const fab = sized.doc['process'];
  const tolerances: Tolerance[] = [], ignored: Applicable['ignored'] = [];
  const partKinds = new Set(sized.pieces.map((p) => p.part?.part).filter((x) => x !== undefined));
  for (const t of sized.doc.tolerances ?? []) {
    const q = t.quantity;
    if (LAMINATE.includes(q)) tolerances.push(t);
    else if (PART[q]) {
      if (partKinds.has(PART[q]!)) tolerances.push(t);
      else ignored.push({ quantity: q, why: `the design has no ${q}` });
    } else if (widthGain(q, fab) !== null) tolerances.push(t);
    else ignored.push({ quantity: q, why: q === 'mill-depth' && fab.kind === 'end-mill'
      ? 'an end mill cuts straight down, so its depth does not change the copper width'
      : `${TOLERANCE_WORDS[q].name} does not apply to the ${fab.kind} process` });
  }
  return { tolerances, ignored };
}

/** Pieces' laminate for one sample: an index per piece into `list` (one entry when every laminate draw is board-wide). */
export interface SampleLaminate { list: SubstrateSpec[]; ofPiece: Int32Array }

export class MadeBoard {
  private readonly pieceIndex: Map<string, number>;
  private readonly gains: (number | null)[];
  /** The lines the design was sized with (board-lines.ts), for the end models re-evaluated on a made board. */
  private readonly lines: BoardLines;
  /** Draws below a physical floor (tanδ or t below 0) taken as the floor, counted over the run. */
  floored = 0;

  /** Per tolerance: its ΔW gain (0 where it changes no width), whether it is per piece, and its part kind. */
  private readonly gain: Float64Array;
  private readonly perPiece: Uint8Array;
  private readonly partOf: ('resistor' | 'capacitor' | 'inductor' | undefined)[];

  constructor(readonly sized: SizedDesign, readonly draws: ToleranceDraws) {
    this.pieceIndex = new Map(sized.pieces.map((p, i) => [p.id, i]));
    this.gains = draws.tolerances.map((t) => widthGain(t.quantity, sized.doc['process']));
    this.gain = Float64Array.from(this.gains, (g) => g ?? 0);
    this.perPiece = Uint8Array.from(draws.tolerances, (t) => (t.scope === 'piece' ? 1 : 0));
    this.partOf = draws.tolerances.map((t) => PART[t.quantity]);
    this.lines = boardLines(sized);
  }

  /** Laminate of every piece for the current draws (`only` limits the draws used to one tolerance, for ranking). */
  laminate(only: number | null = null): SampleLaminate {
    const base = this.sized.doc.substrate;
    const t = this.draws.tolerances;
    const perPiece = t.some((x, k) => (only === null || only === k) && LAMINATE.includes(x.quantity) && x.scope === 'piece');
    const n = perPiece ? this.sized.pieces.length : 1;
    const list: SubstrateSpec[] = [];
    for (let i = 0; i < n; i++) {
      const s: SubstrateSpec = { ...base };
      t.forEach((x, k) => {
        if ((only !== null && only !== k) || !LAMINATE.includes(x.quantity)) return;
        const d = this.draws.at(k, i);
        if (d === 0) return;
        const q = x.quantity as 'er' | 'h' | 'tanDelta' | 't';
        let v = s[q] + d;
        if ((q === 'tanDelta' || q === 't') && v < 0) { v = 0; this.floored++; }
        s[q] = v;
      });
      if (!(s.er > 1) || !(s.h > 0)) {
        throw new InputError('out-of-range', 'tolerances', 'tolerances whose draws keep εr above 1 and h above 0', `a draw giving εr ${s.er}, h ${s.h} m`, 'reduce the spread of εr or h');
      }
      list.push(s);
    }
    return { list, ofPiece: perPiece ? Int32Array.from(this.sized.pieces, (_, i) => i) : new Int32Array(this.sized.pieces.length) };
  }

  /** ΔW of piece i for the current draws, m: the board-wide part and the piece's own part. */
  deltaW(i: number, only: number | null = null): { board: number; piece: number } {
    let board = 0, piece = 0;
    this.gains.forEach((g, k) => {
      if (g === null || (only !== null && only !== k)) return;
      if (this.draws.tolerances[k]!.scope === 'board') board += g * this.draws.at(k, i); else piece += g * this.draws.at(k, i);
    });
    return { board, piece };
  }

  /** Factor on the value of the part of piece i. */
  partFactor(piece: SizedPiece, i: number, only: number | null = null): number {
    let f = 1;
    this.draws.tolerances.forEach((t, k) => {
      if ((only !== null && only !== k) || PART[t.quantity] !== piece.part?.part) return;
      f *= 1 + this.draws.at(k, i);
    });
    if (!(f > 0)) throw new InputError('out-of-range', 'tolerances', 'part tolerances whose draws keep every value above 0', `a factor ${f} on ${piece.id}`, 'reduce the part tolerance');
    return f;
  }

  /**
   * The sized design as made for the current draws, each piece's laminate, and each piece's own width deviation.
   * The pieces' widths in `made` carry the board-wide width change only; `pieceDw` is each piece's own part, which
   * the batch solver takes to first order (batch-solver.ts). End models are evaluated at the full width.
   */
  make(only: number | null = null): { made: SizedDesign; laminate: SampleLaminate; pieceDw: Float64Array } {
    const sized = this.sized, n = sized.pieces.length;
    const lam = this.laminate(only);
    const pieceDw = new Float64Array(n);
    // Per piece index: the piece with the board-wide width change (and its part value), and with its own change too.
    const pieces: SizedPiece[] = new Array<SizedPiece>(n), full: SizedPiece[] = new Array<SizedPiece>(n);
    for (let i = 0; i < n; i++) {
      const p = sized.pieces[i]!;
      // ΔW of the piece (as deltaW, without a record per piece: this runs for every piece of every board).
      let dw = 0, own = 0;
      for (let k = 0; k < this.gain.length; k++) {
        const g = this.gain[k]!;
        if (g === 0 || (only !== null && only !== k)) continue;
        if (this.perPiece[k] === 0) dw += g * this.draws.at(k, i); else own += g * this.draws.at(k, i);
      }
      pieceDw[i] = own;
      const factor = p.part && this.partOf.includes(p.part.part) ? this.partFactor(p, i, only) : 1;
      let q = p;
      if (dw !== 0 || factor !== 1) {
        q = { ...p, width: widen(p.width, dw, p.id) };
        if (p.widthB !== undefined) q.widthB = widen(p.widthB, dw, p.id);
        if (p.sections) q.sections = p.sections.map((s) => ({ ...s, width: widen(s.width, dw, p.id) }));
        if (p.part) q.part = { ...p.part, value: p.part.value * factor, footprint: { ...p.part.footprint, padAcross: widen(p.part.footprint.padAcross, dw, p.id) } };
      }
      pieces[i] = q;
      full[i] = own !== 0 ? { ...p, width: widen(p.width, dw + own, p.id), ...(p.widthB !== undefined ? { widthB: widen(p.widthB, dw + own, p.id) } : {}) } : q;
    }
    const nodes = sized.nodes.map((node) => this.madeNode(node, full, pieces, lam));
    const doc = { ...sized.doc, substrate: lam.list[0]! };
    return { made: { ...sized, pieces, nodes, doc }, laminate: lam, pieceDw };
  }

  private madeNode(n: SizedNode, full: SizedPiece[], board: SizedPiece[], lam: SampleLaminate): SizedNode {
    const segId = n.segments[0];
    if (segId === undefined) return n;
    const i = this.pieceIndex.get(segId)!;
    const p = full[i]!, p0 = this.sized.pieces[i]!, pb = board[i]!;
    const sub = lam.list[lam.ofPiece[i]!]!, sub0 = this.sized.doc.substrate;
    const sameSub = sub === sub0 || (sub.er === sub0.er && sub.h === sub0.h && sub.t === sub0.t && sub.tanDelta === sub0.tanDelta);
    if (n.kind === 'port' && n.port?.launch && pb !== p0) {
      // The pad's own share of a per-piece deviation comes to the pad's line through the batch solver.
      const dw = pb.width - p0.width;
      return { ...n, port: { ...n.port, launch: { ...n.port.launch, padWidth: widen(n.port.launch.padWidth, dw, n.id) } } };
    }
    if (n.kind === 'open' && n.open && (p !== p0 || !sameSub)) {
      const w = p.a === n.id ? p.width : (p.widthB ?? p.width);
      const r = this.lines.at(sub, w, this.sized.f0, this.lines.sizedWith);
      const oe = openEndExtension({ u: w / sub.h, er: sub.er, eeStatic: r.epsEffStatic, h: sub.h });
      return { ...n, open: { dl: oe.dl, capacitance: openEndCapacitance(oe.dl, r.epsEffStatic, r.z0Static) } };
    }
    if (n.kind === 'short' && n.via && sub.h !== sub0.h) {
      const g = viaGround({ h: sub.h, drill: n.via.drill, count: n.via.count, f: this.sized.f0, rho: 1 / sub.sigma, ...(n.via.plating !== undefined ? { plating: n.via.plating } : {}) });
      return { ...n, via: { ...n.via, L: g.L } };
    }
    return n;
  }
}

function widen(w: number, dw: number, id: string): number {
  const v = w + dw;
  if (!(v > 0)) throw new InputError('out-of-range', 'tolerances', 'width tolerances whose draws leave every strip some copper', `${(v * 1e3).toFixed(3)} mm at ${id}`, 'reduce the width, etch or tool spread');
  return v;
}
