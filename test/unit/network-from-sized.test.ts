/**
 * From a sized design to the netlist: the plumbing between layout, line model and solver.
 * Checks against closed forms: a uniform line between two ports has
 *   S11 = Γ(1 − P²)/(1 − Γ²P²), S21 = P(1 − Γ²)/(1 − Γ²P²), Γ = (Zc − Z0)/(Zc + Z0), P = e^(−γl)
 * (D. M. Pozar, Microwave Engineering, 4th ed., §2.3–2.4 / Table 4.2 conversion, from memory), with Zc and γ from the
 * line model (Pozar, Microwave Engineering, 4th ed., §2.7 lossy lines, from memory).
 */
import { describe, expect, it } from 'vitest';
import { newDesign } from '../../core/design/index.ts';
import type { DesignDoc } from '../../core/design/types.ts';
import { sizeDesign } from '../../core/layout/index.ts';
import { lineConstants } from '../../core/line/index.ts';
import { netlistFromSized, solveNetwork, lineS, sAt, sweepFrequencies, writeTouchstone, idealLine, temLengthForDegrees } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

function twoPortLine(extra: Partial<DesignDoc> = {}): DesignDoc {
  // Plain microstrip (the closed-form line two-port below is microstrip's; a milled design is otherwise sized as made).
  const doc = newDesign({ name: 'one line', f0: 2.45e9, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
  doc.nodes = [
    { id: 'p1', kind: 'port', zRef: 50, heading: 0, at: { x: 0, y: 0 } },
    { id: 'p2', kind: 'port', zRef: 50, heading: Math.PI, at: { x: 0.03, y: 0 } },
  ];
  doc.segments = [{ id: 'l', a: 'p1', b: 'p2', kind: 'line', width: { by: 'z0', z0: 35 }, length: { by: 'length', length: 0.03 } }];
  return { ...doc, ...extra };
}

describe('netlistFromSized', () => {
  it('a single sized line equals the closed-form lossy line two-port with the line model’s Zc and γ', () => {
    const sized = sizeDesign(twoPortLine());
    const piece = sized.pieces[0];
    const r = solveNetwork(netlistFromSized(sized), sweepFrequencies({ start: 1e9, stop: 4e9, points: 7 }));
    r.freqs.forEach((f, k) => {
      const want = lineS(lineConstants(sized.doc.substrate, piece.width, f), piece.length, 50);
      const s11 = sAt(r, k, 0, 0), s21 = sAt(r, k, 1, 0);
      expect(Math.hypot(s11.re - want.s11.re, s11.im - want.s11.im)).toBeLessThan(1e-12);
      expect(Math.hypot(s21.re - want.s21.re, s21.im - want.s21.im)).toBeLessThan(1e-12);
    });
  });
  it('an open stub gets its end capacitance, a shorted stub its via, ports their references', () => {
    const doc = twoPortLine();
    doc.nodes.push({ id: 'j', kind: 'junction', at: { x: 0.015, y: 0 } }, { id: 'o', kind: 'open', at: { x: 0.015, y: 0.01 } }, { id: 's', kind: 'short', via: { drill: 0.4e-3, pad: 0.8e-3, count: 1 }, at: { x: 0.015, y: -0.01 } });
    doc.segments = [
      { id: 'l1', a: 'p1', b: 'j', kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } },
      { id: 'l2', a: 'j', b: 'p2', kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } },
      { id: 'st', a: 'j', b: 'o', kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'degrees', deg: 60 } },
      { id: 'sv', a: 'j', b: 's', kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'degrees', deg: 60 } },
    ];
    const sized = sizeDesign(doc);
    expect(sized.problems).toEqual([]);
    const net = netlistFromSized(sized);
    const cap = net.elements.find((e) => e.id === 'o:open-end');
    expect(cap?.kind).toBe('capacitor');
    expect((cap as { value: number }).value).toBe(sized.nodes.find((n) => n.id === 'o')!.open!.capacitance);
    const via = net.elements.find((e) => e.id === 's:via');
    expect(via?.kind).toBe('series-rl');
    expect(net.ports.map((p) => [p.name, p.zRef])).toEqual([['p1', 50], ['p2', 50]]);
    expect(net.warnings.some((w) => /cross j: a cross \(four arms\): no published model at hand/.test(w.message))).toBe(true);
    // Solvable across the band, reciprocal.
    const r = solveNetwork(net, sweepFrequencies({ start: 2e9, stop: 3e9, points: 5 }));
    for (let k = 0; k < 5; k++) {
      expect(sAt(r, k, 0, 1).re).toBeCloseTo(sAt(r, k, 1, 0).re, 12);
      expect(sAt(r, k, 0, 1).im).toBeCloseTo(sAt(r, k, 1, 0).im, 12);
    }
  });
  it('a design the layout cannot size is refused with the layout’s own reason', () => {
    const doc = twoPortLine();
    doc.nodes.push({ id: 'lost', kind: 'open', at: { x: 1, y: 1 } });
    try { netlistFromSized(sizeDesign(doc)); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).code).toBe('impossible-layout');
      expect((e as InputError).message).toMatch(/lost/);
    }
  });
});

describe("S-parameter parts (segment kind 'sparams')", () => {
  // Data of our own: a 40 Ω line, 70° at 2.45 GHz, written as Touchstone by the writer and used as a part.
  const f0 = 2.45e9;
  const dataFreqs = sweepFrequencies({ start: 2e9, stop: 3e9, points: 11 });
  const part = solveNetwork({ elements: [{ kind: 'line', id: 'x', a: 'a', b: 'b', length: temLengthForDegrees(70, f0, 2.2), model: idealLine(40, 2.2) }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] }, dataFreqs);
  const touchstone = writeTouchstone(part, { format: 'ma' });
  const doc = twoPortLine();
  doc.segments = [{ id: 'blk', a: 'p1', b: 'p2', kind: 'sparams', touchstone, name: 'line-part.s2p', width: { by: 'z0', z0: 50 }, length: { by: 'length', length: 0.03 } }];
  it('reproduces the part’s own data at its data points (Y stamp round trip, Kurokawa 1965 conversions)', () => {
    const r = solveNetwork(netlistFromSized(sizeDesign(doc)), dataFreqs);
    for (let t = 0; t < r.s.length; t++) expect(Math.abs(r.s[t] - part.s[t])).toBeLessThan(1e-12);
  });
  it('interpolates real and imaginary parts linearly between data points (common practice)', () => {
    const mid = (dataFreqs[3] + dataFreqs[4]) / 2;
    const r = solveNetwork(netlistFromSized(sizeDesign(doc)), [mid]);
    const want = (0.5 * (sAt(part, 3, 1, 0).re + sAt(part, 4, 1, 0).re));
    // Interpolated S goes through Y and back: the matrix result equals the interpolated S exactly.
    expect(sAt(r, 0, 1, 0).re).toBeCloseTo(want, 12);
  });
  it('a sweep outside the data stops with a clear error naming the part and its band', () => {
    try { solveNetwork(netlistFromSized(sizeDesign(doc)), [3.5e9]); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).message).toMatch(/segments\.blk\.touchstone: expected a frequency inside the part's data \(2 – 3 GHz\), got 3\.5 GHz/);
    }
  });
  it('a broken data block is refused with its line number', () => {
    const bad = { ...doc, segments: [{ ...doc.segments[0], touchstone: '# GHz S RI R 50\n1 0 0 1 0 1 0 0 x\n' } as typeof doc.segments[0]] };
    try { netlistFromSized(sizeDesign(bad)); expect.unreachable(); } catch (e) {
      expect((e as InputError).code).toBe('bad-file');
      expect((e as InputError).message).toMatch(/line-part\.s2p:2/);
    }
  });
});

describe('width steps in the network (Garg & Bahl 1978, each part only within its fit range)', () => {
  it('adds L1–Cs–L2 at each in-line step with the layout’s values; ideal junctions leave them out', async () => {
    const { readFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const { parseDesign } = await import('../../core/design/index.ts');
    const parsed = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'three-section-transformer.json'), 'utf8'));
    if (!parsed.ok) throw new Error('example does not parse');
    const sized = sizeDesign(parsed.doc);
    const steps = sized.nodes.filter((n) => n.step);
    expect(steps.length).toBe(3);
    const net = netlistFromSized(sized);
    for (const n of steps) {
      const st = n.step!;
      expect(st.modelled).toBe(true);
      const c = net.elements.find((e) => e.id === `${n.id}:step-Cs`) as { value: number } | undefined;
      // The capacitance only where its fit holds (1.5 ≤ W1/W2 ≤ 3.5 at εr ≤ 10); below it the fit even turns negative.
      if (st.cValid) expect(c?.value).toBe(st.Cs); else expect(c).toBeUndefined();
      const l1 = net.elements.find((e) => e.id === `${n.id}:step-L1`) as { value: number };
      expect(l1.value).toBe(st.lValid ? st.L1 : 0);
    }
    // The 50 → 42 Ω step is narrower than the capacitance fit's range: its C is left out and says so.
    const k1 = steps.find((n) => n.id === 'k1')!;
    expect(k1.step!.cValid).toBe(false);
    expect(k1.warnings.some((w) => w.code === 'validity' && /capacitance/.test(w.message))).toBe(true);
    const ideal = netlistFromSized(sizeDesign(parsed.doc, { junctions: 'ideal' }));
    expect(ideal.elements.some((e) => e.id.includes(':step-'))).toBe(false);
    const f = [sized.f0];
    const a = solveNetwork(ideal, f), b = solveNetwork(net, f);
    expect(a.s[0]).not.toBe(b.s[0]);
    // Small reactances (tens of fF, tens of pH): the match at f0 moves only a little.
    expect(Math.hypot(b.s[0], b.s[1])).toBeLessThan(0.1);
  });
});

describe('sweepRangeWarnings (common practice: caution above half the higher-order-mode threshold)', () => {
  it('is quiet inside the band and warns, naming the pieces, when the sweep runs past the caution frequency', async () => {
    const { analyzeLine } = await import('../../core/line/index.ts');
    const { sweepRangeWarnings } = await import('../../core/network/index.ts');
    const sized = sizeDesign(twoPortLine());
    const warnAt = analyzeLine(sized.doc.substrate, sized.pieces[0].width, 1e9).thresholds.warnAt;
    expect(sweepRangeWarnings(sized, sized.band.stop).filter((w) => w.code === 'higher-order-mode')).toEqual([]);
    const high = sweepRangeWarnings(sized, warnAt * 1.05).filter((w) => w.code === 'higher-order-mode');
    expect(high.length).toBe(1);
    expect(high[0].subjects).toEqual(['l']);
    expect(high[0].message).toMatch(/top of the sweep/);
  });
});
