/**
 * Folds: a line that turns through two corners and runs back beside itself (a U — one leg, a short join, a leg back,
 * as every meander is made of) has two legs that form a coupled pair. Their coupling changes the electrical length of
 * the U; the ledger (paths.ts), the sweep (core/network fromSized.ts) and equalize (core/network/equalize) all take
 * that change from `foldShareRad` here, so the three agree.
 *
 * The model: the U's two legs are a symmetric coupled pair of `coupled` m (even and odd modes of the Kirschning–Jansen
 * 1984 static model, core/line coupled.ts, dispersion 'none'), joined at the far end by a stretch of `join` m. The U is
 * symmetric under swapping its two legs, so its transmission follows from two half circuits (the even/odd
 * decomposition of a symmetric two-port, J. Reed and G. J. Wheeler, IRE Trans. MTT 4(4), 1956): the even mode loaded
 * by half the join left open at its middle, the odd mode by half the join shorted there; S21 = (Γe − Γo)/2 with the
 * input impedance of a loaded lossless line (D. M. Pozar, Microwave Engineering, 4th ed., 2012, eq. 2.44). The
 * coupling's share is the phase of the same U built from a far-apart pair of the same model (edge gap 100h, where
 * its two modes coincide to 0.05 %) less the phase of the U as drawn: what the single-line model, which carries the
 * dispersion and loss of every leg, does not see. Static modes, because the published per-mode dispersion does not
 * converge to the single line's at wide gaps and would show a difference that is not coupling; lossless, because
 * loss moves this phase difference by far less than the model's own accuracy.
 *
 * A serpentine of k bumps is 2k − 1 folds (k joined at the top, k − 1 along the run); their shares add. That is first
 * order in the coupling (legs two apart, at 2p + s, are left out): valid while a pair's coupling factor is well below
 * 1 — at a gap of 3h it is near −30 dB. Legs farther apart than FOLD_GAP_MAX_H substrate heights are not a fold (the
 * share is below 0.01° there). The coupled run of a leg is its straight copper: the side-by-side stretch of the two
 * centrelines less a strip width taken by the two corners.
 */
import type { SubstrateSpec } from '../substrate/types.ts';
import { COUPLED_G_MIN, COUPLED_U_MAX, COUPLED_U_MIN, lineModels, pairAt } from '../line/index.ts';
import { C0 } from '../units/constants.ts';
import type { Vec2 } from '../geometry/types.ts';
import type { SizedDesign, SizedPiece } from './types.ts';

/** The geometry of one U: strip width, edge gap between the legs, their coupled run and the join's length, m. */
export interface FoldShape { width: number; gap: number; coupled: number; join: number }

/** One fold found in a sized design: its two legs and the join between them (piece ids). */
export interface Fold extends FoldShape { legs: [string, string]; joinPiece: string }

/** Legs farther apart than this many substrate heights are not treated as coupled. */
export const FOLD_GAP_MAX_H = 10;
/** Edge gap, in substrate heights, of the far-apart reference pair. */
const FAR_GAP_H = 100;
const COS_ANTIPARALLEL = Math.cos((5 * Math.PI) / 180);

interface Modes { ze: number; zo: number; se: number; so: number }
const modeMemo = new Map<string, Modes>();

function modesOf(sub: SubstrateSpec, width: number, gap: number): Modes {
  const key = `${sub.er}|${sub.h}|${sub.t}|${width}|${gap}`;
  let m = modeMemo.get(key);
  if (!m) {
    // The core's coupled-pair family (line-model interface), static: a fold's share is a drawing-level estimate.
    const c = pairAt(lineModels.coupled(), sub, width, gap, 0, { dispersion: 'none' });
    m = { ze: c.even.z0, zo: c.odd.z0, se: Math.sqrt(c.even.epsEffStatic), so: Math.sqrt(c.odd.epsEffStatic) };
    if (modeMemo.size > 4096) modeMemo.clear();
    modeMemo.set(key, m);
  }
  return m;
}

/** Phase of S21 through a U of the given modes, radians (lossless; reference impedance √(Ze·Zo)). */
function uPhase(m: Modes, coupled: number, join: number, f: number): number {
  const z = Math.sqrt(m.ze * m.zo);
  const zj = z, sj = (m.se + m.so) / 2;
  const k = (2 * Math.PI * f) / C0;
  const te = k * m.se * coupled, to = k * m.so * coupled, tj = k * sj * (join / 2);
  const ce = Math.cos(te), se = Math.sin(te), co = Math.cos(to), so = Math.sin(to), cj = Math.cos(tj), sj2 = Math.sin(tj);
  // Zin = jN/D of each half circuit (the even mode ends in an open stub of join/2, the odd in a shorted one).
  const nE = -m.ze * (ce * cj - (m.ze * se * sj2) / zj), dE = (m.ze * ce * sj2) / zj + se * cj;
  const nO = m.zo * (zj * sj2 * co + m.zo * so * cj), dO = m.zo * co * cj - zj * sj2 * so;
  // Γ = (jN − zD)/(jN + zD)
  const gamma = (n: number, d: number): [number, number] => {
    const ar = -z * d, ai = n, br = z * d, bi = n, bb = br * br + bi * bi;
    return [(ar * br + ai * bi) / bb, (ai * br - ar * bi) / bb];
  };
  const [er, ei] = gamma(nE, dE), [or, oi] = gamma(nO, dO);
  return Math.atan2((ei - oi) / 2, (er - or) / 2);
}

const wrapPi = (x: number) => x - 2 * Math.PI * Math.round(x / (2 * Math.PI));

/** Extra phase delay the coupling of a U's two legs adds at f, radians (positive = electrically longer). */
export function foldShareRad(sub: SubstrateSpec, shape: FoldShape, f: number): number {
  if (!(shape.coupled > 0) || !(shape.gap > 0) || !(f > 0)) return 0;
  const near = modesOf(sub, shape.width, shape.gap);
  const far = modesOf(sub, shape.width, FAR_GAP_H * sub.h);
  return wrapPi(uPhase(far, shape.coupled, shape.join, f) - uPhase(near, shape.coupled, shape.join, f));
}

const foldMemo = new WeakMap<SizedDesign, Fold[]>();

/** The folds of a sized design (straight line pieces of one width: leg, join, leg back beside the first). */
export function foldsOf(sized: SizedDesign): Fold[] {
  const hit = foldMemo.get(sized);
  if (hit) return hit;
  const out = findFolds(sized);
  foldMemo.set(sized, out);
  return out;
}

function findFolds(sized: SizedDesign): Fold[] {
  const h = sized.doc.substrate.h;
  const pieces = new Map(sized.pieces.map((p) => [p.id, p]));
  const nodes = new Map(sized.nodes.map((n) => [n.id, n]));
  const straight = (p: SizedPiece | undefined): Vec2[] | null => {
    if (!p || p.kind !== 'line' || !Number.isFinite(p.width)) return null;
    const c = sized.centrelines[p.id];
    return c && c.length === 2 ? c : null;
  };
  /** The other piece at a vertex of exactly two pieces. */
  const other = (node: string, piece: string): SizedPiece | undefined => {
    const n = nodes.get(node);
    if (!n || n.kind !== 'vertex' || n.segments.length !== 2) return undefined;
    return pieces.get(n.segments[0] === piece ? n.segments[1]! : n.segments[0]!);
  };
  /** The leg's end at `node` first, then its far end. */
  const ordered = (p: SizedPiece, c: Vec2[], node: string): [Vec2, Vec2] => (p.b === node ? [c[1]!, c[0]!] : [c[0]!, c[1]!]);
  const out: Fold[] = [];
  for (const j of sized.pieces) {
    const cj = straight(j);
    if (!cj) continue;
    const A = other(j.a, j.id), B = other(j.b, j.id);
    const ca = straight(A), cb = straight(B);
    if (!A || !B || !ca || !cb || A.id === B.id) continue;
    if (Math.abs(A.width - j.width) > 1e-9 * j.width || Math.abs(B.width - j.width) > 1e-9 * j.width) continue;
    // Only strips the coupled-line model takes (it refuses W/h outside its limits; such a fold is left as single lines).
    if (!(j.width >= COUPLED_U_MIN * h && j.width <= COUPLED_U_MAX * h)) continue;
    const [aTop, aBase] = ordered(A, ca, j.a), [bTop, bBase] = ordered(B, cb, j.b);
    const ax = aTop.x - aBase.x, ay = aTop.y - aBase.y, la = Math.hypot(ax, ay);
    const bx = bTop.x - bBase.x, by = bTop.y - bBase.y, lb = Math.hypot(bx, by);
    if (!(la > 0) || !(lb > 0)) continue;
    const ux = ax / la, uy = ay / la;
    // Both legs run from their base to the join: side by side means parallel (the line runs back along them).
    if ((ux * bx + uy * by) / lb < COS_ANTIPARALLEL) continue;
    const distance = Math.abs(-uy * (bBase.x - aBase.x) + ux * (bBase.y - aBase.y));
    const gap = distance - j.width;
    if (!(gap >= COUPLED_G_MIN * h) || gap > FOLD_GAP_MAX_H * h) continue;
    const s0 = ux * (bBase.x - aBase.x) + uy * (bBase.y - aBase.y), s1 = ux * (bTop.x - aBase.x) + uy * (bTop.y - aBase.y);
    const coupled = Math.min(la, Math.max(s0, s1)) - Math.max(0, Math.min(s0, s1)) - j.width;
    if (!(coupled > 0)) continue;
    out.push({ legs: [A.id, B.id], joinPiece: j.id, width: j.width, gap, coupled, join: j.span });
  }
  return out;
}

/** Coupling phase of the folds lying wholly on a set of pieces at f, radians. */
export function foldsOnPathRad(sized: SizedDesign, pieces: ReadonlySet<string>, f: number): number {
  let sum = 0;
  for (const fold of foldsOf(sized)) {
    if (pieces.has(fold.legs[0]) && pieces.has(fold.legs[1]) && pieces.has(fold.joinPiece)) sum += foldShareRad(sized.doc.substrate, fold, f);
  }
  return sum;
}

/** Per leg piece, the folds it belongs to (each leg carries half of a fold's share in the sweep). */
export function foldLegs(sized: SizedDesign): Map<string, Fold[]> {
  const out = new Map<string, Fold[]>();
  for (const fold of foldsOf(sized)) for (const leg of fold.legs) { const l = out.get(leg); if (l) l.push(fold); else out.set(leg, [fold]); }
  return out;
}
