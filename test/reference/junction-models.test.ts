/**
 * The junction models against a second transcription of their published equations (junction-oracle.ts: Hammerstad
 * 1981 T-junction, in the parallel-plate form reproduced by Gupta, Garg, Bahl, Bhartia 1996 ch. 3; Garg & Bahl 1978
 * width step), their low-frequency limits, the symmetry the tool promises, and the network's tee n-port against the
 * two-port algebra it stands for.
 */
import { describe, expect, it } from 'vitest';
import { teeReferencePlanes, teeJunction, widthStep, stepResidual, prepareTee, teeShiftsInto } from '../../core/discontinuity/index.ts';
import { starAdmittance, idealLine, solveNetwork, type NetElement } from '../../core/network/index.ts';
import { oracleStep, oracleTee } from './junction-oracle.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-30);

/** Grid of laminates and impedances the examples and feeds use (εr 2.2–10.2, h 0.25–1.6 mm, 25–120 Ω). */
const cases: [number, number, number, number, number][] = [];
for (const h of [0.254e-3, 0.508e-3, 1.6e-3]) for (const [Z1, Z2] of [[50, 50], [35.36, 50], [100, 50], [70.7, 120], [25, 60]] as const) {
  cases.push([Z1, Z2, 2.9 + Z1 / 100, 2.7 + Z2 / 120, h]);
}

describe('Hammerstad 1981 tee: against an independent transcription (parallel-plate form, Gupta et al. 1996 ch. 3)', () => {
  it('d1, d2, n², D1, D2 and fp1 agree to 1e-11 over laminates, impedance ratios 0.42–2 and 0–20 GHz', () => {
    let n = 0;
    for (const [z1, z2, ee1, ee2, h] of cases) for (const f of [0, 1e9, 2.45e9, 5.8e9, 10.368e9, 20e9]) {
      const ours = teeReferencePlanes({ z1, z2, ee1, ee2, h, f });
      const ref = oracleTee(z1, z2, ee1, ee2, h, f);
      // η0 = μ0 c0 here against the core's 376.730313668 Ω: they agree to a few parts in 1e12.
      for (const k of ['D1', 'D2', 'fp1'] as const) expect(rel(ours[k], ref[k]), `${k} ${z1}/${z2} Ω h ${h} f ${f}`).toBeLessThan(1e-11);
      // d1 and d2 pass through zero at high F; compare them on the scale of their guide widths.
      expect(Math.abs(ours.d2 - ref.d2) / ref.D1, `d2 ${z1}/${z2} f ${f}`).toBeLessThan(1e-11);
      expect(Math.abs(ours.d1 - ref.d1) / ref.D2, `d1 ${z1}/${z2} f ${f}`).toBeLessThan(1e-11);
      // n² ≈ 0 far above fp1 (20 GHz on 1.6 mm): the two η0 values' last digits show there, hence 1e-9.
      expect(Math.abs(ours.n2 - ref.n2), `n² ${z1}/${z2} f ${f}`).toBeLessThan(1e-9);
      n++;
    }
    expect(n).toBe(90);
  });
  it('low-frequency limit: n² → 1, d1 → 0.055 D2 Z1/Z2 and d2 → its static value, each departing as f² (model form)', () => {
    for (const [z1, z2, ee1, ee2, h] of cases) {
      const r = z1 / z2;
      const at0 = teeReferencePlanes({ z1, z2, ee1, ee2, h, f: 0 });
      expect(at0.n2).toBe(1);
      expect(rel(at0.d1, 0.055 * at0.D2 * r)).toBeLessThan(1e-14);
      expect(rel(at0.d2, at0.D1 * (0.5 - r * (0.05 + 0.7 * Math.exp(-1.6 * r) - 0.17 * Math.log(r))))).toBeLessThan(1e-13);
      // Quadratic departure: halving f quarters it (1e6 Hz and 2e6 Hz, far below fp1).
      const a = teeReferencePlanes({ z1, z2, ee1, ee2, h, f: 1e6 }), b = teeReferencePlanes({ z1, z2, ee1, ee2, h, f: 2e6 });
      expect(rel((1 - b.n2) / (1 - a.n2), 4)).toBeLessThan(1e-6);
      expect(rel((at0.d1 - b.d1) / (at0.d1 - a.d1), 4)).toBeLessThan(1e-6);
      // And n² falls, the planes move in, as f rises towards fp1.
      const hi = teeReferencePlanes({ z1, z2, ee1, ee2, h, f: 0.4 * at0.fp1 });
      expect(hi.n2).toBeLessThan(1);
      expect(hi.d2).toBeLessThan(at0.d2);
    }
  });
  it('the parallel-plate cutoff fp1 = Z1/(2 μ0 h) is 12.4 GHz for 50 Ω on 1.6 mm (arithmetic check)', () => {
    expect(teeReferencePlanes({ z1: 50, z2: 50, ee1: 3.3, ee2: 3.3, h: 1.6e-3, f: 0 }).fp1 / 1e9).toBeCloseTo(12.43, 2);
  });
  it('unequal main arms: each arm uses its own Z1; swapping the arms swaps the shifts; equal arms give the paper exactly', () => {
    const a = { z: 35.2, ee: 2.95 }, b = { z: 49.9, ee: 2.8 }, br = { z: 49.9, ee: 2.8 };
    const t = teeJunction({ main: [a, b], branch: br, h: 0.508e-3, f: 10.368e9 });
    const s = teeJunction({ main: [b, a], branch: br, h: 0.508e-3, f: 10.368e9 });
    expect(s.d1).toEqual([t.d1[1], t.d1[0]]);
    expect(s.d2).toBe(t.d2);
    expect(s.n2).toBe(t.n2);
    const ra = oracleTee(a.z, br.z, a.ee, br.ee, 0.508e-3, 10.368e9), rb = oracleTee(b.z, br.z, b.ee, br.ee, 0.508e-3, 10.368e9);
    expect(rel(t.d1[0], ra.d1)).toBeLessThan(1e-11);
    expect(rel(t.d1[1], rb.d1)).toBeLessThan(1e-11);
    expect(rel(t.d2, (ra.d2 + rb.d2) / 2)).toBeLessThan(1e-11);
    // The network's per-frequency form (prepared once, no checks) gives the same numbers.
    const out = new Float64Array(4);
    for (const f of [0, 2.45e9, 10.368e9, 30e9]) {
      const j = teeJunction({ main: [a, b], branch: br, h: 0.508e-3, f });
      teeShiftsInto(prepareTee([a, b], br, 0.508e-3), f, out);
      for (const [i, want] of [j.d1[0], j.d1[1], j.d2, j.n2].entries()) expect(Math.abs(out[i]! - want)).toBeLessThan(1e-15 + 1e-12 * Math.abs(want));
    }
    const eq = teeJunction({ main: [b, b], branch: br, h: 0.508e-3, f: 10.368e9 });
    expect(eq.d1[0]).toBe(eq.d1[1]);
    expect(rel(eq.n2, rb.n2)).toBeLessThan(1e-11);
    expect(rel(eq.d2, rb.d2)).toBeLessThan(1e-11);
  });
});

describe('Garg–Bahl 1978 width step: against an independent transcription', () => {
  it('Cs, Ls, L1, L2 agree to 1e-12 for ratios 1.2–8 on εr 2.2–9.8', () => {
    for (const er of [2.2, 3.66, 4.4, 9.8]) for (const k of [1.2, 1.6, 2.37, 3.4, 4.5, 8]) {
      const W2 = 0.6e-3, W1 = k * W2, h = 0.8e-3;
      const z1 = 30, z2 = 70, ee1 = 1 + 0.7 * (er - 1), ee2 = 1 + 0.6 * (er - 1);
      const ours = widthStep({ W1, W2, h, er, z1, z2, ee1, ee2 });
      const ref = oracleStep(W1, W2, h, er, z1, z2, ee1, ee2);
      for (const q of ['Cs', 'Ls', 'L1', 'L2'] as const) {
        if (ref[q] === 0) expect(ours[q]).toBe(0); else expect(rel(ours[q], ref[q]), `${q} k ${k} er ${er}`).toBeLessThan(1e-12);
      }
      // Within validity: C for 1.5 ≤ k ≤ 3.5 at εr ≤ 10 (or 3.5–10 at εr 9.6), L for k ≤ 5 (Garg & Bahl's ranges).
      expect(ours.cValid).toBe((k >= 1.5 && k <= 3.5) || (k > 3.5 && k <= 10 && Math.abs(er - 9.6) <= 0.5));
      expect(ours.lValid).toBe(k <= 5);
    }
  });
  it('low-frequency limit: the step leaves no phase and no reflection beyond the ideal step as f → 0', () => {
    const s = oracleStep(2.4e-3, 1e-3, 0.8e-3, 4.4, 35, 60, 3.4, 3.2);
    const at = (f: number) => stepResidual({ L1: s.L1, L2: s.L2, C: s.Cs, z1: 35, z2: 60, w: 2 * Math.PI * f });
    expect(Math.abs(at(1e3).phaseDeg)).toBeLessThan(1e-6);
    expect(Math.abs(at(1e9).phaseDeg)).toBeGreaterThan(0.01);
    expect(at(1e3).reflectionDb).toBeLessThan(-150);
    // First-order in f: the phase doubles with f at low frequency.
    expect(rel(at(2e6).phaseDeg / at(1e6).phaseDeg, 2)).toBeLessThan(1e-6);
  });
});

describe('the network’s tee n-port (core/network/junctionStar.ts) against plain two-port algebra', () => {
  it('three arms of line meeting at a point, the third through a transformer: same S as lines and a transformer built from elements', () => {
    // Reference: the same three lines to a common node J, built from plain line elements (n = 1 on every arm; the
    // transformer is checked on its own below against its known S).
    const f = 3e9;
    const arms = [{ model: idealLine(50, 3) }, { model: idealLine(35, 3.2) }, { model: idealLine(70, 2.9) }];
    const lengths = [2.1e-3, 1.3e-3, 3.4e-3];
    const y = starAdmittance(arms, { lengths, n: [1, 1, 1] }, f);
    const viaStar = solveNetwork({ elements: [{ kind: 'nport', id: 's', nodes: ['a', 'b', 'c'], y: () => y }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }, { name: '3', node: 'c', zRef: 50 }] }, [f]);
    const els: NetElement[] = ['a', 'b', 'c'].map((n, k) => ({ kind: 'line', id: `l${k}`, a: n, b: 'J', length: lengths[k]!, model: arms[k]!.model }));
    const viaLines = solveNetwork({ elements: els, ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }, { name: '3', node: 'c', zRef: 50 }] }, [f]);
    for (let t = 0; t < viaStar.s.length; t++) expect(Math.abs(viaStar.s[t]! - viaLines.s[t]!)).toBeLessThan(1e-12);
  });
  it('a transformer arm of vanishing length is the ideal transformer: S11 = (1 − n²)/(1 + n²), S21 = 2n/(1 + n²) (Pozar, Microwave Engineering, 4th ed., ABCD of Table 4.1 converted by Table 4.2, from memory)', () => {
    const n = 0.9, f = 1e9;
    // Two arms: arm 0 direct, arm 1 through the transformer, both 1 µm of 50 Ω line (negligible phase).
    const y = starAdmittance([{ model: idealLine(50) }, { model: idealLine(50) }], { lengths: [1e-9, 1e-9], n: [1, n] }, f);
    const r = solveNetwork({ elements: [{ kind: 'nport', id: 's', nodes: ['a', 'b'], y: () => y }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] }, [f]);
    // Port 2 is the branch side: V_branch = n·V_J.
    expect(r.s[0]).toBeCloseTo((1 - n * n) / (1 + n * n), 6);
    expect(r.s[4]).toBeCloseTo((2 * n) / (1 + n * n), 6);
    expect(r.s[6]).toBeCloseTo(-(1 - n * n) / (1 + n * n), 6);
  });
});
