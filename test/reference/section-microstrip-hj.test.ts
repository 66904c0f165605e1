/**
 * The cross-section solver against plain microstrip: Hammerstad & Jensen, "Accurate models for microstrip
 * computer-aided design", IEEE MTT-S Digest 1980, pp. 407–409 (eqs. 1–8; in core/line, itself checked against the
 * paper's stated accuracy and scikit-rf). The paper states Z01 to 0.01–0.03 % and εe to 0.2 % for 0.01 ≤ W/h ≤ 100,
 * εr ≤ 128 at t = 0; its thickness correction has no stated bound (within 1 % of field solutions for t/h ≤ 0.28).
 * Checks: Z0 and εeff within 0.5 % at t = 0 over W/h 0.1–10 and εr 2–13; within 1 % with copper thickness.
 */
import { describe, expect, it } from 'vitest';
import { hammerstadJensenStatic, solveSection } from '../../core/index.ts';

const H = 1e-3;

describe('section solver vs Hammerstad–Jensen 1980 microstrip (t = 0: 0.5 %)', () => {
  const us = [0.1, 0.3, 1, 3, 10];
  const ers = [2, 4.4, 9.8, 13];
  for (const u of us) for (const er of ers) {
    it(`W/h = ${u}, εr = ${er}`, () => {
      const r = solveSection({ er, h: H, width: u * H, t: 0 });
      const m = r.modes[0]!;
      const hj = hammerstadJensenStatic(u, 0, er);
      expect(Math.abs(m.z0 / hj.z0 - 1)).toBeLessThan(0.005);
      expect(Math.abs(m.epsEff / hj.epsEff - 1)).toBeLessThan(0.005);
    });
  }
});

describe('section solver vs Hammerstad–Jensen 1980 with copper thickness (1 %)', () => {
  const cases: [number, number, number][] = [[0.3, 4.4, 0.022], [1, 3.66, 0.069], [2, 4.4, 0.044], [5, 9.8, 0.035], [1, 2.2, 0.14]];
  for (const [u, er, tn] of cases) {
    it(`W/h = ${u}, εr = ${er}, t/h = ${tn}`, () => {
      const m = solveSection({ er, h: H, width: u * H, t: tn * H }, { loss: false }).modes[0]!;
      const hj = hammerstadJensenStatic(u, tn, er);
      expect(Math.abs(m.z0 / hj.z0 - 1)).toBeLessThan(0.01);
      expect(Math.abs(m.epsEff / hj.epsEff - 1)).toBeLessThan(0.01);
    });
  }
});
