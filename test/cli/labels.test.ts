/**
 * Port labels on the command line (issue 14, fault 8): build and sweep print ports as the user labelled them, take
 * a label wherever they take a port, and the Touchstone file says which port is which. The example's own labels
 * are the data; each check compares the CLI with itself (a label and an id give the same numbers).
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { cli } from './cli-basics.test.ts';

const WILK = join(import.meta.dirname, '..', '..', 'assets', 'examples', 'wilkinson-2g45.json');

describe('port labels in build and sweep', () => {
  it('sweep --input takes a label and gives the same figures as the id', () => {
    const byLabel = cli(['sweep', WILK, '--points', '3', '--input', 'output 1', '--json']);
    const byId = cli(['sweep', WILK, '--points', '3', '--input', 'o1', '--json']);
    expect(byLabel.code).toBe(0);
    expect(byLabel.stdout).toBe(byId.stdout);
    expect(JSON.parse(byLabel.stdout).input).toBe('o1');
    const text = cli(['sweep', WILK, '--points', '3', '--input', 'output 1']).stdout;
    expect(text).toMatch(/path from output 1 /);
    expect(text).toMatch(/→ input /);
    expect(text).not.toMatch(/→ in /);
  });
  it('an unknown port names the labels and ids there are', () => {
    const r = cli(['sweep', WILK, '--points', '3', '--input', 'output 9']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/input = in, output 1 = o1, output 2 = o2/);
  });
  it('the Touchstone comment says which port is which', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-labels-'));
    expect(cli(['sweep', WILK, '--points', '3', '--out', join(dir, 'w.s3p')]).code).toBe(0);
    expect(readFileSync(join(dir, 'w.s3p'), 'utf8')).toMatch(/^! ports: 1=input \(in\) 2=output 1 \(o1\) 3=output 2 \(o2\)$/m);
  });
  it('build --from/--to take labels; its tables name ports and pieces by their labels', () => {
    const byLabel = cli(['build', WILK, '--json', '--from', 'input', '--to', 'output 1,output 2']);
    const byId = cli(['build', WILK, '--json', '--from', 'in', '--to', 'o1,o2']);
    expect(byLabel.code).toBe(0);
    expect(JSON.parse(byLabel.stdout).paths).toEqual(JSON.parse(byId.stdout).paths);
    const text = cli(['build', WILK]).stdout;
    expect(text).toMatch(/Paths: Outputs balanced \(from input,/);
    expect(text).toMatch(/^output 1 +\d/m);
    expect(text).toMatch(/input match \(return loss at input ≥ 20 dB/);
    expect(text).toMatch(/isolation output 1→output 2/);
    expect(text).toMatch(/^isolation resistor +lumped/m);
  });
});
