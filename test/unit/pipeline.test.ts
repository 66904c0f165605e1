/**
 * core/pipeline: the stage memo (bounded, least recently used dropped first, refusals kept), the revision key, the
 * refusals (naming the pieces), and the isolation width from the design's process.
 * Outside facts: a V-bit's cut at depth d is tip + 2·d·tan(angle/2) (plain trigonometry of a V); the outline of a
 * region offset by a larger radius encloses more area (Steiner 1840: A + P·r + π·r² for a convex region).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { DesignPipeline, StageMemo, exportDesign, initPolygons, parseDesign, processCut, regionsArea, revisionOf, InputError, type DesignDoc, type FabProcess } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const load = (f: string): DesignDoc => { const r = parseDesign(readFileSync(join(EX, f), 'utf8')); if (!r.ok) throw new Error('unreadable'); return r.doc; };

beforeAll(async () => { await initPolygons(); });

describe('StageMemo', () => {
  it('computes once per key, drops the least recently used beyond its capacity, and keeps refusals', () => {
    const m = new StageMemo(2);
    let n = 0;
    const f = () => ++n;
    expect(m.get('s', 'a', f)).toBe(1);
    expect(m.get('s', 'a', f)).toBe(1);
    expect(m.get('s', 'b', f)).toBe(2);
    m.get('s', 'a', f); // a is now the most recent
    expect(m.get('s', 'c', f)).toBe(3); // b dropped
    expect(m.size).toBe(2);
    expect(m.get('s', 'a', f)).toBe(1);
    expect(m.get('s', 'b', f)).toBe(4);
    expect(m.count('s')).toBe(4);
    let thrown = 0;
    const bad = () => { thrown++; throw new Error('no'); };
    expect(() => m.get('t', 'x', bad)).toThrow('no');
    expect(() => m.get('t', 'x', bad)).toThrow('no');
    expect(thrown).toBe(1);
  });
});

describe('revision', () => {
  it('follows the content, not the object or the writing app', () => {
    const a = load('demo.json');
    const b = structuredClone(a);
    expect(revisionOf(b)).toBe(revisionOf(a));
    expect(revisionOf({ ...b, app: 'someone else 9.9' })).toBe(revisionOf(a));
    const c = structuredClone(a);
    c.nodes[1]!.at = { x: c.nodes[1]!.at.x + 1e-4, y: c.nodes[1]!.at.y };
    expect(revisionOf(c)).not.toBe(revisionOf(a));
  });
});

describe('stages', () => {
  it('size and build a board once per revision, whichever stage asks', () => {
    const p = new DesignPipeline();
    const doc = load('open-stub-match.json');
    p.board(doc); p.findings(doc); p.plan(doc, {}); p.netlist(doc); p.paths(doc);
    p.board(structuredClone(doc));
    expect(p.count('sized')).toBe(1);
    expect(p.count('board')).toBe(1);
    const moved = structuredClone(doc);
    moved.nodes[0]!.at = { x: moved.nodes[0]!.at.x - 1e-3, y: moved.nodes[0]!.at.y };
    p.board(moved);
    expect(p.count('sized')).toBe(2);
  });
  it('refuse an unfinished network naming its node, and a stub too short naming the stub', () => {
    const p = new DesignPipeline();
    const doc = load('open-stub-match.json');
    const unfinished = { ...doc, segments: doc.segments.filter((s) => s.id !== 'stub') };
    expect(() => p.board(unfinished)).toThrow(/stubend/);
    const short = structuredClone(doc);
    const stub = short.segments.find((s) => s.id === 'stub')!;
    (stub as { length: unknown }).length = { by: 'length', length: 1e-4 };
    let err: unknown;
    try { p.board(short); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).code).toBe('impossible-layout');
    expect((err as InputError).got).toMatch(/piece stub/);
  });
});

describe('the isolation width comes from the process', () => {
  it('V-bit: tip + 2·depth·tan(angle/2); end mill: its diameter; etching: none', () => {
    const v: FabProcess = { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 60, depth: 0.1e-3 };
    const w = 0.1e-3 + 2 * 0.1e-3 * Math.tan(Math.PI / 6);
    expect(processCut(v)!.cutWidth).toBeCloseTo(w, 12);
    // The channel beside the copper: the passes the default 0.7 mm clearance needs, each 0.6 of a cut further out.
    const cut = processCut(v)!;
    expect(cut.passes).toBe(1 + Math.ceil((0.7e-3 - w) / (0.6 * w)));
    expect(cut.isolationGap).toBeCloseTo(w + (cut.passes - 1) * 0.6 * w, 12);
    expect(processCut({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3 })!.cutWidth).toBe(0.4e-3);
    expect(processCut({ kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 })).toBeNull();
  });
  it('the isolation layer uses the process cut unless a tool overrides it', () => {
    const p = new DesignPipeline();
    const doc = load('branchline-10g4.json'); // end mill 0.4 mm
    const cut = processCut(doc.process)!.cutWidth; // the outline of one pass's tool centre
    const own = p.prepared(doc, { isolation: true });
    const wide = p.prepared(doc, { isolation: true, tool: 2 * cut });
    expect(own.isolationWidth).toBe(cut);
    expect(wide.isolationWidth).toBe(2 * cut);
    // A wider tool's outline encloses more area (each edge moves out by half the width).
    expect(regionsArea(wide.geometry.isolation!)).toBeGreaterThan(regionsArea(own.geometry.isolation!));
    const r = exportDesign(p, doc, { formats: ['dxf'], base: 'b', version: 't', layers: ['copper', 'isolation'] });
    expect(r.files[0]!.text).toContain('ISOLATION_PATH');
  });
  it('an etched design asks for a width instead of failing silently', () => {
    const p = new DesignPipeline();
    const doc = load('wilkinson-2g45.json');
    expect(() => exportDesign(p, doc, { formats: ['svg'], base: 'w', version: 't', layers: ['copper', 'isolation'] })).toThrow(/tool width/);
    expect(exportDesign(p, doc, { formats: ['svg'], base: 'w', version: 't', layers: ['copper', 'isolation'], tool: 0.2e-3 }).files[0]!.text).toContain('isolation-path');
  });
});

describe('DesignPipeline.check (what `stripwright build` reports)', () => {
  it('shares the sizing and board with export, and sizes a --junctions override as its own revision', () => {
    const p = new DesignPipeline();
    const doc = load('branchline-10g4.json');
    const own = p.check(doc);
    expect(p.count('sized')).toBe(1);
    expect(p.count('board')).toBe(1);
    // The same findings export's gate reads: build and export judge one board.
    expect(own.findings.map((f) => f.code)).toEqual(p.findings(doc).map((f) => f.code));
    p.check(doc);
    expect(p.count('checked')).toBe(1);
    expect(p.count('sized')).toBe(1);
    const ideal = p.check(doc, { junctions: 'ideal' });
    expect(ideal.sized.junctions).toBe('ideal');
    expect(own.sized.junctions).toBe('modelled');
    expect(p.count('sized')).toBe(2);
    // Ideal junctions join at the centre: the shunt arm's span differs from the modelled one (tee reference planes).
    const span = (c: typeof own) => c.sized.pieces.find((x) => x.id === 'shunt1')!.span;
    expect(span(ideal)).not.toBeCloseTo(span(own), 6);
    // Paths carry their sensitivities (build prints them), and a tolerance is a separate request of the same board.
    expect(own.paths.length).toBeGreaterThan(0);
    p.check(doc, { toleranceDeg: 2 });
    expect(p.count('checked')).toBe(3);
    expect(p.count('board')).toBe(2);
  });
});
