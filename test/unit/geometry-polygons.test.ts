import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  initPolygons, unionRegions, unionRings, differenceRegions, intersectRegions, offsetRegions, ringArea, regionArea,
  regionsArea, isCounterClockwise, simplify, rectRing, GRID_M,
} from '../../core/geometry/polygons.ts';
import type { Region } from '../../core/geometry/types.ts';
import { InputError } from '../../core/util/errors.ts';
import { unionAreaOfRects, selfIntersects, shoelace, regionAreaOracle } from './geometry-test-helpers.ts';

const mm = 1e-3;
const sq = (x0: number, y0: number, x1: number, y1: number): Region => ({ outer: rectRing(x0 * mm, y0 * mm, x1 * mm, y1 * mm), holes: [] });

beforeAll(async () => { await initPolygons(); });

describe('ring helpers', () => {
  it('shoelace area and orientation (elementary geometry)', () => {
    const r = rectRing(0, 0, 2, 3);
    expect(ringArea(r)).toBeCloseTo(6, 12);
    expect(isCounterClockwise(r)).toBe(true);
    expect(ringArea(r.slice().reverse())).toBeCloseTo(-6, 12);
    expect(regionArea({ outer: r, holes: [rectRing(0.5, 0.5, 1, 1).reverse()] })).toBeCloseTo(5.75, 12);
  });
  it('simplify drops collinear and repeated points only', () => {
    const r = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }, { x: 0, y: 1 }];
    const s = simplify(r);
    expect(s).toHaveLength(4);
    expect(Math.abs(ringArea(s))).toBeCloseTo(4, 12);
    const tri = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 1 }];
    expect(simplify(tri)).toHaveLength(3);
  });
});

describe('polygon engine (clipper2-wasm)', () => {
  it('unites two overlapping squares: area = sum minus overlap (inclusion–exclusion)', () => {
    const u = unionRegions([sq(0, 0, 10, 10), sq(5, 5, 15, 15)]);
    expect(u).toHaveLength(1);
    expect(regionsArea(u) / (mm * mm)).toBeCloseTo(100 + 100 - 25, 6);
    expect(u[0]!.outer).toHaveLength(8);
    expect(isCounterClockwise(u[0]!.outer)).toBe(true);
  });
  it('a ring of four bars gets one hole, oriented clockwise', () => {
    const u = unionRegions([sq(0, 0, 10, 2), sq(0, 8, 10, 10), sq(0, 0, 2, 10), sq(8, 0, 10, 10)]);
    expect(u).toHaveLength(1);
    expect(u[0]!.holes).toHaveLength(1);
    expect(shoelace(u[0]!.holes[0]!)).toBeLessThan(0);
    expect(regionAreaOracle(u[0]!) / (mm * mm)).toBeCloseTo(100 - 36, 6);
    // collinear points of the shared edges are gone: 4 + 4 vertices
    expect(u[0]!.outer).toHaveLength(4);
    expect(u[0]!.holes[0]!).toHaveLength(4);
  });
  it('respects holes given in either orientation and nests an island inside a hole', () => {
    const frame: Region = { outer: rectRing(0, 0, 10 * mm, 10 * mm).reverse(), holes: [rectRing(2 * mm, 2 * mm, 8 * mm, 8 * mm)] };
    const island = sq(4, 4, 6, 6);
    const u = unionRegions([frame, island]);
    expect(u).toHaveLength(2);
    const big = u.find((r) => r.holes.length === 1)!;
    expect(regionArea(big) / (mm * mm)).toBeCloseTo(64, 6);
    expect(regionsArea(u) / (mm * mm)).toBeCloseTo(68, 6);
  });
  it('difference and intersection', () => {
    const d = differenceRegions([sq(0, 0, 10, 10)], [sq(3, 3, 7, 7)]);
    expect(d).toHaveLength(1);
    expect(d[0]!.holes).toHaveLength(1);
    expect(regionsArea(d) / (mm * mm)).toBeCloseTo(84, 6);
    const i = intersectRegions([sq(0, 0, 10, 10)], [sq(5, -5, 20, 5)]);
    expect(regionsArea(i) / (mm * mm)).toBeCloseTo(25, 6);
    expect(intersectRegions([sq(0, 0, 1, 1)], [sq(2, 2, 3, 3)])).toHaveLength(0);
  });
  it('offset of a 10 mm square by 0.4 mm, round joins: Steiner formula A + P·d + π·d² (within the 1 µm chord error)', () => {
    // Steiner's formula for the parallel body of a convex polygon: 100 + 40·0.4 + π·0.16 = 116.5027 mm².
    const o = offsetRegions([sq(0, 0, 10, 10)], 0.4 * mm, 'round');
    const exact = 100 + 40 * 0.4 + Math.PI * 0.16;
    const got = regionsArea(o) / (mm * mm);
    expect(got).toBeLessThan(exact);
    expect(exact - got).toBeLessThan(0.005);
    // Square joins on an axis-aligned square: bevel of each corner lies between round and miter.
    const sqj = regionsArea(offsetRegions([sq(0, 0, 10, 10)], 0.4 * mm, 'square')) / (mm * mm);
    expect(sqj).toBeGreaterThan(exact - 0.2);
    // Miter joins keep the square exactly: (10.8)².
    expect(regionsArea(offsetRegions([sq(0, 0, 10, 10)], 0.4 * mm, 'miter')) / (mm * mm)).toBeCloseTo(10.8 * 10.8, 5);
  });
  it('a hole shrinks when its region grows; a negative offset shrinks the outer', () => {
    const framed = differenceRegions([sq(0, 0, 10, 10)], [sq(3, 3, 7, 7)]);
    const g = offsetRegions(framed, 0.5 * mm, 'miter');
    expect(regionsArea(g) / (mm * mm)).toBeCloseTo(11 * 11 - 3 * 3, 5);
    const s = offsetRegions([sq(0, 0, 10, 10)], -1 * mm, 'miter');
    expect(regionsArea(s) / (mm * mm)).toBeCloseTo(64, 5);
    expect(offsetRegions([sq(0, 0, 1, 1)], -1 * mm, 'round')).toHaveLength(0);
  });
  it('bad input gets a clear InputError naming the field', () => {
    expect(() => unionRegions([{ outer: [{ x: 0, y: 0 }, { x: 1, y: 0 }], holes: [] }])).toThrow(InputError);
    expect(() => unionRegions([{ outer: [{ x: 0, y: 0 }, { x: NaN, y: 0 }, { x: 0, y: 1 }], holes: [] }])).toThrow(/regions\[0\]\.outer\[1\]/);
    expect(() => offsetRegions([sq(0, 0, 1, 1)], Infinity, 'round')).toThrow(InputError);
    // Far outside any board (and outside the engine's integer range once scaled): refused before the engine sees it.
    expect(() => unionRegions([{ outer: [{ x: 0, y: 0 }, { x: 1e6, y: 0 }, { x: 0, y: 1 }], holes: [] }])).toThrow(/within ±100 m/);
    expect(() => offsetRegions([sq(0, 0, 1, 1)], 1, 'bevel' as never)).toThrow(/'round', 'miter' or 'square'/);
  });
  it('property: the union of random rectangles has the exact union area, no self-intersections, outers CCW and holes CW', () => {
    const rect = fc.record({ x: fc.integer({ min: 0, max: 40 }), y: fc.integer({ min: 0, max: 40 }), w: fc.integer({ min: 1, max: 15 }), h: fc.integer({ min: 1, max: 15 }) });
    fc.assert(fc.property(fc.array(rect, { minLength: 1, maxLength: 25 }), (rs) => {
      const rects = rs.map((r) => ({ x0: r.x * 0.25 * mm, y0: r.y * 0.25 * mm, x1: (r.x + r.w) * 0.25 * mm, y1: (r.y + r.h) * 0.25 * mm }));
      const u = unionRings(rects.map((r) => rectRing(r.x0, r.y0, r.x1, r.y1)));
      const want = unionAreaOfRects(rects);
      const got = u.reduce((s, r) => s + regionAreaOracle(r), 0);
      expect(Math.abs(got - want)).toBeLessThan(1e-3 * want + GRID_M * 1e-3);
      for (const r of u) {
        expect(shoelace(r.outer)).toBeGreaterThan(0);
        expect(selfIntersects(r.outer)).toBe(false);
        for (const h of r.holes) { expect(shoelace(h)).toBeLessThan(0); expect(selfIntersects(h)).toBe(false); }
      }
    }), { numRuns: 150 });
  });
});
