/** `stripwright line --coupled`: flags, JSON keys, synthesis and refusals, against the core function it fronts. */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { runCli } from '../../cli/main.ts';
import { coupledLine } from '../../core/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
async function run(args: string[]) {
  const out: string[] = []; const err: string[] = [];
  const code = await runCli(['line', ...args], { out: (t) => out.push(t), err: (t) => err.push(t), cwd: ROOT });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}
const SUB = { er: 3.66, h: 0.508e-3, t: 0, tanDelta: 0, sigma: 5.8e7, roughness: 0 };

describe('stripwright line --coupled', () => {
  it('analyses a pair and prints the documented JSON keys, equal to core coupledLine', async () => {
    const r = await run(['--er', '3.66', '--h', '0.508mm', '--t', '0', '--coupled', '--width', '0.5mm', '--spacing', '0.1mm', '--f', '5GHz', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    for (const k of ['z0_even_ohm', 'z0_odd_ohm', 'eps_eff_even', 'eps_eff_odd', 'coupling_db']) expect(typeof j[k]).toBe('number');
    const c = coupledLine(SUB, { width: 0.5e-3, spacing: 0.1e-3 }, 5e9);
    expect(j.z0_even_ohm).toBe(c.even.z0);
    expect(j.eps_eff_odd).toBe(c.odd.epsEff);
    expect(j.coupling_db).toBe(c.couplingDb);
  });
  it('sizes a pair for --coupling-db and --z0 (10 dB in 50 Ω)', async () => {
    const r = await run(['--er', '3.66', '--h', '0.508mm', '--coupled', '--coupling-db', '10', '--z0', '50', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.coupling_db).toBeCloseTo(10, 8);
    expect(j.z0_system_ohm).toBeCloseTo(50, 8);
    expect(j.spacing_m).toBeGreaterThan(0);
  });
  it('refuses an unreachable coupling in words (exit 1) and a mixed command line (exit 2)', async () => {
    const r = await run(['--er', '3.66', '--h', '0.508mm', '--coupled', '--coupling-db', '3', '--z0', '50']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/coupling from .* dB/);
    const u = await run(['--er', '3.66', '--h', '0.508mm', '--coupled', '--width', '1mm', '--coupling-db', '10', '--z0', '50']);
    expect(u.code).toBe(2);
    const v = await run(['--er', '3.66', '--h', '0.508mm', '--spacing', '1mm', '--width', '1mm']);
    expect(v.code).toBe(2);
  });
});
