/**
 * The line-model interface is the one path from a piece's copper to its line: a strip family planted with
 * `lineModels.with(…)` (here an invented ideal TEM strip whose Z0 falls as 1/W and whose εeff is a constant 2.25,
 * lossless) is what sizing chooses widths and lengths with, what the path ledger counts phase with, and what the
 * network solves — nothing asks the microstrip formulas behind its back.
 *
 * Outside checks (D. M. Pozar, Microwave Engineering, 4th ed., 2012, from memory):
 *  - §2.1/§3.8: a line of εeff has λg = c0/(f√εeff), so 90° at f0 is c0/(4 f0 √εeff) long and has 90° of phase;
 *  - §2.5 (quarter-wave transformer): a λ/4 line of Z1 loaded by ZL shows Zin = Z1²/ZL, so a 100 Ω quarter-wave
 *    between 50 Ω ports has Γ = (200 − 50)/(200 + 50) = 0.6 at f0;
 *  - Table 4.2 (ABCD → S): the lossless λ/4 line of Z1 (A = D = 0, B = jZ1, C = j/Z1) between Z0 ports has
 *    S21 = 2/(j(Z1/Z0 + Z0/Z1)) = −0.8j for Z1 = 100 Ω, Z0 = 50 Ω (|S11|² + |S21|² = 1).
 */
import { describe, expect, it } from 'vitest';
import {
  InputError, lineModels, netlistFromSized, sAt, sizeDesign, solveNetwork, tracePaths,
  type LineModelFamily, type MicrostripSection, type ModalFigures, type SingleMode, type StripLineFamily,
} from '../../core/index.ts';
import { design, degs, line, port, z } from './layout-fixtures.ts';

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
