/**
 * The example designs (assets/examples/, invented scenarios) meet the targets stated in their own notes, swept
 * across their bands with the full model: sized copper, dispersive lossy lines from the line model, open ends,
 * vias, pads and launch pads. The targets themselves come from the design equations each file cites (Pozar,
 * Microwave Engineering, 4th ed., §5.2, §5.6, §7.3, §7.5; Wilkinson 1960).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, type DesignDoc } from '../../core/design/index.ts';
import { sizeDesign } from '../../core/layout/index.ts';
import {
  netlistFromSized, solveNetwork, sweepFrequencies, portIndex, returnLoss, amplitudeBalance, phaseBalance, magnitudeDb, isolation,
  type NetworkResponse,
} from '../../core/network/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');

function sweep(file: string, range?: { start: number; stop: number }, points = 101, edit: (d: DesignDoc) => DesignDoc = (d) => d): { r: NetworkResponse; f0: number; input: number } {
  const parsed = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', file), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => e.message).join('; '));
  const doc = edit(parsed.doc);
  const net = netlistFromSized(sizeDesign(doc));
  const band = range ?? doc.frequency.band;
  // Odd point count over a band centred on f0 puts a point on f0 where the band is symmetric.
  const freqs = sweepFrequencies({ start: band.start, stop: band.stop, points });
  return { r: solveNetwork(net, freqs), f0: doc.frequency.f0, input: net.input };
}
const nearest = (r: NetworkResponse, f: number) => r.freqs.reduce((best, x, k) => (Math.abs(x - f) < Math.abs(r.freqs[best] - f) ? k : best), 0);

describe('example designs meet their stated targets', () => {
  it('every example is swept with its junctions modelled (tees by Hammerstad 1981, steps by Garg–Bahl 1978)', () => {
    for (const f of ['demo.json', 'branchline-10g4.json', 'open-stub-match.json', 'shorted-stub-match.json', 'three-section-transformer.json', 'wilkinson-2g45.json']) {
      const parsed = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', f), 'utf8'));
      expect(parsed.ok && parsed.doc.junctions, f).toBe('modelled');
    }
  });
  it('branchline-10g4 with junctions, as made: isolation better than 20 dB and match than 19 dB at f0; left at 50 Ω its shunt arms would miss the balance', () => {
    const { r, f0 } = sweep('branchline-10g4.json');
    const k0 = nearest(r, f0);
    const [i, a, b, d] = ['p1', 'p2', 'p3', 'p4'].map((p) => portIndex(r, p));
    expect(isolation(r, i, d)[k0]).toBeGreaterThan(20);
    // Sized as made, the best isolation and match fall about 3 % above f0 (the file's notes say so; its own targets are
    // quadrature and balance): the match at f0 is about 19 dB.
    expect(returnLoss(r, i)[k0]).toBeGreaterThan(19);
    // Why the file sizes its shunt arms at 48.1 Ω: through the tee's branch transformer (n² ≈ 0.96 at 10.4 GHz) at
    // both ends a 50 Ω arm acts as about 52 Ω and the split tips by more than the ±0.5 dB target.
    const at50 = (d0: DesignDoc): DesignDoc => ({ ...d0, segments: d0.segments.map((sg) => (sg.id.startsWith('shunt') && sg.kind === 'line' ? { ...sg, width: { by: 'z0', z0: 50 } } : sg)) });
    const w = sweep('branchline-10g4.json', undefined, 101, at50).r;
    expect(Math.max(...amplitudeBalance(w, i, a, b).map(Math.abs))).toBeGreaterThan(0.5);
  });
  it('wilkinson-2g45: amplitude balance ±0.2 dB and phase balance ±2° across 2.40–2.50 GHz; about −3 dB each way', () => {
    const { r } = sweep('wilkinson-2g45.json');
    const [i, a, b] = ['in', 'o1', 'o2'].map((p) => portIndex(r, p));
    for (const x of amplitudeBalance(r, i, a, b)) expect(Math.abs(x)).toBeLessThanOrEqual(0.2);
    for (const x of phaseBalance(r, i, a, b)) expect(Math.abs(x)).toBeLessThanOrEqual(2);
    // An equal split is −3.01 dB; FR-4 loss adds a few tenths (loss, not a target of the file, so a loose bound).
    for (const x of magnitudeDb(r, a, i)) { expect(x).toBeLessThan(-3.01); expect(x).toBeGreaterThan(-4); }
  });
  it('branchline-10g4: 90° ± 2° between p2 and p3 at 10.368 GHz; amplitude balance ±0.5 dB across 10.30–10.45 GHz', () => {
    const { r, f0 } = sweep('branchline-10g4.json');
    const [i, a, b] = ['p1', 'p2', 'p3'].map((p) => portIndex(r, p));
    const k0 = nearest(r, f0);
    expect(Math.abs(r.freqs[k0] - f0)).toBeLessThan(2e6);
    expect(Math.abs(phaseBalance(r, i, a, b, 90)[k0])).toBeLessThanOrEqual(2);
    for (const x of amplitudeBalance(r, i, a, b)) expect(Math.abs(x)).toBeLessThanOrEqual(0.5);
  });
  it('demo (four-way corporate feed): outputs in phase within ±5° across 5.725–5.875 GHz', () => {
    const { r, input } = sweep('demo.json');
    const outs = ['out1', 'out2', 'out3', 'out4'].map((p) => portIndex(r, p));
    for (const o of outs.slice(1)) for (const x of phaseBalance(r, input, outs[0], o)) expect(Math.abs(x)).toBeLessThanOrEqual(5);
  });
  it('open-stub-match: |S11| below −20 dB at 2.4 GHz', () => {
    const { r } = sweep('open-stub-match.json');
    expect(returnLoss(r, portIndex(r, 'src'))[nearest(r, 2.4e9)]).toBeGreaterThan(20);
  });
  it('shorted-stub-match: |S11| below −20 dB at 2.4 GHz (with the via in the model)', () => {
    const { r } = sweep('shorted-stub-match.json');
    expect(returnLoss(r, portIndex(r, 'src'))[nearest(r, 2.4e9)]).toBeGreaterThan(20);
  });
  it('three-section-transformer: |S11| below 0.05 (−26 dB) across 1.9–3.0 GHz', () => {
    const { r } = sweep('three-section-transformer.json', { start: 1.9e9, stop: 3.0e9 });
    for (const x of returnLoss(r, portIndex(r, 'src'))) expect(x).toBeGreaterThan(20 * Math.log10(1 / 0.05));
  });
});
