/**
 * Properties of the line model over its whole accepted input box (fast-check, fixed seeds so CI is repeatable).
 * Physical facts checked (common practice / textbook behaviour of microstrip): Z0 falls as W grows; εe(f) rises
 * with f towards εr; total loss rises with f; synthesis inverts analysis.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  analyzeLine, synthesizeLine, lineConstants, modeThresholds, validateSubstrate, dielectricAt, InputError, SUBSTRATE_PRESETS, type SubstrateSpec, type LineResult,
} from '../../core/index.ts';

const SEED = 20261201;
const sub = fc.record({
  er: fc.double({ min: 1.001, max: 128, noNaN: true }),
  h: fc.double({ min: 1e-6, max: 0.1, noNaN: true }),
  tRel: fc.double({ min: 0, max: 1, noNaN: true }),
  tanDelta: fc.double({ min: 0, max: 0.5, noNaN: true }),
  sigma: fc.double({ min: 1e3, max: 1e9, noNaN: true }),
  roughness: fc.double({ min: 0, max: 1e-4, noNaN: true }),
}).map(({ tRel, ...s }): SubstrateSpec => {
  // Accepted thickness: 0, or 1 nm up to min(1 mm, h).
  const tMax = Math.min(1e-3, s.h);
  return { ...s, t: tRel < 0.1 ? 0 : 1e-9 + (tMax - 1e-9) * (tRel - 0.1) / 0.9 };
});
/** Twice the TE1 onset c0/(4h√(εr−1)): the highest frequency the quasi-TEM models accept. */
const fQuasiTem = (s: SubstrateSpec) => (2 * 299792458) / (4 * s.h * Math.sqrt(s.er - 1));
/** Accepted frequencies: 0 (static) or 1 Hz up to min(1 THz, 2·f_TE1), drawn on a log scale as a fraction of the top. */
const freqFraction = fc.oneof(fc.constant(-1), fc.constant(0), fc.double({ min: -12, max: 0, noNaN: true }));
const freqOf = (s: SubstrateSpec, e: number) => (e === -1 ? 0 : Math.max(1, Math.min(1e12, fQuasiTem(s)) * 10 ** e));

function allFinite(r: LineResult): boolean {
  const nums = [r.width, r.f, r.z0, r.z0Static, r.epsEff, r.epsEffStatic, r.lambdaG, r.vp, r.delayPerM, r.alphaC, r.alphaD,
    r.alphaCdBPerM, r.alphaDdBPerM, r.lossDbPerWavelength, r.skinDepth, r.thresholds.te1, r.thresholds.warnAt, r.thresholds.errorAt,
    r.thresholds.surfaceWave, r.thresholds.ruleOfThumb, r.thresholds.transverseResonance ?? 0];
  return nums.every(Number.isFinite) && r.z0 > 0 && r.epsEff >= 1 && r.alphaC >= 0 && r.alphaD >= 0;
}

/**
 * The analysis, or undefined when it raised the one refusal allowed at accepted input: the Jansen–Kirschning Z0(f)
 * fit has no value for εr barely above 1 far beyond its f·h range (an InputError naming 'f' that says so).
 */
function finiteOrUndefinedFit(run: () => LineResult): LineResult | undefined {
  try { return run(); } catch (e) {
    if (e instanceof InputError && e.field === 'f' && /Z0\(f\) fit has a value/.test(e.expected)) return undefined;
    throw e;
  }
}

describe('line model properties', () => {
  it('no finite in-range input yields NaN or Infinity (every model choice)', () => {
    fc.assert(fc.property(
      sub, fc.double({ min: -3, max: 3, noNaN: true }), freqFraction,
      fc.constantFrom('kirschning-jansen', 'hammerstad-jensen', 'none'), fc.constantFrom('wheeler-incremental', 'current-distribution'),
      (s, logU, fe, dispersion, conductorLoss) => {
        const f = freqOf(s, fe);
        const w = s.h * 10 ** logU;
        const r = finiteOrUndefinedFit(() => analyzeLine(s, w, f, { dispersion, conductorLoss }));
        if (r === undefined) return;
        expect(allFinite(r)).toBe(true);
        for (const wn of r.warnings) expect(wn.message.length).toBeGreaterThan(10);
      }), { seed: SEED, numRuns: 3000 });
  });
  it('near εr = 1 at any accepted frequency: finite numbers, or the typed error of the Z0(f) fit, never NaN', () => {
    const airLike = sub.map((s) => ({ ...s, er: 1.001 + (s.er - 1.001) / 640 })); // εr 1.001–1.2
    fc.assert(fc.property(airLike, fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: -3, max: 0, noNaN: true }),
      (s, logU, fe) => {
        const r = finiteOrUndefinedFit(() => analyzeLine(s, s.h * 10 ** logU, freqOf(s, fe)));
        if (r !== undefined) expect(allFinite(r)).toBe(true);
      }), { seed: SEED + 5, numRuns: 3000 });
  });
  it('synthesis of any reachable target inverts the analysis to 1e-9 and stays finite', () => {
    fc.assert(fc.property(sub, fc.double({ min: -2.9, max: 2.9, noNaN: true }), freqFraction,
      (s, logU, fe) => {
        const f = freqOf(s, fe);
        // A target known to be reachable: the model's own Z0 at some width.
        const target = analyzeLine(s, s.h * 10 ** logU, f).z0;
        const r = synthesizeLine(s, target, f);
        expect(Math.abs(r.z0 - target) / target).toBeLessThan(1e-9);
        expect(allFinite(r)).toBe(true);
      }), { seed: SEED + 1, numRuns: 1500 });
  });
  it('with the wideband Debye dielectric on: finite results and exact synthesis round trips', () => {
    fc.assert(fc.property(sub, fc.double({ min: 6, max: 11, noNaN: true }), fc.double({ min: -2.5, max: 2.5, noNaN: true }), freqFraction,
      (s0, logFm, logU, fe) => {
        const s: SubstrateSpec = { ...s0, dielectricModel: { kind: 'wideband-debye', fMeasure: 10 ** logFm } };
        try { validateSubstrate(s); } catch { fc.pre(false); } // a fit with ε∞ < 1 is refused up front (tested elsewhere)
        const f = freqOf(s, fe);
        // The quasi-TEM limit uses εr at f, which the Debye model moves: stay inside it.
        fc.pre(f <= fQuasiTem({ ...s, er: dielectricAt(s, f).er }));
        const r = analyzeLine(s, s.h * 10 ** logU, f);
        expect(allFinite(r)).toBe(true);
        const back = synthesizeLine(s, r.z0, f);
        expect(Math.abs(back.z0 - r.z0) / r.z0).toBeLessThan(1e-9);
      }), { seed: SEED + 4, numRuns: 600 });
  });
  it('out-of-range or non-numeric input yields a typed InputError naming the field', () => {
    const good: SubstrateSpec = SUBSTRATE_PRESETS[0]!.spec;
    const badValue = fc.oneof(fc.constant(Number.NaN), fc.constant(Infinity), fc.constant(-Infinity), fc.constant(-1),
      fc.constant(1e300), fc.constant('4.4' as unknown as number), fc.constant(null as unknown as number), fc.constant(undefined as unknown as number));
    const field = fc.constantFrom('er', 'h', 't', 'tanDelta', 'sigma', 'roughness', 'width', 'f');
    fc.assert(fc.property(field, badValue, (name, v) => {
      const s = { ...good } as Record<string, unknown>;
      let w: unknown = 1e-3; let f: unknown = 1e9;
      if (name === 'width') w = v; else if (name === 'f') f = v; else s[name] = v;
      try {
        analyzeLine(s as unknown as SubstrateSpec, w as number, f as number);
        // -1 is fine for nothing; 1e300 is out of range everywhere; so reaching here is a failure.
        return false;
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        const err = e as InputError;
        expect(err.field.endsWith(name)).toBe(true);
        expect(err.expected.length).toBeGreaterThan(5);
        return true;
      }
    }), { seed: SEED + 2, numRuns: 400 });
    expect(() => synthesizeLine(good, Number.NaN, 0)).toThrow(InputError);
    // Above twice the TE1 onset the quasi-TEM models are refused (glass-epoxy 1.6 mm: f_TE1 ≈ 25.2 GHz).
    fc.assert(fc.property(sub, fc.double({ min: 1.0001, max: 100, noNaN: true }), (s, k) => {
      const f = fQuasiTem(s) * k;
      fc.pre(f <= 1e12);
      expect(() => analyzeLine(s, s.h, f)).toThrow(/TE1 surface-wave onset/);
      expect(() => synthesizeLine(s, 50, f)).toThrow(/TE1 surface-wave onset/);
    }), { seed: SEED + 3, numRuns: 300 });
    expect(() => analyzeLine(good, 1e-3, 1e9, { dispersion: 'magic' as never })).toThrow(/dispersion/);
    expect(() => analyzeLine(good, 1e-3, 1e9, { conductorLoss: 'magic' as never })).toThrow(/conductorLoss/);
    expect(() => modeThresholds({ ...good, h: 0 })).toThrow(InputError);
    expect(() => lineConstants(good, -1, 1e9)).toThrow(InputError);
  });
});

describe('physical trends (common practice)', () => {
  const grid = { er: [2.2, 3.66, 4.4, 9.8], h: [0.254e-3, 0.79e-3, 1.6e-3] };
  it('round trip analysis(synthesis(Z)) = Z to 1e-9 over a grid of targets, static and at f', () => {
    let worst = 0;
    for (const er of grid.er) for (const h of grid.h) for (const t of [0, 35e-6]) for (const f of [0, 2.45e9, 10e9]) {
      for (const z of [20, 35, 50, 70.7, 100, 120]) {
        const r = synthesizeLine({ er, h, t, tanDelta: 0.002, sigma: 5.8e7, roughness: 0 }, z, f);
        worst = Math.max(worst, Math.abs(r.z0 - z) / z);
      }
    }
    expect(worst).toBeLessThan(1e-9);
  });
  it('Z0 falls as W grows (static and at 10 GHz)', () => {
    for (const er of grid.er) for (const h of grid.h) for (const f of [0, 10e9]) {
      const s = { er, h, t: 35e-6, tanDelta: 0.002, sigma: 5.8e7, roughness: 0 };
      let last = Infinity;
      for (let lu = -2; lu <= 2; lu += 0.05) {
        const z = analyzeLine(s, h * 10 ** lu, f).z0;
        expect(z).toBeLessThan(last);
        last = z;
      }
    }
  });
  it('εe rises with f from its static value towards εr', () => {
    for (const er of grid.er) for (const h of grid.h) for (const u of [0.2, 1, 5]) {
      const s = { er, h, t: 0, tanDelta: 0, sigma: 5.8e7, roughness: 0 };
      let last = analyzeLine(s, u * h, 0).epsEff;
      for (let f = 0.5e9; f <= 30e9; f += 0.5e9) {
        const e = analyzeLine(s, u * h, f).epsEff;
        expect(e).toBeGreaterThan(last);
        expect(e).toBeLessThan(er);
        last = e;
      }
    }
  });
  it('loss rises with f (conductor and dielectric, with roughness)', () => {
    for (const p of SUBSTRATE_PRESETS) {
      const w = synthesizeLine(p.spec, 50, 0).width;
      let last = 0;
      for (let f = 1e6; f <= 20e9; f *= 1.25) {
        const r = analyzeLine(p.spec, w, f);
        const total = r.alphaC + r.alphaD;
        expect(total).toBeGreaterThan(last);
        last = total;
      }
    }
  });
});
