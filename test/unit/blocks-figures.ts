/**
 * The blocks issue's done figures for the single-path kinds, judged on one made design (shared by
 * test/unit/blocks-board-matrix.test.ts and scripts/blocks-matrix.ts, which prints the whole matrix). Ideal values,
 * each from its textbook:
 * - transformer, taper, launch: all the power through at f0, matched (Pozar, Microwave Engineering, 4th ed., 2012,
 *   §5.5–5.8); stub match: matched at f0 (Pozar §5.2);
 * - low-pass: the ripple edge (equal ripple) at the cut-off, within 10 % for the stepped-impedance form and 5 % for
 *   the open-stub form (Matthaei, Young and Jones 1964, §4.03–4.05; the tolerances);
 * - band-stop: the edges at f0·(1 ∓ Δ/2) within 5 %, at −3.01 dB (maximally flat) or the ripple (equal ripple)
 *   (Pozar §8.5).
 * Figures: lossless copy at f0 within 0.1 dB of the ideal transmission, match below −25 dB; with losses, the
 * transmission within 0.1 dB of the ideal less the loss the line model gives for the path (core/layout/paths.ts).
 * A kind that refuses the case must say why with the field, and name a nearer spec (its hint).
 */
import {
  InputError, makeBlockDesign, netlistFromSized, sizeDesign, solveNetwork, tracePaths, PROCESS_DEFAULT,
  type DesignDoc, type FabProcess, type NetworkResponse, type SubstrateSpec,
} from '../../core/index.ts';

export interface Board { name: string; substrate: Partial<SubstrateSpec> }
export interface Process { name: string; process: FabProcess }
export interface Case { name: string; kind: string; raw: Record<string, unknown> }

/** Boards a user would try: glass-epoxy 1.6 and 0.8 mm (εr 4.4, common practice), a 0.508 mm εr 3.55 low-loss laminate (tanδ 0.0027, a typical value for the family, from memory). */
export const BOARDS: Board[] = [
  { name: 'FR-4 1.6 mm', substrate: {} },
  { name: 'FR-4 0.8 mm', substrate: { h: 0.8e-3, preset: 'glass-epoxy-0.8' } },
  { name: 'εr 3.55 0.508 mm', substrate: { er: 3.55, h: 0.508e-3, tanDelta: 0.0027, roughness: 1.0e-6, preset: undefined } },
];
export const FREQS = [1e9, 2.45e9, 5.8e9];
/** The new-design milling process (sized as made) and the app's etched process (0.2 mm smallest feature, plain microstrip). */
export const PROCESSES: Process[] = [
  { name: 'milled', process: PROCESS_DEFAULT },
  { name: 'etched', process: { kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 } },
];
export const CASES: Case[] = [
  { name: 'transformer maxflat', kind: 'transformer', raw: {} },
  { name: 'transformer chebyshev', kind: 'transformer', raw: { response: 'chebyshev' } },
  { name: 'transformer 50→20 Ω', kind: 'transformer', raw: { z2: '20' } },
  { name: 'taper', kind: 'taper', raw: {} },
  { name: 'taper 50→25 Ω', kind: 'taper', raw: { z2: '25' } },
  { name: 'stub-match single open', kind: 'stub-match', raw: { load: '30-20j' } },
  { name: 'stub-match single short', kind: 'stub-match', raw: { load: '30-20j', end: 'short' } },
  { name: 'stub-match double open', kind: 'stub-match', raw: { load: '30-20j', stubs: 'double' } },
  { name: 'stub-match single open, 2nd', kind: 'stub-match', raw: { load: '30-20j', solution: '2' } },
  { name: 'stub-match single, 100+50j', kind: 'stub-match', raw: { load: '100+50j' } },
  { name: 'stub-match double short', kind: 'stub-match', raw: { load: '30-20j', stubs: 'double', end: 'short' } },
  { name: 'lowpass stepped', kind: 'lowpass', raw: {} },
  { name: 'lowpass stepped maxflat', kind: 'lowpass', raw: { response: 'maxflat' } },
  { name: 'lowpass stubs', kind: 'lowpass', raw: { form: 'stubs' } },
  { name: 'bandstop maxflat', kind: 'bandstop', raw: {} },
  { name: 'bandstop chebyshev', kind: 'bandstop', raw: { response: 'chebyshev' } },
  { name: 'launch', kind: 'launch', raw: {} },
  { name: 'launch narrow pad', kind: 'launch', raw: { padWidth: '1.5 mm', padLength: '1.5 mm' } },
  { name: 'launch pad, 3 mm taper', kind: 'launch', raw: { padWidth: '1.5 mm', taperLength: '3 mm' } },
];

export interface Verdict {
  /** 'meets', 'refused' (with the reason and the nearest spec named), or 'fails' (a figure missed, or a bad refusal). */
  status: 'meets' | 'refused' | 'fails';
  /** Figures seen, or the refusal, in a line. */
  text: string;
  /** What was missed (empty unless status is 'fails'). */
  misses: string[];
}

function sweep(doc: DesignDoc, freqs: number[], lossless: boolean): NetworkResponse {
  return solveNetwork(netlistFromSized(sizeDesign(doc), { lossless }), freqs);
}
function at(r: NetworkResponse, k: number, to: string, from: string): { db: number; deg: number } {
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === `b1.${to}`), j = r.ports.findIndex((p) => p.name === `b1.${from}`);
  if (i < 0 || j < 0) throw new Error(`no port ${to} or ${from}`);
  const t = 2 * ((k * P + i) * P + j);
  return { db: 20 * Math.log10(Math.max(1e-15, Math.hypot(r.s[t]!, r.s[t + 1]!))), deg: (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI };
}

/** The case's equal ripple, dB (the blocks' default 0.5 dB when not given). */
const rippleOf = (c: Case): number => (c.raw.rippleDb === undefined ? 0.5 : parseFloat(String(c.raw.rippleDb)));

/** The frequency (Hz) where the loss first rises through `level` dB walking up from `lo`, or NaN. */
function riseEdge(doc: DesignDoc, level: number, lo: number, hi: number): number {
  const fs = Array.from({ length: 241 }, (_, k) => lo + ((hi - lo) * k) / 240);
  const r = sweep(doc, fs, true);
  const il = fs.map((_, k) => -at(r, k, 'load', 'src').db);
  const k = il.findIndex((x) => x > level);
  if (k <= 0) return NaN;
  return fs[k - 1]! + ((level - il[k - 1]!) / (il[k]! - il[k - 1]!)) * (fs[k]! - fs[k - 1]!);
}

/** The band-stop's edges at `level` dB, walking out from f0 (Hz), or NaN. */
function stopEdges(doc: DesignDoc, f0: number, level: number): [number, number] {
  const fs = Array.from({ length: 281 }, (_, k) => f0 * (0.3 + (1.4 * k) / 280));
  const r = sweep(doc, fs, true);
  const il = fs.map((_, k) => -at(r, k, 'load', 'src').db);
  const c = fs.findIndex((f) => f >= f0);
  let lo = c, hi = c;
  while (lo > 0 && il[lo]! > level) lo--;
  while (hi < fs.length - 1 && il[hi]! > level) hi++;
  return [il[lo]! > level ? NaN : fs[lo]!, il[hi]! > level ? NaN : fs[hi]!];
}

/**
 * The spec a refusal names as the nearest it makes, read from its hint (the words of kinds/filters.ts and
 * kinds/launch.ts), as raw options on top of the case's own; null when it names none in numbers.
 */
export function nearestSpec(c: Case, hint: string): Record<string, unknown> | null {
  const first = /nearest[^:]*: ([^;]*)/.exec(hint)?.[1] ?? '';
  let m: RegExpExecArray | null;
  if (c.kind === 'launch' && /^no taper length/.test(first)) { const { taperLength: _t, ...rest } = c.raw; return rest; }
  if (c.kind === 'launch' && /^no pad width/.test(first)) { const { padWidth: _w, ...rest } = c.raw; return rest; }
  if (c.kind === 'launch' && (m = /a pad at most ([\d.]+) mm long at ([\d.]+) mm wide/.exec(first))) return { ...c.raw, padLength: `${m[1]} mm`, padWidth: `${m[2]} mm` };
  if (c.kind === 'launch' && (m = /a pad (?:at most|at least) ([\d.]+) mm wide at ([\d.]+) mm long/.exec(first))) return { ...c.raw, padWidth: `${m[1]} mm`, padLength: `${m[2]} mm` };
  if ((m = /^([\d.]+) dB (?:equal )?ripple at order (\d+)(?: and ([\d.]+) %)?/.exec(first))) return { ...c.raw, response: 'chebyshev', rippleDb: `${m[1]} dB`, order: m[2], ...(m[3] ? { bw: String(Number(m[3]) / 100) } : {}) };
  if ((m = /^a ([\d.]+) % stop band at order (\d+)/.exec(first))) return { ...c.raw, bw: String(Number(m[1]) / 100), order: m[2] };
  if ((m = /^order (\d+)/.exec(first))) return { ...c.raw, order: m[1] };
  return null;
}

/** The figures of one case on one board, frequency and process. */
export function judge(c: Case, board: Board, f0: number, proc: Process): Verdict {
  let doc: DesignDoc;
  try {
    doc = makeBlockDesign(c.kind, c.raw, { f0, substrate: board.substrate as SubstrateSpec, process: proc.process });
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    const text = `refused: ${e.field}: ${e.got} (${e.hint ?? 'no fix named'})`;
    // A refusal must name the field and a way to a spec it makes.
    const misses = e.field && e.hint && /nearest|at most|at least|ask for|use a|choose|give|raise|lower|leave|empty|smaller|larger|wider|narrower|thinner|thicker/i.test(e.hint) ? [] : ['a refusal without a field or a nearer spec'];
    // A nearest spec named in numbers must be made, and meet the figures.
    const near = nearestSpec(c, e.hint ?? '');
    if (near && !misses.length) {
      const v = judge({ name: `${c.name} (named)`, kind: c.kind, raw: near }, board, f0, proc);
      if (v.status !== 'meets') misses.push(`the nearest spec it names (${JSON.stringify(near)}) ${v.status}: ${v.misses.join('; ') || v.text}`);
    }
    return { status: misses.length ? 'fails' : 'refused', text, misses };
  }
  const misses: string[] = [];
  const seen: string[] = [];
  const sized = sizeDesign(doc);
  if (sized.problems.length) return { status: 'fails', text: `sizing problems: ${sized.problems.map((p) => p.message).join('; ')}`, misses: ['sizing'] };
  const twoPort = (from: string, to: string, matchAlsoAt?: string) => {
    const r = sweep(doc, [f0], true);
    const s21 = at(r, 0, to, from).db, s11 = at(r, 0, from, from).db;
    seen.push(`S21 ${s21.toFixed(3)} dB, S11 ${s11.toFixed(1)} dB`);
    if (Math.abs(s21) >= 0.1) misses.push(`lossless |S21| ${s21.toFixed(3)} dB (ideal 0)`);
    if (!(s11 < -25)) misses.push(`match ${s11.toFixed(1)} dB`);
    if (matchAlsoAt) { const s22 = at(r, 0, to, to).db; seen.push(`S22 ${s22.toFixed(1)} dB`); if (!(s22 < -25)) misses.push(`output match ${s22.toFixed(1)} dB`); }
    // With losses: the ideal less the line model's loss along the path.
    const lossy = at(sweep(doc, [f0], false), 0, to, from).db;
    const pathLoss = tracePaths(sized, `b1.${from}`, [`b1.${to}`], { sensitivities: false }).paths[0]?.lossDb ?? NaN;
    seen.push(`lossy S21 ${lossy.toFixed(3)} dB vs −${pathLoss.toFixed(3)} dB of line loss`);
    if (!(Math.abs(lossy + pathLoss) < 0.1)) misses.push(`lossy |S21| ${lossy.toFixed(3)} dB, path loss ${pathLoss.toFixed(3)} dB`);
  };
  switch (c.kind) {
    case 'transformer': twoPort('src', 'load', 'load'); break;
    case 'taper': twoPort('src', 'load'); break;
    case 'launch': twoPort('conn', 'line'); break;
    case 'stub-match': {
      const s11 = at(sweep(doc, [f0], true), 0, 'src', 'src').db;
      seen.push(`S11 ${s11.toFixed(1)} dB`);
      if (!(s11 < -25)) misses.push(`match ${s11.toFixed(1)} dB`);
      break;
    }
    case 'lowpass': {
      // Defaults: 0.5 dB equal ripple, cut-off at f0; the edge is the ripple + 0.05 dB (the sweep's resolution).
      const e = riseEdge(doc, c.raw.response === 'maxflat' ? 3.0103 : rippleOf(c) + 0.05, 0.2 * f0, 1.4 * f0) / f0;
      const tol = c.raw.form === 'stubs' ? 0.05 : 0.1;
      seen.push(`ripple edge ${e.toFixed(3)}·fc`);
      if (!(Math.abs(e - 1) < tol)) misses.push(`ripple edge ${e.toFixed(3)}·fc (within ${tol * 100} %)`);
      break;
    }
    case 'bandstop': {
      // Default: maximally flat, 50 %: −3.01 dB edges at 0.75·f0 and 1.25·f0; equal ripple: at the ripple.
      const bw = c.raw.bw === undefined ? 0.5 : Number(c.raw.bw);
      const [lo, hi] = stopEdges(doc, f0, c.raw.response === 'chebyshev' ? rippleOf(c) + 0.05 : 3.0103);
      seen.push(`edges ${(lo / f0).toFixed(3)}·f0 and ${(hi / f0).toFixed(3)}·f0`);
      if (!(Math.abs(lo / ((1 - bw / 2) * f0) - 1) < 0.05 && Math.abs(hi / ((1 + bw / 2) * f0) - 1) < 0.05)) misses.push(`edges ${(lo / f0).toFixed(3)} and ${(hi / f0).toFixed(3)}·f0 (want ${1 - bw / 2}, ${1 + bw / 2} within 5 %)`);
      break;
    }
    default: throw new Error(`no figures for ${c.kind}`);
  }
  return { status: misses.length ? 'fails' : 'meets', text: seen.join('; '), misses };
}
