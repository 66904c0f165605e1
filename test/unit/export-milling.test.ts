/**
 * Etch bias and isolation outlines over the polygon engine.
 * Exact areas: a rectangle grown with miter joins by b is (w + 2b)(l + 2b); a convex polygon of area A and
 * perimeter P grown with round joins by r has area A + P·r + π·r² (J. Steiner, "Über parallele Flächen",
 * Monatsber. Preuß. Akad. Wiss. Berlin, 1840, pp. 114–118). Round joins are flattened to ≤ 1 µm chords, so the
 * computed area sits slightly below Steiner's value (our own measurement shows the same deficit).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { initPolygons, regionsArea } from '../../core/geometry/polygons.ts';
import { withEtchBias, withIsolation } from '../../core/export/index.ts';
import { InputError } from '../../core/util/errors.ts';
import { boardFixture, stripOnlyFixture, rectMm, BEND_AREA_MM2, STRIP_AREA_MM2, GROUND_AREA_MM2 } from '../fixtures/export/hand-made.ts';

beforeAll(() => initPolygons());
const mm2 = (m2: number) => m2 * 1e6;

describe('etch bias', () => {
  it('grows a 10 × 2 mm strip by 35 µm per edge: (10.07 × 2.07) mm², corners kept square', () => {
    const { geometry } = withEtchBias(stripOnlyFixture(), 35e-6);
    expect(mm2(regionsArea(geometry.copper))).toBeCloseTo(10.07 * 2.07, 6);
    expect(geometry.copper[0].outer.length).toBe(4);
  });
  it('shrinks it with a negative bias: (9.9 × 1.9) mm²', () => {
    const { geometry } = withEtchBias(stripOnlyFixture(), -50e-6);
    expect(mm2(regionsArea(geometry.copper))).toBeCloseTo(9.9 * 1.9, 6);
  });
  it('keeps copper + clearance equal to the board: the clearance shrinks by what the copper gained', () => {
    const g = boardFixture();
    const before = regionsArea(g.clearance) + regionsArea(g.copper) + regionsArea(g.groundCopper);
    const { geometry } = withEtchBias(g, 0.1e-3);
    const after = regionsArea(geometry.clearance) + regionsArea(geometry.copper) + regionsArea(geometry.groundCopper);
    // Tolerance: the engine snaps to a 10 nm grid; over ≈ 400 mm of edges that is a few 1e-3 mm².
    expect(Math.abs(mm2(after) - mm2(before))).toBeLessThan(5e-3);
    expect(mm2(before)).toBeCloseTo(50 * 40, 6);
  });
  it('warns when the bias closes a gap (ground window 0.6 mm from the strip, bias 0.35 mm)', () => {
    const g = stripOnlyFixture(); // strip 10…20 × 20…22 mm
    g.groundCopper = [{ outer: rectMm(5, 15, 25, 27), holes: [rectMm(9.4, 19.4, 20.6, 22.6, true)] }];
    g.extent = { minX: 5e-3, minY: 15e-3, maxX: 25e-3, maxY: 27e-3 };
    expect(withEtchBias(g, 0.25e-3).warnings).toEqual([]);
    const { warnings } = withEtchBias(g, 0.35e-3);
    expect(warnings.some((w) => /touches the ground copper/.test(w.message))).toBe(true);
  });
  it('warns when a negative bias wipes out thin copper', () => {
    const g = stripOnlyFixture();
    g.copper.push({ outer: rectMm(12, 25, 18, 25.4), holes: [] }); // 0.4 mm wide line
    const { warnings, geometry } = withEtchBias(g, -0.25e-3);
    expect(geometry.copper.length).toBe(1);
    expect(warnings[0].message).toMatch(/removes copper narrower than 0.500 mm/);
  });
  it('refuses a bias beyond ±0.5 mm with a hint', () => {
    expect(() => withEtchBias(stripOnlyFixture(), 2e-3)).toThrow(InputError);
    expect(() => withEtchBias(stripOnlyFixture(), NaN)).toThrow(/etch bias between/);
  });
});

describe('isolation outlines', () => {
  it('a 0.2 mm tool around the 10 × 2 mm strip: area A + P·r + π·r² (Steiner)', () => {
    const r = 0.1; // mm
    const { geometry, warnings } = withIsolation(stripOnlyFixture(), 0.2e-3);
    const steiner = 20 + 24 * r + Math.PI * r * r;
    const got = mm2(regionsArea(geometry.isolation!));
    expect(got).toBeLessThanOrEqual(steiner + 1e-9);
    expect(steiner - got).toBeLessThan(1e-3);
    expect(warnings).toEqual([]);
  });
  it('outlines every copper area of the fixture and encloses the copper', () => {
    const g = boardFixture();
    const { geometry } = withIsolation(g, 0.4e-3);
    const copper = BEND_AREA_MM2 + STRIP_AREA_MM2 + GROUND_AREA_MM2;
    // Ground (outer ring + 2 windows) and the two network pieces: three outlines, the ground one with two holes.
    expect(geometry.isolation!.length).toBe(3);
    expect(mm2(regionsArea(geometry.isolation!))).toBeGreaterThan(copper);
  });
  it('warns when a gap is narrower than the tool (2 mm gaps, 2.2 mm tool)', () => {
    expect(withIsolation(boardFixture(), 1.8e-3).warnings).toEqual([]);
    const { warnings, geometry } = withIsolation(boardFixture(), 2.2e-3);
    expect(warnings.length).toBe(1);
    expect(geometry.isolation!.length).toBeLessThan(3);
  });
  it('refuses a tool of zero diameter', () => {
    expect(() => withIsolation(stripOnlyFixture(), 0)).toThrow(/cutter diameter/);
  });
});
