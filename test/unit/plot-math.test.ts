/**
 * The plots' arithmetic (renderer/src/lib/plot-math.ts, smith-math.ts). Sources: ticks in steps of 1, 2 or 5 × 10^n
 * (common practice for chart axes); angles wrapped to (−180°, 180°] as core/network/figures.ts defines; Smith
 * readouts from the textbook definitions Z = Z0·(1 + Γ)/(1 − Γ) and VSWR = (1 + |Γ|)/(1 − |Γ|) (D. M. Pozar,
 * Microwave Engineering, 4th ed., §2.3–2.4, from memory), with hand-worked values: Γ = 0.2 on 50 Ω → 75 Ω,
 * VSWR 1.5; Γ = 1/3 → 100 Ω, VSWR 2; Γ = j/2 → 50·(0.6 + 0.8j) Ω.
 */
import { describe, expect, it } from 'vitest';
import { niceTicks, tickDecimals, zoomRange, panRange, wrapSeries, wrapsBetween, coincidence, coincidenceTolerance, dashFor, valueAt, nearestIndex, indexBelow } from '../../renderer/src/lib/plot-math.ts';
import { readout, nearestOnTraces } from '../../renderer/src/lib/smith-math.ts';

describe('axis ticks', () => {
  it('steps of 1, 2 or 5 × 10^n inside the range, at most about the count asked for', () => {
    expect(niceTicks(0, 10, 5)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(niceTicks(2.4, 2.5, 5)).toEqual([2.4, 2.42, 2.44, 2.46, 2.48, 2.5]);
    expect(niceTicks(-43.7, -2.9, 6)).toEqual([-40, -30, -20, -10]);
    expect(tickDecimals([2.4, 2.42])).toBe(2);
    expect(tickDecimals([0, 50])).toBe(0);
    for (const [lo, hi] of [[0.001, 0.0013], [-180, 180], [5.725, 5.875], [1e-9, 3e-9]] as const) {
      const t = niceTicks(lo, hi, 6);
      expect(t.length).toBeGreaterThanOrEqual(2);
      expect(t.length).toBeLessThanOrEqual(12);
      for (const v of t) { expect(v).toBeGreaterThanOrEqual(lo - 1e-12 * Math.abs(hi)); expect(v).toBeLessThanOrEqual(hi + 1e-12 * Math.abs(hi)); }
      const step = t[1]! - t[0]!, mant = step / 10 ** Math.floor(Math.log10(step) + 1e-9);
      expect([1, 2, 5].some((m) => Math.abs(mant - m) < 1e-6)).toBe(true);
    }
    expect(niceTicks(3, 3)).toEqual([3]);
  });
});

describe('frequency window', () => {
  const all = { lo: 2e9, hi: 3e9 };
  it('zooms about the pointer and stays inside the sweep', () => {
    const z = zoomRange(all, 2.25e9, 0.5, all);
    expect(z.lo).toBeCloseTo(2.125e9, 0);
    expect(z.hi).toBeCloseTo(2.625e9, 0);
    expect(zoomRange(z, 2.3e9, 10, all)).toEqual(all);
    const p = panRange(z, 1e9, all);
    expect(p.hi).toBe(3e9);
    expect(p.hi - p.lo).toBeCloseTo(0.5e9, 0);
    expect(panRange(z, -1e9, all).lo).toBe(2e9);
    // Never narrower than 1e-4 of the sweep.
    expect(zoomRange(all, 2.5e9, 1e-9, all).hi - zoomRange(all, 2.5e9, 1e-9, all).lo).toBeCloseTo(1e5, 0);
  });
});

describe('angles', () => {
  it('wraps to (−180°, 180°] and sees a wrap as a break', () => {
    expect(wrapSeries([-355, 180, -180, 540, 0, 179.5])).toEqual([5, 180, 180, 180, 0, 179.5]);
    expect(wrapsBetween(170, -170)).toBe(true);
    expect(wrapsBetween(-10, 10)).toBe(false);
  });
});

describe('coincident traces', () => {
  it('groups traces equal within the tolerance and gives the later ones dash patterns', () => {
    const a = [1, 2, 3], b = [1, 2, 3.0000001], c = [1, 2, 4], d = [1, 2, 4];
    expect(coincidence([a, b, c, d], 1e-3)).toEqual([0, 0, 2, 2]);
    expect(coincidence([a, c], 1e-3)).toEqual([0, 1]);
    expect(dashFor(0)).toEqual([]);
    expect(dashFor(1).length).toBeGreaterThan(0);
    expect(dashFor(1)).not.toEqual(dashFor(2));
    // Half a pixel of the value span: a 40 dB span on 240 px → 1/12 dB.
    expect(coincidenceTolerance([[0, -40]], 240)).toBeCloseTo(40 / 480, 12);
  });
});

describe('reading a swept trace at a marker', () => {
  const f = [1, 2, 4, 8], y = [0, 10, 30, 70];
  it('interpolates between the swept points around the frequency, holds the ends outside', () => {
    expect(valueAt(f, y, 3)).toBeCloseTo(20, 12);
    expect(valueAt(f, y, 2)).toBe(10);
    expect(valueAt(f, y, 0.5)).toBe(0);
    expect(valueAt(f, y, 9)).toBe(70);
    expect(indexBelow(f, 4.5)).toBe(2);
    expect(nearestIndex(f, 2.9)).toBe(1);
    expect(nearestIndex(f, 3.1)).toBe(2);
  });
});

describe('Smith readout', () => {
  it('gives Z and VSWR from Γ (hand-worked values from the definitions)', () => {
    const a = readout(0.2, 0, 50);
    expect(a.z!.re).toBeCloseTo(75, 10); expect(a.z!.im).toBeCloseTo(0, 12); expect(a.vswr).toBeCloseTo(1.5, 12);
    const b = readout(1 / 3, 0, 50);
    expect(b.z!.re).toBeCloseTo(100, 10); expect(b.vswr).toBeCloseTo(2, 12);
    const c = readout(0, 0.5, 50);
    expect(c.z!.re).toBeCloseTo(30, 10); expect(c.z!.im).toBeCloseTo(40, 10); expect(c.gammaDeg).toBeCloseTo(90, 12);
    const open = readout(1, 0, 50);
    expect(open.z).toBeNull(); expect(open.vswr).toBeNull();
    expect(readout(-0.5, 0, 50).gammaDeg).toBe(180);
  });
  it('finds the nearest traced point within reach', () => {
    const t = [{ re: [0, 0.5], im: [0, 0] }, { re: [0.9], im: [0.1] }];
    expect(nearestOnTraces(t, 0.48, 0.01, 0.05)).toEqual({ trace: 0, index: 1 });
    expect(nearestOnTraces(t, -0.5, -0.5, 0.05)).toBeNull();
  });
});
