/**
 * The band-stop block over its whole accepted range (orders 1–7, equal ripple 0.01–3 dB and maximally flat, stop
 * bandwidths 5–80 %) on a grid: every spec it accepts must meet its own figures in a lossless copy swept with the tee
 * models, and every spec it refuses must name the nearest spec it does make — which must then be made within spec.
 * Figures (the issue's, for filter blocks): the stop band's edges (where the loss falls to the ripple + 0.05 dB, or
 * to 3.01 dB for maximally flat) apart by the asked bandwidth within 5 %, each within 5 % of its place; the pass bands'
 * loss at most 0.03 dB above the asked ripple. The prototype's ripple band ends at ω' = 1 (Matthaei, Young and Jones
 * 1964, §4.03, eq. 4.03-3), mapped to f0·(1 ∓ Δ/2) by the band-stop transformation (Pozar, Microwave Engineering,
 * 4th ed., 2012, §8.5). The measurement here is this test's own (a 1601-point sweep walked out from f0).
 */
import { describe, expect, it } from 'vitest';
import { makeBlockDesign, sizeDesign, netlistFromSized, solveNetwork, InputError, type DesignDoc, type SubstrateSpec } from '../../core/index.ts';

const FR4: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const F0 = 2.45e9;
const MICROSTRIP = { sizing: 'microstrip', sideCopper: 'stitched' } as const;
const FS = Array.from({ length: 1601 }, (_, k) => F0 * (0.2 + (1.6 * k) / 1600));
const K0 = 800; // FS[800] = f0

type Spec = { response: 'chebyshev' | 'maxflat'; order: number; rippleDb?: number; bw: number };

function make(s: Spec): DesignDoc {
  return makeBlockDesign('bandstop', { response: s.response, order: String(s.order), ...(s.rippleDb !== undefined ? { rippleDb: String(s.rippleDb) } : {}), bw: String(s.bw) }, { f0: F0, substrate: FR4, asMade: MICROSTRIP });
}

/** The lossless copy's stop band (fractional width and centre) and the largest loss in its pass bands. */
function measure(doc: DesignDoc, level: number): { bw: number; lo: number; hi: number; passMax: number } {
  const sized = sizeDesign(doc);
  expect(sized.problems).toEqual([]);
  const r = solveNetwork(netlistFromSized(sized, { lossless: true }), FS);
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'b1.load'), j = r.ports.findIndex((p) => p.name === 'b1.src');
  const il = FS.map((_, k) => { const t = 2 * ((k * P + i) * P + j); return -20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!)); });
  let a = K0; while (a > 0 && il[a]! >= level) a--;
  let b = K0; while (b < FS.length - 1 && il[b]! >= level) b++;
  // Each edge read between the two points around the crossing.
  const cross = (p: number, q: number) => FS[p]! + ((FS[q]! - FS[p]!) * (il[p]! - level)) / (il[p]! - il[q]!);
  const lo = cross(a, a + 1), hi = cross(b, b - 1);
  // The pass bands, 0.5 % of f0 clear of the edges (the block judges the same span).
  const passMax = Math.max(...il.filter((_, k) => FS[k]! < lo - 0.005 * F0 || FS[k]! > hi + 0.005 * F0));
  return { bw: (hi - lo) / F0, lo: lo / F0, hi: hi / F0, passMax };
}

function meetsSpec(s: Spec): void {
  const level = s.response === 'chebyshev' ? s.rippleDb! + 0.05 : 3.0103;
  const m = measure(make(s), level);
  expect(Math.abs(m.bw / s.bw - 1), `stop band ${(m.bw * 100).toFixed(2)} % for ${(s.bw * 100).toFixed(1)} %`).toBeLessThan(0.05);
  expect(Math.abs(m.lo / (1 - s.bw / 2) - 1), 'lower edge').toBeLessThan(0.05);
  expect(Math.abs(m.hi / (1 + s.bw / 2) - 1), 'upper edge').toBeLessThan(0.05);
  if (s.response === 'chebyshev') expect(m.passMax, 'pass-band ripple').toBeLessThan(s.rippleDb! + 0.03);
  else expect(m.passMax).toBeLessThan(3.0103);
}

/** The spec a refusal names as the nearest it makes (the wordings of core/blocks/kinds/filters.ts bandstopNearest). */
function named(s: Spec, hint: string): Spec {
  const pct = (x: string) => Number(x) / 100;
  // A maximally flat spec's nearest may be the equal-ripple row at its order and band.
  let m = /the nearest it makes within spec: ([\d.]+) dB equal ripple at order (\d) and ([\d.]+) %/.exec(hint);
  if (m) return { ...s, response: 'chebyshev', rippleDb: Number(m[1]), order: Number(m[2]), bw: pct(m[3]!) };
  m = /the nearest it makes within spec: ([\d.]+) dB ripple at order (\d) and ([\d.]+) %/.exec(hint);
  if (m) return { ...s, rippleDb: Number(m[1]), order: Number(m[2]), bw: pct(m[3]!) };
  m = /the nearest it makes within spec: a ([\d.]+) % stop band at order (\d)(?: and ([\d.]+) dB)?/.exec(hint);
  if (m) return { ...s, bw: pct(m[1]!), order: Number(m[2]), ...(m[3] ? { rippleDb: Number(m[3]) } : {}) };
  m = /the nearest it makes within spec: order (\d) at the same (?:ripple and )?band/.exec(hint);
  if (m) return { ...s, order: Number(m[1]) };
  throw new Error(`the refusal names no nearest spec: ${hint}`);
}

const GRID: Spec[] = [];
for (let order = 1; order <= 7; order++) {
  for (const bw of [0.05, 0.3, 0.5, 0.8]) {
    GRID.push({ response: 'maxflat', order, bw });
    for (const rippleDb of [0.01, 0.1, 1, 3]) GRID.push({ response: 'chebyshev', order, rippleDb, bw });
  }
}

describe('band-stop block over its accepted range: made within spec, or refused naming the nearest made within spec', () => {
  for (const s of GRID) {
    const name = `order ${s.order}, ${s.response === 'chebyshev' ? `${s.rippleDb} dB` : 'maximally flat'}, ${s.bw * 100} %`;
    it(name, () => {
      let refusal: InputError | null = null;
      try { make(s); } catch (e) { if (e instanceof InputError) refusal = e; else throw e; }
      if (!refusal) { meetsSpec(s); return; }
      expect(refusal.field).toMatch(/^bandstop\./);
      const near = named(s, refusal.hint ?? '');
      expect(near).not.toEqual(s);
      meetsSpec(near);
    }, 120_000);
  }
});
