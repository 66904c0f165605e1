import { beforeAll, describe, expect, it } from 'vitest';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { buildBoardGeometry } from '../../core/layout/geometry.ts';
import { checkFabrication, cutWidth, referenceGroundShiftPct, untoolableCopper } from '../../core/layout/checks.ts';
import { regionsArea } from '../../core/geometry/polygons.ts';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign } from '../../core/design/parse.ts';
import type { DesignDoc } from '../../core/design/types.ts';
import { design, port, line, wd, lenOf } from './layout-fixtures.ts';

beforeAll(async () => { await initPolygons(); });
const run = (d: DesignDoc, opts = {}) => { const s = sizeDesign(d); return checkFabrication(s, buildBoardGeometry(s), opts); };
const endMill = (d: number) => ({ kind: 'end-mill' as const, toolDiameter: d, depth: 0.1e-3 });

/** Two separate straight lines `gap` apart (edge to edge), each 1 mm wide and 10 mm long. */
const pair = (gap: number, process = endMill(0.2e-3)) => design({
  process,
  nodes: [port('a1', 0, 0), port('b1', 0.01, 0), port('a2', 0, 1e-3 + gap), port('b2', 0.01, 1e-3 + gap)],
  segments: [line('l1', 'a1', 'b1', wd(1e-3), lenOf(0.01)), line('l2', 'a2', 'b2', wd(1e-3), lenOf(0.01))],
});

describe('tool cut width', () => {
  it('V-bit: tip + 2·depth·tan(angle/2) (plain geometry): 30°, 0.1 mm tip, 0.05 mm deep → 0.12679 mm', () => {
    expect(cutWidth({ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 }) * 1e3).toBeCloseTo(0.1 + 2 * 0.05 * Math.tan(Math.PI / 12), 9);
    expect(cutWidth(endMill(0.4e-3))).toBe(0.4e-3);
    // Project rule (calculated): 60° at 0.1 mm deep → 0.215 mm; 90° at 0.1 mm → 0.30 mm (0.1 mm tips).
    expect(cutWidth({ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 60, depth: 0.1e-3 }) * 1e3).toBeCloseTo(0.215, 3);
    expect(cutWidth({ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 90, depth: 0.1e-3 }) * 1e3).toBeCloseTo(0.30, 3);
    // Etching: the artwork gap is the final gap minus twice the edge bias.
    expect(cutWidth({ kind: 'etch', edgeBias: 35e-6, minFeature: 0.2e-3 })).toBeCloseTo(0.27e-3, 12);
  });
});

describe('gaps and widths the process cannot make', () => {
  it('a 0.1 mm gap under a 0.2 mm end mill is an error naming both pieces; 0.3 mm is fine', () => {
    const f = run(pair(0.1e-3));
    const g = f.find((x) => x.code === 'min-gap')!;
    expect(g.severity).toBe('error');
    expect(new Set(g.subjects)).toEqual(new Set(['l1', 'l2']));
    expect(g.at!.y).toBeGreaterThan(0.5e-3); expect(g.at!.y).toBeLessThan(0.6e-3);
    expect(run(pair(0.3e-3)).some((x) => x.code === 'min-gap')).toBe(false);
  });
  it('node copper counts too: a via pad 0.1 mm from an unconnected line is a gap error naming the node', () => {
    const d = design({
      process: endMill(0.2e-3),
      nodes: [port('a', 0, 0), { id: 'e', kind: 'short', at: { x: 0.01, y: 0 }, via: { drill: 0.8e-3, pad: 1.6e-3, count: 1 } }, port('b1', 0.005, 1.4e-3), port('b2', 0.015, 1.4e-3)],
      segments: [line('la', 'a', 'e', wd(1e-3), lenOf(0.01)), line('lb', 'b1', 'b2', wd(1e-3), lenOf(0.01))],
    });
    const s = sizeDesign(d);
    const e = s.nodes.find((n) => n.id === 'e')!.pos;
    d.nodes[2] = port('b1', e.x - 0.005, 1.4e-3); d.nodes[3] = port('b2', e.x + 0.005, 1.4e-3); // centre line B over the via
    const gaps = run(d).filter((x) => x.code === 'min-gap');
    expect(gaps).toHaveLength(1);
    expect(new Set(gaps[0]!.subjects)).toEqual(new Set(['e', 'lb']));
  });
  it('etching: a line below the minimum feature is an error', () => {
    const d = design({ process: { kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 }, nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('thin', 'a', 'b', wd(0.15e-3), lenOf(0.01))] });
    const f = run(d).find((x) => x.code === 'min-width')!;
    expect(f.severity).toBe('error');
    expect(f.subjects).toEqual(['thin']);
  });
  it('crossing pieces that are not connected overlap: an error naming both', () => {
    const d = design({
      nodes: [port('a', 0, 0), port('b', 0.01, 0), port('c', 0.005, -0.005), port('e', 0.005, 0.005)],
      segments: [line('x', 'a', 'b', wd(1e-3), lenOf(0.01)), line('y', 'c', 'e', wd(1e-3), lenOf(0.01))],
    });
    const f = run(d).filter((x) => x.code === 'overlap');
    expect(f).toHaveLength(1);
    expect(new Set(f[0]!.subjects)).toEqual(new Set(['x', 'y']));
  });
});

describe('what a round tool cannot remove', () => {
  it('a tee keeps two fillets of (1 − π/4)·r² each (disc closing of a right-angled inside corner)', () => {
    const r = 0.2e-3;
    const d = design({ process: endMill(2 * r), nodes: [port('a', -0.01, 0), { id: 'j', kind: 'junction', at: { x: 0, y: 0 } }, port('b', 0.01, 0), port('c', 0, 0.01)],
      segments: [line('m1', 'a', 'j', wd(1e-3), lenOf(0.01)), line('m2', 'j', 'b', wd(1e-3), lenOf(0.01)), line('br', 'j', 'c', wd(1e-3), lenOf(0.01))] });
    const g = buildBoardGeometry(sizeDesign(d));
    const left = untoolableCopper(g, r);
    expect(left).toHaveLength(2);
    // Round joins are flattened to 1 µm chords: each fillet may differ by at most a 1 µm band along its quarter arc.
    expect(Math.abs(regionsArea(left) - 2 * (1 - Math.PI / 4) * r * r)).toBeLessThan(2 * (Math.PI / 2) * r * 1e-6);
  });
  it('tiling gives the same leftovers as one window (the branch-line example, 0.4 mm end mill)', () => {
    const text = readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'branchline-10g4.json'), 'utf8');
    const r0 = parseDesign(text);
    if (!r0.ok) throw new Error('example did not load');
    const g = buildBoardGeometry(sizeDesign(r0.doc));
    const whole = regionsArea(untoolableCopper(g, 0.2e-3));
    const tiled = regionsArea(untoolableCopper(g, 0.2e-3, { tile: 2e-3 }));
    expect(whole).toBeGreaterThan(0);
    expect(Math.abs(tiled - whole) / whole).toBeLessThan(1e-3);
  });
});

describe('board, keep-outs, ground copper', () => {
  it('copper off the board outline and inside a keep-out are errors naming the piece', () => {
    const d = pair(1e-3);
    d.board = { outline: [{ x: 0.001, y: -0.001 }, { x: 0.02, y: -0.001 }, { x: 0.02, y: 0.01 }, { x: 0.001, y: 0.01 }] };
    d.areas = [{ id: 'k', kind: 'keep-out', polygon: [{ x: 0.004, y: 1.5e-3 }, { x: 0.006, y: 1.5e-3 }, { x: 0.006, y: 3e-3 }, { x: 0.004, y: 3e-3 }] }];
    const f = run(d);
    const off = f.find((x) => x.code === 'off-board')!;
    expect(new Set(off.subjects)).toEqual(new Set(['l1', 'l2']));
    const k = f.find((x) => x.code === 'keep-out')!;
    expect(k.subjects).toEqual(['k', 'l2']);
  });
  it('ground copper closer than 3h warns, quoting the reference shift of the project’s coplanar-ground check (s/h = 1: −5.0 %)', () => {
    expect(referenceGroundShiftPct(1)).toBeCloseTo(-5.0, 9);
    expect(referenceGroundShiftPct(3)).toBeCloseTo(-0.48, 9);
    expect(referenceGroundShiftPct(0.1)).toBeNull();
    const d = design({ nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', wd(1.1e-3), lenOf(0.01))] });
    const box = [{ x: 0, y: -0.005 }, { x: 0.01, y: -0.005 }, { x: 0.01, y: 0.005 }, { x: 0, y: 0.005 }];
    d.areas = [{ id: 'gnd', kind: 'ground-copper', polygon: box, clearance: d.substrate.h }];
    const f = run(d).find((x) => x.code === 'ground-near')!;
    expect(f.subjects).toEqual(['gnd', 'l']);
    expect(f.message).toMatch(/about 5\.0 %/);
    d.areas[0]!.clearance = 3.2 * d.substrate.h;
    const f2 = run(d).filter((x) => x.code === 'ground-near');
    expect(f2.some((x) => x.severity === 'warning')).toBe(false);
    // Still under 5 W (5.5 mm): the common-practice coplanar-rule note, as information only.
    expect(f2.map((x) => x.severity)).toEqual(['info']);
    d.areas[0]!.clearance = 6e-3;
    expect(run(d).some((x) => x.code === 'ground-near')).toBe(false);
  });
});

describe('loss budget', () => {
  it('a 300 mm 50 Ω line on glass-epoxy at 7 GHz exceeds 1 dB and the laminate is flagged above 6 GHz (common practice)', () => {
    const fr4 = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };
    const d = design({ substrate: fr4, f0: 7e9, nodes: [port('a', 0, 0), port('b', 0.3, 0)], segments: [line('long', 'a', 'b', wd(3e-3), lenOf(0.3))] });
    const f = run(d);
    const loss = f.find((x) => x.code === 'loss-budget')!;
    expect(loss.severity).toBe('warning');
    expect(loss.subjects).toContain('long');
    expect(loss.fix).toMatch(/low-loss laminate/);
    expect(f.some((x) => x.code === 'lossy-laminate')).toBe(true);
    expect(run(d, { lossLimitDb: 100 }).some((x) => x.code === 'loss-budget')).toBe(false);
  });
  it('paths that lose alike are named and marked alike: the demo\'s four symmetric paths, each piece of each path', () => {
    const r = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'demo.json'), 'utf8'));
    if (!r.ok) throw new Error('bad example');
    const loss = run(r.doc, { lossLimitDb: 0.1 }).find((x) => x.code === 'loss-budget')!;
    // The demo is drawn symmetric about x = 0 (its notes), so the four paths lose the same.
    // Named by their labels, as every face names ports (core/design/names.ts).
    expect(loss.message).toMatch(/^4 paths from input \(to patch 1, patch 2, patch 3, patch 4\) each lose [\d.]+ dB/);
    for (const id of ['up1', 'up2', 'up3', 'up4', 'br1', 'br2', 'br3', 'br4', 'feed']) expect(loss.subjects, id).toContain(id);
  });
});
