import { describe, expect, it } from 'vitest';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { tracePaths, designPaths } from '../../core/layout/paths.ts';
import { InputError } from '../../core/util/errors.ts';
import { design, port, vertex, junction, line, wd, z, lenOf, degs } from './layout-fixtures.ts';
import { oracleLine, C0 } from './layout-oracle.ts';

describe('phase of a line and its sensitivities (table checked by hand, 50 Ω lines at 5 GHz, 100 mm)', () => {
  const rows = [
    { er: 4.4, h: 1.52e-3, t: 35e-6, W: 2.864e-3, phase: 1111, Ser: 0.470, Sh: -0.026, SW: 0.052 },
    { er: 3.66, h: 0.508e-3, t: 35e-6, W: 1.073e-3, phase: 1010, Ser: 0.443, Sh: -0.036, SW: 0.047 },
    { er: 2.2, h: 0.508e-3, t: 35e-6, W: 1.521e-3, phase: 821, Ser: 0.424, Sh: -0.028, SW: 0.033 },
  ];
  for (const r of rows) {
    it(`εr ${r.er}, h ${r.h * 1e3} mm: ${r.phase}°, S_er ${r.Ser}, S_h ${r.Sh}, S_W ${r.SW}`, () => {
      const sub = { er: r.er, h: r.h, t: r.t, tanDelta: 0.002, sigma: 5.8e7, roughness: 0 };
      const s = sizeDesign(design({ substrate: sub, f0: 5e9, nodes: [port('a', 0, 0), port('b', 0.1, 0)], segments: [line('l', 'a', 'b', wd(r.W), lenOf(0.1))] }));
      const rep = tracePaths(s, 'a', ['b']);
      const e = rep.paths[0]!;
      expect(Math.abs(e.degAtF0 - r.phase)).toBeLessThan(0.6); // table rounds to whole degrees
      expect(e.sensitivity.er).toBeCloseTo(r.Ser, 2);
      expect(e.sensitivity.h).toBeCloseTo(r.Sh, 2);
      expect(e.sensitivity.W).toBeCloseTo(r.SW, 2);
      // phase = 360 f √εe(f) l / c0 with εe(f) from the independent transcription of Kirschning & Jansen 1982
      const ee = oracleLine(r.W, r.h, r.t, r.er, 5e9).ee;
      expect(e.degAtF0).toBeCloseTo((360 * 5e9 * Math.sqrt(ee) * 0.1) / C0, 3);
      expect(e.delay).toBeCloseTo((Math.sqrt(ee) * 0.1) / C0, 14);
      expect(e.physicalLength).toBeCloseTo(0.1, 12);
    });
  }
});

describe('matched paths', () => {
  // A tee feeding two outputs; one output run is `extra` degrees longer.
  const tee = (extra: number, bendB = false) => design({
    f0: 2.45e9,
    nodes: [port('in', 0, -0.01), junction('j', 0, 0), port('o1', -0.02, 0), bendB ? vertex('v', 0.02, 0) : port('o2', 0.02, 0), ...(bendB ? [port('o2', 0.02, 0.01)] : [])],
    segments: [
      line('feed', 'in', 'j', z(50), lenOf(0.01)), line('a1', 'j', 'o1', z(100), degs(180)),
      bendB ? line('a2', 'j', 'v', z(100), degs(90 + extra)) : line('a2', 'j', 'o2', z(100), degs(180 + extra)),
      ...(bendB ? [line('a3', 'v', 'o2', z(100), degs(90))] : []),
    ],
  });
  it('equal arms match; an arm 8° longer is flagged against ±5° and passes ±10°', () => {
    const same = tracePaths(sizeDesign(tee(0)), 'in', ['o1', 'o2']);
    expect(same.paths.map((p) => p.withinTolerance)).toEqual([true, true]);
    expect(Math.abs(same.paths[1]!.phaseDiffDeg)).toBeLessThan(1e-9);
    const off = tracePaths(sizeDesign(tee(8)), 'in', ['o1', 'o2']);
    expect(off.paths[1]!.phaseDiffDeg).toBeCloseTo(8, 6);
    expect(off.paths[1]!.withinTolerance).toBe(false);
    expect(off.warnings.some((w) => w.code === 'phase' && w.severity === 'warning')).toBe(true);
    expect(tracePaths(sizeDesign(tee(8)), 'in', ['o1', 'o2'], { toleranceDeg: 10 }).paths[1]!.withinTolerance).toBe(true);
  });
  it('counts bends and junctions and notes unequal bend counts', () => {
    const r = tracePaths(sizeDesign(tee(0, true)), 'in', ['o1', 'o2']);
    expect(r.paths.map((p) => [p.bends, p.junctions])).toEqual([[0, 1], [1, 1]]);
    expect(r.warnings.some((w) => /bends/.test(w.message))).toBe(true);
  });
  it('a full wavelength of difference matches at f0 only and says so (common practice: more than λg/8)', () => {
    const r = tracePaths(sizeDesign(tee(360)), 'in', ['o1', 'o2']);
    expect(Math.abs(r.paths[1]!.phaseDiffDeg)).toBeLessThan(1e-6);
    expect(r.warnings.some((w) => /λg\/8/.test(w.message))).toBe(true);
    // Across 2.4–2.5 GHz the extra wavelength drifts by about ±360·(Δf/f0): |Δ| ≈ 7° at the band edges.
    const [lo, hi] = r.paths[1]!.phaseDiffBandDeg;
    expect(lo).toBeLessThan(-5); expect(hi).toBeGreaterThan(5);
  });
  it('loss adds up along the path from the line model (dB/m × length)', () => {
    const s = sizeDesign(tee(0));
    const r = tracePaths(s, 'in', ['o1']);
    const want = s.pieces.filter((p) => ['feed', 'a1'].includes(p.id)).reduce((a, p) => a + p.line!.lossDbPerM * p.length, 0);
    expect(r.paths[0]!.lossDb).toBeCloseTo(want, 12);
  });
  it('unknown ports are an InputError listing the ports; designs without phase groups report without judging', () => {
    const s = sizeDesign(tee(30));
    expect(() => tracePaths(s, 'nope', ['o1'])).toThrow(InputError);
    expect(() => tracePaths(s, 'in', ['o1'], { toleranceDeg: 0 })).toThrow(/above 0/);
    const rep = designPaths(s);
    expect(rep).toHaveLength(1);
    expect(rep[0]!.matched).toBe(false);
    expect(rep[0]!.paths.every((p) => p.withinTolerance)).toBe(true);
    const d = tee(30); d.phaseGroups = [{ id: 'g', name: 'outs', from: 'in', to: ['o1', 'o2'], toleranceDeg: 5 }];
    const g = designPaths(sizeDesign(d));
    expect(g[0]!.matched).toBe(true);
    expect(g[0]!.paths[1]!.withinTolerance).toBe(false);
  });
});
