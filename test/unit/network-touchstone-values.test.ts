/**
 * Touchstone values the reader must refuse where they are (non-finite once converted) and frequency order
 * (Touchstone File Format Specification Rev. 1.1, EIA/IBIS 2002: network data in increasing frequency; a v1 2-port
 * noise block follows with 5 values a line and a frequency that starts over). Hand-written files.
 */
import { describe, expect, it } from 'vitest';
import { readTouchstone, sparamsAdmittance, groupDelay, summarize } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

const err = (fn: () => unknown): InputError => {
  try { fn(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
};

/** A 2-port record line of a matched 3 dB pad-like block at f GHz (values invented for the test). */
const rec = (f: number, s21 = 0.7) => `${f} 0.1 0 ${s21} 0 ${s21} 0 0.1 0`;

describe('values that overflow are refused at read, with their line', () => {
  it('a dB magnitude beyond a double (10^(7000/20)) names its line', () => {
    const e = err(() => readTouchstone('# GHz S DB R 50\n! a comment\n1 -3 0\n2 7000 45\n', { fileName: 'x.s1p' }));
    expect(e.code).toBe('bad-file');
    expect(e.message).toMatch(/x\.s1p:4/);
    expect(e.message).toMatch(/7000/);
  });
  it('a frequency that overflows once scaled by its unit (1e300 GHz) names its line', () => {
    const e = err(() => readTouchstone('# GHz S RI R 50\n1 0 0\n1e300 0 0\n', { fileName: 'x.s1p' }));
    expect(e.message).toMatch(/x\.s1p:3/);
    expect(e.message).toMatch(/hertz/);
  });
  it('normalised Z-parameters that overflow once scaled by R are refused, not passed on as a silent short', () => {
    const e = err(() => readTouchstone('# GHz Z RI R 1e10\n1 1e300 0\n', { fileName: 'x.s1p' }));
    expect(e.code).toBe('bad-file');
    expect(e.message).toMatch(/x\.s1p:2/);
  });
  it('a reference resistance that overflows (R 1e309) is refused on the option line (found by the fuzz suite)', () => {
    const e = err(() => readTouchstone('# GHz S RI R 1e309\n1 0 0\n', { fileName: 'x.s1p' }));
    expect(e.message).toMatch(/x\.s1p:1: expected a finite reference resistance/);
  });
  it('a large but finite file reads with every value finite', () => {
    const d = readTouchstone('# GHz S DB R 50\n1 6000 0\n', { fileName: 'x.s1p' });
    for (const v of d.s) expect(Number.isFinite(v)).toBe(true);
  });
});

describe('frequency order', () => {
  const twelve = (repeatAt: number) => {
    const lines = ['# GHz S RI R 50'];
    for (let k = 1; k <= 12; k++) lines.push(rec(k === repeatAt + 1 ? repeatAt : k));
    return lines.join('\n') + '\n';
  };
  it('a 2-port with a repeated frequency keeps all 12 points and warns naming the line', () => {
    const d = readTouchstone(twelve(6), { fileName: 'x.s2p' });
    expect(d.freqs.length).toBe(12);
    expect(d.freqs[5]).toBe(6e9);
    expect(d.freqs[6]).toBe(6e9);
    const w = d.warnings.find((x) => /repeats/.test(x.message));
    expect(w?.message).toMatch(/line 8\b/);
    expect(d.warnings.some((x) => /noise/.test(x.message))).toBe(false);
  });
  it('a 2-port network line whose frequency falls is refused with its line number', () => {
    const text = ['# GHz S RI R 50', rec(1), rec(2), rec(3), rec(2.5), rec(4)].join('\n');
    const e = err(() => readTouchstone(text, { fileName: 'x.s2p' }));
    expect(e.message).toMatch(/x\.s2p:5/);
    expect(e.message).toMatch(/rising order/);
  });
  it('the v1 noise block (5 values a line, frequency starting over) is still skipped with a note', () => {
    const text = ['# GHz S RI R 50', rec(1), rec(2), rec(3), '1 0.5 0.3 20 0.4', '2 0.6 0.3 25 0.4'].join('\n');
    const d = readTouchstone(text, { fileName: 'x.s2p' });
    expect(d.freqs.length).toBe(3);
    expect(d.warnings.some((x) => /noise/.test(x.message))).toBe(true);
  });
  it('1-port: repeated kept with a warning, falling refused with its line', () => {
    const d = readTouchstone('# GHz S RI R 50\n1 0 0\n2 0.1 0\n2 0.2 0\n3 0 0\n', { fileName: 'x.s1p' });
    expect(Array.from(d.freqs)).toEqual([1e9, 2e9, 2e9, 3e9]);
    expect(d.warnings.some((x) => /line 4\b/.test(x.message))).toBe(true);
    expect(err(() => readTouchstone('# GHz S RI R 50\n1 0 0\n3 0 0\n2 0 0\n', { fileName: 'x.s1p' })).message).toMatch(/x\.s1p:4/);
  });
  it('figures of data with a repeated frequency stay finite (group delay skips the zero step)', () => {
    const d = readTouchstone(twelve(6), { fileName: 'x.s2p' });
    for (const v of groupDelay(d, 1, 0)) expect(Number.isFinite(v)).toBe(true);
    const all = JSON.stringify(summarize(d, 0));
    expect(all).not.toMatch(/null|NaN|Infinity/);
    const same = readTouchstone('# GHz S RI R 50\n2 0.1 0.1\n2 0.2 0.1\n', { fileName: 'x.s1p' });
    for (const v of groupDelay(same, 0, 0)) expect(Number.isFinite(v)).toBe(true);
  });
});

describe('measured data for a part is evaluated as the sweep will', () => {
  it('an ideal short at one data point (S = -1, no admittance) is refused when the data is taken in', () => {
    const text = '# GHz S RI R 50\n1 0 0\n2 -1 0\n3 0 0\n';
    const e = err(() => sparamsAdmittance(text, 'short.s1p', 'short.s1p'));
    expect(e.message).toMatch(/2 GHz/);
  });
  it('ordinary data is taken in and its admittance is finite at every data point', () => {
    const { data, y } = sparamsAdmittance('# GHz S RI R 50\n1 0.5 0 0.5 0 0.5 0 0.5 0\n2 0.5 0 0.5 0 0.5 0 0.5 0\n', 'r.s2p');
    for (const f of data.freqs) for (const v of y(f)) expect(Number.isFinite(v)).toBe(true);
  });
});
