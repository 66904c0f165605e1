/**
 * Regression set of real Touchstone files (test/fixtures/touchstone/skrf, copied from Debian's python3-scikit-rf
 * 0.15.4 package data under its BSD 3-Clause licence): our reader against scikit-rf's reading of the same bytes
 * (scripts/reference/skrf_read_many.py, Debian python3), frequencies and S to 1e-6.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readTouchstone } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';
import { python } from './network-oracle.ts';

const DIR = join(import.meta.dirname, '..', 'fixtures', 'touchstone', 'skrf');
const FILES = readdirSync(DIR).filter((f) => /\.s\dp$/i.test(f)).sort();
/** Port impedances from vendor comments (not the Touchstone specification): scikit-rf reads them, we do not. */
const VENDOR_Z0 = new Set(['hfss2020r2_test_multiport.s1p', 'hfss2019r2_test_multiport.s5p']);
/** Outside the specification (a complex reference): refused by our reader with its line, read by scikit-rf. */
const REFUSED: Record<string, RegExp> = { 'simple_touchstone.s2p': /simple_touchstone\.s2p:\d+: .*reference resistance/ };

interface SkrfRead { file: string; nports?: number; f?: number[]; z0?: number[]; s?: [number, number][][][]; error?: string }

describe('real Touchstone files: our reader against Debian scikit-rf 0.15.4', () => {
  const ref = JSON.parse(python('skrf_read_many.py', '', FILES.map((f) => join(DIR, f)))) as SkrfRead[];
  it('the set holds at least a dozen files and scikit-rf reads each', () => {
    expect(FILES.length).toBeGreaterThanOrEqual(12);
    for (const r of ref) expect(r.error, r.file).toBeUndefined();
  });
  FILES.forEach((name, n) => {
    it(name, () => {
      const text = readFileSync(join(DIR, name), 'utf8');
      if (REFUSED[name]) {
        let e: unknown;
        try { readTouchstone(text, { fileName: name }); } catch (x) { e = x; }
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).message).toMatch(REFUSED[name]);
        return;
      }
      const ours = readTouchstone(text, { fileName: name });
      const r = ref[n]!;
      const P = r.nports!, F = r.f!.length;
      expect(ours.ports.length).toBe(P);
      expect(ours.freqs.length).toBe(F);
      let worst = 0;
      for (let k = 0; k < F; k++) {
        expect(Math.abs(ours.freqs[k] - r.f![k])).toBeLessThanOrEqual(1e-6 * Math.max(1, r.f![k]));
        for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
          const t = 2 * ((k * P + i) * P + j);
          worst = Math.max(worst, Math.abs(ours.s[t] - r.s![k][i][j][0]), Math.abs(ours.s[t + 1] - r.s![k][i][j][1]));
        }
      }
      expect(worst).toBeLessThanOrEqual(1e-6);
      if (!VENDOR_Z0.has(name)) for (let i = 0; i < P; i++) expect(ours.ports[i].zRef).toBeCloseTo(r.z0![i], 9);
    });
  });
  it('the repeated frequency in ntwk_noise.s2p is kept as data with a warning naming its line (12 points, as scikit-rf)', () => {
    const d = readTouchstone(readFileSync(join(DIR, 'ntwk_noise.s2p'), 'utf8'), { fileName: 'ntwk_noise.s2p' });
    expect(d.freqs.length).toBe(12);
    expect(d.warnings.find((w) => /repeats/.test(w.message))?.message).toMatch(/line 12\b/);
  });
});
