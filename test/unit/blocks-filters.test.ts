/**
 * Filter blocks (core/blocks/kinds/filters.ts) swept as a lossless copy (netlistFromSized lossless: the sized lines
 * with no conductor or dielectric loss, and the Hammerstad 1981 tee junctions the sweep uses), against their
 * prototypes:
 * - equal-ripple band-stop: the prototype's ripple band ends at ω' = 1 (Matthaei, Young and Jones 1964, §4.03,
 *   eq. 4.03-3), which the band-stop mapping puts at f0·(1 ∓ Δ/2) (Pozar, Microwave Engineering, 4th ed., 2012,
 *   §8.3 and §8.5); the pass bands must hold the asked ripple (0.03 dB allowed for the junctions, our own
 *   tolerance) and the edges fall within 5 % (the figure);
 * - the row of stubs and lines in Richards' variable (Pozar §8.4, Table 4.1 matrices) against the optimum
 *   equal-ripple function of Horton and Wenzel 1965 (IEEE Trans. MTT-13, 316–327; its form quoted from memory), and
 *   its stop band at least as deep as the prototype mapped by Ω = tan θ (Matthaei et al. eq. 4.03-3).
 */
import { describe, expect, it } from 'vitest';
import {
  makeBlockDesign, sizeDesign, netlistFromSized, solveNetwork, prototypeValues, equalRippleRow, rowLossDb, optimumLossDb, prototypeLossDb, InputError, type DesignDoc, type SubstrateSpec,
} from '../../core/index.ts';

const FR4: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
// A low-loss laminate of our own choosing (PTFE-ceramic class values, as data sheets of that class give them).
const LOW_LOSS: SubstrateSpec = { er: 3.55, h: 0.813e-3, t: 35e-6, tanDelta: 0.0027, sigma: 5.8e7, roughness: 1e-6 };
const F0 = 2.45e9;
const MICROSTRIP = { sizing: 'microstrip', sideCopper: 'stitched' } as const;

/** Insertion loss (dB) from b1.src to b1.load at each frequency. */
function insertionLoss(doc: DesignDoc, fs: number[], lossless = true): number[] {
  const sized = sizeDesign(doc);
  expect(sized.problems).toEqual([]);
  const r = solveNetwork(netlistFromSized(sized, { lossless }), fs);
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'b1.load'), j = r.ports.findIndex((p) => p.name === 'b1.src');
  return fs.map((_, k) => { const t = 2 * ((k * P + i) * P + j); return -20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!)); });
}

describe('equal-ripple band-stop in Richards\' variable (Horton and Wenzel 1965; Matthaei et al. 1964 eq. 4.03-3)', () => {
  for (const [n, ripple, bw] of [[3, 0.5, 0.5], [4, 0.1, 0.6], [5, 1, 0.4], [7, 3, 0.5], [2, 0.5, 0.8]] as const) {
    it(`N = ${n}, ${ripple} dB, Δ = ${bw * 100} %: the row has the optimum response, its ripple and edge, and beats the prototype`, () => {
      const thc = (Math.PI / 2) * (1 - bw / 2);
      const row = equalRippleRow(prototypeValues('equal-ripple', n, ripple), n, ripple, thc);
      const ths = Array.from({ length: 200 }, (_, k) => (thc * (k + 1)) / 200);
      // Pass band: equal ripple, never above the asked ripple, and the optimum function within 0.01 dB.
      const pass = ths.map((th) => rowLossDb(row, th));
      expect(Math.max(...pass)).toBeLessThan(ripple + 0.01);
      expect(Math.max(...pass)).toBeGreaterThan(ripple - 0.01);
      for (const th of ths) expect(Math.abs(rowLossDb(row, th) - optimumLossDb(n, ripple, thc, th))).toBeLessThan(0.01);
      // Stop band: at least the prototype's attenuation mapped by Ω = tan θ / tan θc.
      for (const th of [thc * 1.05, thc + 0.3 * (Math.PI / 2 - thc), thc + 0.6 * (Math.PI / 2 - thc)]) {
        expect(rowLossDb(row, th)).toBeGreaterThan(prototypeLossDb(n, ripple, Math.tan(th) / Math.tan(thc)));
      }
    });
  }
});

describe('why not the narrow-band form (Pozar §8.5, eq. 8.79)', () => {
  it('0.5 dB, N = 3, Δ = 50 %: stubs of 4·Z0/(π·g·Δ) on Z0 lines ripple well above 0.5 dB; the fitted row does not', () => {
    const n = 3, ripple = 0.5, bw = 0.5, thc = (Math.PI / 2) * (1 - bw / 2);
    const g = prototypeValues('equal-ripple', n, ripple);
    const narrow = { stubZ: g.slice(1, n + 1).map((gk) => 4 / (Math.PI * gk * bw)), lineZ: [1, 1] };
    const ths = Array.from({ length: 200 }, (_, k) => (thc * (k + 1)) / 200);
    expect(Math.max(...ths.map((th) => rowLossDb(narrow, th)))).toBeGreaterThan(2 * ripple);
    const row = equalRippleRow(g, n, ripple, thc);
    expect(Math.max(...ths.map((th) => rowLossDb(row, th)))).toBeLessThan(ripple + 0.01);
  });
});

describe('equal-ripple band-stop block, lossless copy with the tee models (Matthaei et al. §4.03; Pozar §8.5)', () => {
  const fs = Array.from({ length: 321 }, (_, k) => F0 * (0.2 + (1.6 * k) / 320));
  const cases: [string, SubstrateSpec, string, string, number][] = [
    ['FR-4', FR4, '3', '0.5', 0.5], ['FR-4', FR4, '4', '1', 0.7], ['FR-4', FR4, '5', '0.1', 0.6],
    ['low-loss', LOW_LOSS, '3', '1', 0.4], ['low-loss', LOW_LOSS, '4', '0.1', 0.7], ['low-loss', LOW_LOSS, '5', '0.5', 0.5],
  ];
  for (const [name, sub, order, ripple, bw] of cases) {
    it(`${name}, N = ${order}, ${ripple} dB, Δ = ${bw * 100} %: pass bands within the ripple (+0.03 dB), edges within 5 %, deep at f0`, () => {
      const doc = makeBlockDesign('bandstop', { response: 'chebyshev', order, rippleDb: ripple, bw: String(bw) }, { f0: F0, substrate: sub, asMade: MICROSTRIP });
      const il = insertionLoss(doc, fs);
      const R = Number(ripple), k0 = 160; // fs[160] = f0
      // The stop band: from f0 outwards while the loss stays above the ripple (+0.05 dB, as the block measures it).
      let a = k0; while (a > 0 && il[a]! >= R + 0.05) a--;
      let b = k0; while (b < fs.length - 1 && il[b]! >= R + 0.05) b++;
      expect(Math.abs(fs[a]! / (F0 * (1 - bw / 2)) - 1)).toBeLessThan(0.05);
      expect(Math.abs(fs[b]! / (F0 * (1 + bw / 2)) - 1)).toBeLessThan(0.05);
      const passMax = Math.max(...il.filter((_, k) => k < a || k > b));
      expect(passMax).toBeLessThan(R + 0.03);
      expect(passMax).toBeGreaterThan(R * 0.8); // equal ripple: the pass bands do reach the ripple
      expect(il[k0]!).toBeGreaterThan(30);
    }, 60_000);
  }
  it('a band too narrow for makeable stubs is refused naming the field and how to fix it', () => {
    expect(() => makeBlockDesign('bandstop', { response: 'chebyshev', order: '3', rippleDb: '0.1', bw: '0.1' }, { f0: F0, substrate: FR4, asMade: MICROSTRIP }))
      .toThrow(/bandstop\.bw/);
  });
});

describe('open-stub low-pass at large ripple: made where the laminate allows, refused naming the largest it can make', () => {
  // The equal-ripple prototype's ripple band ends at ω' = 1 (Matthaei, Young and Jones 1964, §4.03, eq. 4.03-3),
  // which Richards' transform puts at the cut-off where the stubs are λ/8 (Pozar §8.4). Lossless copy with the tees.
  const fc = 2e9;
  const fs = Array.from({ length: 241 }, (_, k) => fc * (0.02 + (1.18 * k) / 240));
  const make = (sub: SubstrateSpec, order: string, rippleDb: string) =>
    makeBlockDesign('lowpass', { form: 'stubs', response: 'chebyshev', order, rippleDb, cutoff: '2 GHz' }, { f0: F0, substrate: sub, asMade: MICROSTRIP });
  for (const [name, sub, order, ripple] of [['low-loss', LOW_LOSS, '3', '3'], ['low-loss', LOW_LOSS, '5', '2'], ['low-loss', LOW_LOSS, '7', '2'], ['FR-4', FR4, '3', '1.5']] as const) {
    it(`${name}, N = ${order}, ${ripple} dB: the ripple edge within 5 % of the cut-off, no higher ripple inside it`, () => {
      const il = insertionLoss(make(sub, order, ripple), fs);
      const level = Number(ripple) + 0.05, k = il.findIndex((x) => x > level);
      const edge = fs[k - 1]! + ((level - il[k - 1]!) / (il[k]! - il[k - 1]!)) * (fs[k]! - fs[k - 1]!);
      expect(Math.abs(edge / fc - 1)).toBeLessThan(0.05);
      expect(Math.max(...il.slice(0, k))).toBeGreaterThan(Number(ripple) * 0.8); // it does ripple
    }, 60_000);
  }
  it('FR-4 1.6 mm, N = 3 at 2 dB (stubs wider than they are long) is refused on rippleDb, naming 1.5 dB; that one is made', () => {
    let err: unknown;
    try { make(FR4, '3', '2'); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    const e = err as InputError;
    expect(e.field).toBe('lowpass.rippleDb');
    expect(e.message).toMatch(/up to 1\.5 dB/);
    expect(e.message).toMatch(/mm wide on a .* mm stub/);
    expect(() => make(FR4, '3', '1.5')).not.toThrow();
  }, 60_000);
  it('FR-4, N = 7 at 3 dB is refused too, naming a smaller ripple that its own check accepts', () => {
    let err: unknown;
    try { make(FR4, '7', '3'); } catch (e) { err = e; }
    const m = /up to ([\d.]+) dB/.exec((err as Error).message);
    expect(m).not.toBeNull();
    expect(() => make(FR4, '7', m![1]!)).not.toThrow();
  }, 120_000);
});
