/**
 * The cross-section solver against the conformal-mapping formulas of conductor-backed coplanar waveguide (strip of
 * width S between wide grounds at gap W on the top, ground plane below at h; zero thickness), as given in
 * R. N. Simons, "Coplanar Waveguide Circuits, Components, and Systems", Wiley 2001, §2.4 (after Ghione & Naldi,
 * Electronics Letters 20 (1984) pp. 179–181) — written here from memory, independently of the solver:
 *   k = S/(S + 2W),  k3 = tanh(πS/4h)/tanh(π(S + 2W)/4h),  k' = √(1 − k²)
 *   q = K(k')/K(k) · K(k3)/K(k3'),  εeff = (1 + εr·q)/(1 + q),  Z0 = 60π/√εeff / (K(k)/K(k') + K(k3)/K(k3')).
 * Where it holds: t = 0, grounds wide and at ground potential (stitched), no cover or lid, quasi-static; the
 * mapping treats the slot boundaries as magnetic walls, which the literature finds accurate to about 1–2 % when the
 * ground plane is not much closer than the slot (h ≳ W) — the cases below keep h ≥ W.
 * Check: Z0 and εeff within 2 %.
 */
import { describe, expect, it } from 'vitest';
import { solveSection } from '../../core/index.ts';

/** Complete elliptic integral of the first kind K(k) by the arithmetic–geometric mean: K = π/(2·AGM(1, √(1 − k²))). */
function ellipK(k: number): number {
  let a = 1, b = Math.sqrt(1 - k * k);
  for (let i = 0; i < 40 && Math.abs(a - b) > 1e-15 * a; i++) { const an = (a + b) / 2; b = Math.sqrt(a * b); a = an; }
  return Math.PI / (2 * a);
}

function cbcpw(er: number, h: number, S: number, W: number): { z0: number; epsEff: number } {
  const k = S / (S + 2 * W);
  const k3 = Math.tanh((Math.PI * S) / (4 * h)) / Math.tanh((Math.PI * (S + 2 * W)) / (4 * h));
  const kp = Math.sqrt(1 - k * k), k3p = Math.sqrt(1 - k3 * k3);
  const r1 = ellipK(k) / ellipK(kp), r3 = ellipK(k3) / ellipK(k3p);
  const q = r3 / r1;
  const epsEff = (1 + er * q) / (1 + q);
  return { epsEff, z0: (60 * Math.PI) / Math.sqrt(epsEff) / (r1 + r3) };
}

describe('section solver vs conductor-backed CPW conformal mapping (Simons 2001 §2.4; 2 %)', () => {
  const H = 1e-3;
  const cases: [number, number, number][] = [ // εr, S/h, W/h
    [4.4, 1, 0.2], [4.4, 0.5, 0.3], [9.8, 1, 0.5], [3.66, 2, 0.3], [2.2, 0.6, 0.15], [9.8, 0.4, 0.1],
  ];
  for (const [er, s, w] of cases) {
    it(`εr = ${er}, S/h = ${s}, W/h = ${w}`, () => {
      const m = solveSection({ er, h: H, width: s * H, t: 0, side: { gap: w * H, width: Infinity, connection: 'stitched' } }).modes[0]!;
      const ref = cbcpw(er, H, s * H, w * H);
      expect(Math.abs(m.z0 / ref.z0 - 1)).toBeLessThan(0.02);
      expect(Math.abs(m.epsEff / ref.epsEff - 1)).toBeLessThan(0.02);
    });
  }
  it('the elliptic-integral helper reproduces K(1/√2) = 1.854075 (Abramowitz & Stegun table 17.1)', () => {
    expect(ellipK(Math.SQRT1_2)).toBeCloseTo(1.8540747, 6);
  });
});
