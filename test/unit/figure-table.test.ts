/**
 * The response's derived-figure table (core/network/figureTable.ts) on circuits whose answers are known in closed
 * form (D. M. Pozar, Microwave Engineering, 4th ed.):
 *  - a quarter-wave transformer from 50 Ω to 100 Ω (Zc = √(50·100)): |Γ(θ)| = |ZL − Z0| / √((ZL + Z0)² + 4·Z0·ZL·tan²θ)
 *    (§5.5, eq. 5.64 from memory; θ = 90°·f/f0), worst at the band edges and matched at f0;
 *  - a matched ideal TEM line: S21 = e^(−jωl/c), so the group delay is l/c at every frequency (§2.7 definition);
 *  - an ideal three-line junction feeding two matched outputs whose lines differ by Δl: equal magnitudes, so the
 *    amplitude balance is 0, and the phase balance is 360°·f·Δl/c, largest at the top of the band.
 */
import { describe, expect, it } from 'vitest';
import { solveNetwork, sweepFrequencies, idealLine, temLengthForDegrees, figureTable } from '../../core/network/index.ts';

const C0 = 299_792_458;
const band = { start: 0.9e9, stop: 1.1e9 };
const doc = (phaseGroups: { id: string; name: string; from: string; to: string[]; toleranceDeg: number }[] = []) => ({ frequency: { f0: 1e9, band }, phaseGroups });
const freqs = sweepFrequencies({ start: 0.8e9, stop: 1.2e9, points: 401 });

describe('figure table', () => {
  it('quarter-wave transformer: worst return loss and VSWR at the band edges as the closed form says, matched at f0', () => {
    const r = solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'p1', b: 'p2', length: temLengthForDegrees(90, 1e9), model: idealLine(Math.sqrt(5000)) }],
      ports: [{ name: '1', node: 'p1', zRef: 50 }, { name: '2', node: 'p2', zRef: 100 }] }, freqs);
    const t = figureTable(r, doc(), 0);
    expect(t.over).toBe('band');
    const theta = (90 * 0.9 * Math.PI) / 180;
    const gamma = 50 / Math.sqrt(150 ** 2 + 4 * 5000 * Math.tan(theta) ** 2);
    const rl = t.rows.find((x) => x.kind === 'return-loss' && x.ports[0] === '1')!;
    expect(rl.worst.value).toBeCloseTo(-20 * Math.log10(gamma), 8);
    expect([0.9e9, 1.1e9]).toContain(rl.worst.freq);
    expect(rl.atF0).toBeGreaterThan(200);
    const sw = t.rows.find((x) => x.kind === 'vswr' && x.ports[0] === '1')!;
    expect(sw.worst.value).toBeCloseTo((1 + gamma) / (1 - gamma), 9);
    // A two-port has no pairs of outputs: no isolation or balance rows.
    expect(t.rows.some((x) => x.kind === 'isolation' || x.kind === 'phase-balance')).toBe(false);
  });

  it('matched line: group delay l/c over the whole band, insertion loss 0 dB', () => {
    const l = 0.123;
    const r = solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'p1', b: 'p2', length: l, model: idealLine(50) }],
      ports: [{ name: 'in', node: 'p1', zRef: 50 }, { name: 'out', node: 'p2', zRef: 50 }] }, freqs);
    const t = figureTable(r, doc(), 0);
    const gd = t.rows.find((x) => x.kind === 'group-delay')!;
    expect(gd.worst.value).toBeCloseTo(l / C0, 15);
    expect(gd.least!.value).toBeCloseTo(l / C0, 15);
    expect(Math.abs(t.rows.find((x) => x.kind === 'insertion-loss')!.worst.value)).toBeLessThan(1e-9);
  });

  it('two matched outputs with lines differing by Δl: amplitude balance 0, phase balance 360°·f·Δl/c at the band top', () => {
    const dl = temLengthForDegrees(10, 1e9);
    const line = (id: string, a: string, b: string, length: number) => ({ kind: 'line' as const, id, a, b, length, model: idealLine(50) });
    const r = solveNetwork({ elements: [line('f', 'pin', 'j', 0.05), line('a', 'j', 'pa', 0.04), line('b', 'j', 'pb', 0.04 + dl)],
      ports: [{ name: 'in', node: 'pin', zRef: 50 }, { name: 'a', node: 'pa', zRef: 50 }, { name: 'b', node: 'pb', zRef: 50 }] }, freqs);
    for (const groups of [[], [{ id: 'g', name: 'pair', from: 'in', to: ['a', 'b'], toleranceDeg: 1 }]]) {
      const t = figureTable(r, doc(groups), 0);
      const amp = t.rows.find((x) => x.kind === 'amplitude-balance')!, ph = t.rows.find((x) => x.kind === 'phase-balance')!;
      expect(Math.abs(amp.worst.value)).toBeLessThan(1e-9);
      expect(ph.worst.value).toBeCloseTo(11, 6);
      expect(ph.worst.freq).toBe(1.1e9);
      expect(ph.atF0).toBeCloseTo(10, 6);
      expect(t.rows.filter((x) => x.kind === 'isolation')).toHaveLength(1);
    }
  });
});
