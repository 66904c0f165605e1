/**
 * `stripwright section`: flags, JSON keys, even/odd modes, and input errors. The numbers are those of the core
 * function it fronts (solveSection), which is checked against outside sources in test/reference/section-*.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { runCli } from '../../cli/main.ts';
import { solveSection } from '../../core/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
async function run(args: string[]) {
  const out: string[] = []; const err: string[] = [];
  const code = await runCli(['section', ...args], { out: (t) => out.push(t), err: (t) => err.push(t), cwd: ROOT });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}

describe('stripwright section', () => {
  it('--json prints Z0, εeff, C, L and their error estimates, from the same core function', async () => {
    const r = await run(['--er', '4.4', '--h', '1.6mm', '--width', '3mm', '--t', '35um', '--gap', '0.5mm', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    for (const k of ['z0_ohm', 'eps_eff', 'c_f_per_m', 'l_h_per_m', 'error', 'warnings']) expect(j).toHaveProperty(k);
    const m = solveSection({ er: 4.4, h: 1.6e-3, width: 3e-3, t: 35e-6, side: { gap: 0.5e-3, width: Infinity, connection: 'stitched' } }).modes[0]!;
    expect(j.z0_ohm).toBeCloseTo(m.z0, 9);
    expect(j.eps_eff).toBeCloseTo(m.epsEff, 9);
    expect(j.c_f_per_m).toBeCloseTo(m.c, 20);
    expect(j.error.z0_rel).toBeGreaterThan(0);
  });
  it('--floating leaves the side copper unconnected (higher Z0 than stitched); --spacing gives even and odd modes', async () => {
    const base = ['--er', '3.66', '--h', '0.508mm', '--width', '1.1mm', '--json'];
    const st = JSON.parse((await run([...base, '--gap', '0.3mm'])).stdout);
    const fl = JSON.parse((await run([...base, '--gap', '0.3mm', '--floating'])).stdout);
    expect(fl.z0_ohm).toBeGreaterThan(st.z0_ohm);
    const pair = JSON.parse((await run([...base, '--spacing', '0.3mm', '--cover', '3.5,25um'])).stdout);
    expect(pair.even.z0_ohm).toBeGreaterThan(pair.odd.z0_ohm);
    expect(pair.odd).toHaveProperty('l_h_per_m');
  });
  it('bad input: exit 1 with the field named; a missing flag: usage error', async () => {
    const r = await run(['--er', '4.4', '--h', '1.6mm', '--width=-3mm']);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('width');
    const u = await run(['--er', '4.4', '--h', '1.6mm']);
    expect(u.code).toBe(2);
    expect(u.stderr).toContain('--width');
  });
});
