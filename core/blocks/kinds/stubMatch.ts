/**
 * Block `stub-match`: single- or double-stub shunt matching of a load (complex Z, or a one-port Touchstone file read
 * at f0) to the system impedance, with open or shorted stubs; every solution is listed and one is built.
 *
 * Design equations: D. M. Pozar, Microwave Engineering, 4th ed., 2012:
 * - single shunt stub, §5.2 (eqs. 5.9–5.12): t = tan βd from ZL = RL + jXL,
 *   t = [XL ± √(RL·((Z0 − RL)² + XL²)/Z0)]/(RL − Z0) (t = −XL/(2Z0) when RL = Z0); the line's susceptance there
 *   B = [RL²·t − (Z0 − XL·t)(XL + Z0·t)] / (Z0·[RL² + (XL + Z0·t)²]), which the stub cancels;
 * - double shunt stub, §5.3 (eqs. 5.17–5.20): with the load admittance moved to the first stub, GL + jBL, and
 *   t = tan βd of the stub spacing, B1 = −BL + [Y0 ± √((1 + t²)·GL·Y0 − GL²t²)]/t,
 *   B2 = [±Y0·√(Y0·GL·(1 + t²) − GL²t²) + GL·Y0]/(GL·t), solvable for 0 ≤ GL ≤ Y0·(1 + t²)/t².
 * A stub of susceptance B: open, tan βℓ = B/Y0; shorted, tan βℓ = −Y0/B (its shortest positive length).
 */
import type { DesignSegment } from '../../design/types.ts';
import { readTouchstone } from '../../network/touchstoneRead.ts';
import { InputError } from '../../util/errors.ts';
import { FEED_PARAM, Sketch, Z0_PARAM, lambdaG, widthFor, ghz, type BlockContext, type BlockDef, type Spec } from '../context.ts';
import { FOOTPRINT_PARAM } from '../fold.ts';

export interface Complex2 { re: number; im: number }
export interface StubSolution {
  /** Electrical lengths at f0, degrees: for a single stub, `d` (stub to load) and `stub`; for a double stub, `stub1` (at the load side) and `stub2`. */
  d?: number; stub?: number; stub1?: number; stub2?: number;
}

const toDeg = (rad: number) => (rad * 180) / Math.PI;
/** Shortest positive electrical length (deg, in (0°, 180°]) of a stub of susceptance B. */
export function stubDegrees(b: number, y0: number, end: 'open' | 'short'): number {
  const th = end === 'open' ? Math.atan2(b, y0) : Math.atan2(-y0, b);
  const d = toDeg(th);
  return d <= 1e-9 ? d + 180 : d;
}

/** Single shunt stub: both solutions (or one), Pozar §5.2. */
export function singleStubSolutions(zl: Complex2, z0: number, end: 'open' | 'short'): StubSolution[] {
  const { re: rl, im: xl } = zl;
  const ts: number[] = [];
  if (Math.abs(rl - z0) < 1e-12 * z0) ts.push(-xl / (2 * z0));
  else {
    const root = Math.sqrt((rl * ((z0 - rl) ** 2 + xl * xl)) / z0);
    ts.push((xl + root) / (rl - z0), (xl - root) / (rl - z0));
  }
  const out: StubSolution[] = [];
  for (const t of ts) {
    const dRad = t >= 0 ? Math.atan(t) : Math.PI + Math.atan(t);
    const b = (rl * rl * t - (z0 - xl * t) * (xl + z0 * t)) / (z0 * (rl * rl + (xl + z0 * t) ** 2));
    // The stub must cancel B: it supplies −B.
    out.push({ d: toDeg(dRad), stub: stubDegrees(-b, 1 / z0, end) });
  }
  return out;
}

/** Admittance of load `zl` seen through `deg` of Z0 line. */
export function throughLine(zl: Complex2, z0: number, deg: number): Complex2 {
  const t = Math.tan((deg * Math.PI) / 180);
  // Zin = Z0 (ZL + jZ0 t)/(Z0 + jZL t)
  const nr = zl.re, ni = zl.im + z0 * t, dr = z0 - zl.im * t, di = zl.re * t;
  const zr = (z0 * (nr * dr + ni * di)) / (dr * dr + di * di), zi = (z0 * (ni * dr - nr * di)) / (dr * dr + di * di);
  const m = zr * zr + zi * zi;
  return { re: zr / m, im: -zi / m };
}

/** Double shunt stub: the two solutions, Pozar §5.3; refuses a load outside the forbidden region's complement. */
export function doubleStubSolutions(zl: Complex2, z0: number, loadDeg: number, spacingDeg: number, end: 'open' | 'short'): StubSolution[] {
  const y0 = 1 / z0;
  const yl = throughLine(zl, z0, loadDeg);
  const gl = yl.re, bl = yl.im, t = Math.tan((spacingDeg * Math.PI) / 180);
  const lim = (y0 * (1 + t * t)) / (t * t);
  if (!(gl <= lim)) throw new InputError('out-of-range', 'stub-match.loadDeg', `a load line that brings the load conductance below ${(lim * 1e3).toFixed(3)} mS (the stub spacing's reach)`, `${(gl * 1e3).toFixed(3)} mS`, 'change the load line length by about 45° or use a shorter stub spacing');
  const root = Math.sqrt((1 + t * t) * gl * y0 - gl * gl * t * t);
  const r2 = Math.sqrt(y0 * gl * (1 + t * t) - gl * gl * t * t);
  return [1, -1].map((s) => ({ stub1: stubDegrees(-bl + (y0 + s * root) / t, y0, end), stub2: stubDegrees((s * y0 * r2 + gl * y0) / (gl * t), y0, end) }));
}

/** The load at f0 from a one-port Touchstone text: Γ interpolated linearly between the nearest points. */
export function loadFromTouchstone(text: string, f0: number): { z: Complex2; zRef: number } {
  const data = readTouchstone(text, { ports: 1, fileName: 'load file' });
  if (data.ports.length !== 1) throw new InputError('bad-file', 'stub-match.loadFile', 'a one-port Touchstone file (.s1p)', `${data.ports.length} ports`);
  const f = data.freqs, k = f.findIndex((x) => x >= f0);
  if (k < 0 || (k === 0 && f[0]! > f0)) throw new InputError('out-of-range', 'stub-match.loadFile', `data that covers f0 = ${ghz(f0)}`, `${ghz(f[0]!)} to ${ghz(f[f.length - 1]!)}`, 'use a file measured across the design frequency');
  const a = Math.max(0, k - 1), w = k === a ? 0 : (f0 - f[a]!) / (f[k]! - f[a]!);
  const g = { re: data.s[2 * a]! * (1 - w) + data.s[2 * k]! * w, im: data.s[2 * a + 1]! * (1 - w) + data.s[2 * k + 1]! * w };
  const zRef = data.ports[0]!.zRef;
  const dr = (1 - g.re) ** 2 + g.im ** 2;
  if (!(dr > 1e-12)) throw new InputError('out-of-range', 'stub-match.loadFile', 'a load that is not an open circuit at f0', '|Γ| = 1 at angle 0');
  const z = { re: (zRef * (1 - g.re * g.re - g.im * g.im)) / dr, im: (zRef * 2 * g.im) / dr };
  if (!(z.re > 1e-6)) throw new InputError('out-of-range', 'stub-match.loadFile', 'a load with some resistance at f0', `${z.re.toFixed(3)}${z.im < 0 ? '-' : '+'}${Math.abs(z.im).toFixed(3)}j Ω`, 'a lossless load cannot be matched by lossless stubs');
  return { z, zRef };
}

/** A one-port Touchstone text of a constant impedance over the band (so the design carries its load). */
function loadText(z: Complex2, zRef: number, f: number[]): string {
  const d = (z.re + zRef) ** 2 + z.im ** 2;
  const g = { re: (z.re * z.re - zRef * zRef + z.im * z.im) / d, im: (2 * z.im * zRef) / d };
  return [`! load ${z.re}${z.im < 0 ? '-' : '+'}${Math.abs(z.im)}j ohm, constant (written by the stub-match block)`, `# HZ S RI R ${zRef}`, ...f.map((x) => `${x} ${g.re} ${g.im}`)].join('\n') + '\n';
}

export const stubMatchBlock: BlockDef = {
  kind: 'stub-match',
  title: 'Stub match',
  summary: 'single- or double-stub match of a complex load, open or shorted stubs, every solution listed',
  source: 'Pozar, Microwave Engineering, 4th ed., 2012, §5.2 and §5.3',
  params: [
    { name: 'load', type: 'complex', optional: true, meaning: 'Load impedance at f0, ohms, e.g. 30-20j' },
    { name: 'loadFile', type: 'text', optional: true, maxChars: 4_000_000, meaning: 'One-port Touchstone text of the load (instead of --load)' },
    { name: 'stubs', type: 'choice', choices: ['single', 'double'], default: 'single', meaning: 'One stub (with a line to the load) or two stubs at a fixed spacing' },
    { name: 'end', type: 'choice', choices: ['open', 'short'], default: 'open', meaning: 'Stub ends open or shorted to ground by a via' },
    { name: 'solution', type: 'integer', min: 1, max: 2, default: 1, meaning: 'Which of the listed solutions to build' },
    { name: 'spacingDeg', type: 'number', unit: 'none', min: 10, max: 170, default: 45, meaning: 'Double stub: spacing of the stubs, degrees', when: (s) => s.stubs === 'double' },
    { name: 'loadDeg', type: 'number', unit: 'none', min: 0, max: 180, default: 20, meaning: 'Double stub: line from the first stub to the load, degrees', when: (s) => s.stubs === 'double' },
    Z0_PARAM,
    FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec: Spec, ctx: BlockContext) {
    const z0 = spec.z0 as number, feed = spec.feed as number, end = spec.end as 'open' | 'short', f0 = ctx.f0;
    if ((spec.load === undefined) === (spec.loadFile === undefined)) throw new InputError('invalid-number', 'stub-match.load', 'the load: a complex impedance (--load 30-20j) or a one-port Touchstone file (--load-file), not both', spec.load === undefined ? 'neither' : 'both');
    const fromFile = spec.loadFile !== undefined ? loadFromTouchstone(spec.loadFile as string, f0) : null;
    const zl = fromFile ? fromFile.z : (spec.load as Complex2);
    widthFor(ctx, z0, 'stub-match.z0', 'the lines');
    const double = spec.stubs === 'double';
    const sols = double ? doubleStubSolutions(zl, z0, spec.loadDeg as number, spec.spacingDeg as number, end) : singleStubSolutions(zl, z0, end);
    const pick = Math.min(spec.solution as number, sols.length) - 1;
    const s = sols[pick]!;
    const sk = new Sketch();
    const lg = lambdaG(ctx, z0), len = (deg: number) => (lg * deg) / 360;
    const stubEnd = (id: string, at: { x: number; y: number }) => (end === 'open' ? sk.open(id, at, 'stub end') : sk.short(id, at, 'stub via'));
    sk.port('src', { x: -feed, y: 0 }, z0, 0, 'source');
    let x = 0;
    const stubs: [string, number][] = double ? [['stub2', s.stub2!], ['stub1', s.stub1!]] : [['stub', s.stub!]];
    const after = double ? [spec.spacingDeg as number, spec.loadDeg as number] : [s.d!];
    let prev = 'src';
    stubs.forEach(([name, deg], i) => {
      const j = sk.junction(`t${i + 1}`, { x, y: 0 });
      sk.line(i === 0 ? 'feed' : `between`, prev, j, z0, i === 0 ? { length: feed } : { deg: after[0]! });
      stubEnd(`${name}-end`, { x, y: -len(deg) });
      sk.line(name, j, `${name}-end`, z0, { deg }, name === 'stub2' ? 'stub nearer the source' : name === 'stub1' ? 'stub nearer the load' : 'stub');
      prev = j;
      if (i < stubs.length - 1) x += len(after[0]!);
    });
    const lastDeg = after[after.length - 1]!;
    x += Math.max(len(lastDeg), 1e-3);
    sk.vertex('ld', { x, y: 0 }, 'square');
    sk.open('ld-end', { x: x + 1e-3, y: 0 }, 'load (data block)');
    // A line of 0° is not a piece: a load right at the stub uses 1 µm of line.
    sk.line('toload', prev, 'ld', z0, lastDeg > 1e-6 ? { deg: lastDeg } : { length: 1e-6 }, 'line to the load');
    const zRef = fromFile ? fromFile.zRef : z0;
    const touchstone = fromFile ? (spec.loadFile as string) : loadText(zl, zRef, [f0 * 0.5, f0, f0 * 1.5]);
    const loadSeg: DesignSegment = { id: 'load', kind: 'sparams', a: 'ld', b: 'ld-end', name: 'load', touchstone, width: { by: 'z0', z0 }, length: { by: 'length', length: 1e-3 }, label: 'the load' };
    sk.segments.push(loadSeg);
    const zs = `${zl.re.toFixed(2)}${zl.im < 0 ? '−' : '+'}${Math.abs(zl.im).toFixed(2)}j Ω`;
    const list = sols.map((x, i) => `${i + 1}: ${double ? `stub at the load side ${x.stub1!.toFixed(2)}°, stub at the source side ${x.stub2!.toFixed(2)}°` : `load line ${x.d!.toFixed(2)}°, stub ${x.stub!.toFixed(2)}°`}${i === pick ? ' (built)' : ''}`);
    return {
      name: `${double ? 'Double' : 'Single'}-stub match of ${zs}, ${ghz(f0)}`,
      nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      targets: [{ id: 'match', name: 'source matched at f0', figure: 'return-loss', ports: ['src'], band: { start: f0, stop: f0 }, limit: { min: 25 } }],
      notes: [
        `${stubMatchBlock.title} (${stubMatchBlock.source}): load ${zs}${fromFile ? ' (from the Touchstone file at f0)' : ''} to ${z0} Ω at ${ghz(f0)}, ${end} stubs.`,
        `Solutions (electrical lengths at f0): ${list.join('; ')}.`,
        'Stub lengths count from the tee\'s reference plane; sizing shortens an open stub by its end extension.',
      ],
      band: { start: f0 * 0.7, stop: f0 * 1.3 },
    };
  },
};
