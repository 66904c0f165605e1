/**
 * The line-model interface (core/line/line-model.ts): a cross-section description in, figures per mode out.
 * Checks: each adapter gives the numbers of the model it wraps to the last bit (the interface adds no arithmetic of
 * its own); the coupled family gives even and odd modes that behave as the physics says (even mode above odd in Z0
 * and εeff for a pair on a dielectric, both tending to the single line as the strips part: D. M. Pozar, Microwave
 * Engineering, 4th ed., 2012, §7.6, the even/odd analysis of coupled lines); a fake cross-section plugs in without
 * touching the core; the 2-D solver's adapter equals the line layer fed with the solver's tables.
 */
import { describe, expect, it } from 'vitest';
import {
  analyzeCoupled, analyzeLine, analyzeLines, couplingFromModes, microstripFamily, pairAt, stripColumns, synthesizeCoupled, InputError, lineModels, LineModels, microstripMode, modeOfLine, sectionTable, solvedSectionFamily,
  type LineModelFamily, type ModalFigures, type CrossSectionDescription, type SubstrateSpec, type ModeFigures,
} from '../../core/index.ts';
import { lineConstants } from '../../core/line/line-constants.ts';
import { lineConstantsOfMode } from '../../core/network/lineTwoPort.ts';

const SUB: SubstrateSpec = { er: 4.3, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };

describe('microstrip family', () => {
  it('equals the direct analysis bit for bit at every frequency and width asked', () => {
    for (const w of [0.4e-3, 3.0e-3, 8e-3]) for (const f of [0, 1e8, 2.45e9, 6e9]) {
      const direct = analyzeLine(SUB, w, f);
      const m = lineModels.evaluate({ kind: 'microstrip', substrate: SUB, width: w } as CrossSectionDescription, f);
      expect(Object.keys(m.modes)).toEqual(['single']);
      const s = m.modes.single!;
      expect(s.z0).toBe(direct.z0); expect(s.epsEff).toBe(direct.epsEff);
      expect(s.z0Static).toBe(direct.z0Static); expect(s.epsEffStatic).toBe(direct.epsEffStatic);
      expect(s.alphaC).toBe(direct.alphaC); expect(s.alphaD).toBe(direct.alphaD);
      expect(s.beta).toBe(f > 0 ? (2 * Math.PI) / direct.lambdaG : 0);
      expect(m.warnings).toEqual(direct.warnings);
    }
  });
  it('gives the network the line constants core/line computed before, to the last bit', () => {
    for (const f of [1e8, 3e9]) {
      const a = lineConstants(SUB, 3e-3, f);
      const b = lineConstantsOfMode(microstripMode(SUB, 3e-3, f), f);
      expect(b).toEqual(a);
    }
  });
  it('says when the result does not hold (valid false past the higher-order-mode threshold)', () => {
    const low = lineModels.evaluate({ kind: 'microstrip', substrate: SUB, width: 3e-3 } as CrossSectionDescription, 1e9);
    expect(low.valid).toBe(true);
    const high = lineModels.evaluate({ kind: 'microstrip', substrate: SUB, width: 3e-3, options: { dispersion: 'hammerstad-jensen' } } as CrossSectionDescription, 40e9);
    expect(high.valid).toBe(false);
    expect(high.warnings.some((w) => w.severity === 'error')).toBe(true);
  });
});

describe('coupled-microstrip family', () => {
  const pair = { kind: 'coupled-microstrip', substrate: { ...SUB, t: 0 }, width: 2.8e-3, gap: 0.3e-3 } as CrossSectionDescription;
  it('gives even and odd modes equal to the direct coupled analysis', () => {
    const f = 2e9;
    const r = lineModels.evaluate(pair, f);
    const d = analyzeCoupled({ ...SUB, t: 0 }, 2.8e-3, 0.3e-3, f);
    expect(Object.keys(r.modes).sort()).toEqual(['even', 'odd']);
    for (const k of ['even', 'odd'] as const) {
      const m = r.modes[k]!;
      expect(m.z0).toBe(d[k].z0); expect(m.epsEff).toBe(d[k].epsEff); expect(m.beta).toBe(d[k].beta);
      expect(m.alphaC).toBe(d[k].alphaC); expect(m.alphaD).toBe(d[k].alphaD);
    }
  });
  it('has Z0e > Z0o and εe,even > εe,odd, both near the single line when the strips are far apart (Pozar §7.6)', () => {
    const near = lineModels.evaluate(pair, 1e9).modes;
    expect(near.even!.z0).toBeGreaterThan(near.odd!.z0);
    expect(near.even!.epsEff).toBeGreaterThan(near.odd!.epsEff);
    const far = lineModels.evaluate({ ...pair, gap: 10 * SUB.h } as CrossSectionDescription, 1e9).modes;
    const single = analyzeLine({ ...SUB, t: 0 }, 2.8e-3, 1e9).z0;
    expect(Math.abs(far.even!.z0 / single - 1)).toBeLessThan(0.03);
    expect(Math.abs(far.odd!.z0 / single - 1)).toBeLessThan(0.03);
  });
  it('chooses the geometry the coupled synthesis chooses, and its modes and coupling are those of the synthesis, bit for bit', () => {
    // 10 dB in 50 Ω: Z0e,o = 50·√((1 ± C)/(1 ∓ C)), C = 10^(−1/2) (Pozar §7.6).
    const sub = { ...SUB, t: 0 }, c = 10 ** -0.5, f = 2.45e9;
    const modes = { z0Even: 50 * Math.sqrt((1 + c) / (1 - c)), z0Odd: 50 * Math.sqrt((1 - c) / (1 + c)) };
    const fam = lineModels.pair();
    const g = fam.geometryFor(sub, modes, f);
    const direct = synthesizeCoupled(sub, modes, f);
    expect(g).toEqual({ width: direct.width, gap: direct.spacing });
    const r = pairAt(fam, sub, g.width, g.gap, f);
    expect(r.even.z0).toBe(direct.even.z0); expect(r.odd.z0).toBe(direct.odd.z0);
    expect(r.even.beta).toBe(direct.even.beta); expect(r.odd.beta).toBe(direct.odd.beta);
    expect(r.couplingDb).toBe(direct.couplingDb); expect(r.couplingFactor).toBe(couplingFromModes(r.even.z0, r.odd.z0).factor);
    expect(r.couplingDb).toBeCloseTo(10, 6);
    expect(r.warnings).toEqual(direct.warnings);
  });
  it('refuses an impossible pair in the user\'s words (InputError naming the field)', () => {
    expect(() => lineModels.pair().geometryFor({ ...SUB, t: 0 }, { z0Even: 40, z0Odd: 60 }, 1e9)).toThrow(InputError);
  });
});

describe('many strips at once (stripColumns)', () => {
  const widths = [0.5e-3, 1e-3, 3e-3, 3e-3], freqs = [1e8, 1e9, 2.45e9, 6e9];
  it('is the batch analysis itself for the microstrip family, bit for bit', () => {
    const a = stripColumns(microstripFamily, SUB, widths, freqs), b = analyzeLines(SUB, widths, freqs);
    expect(Array.from(a.z0)).toEqual(Array.from(b.z0)); expect(Array.from(a.lambdaG)).toEqual(Array.from(b.lambdaG));
    expect(Array.from(a.alphaC)).toEqual(Array.from(b.alphaC)); expect(Array.from(a.alphaD)).toEqual(Array.from(b.alphaD));
  });
  it('asks evaluate entry by entry for a family without a batch form, with the same figures', () => {
    const { columns: _drop, ...noBatch } = microstripFamily;
    const a = stripColumns(noBatch, SUB, widths, freqs), b = analyzeLines(SUB, widths, freqs);
    for (const k of ['z0', 'z0Static', 'epsEff', 'epsEffStatic', 'lambdaG', 'delayPerM', 'alphaC', 'alphaD'] as const) {
      expect(Array.from(a[k]), k).toEqual(Array.from(b[k]));
    }
    expect(a.warnings.length).toBe(b.warnings.length);
  });
});

describe('plugging in', () => {
  // A made-up cross-section: an ideal air line whose Z0 the description states (test data of our own).
  interface AirLine extends CrossSectionDescription { kind: 'ideal-air'; z0: number }
  const airFamily: LineModelFamily<AirLine, 'single'> = {
    kind: 'ideal-air', modes: ['single'], source: 'test fake',
    evaluate(s, f): ModalFigures<'single'> {
      const c0 = 299792458;
      const mode: ModeFigures = { z0: s.z0, z0Static: s.z0, epsEff: 1, epsEffStatic: 1, beta: (2 * Math.PI * f) / c0, lambdaG: f > 0 ? c0 / f : 0, delayPerM: 1 / c0, alphaC: 0, alphaD: 0 };
      return { f, modes: { single: mode }, warnings: [], valid: true };
    },
  };
  it('a new family answers through the same set, and the default set is left as it was', () => {
    const mine = lineModels.with(airFamily);
    const r = mine.evaluate({ kind: 'ideal-air', z0: 75 } as AirLine, 1e9);
    expect(r.modes.single!.z0).toBe(75);
    expect(mine.kinds()).toEqual(['microstrip', 'coupled-microstrip', 'ideal-air']);
    expect(() => lineModels.evaluate({ kind: 'ideal-air', z0: 75 } as AirLine, 1e9)).toThrow(InputError);
  });
  it('an unknown kind is an InputError naming the field and the kinds there are', () => {
    try { new LineModels([]).evaluate({ kind: 'nothing' }, 1e9); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('crossSection.kind');
    }
  });
  it('the 2-D solver plugs in as a family and equals the line layer fed with its tables', () => {
    const template = { er: SUB.er, h: SUB.h, t: SUB.t, side: { gap: 0.5e-3, width: Infinity, connection: 'stitched' as const } };
    const set = lineModels.with(solvedSectionFamily);
    const viaInterface = set.evaluate({ kind: 'solved-section', substrate: SUB, template, width: 3e-3 } as CrossSectionDescription, 2e9).modes.single!;
    const direct = modeOfLine(analyzeLine(SUB, 3e-3, 2e9, { crossSection: sectionTable(template) }));
    expect(viaInterface).toEqual(direct);
    // Side copper at half a millimetre pulls Z0 below open microstrip (more capacitance to ground).
    expect(viaInterface.z0).toBeLessThan(microstripMode(SUB, 3e-3, 2e9).z0);
  });
});
