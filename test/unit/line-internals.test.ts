/**
 * Checks of the implementation against itself where the physics gives no outside number: the analytic derivative
 * in Wheeler's rule against finite differences of the same air-line model, the remembered (cached) terms against
 * fresh evaluation in any call order, and the wideband Debye model against its defining equation.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeLine, synthesizeLine, widebandDebyeAt, widebandDebyeEpsInf, validateSubstrate, substrateWithDefaults, InputError, type SubstrateSpec } from '../../core/index.ts';
import { hjDeltaU1, hjZ01 } from '../../core/line/hammerstad-jensen-1980.ts';
import { wheelerIncrementalAlphaC } from '../../core/line/wheeler-incremental-inductance.ts';
import { ETA0 } from '../../core/units/constants.ts';
import { fillingFactorAlphaD } from '../../core/line/filling-factor-dielectric-loss.ts';

describe("Wheeler's incremental-inductance rule (Wheeler 1942; Pucel, Massé, Hartwig 1968)", () => {
  // Z0a(W, h, t): the Hammerstad–Jensen air line with thickness, Z01(u + Δu1).
  const z0a = (W: number, h: number, t: number) => hjZ01(W / h + hjDeltaU1(W / h, t / h));
  it('the analytic bracket equals central differences of Z0a over W, h and t (relative step 1e-4, methods §3.2)', () => {
    for (const [W, h, t] of [[1.0734e-3, 0.508e-3, 35e-6], [0.2e-3, 1.6e-3, 17.5e-6], [5e-3, 0.79e-3, 70e-6], [30e-6, 0.254e-3, 5e-6]] as const) {
      const d = (fn: (k: number) => number, x: number) => (fn(1 + 1e-4) - fn(1 - 1e-4)) / (2e-4 * x);
      const dW = d((k) => z0a(W * k, h, t), W); const dh = d((k) => z0a(W, h * k, t), h); const dt = d((k) => z0a(W, h, t * k), t);
      const rs = 0.02606; const z0 = 50;
      const numeric = (rs / (ETA0 * z0)) * (dh - dW - dt);
      expect(Math.abs(wheelerIncrementalAlphaC(W / h, t / h, h, rs, z0) / numeric - 1)).toBeLessThan(1e-6);
    }
  });
  it('the analysis uses the same value (no roughness, f high enough that the DC term is negligible)', () => {
    const sub: SubstrateSpec = { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0, sigma: 5.8e7, roughness: 0 };
    const r = analyzeLine(sub, 1.0734e-3, 20e9);
    const rs = Math.sqrt((Math.PI * 20e9 * 1.25663706212e-6) / 5.8e7);
    const direct = wheelerIncrementalAlphaC(1.0734e-3 / 0.508e-3, 35e-6 / 0.508e-3, 0.508e-3, rs, r.z0Static);
    expect(Math.abs(r.alphaC / direct - 1)).toBeLessThan(1e-4);
  });
});

describe('the analysis uses the model files it cites', () => {
  it('dielectric loss equals the filling-factor function with εe(f) (Welch & Pratt 1966 form)', () => {
    for (const [er, h, w, f, tand] of [[4.4, 1.6e-3, 3e-3, 5.8e9, 0.02], [2.2, 0.787e-3, 2.4e-3, 10e9, 0.0009], [9.8, 0.635e-3, 0.6e-3, 1e9, 0.0002]] as const) {
      const r = analyzeLine({ er, h, t: 35e-6, tanDelta: tand, sigma: 5.8e7, roughness: 0 }, w, f);
      expect(Math.abs(r.alphaD / fillingFactorAlphaD(f, er, r.epsEff, tand) - 1)).toBeLessThan(1e-14);
    }
  });
});

describe('remembered terms never leak between calls', () => {
  it('results are identical whatever the call order (fresh vs shuffled, mixed substrates, f and models)', () => {
    const subs: SubstrateSpec[] = [
      { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1e-6 },
      { er: 2.2, h: 0.787e-3, t: 0, tanDelta: 0.0009, sigma: 5.8e7, roughness: 0 },
      { er: 9.8, h: 0.635e-3, t: 5e-6, tanDelta: 0.0002, sigma: 4.1e7, roughness: 0.1e-6, dielectricModel: { kind: 'wideband-debye', fMeasure: 1e10 } },
    ];
    const cases: [number, number, number, 'kirschning-jansen' | 'hammerstad-jensen' | 'none'][] = [];
    for (let i = 0; i < 300; i++) cases.push([i % 3, 0.3e-3 + (i % 17) * 0.2e-3, [0, 1e9, 5.8e9, 10e9][i % 4]!, (['kirschning-jansen', 'hammerstad-jensen', 'none'] as const)[i % 3]!]);
    const run = (order: number[]) => {
      const out = new Map<number, string>();
      for (const i of order) {
        const [s, w, f, d] = cases[i]!;
        const r = analyzeLine(subs[s]!, w, f, { dispersion: d });
        const z = synthesizeLine(subs[s]!, 40 + (i % 50), f, { dispersion: d });
        out.set(i, JSON.stringify([r, z.width]));
      }
      return out;
    };
    const order = cases.map((_, i) => i);
    const first = run(order);
    fc.assert(fc.property(fc.shuffledSubarray(order, { minLength: order.length }), (perm) => {
      const second = run(perm);
      for (const i of order) expect(second.get(i)).toBe(first.get(i));
    }), { seed: 7, numRuns: 5 });
  });
});

describe('wideband Debye dielectric (Djordjevic et al., IEEE Trans. EMC 43(4), 2001, eq. as recalled)', () => {
  it('reproduces εr and tanδ at the measurement frequency', () => {
    const d = widebandDebyeAt(4.4, 0.02, 1e9, 1e9);
    expect(d.er).toBeCloseTo(4.4, 12);
    expect(d.tanDelta).toBeCloseTo(0.02, 12);
  });
  it("is the model's own equation: ε = ε∞ + K·ln((f2 + jf)/(f1 + jf)) with K from the measured loss", () => {
    const f1 = 1e3; const f2 = 1e12; const f0 = 1e9;
    const K = (4.4 * 0.02) / (Math.atan(f0 / f1) - Math.atan(f0 / f2));
    const epsInf = widebandDebyeEpsInf(4.4, 0.02, f0);
    for (const f of [1e4, 1e6, 2.45e9, 5.8e9, 1e11]) {
      const re = epsInf + K * 0.5 * Math.log((f2 * f2 + f * f) / (f1 * f1 + f * f));
      const im = K * (Math.atan(f / f1) - Math.atan(f / f2));
      const d = widebandDebyeAt(4.4, 0.02, f0, f);
      expect(d.er).toBeCloseTo(re, 12);
      expect(d.tanDelta).toBeCloseTo(im / re, 12);
    }
  });
  it('inside the band εr falls by about (2·ln10/π)·ε″ per decade (the causal partner of a flat loss)', () => {
    const a = widebandDebyeAt(4.4, 0.02, 1e9, 1e8); const b = widebandDebyeAt(4.4, 0.02, 1e9, 1e9);
    expect((a.er - b.er) / ((2 * Math.LN10 / Math.PI) * 4.4 * 0.02)).toBeCloseTo(1, 2);
    // Glass-epoxy entered as 4.4 at 1 GHz comes out near 4.3 at 5.8 GHz.
    expect(widebandDebyeAt(4.4, 0.02, 1e9, 5.8e9).er).toBeCloseTo(4.30, 2);
  });
  it('switches on through the substrate and moves εeff; refuses a fit with ε∞ < 1', () => {
    const base: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };
    const deb: SubstrateSpec = { ...base, dielectricModel: { kind: 'wideband-debye', fMeasure: 1e9 } };
    expect(analyzeLine(deb, 3e-3, 1e9).epsEff).toBeCloseTo(analyzeLine(base, 3e-3, 1e9).epsEff, 12);
    expect(analyzeLine(deb, 3e-3, 5.8e9).epsEff).toBeLessThan(analyzeLine(base, 3e-3, 5.8e9).epsEff);
    expect(() => validateSubstrate({ ...base, er: 1.2, tanDelta: 0.4, dielectricModel: { kind: 'wideband-debye', fMeasure: 1e9 } })).toThrow(InputError);
    expect(() => validateSubstrate({ ...base, dielectricModel: { kind: 'wideband-debye', fMeasure: 1e13 } })).toThrow(/between fLow/);
  });
});

describe('substrate defaults', () => {
  it('fills 35 µm copper (1 oz, common practice) and annealed copper 5.8e7 S/m (100 %IACS), and validates', () => {
    const s = substrateWithDefaults({ er: 4.4, h: 1.6e-3 });
    expect(s).toEqual({ er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0, sigma: 5.8e7, roughness: 0 });
    expect(substrateWithDefaults({ er: 4.4, h: 1.6e-3, t: 0 }).t).toBe(0);
    expect(() => substrateWithDefaults({ er: 0.5, h: 1.6e-3 })).toThrow(/substrate\.er/);
  });
});
