/**
 * The line-model interface is the one path from a piece's copper to its line: a strip family planted with
 * `lineModels.with(…)` (here an invented ideal TEM strip whose Z0 falls as 1/W and whose εeff is a constant 2.25,
 * lossless) is what sizing chooses widths and lengths with, what the path ledger counts phase with, and what the
 * network solves — nothing asks the microstrip formulas behind its back. Likewise an invented coupled-pair family
 * (homogeneous TEM pair: both modes at εeff 2.25, Z0e,o = Zm·(1 ± c) with Zm = K·h/W and c = ½·h/(h + s)) is what
 * the coupled sizing and the network's coupled sections use; and both reach the yield (made boards, the path-phase
 * estimate) and the coupon (its width, its lengths, the laminate fit's model).
 *
 * Outside checks (D. M. Pozar, Microwave Engineering, 4th ed., 2012, from memory):
 *  - §2.1/§3.8: a line of εeff has λg = c0/(f√εeff), so 90° at f0 is c0/(4 f0 √εeff) long and has 90° of phase;
 *  - §2.5 (quarter-wave transformer): a λ/4 line of Z1 loaded by ZL shows Zin = Z1²/ZL, so a 100 Ω quarter-wave
 *    between 50 Ω ports has Γ = (200 − 50)/(200 + 50) = 0.6 at f0;
 *  - Table 4.2 (ABCD → S): the lossless λ/4 line of Z1 (A = D = 0, B = jZ1, C = j/Z1) between Z0 ports has
 *    S21 = 2/(j(Z1/Z0 + Z0/Z1)) = −0.8j for Z1 = 100 Ω, Z0 = 50 Ω (|S11|² + |S21|² = 1).
 *  - §7.6 (coupled-line coupler, TEM): Z0e,o = Z0·√((1 ± C)/(1 ∓ C)); a λ/4 section between Z0 ports couples
 *    V3/V1 = C to the port beside the input and passes V2/V1 = −j√(1 − C²), with no reflection and nothing at the
 *    isolated port (10 dB: C = 10^(−1/2)).
 * The coupon's line pair: β·Δl symmetric about 90° over the band, Δl = π/(β(f1) + β(f2)) (R. B. Marks, "A multiline
 * method of network analyzer calibration", IEEE Trans. MTT 39(7), 1991, on the conditioning of a line pair).
 */
import { describe, expect, it } from 'vitest';
import {
  InputError, lineModels, netlistFromSized, pathPhaseMonteCarlo, planCoupon, runYield, sAt, sizeDesign, solveNetwork, tracePaths,
  type CoupledMicrostripSection, type CoupledModeName, type CoupledPairFamily, type DesignDoc, type LineModelFamily,
  type MicrostripSection, type ModalFigures, type ModeFigures, type PairModes, type SingleMode, type StripLineFamily,
} from '../../core/index.ts';
import { modelEps } from '../../core/network/coupon/laminate-fit.ts';
import { design, degs, line, port, RO_LIKE, z } from './layout-fixtures.ts';

const C0 = 299_792_458;
const EPS = 2.25;
/** Z0 · W / h of the invented strip, Ω (Z0 = K·h/W). */
const K = 120;

function tem(): StripLineFamily & { calls: number } {
  const fam = {
    kind: 'microstrip' as const,
    modes: ['single'] as const,
    source: 'invented ideal TEM strip for a test (Z0 = K·h/W, εeff = 2.25, lossless)',
    calls: 0,
    evaluate(s: MicrostripSection, f: number): ModalFigures<SingleMode> {
      fam.calls++;
      const z0 = (K * s.substrate.h) / s.width;
      const lambdaG = f > 0 ? C0 / (f * Math.sqrt(EPS)) : 0;
      const mode = {
        z0, z0Static: z0, epsEff: EPS, epsEffStatic: EPS, lambdaG, beta: f > 0 ? (2 * Math.PI) / lambdaG : 0,
        delayPerM: Math.sqrt(EPS) / C0, alphaC: 0, alphaD: 0,
      };
      return { f, modes: { single: mode }, warnings: [], valid: true };
    },
    widthFor(sub: { h: number }, z0: number): number { return (K * sub.h) / z0; },
  };
  return fam;
}

const F0 = 2.45e9;
const quarterWave = () => design({
  f0: F0,
  nodes: [port('p1', 0, 0), port('p2', 0.02, 0, Math.PI)],
  segments: [line('l', 'p1', 'p2', z(100), degs(90))],
});

describe('a planted strip family reaches sizing, paths and the network', () => {
  it('sizing takes its width and length from the planted family, not from microstrip', () => {
    const fam = tem();
    const models = lineModels.with(fam);
    const doc = quarterWave();
    const sized = sizeDesign(doc, { models });
    const piece = sized.pieces[0]!;
    expect(sized.problems).toEqual([]);
    expect(fam.calls).toBeGreaterThan(0);
    // Width: the family's own widthFor (Z0 = K·h/W).
    expect(piece.width).toBeCloseTo((K * doc.substrate.h) / 100, 15);
    expect(piece.z0).toBeCloseTo(100, 10);
    // Length: 90° on λg = c0/(f0·√2.25) (Pozar §2.1).
    expect(piece.nominalLength / (C0 / (4 * F0 * Math.sqrt(EPS)))).toBeCloseTo(1, 12);
    expect(piece.line!.epsEff).toBe(EPS);
    // The core's microstrip on the same laminate gives another width and length: the plant really changed them.
    const plain = sizeDesign(doc).pieces[0]!;
    expect(Math.abs(plain.width - piece.width) / piece.width).toBeGreaterThan(0.05);
    expect(Math.abs(plain.nominalLength - piece.nominalLength) / piece.nominalLength).toBeGreaterThan(0.05);
  });

  it('the path ledger counts phase with the same family (90° at f0)', () => {
    const fam = tem();
    const sized = sizeDesign(quarterWave(), { models: lineModels.with(fam) });
    const before = fam.calls;
    const report = tracePaths(sized, 'p1', ['p2'], { sensitivities: false });
    expect(fam.calls).toBeGreaterThan(before);
    expect(report.paths[0]!.degAtF0).toBeCloseTo(90, 9);
  });

  it('the network solves the planted line: a 100 Ω quarter-wave between 50 Ω ports (Pozar §2.5, Table 4.2)', () => {
    const fam = tem();
    const sized = sizeDesign(quarterWave(), { models: lineModels.with(fam) });
    const before = fam.calls;
    const r = solveNetwork(netlistFromSized(sized), [F0]);
    expect(fam.calls).toBeGreaterThan(before);
    const s11 = sAt(r, 0, 0, 0), s21 = sAt(r, 0, 1, 0);
    expect(s11.re).toBeCloseTo(0.6, 9); expect(s11.im).toBeCloseTo(0, 9);
    expect(s21.re).toBeCloseTo(0, 9); expect(s21.im).toBeCloseTo(-0.8, 9);
    // Passed explicitly, the models win over the sized design's own: the core's microstrip at that width differs.
    const core = solveNetwork(netlistFromSized(sized, { models: lineModels }), [F0]);
    expect(Math.abs(sAt(core, 0, 0, 0).re - 0.6)).toBeGreaterThan(1e-3);
  });

  it('refuses a planted strip family that cannot choose a width for an impedance, naming what is missing', () => {
    const { widthFor: _drop, ...rest } = tem();
    const noWidth: LineModelFamily<MicrostripSection, SingleMode> = rest;
    const run = () => sizeDesign(quarterWave(), { models: lineModels.with(noWidth) });
    expect(run).toThrow(InputError);
    expect(run).toThrow(/widthFor/);
  });
});

/** The invented homogeneous TEM pair: Zm = KP·h/W, c = ½·h/(h + s), Z0e,o = Zm·(1 ± c), both modes at εeff 2.25. */
const KP = 120;
function temPair(): CoupledPairFamily & { calls: number } {
  const mode = (z0: number, f: number): ModeFigures => {
    const lambdaG = f > 0 ? C0 / (f * Math.sqrt(EPS)) : 0;
    return { z0, z0Static: z0, epsEff: EPS, epsEffStatic: EPS, lambdaG, beta: f > 0 ? (2 * Math.PI) / lambdaG : 0, delayPerM: Math.sqrt(EPS) / C0, alphaC: 0, alphaD: 0 };
  };
  const fam = {
    kind: 'coupled-microstrip' as const,
    modes: ['even', 'odd'] as const,
    source: 'invented homogeneous TEM pair for a test',
    calls: 0,
    evaluate(s: CoupledMicrostripSection, f: number): ModalFigures<CoupledModeName> {
      fam.calls++;
      const h = s.substrate.h, zm = (KP * h) / s.width, c = (0.5 * h) / (h + s.gap);
      return { f, modes: { even: mode(zm * (1 + c), f), odd: mode(zm * (1 - c), f) }, warnings: [], valid: true };
    },
    geometryFor(sub: { h: number }, m: PairModes) {
      const zm = (m.z0Even + m.z0Odd) / 2, c = (m.z0Even - m.z0Odd) / (m.z0Even + m.z0Odd);
      return { width: (KP * sub.h) / zm, gap: sub.h * (0.5 / c - 1) };
    },
  };
  return fam;
}

const C10 = 10 ** (-10 / 20);
const Z0E = 50 * Math.sqrt((1 + C10) / (1 - C10)), Z0O = 50 * Math.sqrt((1 - C10) / (1 + C10));
/** A 10 dB coupled-line coupler asked by its mode impedances, ports straight on the pair's four ends. */
function coupler(): DesignDoc {
  const L = 0.02, p = 2e-3;
  const doc = design({
    f0: F0,
    nodes: [port('a', 0, 0), port('b', L, 0, Math.PI), port('c', 0, -p), port('d', L, -p, Math.PI)],
    segments: [{ id: 'pair', kind: 'coupled', a: 'a', b: 'b', c: 'c', d: 'd', pair: { by: 'modes', z0Even: Z0E, z0Odd: Z0O }, length: { by: 'degrees', deg: 90 } }],
  });
  doc.targets = [{ id: 'coupling', figure: 'transmission', ports: ['a', 'c'], band: { start: F0, stop: F0 }, limit: { min: -10.5, max: -9.5 } }];
  doc.tolerances = [{ quantity: 'er', distribution: 'normal', spread: 0.2, scope: 'board' }];
  return doc;
}

describe('a planted coupled-pair family reaches the coupled sizing and the network', () => {
  it('sizing takes the pair\'s width and gap from the family\'s geometryFor, and its length from the modes', () => {
    const pair = temPair();
    const sized = sizeDesign(coupler(), { models: lineModels.with(tem()).with(pair) });
    expect(sized.problems).toEqual([]);
    expect(pair.calls).toBeGreaterThan(0);
    const piece = sized.pieces.find((x) => x.id === 'pair')!;
    const zm = (Z0E + Z0O) / 2;
    expect(piece.pair!.width).toBeCloseTo((KP * RO_LIKE.h) / zm, 15);
    expect(piece.pair!.gap).toBeCloseTo(RO_LIKE.h * (0.5 / C10 - 1), 15);
    expect(piece.pair!.z0Even).toBeCloseTo(Z0E, 9);
    expect(piece.pair!.z0Odd).toBeCloseTo(Z0O, 9);
    expect(piece.pair!.couplingDb).toBeCloseTo(10, 9);
    // 90° on the modes' β at εeff 2.25 (Pozar §2.1).
    expect(piece.nominalLength / (C0 / (4 * F0 * Math.sqrt(EPS)))).toBeCloseTo(1, 12);
    // The core's coupled microstrip asks another geometry for the same modes: the plant really changed it.
    const plain = sizeDesign(coupler()).pieces.find((x) => x.id === 'pair')!;
    expect(Math.abs(plain.pair!.gap - piece.pair!.gap) / piece.pair!.gap).toBeGreaterThan(0.05);
  });

  it('the network solves the planted pair: an ideal 10 dB coupler at f0 (Pozar §7.6)', () => {
    const pair = temPair();
    const sized = sizeDesign(coupler(), { models: lineModels.with(tem()).with(pair) });
    const before = pair.calls;
    const r = solveNetwork(netlistFromSized(sized), [F0]);
    expect(pair.calls).toBeGreaterThan(before);
    const [a, b, c, d] = ['a', 'b', 'c', 'd'].map((n) => r.ports.findIndex((p) => p.name === n));
    const s31 = sAt(r, 0, c!, a!), s21 = sAt(r, 0, b!, a!), s41 = sAt(r, 0, d!, a!), s11 = sAt(r, 0, a!, a!);
    expect(s31.re).toBeCloseTo(C10, 9); expect(s31.im).toBeCloseTo(0, 9);
    expect(s21.re).toBeCloseTo(0, 9); expect(s21.im).toBeCloseTo(-Math.sqrt(1 - C10 * C10), 9);
    expect(Math.hypot(s41.re, s41.im)).toBeLessThan(1e-9);
    expect(Math.hypot(s11.re, s11.im)).toBeLessThan(1e-9);
  });

  it('refuses a planted pair family that cannot choose a geometry for mode impedances, naming what is missing', () => {
    const { geometryFor: _drop, ...rest } = temPair();
    const noGeometry: LineModelFamily<CoupledMicrostripSection, CoupledModeName> = rest;
    const sized = sizeDesign(coupler(), { models: lineModels.with(noGeometry) });
    expect(sized.problems.map((p) => p.message).join(' ')).toMatch(/geometryFor/);
  });
});

describe('the planted families reach the yield and the coupon', () => {
  it('yield: the made boards are solved with the planted lines (their figures ignore εr, so an εr spread moves nothing)', async () => {
    const pair = temPair(), strip = tem();
    const models = lineModels.with(strip).with(pair);
    const y = await runYield(coupler(), { models, samples: 20, seed: 5, rankingSamples: 0 });
    const t = y.targets[0]!;
    // The ideal coupler's coupling, 20·log10 C = −10 dB (Pozar §7.6), as the nominal.
    expect(t.nominal.worst.value).toBeCloseTo(-10, 8);
    for (const v of t.values) expect(Object.is(v, t.nominal.worst.value)).toBe(true);
    expect(pair.calls).toBeGreaterThan(20);
    // With the core's models the same tolerance spreads the boards: the plant is what made them all equal.
    const core = await runYield(coupler(), { samples: 20, seed: 5, rankingSamples: 0 });
    expect(Math.max(...core.targets[0]!.values) - Math.min(...core.targets[0]!.values)).toBeGreaterThan(1e-4);
  });

  it('yield: the path-phase estimate counts with the planted strip (90° on every board)', async () => {
    const doc = quarterWave();
    doc.tolerances = [{ quantity: 'er', distribution: 'normal', spread: 0.2, scope: 'board' }, { quantity: 'h', distribution: 'normal', spread: 50e-6, scope: 'board' }];
    const strip = tem();
    const sized = sizeDesign(doc, { models: lineModels.with(strip) });
    const report = tracePaths(sized, 'p1', ['p2'], { sensitivities: false });
    const before = strip.calls;
    const est = await pathPhaseMonteCarlo(sized, { samples: 50, seed: 2, reports: [report] });
    expect(strip.calls).toBeGreaterThan(before);
    // Z0 = K·h/W moves with h, but the invented εeff does not: the electrical length stays 90° (Pozar §2.1).
    const st = est.groups[0]!.paths[0]!.stats;
    expect(st.min).toBeCloseTo(90, 9);
    expect(st.max).toBeCloseTo(90, 9);
  });

  it('coupon: its width and line lengths come from the planted strip (Marks 1991 pair condition)', () => {
    const strip = tem();
    const f1 = 1e9, f2 = 4e9;
    const plan = planCoupon({ substrate: RO_LIKE, band: { start: f1, stop: f2 }, models: lineModels.with(strip) });
    expect(plan.width).toBe((K * RO_LIKE.h) / 50);
    // β = 2πf·√2.25/c0, so Δl = π/(β(f1) + β(f2)) = c0/(3(f1 + f2)), rounded to 10 µm as the generator does.
    const pairLine = plan.lines.find((l) => l.delta > 0)!;
    expect(pairLine.delta).toBeCloseTo(Math.round((C0 / (3 * (f1 + f2))) * 1e5) / 1e5, 12);
    expect(pairLine.phaseDeg![0] + pairLine.phaseDeg![1]).toBeCloseTo(180, 0);
    const plain = planCoupon({ substrate: RO_LIKE, band: { start: f1, stop: f2 } });
    expect(Math.abs(plain.width - plan.width) / plan.width).toBeGreaterThan(0.05);
  });

  it('coupon: the laminate fit\'s model is the planted strip', () => {
    const strip = tem();
    const m = modelEps(RO_LIKE, 1e-3, [1e9, 2e9, 3e9], undefined, strip)!;
    expect(strip.calls).toBe(3);
    for (const e of m.real) expect(e).toBe(EPS);
    for (const a of m.alpha) expect(a).toBe(0);
  });
});
