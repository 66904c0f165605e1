import { describe, expect, it } from 'vitest';
import {
  openEndExtension, openEndCapacitance, openEndExtensionHammerstad1975, optimalMiterFraction, miterCut,
  viaInductance, viaResistance, viaGround, viaEquivalentLength, teeReferencePlanes, widthStep, arcBend,
} from '../../core/discontinuity/index.ts';
import { InputError } from '../../core/util/errors.ts';
import { hjEe, hjZ0 } from './layout-oracle.ts';

// Reference case (our own worked example): 50 Ω on εr 3.66, h 0.508 mm, t = 0: W = 1.1122 mm, u = 2.1894.
const h = 0.508e-3, er = 3.66, u = 2.1894, W = u * h;

describe('Kirschning–Jansen–Koster 1981 open end (Kirschning, Jansen & Koster 1981, Electronics Letters 17(3), checked example)', () => {
  const ee = hjEe(u, er);
  it('Δl = 0.2174 mm = 0.4280 h', () => {
    const r = openEndExtension({ u, er, eeStatic: ee, h });
    expect(r.dl * 1e3).toBeCloseTo(0.2174, 4);
    expect(r.dlOverH).toBeCloseTo(0.4280, 3);
    expect(r.warnings).toHaveLength(0);
  });
  it('Hammerstad 1975 alternative 0.2162 mm; C_oc = 24.5 fF', () => {
    expect(openEndExtensionHammerstad1975({ u, eeStatic: ee, h }) * 1e3).toBeCloseTo(0.2162, 4);
    const dl = openEndExtension({ u, er, eeStatic: ee, h }).dl;
    expect(openEndCapacitance(dl, ee, hjZ0(u, er)) * 1e15).toBeCloseTo(24.5, 1);
  });
  it('warns outside 0.01 ≤ u ≤ 100 and refuses nonsense', () => {
    expect(openEndExtension({ u: 200, er, eeStatic: hjEe(200, er), h }).warnings[0]!.code).toBe('validity');
    expect(() => openEndExtension({ u: -1, er, eeStatic: 2, h })).toThrow(InputError);
    expect(() => openEndExtension({ u, er, eeStatic: 5, h })).toThrow(/between 1 and er/);
  });
});

describe('Douville–James 1978 optimal miter (Douville & James 1978, IEEE Trans. MTT 26(3), example)', () => {
  it('M = 55.38 %, x = 0.8711 mm, legs = 1.2319 mm at u = 2.1894', () => {
    expect(optimalMiterFraction(u) * 100).toBeCloseTo(55.38, 2);
    const c = miterCut({ W, h, er, turnRad: Math.PI / 2 });
    expect(c.x * 1e3).toBeCloseTo(0.8711, 3);
    expect(c.leg * 1e3).toBeCloseTo(1.2319, 3);
    expect(c.leg).toBeCloseTo(2 * c.fraction * W, 12); // legs = 2 M W (Douville & James 1978)
    expect(c.warnings).toHaveLength(0);
  });
  it('warns below W/h = 0.25 and for turns other than 90°; a chosen fraction is used as given', () => {
    expect(miterCut({ W: 0.1 * h, h, er, turnRad: Math.PI / 2 }).warnings.some((w) => w.code === 'validity')).toBe(true);
    expect(miterCut({ W, h, er, turnRad: Math.PI / 4 }).warnings.some((w) => /90° bends/.test(w.message))).toBe(true);
    const c = miterCut({ W, h, er, turnRad: Math.PI / 2, fraction: 0.5 });
    expect(c.leg).toBeCloseTo(W, 12); // 2 · 0.5 · W
  });
  it('other angles (our own rule): the cut follows the corner, x = 2MW·sin²(θ/2)/cos(θ/2), and vanishes for a straight run', () => {
    const M = optimalMiterFraction(u);
    const c45 = miterCut({ W, h, er, turnRad: Math.PI / 4 });
    expect(c45.x).toBeCloseTo((2 * M * W * Math.sin(Math.PI / 8) ** 2) / Math.cos(Math.PI / 8), 12);
    // The cut never reaches past the centreline point P at 45°: P lies W/(2cos(θ/2)) from the outer corner.
    expect(c45.x).toBeLessThan(W / (2 * Math.cos(Math.PI / 8)));
    expect(miterCut({ W, h, er, turnRad: 0.01 }).leg).toBeLessThan(0.01 * W);
  });
});

describe('Goldfarb–Pucel 1991 via (Goldfarb & Pucel 1991, IEEE MGWL 1(6), checked examples)', () => {
  it('L = 65.1 pH (h 0.508, r 0.2 mm), 332 pH (h 1.52, r 0.3), 82.6 pH (h 0.508, r 0.15)', () => {
    expect(viaInductance(0.508e-3, 0.2e-3) * 1e12).toBeCloseTo(65.1, 1);
    expect(viaInductance(1.52e-3, 0.3e-3) * 1e12).toBeCloseTo(332, 0);
    expect(viaInductance(0.508e-3, 0.15e-3) * 1e12).toBeCloseTo(82.6, 1);
    expect(2 * Math.PI * 5e9 * viaInductance(0.508e-3, 0.2e-3)).toBeCloseTo(2.04, 2);
  });
  it('R: tp 25 µm, h 0.508, r 0.2 mm, ρ 1.72e-8: R_dc 0.297 mΩ, 7.95 mΩ at 5 GHz', () => {
    expect(viaResistance({ h: 0.508e-3, r: 0.2e-3, rho: 1.72e-8, f: 0, tp: 25e-6 }) * 1e3).toBeCloseTo(0.297, 3);
    expect(viaResistance({ h: 0.508e-3, r: 0.2e-3, rho: 1.72e-8, f: 5e9, tp: 25e-6 }) * 1e3).toBeCloseTo(7.95, 2);
  });
  it('common practice check: 0.8 mm drill through 1.6 mm is ≈0.30 nH, 4.6 Ω at 2.45 GHz, ≈5° of a 50 Ω stub', () => {
    const g = viaGround({ h: 1.6e-3, drill: 0.8e-3, count: 1, f: 2.45e9, rho: 1.72e-8 });
    expect(g.L * 1e9).toBeCloseTo(0.30, 2);
    // The expected figures are rounded to two figures ("0.30 nH: 4.6 Ω … 5°"), so compare at that precision.
    expect(Math.abs(g.X - 4.6)).toBeLessThan(0.1);
    const beta = 1; // per radian: Δl·β in radians
    expect(Math.abs(viaEquivalentLength(g.X, 50, beta) * 180 / Math.PI - 5)).toBeLessThan(0.5);
    const two = viaGround({ h: 1.6e-3, drill: 0.8e-3, count: 2, f: 2.45e9, rho: 1.72e-8 });
    expect(two.L).toBeCloseTo(g.L / 2, 15);
    expect(two.warnings.length).toBe(1);
  });
});

describe('Hammerstad 1981 T-junction planes (Hammerstad, "Computer-aided design of microstrip couplers with accurate discontinuity models", IEEE MTT-S Digest 1981 (from memory); unchecked-form example; advisory)', () => {
  it('Z1 = Z2 = 50 Ω at 2.45 GHz: D = 2.264 mm, d1 = 0.124 mm, d2 = 0.697 mm, n² = 0.9985', () => {
    const ee = hjEe(u, er);
    const t = teeReferencePlanes({ z1: 50, z2: 50, ee1: ee, ee2: ee, h, f: 2.45e9 });
    expect(t.D1 * 1e3).toBeCloseTo(2.264, 2);
    expect(t.d1 * 1e3).toBeCloseTo(0.124, 3);
    expect(t.d2 * 1e3).toBeCloseTo(0.697, 2);
    expect(t.n2).toBeCloseTo(0.9985, 3);
  });
});

describe('Garg–Bahl 1978 width step (Garg & Bahl 1978, Int. J. Electronics 45(1), example)', () => {
  it('25 → 50 Ω (W1 2.9682, W2 1.1122 mm): Cs 20.2 fF, Ls 18.4 pH, L1 6.3 pH, L2 12.1 pH', () => {
    const W1 = 2.9682e-3, W2 = 1.1122e-3;
    const s = widthStep({ W1, W2, h, er, z1: 25, z2: 50, ee1: hjEe(W1 / h, er), ee2: hjEe(W2 / h, er) });
    expect(s.Cs * 1e15).toBeCloseTo(20.2, 1);
    expect(s.Ls * 1e12).toBeCloseTo(18.4, 1);
    expect(s.L1 * 1e12).toBeCloseTo(6.3, 1);
    expect(s.L2 * 1e12).toBeCloseTo(12.1, 1);
  });
});

describe('arc bend (common practice: a line of its centreline arc length)', () => {
  it('90° with R = 3 mm: tangent R tan 45° = 3 mm, arc 3π/2 mm; warns under 3 W; refuses R ≤ W/2', () => {
    const a = arcBend({ R: 3e-3, W: 1e-3, turnRad: Math.PI / 2 });
    expect(a.tangent).toBeCloseTo(3e-3, 12);
    expect(a.arcLength).toBeCloseTo(1.5 * Math.PI * 1e-3, 12);
    expect(a.warnings).toHaveLength(0);
    expect(arcBend({ R: 2e-3, W: 1e-3, turnRad: Math.PI / 2 }).warnings).toHaveLength(1);
    expect(() => arcBend({ R: 0.4e-3, W: 1e-3, turnRad: 1 })).toThrow(InputError);
  });
});
