import { describe, expect, it } from 'vitest';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { InputError } from '../../core/util/errors.ts';
import { design, port, vertex, junction, open, line, z, wd, degs, lenOf, RO_LIKE } from './layout-fixtures.ts';
import { oracleLine, oracleSynth, oracleOpenEnd, C0 } from './layout-oracle.ts';

const h = RO_LIKE.h, er = RO_LIKE.er;

describe('widths and lengths at f0', () => {
  it('50 Ω at 10 GHz on εr 3.66 / 0.508 mm (t = 0): W = 1.1155 mm (checked example worked by hand; Kirschning & Jansen 1982, Electronics Letters 18(6))', () => {
    const s = sizeDesign(design({ f0: 10e9, nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', z(50), lenOf(0.01))] }));
    expect(s.problems).toEqual([]);
    expect(s.pieces[0]!.width * 1e3).toBeCloseTo(1.1155, 4);
    expect(s.pieces[0]!.z0).toBeCloseTo(50, 8);
  });
  it('a 90° line is λg/4 = c0/(4 f √εe(f)) with εe(f) from KJ 1982 (example worked by hand: W 1.0734 mm, t 35 µm, 10 GHz, εe 2.86086)', () => {
    const sub = { ...RO_LIKE, t: 35e-6 };
    const s = sizeDesign(design({ substrate: sub, f0: 10e9, nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', wd(1.0734e-3), degs(90))] }));
    const expected = C0 / (4 * 10e9 * Math.sqrt(2.86086));
    expect(Math.abs(s.pieces[0]!.length - expected) / expected).toBeLessThan(2e-5);
    expect(s.pieces[0]!.deg).toBeCloseTo(90, 6);
    expect(s.pieces[0]!.z0).toBeCloseTo(50.100, 2); // Z0(f) of Kirschning & Jansen 1982 = 50.100 Ω (worked by hand)
  });
  it('an independent transcription of HJ + KJ + JK (test/unit/layout-oracle.ts) gives the same widths for 35.36, 70.71 and 100 Ω at 5.8 GHz on 1.6 mm FR-4 with 35 µm copper', () => {
    const fr4 = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };
    for (const z0 of [35.36, 70.71, 100]) {
      const s = sizeDesign(design({ substrate: fr4, f0: 5.8e9, nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', z(z0), degs(90))] }));
      const W = oracleSynth(z0, fr4.h, fr4.t, fr4.er, 5.8e9);
      expect(Math.abs(s.pieces[0]!.width - W) / W).toBeLessThan(1e-6);
      const ee = oracleLine(W, fr4.h, fr4.t, fr4.er, 5.8e9).ee;
      expect(Math.abs(s.pieces[0]!.length - C0 / (4 * 5.8e9 * Math.sqrt(ee))) / s.pieces[0]!.length).toBeLessThan(1e-5);
    }
  });
  it('a drawn piece keeps the drawing: a drawn open stub ends where drawn and realises Δl more electrical length', () => {
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), open('e', 0.01, 0)], segments: [line('s', 'a', 'e', wd(1.1122e-3), { by: 'drawn' })] }));
    const p = s.pieces[0]!;
    expect(s.nodes.find((n) => n.id === 'e')!.pos.x).toBeCloseTo(0.01, 12);
    expect(p.length).toBeCloseTo(0.01, 12);
    expect(p.nominalLength - 0.01).toBeCloseTo(0.2174e-3, 7); // Δl of Kirschning, Jansen & Koster 1981, Electronics Letters 17(3)
    expect(p.effectiveDeg).toBeGreaterThan(p.deg);
  });
  it('drawn length is the distance between the drawn nodes', () => {
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), port('b', 0.003, 0.004)], segments: [line('l', 'a', 'b', z(50), { by: 'drawn' })] }));
    expect(s.pieces[0]!.length).toBeCloseTo(0.005, 12);
  });
});

describe('compensations', () => {
  const stub = (endNode: any, deg = 90) => design({
    nodes: [port('p', 0, 0), junction('t', 0.01, 0), port('q', 0.02, 0), endNode],
    segments: [line('in', 'p', 't', wd(1.1122e-3), lenOf(0.01)), line('out', 't', 'q', wd(1.1122e-3), lenOf(0.01)), line('stub', 't', endNode.id, wd(1.1122e-3), degs(deg))],
  });
  it('open stub drawn Δl = 0.2174 mm short (Kirschning, Jansen & Koster 1981, Electronics Letters 17(3), example worked by hand) and its far node moves in', () => {
    // Ideal junctions here, so the open end is the only correction on the stub (the tee's is tested below).
    const s = sizeDesign(stub(open('e', 0.01, 0.02)), { junctions: 'ideal' });
    const p = s.pieces.find((x) => x.id === 'stub')!;
    const oe = p.compensations.find((c) => c.model === 'open-end')!;
    expect(oe.applied).toBe(true);
    expect(oe.amount_m * 1e3).toBeCloseTo(0.2174, 4);
    expect(p.nominalLength - p.length).toBeCloseTo(oe.amount_m, 12);
    expect(p.effectiveDeg).toBeCloseTo(90, 6);
    const e = s.nodes.find((n) => n.id === 'e')!;
    expect(Math.hypot(e.pos.x - 0.01, e.pos.y) ).toBeCloseTo(p.length, 9);
    expect(e.open!.capacitance * 1e15).toBeCloseTo(24.5, 1); // C_oc from the KJK 1981 Δl
  });
  it('shorted stub drawn shorter by arctan(ωL/Z0)/β with the via L of Goldfarb–Pucel (65.1 pH for h 0.508, r 0.2 mm; Goldfarb & Pucel 1991, IEEE Microwave and Guided Wave Letters 1(6), from memory)', () => {
    const s = sizeDesign(stub({ id: 'e', kind: 'short', at: { x: 0.01, y: 0.02 }, via: { drill: 0.4e-3, pad: 0.8e-3, count: 1 } }));
    const p = s.pieces.find((x) => x.id === 'stub')!;
    const c = p.compensations.find((x) => x.model === 'via')!;
    const X = 2 * Math.PI * 2.45e9 * 65.1e-12;
    const want = Math.atan(X / p.line!.z0) / p.line!.beta;
    expect(Math.abs(c.amount_m - want) / want).toBeLessThan(2e-3);
    expect(s.nodes.find((n) => n.id === 'e')!.via!.L * 1e12).toBeCloseTo(65.1, 1);
  });
  it('tee planes (Hammerstad 1981) lengthen each arm by its shift, so its electrical length counts from the plane; a symmetric split gets equal shifts', () => {
    const s = sizeDesign(stub(open('e', 0.01, 0.02)));
    expect(s.junctions).toBe('modelled');
    const shift = (id: string) => s.pieces.find((p) => p.id === id)!.compensations.find((c) => c.model === 'tee-planes')!;
    for (const id of ['in', 'out', 'stub']) {
      expect(shift(id).applied).toBe(true);
      expect(shift(id).junction).toMatchObject({ kind: 'tee', modelled: true, inRange: true });
    }
    const t = s.nodes.find((n) => n.id === 't')!.tee!;
    expect(t.branch).toBe('stub');
    expect(t.main).toEqual(['in', 'out']);
    // Equal main arms: equal shifts (the paper's d1 for both), lengthening the copper (negative amount).
    expect(shift('in').amount_m).toBe(shift('out').amount_m);
    expect(-shift('in').amount_m).toBeCloseTo(t.atF0.d1[0], 15);
    expect(-shift('stub').amount_m).toBeCloseTo(t.atF0.d2, 15);
    // Fixed-length main arm: 10 mm plane to plane, so 10 mm + d1 of copper from the junction centre.
    const inArm = s.pieces.find((p) => p.id === 'in')!;
    expect(inArm.span).toBeCloseTo(0.01 + t.atF0.d1[0], 12);
    // Stub: 90° from the branch plane, minus the open end, plus d2.
    const stubP = s.pieces.find((p) => p.id === 'stub')!;
    const dl = stubP.compensations.find((c) => c.model === 'open-end')!.amount_m;
    expect(stubP.span).toBeCloseTo(stubP.nominalLength - dl + t.atF0.d2, 12);
    expect(stubP.effectiveDeg).toBeCloseTo(90, 9);
    // Where the planes lie (the model's geometry): the main planes just past the branch centreline, well inside the
    // branch's parallel-plate width; the branch plane inside the main line's parallel-plate width, short of its edge.
    expect(t.atF0.d1[0]).toBeGreaterThan(0);
    expect(t.atF0.d1[0]).toBeLessThan(t.atF0.perArm[0].D2 / 2);
    expect(t.atF0.d2).toBeGreaterThan(0);
    expect(t.atF0.d2).toBeLessThan(t.atF0.perArm[0].D1 / 2);
  });
  it('ideal junctions: the same shifts reported, not applied, and the arms measured from the centre', () => {
    const doc = { ...stub(open('e', 0.01, 0.02)), junctions: 'ideal' as const };
    const s = sizeDesign(doc);
    expect(s.junctions).toBe('ideal');
    const tees = s.pieces.flatMap((p) => p.compensations.filter((c) => c.model === 'tee-planes'));
    expect(tees).toHaveLength(3);
    expect(tees.every((c) => !c.applied && c.junction!.modelled === false)).toBe(true);
    // What ideal junctions leave: the ignored shift as phase, −β·d.
    const inArm = s.pieces.find((p) => p.id === 'in')!;
    const c = inArm.compensations.find((x) => x.model === 'tee-planes')!;
    expect(c.junction!.residual!.phaseDeg).toBeCloseTo((c.amount_m * inArm.line!.beta * 180) / Math.PI, 12);
    expect(inArm.span).toBeCloseTo(0.01, 12);
    // The option overrides the design's own setting.
    expect(sizeDesign(doc, { junctions: 'modelled' }).pieces.find((p) => p.id === 'in')!.span).toBeGreaterThan(0.01);
  });
  it('a Y-shaped split (arms not in a T) and a cross have no model: joined at the centre and reported as such', () => {
    const y = design({
      nodes: [port('p', 0, 0), junction('t', 0.01, 0), port('q', 0.02, 0.01), port('r', 0.02, -0.01)],
      segments: [line('in', 'p', 't', wd(1.1122e-3), lenOf(0.01)), line('a', 't', 'q', wd(1.1122e-3), lenOf(0.01)), line('b', 't', 'r', wd(1.1122e-3), lenOf(0.01))],
    });
    const s = sizeDesign(y);
    expect(s.nodes.find((n) => n.id === 't')!.tee).toBeUndefined();
    for (const p of s.pieces) {
      const c = p.compensations.find((x) => x.junction)!;
      expect(c.junction).toMatchObject({ kind: 'other', modelled: false, inRange: false, residual: null });
      expect(p.span).toBeCloseTo(0.01, 12);
    }
  });
  it('mitered bends keep the path length through the corner point; arcs keep it via the centreline arc', () => {
    const mk = (bend: any) => design({
      nodes: [port('a', 0, 0), vertex('v', 0.01, 0, bend), port('b', 0.01, 0.01)],
      segments: [line('l1', 'a', 'v', wd(1.1122e-3), lenOf(0.01)), line('l2', 'v', 'b', wd(1.1122e-3), lenOf(0.01))],
    });
    const m = sizeDesign(mk({ style: 'miter-optimal' }));
    expect(m.pieces.map((p) => p.length)).toEqual([0.01, 0.01]);
    expect(m.nodes.find((n) => n.id === 'v')!.bend!.miter!.fraction * 100).toBeCloseTo(55.38, 1); // optimal miter, Douville & James 1978, IEEE Trans. MTT 26(3)
    const R = 3e-3;
    const a = sizeDesign(mk({ style: 'arc', radius: R }));
    const [p1, p2] = a.pieces;
    // Straight part + half arc = requested 10 mm; the corner-to-corner span grows by R tan 45° − Rπ/4.
    expect(p1!.length).toBeCloseTo(0.01, 12);
    expect(p1!.span - p1!.length).toBeCloseTo(R - (R * Math.PI) / 4, 12);
    expect(p1!.compensations.find((c) => c.model === 'arc-bend')!.amount_m).toBeCloseTo(R, 12);
    expect(a.nodes.find((n) => n.id === 'b')!.pos.y).toBeCloseTo(p2!.span, 12);
  });
  it('the pads of a lumped part come off the line copper (pad extent along the line)', () => {
    const s = sizeDesign(design({
      nodes: [port('a', 0, 0), vertex('r1', 0.01, 0, { style: 'square' }), vertex('r2', 0.0116, 0, { style: 'square' }), port('b', 0.0216, 0)],
      segments: [line('l1', 'a', 'r1', wd(1e-3), lenOf(0.01)), { id: 'c', a: 'r1', b: 'r2', kind: 'lumped', part: 'capacitor', value: 1e-12, size: '0603', width: wd(1e-3) }, line('l2', 'r2', 'b', wd(1e-3), lenOf(0.01))],
    }));
    expect(s.problems).toEqual([]);
    const l1 = s.pieces[0]!;
    const pad = l1.compensations.find((c) => c.model === 'lumped-pad')!;
    expect(pad.amount_m).toBeCloseTo(0.4e-3, 12); // half of the 0.8 mm pad along the axis
    expect(l1.length).toBeCloseTo(0.01 - 0.4e-3, 12);
    expect(s.pieces[1]!.span).toBeCloseTo(1.6e-3, 12); // 0603 pitch
  });
});

describe('impossible requests are errors that name the pieces', () => {
  it('a dangling vertex, an end with two pieces, a junction with two', () => {
    const s = sizeDesign(design({
      nodes: [port('a', 0, 0), vertex('v', 0.01, 0), port('b', 0, 0.01), junction('j', 0.02, 0.02), port('c', 0.03, 0.02), port('d', 0.02, 0.03)],
      segments: [line('l1', 'a', 'v', z(50), lenOf(0.01)), line('l2', 'b', 'j', z(50), lenOf(0.01)), line('l3', 'b', 'c', z(50), lenOf(0.01)), line('l4', 'j', 'c', z(50), lenOf(0.01))],
    }));
    const codes = s.problems.map((p) => p.code);
    expect(codes).toContain('dangling-end');
    expect(s.problems.find((p) => p.code === 'dangling-end' && p.subjects.includes('v'))!.subjects).toContain('l1');
    expect(s.problems.some((p) => p.code === 'bad-topology' && p.subjects.includes('b'))).toBe(true);
    expect(s.problems.some((p) => p.subjects.includes('j'))).toBe(true);
  });
  it('a stub shorter than its open-end correction', () => {
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), open('e', 0.001, 0)], segments: [line('s', 'a', 'e', wd(1.1122e-3), lenOf(0.1e-3))] }));
    const p = s.problems.find((x) => x.code === 'too-short')!;
    expect(p.subjects).toEqual(['s']);
    expect(p.message).toMatch(/open-end/);
  });
  it('a loop whose fixed lengths cannot close names every piece of the loop; a drawn piece closes it', () => {
    // Ideal junctions: the loop's sides are exactly their fixed lengths.
    const mk = (closer: any) => ({ ...design({
      nodes: [port('p', -0.005, 0), junction('a', 0, 0), vertex('b', 0.01, 0, { style: 'square' }), vertex('c', 0.01, 0.01, { style: 'square' }), junction('d', 0, 0.01), port('q', -0.005, 0.01)],
      segments: [line('in', 'p', 'a', z(50), lenOf(0.005)), line('ab', 'a', 'b', z(50), lenOf(0.01)), line('bc', 'b', 'c', z(50), lenOf(0.01)), line('cd', 'c', 'd', z(50), lenOf(0.01)), line('da', 'd', 'a', z(50), closer), line('out', 'd', 'q', z(50), lenOf(0.005))],
    }), junctions: 'ideal' as const });
    const bad = sizeDesign(mk(lenOf(0.012)));
    const lp = bad.problems.find((p) => p.code === 'loop-mismatch')!;
    expect(new Set(lp.subjects)).toEqual(new Set(['ab', 'bc', 'cd', 'da']));
    expect(lp.message).toMatch(/2\.000 mm/);
    const good = sizeDesign(mk({ by: 'drawn' }));
    expect(good.problems).toEqual([]);
    expect(good.pieces.find((p) => p.id === 'da')!.length).toBeCloseTo(0.01, 9);
  });
  it('an impossible impedance is a bad-value problem naming the piece; strict mode throws impossible-layout', () => {
    const d = design({ nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', z(2000), lenOf(0.01))] });
    const s = sizeDesign(d);
    expect(s.problems[0]!.code).toBe('bad-value');
    expect(s.problems[0]!.subjects).toEqual(['l']);
    try { sizeDesign(d, { strict: true }); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).code).toBe('impossible-layout');
      expect((e as InputError).field).toBe('segments.l');
    }
  });
  it('a piece to a node that does not exist, or from a node to itself, is a problem, not a crash', () => {
    const s = sizeDesign(design({ nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'ghost', z(50), lenOf(0.01)), line('loop', 'b', 'b', z(50), lenOf(0.01))] }));
    expect(s.problems.some((p) => p.code === 'bad-topology' && p.subjects.includes('l') && /ghost/.test(p.message))).toBe(true);
    expect(s.problems.some((p) => p.subjects.includes('loop'))).toBe(true);
  });
  it('square bends are flagged above 2 GHz on boards of 0.8 mm and more (common practice), not below', () => {
    const mk = (f0: number) => sizeDesign(design({ f0, substrate: { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 },
      nodes: [port('a', 0, 0), vertex('v', 0.02, 0, { style: 'square' }), port('b', 0.02, 0.02)],
      segments: [line('l1', 'a', 'v', z(50), lenOf(0.02)), line('l2', 'v', 'b', z(50), lenOf(0.02))] })).nodes.find((n) => n.id === 'v')!.warnings;
    expect(mk(2.45e9).some((w) => /square 90\.0° bend/.test(w.message))).toBe(true);
    expect(mk(1e9).some((w) => /square/.test(w.message))).toBe(false);
  });
  it('a port heading that disagrees with the drawing is noted (the drawing wins)', () => {
    const s = sizeDesign(design({ nodes: [port('a', 0, 0, Math.PI / 2), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', z(50), lenOf(0.01))] }));
    const w = s.nodes.find((n) => n.id === 'a')!.warnings;
    expect(w.some((x) => /leaves at 90\.0°/.test(x.message))).toBe(true);
    expect(s.nodes.find((n) => n.id === 'b')!.pos.x).toBeCloseTo(0.01, 12);
  });
  it('a bad design frequency is an InputError naming frequency.f0', () => {
    const d = design({ nodes: [], segments: [] });
    d.frequency.f0 = -1;
    expect(() => sizeDesign(d)).toThrow(/frequency\.f0/);
  });
});

describe('tapers', () => {
  it('a linear taper by degrees: straight edges, sections summing to the length, Σβ·l = the electrical length asked', () => {
    const s = sizeDesign(design({
      f0: 5e9, nodes: [port('a', 0, 0), port('b', 0.02, 0)],
      segments: [{ id: 't', a: 'a', b: 'b', kind: 'taper', profile: 'linear', from: { by: 'z0', z0: 50 }, to: { by: 'z0', z0: 100 }, length: degs(180) }],
    }));
    const p = s.pieces[0]!;
    const ws = p.taperWidths!;
    const n = ws.length - 1;
    ws.forEach((w, k) => expect(w).toBeCloseTo(p.width + ((p.widthB! - p.width) * k) / n, 12));
    const L = p.sections!.reduce((a, x) => a + x.length, 0);
    expect(L).toBeCloseTo(p.nominalLength, 12);
    const phase = p.sections!.reduce((a, x) => a + x.beta * x.length, 0);
    expect((phase * 180) / Math.PI).toBeCloseTo(180, 6);
    expect(p.effectiveDeg).toBeCloseTo(180, 6);
    // ≥ 20 sections per guided wavelength at the top of the band (the project's own rule)
    expect(p.sections!.length).toBeGreaterThanOrEqual(Math.ceil((20 * L) / Math.min(...p.sections!.map((x) => (2 * Math.PI) / x.beta))) - 1);
  });
  it('a Klopfenstein taper whose ends are too close for the ripple asked is a bad-value problem naming it', () => {
    const s = sizeDesign(design({
      nodes: [port('a', 0, 0), port('b', 0.02, 0)],
      segments: [{ id: 't', a: 'a', b: 'b', kind: 'taper', profile: 'klopfenstein', from: { by: 'z0', z0: 50 }, to: { by: 'z0', z0: 51 }, length: lenOf(0.02), rippleDb: 20 }],
    }));
    expect(s.problems[0]!.subjects).toEqual(['t']);
    expect(s.problems[0]!.message).toMatch(/ripple/);
  });
});

describe('line cache reuse', () => {
  it('a cache is reused for an equal substrate (a copy), not for a changed one', async () => {
    const { LineCache } = await import('../../core/layout/lineCache.ts');
    const d = design({ nodes: [port('a', 0, 0), port('b', 0.01, 0)], segments: [line('l', 'a', 'b', z(50), lenOf(0.01))] });
    const cache = new LineCache({ ...d.substrate });
    expect(cache.fits({ ...d.substrate })).toBe(true);
    expect(cache.fits({ ...d.substrate, er: 3.7 })).toBe(false);
    expect(cache.fits(d.substrate, { dispersion: 'none' })).toBe(false);
    const w1 = sizeDesign(d, { cache }).pieces[0]!.width;
    d.substrate = { ...d.substrate, h: 0.8e-3 };
    const w2 = sizeDesign(d, { cache }).pieces[0]!.width;
    expect(w2).toBeGreaterThan(w1 * 1.3); // re-sized for the thicker board, not served from the stale cache
  });
});

describe('open-end extension agrees with a second transcription across widths', () => {
  it('KJK Δl for u = 0.2 … 8 (layout-oracle transcription of Kirschning, Jansen & Koster 1981)', () => {
    for (const W of [0.1e-3, 0.5e-3, 1.1122e-3, 2e-3, 4e-3]) {
      const s = sizeDesign(design({ nodes: [port('a', 0, 0), open('e', 0.02, 0)], segments: [line('s', 'a', 'e', wd(W), lenOf(0.02))] }));
      const ees = oracleLine(W, h, 0, er, 0).ees;
      const want = oracleOpenEnd(W / h, er, ees, h);
      expect(Math.abs(s.pieces[0]!.compensations[0]!.amount_m - want) / want).toBeLessThan(1e-9);
    }
  });
});
