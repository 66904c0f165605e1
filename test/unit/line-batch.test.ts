/**
 * analyzeLines, the batch form of the analysis: the same numbers as one analyzeLine call per strip, to the last bit,
 * with warnings tagged by index, and errors that name the entry. (Internal consistency; the numbers themselves are
 * checked against the papers and scikit-rf in the other line tests.)
 */
import { describe, expect, it } from 'vitest';
import { analyzeLine, analyzeLines, InputError, type SubstrateSpec } from '../../core/index.ts';

const glassEpoxy: SubstrateSpec = { er: 4.4, h: 0.79e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1e-6 };

describe('analyzeLines', () => {
  it('equals analyzeLine bit for bit on random strips and frequencies, warnings included', () => {
    let s = 5;
    const rnd = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
    const widths: number[] = []; const freqs: number[] = [];
    for (let i = 0; i < 2000; i++) { widths.push(glassEpoxy.h * 10 ** (rnd() * 4 - 2.5)); freqs.push(rnd() < 0.1 ? 0 : 10 ** (7 + rnd() * 3.7)); }
    const cols = analyzeLines(glassEpoxy, widths, freqs);
    const expected: { index: number; code: string; message: string }[] = [];
    for (let i = 0; i < widths.length; i++) {
      const r = analyzeLine(glassEpoxy, widths[i]!, freqs[i]!);
      for (const [k, v] of [['z0', r.z0], ['z0Static', r.z0Static], ['epsEff', r.epsEff], ['epsEffStatic', r.epsEffStatic], ['lambdaG', r.lambdaG],
        ['vp', r.vp], ['delayPerM', r.delayPerM], ['alphaC', r.alphaC], ['alphaD', r.alphaD], ['skinDepth', r.skinDepth]] as const) {
        expect(Object.is(cols[k][i], v), `${k}[${i}]`).toBe(true);
      }
      expect(cols.width[i]).toBe(widths[i]); expect(cols.f[i]).toBe(freqs[i]);
      for (const w of r.warnings) expected.push({ index: i, code: w.code, message: w.message });
    }
    expect(expected.length).toBeGreaterThan(10); // the grid reaches past the models' ranges on purpose
    expect(cols.warnings.map((w) => ({ index: w.index, code: w.warning.code, message: w.warning.message }))).toEqual(expected);
  });

  it('takes one frequency for every width', () => {
    const cols = analyzeLines(glassEpoxy, [1e-3, 1.5e-3, 3e-3], 2.45e9);
    expect(Array.from(cols.f)).toEqual([2.45e9, 2.45e9, 2.45e9]);
    expect(cols.z0[1]).toBe(analyzeLine(glassEpoxy, 1.5e-3, 2.45e9).z0);
    expect(cols.z0[0]! > cols.z0[1]! && cols.z0[1]! > cols.z0[2]!).toBe(true); // Z0 falls as W grows
  });

  it('names the first bad entry and returns nothing', () => {
    const bad = (fn: () => unknown, field: string) => {
      try { fn(); } catch (e) { expect(e).toBeInstanceOf(InputError); expect((e as InputError).field).toBe(field); return; }
      throw new Error('no error');
    };
    bad(() => analyzeLines(glassEpoxy, [1e-3, 2e-3, -1, 3e-3], 1e9), 'widths[2]');
    bad(() => analyzeLines(glassEpoxy, [1e-3, 2e-3], [1e9, Number.NaN]), 'freqs[1]');
    bad(() => analyzeLines(glassEpoxy, [1e-3, 2e-3], [1e9]), 'freqs');
    bad(() => analyzeLines(glassEpoxy, 1e-3 as unknown as number[], 1e9), 'widths');
    bad(() => analyzeLines({ ...glassEpoxy, er: 0.5 }, [1e-3], 1e9), 'substrate.er');
    // Refused while analysing (above twice the TE1 onset, about 103 GHz here): still named by entry.
    bad(() => analyzeLines(glassEpoxy, [1e-3, 2e-3, 3e-3], [1e9, 2e9, 250e9]), 'freqs[2]');
  });

  it('an empty list gives empty columns', () => {
    const cols = analyzeLines(glassEpoxy, [], 1e9);
    expect(cols.z0.length).toBe(0); expect(cols.warnings).toEqual([]);
  });
});
