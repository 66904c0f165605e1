/**
 * `stripwright coupon` end to end (CLI from source, cli() of cli-basics.test.ts) on the scikit-rf-made fixtures of
 * test/fixtures/coupon (εr 4.25, tanδ 0.017 behind them; see that folder's README). The CLI must give what the core
 * gives in-process (one function for every face) and the laminate within the outside check's targets.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cli } from './cli-basics.test.ts';
import { extractLaminate, parseDesign, validateDesign } from '../../core/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const FIX = join(ROOT, 'test', 'fixtures', 'coupon');
const A = join(FIX, 'coupon-25mm.s2p'), B = join(FIX, 'coupon-41.5mm.s2p');
const dir = mkdtempSync(join(tmpdir(), 'sw-coupon-'));
const GEOM = ['--h', '1.52mm', '--t', '0', '--width', '2.9mm'];

describe('stripwright coupon (measure)', () => {
  it('--json: top-level er and tand, uncertainties, excluded list; the same numbers as the core in-process', () => {
    const r = cli(['coupon', A, B, '--length-a', '25mm', '--length-b', '41.5mm', ...GEOM, '--dielectric', 'constant', '--conductor-loss', 'current-distribution', '--json']);
    expect(r.code, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(Math.abs(j.er / 4.25 - 1)).toBeLessThan(0.005);
    expect(Math.abs(j.tand / 0.017 - 1)).toBeLessThan(0.15);
    expect(j.uncertainty.er).toBeGreaterThan(0);
    expect(j.uncertainty.tand).toBeGreaterThan(0);
    expect(Array.isArray(j.excluded)).toBe(true);
    const own = extractLaminate({
      lines: [{ name: 'coupon-25mm.s2p', text: readFileSync(A, 'utf8'), length: 0.025 }, { name: 'coupon-41.5mm.s2p', text: readFileSync(B, 'utf8'), length: 0.0415 }],
      width: 2.9e-3, h: 1.52e-3, t: 0, dielectric: 'constant', line: { conductorLoss: 'current-distribution' },
    });
    expect(j.er).toBe(own.er);
    expect(j.tand).toBe(own.tand);
  });
  it('a table by default, stated frequency and uncertainty; --lengths as one list', () => {
    const r = cli(['coupon', A, B, '--lengths', '25mm,41.5mm', ...GEOM]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/εr\s+4\.2\d+ ± /);
    expect(r.stdout).toMatch(/stated at 2 GHz \(wideband Debye/);
  });
  it('equal lengths, a missing flag: clear errors and exit codes', () => {
    const eq = cli(['coupon', A, B, '--lengths', '25mm,25mm', ...GEOM]);
    expect(eq.code).toBe(1);
    expect(eq.stderr).toMatch(/lines\[1\]\.length: expected a length different from coupon-25mm\.s2p/);
    const missing = cli(['coupon', A, B, '--length-a', '25mm', ...GEOM]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/give --length-b/);
  });
});

describe('stripwright coupon --make', () => {
  it('writes a coupon design the loader accepts, and prints the plan', () => {
    const out = join(dir, 'coupon.json');
    const r = cli(['coupon', '--make', '--preset', 'glass-epoxy', '--from', '1GHz', '--to', '4GHz', '--thru', '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/line B\s+41\.29 mm\s+\(β·Δl 36°–144°/);
    const p = parseDesign(readFileSync(out, 'utf8'));
    expect(p.ok).toBe(true);
    if (p.ok) expect(p.doc.segments.map((s) => s.id).sort()).toEqual(['lineA', 'lineB', 'lineT']);
    // Refuses to replace it without --force.
    expect(cli(['coupon', '--make', '--preset', 'glass-epoxy', '--from', '1GHz', '--to', '4GHz', '--out', out]).code).toBe(1);
  });
  it('--add-to puts the coupon below an existing design, which keeps everything it had', () => {
    const src = join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json');
    const out = join(dir, 'wilk-coupon.json');
    const r = cli(['coupon', '--make', '--add-to', src, '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    const before = parseDesign(readFileSync(src, 'utf8')), after = parseDesign(readFileSync(out, 'utf8'));
    if (!before.ok || !after.ok) throw new Error('does not parse');
    expect(after.doc.segments.length).toBe(before.doc.segments.length + 2);
    for (const s of before.doc.segments) expect(after.doc.segments.find((x) => x.id === s.id)).toEqual(s);
    expect(validateDesign(after.doc, { complete: true }).ok).toBe(true);
    const top = Math.max(...after.doc.nodes.filter((n) => !before.doc.nodes.some((m) => m.id === n.id)).map((n) => n.at.y));
    expect(top).toBeLessThan(Math.min(...before.doc.nodes.map((n) => n.at.y)));
  });
});
