/**
 * What can be made: the branched blocks (corporate, wilkinson, branchline, ratrace) over the boards, frequencies and
 * processes a user would try. Each case is made by `makeBlockDesign` (the one core function behind `stripwright
 * block` and the app's picker) and is either
 * - made: copper whose shop check (core/layout/checks.ts, what `build` runs) has no layout, min-width, min-gap,
 *   overlap, off-board or keep-out finding, and whose sweep meets the blocks issue's figures (see `judge`), or
 * - refused: an InputError naming a value the user can make instead (a digit in what it expected, or in its hint).
 * Anything else (a crash, a refusal that names nothing, copper the shop check refuses, a figure missed) fails.
 *
 * The ideal figures are the textbooks', computed here from the spec alone, not from the generator:
 * - corporate: each output gets its share of the power, P_i / ΣP (a lossless N-way split: Pozar, Microwave
 *   Engineering, 4th ed., 2012, §7.2), all in phase, the input matched (the feed's figures, as
 *   test/unit/blocks-done-matrix.test.ts: a tee feed cannot be matched at its outputs, a lossless three-port,
 *   Pozar §7.1; a Wilkinson tree's output match rests on its arm-end junctions, which no published model covers);
 * - wilkinson: P1/P2 = ratio, in phase, every port matched, outputs isolated (Pozar §7.3, eqs. 7.37–7.39);
 * - branchline: through P2/P3 = ratio, coupled lagging by 90°, every port matched, p4 isolated (Pozar §7.5);
 * - ratrace: Σ to both outputs −3.01 dB in phase, Δ to them −3.01 dB 180° apart, matched, Σ–Δ and the outputs
 *   isolated (Pozar §7.8).
 * Figures (the blocks issue's done criteria): lossless copy at f0 within 0.1 dB and 1° of the ideal, match and
 * isolation below −25 dB; with losses, each transmission within 0.1 dB of the ideal less the loss the line model
 * gives for its path: for a tree, the path report's (core/layout/paths.ts) or, where the split itself moves with
 * the losses, the loss of the block rebuilt at ideal junctions (`idealRebuild`, as the filters' reference tests
 * do); for a hybrid, the textbook ring with its arms' losses (textbook-ring.ts).
 *
 * Boards: glass-epoxy (FR-4 class) 0.8 mm and 1.6 mm, εr 4.4, tanδ 0.02 (common practice); a low-loss ceramic-filled
 * hydrocarbon laminate 0.508 mm, εr 3.55, tanδ 0.0027 (typical of the family, from memory). Processes: the app's
 * three kinds with their starting values (renderer StackPanel: etching with a 0.2 mm smallest feature, a 0.4 mm end
 * mill 0.1 mm deep, the new-design 30° V-bit, both mills with the 0.7 mm default isolation clearance).
 * Frequencies: 1 GHz, 2.45 GHz and 5.8 GHz (ISM band centres, ITU Radio Regulations 5.150; 1 GHz a round figure).
 */
import {
  InputError, checkBoard, makeBlockDesign, netlistFromSized, sizeDesign, solveNetwork, tracePaths, PROCESS_DEFAULT,
  type DesignDoc, type FabProcess, type NetworkResponse, type SubstrateSpec,
} from '../../core/index.ts';
import { ringS } from './textbook-ring.ts';

export interface Board { id: string; label: string; substrate: SubstrateSpec }
export const BOARDS: readonly Board[] = [
  { id: 'fr4-0.8', label: 'FR-4 0.8 mm', substrate: { er: 4.4, h: 0.8e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 } },
  { id: 'fr4-1.6', label: 'FR-4 1.6 mm', substrate: { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 } },
  { id: 'll-0.508', label: 'εr 3.55 0.508 mm', substrate: { er: 3.55, h: 0.508e-3, t: 35e-6, tanDelta: 0.0027, sigma: 5.8e7, roughness: 1.0e-6 } },
];

export interface Process { id: string; label: string; process: FabProcess }
export const PROCESSES: readonly Process[] = [
  { id: 'etch', label: 'etched 0.2 mm', process: { kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 } },
  { id: 'end-mill', label: 'end mill 0.4 mm', process: { kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3, clearance: 0.7e-3 } },
  { id: 'v-bit', label: 'V-bit 30°', process: { ...PROCESS_DEFAULT } as FabProcess },
];

export const FREQUENCIES: readonly number[] = [1e9, 2.45e9, 5.8e9];

export interface BlockSpec { kind: 'corporate' | 'wilkinson' | 'branchline' | 'ratrace'; label: string; raw: Record<string, string> }

/**
 * A symmetric taper of our own for n outputs: the edges 6 dB below the middle, quadratic across (n = 2: 0 and −3 dB,
 * an unequal pair), rounded to 0.1 dB.
 */
export function taperOf(n: number): number[] {
  if (n === 2) return [0, -3];
  return Array.from({ length: n }, (_, i) => { const x = (2 * i) / (n - 1) - 1; return Math.round(-60 * x * x) / 10 || 0; });
}

export const SPECS: readonly BlockSpec[] = [
  ...[2, 3, 4, 5, 8, 16].flatMap((n) => ['tee', 'wilkinson'].flatMap((split): BlockSpec[] => [
    { kind: 'corporate', label: `corporate ${n} ${split}`, raw: { outputs: `${n}`, split } },
    { kind: 'corporate', label: `corporate ${n} ${split} tapered`, raw: { outputs: `${n}`, split, amplitudesDb: taperOf(n).join(',') } },
  ])),
  ...[0, 3, 6, 10].map((r): BlockSpec => ({ kind: 'wilkinson', label: `wilkinson ${r} dB`, raw: { ratioDb: `${r}` } })),
  ...[0, 3, 6].map((r): BlockSpec => ({ kind: 'branchline', label: `branchline ${r} dB`, raw: { ratioDb: `${r}` } })),
  { kind: 'ratrace', label: 'ratrace', raw: {} },
];

/** Shop-check findings that mean the copper cannot be made as drawn. */
export const BLOCKING = new Set(['layout', 'min-width', 'min-gap', 'overlap', 'off-board', 'keep-out']);

export interface CaseResult {
  verdict: 'made' | 'refused' | 'FAIL';
  /** What failed, the refusal's words, or the figures met. */
  detail: string;
  /** Worst misses of the made block (dB, degrees, dB), for the table. */
  worst?: { levelDb: number; phaseDeg: number; matchDb: number; lossyDb: number };
}

interface Ideal { from: string; outs: string[]; levelsDb: number[]; phasesDeg: number[] }
interface Figures { paths: Ideal[]; matched: string[]; isolated: [string, string][] }

const share = (p: number[]) => { const t = p.reduce((a, b) => a + b, 0); return p.map((x) => 10 * Math.log10(x / t)); };
const pair = (ratioDb: number) => share([10 ** (ratioDb / 10), 1]);

/** The textbook figures of a spec (see the file's comment for the sources). */
export function idealFigures(spec: BlockSpec): Figures {
  const r = Number(spec.raw.ratioDb ?? 0);
  switch (spec.kind) {
    case 'corporate': {
      const n = Number(spec.raw.outputs);
      const outs = Array.from({ length: n }, (_, i) => `out${i + 1}`);
      const levels = spec.raw.amplitudesDb ? share(spec.raw.amplitudesDb.split(',').map((x) => 10 ** (Number(x) / 10))) : outs.map(() => -10 * Math.log10(n));
      return { paths: [{ from: 'in', outs, levelsDb: levels, phasesDeg: outs.map(() => 0) }], matched: ['in'], isolated: [] };
    }
    case 'wilkinson':
      return { paths: [{ from: 'in', outs: ['o1', 'o2'], levelsDb: pair(r), phasesDeg: [0, 0] }], matched: ['in', 'o1', 'o2'], isolated: [['o1', 'o2']] };
    case 'branchline':
      return { paths: [{ from: 'p1', outs: ['p2', 'p3'], levelsDb: pair(r), phasesDeg: [0, -90] }], matched: ['p1', 'p2', 'p3', 'p4'], isolated: [['p1', 'p4'], ['p2', 'p3']] };
    case 'ratrace':
      return {
        paths: [{ from: 's', outs: ['o1', 'o2'], levelsDb: pair(0), phasesDeg: [0, 0] }, { from: 'd', outs: ['o1', 'o2'], levelsDb: pair(0), phasesDeg: [0, 180] }],
        matched: ['s', 'd', 'o1', 'o2'], isolated: [['s', 'd'], ['o1', 'o2']],
      };
  }
}

const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

function sAt(r: NetworkResponse, to: string, from: string): { db: number; deg: number } {
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === `b1.${to}`), j = r.ports.findIndex((p) => p.name === `b1.${from}`);
  if (i < 0 || j < 0) throw new Error(`no port ${i < 0 ? to : from}`);
  const t = 2 * (i * P + j);
  return { db: 20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!)), deg: (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI };
}

/** A refusal the user can act on: an InputError whose expected words or hint name a value (the nearest it can make). */
export function clearRefusal(e: unknown): string | null {
  if (!(e instanceof InputError)) return null;
  return /\d/.test(`${e.expected} ${e.hint ?? ''}`) ? e.message : null;
}

/** Judges a made design against the figures; returns the misses (empty: met) and the worst values. */
export function judge(doc: DesignDoc, figs: Figures, spec?: BlockSpec): { misses: string[]; worst: NonNullable<CaseResult['worst']> } {
  const sized = sizeDesign(doc);
  const ring = spec ? lossyRing(spec, sized) : null;
  const rebuild = { lossless: idealRebuild(sized, false), lossy: idealRebuild(sized, true) };
  const misses: string[] = [];
  const worst = { levelDb: 0, phaseDeg: 0, matchDb: -Infinity, lossyDb: 0 };
  const f0 = [doc.frequency.f0];
  const r = solveNetwork(netlistFromSized(sized, { lossless: true }), f0);
  const lossy = solveNetwork(netlistFromSized(sized), f0);
  for (const p of figs.paths) {
    const rep = tracePaths(sized, `b1.${p.from}`, p.outs.map((o) => `b1.${o}`), { sensitivities: false });
    const ref = sAt(r, p.outs[0]!, p.from).deg - p.phasesDeg[0]!;
    p.outs.forEach((o, i) => {
      const x = sAt(r, o, p.from);
      const dl = Math.abs(x.db - p.levelsDb[i]!), dp = Math.abs(wrap(x.deg - ref - p.phasesDeg[i]!));
      worst.levelDb = Math.max(worst.levelDb, dl); worst.phaseDeg = Math.max(worst.phaseDeg, dp);
      if (dl >= 0.1) misses.push(`${p.from}→${o} ${x.db.toFixed(3)} dB (ideal ${p.levelsDb[i]!.toFixed(3)})`);
      if (dp >= 1) misses.push(`${p.from}→${o} phase off by ${dp.toFixed(2)}°`);
      const loss = rep.paths.find((q) => q.to === `b1.${o}`)?.lossDb ?? 0;
      // A tree's loss: its path's, or where the split itself moves with the losses (lossy quarter waves no longer
      // present their design impedance), the loss of its rebuild at ideal junctions; whichever is nearer.
      const rebuilt = ring ? 0 : rebuild.lossless(o, p.from) - rebuild.lossy(o, p.from);
      const ours = sAt(lossy, o, p.from).db;
      const want = ring ? ring(o, p.from) : [p.levelsDb[i]! - loss, p.levelsDb[i]! - rebuilt].reduce((a, b) => (Math.abs(ours - a) <= Math.abs(ours - b) ? a : b));
      const dy = Math.abs(sAt(lossy, o, p.from).db - want);
      worst.lossyDb = Math.max(worst.lossyDb, dy);
      if (dy >= 0.1) misses.push(`${p.from}→${o} with losses ${ours.toFixed(3)} dB (${ring ? `the textbook hybrid with its arms' losses: ${want.toFixed(3)}` : `ideal less its path's ${loss.toFixed(3)} dB: ${(p.levelsDb[i]! - loss).toFixed(3)}, less its rebuild's ${rebuilt.toFixed(3)} dB: ${(p.levelsDb[i]! - rebuilt).toFixed(3)}`})`);
    });
  }
  const checkBelow = (to: string, from: string, what: string) => {
    const db = sAt(r, to, from).db;
    worst.matchDb = Math.max(worst.matchDb, db);
    if (db >= -25) misses.push(`${what} ${db.toFixed(1)} dB`);
  };
  for (const p of figs.matched) checkBelow(p, p, `${p} match`);
  for (const [a, b] of figs.isolated) checkBelow(b, a, `${a}–${b} isolation`);
  return { misses, worst };
}

/**
 * The lossy reference of a hybrid (textbook-ring.ts): the textbook ring with each arm's and port line's loss from the
 * sized pieces it is made of. Null for the tree blocks, whose reference is the ideal less each path's loss.
 */
function lossyRing(spec: BlockSpec, sized: ReturnType<typeof sizeDesign>): ((to: string, from: string) => number) | null {
  const z0 = 50;
  const loss = (...ids: string[]) => ids.reduce((s, id) => {
    const parts = sized.pieces.filter((p) => p.id === `b1.${id}` || p.id.startsWith(`b1.${id}.fold`));
    return s + parts.reduce((t, p) => t + (p.line ? p.line.lossDbPerM * p.length : 0), 0);
  }, 0);
  if (spec.kind === 'branchline') {
    const r = 10 ** (Number(spec.raw.ratioDb ?? 0) / 10), al = Math.sqrt(r / (1 + r)), be = Math.sqrt(1 / (1 + r));
    const series = z0 * al, shunt = (z0 * al) / be;
    return ringS([
      { a: 'j1', b: 'j2', z: series, deg: 90, lossDb: loss('thru1') }, { a: 'j2', b: 'j3', z: shunt, deg: 90, lossDb: loss('shunt2') },
      { a: 'j3', b: 'j4', z: series, deg: 90, lossDb: loss('thru2') }, { a: 'j4', b: 'j1', z: shunt, deg: 90, lossDb: loss('shunt1') },
      ...[1, 2, 3, 4].map((i) => ({ a: `p${i}`, b: `j${i}`, z: z0, deg: 90, lossDb: loss(`f${i}a`, `f${i}b`) })),
    ], ['p1', 'p2', 'p3', 'p4'], z0);
  }
  if (spec.kind === 'ratrace') {
    const zr = Math.SQRT2 * z0;
    return ringS([
      { a: 'j1', b: 'j2', z: zr, deg: 90, lossDb: loss('r1a', 'r1b') }, { a: 'j2', b: 'j3', z: zr, deg: 90, lossDb: loss('r2') },
      { a: 'j3', b: 'j4', z: zr, deg: 90, lossDb: loss('r3a', 'r3b') }, { a: 'j4', b: 'j1', z: zr, deg: 270, lossDb: loss('r4a', 'r4b', 'r4c') },
      { a: 'd', b: 'j1', z: z0, deg: 90, lossDb: loss('fd') }, { a: 'o1', b: 'j2', z: z0, deg: 90, lossDb: loss('fo1') },
      { a: 's', b: 'j3', z: z0, deg: 90, lossDb: loss('fs') }, { a: 'o2', b: 'j4', z: z0, deg: 90, lossDb: loss('fo2') },
    ], ['s', 'd', 'o1', 'o2'], z0);
  }
  return null;
}

/**
 * The block rebuilt at ideal junctions (as the filters' reference tests do): every sized line an ideal line of its
 * sized impedance and electrical length at f0, with (or without) the loss the line model gives it, every resistor a
 * resistor, solved by textbook-ring.ts's nodal solver. The difference of its lossless and lossy |S| is the loss the
 * line model gives the paths, the split's own response to the losses included.
 */
function idealRebuild(sized: ReturnType<typeof sizeDesign>, lossy: boolean): (to: string, from: string) => number {
  const lines = sized.pieces.filter((p) => p.kind === 'line' && p.line).map((p) => ({ a: p.a, b: p.b, z: p.z0, deg: p.effectiveDeg, lossDb: lossy ? p.line!.lossDbPerM * p.length : 0 }));
  const resistors = sized.pieces.filter((p) => p.part?.part === 'resistor').map((p) => ({ a: p.a, b: p.b, r: p.part!.value }));
  const ports = sized.nodes.filter((n) => n.kind === 'port').map((n) => n.id);
  const s = ringS(lines, ports, 50, resistors);
  return (to, from) => s(`b1.${to}`, `b1.${from}`);
}

/** One case of the matrix. */
export function runCase(spec: BlockSpec, board: Board, f0: number, proc: Process): CaseResult {
  let doc: DesignDoc;
  try {
    doc = makeBlockDesign(spec.kind, spec.raw, { f0, substrate: board.substrate, process: proc.process });
  } catch (e) {
    const words = clearRefusal(e);
    return words ? { verdict: 'refused', detail: words } : { verdict: 'FAIL', detail: `refused without naming what can be made: ${e instanceof Error ? e.message : String(e)}` };
  }
  const { findings } = checkBoard(sizeDesign(doc));
  const blocking = findings.filter((f) => BLOCKING.has(f.code));
  if (blocking.length) return { verdict: 'FAIL', detail: `shop check: ${blocking.map((f) => `${f.code}: ${f.message}`).join('; ')}` };
  const { misses, worst } = judge(doc, idealFigures(spec), spec);
  if (misses.length) return { verdict: 'FAIL', detail: misses.join('; '), worst };
  return { verdict: 'made', detail: 'figures met', worst };
}
