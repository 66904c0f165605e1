/**
 * The path ledger's phases (core/layout/paths.ts) over many made boards: for large feeds, where a full network solve
 * per board is more than a phase budget needs. Each path's electrical length at f0 is Σ β·l over its pieces' path
 * copper, as the ledger counts it, with:
 *  - board-wide tolerances (laminate εr, h, t, tanδ; etch bias, tool width, milling depth, a board-wide width error)
 *    analysed exactly: β of every distinct width on the sample's laminate at the sample's width change;
 *  - per-piece tolerances to first order: β + Σ δ·∂β/∂x, the derivatives taken once per width on the nominal laminate
 *    by central differences (step 1e-4 of the value) of the full line model.
 * Same generator and streams as the network yield (draws.ts), so a seed fixes every number.
 */
import { InputError, describe } from '../util/errors.ts';
import type { SubstrateSpec, ToleranceQuantity } from '../design/types.ts';
import type { LineOptions } from '../line/index.ts';
import { boardLines } from './board-lines.ts';
import { designPaths, phaseLength, type PathReport } from '../layout/paths.ts';
import type { SizedDesign, SizedPiece } from '../layout/types.ts';
import type { AbortLike } from '../network/sweep.ts';
import { ToleranceDraws } from './draws.ts';
import { applicableTolerances, widthGain } from './made-board.ts';
import { summary, wilson, histogram, type Histogram, type Proportion, type Summary } from './stats.ts';

export interface PathPhaseOptions {
  samples: number;
  seed: number;
  /** Line options (default: those the design was sized with, board-lines.ts). */
  line?: LineOptions;
  /** Paths to follow (default: the design's phase groups, as the ledger reports them). */
  reports?: PathReport[];
  onProgress?: (done: number, total: number) => void;
  signal?: AbortLike;
  yieldTo?: () => Promise<void>;
}

export interface PathPhaseResult {
  samples: number;
  seed: number;
  groups: {
    name: string;
    from: string;
    toleranceDeg: number;
    paths: { to: string; nominalDeg: number; stats: Summary }[];
    /** Largest |difference to the first path − wanted offset| per sample, degrees. */
    balance: { stats: Summary; histogram: Histogram; within: Proportion };
  }[];
  /** What per-piece tolerances were taken to first order. */
  firstOrder: ToleranceQuantity[];
}

const LAMINATE = new Set<ToleranceQuantity>(['er', 'h', 'tanDelta', 't']);
const wrap = (d: number) => d - 360 * Math.floor((d + 180) / 360);

interface Leg { width: number; length: number }

/** The copper legs of a piece on a path: (width, length) pairs as the ledger counts them. */
function legs(p: SizedPiece): Leg[] {
  if (p.kind === 'lumped' || p.kind === 'sparams') return [];
  const L = phaseLength(p);
  if (p.sections && p.sections.length) {
    const scale = L / p.sections.reduce((s, x) => s + x.length, 0);
    return p.sections.map((s) => ({ width: s.width, length: s.length * scale }));
  }
  return [{ width: p.width, length: L }];
}

export async function pathPhaseMonteCarlo(sized: SizedDesign, opts: PathPhaseOptions): Promise<PathPhaseResult> {
  if (!Number.isInteger(opts.samples) || opts.samples < 1 || opts.samples > 10_000_000) throw new InputError('out-of-range', 'samples', 'a whole number of boards from 1 to 10 000 000', describe(opts.samples));
  if (!Number.isInteger(opts.seed) || opts.seed < 0 || opts.seed > 0xffffffff) throw new InputError('out-of-range', 'seed', 'a whole number from 0 to 4294967295', describe(opts.seed));
  const reports = opts.reports ?? designPaths(sized, { sensitivities: false });
  const { tolerances } = applicableTolerances(sized);
  const fab = sized.doc['process'];
  const sub0 = sized.doc.substrate, f0 = sized.f0;
  const pieceIndex = new Map(sized.pieces.map((p, i) => [p.id, i]));
  const widths = [...new Set(sized.pieces.flatMap((p) => legs(p).map((l) => l.width)))];
  const wIndex = new Map(widths.map((w, i) => [w, i]));
  const K = widths.length;
  // The lines the design was sized with (as made: its cross-section tables), unless the caller gives others.
  const lines = boardLines(sized), line = opts.line ?? lines.sizedWith;
  const betaOf = (sub: SubstrateSpec, dw: number, out: Float64Array) => {
    const c = lines.columns(sub, widths.map((w) => w + dw), f0, line);
    for (let i = 0; i < K; i++) out[i] = (2 * Math.PI) / c.lambdaG[i]!;
  };
  // First-order derivatives of β per width for the per-piece tolerances.
  const perPiece = tolerances.map((t, k) => ({ t, k })).filter((x) => x.t.scope === 'piece');
  const deriv = perPiece.map(({ t }) => {
    const d = new Float64Array(K), up = new Float64Array(K), dn = new Float64Array(K);
    if (LAMINATE.has(t.quantity)) {
      const q = t.quantity as 'er' | 'h' | 'tanDelta' | 't';
      const h = 1e-4 * Math.max(Math.abs(sub0[q]), q === 'tanDelta' ? 1e-3 : q === 't' ? 1e-6 : 1e-9);
      betaOf({ ...sub0, [q]: sub0[q] + h }, 0, up); betaOf({ ...sub0, [q]: Math.max(0, sub0[q] - h) }, 0, dn);
      const lo = Math.max(0, sub0[q] - h);
      for (let i = 0; i < K; i++) d[i] = (up[i]! - dn[i]!) / (sub0[q] + h - lo);
    } else {
      const g = widthGain(t.quantity, fab) ?? 0;
      for (let i = 0; i < K; i++) {
        const w = widths[i]!, h = 1e-4 * w;
        const c = lines.columns(sub0, [w + h, w - h], f0, line);
        d[i] = (g * ((2 * Math.PI) / c.lambdaG[0]! - (2 * Math.PI) / c.lambdaG[1]!)) / (2 * h);
      }
    }
    return d;
  });
  // Each route flattened once into legs: width index, length and piece index.
  const routes = reports.map((r) => r.paths.map((e) => {
    const flat = e.pieces.flatMap((id) => { const i = pieceIndex.get(id)!; return legs(sized.pieces[i]!).map((l) => ({ ...l, piece: i })); });
    return { w: Int32Array.from(flat, (l) => wIndex.get(l.width)!), len: Float64Array.from(flat, (l) => l.length), piece: Int32Array.from(flat, (l) => l.piece) };
  }));
  const N = opts.samples;
  const phase = reports.map((r) => r.paths.map(() => new Float64Array(N)));
  const balance = reports.map(() => new Float64Array(N));
  const draws = new ToleranceDraws(tolerances, sized.pieces.length, opts.seed);
  const beta = new Float64Array(K);
  const pause = opts.yieldTo ?? (() => Promise.resolve());
  for (let n = 0; n < N; n++) {
    draws.next();
    const sub: SubstrateSpec = { ...sub0 };
    let dw = 0;
    tolerances.forEach((t, k) => {
      if (t.scope !== 'board') return;
      const d = draws.at(k, 0);
      if (LAMINATE.has(t.quantity)) { const q = t.quantity as 'er' | 'h' | 'tanDelta' | 't'; sub[q] = Math.max(q === 'tanDelta' || q === 't' ? 0 : -Infinity, sub[q] + d); }
      else dw += (widthGain(t.quantity, fab) ?? 0) * d;
    });
    if (!(sub.er > 1) || !(sub.h > 0)) throw new InputError('out-of-range', 'tolerances', 'tolerances whose draws keep εr above 1 and h above 0', `a draw giving εr ${sub.er}, h ${sub.h} m`);
    if (dw === 0 && sub.er === sub0.er && sub.h === sub0.h && sub.t === sub0.t && sub.tanDelta === sub0.tanDelta) betaOf(sub0, 0, beta);
    else betaOf(sub, dw, beta);
    reports.forEach((r, g) => {
      const ph = phase[g]!;
      routes[g]!.forEach((route, e) => {
        let deg = 0;
        for (let l = 0; l < route.w.length; l++) {
          const wi = route.w[l]!;
          let b = beta[wi]!;
          for (let x = 0; x < perPiece.length; x++) b += draws.at(perPiece[x]!.k, route.piece[l]!) * deriv[x]![wi]!;
          deg += (b * route.len[l]! * 180) / Math.PI;
        }
        ph[e]![n] = deg;
      });
      const ref = ph[0]?.[n] ?? 0, refOff = r.paths[0]?.targetDeg ?? 0;
      let worst = 0;
      r.paths.forEach((e, k) => { if (k > 0) worst = Math.max(worst, Math.abs(wrap(ph[k]![n]! - ref - (e.targetDeg - refOff)))); });
      balance[g]![n] = worst;
    });
    if ((n + 1) % 1024 === 0 || n + 1 === N) {
      opts.onProgress?.(n + 1, N);
      if (opts.signal?.aborted) { const e = new Error('the phase estimate was cancelled'); e.name = 'AbortError'; throw e; }
      if (n + 1 < N) await pause();
    }
  }
  return {
    samples: N, seed: opts.seed,
    groups: reports.map((r, g) => {
      const b = balance[g]!;
      let within = 0;
      for (let n = 0; n < N; n++) if (b[n]! <= r.toleranceDeg) within++;
      return {
        name: r.name, from: r.from, toleranceDeg: r.toleranceDeg,
        paths: r.paths.map((e, k) => ({ to: e.to, nominalDeg: e.degAtF0, stats: summary(phase[g]![k]!) })),
        balance: { stats: summary(b), histogram: histogram(b, [r.toleranceDeg]), within: wilson(within, N) },
      };
    }),
    firstOrder: perPiece.map((x) => x.t.quantity),
  };
}
