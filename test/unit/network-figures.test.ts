/**
 * Derived figures (definitions as in D. M. Pozar, Microwave Engineering, 4th ed.: return loss and VSWR §2.3,
 * insertion loss §4.3; group delay as −dφ/dω is common practice) on networks whose answers are known exactly.
 */
import { describe, expect, it } from 'vitest';
import {
  solveNetwork, sweepFrequencies, idealLine, temLengthForDegrees, groupDelay, phaseDeg, vswr, returnLoss, insertionLoss,
  amplitudeBalance, phaseBalance, isolation, smith, summarize, unwrapDeg, wrap180, type Netlist,
} from '../../core/network/index.ts';
import { C0 } from '../../core/units/constants.ts';

const f0 = 2.45e9;
const freqs = sweepFrequencies({ start: 1e9, stop: 4e9, points: 301 });

describe('a matched lossless line', () => {
  const ee = 2.81, len = 0.25; // about 14 wavelengths at 4 GHz: many phase wraps
  const r = solveNetwork({ elements: [{ kind: 'line', id: 'l', a: 'a', b: 'b', length: len, model: idealLine(50, ee) }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] }, freqs);
  it('unwrapped phase of S21 is −360°·f·l·√εeff/c0 plus a whole number of turns, with no jumps', () => {
    const ph = phaseDeg(r, 1, 0);
    const want = (k: number) => (-360 * freqs[k] * len * Math.sqrt(ee)) / C0;
    const turns = Math.round((ph[0] - want(0)) / 360);
    for (let k = 0; k < freqs.length; k++) expect(ph[k] - 360 * turns).toBeCloseTo(want(k), 8);
  });
  it('group delay is l·√εeff/c0 (TEM line, Pozar, Microwave Engineering 4th ed., §3.9 group velocity, from memory)', () => {
    const gd = groupDelay(r, 1, 0);
    for (const g of gd) expect(g).toBeCloseTo((len * Math.sqrt(ee)) / C0, 18);
  });
  it('insertion loss 0 dB, return loss at the −400 dB floor (exact match)', () => {
    for (const x of insertionLoss(r, 0, 1)) expect(x).toBeCloseTo(0, 12);
    for (const x of returnLoss(r, 0)) expect(x).toBeGreaterThan(250);
  });
});

describe('a resistive load', () => {
  // 100 Ω to ground on a 50 Ω port: Γ = 1/3, VSWR = 2, RL = 20·log10(3) = 9.5424 dB (Pozar §2.3 definitions).
  const r = solveNetwork({ elements: [{ kind: 'resistor', id: 'r', a: 'a', b: 'gnd', value: 100 }], ports: [{ name: '1', node: 'a', zRef: 50 }] }, [1e9, 2e9]);
  it('VSWR, return loss and the Smith-chart point', () => {
    expect(vswr(r, 0)[0]).toBeCloseTo(2, 14);
    expect(returnLoss(r, 0)[1]).toBeCloseTo(20 * Math.log10(3), 12);
    expect(smith(r, 0).re[0]).toBeCloseTo(1 / 3, 15);
    expect(smith(r, 0).im[0]).toBeCloseTo(0, 15);
  });
});

describe('balance and isolation', () => {
  const l = (id: string, a: string, b: string, z: number) => ({ kind: 'line' as const, id, a, b, length: temLengthForDegrees(90, f0), model: idealLine(z) });
  const hybrid: Netlist = {
    elements: [l('s12', 'n1', 'n2', 50 / Math.SQRT2), l('s43', 'n4', 'n3', 50 / Math.SQRT2), l('p14', 'n1', 'n4', 50), l('p23', 'n2', 'n3', 50)],
    ports: ['n1', 'n2', 'n3', 'n4'].map((n, i) => ({ name: `${i + 1}`, node: n, zRef: 50 })),
  };
  it('branch-line at f0: 0 dB amplitude balance, 90° between the outputs, isolated port 4 (Pozar §7.5)', () => {
    const r = solveNetwork(hybrid, [f0]);
    expect(amplitudeBalance(r, 0, 1, 2)[0]).toBeCloseTo(0, 12);
    expect(phaseBalance(r, 0, 1, 2, 90)[0]).toBeCloseTo(0, 10);
    expect(isolation(r, 0, 3)[0]).toBeGreaterThan(250);
  });
  it('summary finds the worst values over the band and where they are', () => {
    const r = solveNetwork(hybrid, sweepFrequencies({ start: 2.2e9, stop: 2.7e9, points: 51 }));
    const sum = summarize(r, 0);
    expect(sum.ports).toHaveLength(4);
    // The hybrid is symmetric about f0 only approximately; the worst match lies at a band edge.
    expect([2.2e9, 2.7e9]).toContain(sum.ports[0].returnLoss.freq);
    const rl = returnLoss(r, 0);
    expect(sum.ports[0].returnLoss.value).toBe(Math.min(...rl));
    const pb = phaseBalance(r, 0, 1, 2);
    const worstPb = sum.pairs.find((p) => p.a === '2' && p.b === '3')!.phaseBalance;
    expect(Math.abs(worstPb.value)).toBe(Math.max(...pb.map(Math.abs)));
    expect(pb[r.freqs.indexOf(worstPb.freq)]).toBe(worstPb.value);
  });
});

describe('phase helpers', () => {
  it('unwrap removes 360° jumps and wrap180 maps into (−180, 180]', () => {
    expect(Array.from(unwrapDeg(Float64Array.of(170, -170, -10, 160)))).toEqual([170, 190, 350, 520]);
    expect(wrap180(190)).toBe(-170);
    expect(wrap180(-180)).toBe(180);
    expect(wrap180(540)).toBe(180);
  });
});

describe('summary group delay', () => {
  it('a matched TEM line has the same delay everywhere: min = max = l·√εeff/c0', () => {
    const r = solveNetwork({ elements: [{ kind: 'line', id: 'l', a: 'a', b: 'b', length: 0.1, model: idealLine(50, 3) }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] }, freqs);
    const p = summarize(r, 0).paths[0];
    expect(p.groupDelay.min.value).toBeCloseTo((0.1 * Math.sqrt(3)) / C0, 18);
    expect(p.groupDelay.max.value).toBeCloseTo((0.1 * Math.sqrt(3)) / C0, 18);
  });
});
