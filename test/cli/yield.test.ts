/**
 * `stripwright yield` and the targets in `stripwright build`, run as a user would (through the CLI entry point).
 * The numbers are checked against outside references in test/reference/yield-*.test.ts; here: the faces agree with
 * the core function, the same seed repeats, and the exit codes follow the documented rule.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cli } from './cli-basics.test.ts';
import { parseDesign, runYield } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');

describe('stripwright yield', () => {
  it('prints the overall yield with its interval, each target and the ranking, and exits 0', () => {
    const r = cli(['yield', join(EX, 'open-stub-match.json'), '--samples', '40', '--seed', '3', '--ranking', '10']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Overall yield: [\d.]+ %\s+\(95 % interval [\d.]+ % – [\d.]+ %, \d+ of 40 boards/);
    expect(r.stdout).toMatch(/source matched — return loss at src ≥ 20 dB, at 2\.4 GHz/);
    expect(r.stdout).toMatch(/What matters most/);
  });
  it('--json gives the same numbers as the core function for the same seed', async () => {
    const r = cli(['yield', join(EX, 'three-section-transformer.json'), '--samples', '30', '--seed', '9', '--ranking', '0', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    const parsed = parseDesign(readFileSync(join(EX, 'three-section-transformer.json'), 'utf8'));
    if (!parsed.ok) throw new Error('refused');
    const core = await runYield(parsed.doc, { samples: 30, seed: 9, rankingSamples: 0 });
    expect(j.overall).toEqual(core.overall);
    expect(j.targets[0].stats).toEqual(core.targets[0]!.stats);
    expect(j.targets[0].values).toBeUndefined();
    expect(j.generator).toMatch(/xoshiro128/);
  });
  it('exits 1 when no value can be produced (no targets) and 2 for a bad command line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-yield-'));
    const file = join(dir, 'no-targets.json');
    const doc = JSON.parse(readFileSync(join(EX, 'open-stub-match.json'), 'utf8'));
    doc.targets = [];
    writeFileSync(file, JSON.stringify(doc));
    const r = cli(['yield', file, '--samples', '5']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/targets: expected at least one target/);
    const bad = cli(['yield', join(EX, 'open-stub-match.json'), '--samples', 'many']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--samples expects a whole number/);
  });
});

describe('stripwright build with targets', () => {
  it('prints a PASS/FAIL line per target for the board as drawn', () => {
    const r = cli(['build', join(EX, 'wilkinson-2g45.json')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Targets \(the board as drawn, nominal laminate\):/);
    expect(r.stdout).toMatch(/PASS {2}outputs isolated \(isolation output 1→output 2 ≥ 20 dB, 2\.4–2\.5 GHz\): worst 37\.\d\d dB/);
  });
  it('a target the board misses is a FAIL line, and --json carries the evaluation', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-build-t-'));
    const file = join(dir, 'strict.json');
    const doc = JSON.parse(readFileSync(join(EX, 'wilkinson-2g45.json'), 'utf8'));
    doc.targets.find((t: { id: string }) => t.id === 'isolation').limit = { min: 60 };
    writeFileSync(file, JSON.stringify(doc));
    expect(cli(['build', file]).stdout).toMatch(/FAIL {2}outputs isolated/);
    const j = JSON.parse(cli(['build', file, '--json']).stdout);
    expect(j.targets.pass).toBe(false);
    expect(j.targets.results.find((x: { id: string }) => x.id === 'isolation').margin).toBeLessThan(0);
  });
});
