/**
 * `stripwright sweep` end to end: runs the CLI from source (cli() helper of cli-basics.test.ts). The numbers are
 * checked against the core solved in-process and, for the Touchstone file, against Debian's scikit-rf reading it.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cli } from './cli-basics.test.ts';
import { python } from '../reference/network-oracle.ts';
import { parseDesign } from '../../core/design/index.ts';
import { sizeDesign } from '../../core/layout/index.ts';
import { netlistFromSized, solveNetwork, sweepFrequencies, readTouchstone, writeTouchstone } from '../../core/network/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const WILK = join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json');
const dir = mkdtempSync(join(tmpdir(), 'sw-sweep-'));

describe('stripwright sweep', () => {
  it('sweeps at the design\'s own settings (format 7), the frequencies the app uses; flags still win', () => {
    const doc = JSON.parse(readFileSync(WILK, 'utf8'));
    doc.sweep = { start: 2e9, stop: 3e9, points: 5, spacing: 'log' };
    const file = join(dir, 'wilk-own-sweep.json');
    writeFileSync(file, JSON.stringify(doc));
    const a = JSON.parse(cli(['sweep', file, '--json']).stdout);
    // Logarithmic: 2, 2·1.5^(1/4), …, 3 GHz (equal ratios).
    expect(a.frequencies.length).toBe(5);
    expect(a.frequencies[0]).toBe(2e9);
    expect(a.frequencies[2]).toBeCloseTo(Math.sqrt(6) * 1e9, 0);
    const b = JSON.parse(cli(['sweep', file, '--json', '--points', '3']).stdout);
    expect(b.frequencies).toHaveLength(3);
    expect(b.frequencies[1]).toBeCloseTo(Math.sqrt(6) * 1e9, 0);
  });
  it('--junctions ideal sweeps with the arms joined at the junction centres, for comparison', () => {
    const file = join(ROOT, 'assets', 'examples', 'open-stub-match.json');
    const a = JSON.parse(cli(['sweep', file, '--points', '3', '--json']).stdout);
    const b = JSON.parse(cli(['sweep', file, '--points', '3', '--json', '--junctions', 'ideal']).stdout);
    expect(a.s.re[1][0][0]).not.toBe(b.s.re[1][0][0]);
    expect(b.warnings.some((w: { message: string }) => /ideal junction/.test(w.message))).toBe(true);
    expect(cli(['sweep', file, '--junctions', 'no']).code).toBe(2);
  });
  it('prints a summary: worst figures over the band and the values at f0', () => {
    const r = cli(['sweep', WILK]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/201 points, 2\.4 GHz – 2\.5 GHz/);
    expect(r.stdout).toMatch(/Worst over the band/);
    expect(r.stdout).toMatch(/At 2\.45 GHz \(f0\)/);
    expect(r.stdout).toMatch(/output 1\/output 2/); // outputs by their labels
    // What the model leaves out is said, not hidden: the split is Y-shaped, and no published model is at hand for it.
    expect(r.stdout).toMatch(/Notes\n  junction j: arms not in a T .*no published model at hand/);
  });
  it('--json holds the frequencies, S as re/im and the figures, equal to the core solved in-process', () => {
    const r = cli(['sweep', WILK, '--from', '2.3GHz', '--to', '2.6GHz', '--points', '31', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.frequencies).toHaveLength(31);
    expect(j.frequencies[0]).toBe(2.3e9);
    expect(j.s.re).toHaveLength(31);
    expect(j.s.re[0]).toHaveLength(3);
    const doc = parseDesign(readFileSync(WILK, 'utf8'));
    if (!doc.ok) throw new Error('example does not parse');
    const own = solveNetwork(netlistFromSized(sizeDesign(doc.doc)), sweepFrequencies({ start: 2.3e9, stop: 2.6e9, points: 31 }));
    for (let k = 0; k < 31; k++) for (let i = 0; i < 3; i++) for (let q = 0; q < 3; q++) {
      const t = 2 * ((k * 3 + i) * 3 + q);
      expect(j.s.re[k][i][q]).toBe(own.s[t]);
      expect(j.s.im[k][i][q]).toBe(own.s[t + 1]);
    }
    expect(j.figures.paths.map((p: { to: string }) => p.to)).toEqual(['o1', 'o2']);
    expect(j.figures.pairs[0].isolationDb).toHaveLength(31);
    expect(j.worst.ports[0].name).toBe('in');
  });
  it('--out writes Touchstone 1.1 that scikit-rf reads back to the same S as --json (Touchstone File Format Specification, IBIS Open Forum)', () => {
    const out = join(dir, 'wilk.s3p');
    const w = cli(['sweep', WILK, '--points', '11', '--out', out]);
    expect(w.code).toBe(0);
    expect(w.stdout).toMatch(/wrote .*wilk\.s3p/);
    const text = readFileSync(out, 'utf8');
    expect(text).toMatch(/^! stripwright /);
    expect(text).toMatch(/^# GHz S RI R 50$/m);
    const j = JSON.parse(cli(['sweep', WILK, '--points', '11', '--json']).stdout);
    const back = JSON.parse(python('skrf_read.py', '', [out])) as { s: number[][][][]; f: number[] };
    expect(back.f).toEqual(j.frequencies);
    back.s.forEach((m, k) => m.forEach((row, i) => row.forEach(([re, im], q) => {
      expect(Math.abs(re - j.s.re[k][i][q]) + Math.abs(im - j.s.im[k][i][q])).toBeLessThan(1e-12);
    })));
  });
  it('never replaces a file without --force, and says so', () => {
    const out = join(dir, 'keep.s3p');
    writeFileSync(out, 'mine');
    const r = cli(['sweep', WILK, '--points', '3', '--out', out]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/not replacing .*--force/);
    expect(readFileSync(out, 'utf8')).toBe('mine');
    expect(cli(['sweep', WILK, '--points', '3', '--out', out, '--force']).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/^! stripwright/);
  });
  it('refuses an --out name whose extension does not match the port count', () => {
    const out = join(dir, 'wrong.s2p');
    const r = cli(['sweep', WILK, '--points', '3', '--out', out]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/should end in \.s3p/);
    expect(existsSync(out)).toBe(false);
  });
  it('summarises a Touchstone file given instead of a design', () => {
    const out = join(dir, 'again.s3p');
    cli(['sweep', WILK, '--points', '5', '--out', out]);
    const r = cli(['sweep', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Touchstone file "again\.s3p": 5 points/);
  });
  it('--compare sweeps at a measured file’s frequencies and reports the differences (a board 0.9× in S21 and S12 shows 0.92 dB)', () => {
    const own = join(dir, 'own.s3p');
    cli(['sweep', WILK, '--from', '2.41GHz', '--to', '2.49GHz', '--points', '9', '--out', own]);
    // A "measured" file: the same data with the through paths 10 % low (20·log10(0.9) = −0.915 dB).
    const data = readTouchstone(readFileSync(own, 'utf8'), { fileName: 'own.s3p' });
    for (let k = 0; k < data.freqs.length; k++) for (const [i, j] of [[1, 0], [0, 1]]) {
      const t = 2 * ((k * 3 + i) * 3 + j);
      data.s[t] *= 0.9; data.s[t + 1] *= 0.9;
    }
    const meas = join(dir, 'meas.s3p');
    writeFileSync(meas, writeTouchstone(data));
    const same = JSON.parse(cli(['sweep', WILK, '--compare', own, '--json']).stdout);
    for (const e of same.comparison.entries) expect(e.maxVector.value).toBeLessThan(1e-12);
    const r = cli(['sweep', WILK, '--compare', meas, '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.frequencies).toHaveLength(9);
    const byName = (n: string) => j.comparison.entries.find((e: { s: string }) => e.s === n);
    expect(byName('S21').maxDb.value).toBeCloseTo(-20 * Math.log10(0.9), 9);
    expect(byName('S12').maxDb.value).toBeCloseTo(-20 * Math.log10(0.9), 9);
    expect(byName('S31').maxVector.value).toBeLessThan(1e-12);
    expect(byName('S21').maxDeg.value).toBeLessThan(1e-9);
    const text = cli(['sweep', WILK, '--compare', meas]);
    expect(text.stdout).toMatch(/Compared with meas\.s3p at its 9 frequencies/);
  });
  it('bad command lines exit 2 with the reason; bad files exit 1 with the reason', () => {
    expect(cli(['sweep']).code).toBe(2);
    const pts = cli(['sweep', WILK, '--points', 'many']);
    expect(pts.code).toBe(2);
    expect(pts.stderr).toMatch(/--points expects a whole number/);
    expect(cli(['sweep', WILK, '--format', 'xy', '--out', 'x.s3p']).stderr).toMatch(/--format must be one of ri, ma, db/);
    expect(cli(['sweep', WILK, '--from', '3 apples']).code).toBe(2);
    expect(cli(['sweep', WILK, '--frobnicate']).code).toBe(2);
    const missing = cli(['sweep', join(dir, 'nope.json')]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/no such file/);
    const bad = join(dir, 'bad.json');
    writeFileSync(bad, '{"format": "stripwright-design", "version": 1');
    const b = cli(['sweep', bad]);
    expect(b.code).toBe(1);
    expect(b.stderr).toMatch(/not a valid design/);
    const ts = join(dir, 'short.s2p');
    writeFileSync(ts, '# GHz S RI R 50\n1 0 0 1 0 1 0 0\n');
    const t = cli(['sweep', ts]);
    expect(t.code).toBe(1);
    expect(t.stderr).toMatch(/short\.s2p:2/);
  });
});
