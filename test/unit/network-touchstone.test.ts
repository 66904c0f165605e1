/**
 * Touchstone reading and writing (Touchstone File Format Specification Rev. 1.1, EIA/IBIS 2002, and Version 2.0,
 * IBIS Open Forum 2009). Hand-written files; values worked by hand.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readTouchstone, writeTouchstone, solveNetwork, idealLine, temLengthForDegrees, sAt, renormalize, type NetworkResponse } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

const err = (fn: () => unknown): InputError => {
  try { fn(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
};

describe('reading version 1.1', () => {
  it('2-port RI in the v1 order S11 S21 S12 S22 (spec Rev. 1.1; line.s2p)', () => {
    const d = readTouchstone('! made by hand\n# GHz S RI R 50\n1 0.1 0.01 0.9 -0.2 0.3 0.03 0.2 0.02\n2 0.1 0.01 0.9 -0.2 0.3 0.03 0.2 0.02\n', { fileName: 'line.s2p' });
    expect(Array.from(d.freqs)).toEqual([1e9, 2e9]);
    expect(sAt(d, 0, 1, 0)).toEqual({ re: 0.9, im: -0.2 });
    expect(sAt(d, 0, 0, 1)).toEqual({ re: 0.3, im: 0.03 });
    expect(d.comments).toEqual(['made by hand']);
  });
  it('defaults GHz S MA R 50 apply to a bare "#" line; MA angles in degrees', () => {
    const d = readTouchstone('#\n1.5 0.5 90\n', { fileName: 'x.s1p' });
    expect(d.freqs[0]).toBe(1.5e9);
    expect(d.ports[0].zRef).toBe(50);
    expect(sAt(d, 0, 0, 0).re).toBeCloseTo(0, 15);
    expect(sAt(d, 0, 0, 0).im).toBeCloseTo(0.5, 15);
  });
  it('DB: −6.0206 dB is a magnitude of 0.5 (20·log10)', () => {
    const d = readTouchstone('# MHz S DB R 75\n100 -6.020599913279624 180\n', { fileName: 'x.s1p' });
    expect(d.freqs[0]).toBe(1e8);
    expect(d.ports[0].zRef).toBe(75);
    expect(sAt(d, 0, 0, 0).re).toBeCloseTo(-0.5, 14);
  });
  it('4-port rows on their own lines, port count inferred without a file name', () => {
    const row = (k: number) => `${k}.1 0 ${k}.2 0 ${k}.3 0 ${k}.4 0`;
    const text = `# GHz S RI R 50\n1 ${row(1)}\n ${row(2)}\n ${row(3)}\n ${row(4)}\n2 ${row(1)}\n ${row(2)}\n ${row(3)}\n ${row(4)}\n`;
    const d = readTouchstone(text);
    expect(d.ports.length).toBe(4);
    expect(sAt(d, 1, 2, 3).re).toBe(3.4);
  });
  it('Z-parameters normalised to R (v1) convert to S: a 100 Ω resistor to ground in 50 Ω gives S11 = 1/3', () => {
    // Z11 = 100 Ω = 2 normalised; Γ = (100 − 50)/(100 + 50).
    const d = readTouchstone('# GHz Z RI R 50\n1 2 0\n', { fileName: 'z.s1p' });
    expect(sAt(d, 0, 0, 0).re).toBeCloseTo(1 / 3, 15);
  });
  it('the v1 2-port noise block (frequency falls back) is skipped with a note', () => {
    const d = readTouchstone('# GHz S RI R 50\n1 0 0 1 0 1 0 0 0\n2 0 0 1 0 1 0 0 0\n1 1.2 0.5 30 0.3\n', { fileName: 'amp.s2p' });
    expect(d.freqs.length).toBe(2);
    expect(d.warnings.some((w) => /noise/.test(w.message))).toBe(true);
  });
});

describe('reading version 2.0', () => {
  it('[Two-Port Data Order] 12_21 puts S12 second (spec 2.0; the case Debian scikit-rf cannot read)', () => {
    const text = '[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 2\n[Two-Port Data Order] 12_21\n[Number of Frequencies] 1\n[Network Data]\n1 0.1 0.01 0.3 0.03 0.9 -0.2 0.2 0.02\n[End]\n';
    const d = readTouchstone(text);
    expect(d.version).toBe('2.0');
    expect(sAt(d, 0, 1, 0)).toEqual({ re: 0.9, im: -0.2 });
    expect(sAt(d, 0, 0, 1)).toEqual({ re: 0.3, im: 0.03 });
  });
  it('21_12 is the v1 order', () => {
    const text = '[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 2\n[Two-Port Data Order] 21_12\n[Number of Frequencies] 1\n[Network Data]\n1 0.1 0.01 0.9 -0.2 0.3 0.03 0.2 0.02\n[End]\n';
    expect(sAt(readTouchstone(text), 0, 1, 0)).toEqual({ re: 0.9, im: -0.2 });
  });
  it('[Reference] per port, [Matrix Format] Lower, information block skipped', () => {
    const text = [
      '[Version] 2.0', '# Hz S RI', '[Number of Ports] 3', '[Number of Frequencies] 1', '[Reference] 50 75', '  100',
      '[Matrix Format] Lower', '[Begin Information]', 'anything here', '[End Information]', '[Network Data]',
      '5e8 0.11 0', '0.21 0 0.22 0', '0.31 0 0.32 0 0.33 0', '[End]',
    ].join('\n');
    const d = readTouchstone(text);
    expect(d.ports.map((p) => p.zRef)).toEqual([50, 75, 100]);
    expect(sAt(d, 0, 0, 2).re).toBe(0.31);
    expect(sAt(d, 0, 2, 0).re).toBe(0.31);
    expect(sAt(d, 0, 1, 2).re).toBe(0.32);
  });
  it('v2 Z-parameters are in ohms, not normalised', () => {
    const text = '[Version] 2.0\n# GHz Z RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 100 0\n[End]\n';
    expect(sAt(readTouchstone(text), 0, 0, 0).re).toBeCloseTo(1 / 3, 15);
  });
});

describe('bad files: InputError bad-file with the line number', () => {
  const cases: [string, string, RegExp][] = [
    ['a value missing in the last record', '# GHz S RI R 50\n1 0 0 1 0 1 0 0 0\n2 0 0 1 0 1 0 0\n', /x\.s2p:3/],
    ['a word among the numbers', '# GHz S RI R 50\n1 0 0 1 zero 1 0 0 0\n', /x\.s2p:2.*"zero"/],
    ['an unknown option', '# THz S XY R 50\n1 0 0 1 0 1 0 0 0\n', /x\.s2p:1/],
    ['frequencies out of order (3-port)', '# GHz S RI R 50\n1 0 0 0 0 0 0\n0 0 0 0 0 0\n0 0 0 0 0 0\n3 0 0 0 0 0 0\n0 0 0 0 0 0\n0 0 0 0 0 0\n2 0 0 0 0 0 0\n0 0 0 0 0 0\n0 0 0 0 0 0\n', /x\.s2p:8.*rising order/],
    ['data before the option line', '1 0 0 1 0 1 0 0 0\n# GHz S RI R 50\n', /x\.s2p:1/],
    ['H-parameters', '# GHz H RI R 50\n1 0 0 1 0 1 0 0 0\n', /H-parameters/],
    ['v2 without [End]', '[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0 0\n', /\[End\]/],
    ['v2 2-port without the data order', '[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 2\n[Number of Frequencies] 1\n[Network Data]\n1 0 0 1 0 1 0 0 0\n[End]\n', /Two-Port Data Order/],
    ['v2 wrong frequency count', '[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 2\n[Network Data]\n1 0 0\n[End]\n', /2 frequencies/],
    ['an empty file', '', /empty/],
  ];
  for (const [what, text, re] of cases) {
    it(what, () => {
      const e = err(() => readTouchstone(text, { fileName: what.includes('3-port') ? 'x.s3p' : 'x.s2p' }));
      expect(e.code).toBe('bad-file');
      expect(e.message.replace('x.s3p', 'x.s2p')).toMatch(re);
    });
  }
});

describe('writing version 1.1', () => {
  const q = temLengthForDegrees(90, 1e9);
  const r = solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'a', b: 'b', length: q, model: idealLine(70.71) }], ports: [{ name: 'in', node: 'a', zRef: 50 }, { name: 'out', node: 'b', zRef: 100 }] }, [0.9e9, 1e9, 1.1e9]);
  it('refuses ports of different references unless one file reference is chosen', () => {
    expect(err(() => writeTouchstone(r)).field).toBe('zRef');
  });
  it('renormalises to the chosen reference (Kurokawa 1965 power waves): same as solving with that reference', () => {
    const text = writeTouchstone(r, { zRef: 50, format: 'ri' });
    expect(text).toMatch(/^# GHz S RI R 50$/m);
    const back = readTouchstone(text, { fileName: 'x.s2p' });
    const direct = solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'a', b: 'b', length: q, model: idealLine(70.71) }], ports: [{ name: 'in', node: 'a', zRef: 50 }, { name: 'out', node: 'b', zRef: 50 }] }, r.freqs);
    for (let t = 0; t < direct.s.length; t++) expect(back.s[t]).toBeCloseTo(direct.s[t], 13);
  });
  it('the header names the app, design and ports in "!" comments, ASCII only', () => {
    const text = writeTouchstone(r, { zRef: 50, app: 'stripwright 0.1.0', design: 'Feed µ-strip ✓' });
    expect(text.split('\n')[0]).toMatch(/^! stripwright 0\.1\.0/);
    expect(text).toMatch(/^! design: Feed u-strip \?$/m);
    expect(/^[\x20-\x7e\n]*$/.test(text)).toBe(true);
  });
  it('5 ports: at most four pairs per line, each row on a new line, frequency only at the start', () => {
    const P = 5, s = new Float64Array(2 * P * P).map((_, i) => i / 100);
    const five: NetworkResponse = { freqs: Float64Array.of(1e9), ports: Array.from({ length: P }, (_, i) => ({ name: `${i + 1}`, zRef: 50 })), s, warnings: [] };
    const lines = writeTouchstone(five).split('\n').filter((l) => l && !l.startsWith('!') && !l.startsWith('#'));
    expect(lines.length).toBe(10);
    expect(lines[0].trim().split(/\s+/).length).toBe(9);
    expect(lines[1].trim().split(/\s+/).length).toBe(2);
    const back = readTouchstone(writeTouchstone(five), { fileName: 'x.s5p' });
    expect(Array.from(back.s)).toEqual(Array.from(s));
  });
});

describe('writing version 2.0 (per-port references kept)', () => {
  const q = temLengthForDegrees(90, 1e9);
  const net = { elements: [{ kind: 'line' as const, id: 't', a: 'a', b: 'b', length: q, model: idealLine(70.71) }], ports: [{ name: 'in', node: 'a', zRef: 50 }, { name: 'out', node: 'b', zRef: 100 }] };
  const r = solveNetwork(net, [0.9e9, 1e9, 1.1e9]);
  it('keywords in the order of the 2.0 specification, [Reference] per port, no renormalisation', () => {
    const text = writeTouchstone(r, { version: '2.0' });
    const keys = text.split('\n').filter((l) => /^\[|^#/.test(l));
    expect(keys).toEqual(['[Version] 2.0', '# GHz S RI R 50', '[Number of Ports] 2', '[Two-Port Data Order] 21_12', '[Number of Frequencies] 3', '[Reference] 50 100', '[Network Data]', '[End]']);
    const back = readTouchstone(text);
    expect(back.ports.map((p) => p.zRef)).toEqual([50, 100]);
    expect(Array.from(back.s)).toEqual(Array.from(r.s));
  });
  it('its data renormalised to 50 Ω equal the version 1.1 export at R 50', () => {
    const v2 = readTouchstone(writeTouchstone(r, { version: '2.0' }));
    const v1 = readTouchstone(writeTouchstone(r, { zRef: 50 }), { fileName: 'x.s2p' });
    for (let k = 0; k < 3; k++) {
      const m = renormalize(v2.s.subarray(8 * k, 8 * k + 8), 2, [50, 100], 50);
      for (let t = 0; t < 8; t++) expect(m[t]).toBeCloseTo(v1.s[8 * k + t], 14);
    }
  });
});

describe('hostile and damaged files (the project’s own catalogue)', () => {
  const good = writeTouchstone(solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'a', b: 'b', length: 0.05, model: idealLine(60, 2) }, { kind: 'capacitor', id: 'c', a: 'b', b: 'gnd', value: 1e-12 }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] }, [1e9, 1.5e9, 2e9, 2.5e9]));
  const check = (text: string) => {
    try {
      const d = readTouchstone(text, { fileName: 'x.s2p' });
      for (const v of d.s) expect(Number.isFinite(v)).toBe(true);
      for (const f of d.freqs) expect(Number.isFinite(f)).toBe(true);
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).code).toBe('bad-file');
    }
  };
  it('a byte-order mark is accepted', () => {
    expect(readTouchstone('\uFEFF' + good, { fileName: 'x.s2p' }).freqs.length).toBe(4);
  });
  it('1e309 (overflows to Infinity), NUL bytes and UTF-16 text are refused with their line', () => {
    expect(err(() => readTouchstone('# GHz S RI R 50\n1 1e309 0\n', { fileName: 'x.s1p' })).message).toMatch(/x\.s1p:2: expected a finite number/);
    expect(err(() => readTouchstone('# GHz S RI R 50\n1 0\u0000 0\n', { fileName: 'x.s1p' })).message).toMatch(/x\.s1p:2: expected ASCII/);
    const utf16 = Array.from('# GHz S RI R 50\n1 0 0\n').map((c) => c + '\u0000').join('');
    expect(err(() => readTouchstone(utf16, { fileName: 'x.s1p' })).code).toBe('bad-file');
  });
  it('truncated at every 10 % of its length: data or a bad-file error, never anything else', () => {
    for (let p = 0; p <= 10; p++) check(good.slice(0, Math.floor((good.length * p) / 10)));
  });
  it('random damage (fast-check, seeded): data or a bad-file error, never NaN or a crash', () => {
    fc.assert(fc.property(fc.nat(good.length), fc.string({ maxLength: 6 }), fc.nat(8), (at, insert, cut) => {
      check(good.slice(0, at) + insert + good.slice(at + cut));
    }), { seed: 4242, numRuns: 500 });
  });
  it('a huge port count is refused before allocating', () => {
    expect(err(() => readTouchstone('[Version] 2.0\n# GHz S RI\n[Number of Ports] 100000\n[Number of Frequencies] 1\n[Network Data]\n1 0 0\n[End]\n')).message).toMatch(/at most 4097 ports/);
  });
});

describe('the writer refuses what would make a broken file', () => {
  it('non-finite S or frequencies that do not increase', () => {
    const bad: NetworkResponse = { freqs: Float64Array.of(1e9, 2e9), ports: [{ name: '1', zRef: 50 }], s: Float64Array.of(0, 0, NaN, 0), warnings: [] };
    expect(err(() => writeTouchstone(bad)).code).toBe('invalid-number');
    const order: NetworkResponse = { ...bad, freqs: Float64Array.of(2e9, 1e9), s: new Float64Array(4) };
    expect(err(() => writeTouchstone(order)).field).toBe('freqs[1]');
  });
});
