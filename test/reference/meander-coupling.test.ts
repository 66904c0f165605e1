/**
 * The meander's coupling share (core/network/equalize/coupling.ts) against an independent computation from the
 * coupled-line model: scripts/reference/meander_fold.py rebuilds the folded pair (a U of two coupled legs joined at
 * the far end) from the even/odd-mode equations directly (mode Z-matrices, the even/odd split of the strip
 * terminals, the join added and the far ends eliminated) with numpy under Debian's python3, sharing no code with the
 * core. Mode figures: the Kirschning–Jansen 1984 static modes of core/line (dispersion 'none', as coupling.ts uses).
 */
import { describe, expect, it } from 'vitest';
import { analyzeCoupled, meanderCouplingDeg, modeConstants } from '../../core/index.ts';
import { python } from './network-oracle.ts';

const sub = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };

function modes(W: number, gap: number, f: number) {
  const c = analyzeCoupled(sub, W, gap, f, { dispersion: 'none' });
  const even = modeConstants(c.even.z0, c.even.epsEff, c.even.alphaC, c.even.alphaD, f);
  const odd = modeConstants(c.odd.z0, c.odd.epsEff, c.odd.alphaC, c.odd.alphaD, f);
  // The join and the reference: the single strip as the same model gives it (mean of the modes).
  const z = Math.sqrt(c.even.z0 * c.odd.z0);
  const join = modeConstants(z, ((Math.sqrt(c.even.epsEff) + Math.sqrt(c.odd.epsEff)) / 2) ** 2, (c.even.alphaC + c.odd.alphaC) / 2, (c.even.alphaD + c.odd.alphaD) / 2, f);
  const pack = (m: { zc: { re: number; im: number }; gamma: { re: number; im: number } }) => ({ zc: [m.zc.re, m.zc.im], gamma: [m.gamma.re, m.gamma.im] });
  return { even: pack(even), odd: pack(odd), join: pack(join), zref: z };
}

describe('meander coupling share against the even/odd-mode equations (numpy, Debian python3)', () => {
  const cases = [
    { W: 0.7e-3, gaps: 3, H: 5e-3, f: 5.8e9 },
    { W: 0.7e-3, gaps: 3, H: 10e-3, f: 5.8e9 },
    { W: 3e-3, gaps: 2, H: 8e-3, f: 2.45e9 },
    { W: 1.5e-3, gaps: 4, H: 12e-3, f: 3.5e9 },
  ];
  it('one U: the share agrees to 0.01° in every case', () => {
    const input = cases.flatMap((c) => {
      const pitch = c.gaps * sub.h + c.W, leg = c.H - c.W;
      return [
        { ...modes(c.W, 100 * sub.h, c.f), leg, joinLength: pitch },
        { ...modes(c.W, c.gaps * sub.h, c.f), leg, joinLength: pitch },
      ];
    });
    const out = JSON.parse(python('meander_fold.py', JSON.stringify({ cases: input }))) as { phase: number[] };
    cases.forEach((c, i) => {
      const far = out.phase[2 * i]!, near = out.phase[2 * i + 1]!;
      let d = far - near;
      d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
      const oracle = (d * 180) / Math.PI;
      const ours = meanderCouplingDeg(sub, c.W, { kind: 'serpentine', bumps: 1, height: c.H, pitch: c.gaps * sub.h + c.W }, c.f);
      expect(Math.abs(ours - oracle), `case ${i}: ours ${ours}, oracle ${oracle}`).toBeLessThan(0.01);
      expect(Math.abs(oracle)).toBeGreaterThan(0.01); // the case has coupling to measure
    });
  });
  it('k bumps count 2k − 1 neighbouring leg pairs (first order)', () => {
    const one = meanderCouplingDeg(sub, 0.7e-3, { kind: 'serpentine', bumps: 1, height: 6e-3, pitch: 3 * sub.h + 0.7e-3 }, 5.8e9);
    const three = meanderCouplingDeg(sub, 0.7e-3, { kind: 'serpentine', bumps: 3, height: 6e-3, pitch: 3 * sub.h + 0.7e-3 }, 5.8e9);
    expect(three).toBeCloseTo(5 * one, 12);
  });
});
