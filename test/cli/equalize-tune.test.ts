/**
 * `stripwright equalize` and `stripwright tune` run as a user would (through the CLI entry point): the written file
 * is the core function's result, a seed repeats, refusals exit 1 with the reason, and bad command lines exit 2.
 * The numbers are checked against outside references in test/unit/equalize.test.ts, test/unit/tune.test.ts and
 * test/reference/meander-coupling.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cli } from './cli-basics.test.ts';
import { equalizeGroup, parseDesign, serializeDesign, makeBlockDesign, tuneWithBlocks, type DesignDoc, type Target } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const dir = mkdtempSync(join(tmpdir(), 'sw-eq-'));
const demo = (): DesignDoc => { const r = parseDesign(readFileSync(join(EX, 'demo.json'), 'utf8')); if (!r.ok) throw new Error('demo'); return r.doc; };
const uneven: DesignDoc = { ...demo(), segments: demo().segments.map((s) => (s.id === 'risel' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: 10e-3 } } : s)) };
const src = join(dir, 'uneven.json');
writeFileSync(src, serializeDesign(uneven));

describe('stripwright equalize', () => {
  it('writes the equalized design, the same as the core function gives, and prints the meanders', () => {
    const out = join(dir, 'eq.json');
    const r = cli(['equalize', src, '--group', 'Patch feeds in phase', '--out', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/1 meander\(s\); spread at f0 0\.\d\d°/);
    expect(r.stdout).toMatch(/armr: \+2\d\.\d\d°/);
    expect(readFileSync(out, 'utf8')).toBe(serializeDesign(equalizeGroup(uneven, { group: 'outputs' }).doc));
  });
  it('refuses with the missing length when the chosen pieces have no room (exit 1)', () => {
    const r = cli(['equalize', src, '--group', 'outputs', '--pieces', 'riser', '--out', join(dir, 'no.json')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/mm is missing/);
  });
  it('a serpentine-only equalize of a small difference says how much the smallest serpentine adds and what to try (exit 1)', () => {
    const r = cli(['equalize', src, '--group', 'outputs', '--style', 'serpentine', '--out', join(dir, 'serp.json')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/is [\d.]+° \([\d.]+ mm of line\) short, but the smallest serpentine \(two bumps or more\) on its runs \(armr.*\) adds [\d.]+ mm/);
    expect(r.stderr).toMatch(/meander style auto .* or trombone/);
  });
  it('prints the sweep\'s phase spread at the band edges of an equal-phase group', () => {
    const r = cli(['equalize', src, '--group', 'outputs', '--out', join(dir, 'eq2.json')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/the sweep's S21 phase spread: \d+\.\d\d \/ \d+\.\d\d \/ \d+\.\d\d° at band start \/ f0 \/ stop/);
  });
  it('a bad command line exits 2 with the usage', () => {
    const r = cli(['equalize', src, '--out', join(dir, 'x.json')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--group/);
  });
});

describe('stripwright tune', () => {
  it('prints a before/after table and repeats for a seed', () => {
    const args = (out: string) => ['tune', join(EX, 'open-stub-match.json'), '--vary', 'toload:degrees:90:170', '--vary', 'stub:degrees:20:70', '--seed', '5', '--points', '21', '--out', out];
    const a = cli(args(join(dir, 't1.json'))), b = cli(args(join(dir, 't2.json')));
    expect(a.code).toBe(0);
    expect(a.stdout).toMatch(/seed 5: \d+ evaluations/);
    expect(a.stdout).toMatch(/toload degrees\s+125\.264\s+[\d.]+/);
    expect(a.stdout).toMatch(/source matched\s+[\d.]+\s+[\d.]+/);
    expect(readFileSync(join(dir, 't1.json'), 'utf8')).toBe(readFileSync(join(dir, 't2.json'), 'utf8'));
  }, 60_000);
  it('takes goals from a file (target records with weights)', () => {
    const goals = join(dir, 'goals.json');
    writeFileSync(goals, JSON.stringify([{ id: 'deep', figure: 'return-loss', ports: ['src'], band: { start: 2.4e9, stop: 2.4e9 }, limit: { min: 40 }, weight: 2 }]));
    const r = cli(['tune', join(EX, 'open-stub-match.json'), '--goals', goals, '--vary', 'stub:degrees:20:70', '--out', join(dir, 't3.json')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/return loss at src ≥ 40 dB/);
  }, 60_000);
  it('refuses a bad --vary (exit 2) and an unknown piece (exit 1)', () => {
    expect(cli(['tune', join(EX, 'open-stub-match.json'), '--vary', 'stub:furlongs:1:2', '--out', join(dir, 'x.json')]).code).toBe(2);
    const r = cli(['tune', join(EX, 'open-stub-match.json'), '--vary', 'nope:degrees:1:2', '--out', join(dir, 'x.json')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/ids of segments/);
  });
});

describe('stripwright tune with a block parameter', () => {
  const doc = makeBlockDesign('wilkinson', { ratioDb: 0 }, { f0: 2.45e9 });
  const g = doc.phaseGroups[0]!;
  const goal: Target = { id: 'split', figure: 'transmission', ports: [g.from, g.to[0]!], band: { start: 2.45e9, stop: 2.45e9 }, limit: { min: -4.1, max: -3.9 } };
  const variables = [{ block: 'b1', param: 'ratioDb', min: -4, max: 4 }];
  it('the CLI takes BLOCK@PARAM:MIN:MAX (the option spelling too) and writes what the core gives', async () => {
    const src = join(dir, 'w.json'), goals = join(dir, 'goals.json'), out = join(dir, 'out.json');
    writeFileSync(src, serializeDesign(doc));
    writeFileSync(goals, JSON.stringify([goal]));
    const r = cli(['tune', src, '--goals', goals, '--vary', 'b1@ratio-db:-4:4', '--seed', '1', '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/b1 ratioDb/);
    const core = await tuneWithBlocks(doc, { variables, goals: [{ target: goal, weight: 1 }], seed: 1 });
    const back = parseDesign(readFileSync(out, 'utf8'));
    expect(back.ok).toBe(true);
    expect(readFileSync(out, 'utf8')).toBe(serializeDesign(core.doc));
  });
});
