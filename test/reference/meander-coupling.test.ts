/**
 * The meanders' coupling share (core/layout folds.ts, used by the ledger, the sweep and equalize) against an
 * independent computation from the coupled-line model: scripts/reference/meander_fold.py rebuilds the folded pair (a U
 * of two coupled legs joined at the far end) from the even/odd-mode equations directly (mode Z-matrices, the even/odd
 * split of the strip terminals, the join added and the far ends eliminated) with numpy under Debian's python3, sharing
 * no code with the core. Mode figures: the Kirschning–Jansen 1984 static modes of core/line (dispersion 'none',
 * lossless, as folds.ts takes them); the numpy side gets only Z and γ of each mode.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeCoupled, meanderCouplingDeg, corporateFeed, equalizeGroup, sizeDesign, tracePaths, LineCache, phaseLength, type DesignDoc, type SubstrateSpec } from '../../core/index.ts';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { python } from './network-oracle.ts';

const sub = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const C0 = 299_792_458;

function modes(s: SubstrateSpec, W: number, gap: number, f: number) {
  const c = analyzeCoupled(s, W, gap, 0, { dispersion: 'none' });
  const k = (2 * Math.PI * f) / C0;
  const line = (z: number, ee: number) => ({ zc: [z, 0], gamma: [0, k * Math.sqrt(ee)] });
  // The join and the reference: the single strip as the same model gives it (mean of the modes).
  const z = Math.sqrt(c.even.z0 * c.odd.z0);
  return {
    even: line(c.even.z0, c.even.epsEffStatic), odd: line(c.odd.z0, c.odd.epsEffStatic),
    join: line(z, ((Math.sqrt(c.even.epsEffStatic) + Math.sqrt(c.odd.epsEffStatic)) / 2) ** 2), zref: z,
  };
}

/** Coupling share of one U by the numpy oracle, degrees: far-apart pair (100h) less the pair as drawn. */
function oracleShares(s: SubstrateSpec, cases: { W: number; gap: number; leg: number; join: number; f: number }[]): number[] {
  const input = cases.flatMap((c) => [
    { ...modes(s, c.W, 100 * s.h, c.f), leg: c.leg, joinLength: c.join },
    { ...modes(s, c.W, c.gap, c.f), leg: c.leg, joinLength: c.join },
  ]);
  const out = JSON.parse(python('meander_fold.py', JSON.stringify({ cases: input }))) as { phase: number[] };
  return cases.map((_, i) => {
    let d = out.phase[2 * i]! - out.phase[2 * i + 1]!;
    d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
    return (d * 180) / Math.PI;
  });
}

describe('meander coupling share against the even/odd-mode equations (numpy, Debian python3)', () => {
  const cases = [
    { W: 0.7e-3, gaps: 3, H: 5e-3, f: 5.8e9 },
    { W: 0.7e-3, gaps: 3, H: 10e-3, f: 5.8e9 },
    { W: 3e-3, gaps: 2, H: 8e-3, f: 2.45e9 },
    { W: 1.5e-3, gaps: 4, H: 12e-3, f: 3.5e9 },
  ];
  it('one U: the share agrees to 0.01° in every case', () => {
    const oracle = oracleShares(sub, cases.map((c) => ({ W: c.W, gap: c.gaps * sub.h, leg: c.H - c.W, join: c.gaps * sub.h + c.W, f: c.f })));
    cases.forEach((c, i) => {
      const ours = meanderCouplingDeg(sub, c.W, { kind: 'serpentine', bumps: 1, height: c.H, pitch: c.gaps * sub.h + c.W }, c.f);
      expect(Math.abs(ours - oracle[i]!), `case ${i}: ours ${ours}, oracle ${oracle[i]}`).toBeLessThan(0.01);
      expect(Math.abs(oracle[i]!)).toBeGreaterThan(0.01); // the case has coupling to measure
    });
  });
  it('k bumps count 2k − 1 neighbouring leg pairs (first order)', () => {
    const one = meanderCouplingDeg(sub, 0.7e-3, { kind: 'serpentine', bumps: 1, height: 6e-3, pitch: 3 * sub.h + 0.7e-3 }, 5.8e9);
    const three = meanderCouplingDeg(sub, 0.7e-3, { kind: 'serpentine', bumps: 3, height: 6e-3, pitch: 3 * sub.h + 0.7e-3 }, 5.8e9);
    expect(three).toBeCloseTo(5 * one, 12);
  });
});

describe('the ledger reads a meander as coupled legs (numpy oracle for the coupling)', () => {
  beforeAll(async () => { await initPolygons(); });
  it('the ledger\'s electrical length of an equalize meander = its single-line length + the oracle\'s share per fold, within 0.02°', () => {
    // Our own detuning: a 4-way feed with one output run 14 mm long, so equalize puts U's on the others.
    const feed = corporateFeed({ outputs: 4, f0: 5.8e9, pitch: 30e-3, substrate: { h: 0.5e-3 } });
    const doc: DesignDoc = { ...feed, segments: feed.segments.map((x) => (x.id === 'run1' && x.kind === 'line' ? { ...x, length: { by: 'length' as const, length: 14e-3 } } : x)) };
    const res = equalizeGroup(doc, { group: 'outputs', style: 'trombone' });
    const m = res.meanders[0]!;
    expect(m.shape.kind).toBe('serpentine');
    if (m.shape.kind !== 'serpentine') return;
    const s1 = sizeDesign(res.doc);
    const pieces = s1.pieces.filter((p) => m.segments.includes(p.id));
    const W = pieces[0]!.width, f0 = s1.f0;
    const ledger = tracePaths(s1, pieces[0]!.a, [pieces[pieces.length - 1]!.b], { sensitivities: false, matched: false }).paths[0]!.degAtF0;
    // Single-line part: β·l of each stretch (the line model, checked against its papers elsewhere).
    const cache = new LineCache(doc.substrate, s1.lineOptions);
    const single = pieces.reduce((a, p) => a + (cache.modeAt(p.width, f0).beta * phaseLength(p) * 180) / Math.PI, 0);
    const folds = 2 * m.shape.bumps - 1;
    const [share] = oracleShares(doc.substrate, [{ W, gap: m.shape.pitch - W, leg: m.shape.height - W, join: m.shape.pitch, f: f0 }]);
    expect(Math.abs(share!)).toBeGreaterThan(0.05);
    expect(Math.abs(ledger - (single + folds * share!))).toBeLessThan(0.02);
  });
});
