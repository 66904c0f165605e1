/**
 * Property tests over random geometries (fast-check): random rectangles and rotated quads united by the polygon
 * engine (so regions with holes and islands occur), then every format read back by an outside parser:
 * every outline closed, every vertex inside the board, and the areas equal to the geometry's.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import DxfParser from 'dxf-parser';
import { initPolygons, regionsArea, unionRegions, differenceRegions, rectRing, GRID_M } from '../../core/geometry/polygons.ts';
import type { BoardGeometry, Region, Ring } from '../../core/geometry/types.ts';
import { toDxf, toDxfR12, toGerber, toSvg, withEtchBias, withIsolation } from '../../core/export/index.ts';
import { lintGerber } from '../../scripts/oracles/gerber-lint.ts';
import { readBack } from '../../scripts/oracles/gerber-read.ts';

beforeAll(() => initPolygons());

const BOARD = { w: 0.06, h: 0.04 }; // 60 × 40 mm

/** A quad of size w × h centred at (cx, cy), rotated by a. */
function quad(cx: number, cy: number, w: number, h: number, a: number): Ring {
  const c = Math.cos(a), s = Math.sin(a);
  return [[-1, -1], [1, -1], [1, 1], [-1, 1]].map(([u, v]) => ({ x: cx + (u * w / 2) * c - (v * h / 2) * s, y: cy + (u * w / 2) * s + (v * h / 2) * c }));
}

const arbQuad = fc.record({
  cx: fc.double({ min: 0.01, max: 0.05, noNaN: true }), cy: fc.double({ min: 0.01, max: 0.03, noNaN: true }),
  w: fc.double({ min: 0.0005, max: 0.015, noNaN: true }), h: fc.double({ min: 0.0005, max: 0.015, noNaN: true }),
  a: fc.double({ min: 0, max: Math.PI, noNaN: true }),
});

/** Copper = union of quads, minus a few window cuts (to make holes), clipped to the board interior. */
const arbGeometry = fc.record({ adds: fc.array(arbQuad, { minLength: 1, maxLength: 8 }), cuts: fc.array(arbQuad, { maxLength: 3 }) })
  .map(({ adds, cuts }): BoardGeometry => {
    const inner: Region[] = [{ outer: rectRing(0.001, 0.001, BOARD.w - 0.001, BOARD.h - 0.001), holes: [] }];
    const added = unionRegions(adds.map((q) => ({ outer: quad(q.cx, q.cy, q.w, q.h, q.a), holes: [] })));
    const cut = cuts.map((q) => ({ outer: quad(q.cx, q.cy, q.w / 3, q.h / 3, q.a), holes: [] }));
    const copper = differenceRegions(differenceRegions(added, cut), differenceRegions([{ outer: rectRing(-1, -1, 1, 1), holes: [] }], inner));
    const outline: Region = { outer: rectRing(0, 0, BOARD.w, BOARD.h), holes: [] };
    return {
      copper, groundCopper: [], outline, clearance: differenceRegions([outline], copper), keepouts: [], drills: [],
      extent: { minX: 0, minY: 0, maxX: BOARD.w, maxY: BOARD.h }, pieces: [],
    };
  })
  .filter((g) => g.copper.length > 0);

const shoelace = (pts: { x: number; y: number }[]) => pts.reduce((a, p, i) => { const q = pts[(i + 1) % pts.length]; return a + (p.x * q.y - q.x * p.y) / 2; }, 0);
const inBoard = (x: number, y: number) => x >= -1e-9 && x <= 60 + 1e-9 && y >= -1e-9 && y <= 40 + 1e-9;

describe('random geometries through every exporter', () => {
  it('DXF (dxf-parser): every copper polyline closed, inside the board, net area equal to the geometry', () => {
    fc.assert(fc.property(arbGeometry, (g) => {
      const dxf = new DxfParser().parseSync(toDxf(g, { layers: ['copper'] }))!;
      const polys = dxf.entities as unknown as { shape: boolean; vertices: { x: number; y: number }[] }[];
      expect(polys.length).toBe(g.copper.reduce((n, r) => n + 1 + r.holes.length, 0));
      let area = 0;
      for (const p of polys) {
        expect(p.shape).toBe(true);
        for (const v of p.vertices) expect(inBoard(v.x, v.y)).toBe(true);
        area += shoelace(p.vertices); // outers counter-clockwise, holes clockwise
      }
      expect(Math.abs(area - regionsArea(g.copper) * 1e6)).toBeLessThan(1e-4);
    }), { numRuns: 30 });
  });

  it('DXF R12 (dxf-parser): the same closed outlines as the 2007 file, vertex for vertex', () => {
    fc.assert(fc.property(arbGeometry, (g) => {
      const a = new DxfParser().parseSync(toDxf(g, { layers: ['copper'] }))!.entities as unknown as { shape: boolean; vertices: { x: number; y: number }[] }[];
      const b = new DxfParser().parseSync(toDxfR12(g, { layers: ['copper'] }))!.entities as unknown as { shape: boolean; vertices: { x: number; y: number }[] }[];
      expect(b.length).toBe(a.length);
      b.forEach((e, i) => {
        expect(e.shape).toBe(true);
        expect(e.vertices.map((v) => [v.x, v.y])).toEqual(a[i].vertices.map((v) => [v.x, v.y]));
      });
    }), { numRuns: 20 });
  });

  it('Gerber (own rules + gerber-parser/plotter): clean, closed contours, inside the board, area equal', async () => {
    await fc.assert(fc.asyncProperty(arbGeometry, async (g) => {
      const { copper } = toGerber(g);
      expect(lintGerber(copper).problems).toEqual([]);
      const r = await readBack(copper);
      expect(r.warnings).toEqual([]);
      expect(r.box![0]).toBeGreaterThanOrEqual(0);
      expect(r.box![2]).toBeLessThanOrEqual(60);
      // Area as the plotter sees it: dark fills minus clear fills (the clear ones lie inside their dark region).
      let area = 0, dark = true;
      for (const o of r.objects) {
        if (o.type === 'polarity') dark = o.polarity === 'dark';
        if (o.type === 'fill') {
          const pts = (o.path as { start: number[] }[]).map((s) => ({ x: s.start[0], y: s.start[1] }));
          area += (dark ? 1 : -1) * Math.abs(shoelace(pts));
        }
      }
      expect(Math.abs(area - regionsArea(g.copper) * 1e6)).toBeLessThan(1e-4);
    }), { numRuns: 30 });
  });

  it('SVG: every subpath closed and inside the drawing', () => {
    fc.assert(fc.property(arbGeometry, (g) => {
      const svg = toSvg(g, { layers: ['copper'], marginMm: 0 });
      const paths = [...svg.matchAll(/<path d="([^"]+)"/g)].map((m) => m[1]);
      expect(paths.length).toBe(g.copper.length);
      for (const d of paths) {
        const subs = d.split(/(?=M)/);
        for (const s of subs) {
          expect(s.trim().endsWith('Z')).toBe(true);
          for (const [, x, y] of s.matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)) expect(inBoard(Number(x), Number(y))).toBe(true);
        }
      }
    }), { numRuns: 30 });
  });
});

describe('random shapes through etch bias and isolation', () => {
  it('a rotated w × h rectangle biased by b has area (w + 2b)(h + 2b) (miter joins keep it a rectangle)', () => {
    fc.assert(fc.property(arbQuad, fc.double({ min: -0.2e-3, max: 0.2e-3, noNaN: true }), (q, b) => {
      fc.pre(Math.min(q.w, q.h) > 2 * Math.abs(b) + 1e-5);
      const g: BoardGeometry = {
        copper: [{ outer: quad(q.cx, q.cy, q.w, q.h, q.a), holes: [] }], groundCopper: [], outline: { outer: rectRing(0, 0, BOARD.w, BOARD.h), holes: [] },
        clearance: [], keepouts: [], drills: [], extent: { minX: 0, minY: 0, maxX: BOARD.w, maxY: BOARD.h }, pieces: [],
      };
      const got = regionsArea(withEtchBias(g, b).geometry.copper);
      const want = (q.w + 2 * b) * (q.h + 2 * b);
      // Tolerance: the engine snaps vertices to its 10 nm grid (GRID_M), moving each edge by up to that much:
      // perimeter × 10 nm.
      expect(Math.abs(got - want)).toBeLessThan(2 * (q.w + q.h + 4 * Math.abs(b)) * GRID_M);
    }), { numRuns: 40 });
  });
  it('isolation outline of a convex quad: area within the chord deficit below Steiner A + P·r + π·r²', () => {
    fc.assert(fc.property(arbQuad, fc.double({ min: 0.05e-3, max: 0.5e-3, noNaN: true }), (q, d) => {
      const r = d / 2;
      const g: BoardGeometry = {
        copper: [{ outer: quad(q.cx, q.cy, q.w, q.h, q.a), holes: [] }], groundCopper: [], outline: null,
        clearance: [], keepouts: [], drills: [], extent: { minX: 0, minY: 0, maxX: BOARD.w, maxY: BOARD.h }, pieces: [],
      };
      const got = regionsArea(withIsolation(g, d).geometry.isolation!);
      const steiner = q.w * q.h + 2 * (q.w + q.h) * r + Math.PI * r * r;
      // Round joins are flattened to 1 µm chords: the polygon lies inside the true offset, losing at most
      // (arc length) × 1 µm = 2πr × 1e-6 m² (plus grid noise).
      const grid = 2 * (q.w + q.h + 2 * Math.PI * r) * GRID_M; // grid snapping, as above
      expect(got).toBeLessThanOrEqual(steiner + grid);
      expect(steiner - got).toBeLessThan(2 * Math.PI * r * 1e-6 + grid);
    }), { numRuns: 40 });
  });
});
