/**
 * Coupled microstrip pair (core/line/coupled*.ts, kirschning-jansen-1984-coupled.ts, getsinger-1973-*.ts).
 * Outside checks, each named: the Kirschning–Jansen 1984 static equations (IEEE Trans. MTT 32(1), 1984) by a second,
 * independent transcription written here with Math.pow and no shared code; Getsinger's 1973 per-mode dispersion
 * form (IEEE Trans. MTT 21(3), 1973) likewise; the textbook coupler relations of D. M. Pozar, Microwave Engineering,
 * 4th ed., 2012, §7.6; physical limits (a far-apart pair is two single lines).
 */
import { describe, expect, it } from 'vitest';
import { analyzeCoupled, synthesizeCoupled, modesForCoupling, analyzeLine, InputError, type SubstrateSpec } from '../../core/index.ts';
import { kjCoupledStatic, kjStatic } from '../../core/line/kirschning-jansen-1984-coupled.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const ETA0_ = 376.730313668; // μ0·c0, CODATA 2018
const SUB: SubstrateSpec = { er: 3.66, h: 0.508e-3, t: 0, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 };

/** Second transcription of the paper's static equations (and the Hammerstad–Jensen 1980 zero-thickness line). */
function paper(u: number, g: number, er: number) {
  const fu = 6 + (2 * Math.PI - 6) * Math.exp(-Math.pow(30.666 / u, 0.7528));
  const Z01 = (ETA0_ / (2 * Math.PI)) * Math.log(fu / u + Math.sqrt(1 + Math.pow(2 / u, 2)));
  const a = (x: number) => 1 + Math.log((Math.pow(x, 4) + Math.pow(x / 52, 2)) / (Math.pow(x, 4) + 0.432)) / 49 + Math.log(1 + Math.pow(x / 18.1, 3)) / 18.7;
  const b = 0.564 * Math.pow((er - 0.9) / (er + 3), 0.053);
  const eeOf = (x: number) => (er + 1) / 2 + ((er - 1) / 2) * Math.pow(1 + 10 / x, -a(x) * b);
  const ee = eeOf(u);
  const Z0 = Z01 / Math.sqrt(ee);
  const v = u * (20 + g * g) / (10 + g * g) + g * Math.exp(-g);
  const eee = eeOf(v);
  const ao = 0.7287 * (ee - (er + 1) / 2) * (1 - Math.exp(-0.179 * u));
  const bo = 0.747 * er / (0.15 + er);
  const co = bo - (bo - 0.207) * Math.exp(-0.414 * u);
  const d0 = 0.593 + 0.694 * Math.exp(-0.562 * u);
  const eeo = ((er + 1) / 2 + ao - ee) * Math.exp(-co * Math.pow(g, d0)) + ee;
  const Q1 = 0.8695 * Math.pow(u, 0.194);
  const Q2 = 1 + 0.7519 * g + 0.189 * Math.pow(g, 2.31);
  const Q3 = 0.1975 + Math.pow(16.6 + Math.pow(8.4 / g, 6), -0.387) + Math.log(Math.pow(g, 10) / (1 + Math.pow(g / 3.4, 10))) / 241;
  const Q4 = (2 * Q1 / Q2) / (Math.exp(-g) * Math.pow(u, Q3) + (2 - Math.exp(-g)) * Math.pow(u, -Q3));
  const Q5 = 1.794 + 1.14 * Math.log(1 + 0.638 / (g + 0.517 * Math.pow(g, 2.43)));
  const Q6 = 0.2305 + Math.log(Math.pow(g, 10) / (1 + Math.pow(g / 5.8, 10))) / 281.3 + Math.log(1 + 0.598 * Math.pow(g, 1.154)) / 5.1;
  const Q7 = (10 + 190 * g * g) / (1 + 82.3 * Math.pow(g, 3));
  const Q8 = Math.exp(-6.5 - 0.95 * Math.log(g) - Math.pow(g / 0.15, 5));
  const Q9 = Math.log(Q7) * (Q8 + 1 / 16.5);
  const Q10 = Q4 - (Q5 / Q2) * Math.exp(Q6 * Math.log(u) * Math.pow(u, -Q9));
  const Z0e = Z0 * Math.sqrt(ee / eee) / (1 - (Z0 / ETA0_) * Math.sqrt(ee) * Q4);
  const Z0o = Z0 * Math.sqrt(ee / eeo) / (1 - (Z0 / ETA0_) * Math.sqrt(ee) * Q10);
  return { eee, eeo, Z0e, Z0o, Z0, ee };
}

describe('Kirschning–Jansen 1984 static even/odd model', () => {
  it('equals an independent transcription of the paper over its stated range (0.1 ≤ u, g ≤ 10, εr ≤ 18)', () => {
    let seed = 7;
    const rnd = () => { seed = (seed * 16807) % 2147483647; return seed / 2147483647; };
    for (let i = 0; i < 400; i++) {
      const u = 0.1 * Math.pow(100, rnd()), g = 0.1 * Math.pow(100, rnd()), er = 1.5 + 16.5 * rnd();
      kjCoupledStatic(u, g, er);
      const p = paper(u, g, er);
      expect(rel(kjStatic.eeE, p.eee)).toBeLessThan(1e-10);
      expect(rel(kjStatic.eeO, p.eeo)).toBeLessThan(1e-10);
      expect(rel(kjStatic.z0E, p.Z0e)).toBeLessThan(1e-10);
      expect(rel(kjStatic.z0O, p.Z0o)).toBeLessThan(1e-10);
    }
  });
  it('orders the modes as physics does: Z0e > Z0 > Z0o, εe,e > εe,o, and both → the single line as the gap grows', () => {
    for (const u of [0.2, 1, 4]) for (const er of [2.2, 4.4, 10.2]) {
      const near = analyzeCoupled({ ...SUB, er }, u * SUB.h, 0.3 * SUB.h, 0);
      const single = analyzeLine({ ...SUB, er }, u * SUB.h, 0);
      expect(near.even.z0).toBeGreaterThan(single.z0);
      expect(near.odd.z0).toBeLessThan(single.z0);
      expect(near.even.epsEff).toBeGreaterThan(near.odd.epsEff);
      const far = analyzeCoupled({ ...SUB, er }, u * SUB.h, 40 * SUB.h, 0);
      expect(rel(far.even.z0, single.z0)).toBeLessThan(2e-3);
      expect(rel(far.odd.z0, single.z0)).toBeLessThan(2e-3);
      expect(rel(far.even.epsEff, single.epsEff)).toBeLessThan(2e-3);
      expect(rel(far.odd.epsEff, single.epsEff)).toBeLessThan(2e-3);
    }
  });
  it('warns outside the stated range and for copper thickness, never silently', () => {
    expect(analyzeCoupled(SUB, 0.05 * SUB.h, 0.5 * SUB.h, 0).warnings.some((w) => w.source === 'kirschning-jansen-1984' && w.code === 'validity')).toBe(true);
    expect(analyzeCoupled(SUB, SUB.h, SUB.h, 0).warnings).toEqual([]);
    expect(analyzeCoupled({ ...SUB, t: 35e-6 }, SUB.h, SUB.h, 0).warnings.some((w) => /zero copper thickness/.test(w.message))).toBe(true);
  });
  it('refuses a gap below h/100 with an InputError naming the field', () => {
    expect(() => analyzeCoupled(SUB, SUB.h, 0.001 * SUB.h, 0)).toThrow(InputError);
    try { analyzeCoupled(SUB, SUB.h, 0, 0); } catch (e) { expect((e as InputError).field).toBe('spacing'); }
  });
});

describe('Getsinger 1973 dispersion per mode (even with Z0e/2, odd with 2·Z0o)', () => {
  it('matches the formula εe(f) = εr − (εr − εe0)/(1 + G (f/fp)²), fp = Z/(2 μ0 h), G = 0.6 + 0.009 Z', () => {
    const r = analyzeCoupled(SUB, SUB.h, 0.4 * SUB.h, 12e9);
    const mu0 = 1.25663706212e-6;
    const check = (eps0: number, Z: number) => {
      const fp = Z / (2 * mu0 * SUB.h), G = 0.6 + 0.009 * Z;
      return SUB.er - (SUB.er - eps0) / (1 + G * (12e9 / fp) ** 2);
    };
    expect(rel(r.even.epsEff, check(r.even.epsEffStatic, r.even.z0 / 2))).toBeLessThan(1e-13);
    expect(rel(r.odd.epsEff, check(r.odd.epsEffStatic, 2 * r.odd.z0))).toBeLessThan(1e-13);
    expect(r.even.epsEff).toBeGreaterThan(r.even.epsEffStatic);
    const none = analyzeCoupled(SUB, SUB.h, 0.4 * SUB.h, 12e9, { dispersion: 'none' });
    expect(none.even.epsEff).toBe(none.even.epsEffStatic);
    expect(r.models.dispersion).toBe('getsinger');
  });
});

describe('losses per mode', () => {
  const CU: SubstrateSpec = { ...SUB, t: 35e-6 };
  it('a far-apart pair loses what a single line loses (Wheeler rule ratio → 1)', () => {
    const far = analyzeCoupled(CU, 1.1e-3, 40 * SUB.h, 5e9);
    const single = analyzeLine(CU, 1.1e-3, 5e9);
    expect(rel(far.even.alphaC, single.alphaC)).toBeLessThan(5e-3);
    expect(rel(far.odd.alphaC, single.alphaC)).toBeLessThan(5e-3);
  });
  it('the odd mode loses more conductor power than the even mode in a close pair (current crowds on the inner edges)', () => {
    const r = analyzeCoupled(CU, SUB.h, 0.2 * SUB.h, 5e9);
    expect(r.odd.alphaC).toBeGreaterThan(r.even.alphaC);
    expect(r.even.alphaC).toBeGreaterThan(0);
  });
  it('dielectric loss by the filling-factor form (Welch and Pratt 1966) with each mode\'s εe', () => {
    const r = analyzeCoupled(CU, SUB.h, 0.5 * SUB.h, 5e9);
    const c0 = 299792458;
    for (const m of [r.even, r.odd]) {
      const want = (Math.PI * 5e9 / c0) * (SUB.er / Math.sqrt(m.epsEff)) * ((m.epsEff - 1) / (SUB.er - 1)) * SUB.tanDelta;
      expect(rel(m.alphaD, want)).toBeLessThan(1e-12); // written with one division in the core
    }
  });
});

describe('synthesis', () => {
  it('Pozar §7.6: Z0e = Z0·√((1 + C)/(1 − C)), Z0o = Z0·√((1 − C)/(1 + C)); a 20 dB, 50 Ω coupler needs 55.28 / 45.23 Ω (Pozar\'s worked example, from memory)', () => {
    const m = modesForCoupling(20, 50);
    expect(m.z0Even).toBeCloseTo(55.28, 2);
    expect(m.z0Odd).toBeCloseTo(45.23, 2);
    expect(rel(m.z0Even * m.z0Odd, 2500)).toBeLessThan(1e-14);
  });
  it('the synthesised (W, s) analyse back to the target coupling and system impedance to 1e-9', () => {
    for (const sub of [SUB, { ...SUB, er: 4.4, h: 1.6e-3 }, { ...SUB, er: 10.2, h: 0.635e-3 }]) {
      for (const c of [8, 10, 15, 20, 30]) {
        const r = synthesizeCoupled(sub, { couplingDb: c, z0: 50 }, 2e9);
        expect(Math.abs(r.couplingDb - c)).toBeLessThan(1e-8);
        expect(rel(r.z0System, 50)).toBeLessThan(1e-9);
      }
    }
    const r = synthesizeCoupled(SUB, { z0Even: 70, z0Odd: 38 }, 0);
    expect(rel(r.even.z0, 70)).toBeLessThan(1e-9);
    expect(rel(r.odd.z0, 38)).toBeLessThan(1e-9);
  });
  it('an unreachable coupling is an InputError that says the tightest coupling the substrate can make', () => {
    try { synthesizeCoupled(SUB, { couplingDb: 3, z0: 50 }, 0); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).code).toBe('unreachable-target');
      expect((e as InputError).expected).toMatch(/from \d+\.\d+ dB \(gap 0\.01·h\)/);
    }
  });
});
