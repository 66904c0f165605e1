/**
 * Each sizing step alone (core/layout/sizing/), on small invented designs (test/unit/layout-fixtures.ts).
 * Outside sources beside each check:
 *  - widths: Hammerstad & Jensen 1980 (IEEE MTT-S Digest, eq. 1–6) quasi-static Z0 of the synthesised width — a
 *    50 Ω line on εr 3.66, h 0.508 mm is about 1.1 mm wide (from memory; the check is that analysis of the width
 *    gives back the asked Z0, which is exact whatever the model);
 *  - nominal lengths: l = θ·λg/360 with λg = c/(f0·√εeff) (definition of electrical length);
 *  - open end: Kirschning, Jansen & Koster 1981 Δl, the same function the discontinuity tests check against its paper;
 *  - spans: copper length = nominal − cuts − pads, span = nominal − cuts + arc extras (the project's own rule);
 *  - placement: a node lands at its neighbour plus span along the drawn direction (plain geometry).
 */
import { describe, expect, it } from 'vitest';
import { sizingContext, type Work } from '../../core/layout/sizing/context.ts';
import { buildTopology, checkDegree } from '../../core/layout/sizing/topology.ts';
import { sizeWidths } from '../../core/layout/sizing/widths.ts';
import { sizeLengths } from '../../core/layout/sizing/lengths.ts';
import { handleNode, sizeEnds } from '../../core/layout/sizing/ends/index.ts';
import { sizeSpan } from '../../core/layout/sizing/spans.ts';
import { placeDesign } from '../../core/layout/sizing/placement.ts';
import { openEndExtension } from '../../core/discontinuity/kirschningJansenKoster1981OpenEnd.ts';
import { analyzeLine } from '../../core/line/index.ts';
import { design, port, open, vertex, junction, line, z, degs, lenOf, RO_LIKE } from './layout-fixtures.ts';

const C = 299_792_458;
/** A 50 Ω through line p1 → v → p2 with a 90° bend, and an open stub. */
const bentLine = () => design({
  nodes: [port('p1', 0, 0), vertex('v', 0.02, 0), port('p2', 0.02, 0.02, Math.PI / 2)],
  segments: [line('a', 'p1', 'v', z(50), degs(90)), line('b', 'v', 'p2', z(50), lenOf(0.015))],
});
const stub = () => design({
  nodes: [port('p1', 0, 0), open('e', 0.03, 0)],
  segments: [line('s', 'p1', 'e', z(50), degs(90))],
});
function upTo(doc: ReturnType<typeof stub>, steps: 'widths' | 'lengths' | 'ends') {
  const ctx = sizingContext(doc, {});
  const adj = buildTopology(ctx);
  const works = sizeWidths(ctx);
  const byId = new Map<string, Work>(works.map((w) => [w.seg.id, w]));
  if (steps !== 'widths') sizeLengths(ctx, works);
  const nodes = steps === 'ends' ? sizeEnds(ctx, adj, byId) : [];
  return { ctx, adj, works, byId, nodes };
}

describe('topology', () => {
  it('lists the pieces at each node and names a node with too few or too many (the design\'s own degree table)', () => {
    const ctx = sizingContext(design({ nodes: [port('p1', 0, 0), junction('j', 0.01, 0), port('p2', 0.02, 0)], segments: [line('a', 'p1', 'j', z(50), degs(90)), line('b', 'j', 'p2', z(50), degs(90))] }), {});
    const adj = buildTopology(ctx);
    expect(adj.get('j')).toEqual(['a', 'b']);
    expect(ctx.problems.map((p) => p.subjects[0])).toEqual(['j']);
    expect(ctx.problems[0]!.message).toMatch(/make it a vertex/);
    const c2 = sizingContext(stub(), {});
    checkDegree(c2, port('p9', 0, 0), ['x', 'y']);
    expect(c2.problems[0]!.code).toBe('bad-topology');
    checkDegree(c2, port('p8', 0, 0), ['x']);
    expect(c2.problems).toHaveLength(1);
  });
});

describe('widths', () => {
  it('synthesises each line at f0 so that analysis gives back the asked Z0', () => {
    const { works, ctx } = upTo(stub(), 'widths');
    const w = works[0]!;
    expect(w.ok).toBe(true);
    const back = analyzeLine(RO_LIKE, w.piece.width, ctx.f0);
    expect(back.z0).toBeCloseTo(50, 3);
    expect(w.piece.width).toBeGreaterThan(0.9e-3);
    expect(w.piece.width).toBeLessThan(1.3e-3);
  });
  it('a width it cannot have is a problem naming the piece', () => {
    const doc = stub();
    (doc.segments[0] as { width: unknown }).width = { by: 'z0', z0: 5000 };
    const { works, ctx } = upTo(doc, 'widths');
    expect(works[0]!.ok).toBe(false);
    expect(ctx.problems[0]!.subjects).toEqual(['s']);
  });
});

describe('nominal lengths', () => {
  it('90° at f0 is a quarter of the guided wavelength; a given length is kept', () => {
    const { works, ctx } = upTo(bentLine(), 'lengths');
    const a = works[0]!.piece;
    const lambdaG = C / (ctx.f0 * Math.sqrt(a.line!.epsEff));
    expect(a.nominalLength).toBeCloseTo(lambdaG / 4, 9);
    expect(works[1]!.piece.nominalLength).toBe(0.015);
  });
});

describe('end handlers', () => {
  it('an open end cuts the stub by the Kirschning–Jansen–Koster Δl and records it', () => {
    const { works, ctx } = upTo(stub(), 'ends');
    const w = works[0]!;
    const r = w.endB!.r;
    const dl = openEndExtension({ u: w.piece.width / RO_LIKE.h, er: RO_LIKE.er, eeStatic: r.epsEffStatic, h: RO_LIKE.h }).dl;
    expect(w.cut).toBeCloseTo(dl, 15);
    expect(w.piece.compensations.find((c) => c.model === 'open-end')!.amount_m).toBeCloseTo(dl, 15);
    expect(ctx.problems).toEqual([]);
  });
  it('a vertex bend records the bend and its miter on the node; a piece drawn with no length is named', () => {
    const { nodes } = upTo(bentLine(), 'ends');
    const v = nodes.find((n) => n.id === 'v')!;
    expect(v.bend!.turn).toBeCloseTo(Math.PI / 2, 12);
    expect(v.bend!.miter).toBeDefined();
    const doc = bentLine();
    doc.nodes[2]!.at = { ...doc.nodes[1]!.at };
    const s = upTo(doc, 'lengths');
    const sized = { id: 'v', kind: 'vertex' as const, at: doc.nodes[1]!.at, pos: { x: NaN, y: NaN }, segments: ['a', 'b'], warnings: [] };
    handleNode(s.ctx, doc.nodes[1]!, sized, ['a', 'b'], s.byId);
    expect(s.ctx.problems.some((p) => p.subjects.includes('b') && /same point/.test(p.message))).toBe(true);
  });
});

describe('spans', () => {
  it('copper length = nominal − cuts − pads; span = nominal − cuts + arc extras; too short is named', () => {
    const { works, ctx } = upTo(stub(), 'ends');
    const w = works[0]!;
    w.pads = 1e-4;
    sizeSpan(ctx, w);
    expect(w.piece.length).toBeCloseTo(w.piece.nominalLength - w.cut - 1e-4, 15);
    expect(w.piece.span).toBeCloseTo(w.piece.nominalLength - w.cut, 15);
    const short = { ...w, piece: { ...w.piece, compensations: [] }, cut: w.piece.nominalLength * 2 };
    sizeSpan(ctx, short);
    expect(ctx.problems.at(-1)!.code).toBe('too-short');
    expect(ctx.problems.at(-1)!.subjects).toEqual(['s']);
  });
});

describe('placement', () => {
  it('places each node at its neighbour plus the span along the drawn direction', () => {
    const { ctx, works, byId, adj, nodes } = upTo(bentLine(), 'ends');
    for (const w of works) sizeSpan(ctx, w);
    const out = new Map(nodes.map((n) => [n.id, n]));
    expect(placeDesign(ctx, works, byId, adj, out)).toBe('p1');
    const v = out.get('v')!.pos, p2 = out.get('p2')!.pos;
    expect(v.x).toBeCloseTo(works[0]!.piece.span, 12);
    expect(v.y).toBeCloseTo(0, 12);
    expect(p2.x).toBeCloseTo(v.x, 12);
    expect(p2.y).toBeCloseTo(works[1]!.piece.span, 12);
  });
});
