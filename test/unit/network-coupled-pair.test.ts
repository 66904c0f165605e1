/**
 * The coupled pair's four-port (core/network/coupledPair.ts) in the nodal solver.
 * Outside check: the textbook closed form of an ideal (TEM, equal mode velocities) coupled-line coupler, D. M. Pozar,
 * Microwave Engineering, 4th ed., Wiley, 2012, §7.6: with Z0 = √(Z0e·Z0o) and C = (Z0e − Z0o)/(Z0e + Z0o),
 *   V3/V1 = jC·tanθ/(√(1 − C²) + j·tanθ),  V2/V1 = √(1 − C²)/(√(1 − C²)·cosθ + j·sinθ),  S11 = S41 = 0,
 * for port 1 driven, 2 = through, 3 = coupled (beside 1), 4 = isolated.
 */
import { describe, expect, it } from 'vitest';
import { coupledPairY, modeConstants, solveNetwork, sAt, analyzeCoupled, type Netlist } from '../../core/index.ts';

const C0 = 299792458;
function idealPair(z0e: number, z0o: number, ee: number, length: number, zRef: number): Netlist {
  const y = (f: number) => coupledPairY(modeConstants(z0e, ee, 0, 0, f), modeConstants(z0o, ee, 0, 0, f), length);
  return {
    elements: [{ kind: 'nport', id: 'pair', nodes: ['n1', 'n2', 'n3', 'n4'], y }],
    ports: ['n1', 'n2', 'n3', 'n4'].map((n) => ({ name: n, node: n, zRef })),
  };
}

describe('coupled-line four-port against Pozar §7.6', () => {
  it('an ideal 10 dB coupler matches the closed form to 1e-9 over θ = 5° … 175°', () => {
    const z0 = 50, c = 10 ** (-10 / 20);
    const z0e = z0 * Math.sqrt((1 + c) / (1 - c)), z0o = z0 * Math.sqrt((1 - c) / (1 + c));
    const ee = 2.5, f0 = 3e9, length = C0 / (4 * f0 * Math.sqrt(ee));
    const freqs = Array.from({ length: 35 }, (_, i) => (f0 * (5 + 5 * i)) / 90);
    const r = solveNetwork(idealPair(z0e, z0o, ee, length, z0), freqs);
    const k = Math.sqrt(1 - c * c);
    freqs.forEach((f, i) => {
      const th = (Math.PI / 2) * (f / f0);
      const t = Math.tan(th);
      // V3/V1 = jC t/(k + j t)
      const den = k * k + t * t;
      const v3 = { re: (c * t * t) / den, im: (c * t * k) / den };
      // V2/V1 = k/(k cosθ + j sinθ)
      const d2 = (k * Math.cos(th)) ** 2 + Math.sin(th) ** 2;
      const v2 = { re: (k * k * Math.cos(th)) / d2, im: (-k * Math.sin(th)) / d2 };
      const s21 = sAt(r, i, 1, 0), s31 = sAt(r, i, 2, 0), s41 = sAt(r, i, 3, 0), s11 = sAt(r, i, 0, 0);
      expect(Math.abs(s21.re - v2.re) + Math.abs(s21.im - v2.im)).toBeLessThan(1e-9);
      expect(Math.abs(s31.re - v3.re) + Math.abs(s31.im - v3.im)).toBeLessThan(1e-9);
      expect(Math.hypot(s41.re, s41.im)).toBeLessThan(1e-9);
      expect(Math.hypot(s11.re, s11.im)).toBeLessThan(1e-9);
    });
  });
  it('a lossy microstrip pair is reciprocal and passive, and a far-apart pair hardly couples', () => {
    const sub = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1e-6 };
    const net = (gap: number): Netlist => ({
      elements: [{ kind: 'nport', id: 'p', nodes: ['a', 'b', 'c', 'd'], y: (f) => {
        const r = analyzeCoupled(sub, 3e-3, gap, f);
        return coupledPairY(modeConstants(r.even.z0, r.even.epsEff, r.even.alphaC, r.even.alphaD, f), modeConstants(r.odd.z0, r.odd.epsEff, r.odd.alphaC, r.odd.alphaD, f), 20e-3);
      } }],
      ports: ['a', 'b', 'c', 'd'].map((n) => ({ name: n, node: n, zRef: 50 })),
    });
    const freqs = [0.5e9, 1e9, 2.4e9, 4e9];
    const r = solveNetwork(net(0.3e-3), freqs);
    for (let k = 0; k < freqs.length; k++) {
      for (let i = 0; i < 4; i++) {
        let col = 0;
        for (let j = 0; j < 4; j++) {
          const a = sAt(r, k, i, j), b = sAt(r, k, j, i);
          expect(Math.abs(a.re - b.re) + Math.abs(a.im - b.im)).toBeLessThan(1e-12);
          col += a.re * a.re + a.im * a.im;
        }
        expect(col).toBeLessThan(1);
      }
    }
    const far = solveNetwork(net(40e-3), [2.4e9]);
    const s31 = sAt(far, 0, 2, 0);
    expect(20 * Math.log10(Math.hypot(s31.re, s31.im))).toBeLessThan(-50);
  });
});
