import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { buildBoardGeometry } from '../../core/layout/geometry.ts';
import { klopfensteinProfile } from '../../core/layout/klopfenstein1956Taper.ts';
import type { DesignNode, DesignSegment } from '../../core/design/types.ts';
import { design, port, vertex, junction, line, wd, lenOf, RO_LIKE } from './layout-fixtures.ts';
import { shoelace, selfIntersects, regionAreaOracle, distToSegment, unionAreaOfRects } from './geometry-test-helpers.ts';

beforeAll(async () => { await initPolygons(); });
const h = RO_LIKE.h;
/** The engine snaps vertices to a 10 nm grid, so areas may move by up to about perimeter × 10 nm. */
const perimeter = (ring: { x: number; y: number }[]) => ring.reduce((s, p, i) => s + Math.hypot(ring[(i + 1) % ring.length]!.x - p.x, ring[(i + 1) % ring.length]!.y - p.y), 0);
const gridTol = (rings: { x: number; y: number }[][]) => rings.reduce((s, r) => s + perimeter(r), 0) * 1e-8;
const closeArea = (got: number, want: number, rings: { x: number; y: number }[][]) => expect(Math.abs(got - want)).toBeLessThanOrEqual(gridTol(rings));

/**
 * Union invariants of a board's copper: its area lies between the largest part and the sum of the parts (less the
 * grid rounding), every outer ring runs counter-clockwise without crossing itself, and (when asked) every hole runs
 * clockwise without crossing itself.
 */
function expectCleanUnion(g: ReturnType<typeof buildBoardGeometry>, opts: { holes: boolean }): void {
  let parts = 0, largest = 0;
  for (const p of g.pieces) for (const r of p.regions) { const a = Math.abs(shoelace(r.outer)); parts += a; largest = Math.max(largest, a); }
  const area = g.copper.reduce((a, r) => a + regionAreaOracle(r), 0);
  const tol = gridTol(g.copper.flatMap((r) => [r.outer, ...r.holes]));
  expect(area).toBeLessThanOrEqual(parts + tol);
  expect(area).toBeGreaterThanOrEqual(largest - tol);
  for (const r of g.copper) {
    expect(shoelace(r.outer)).toBeGreaterThan(0);
    expect(selfIntersects(r.outer)).toBe(false);
    if (opts.holes) for (const hole of r.holes) { expect(shoelace(hole)).toBeLessThan(0); expect(selfIntersects(hole)).toBe(false); }
  }
}

describe('copper of straight runs, bends and tees', () => {
  it('every outline point of a straight run lies W/2 ± 1 µm from its centreline', () => {
    const W = 1.1122e-3;
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), port('b', 0.02, 0.015)], segments: [line('l', 'a', 'b', wd(W), lenOf(0.025))] }));
    const g = buildBoardGeometry(s);
    expect(g.copper).toHaveLength(1);
    const [c0, c1] = s.centrelines.l!;
    for (const p of g.copper[0]!.outer) expect(Math.abs(distToSegment(p, c0!, c1!) - W / 2)).toBeLessThan(1e-6);
    closeArea(regionAreaOracle(g.copper[0]!), W * 0.025, [g.copper[0]!.outer]);
  });
  it('a 90° optimal miter cuts legs of 2·M·W along both outer edges (Douville & James 1978, IEEE Trans. MTT 26(3))', () => {
    const W = 1.1122e-3, u = W / h;
    const M = (52 + 65 * Math.exp(-1.35 * u)) / 100;
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), vertex('v', 0.01, 0), port('b', 0.01, 0.01)], segments: [line('l1', 'a', 'v', wd(W), lenOf(0.01)), line('l2', 'v', 'b', wd(W), lenOf(0.01))] }));
    const g = buildBoardGeometry(s);
    expect(g.copper).toHaveLength(1);
    const outerCorner = { x: 0.01 + W / 2, y: -W / 2 };
    const leg = 2 * M * W;
    const want = [{ x: outerCorner.x - leg, y: outerCorner.y }, { x: outerCorner.x, y: outerCorner.y + leg }];
    const ring = g.copper[0]!.outer;
    for (const w of want) expect(Math.min(...ring.map((p) => Math.hypot(p.x - w.x, p.y - w.y)))).toBeLessThan(1e-8);
    expect(Math.min(...ring.map((p) => Math.hypot(p.x - outerCorner.x, p.y - outerCorner.y)))).toBeGreaterThan(leg / 2);
    // Area: the unmitered bend minus the cut triangle with legs 2MW.
    const rects = [{ x0: 0, y0: -W / 2, x1: 0.01 + W / 2, y1: W / 2 }, { x0: 0.01 - W / 2, y0: -W / 2, x1: 0.01 + W / 2, y1: 0.01 }];
    const square = unionAreaOfRects(rects); // exact area of the unmitered bend by coordinate compression
    closeArea(regionAreaOracle(g.copper[0]!), square - leg * leg / 2, [g.copper[0]!.outer]);
  });
  it('an arc bend: outline points at R ± W/2 from the arc centre (within the 1 µm chord tolerance)', () => {
    const W = 1e-3, R = 3e-3;
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), vertex('v', 0.01, 0, { style: 'arc', radius: R }), port('b', 0.01, 0.01)], segments: [line('l1', 'a', 'v', wd(W), lenOf(0.01)), line('l2', 'v', 'b', wd(W), lenOf(0.01))] }));
    const v = s.nodes.find((n) => n.id === 'v')!.pos;
    const centre = { x: v.x - R, y: v.y + R };
    const g = buildBoardGeometry(s);
    const arcPts = g.pieces.find((p) => p.id === 'v')!.regions[0]!.outer;
    for (const p of arcPts) {
      const r = Math.hypot(p.x - centre.x, p.y - centre.y);
      expect(Math.min(Math.abs(r - (R - W / 2)), Math.abs(r - (R + W / 2)))).toBeLessThan(1e-9);
    }
    // Area of the whole bend: two straight parts of (L − R) plus a quarter annulus (chords lose < 1 µm · length).
    const straight = s.pieces.map((p) => p.span - R);
    const exact = W * (straight[0]! + straight[1]!) + (Math.PI / 4) * ((R + W / 2) ** 2 - (R - W / 2) ** 2);
    expect(Math.abs(regionAreaOracle(g.copper[0]!) - exact)).toBeLessThan(1e-6 * (Math.PI / 2) * (R + W / 2));
  });
  it('a tee: the united area equals the parts minus their overlap (exact by coordinate compression)', () => {
    const Wm = 1.1e-3, Wb = 0.6e-3;
    const s = sizeDesign(design({
      nodes: [port('a', -0.01, 0), junction('j', 0, 0), port('b', 0.01, 0), port('c', 0, 0.01)],
      segments: [line('m1', 'a', 'j', wd(Wm), lenOf(0.01)), line('m2', 'j', 'b', wd(Wm), lenOf(0.01)), line('br', 'j', 'c', wd(Wb), lenOf(0.01))],
    }), { junctions: 'ideal' }); // the copper of arms measured from the centre (tee plane shifts: layout-sizing.test.ts)
    const g = buildBoardGeometry(s);
    expect(g.copper).toHaveLength(1);
    const want = unionAreaOfRects([
      { x0: -0.01, y0: -Wm / 2, x1: 0.01, y1: Wm / 2 }, { x0: -Wb / 2, y0: 0, x1: Wb / 2, y1: 0.01 },
    ]);
    closeArea(regionAreaOracle(g.copper[0]!), want, [g.copper[0]!.outer]);
  });
});

describe('tees with a branch wider than the main line', () => {
  it('area equals the union of the rectangles (coordinate compression); one simple outline', () => {
    const Wm = 0.5e-3, Wb = 1.6e-3;
    const s = sizeDesign(design({
      nodes: [port('a', -0.01, 0), junction('j', 0, 0), port('b', 0.01, 0), port('c', 0, -0.01)],
      segments: [line('m1', 'a', 'j', wd(Wm), lenOf(0.01)), line('m2', 'j', 'b', wd(Wm), lenOf(0.01)), line('br', 'j', 'c', wd(Wb), lenOf(0.01))],
    }), { junctions: 'ideal' }); // the copper of arms measured from the centre (tee plane shifts: layout-sizing.test.ts)
    const g = buildBoardGeometry(s);
    expect(g.copper).toHaveLength(1);
    // The junction square: Wb along the main line, Wm across, centred on the junction.
    const want = unionAreaOfRects([
      { x0: -0.01, y0: -Wm / 2, x1: 0.01, y1: Wm / 2 }, { x0: -Wb / 2, y0: -0.01, x1: Wb / 2, y1: 0 }, { x0: -Wb / 2, y0: -Wm / 2, x1: Wb / 2, y1: Wm / 2 },
    ]);
    closeArea(regionAreaOracle(g.copper[0]!), want, [g.copper[0]!.outer]);
    expect(selfIntersects(g.copper[0]!.outer)).toBe(false);
  });
});

describe('property: random trees of tees give clean copper', () => {
  const arm = fc.record({ len: fc.integer({ min: 6, max: 20 }), w: fc.integer({ min: 3, max: 15 }), deeper: fc.boolean() });
  it('every copper region is simple and oriented; area within the parts', () => {
    fc.assert(fc.property(fc.array(arm, { minLength: 3, maxLength: 9 }), (arms) => {
      const nodes: DesignNode[] = [port('in', 0, -5e-3), junction('j0', 0, 0)];
      const segs: DesignSegment[] = [line('feed', 'in', 'j0', wd(1e-3), lenOf(5e-3))];
      // Grow a comb: each junction sends a branch up and continues to the right.
      let x = 0, k = 0;
      arms.forEach((a, i) => {
        const L = a.len * 1e-3, W = a.w * 0.1e-3;
        const last = i === arms.length - 1;
        const next = last ? `end${i}` : `j${i + 1}`;
        nodes.push(last ? port(next, x + L, 0) : junction(next, x + L, 0));
        segs.push(line(`run${i}`, `j${i}`, next, wd(W), lenOf(L)));
        const top = `top${k++}`;
        nodes.push(port(top, x, a.deeper ? 0.02 : 0.01));
        segs.push(line(`up${i}`, `j${i}`, top, wd(W / 2 + 0.2e-3), lenOf(a.deeper ? 0.02 : 0.01)));
        x += L;
      });
      const s = sizeDesign(design({ nodes, segments: segs }));
      expect(s.problems).toEqual([]);
      const g = buildBoardGeometry(s);
      expectCleanUnion(g, { holes: false });
      expect(g.copper).toHaveLength(1);
    }), { numRuns: 40 });
  });
});

describe('Klopfenstein 1956 profile (Klopfenstein 1956, Proc. IRE 44(1) (from memory); Grossberg series)', () => {
  it('50 → 100 Ω, Γm = 0.02: A = 3.5447 and Z at z/L = 0, 0.1, …, 1', () => {
    const p = klopfensteinProfile(50, 100, 0.02);
    expect(p.A).toBeCloseTo(3.5447, 4);
    const want = [51.01, 52.75, 55.53, 59.48, 64.61, 70.71, 77.39, 84.06, 90.04, 94.79, 98.02];
    want.forEach((z, i) => expect(p.z(i / 10)).toBeCloseTo(z, 1));
  });
  it('a Klopfenstein taper piece: smooth outline, widths by synthesis, ends at the end widths', () => {
    const s = sizeDesign(design({
      nodes: [port('a', 0, 0), port('b', 0.03, 0)],
      segments: [{ id: 't', a: 'a', b: 'b', kind: 'taper', profile: 'klopfenstein', from: { by: 'z0', z0: 50 }, to: { by: 'z0', z0: 100 }, length: lenOf(0.03) }],
    }));
    const p = s.pieces[0]!;
    expect(p.taperWidths![0]).toBeCloseTo(p.width, 12);
    expect(p.taperWidths![p.taperWidths!.length - 1]).toBeCloseTo(p.widthB!, 12);
    expect(p.sections!.length).toBeGreaterThanOrEqual(24);
    for (let i = 1; i < p.taperWidths!.length; i++) expect(p.taperWidths![i]!).toBeLessThan(p.taperWidths![i - 1]!);
    const g = buildBoardGeometry(s);
    expect(g.copper).toHaveLength(1);
    expect(selfIntersects(g.copper[0]!.outer)).toBe(false);
  });
});

describe('ground copper, clearance layer and drills', () => {
  it('ground copper keeps its clearance; board = copper + ground + clearance', () => {
    const d = design({ nodes: [port('a', 0, 0), vertex('v', 0.01, 0), { id: 'e', kind: 'short', at: { x: 0.01, y: 0.008 }, via: { drill: 0.4e-3, pad: 0.8e-3, count: 2 } }], segments: [line('l1', 'a', 'v', wd(1e-3), lenOf(0.01)), line('l2', 'v', 'e', wd(1e-3), lenOf(0.008))] });
    const box = [{ x: 0, y: -0.01 }, { x: 0.02, y: -0.01 }, { x: 0.02, y: 0.012 }, { x: 0, y: 0.012 }];
    d.board = { outline: box };
    d.areas = [{ id: 'g', kind: 'ground-copper', polygon: box, clearance: 0.5e-3 }];
    const s = sizeDesign(d);
    const g = buildBoardGeometry(s);
    expect(g.drills.filter((x) => x.use === 'via')).toHaveLength(2);
    const copperArea = g.copper.reduce((a, r) => a + regionAreaOracle(r), 0);
    const groundArea = g.groundCopper.reduce((a, r) => a + regionAreaOracle(r), 0);
    const clearArea = g.clearance.reduce((a, r) => a + regionAreaOracle(r), 0);
    expect(copperArea + groundArea + clearArea).toBeCloseTo(0.02 * 0.022, 10);
    // Every ground vertex is at least the clearance (less the 1 µm chord tolerance) from the copper edges.
    const edges = g.copper.flatMap((r) => [r.outer, ...r.holes]).flatMap((ring) => ring.map((p, i) => [p, ring[(i + 1) % ring.length]!] as const));
    for (const r of g.groundCopper) for (const p of [...r.outer, ...r.holes.flat()]) {
      if (p.x <= 1e-9 || p.x >= 0.02 - 1e-9 || p.y <= -0.01 + 1e-9 || p.y >= 0.012 - 1e-9) continue; // board edge
      const dmin = Math.min(...edges.map(([a, b]) => distToSegment(p, a, b)));
      expect(dmin).toBeGreaterThan(0.5e-3 - 1.5e-6);
    }
  });
});

describe('keep-outs', () => {
  it('ground copper gives way to a keep-out', () => {
    const d = design({ nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', wd(1e-3), lenOf(0.01))] });
    const box = [{ x: 0, y: -0.01 }, { x: 0.01, y: -0.01 }, { x: 0.01, y: 0.01 }, { x: 0, y: 0.01 }];
    const ko = [{ x: 0.002, y: 0.004 }, { x: 0.004, y: 0.004 }, { x: 0.004, y: 0.006 }, { x: 0.002, y: 0.006 }];
    d.areas = [{ id: 'g', kind: 'ground-copper', polygon: box, clearance: 1e-3 }];
    const without = buildBoardGeometry(sizeDesign(d)).groundCopper.reduce((a, r) => a + regionAreaOracle(r), 0);
    d.areas.push({ id: 'k', kind: 'keep-out', polygon: ko });
    const g = buildBoardGeometry(sizeDesign(d));
    const withKo = g.groundCopper.reduce((a, r) => a + regionAreaOracle(r), 0);
    expect(without - withKo).toBeCloseTo(4e-6, 10); // the 2 mm × 2 mm keep-out
    expect(g.keepouts).toHaveLength(1);
  });
});

describe('property: random networks give clean copper', () => {
  const step = fc.record({ len: fc.integer({ min: 4, max: 20 }), turn: fc.constantFrom(-90, -45, 0, 45, 90), bend: fc.constantFrom('square', 'miter-optimal', 'arc'), w: fc.integer({ min: 3, max: 15 }) });
  it('simple outlines, outers counter-clockwise, holes clockwise, area between the largest part and the sum of parts', () => {
    fc.assert(fc.property(fc.array(step, { minLength: 1, maxLength: 8 }), (steps) => {
      const nodes: DesignNode[] = [port('n0', 0, 0)];
      const segs: DesignSegment[] = [];
      let x = 0, y = 0, heading = 0;
      steps.forEach((st, i) => {
        heading += i === 0 ? 0 : (st.turn * Math.PI) / 180;
        const L = st.len * 1e-3;
        x += L * Math.cos(heading); y += L * Math.sin(heading);
        const last = i === steps.length - 1;
        const id = `n${i + 1}`;
        const next = steps[i + 1];
        const bend = next && next.bend === 'arc' ? { style: 'arc' as const, radius: 1.6e-3 } : { style: (next?.bend ?? 'square') as 'square' | 'miter-optimal' };
        nodes.push(last ? port(id, x, y) : vertex(id, x, y, bend));
        segs.push(line(`s${i}`, `n${i}`, id, wd(st.w * 0.1e-3), lenOf(L)));
      });
      const s = sizeDesign(design({ nodes, segments: segs }));
      if (s.problems.length) return; // a too-short piece between bends: a correct refusal, nothing to draw
      expectCleanUnion(buildBoardGeometry(s), { holes: true });
    }), { numRuns: 60 });
  });
});
