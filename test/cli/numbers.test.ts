/**
 * Numbers on the command line as a person types them (issue 14, fault 12): every numeric option goes through the one
 * units parser. A bare frequency is refused with the likely unit; angles, levels, impedances, counts and εr keep
 * their bare form. Checks compare the CLI with itself (the same value written two ways gives the same report),
 * so no figure here is hard-coded; 0.1 rad = 5.7296° is the definition of the radian.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { cli } from './cli-basics.test.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const WILK = join(EX, 'wilkinson-2g45.json');

describe('numeric options through the one units parser', () => {
  it('line --f 2.45 is refused with "did you mean 2.45 GHz?"; with the unit it sizes at 2.45 GHz', () => {
    const bare = cli(['line', '--preset', 'glass-epoxy', '--z0', '50', '--f', '2.45']);
    expect(bare.code).not.toBe(0);
    expect(bare.stderr).toMatch(/did you mean 2\.45 GHz\?/);
    const big = cli(['line', '--preset', 'glass-epoxy', '--z0', '50', '--f', '433000000']);
    expect(big.stderr).toMatch(/did you mean 433000000 Hz\?/);
    const ok = cli(['line', '--preset', 'glass-epoxy', '--z0', '50', '--f', '2.45GHz', '--json']);
    expect(ok.code).toBe(0);
    expect(JSON.parse(ok.stdout).f_hz).toBe(2.45e9);
    // Bare numbers stay accepted for εr and impedances.
    const er = cli(['line', '--er', '4.4', '--h', '1.6mm', '--z0', '50', '--json']);
    expect(er.code).toBe(0);
  });
  it('build --tolerance 5deg and --loss-limit 2dB mean the same as the bare numbers', () => {
    const withUnits = cli(['build', WILK, '--json', '--tolerance', '5deg', '--loss-limit', '2dB']);
    const bare = cli(['build', WILK, '--json', '--tolerance', '5', '--loss-limit', '2']);
    expect(withUnits.code).toBe(0);
    expect(withUnits.stdout).toBe(bare.stdout);
    expect(JSON.parse(withUnits.stdout).paths[0].toleranceDeg).toBe(5);
    const deg = cli(['build', WILK, '--json', '--tolerance', '5°']);
    expect(JSON.parse(deg.stdout).paths[0].toleranceDeg).toBeCloseTo(5, 12);
    const rad = cli(['build', WILK, '--json', '--tolerance', '0.1rad']);
    expect(JSON.parse(rad.stdout).paths[0].toleranceDeg).toBeCloseTo(18 / Math.PI, 12); // 0.1 rad in degrees
  });
  it('a loss limit with a unit is used: a tiny one turns every path into a loss finding', () => {
    const tight = JSON.parse(cli(['build', WILK, '--json', '--loss-limit', '0.0001dB']).stdout);
    const loose = JSON.parse(cli(['build', WILK, '--json', '--loss-limit', '100 dB']).stdout);
    const lossFindings = (j: { findings: { code: string }[] }) => j.findings.filter((f) => /loss/.test(f.code)).length;
    expect(lossFindings(tight)).toBeGreaterThan(lossFindings(loose));
  });
  it('a wrong unit or an out-of-range value is a usage error naming the option', () => {
    const r = cli(['build', WILK, '--tolerance', '5mm']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--tolerance: expected an angle/);
    const far = cli(['build', WILK, '--tolerance', '200deg']);
    expect(far.code).toBe(2);
    expect(far.stderr).toMatch(/--tolerance expects above 0° and up to 180°/);
    const ll = cli(['build', WILK, '--loss-limit', '2GHz']);
    expect(ll.code).toBe(2);
    expect(ll.stderr).toMatch(/--loss-limit: expected a level in dB/);
  });
  it('sweep: a bare --from is refused with a suggestion; --zref takes 50 or 50ohm; counts stay bare', () => {
    const from = cli(['sweep', WILK, '--from', '2.4', '--to', '2.5GHz']);
    expect(from.code).toBe(2);
    expect(from.stderr).toMatch(/did you mean 2\.4 GHz\?/);
    const a = cli(['sweep', WILK, '--points', '3', '--json']);
    expect(a.code).toBe(0);
    expect(JSON.parse(a.stdout).frequencies).toHaveLength(3);
    const dir = mkdtempSync(join(tmpdir(), 'sw-zref-'));
    expect(cli(['sweep', WILK, '--points', '3', '--zref', '50ohm', '--out', join(dir, 'a.s3p')]).code).toBe(0);
    expect(cli(['sweep', WILK, '--points', '3', '--zref', '50', '--out', join(dir, 'b.s3p')]).code).toBe(0);
    expect(readFileSync(join(dir, 'a.s3p'), 'utf8')).toBe(readFileSync(join(dir, 'b.s3p'), 'utf8'));
  });
});
