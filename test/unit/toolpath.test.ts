/**
 * Toolpaths and G-code: options and their bounds, cut width, pass offsets, direction, tabs, pecks, ordering, the board
 * as milled, refusal of narrow gaps, determinism. Values checked against plain geometry worked by hand (sources named
 * per test); the G-code read back through an outside reader is in test/reference/gcode-retrace.test.ts.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  InputError, initPolygons, resolveMillingOptions, MILLING_DEFAULTS, cutWidth, isolationPaths, ringArea, orderItems, tourLength,
  drillMoves, cutoutMoves, exportGcode, planDesignMilling, estimateProgram, PROCESS_DEFAULT, parseQuantity, sweptArea, regionsArea,
  isolationPlan, MAX_ISOLATION_PASSES, asMadeOf, asMadeTemplate, type FabProcess, type Region, type ToolProgram,
} from '../../core/index.ts';
import { twoStrips } from './toolpath-fixtures.ts';

beforeAll(() => initPolygons());
const INFO = { base: 'b', application: 'Stripwright', version: '0.1.0' };
describe('machining options', () => {
  it('the defaults are valid and SI inside (200 mm/min = 0.00333 m/s)', () => {
    const o = resolveMillingOptions();
    expect(o.feed).toBeCloseTo(200e-3 / 60, 12);
    expect(parseQuantity('200mm/min', 'speed')).toBeCloseTo(o.feed, 15);
    expect(parseQuantity('7.874in/min', 'speed')).toBeCloseTo(7.874 * 25.4e-3 / 60, 15); // 1 in = 25.4 mm exactly
  });
  const bad: [Partial<typeof MILLING_DEFAULTS>, string, RegExp][] = [
    [{ feed: 5e-3 / 60 }, 'feed', /from 10 mm\/min to 3000 mm\/min, got 5 mm\/min/],
    [{ spindleRpm: 100000 }, 'spindleRpm', /1000 rpm to 60000 rpm/],
    [{ passes: 1.5 }, 'passes', /whole number/],
    [{ overlap: 0.95 }, 'overlap', /0\.1 to 0\.9/],
    [{ clearOverlap: 0.3 }, 'clearOverlap', /0\.5 to 0\.9/],
    [{ cutoutTool: 10e-3 }, 'cutoutTool', /0\.5 mm to 6\.35 mm/],
    [{ peckDepth: 0.05e-3 }, 'peckDepth', /0 \(no pecking\)/],
    [{ travelHeight: 8e-3, safeHeight: 5e-3 }, 'travelHeight', /no higher than the safe height/],
    [{ units: 'cm' as never }, 'units', /'mm'.*'inch'/],
    [{ workArea: { width: 5e-3, height: 0.1 } }, 'workArea.width', /20 mm to 2000 mm/],
    [{ feed: Number.NaN }, 'feed', /got NaN/],
  ];
  for (const [given, field, msg] of bad) {
    it(`refuses ${field} out of range, naming it`, () => {
      try { resolveMillingOptions(given); expect.unreachable(); } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).field).toBe(field);
        expect((e as InputError).message).toMatch(msg);
      }
    });
  }
});

describe('swept area (core/geometry sweptArea)', () => {
  it('a straight cut sweeps a stadium, 2rL + πr²; a square loop of side a a band of 8ar + (π − 4)r² (plain geometry)', () => {
    const r = 0.1e-3, L = 5e-3, a = 4e-3;
    // Round ends and joins are polygons whose chords lie within 1 µm inside the arcs: each area may fall short of the
    // formula by at most (arc length) × 1 µm, here 2πr × 1 µm, and never exceed it.
    const short = 2 * Math.PI * r * 1e-6;
    const within = (got: number, want: number) => { expect(got).toBeLessThanOrEqual(want + 1e-15); expect(got).toBeGreaterThan(want - short); };
    const open1 = sweptArea([{ points: [{ x: 0, y: 0 }, { x: L, y: 0 }], closed: false }], r);
    within(regionsArea(open1), 2 * r * L + Math.PI * r * r);
    const loop = sweptArea([{ points: [{ x: 0, y: 0 }, { x: a, y: 0 }, { x: a, y: a }, { x: 0, y: a }], closed: true }], r);
    expect(loop).toHaveLength(1);
    expect(loop[0]!.holes).toHaveLength(1);
    within(regionsArea(loop), 8 * a * r + (Math.PI - 4) * r * r);
  });
});

describe('toolpaths from geometry', () => {
  // A 2 mm × 10 mm strip; an end mill of 0.2 mm.
  const strip: Region = { outer: [{ x: 0, y: 0 }, { x: 10e-3, y: 0 }, { x: 10e-3, y: 2e-3 }, { x: 0, y: 2e-3 }], holes: [] };
  const board: Region = { outer: [{ x: -5e-3, y: -5e-3 }, { x: 15e-3, y: -5e-3 }, { x: 15e-3, y: 7e-3 }, { x: -5e-3, y: 7e-3 }], holes: [] };
  it('the V-bit cut width is tip + 2·depth·tan(angle/2) (cone geometry; 30°: tan 15° = 2 − √3)', () => {
    expect(cutWidth(PROCESS_DEFAULT)).toBeCloseTo(0.1e-3 + 2 * 0.05e-3 * (2 - Math.sqrt(3)), 12);
    expect(cutWidth({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3 })).toBe(0.4e-3);
  });
  it('pass k runs at w/2 + k·w·(1 − overlap) from the copper (round offset of a rectangle: its box grows by δ)', () => {
    const o = resolveMillingOptions({ passes: 3, overlap: 0.4 });
    const paths = isolationPaths([strip], board, 0.2e-3, 0.1e-3, o);
    expect(paths).toHaveLength(3);
    paths.forEach((p, k) => {
      const d = 0.1e-3 + k * 0.2e-3 * 0.6;
      const xs = p.points.map((q) => q.x), ys = p.points.map((q) => q.y);
      expect(Math.min(...xs)).toBeCloseTo(-d, 6); expect(Math.max(...xs)).toBeCloseTo(10e-3 + d, 6);
      expect(Math.min(...ys)).toBeCloseTo(-d, 6); expect(Math.max(...ys)).toBeCloseTo(2e-3 + d, 6);
      // Steiner: the perimeter of a rectangle's round offset is P + 2πδ (arc flattening makes it a little shorter).
      let per = 0; for (let i = 0; i < p.points.length; i++) { const a = p.points[i]!, b = p.points[(i + 1) % p.points.length]!; per += Math.hypot(b.x - a.x, b.y - a.y); }
      expect(per).toBeLessThanOrEqual(24e-3 + 2 * Math.PI * d + 1e-9);
      expect(per).toBeGreaterThan(24e-3 + 2 * Math.PI * d - 1e-5);
    });
  });
  it('the isolation clearance sets the passes, and the channel they mill is the gap as-made sizing uses (one function)', () => {
    // 0.2 mm end mill, 1 mm clearance: stepover 0.12 mm, passes 1 + ⌈(1 − 0.2)/0.12⌉ = 8, channel 0.2 + 7·0.12 = 1.04 mm.
    const proc = { kind: 'end-mill', toolDiameter: 0.2e-3, depth: 0.1e-3, clearance: 1e-3 } as const;
    const iso = isolationPlan(proc);
    expect(iso.passes).toBe(8);
    expect(iso.gap).toBeCloseTo(1.04e-3, 12);
    const paths = isolationPaths([strip], board, cutWidth(proc), 0.1e-3, resolveMillingOptions({ passes: iso.passes }));
    // The outermost loop's centre runs gap − cut/2 from the copper, so its cut ends at the gap (box grows by δ).
    const ys = paths.flatMap((p) => p.points.map((q) => q.y));
    expect(Math.max(...ys) - 2e-3 + 0.1e-3).toBeCloseTo(iso.gap, 6);
    // The design's as-made template sees that channel beside every line.
    const doc = { ...twoStrips(2e-3, 2e-3, 3e-3, proc), asMade: { sizing: 'as-made', sideCopper: 'stitched' } as const };
    expect(asMadeOf(doc).sizing).toBe('as-made');
    expect(asMadeTemplate(doc)!.side!.gap).toBeCloseTo(iso.gap, 12);
    // The planner takes the passes from the process; passes asked for that open another channel are warned about.
    expect(planDesignMilling(doc).plan.options.passes).toBe(8);
    const asked = planDesignMilling(doc, { passes: 2 }).plan.findings.find((f) => f.code === 'isolation-gap');
    expect(asked?.severity).toBe('warning');
    expect(asked?.message).toMatch(/0\.320 mm .* 1\.040 mm/);
    expect(planDesignMilling(doc).plan.findings.some((f) => f.code === 'isolation-gap')).toBe(false);
  });
  it('a clearance that needs more than the most passes milled: ten are milled, and the plan, its findings and the G-code header say so', () => {
    // 0.2 mm end mill, 2 mm clearance: stepover 0.12 mm, 1 + ⌈(2 − 0.2)/0.12⌉ = 16 passes needed; ten open
    // 0.2 + 9·0.12 = 1.28 mm (plain arithmetic of the pass offsets, as in the test above).
    const proc = { kind: 'end-mill', toolDiameter: 0.2e-3, depth: 0.1e-3, clearance: 2e-3 } as const;
    const iso = isolationPlan(proc);
    expect(iso.passes).toBe(MAX_ISOLATION_PASSES);
    expect(iso.gap).toBeCloseTo(1.28e-3, 12);
    expect(iso.warnings).toHaveLength(1);
    expect(iso.warnings[0]!.message).toMatch(/2\.000 mm needs 16 passes .* 1\.280 mm beside the copper/);
    // Exactly at the bound (0.2 + 9·0.12 = 1.28 mm asks for ten) and passes given by the user: no warning.
    expect(isolationPlan({ ...proc, clearance: 1.28e-3 }).warnings).toEqual([]);
    expect(isolationPlan({ ...proc, clearance: 1.28e-3 }).passes).toBe(10);
    expect(isolationPlan(proc, undefined, 3).warnings).toEqual([]);
    // Sizing sees the channel milled, and the plan and the isolation tool's G-code carry the warning.
    const doc = { ...twoStrips(2e-3, 3e-3, 4e-3, proc), asMade: { sizing: 'as-made', sideCopper: 'stitched' } as const };
    expect(asMadeTemplate(doc)!.side!.gap).toBeCloseTo(iso.gap, 12);
    const g = exportGcode(doc, {}, INFO);
    const f = g.plan.findings.find((x) => x.code === 'isolation-passes');
    expect(f?.severity).toBe('warning');
    const iso1 = g.files.find((x) => /isolation/.test(x.text.split('\n').slice(0, 4).join(' ')))!;
    expect(iso1.text).toMatch(/\(NOTE: the isolation clearance of 2\.000 mm needs 16 passes/);
    // With the passes given, the planner mills them and warns of the other channel instead (isolation-gap).
    expect(planDesignMilling(doc, { passes: 10 }).plan.findings.some((x) => x.code === 'isolation-passes')).toBe(false);
  });
  it('climb runs around an island counter-clockwise (copper on the left with an M3 spindle); conventional the other way', () => {
    const climb = isolationPaths([strip], board, 0.2e-3, 0.1e-3, resolveMillingOptions({ passes: 1 }));
    const conv = isolationPaths([strip], board, 0.2e-3, 0.1e-3, resolveMillingOptions({ passes: 1, direction: 'conventional' }));
    expect(ringArea(climb[0]!.points)).toBeGreaterThan(0);
    expect(ringArea(conv[0]!.points)).toBeLessThan(0);
  });
  it('drilling pecks: ⌈depth/peck⌉ strokes down, a full retract after each (the usual peck cycle)', () => {
    const o = resolveMillingOptions({ peckDepth: 0.5e-3 });
    const m = drillMoves({ x: 0, y: 0 }, 1.935e-3, o);
    expect(m.filter((x) => x.kind === 'line')).toHaveLength(4);
    expect(m.filter((x) => x.kind === 'rapid' && x.to.z === o.travelHeight)).toHaveLength(4);
    expect(Math.min(...m.map((x) => x.to.z))).toBeCloseTo(-1.935e-3, 12);
    expect(drillMoves({ x: 0, y: 0 }, 1.935e-3, resolveMillingOptions({ peckDepth: 0 })).filter((x) => x.kind === 'line')).toHaveLength(1);
  });
  it('cutout tabs: on passes below the tab top the tool rises over `tabs` stretches of tabWidth + tool diameter', () => {
    const o = resolveMillingOptions({ tabs: 4, tabWidth: 2e-3, tabHeight: 0.6e-3, stepDown: 0.5e-3, cutoutTool: 1e-3 });
    const loop = [{ x: 0, y: 0 }, { x: 40e-3, y: 0 }, { x: 40e-3, y: 30e-3 }, { x: 0, y: 30e-3 }];
    const moves = cutoutMoves(loop, 1.9e-3, 1.6e-3, o);
    const tabTop = -(1.6e-3 - 0.6e-3);
    // Last pass: from its plunge to the end.
    const lastPlunge = moves.map((m, i) => ({ m, i })).filter(({ m }) => m.kind === 'line' && Math.abs(m.to.z + 1.9e-3) < 1e-12 && m.to.x === 0 && m.to.y === 0)[0]!.i;
    let at = moves[lastPlunge]!.to, raised = 0, runs = 0, inRun = false;
    for (const m of moves.slice(lastPlunge + 1)) {
      if (m.kind === 'rapid') break;
      const flat = m.to.z === at.z;
      if (flat && Math.abs(m.to.z - tabTop) < 1e-12) { raised += Math.hypot(m.to.x - at.x, m.to.y - at.y); if (!inRun) { runs++; inRun = true; } }
      else if (flat) inRun = false;
      at = m.to;
    }
    expect(runs).toBe(4);
    expect(raised).toBeCloseTo(4 * (2e-3 + 1e-3), 9);
    expect(Math.min(...moves.map((m) => m.to.z))).toBeCloseTo(-1.9e-3, 12);
  });
  it('too many tabs for the loop are refused', () => {
    const loop = [{ x: 0, y: 0 }, { x: 5e-3, y: 0 }, { x: 5e-3, y: 5e-3 }, { x: 0, y: 5e-3 }];
    expect(() => cutoutMoves(loop, 1.9e-3, 1.6e-3, resolveMillingOptions({ tabs: 8 }))).toThrow(/tabs that fit/);
  });
  it('the time estimate is length over feed plus travel over the rapid rate (worked by hand)', () => {
    const o = resolveMillingOptions();
    const p: ToolProgram = {
      tool: { number: 1, kind: 'end-mill', diameter: 1e-3, cutWidth: 1e-3, label: 't', slug: 't' }, operations: ['isolation'], spindleRpm: 10000,
      start: { x: 0, y: 0, z: 5e-3 }, seconds: 0, cutLength: 0, travelLength: 0,
      moves: [
        { kind: 'rapid', to: { x: 0, y: 0, z: 1e-3 } },
        { kind: 'line', to: { x: 0, y: 0, z: -0.1e-3 }, feed: o.plungeFeed },
        { kind: 'line', to: { x: 10e-3, y: 0, z: -0.1e-3 }, feed: o.feed },
        { kind: 'arc', to: { x: 10e-3, y: 0, z: -0.1e-3 }, centre: { x: 5e-3, y: 0 }, clockwise: false, feed: o.feed },
      ],
    };
    const e = estimateProgram(p, o.rapidRate);
    // 4 mm rapid at 1000 mm/min = 0.24 s; 1.1 mm plunge at 50 mm/min = 1.32 s; 10 mm + a 5 mm-radius full circle at 200 mm/min.
    expect(e.seconds).toBeCloseTo(0.24 + 1.32 + ((10 + 10 * Math.PI) / 200) * 60, 9);
  });
});

describe('ordering (nearest neighbour + 2-opt)', () => {
  it('visits every item once, never longer than the given order, and leaves no improving 2-swap (a 2-opt local optimum)', () => {
    fc.assert(fc.property(fc.array(fc.record({ x: fc.double({ min: 0, max: 0.1, noNaN: true }), y: fc.double({ min: 0, max: 0.1, noNaN: true }) }), { minLength: 4, maxLength: 40 }), (pts) => {
      const home = { x: 0, y: 0 };
      const { order } = orderItems(pts.map((p) => [p]), home);
      expect([...order].sort((a, b) => a - b)).toEqual(pts.map((_, i) => i));
      const tour = tourLength(order.map((i) => pts[i]!), home);
      expect(tour).toBeLessThanOrEqual(tourLength(pts, home) + 1e-12);
      const P = (k: number) => (k < 0 ? home : pts[order[k]!]!);
      const d = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);
      for (let i = 0; i < order.length - 1; i++) for (let j = i + 1; j < order.length; j++) {
        const before = d(P(i - 1), P(i)) + (j + 1 < order.length ? d(P(j), P(j + 1)) : 0);
        const after = d(P(i - 1), P(j)) + (j + 1 < order.length ? d(P(i), P(j + 1)) : 0);
        expect(after).toBeGreaterThanOrEqual(before - 1e-9);
      }
    }), { numRuns: 40 });
  });
});

describe('the board as milled', () => {
  it('an end mill leaves the drawn width, so Z0 does not move', () => {
    const doc = twoStrips(3e-3, 1.5e-3, 2e-3, { kind: 'end-mill', toolDiameter: 0.3e-3, depth: 0.1e-3 });
    const m = planDesignMilling(doc);
    expect(m.plan.findings.filter((f) => f.severity === 'error')).toEqual([]);
    for (const p of m.plan.milled.pieces) {
      expect(Math.abs(p.topWidth - p.drawnWidth)).toBeLessThan(2e-6);
      expect(p.footWidth).toBe(p.topWidth);
      expect(Math.abs(p.z0Shift)).toBeLessThan(0.02);
    }
  });
  it('a V-bit leaves copper wider at its foot by 2·t·tan(angle/2), which lowers Z0 (a wider strip has lower Z0)', () => {
    const doc = twoStrips(3e-3, 1.5e-3, 2e-3, { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 60, depth: 0.08e-3 });
    const m = planDesignMilling(doc);
    for (const p of m.plan.milled.pieces) {
      expect(p.footWidth - p.topWidth).toBeCloseTo(2 * 35e-6 * Math.tan(Math.PI / 6), 9);
      expect(p.z0Shift).toBeLessThan(0);
      expect(p.joined).toBe(false);
    }
  });
  it('a gap narrower than the cut refuses the export, naming both pieces', () => {
    const doc = twoStrips(2e-3, 2e-3, 0.15e-3, { kind: 'end-mill', toolDiameter: 0.3e-3, depth: 0.1e-3 });
    expect(() => exportGcode(doc, {}, INFO)).toThrow(/lower.*upper|upper.*lower/);
    const m = planDesignMilling(doc);
    expect(m.plan.findings.some((f) => f.code === 'joined' && f.subjects.includes('lower') && f.subjects.includes('upper'))).toBe(true);
  });
  it('a cut shallower than the copper is refused (the islands would stay joined)', () => {
    const doc = twoStrips(2e-3, 2e-3, 1e-3, { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.03e-3 });
    expect(() => exportGcode(doc, {}, INFO)).toThrow(/process\.depth/);
  });
  it('clearing leaves no copper but the design', () => {
    const doc = twoStrips(2e-3, 2e-3, 1.5e-3, { kind: 'end-mill', toolDiameter: 0.8e-3, depth: 0.1e-3 }, 8e-3);
    const m = planDesignMilling(doc, { clear: true });
    expect(m.plan.milled.islands.filter((i) => i.designIslands.length === 0)).toEqual([]);
    const without = planDesignMilling(doc);
    expect(without.plan.findings.some((f) => f.code === 'leftover')).toBe(true);
  });
  it('the same design gives the same bytes, with no date in them', () => {
    const doc = twoStrips(2e-3, 2e-3, 1.5e-3, PROCESS_DEFAULT as FabProcess);
    const a = exportGcode(doc, {}, INFO), b = exportGcode(doc, {}, INFO);
    expect(a.files.map((f) => f.text)).toEqual(b.files.map((f) => f.text));
    expect(a.files[0]!.text).not.toMatch(/20\d\d-\d\d-\d\d|\d\d:\d\d:\d\d/);
  });
});
