/**
 * Work bounds (issue 22, items 1 and 4): every process parameter stays within what real tools are, a board beyond the
 * size limit is refused during sizing before any geometry, every polygon operation has a work bound that fails with
 * an InputError, and sizing problems are reported before geometry. Each case here hung for minutes or failed with an
 * internal geometry message before the fix.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  BOARD_SIZE_LIMIT, InputError, MAX_ENGINE_POINTS, PROCESS_LIMITS, buildBoardGeometry, checkBoard, initPolygons, offsetRegions,
  parseDesign, rectRing, sizeDesign, unionRegions, untoolableCopper, type DesignDoc, type Region,
} from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const example = (name: string): Record<string, unknown> => JSON.parse(readFileSync(join(EX, name), 'utf8'));
const load = (doc: unknown): DesignDoc => {
  const r = parseDesign(JSON.stringify(doc));
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
  return r.doc;
};
const refusal = (doc: unknown): string[] => {
  const r = parseDesign(JSON.stringify(doc));
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.errors.map((e) => e.message);
};

beforeAll(async () => { await initPolygons(); });

describe('process parameters are bounded by what tools are', () => {
  it('refuses the 179.9° V-bit cutting 5 mm deep at load, naming both fields and the bounds', () => {
    const d = example('demo.json');
    d.process = { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 179.9, depth: 5e-3 };
    const msgs = refusal(d);
    expect(msgs.find((m) => m.startsWith('process.angleDeg:'))).toMatch(/10.*120/);
    expect(msgs.find((m) => m.startsWith('process.depth:'))).toMatch(/1 mm/);
  });
  it('keeps the bounds of each kind (edges accepted, beyond refused)', () => {
    const L = PROCESS_LIMITS;
    const ok = [
      { kind: 'v-bit', tipWidth: L.vBitTipMax, angleDeg: L.vBitAngleDegMax, depth: L.vBitDepthMax },
      { kind: 'v-bit', tipWidth: 0, angleDeg: L.vBitAngleDegMin, depth: 10e-6 },
      { kind: 'end-mill', toolDiameter: L.endMillDiameterMin, depth: L.endMillDepthMax },
      { kind: 'end-mill', toolDiameter: L.endMillDiameterMax, depth: 0.1e-3 },
      { kind: 'etch', edgeBias: -L.etchBiasMax, minFeature: L.etchMinFeatureMax },
      { kind: 'etch', edgeBias: L.etchBiasMax, minFeature: L.etchMinFeatureMin },
    ];
    for (const p of ok) { const d = example('demo.json'); d.process = p; expect(() => load(d)).not.toThrow(); }
    const bad: [Record<string, unknown>, string][] = [
      [{ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: L.vBitAngleDegMax + 1, depth: 50e-6 }, 'process.angleDeg'],
      [{ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: L.vBitAngleDegMin - 1, depth: 50e-6 }, 'process.angleDeg'],
      [{ kind: 'v-bit', tipWidth: L.vBitTipMax * 1.01, angleDeg: 30, depth: 50e-6 }, 'process.tipWidth'],
      [{ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: L.vBitDepthMax * 1.01 }, 'process.depth'],
      [{ kind: 'end-mill', toolDiameter: L.endMillDiameterMax * 1.01, depth: 0.1e-3 }, 'process.toolDiameter'],
      [{ kind: 'end-mill', toolDiameter: L.endMillDiameterMin * 0.99, depth: 0.1e-3 }, 'process.toolDiameter'],
      [{ kind: 'end-mill', toolDiameter: 0.4e-3, depth: L.endMillDepthMax * 1.01 }, 'process.depth'],
      [{ kind: 'etch', edgeBias: L.etchBiasMax * 1.01, minFeature: 0.2e-3 }, 'process.edgeBias'],
      [{ kind: 'etch', edgeBias: 0, minFeature: L.etchMinFeatureMax * 1.01 }, 'process.minFeature'],
    ];
    for (const [p, field] of bad) {
      const d = example('demo.json'); d.process = p;
      expect(refusal(d).some((m) => m.startsWith(`${field}:`))).toBe(true);
    }
  });
});

describe('a board beyond the size limit is refused during sizing, before any geometry', () => {
  it('the demo at the lowest design frequency (1 MHz): a too-large problem naming the longest pieces', () => {
    const d = example('demo.json');
    d.frequency = { f0: 1e6, band: { start: 1e6, stop: 2e6 } };
    const sized = sizeDesign(load(d));
    const p = sized.problems.find((x) => x.code === 'too-large');
    expect(p).toBeDefined();
    // The two quarter-wave pieces are tens of metres long at 1 MHz (λ/4 ≈ 42 m on this laminate).
    expect(p!.subjects).toEqual(expect.arrayContaining(['qwl', 'qwr']));
    expect(p!.message).toMatch(/1000 mm/);
    // Geometry refuses it at once with the sizing problem, instead of working on metres of copper.
    expect(() => buildBoardGeometry(sized)).toThrow(InputError);
    const c = checkBoard(sized);
    expect(c.geometry).toBeNull();
    expect(c.findings.map((f) => f.code)).toContain('layout');
  });
  it('the Wilkinson example at 1 MHz and a 10 m line: refused the same way', () => {
    const w = example('wilkinson-2g45.json');
    w.frequency = { f0: 1e6, band: { start: 1e6, stop: 2e6 } };
    expect(sizeDesign(load(w)).problems.some((x) => x.code === 'too-large')).toBe(true);
    const o = example('open-stub-match.json');
    (o.segments as { id: string; length: unknown }[]).find((s) => s.id === 'toload')!.length = { by: 'length', length: 10 };
    expect(sizeDesign(load(o)).problems.some((x) => x.code === 'too-large')).toBe(true);
  });
  it('a board outline larger than the limit is refused too; one within it is not', () => {
    const o = example('open-stub-match.json');
    const s = BOARD_SIZE_LIMIT * 1.2;
    o.board = { outline: [{ x: 0, y: -0.013 }, { x: s, y: -0.013 }, { x: s, y: 0.008 }, { x: 0, y: 0.008 }] };
    expect(sizeDesign(load(o)).problems.some((x) => x.code === 'too-large')).toBe(true);
    expect(sizeDesign(load(example('open-stub-match.json'))).problems).toEqual([]);
  });
});

describe('every polygon operation has a work bound', () => {
  const squares = (n: number, size: number): Region[] =>
    Array.from({ length: n }, (_, i) => ({ outer: rectRing(i * 2 * size, 0, i * 2 * size + size, size), holes: [] }));
  it('an offset that would make millions of points is refused with an InputError, not run', () => {
    // 1000 small squares grown by 5.7 m with round joins flattened to 1 µm: ~5 000 points per ring.
    const e = (() => { try { offsetRegions(squares(1000, 1e-3), 5.7, 'round'); return null; } catch (x) { return x; } })();
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).message).toMatch(/at most .* points/);
  });
  it('a union over the point bound is refused; under it, it runs', () => {
    const many = Array.from({ length: Math.ceil(MAX_ENGINE_POINTS / 4) + 1 }, (_, i) => ({ outer: rectRing(i * 1e-5, 0, i * 1e-5 + 5e-6, 5e-6), holes: [] }));
    expect(() => unionRegions(many)).toThrow(InputError);
    expect(unionRegions(squares(10, 1e-3))).toHaveLength(10);
  });
  it('the round-tool check refuses a tool radius that would need an unbounded number of tiles or points', () => {
    const sized = sizeDesign(load(example('open-stub-match.json')));
    const g = buildBoardGeometry(sized);
    // A 5.7 m radius (the 179.9° V-bit's half cut): the closing's negative offset sweeps every edge over every other.
    expect(() => untoolableCopper(g, 5.7)).toThrow(/units of work/);
    // Tiles far finer than the board: refused by count instead of worked through one by one.
    expect(() => untoolableCopper(g, 1e-7, { tile: 1e-9 })).toThrow(/tiles/);
    expect(() => untoolableCopper(g, 0.0635e-3)).not.toThrow();
  });
});

describe('sizing problems come before geometry errors (item 4)', () => {
  it('the demo with its quarter-wave piece made an 0805 part builds copper (a straight line through a junction with a part)', () => {
    const d = example('demo.json') as { segments: Record<string, unknown>[] };
    const i = d.segments.findIndex((s) => s.id === 'qwl');
    const q = d.segments[i]!;
    d.segments[i] = { id: q.id, kind: 'lumped', a: q.a, b: q.b, part: 'resistor', value: 100, size: '0805', width: q.width };
    const sized = sizeDesign(load(d));
    expect(sized.problems).toEqual([]);
    const g = buildBoardGeometry(sized);
    for (const p of g.pieces) for (const r of p.regions) expect(r.outer.length).toBeGreaterThanOrEqual(3);
    expect(checkBoard(sized).geometry).not.toBeNull();
  });
  it('an impedance the model cannot reach at a junction: the sizing problem, not a geometry message', () => {
    const d = example('demo.json') as { segments: { id: string; width: unknown }[] };
    d.segments.find((s) => s.id === 'qwl')!.width = { by: 'z0', z0: 5000 };
    const sized = sizeDesign(load(d));
    expect(sized.problems.some((p) => p.subjects.includes('qwl'))).toBe(true);
    const c = checkBoard(sized);
    expect(c.findings.every((f) => !/regions\[|ring of at least/.test(f.message))).toBe(true);
    expect(c.findings.some((f) => f.code === 'layout' && f.subjects.includes('qwl'))).toBe(true);
  });
});
