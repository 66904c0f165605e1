/**
 * `stripwright line`: flags, JSON keys, table, batch. Numbers are checked against the core they front (the models
 * themselves are checked against outside sources in test/unit and test/reference) and one trade figure.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync, readFileSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../cli/main.ts';
import { analyzeLine, synthesizeLine } from '../../core/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');

/** Runs the CLI in-process (fast); `spawn` below runs it as a user would, for exit codes and streams. */
async function run(args: string[], cwd = ROOT) {
  const out: string[] = []; const err: string[] = [];
  const code = await runCli(['line', ...args], { out: (t) => out.push(t), err: (t) => err.push(t), cwd });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}
function spawn(args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'cli', 'main.ts'), 'line', ...args], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const KEYS = ['width_m', 'z0_ohm', 'z0_static_ohm', 'eps_eff', 'eps_eff_static', 'f_hz', 'lambda_g_m', 'vp_m_per_s', 'delay_s_per_m',
  'alpha_c_db_per_m', 'alpha_d_db_per_m', 'skin_depth_m', 'threshold_hz', 'warnings'];
const FR4 = { er: 4.4, h: 0.79e-3, t: 0, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };

describe('stripwright line', () => {
  it('synthesis --json without --f: exactly the documented keys, static values, 50 Ω on εr 4.4 / 0.79 mm ≈ 1.51 mm (common practice)', async () => {
    const r = await run(['--er', '4.4', '--h', '0.79mm', '--t', '0', '--tand', '0.02', '--z0', '50', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(Object.keys(j).sort()).toEqual(KEYS.filter((k) => k !== 'lambda_g_m' && k !== 'skin_depth_m').sort());
    expect(j.f_hz).toBe(0);
    expect(j.z0_ohm).toBe(j.z0_static_ohm);
    expect(j.eps_eff).toBe(j.eps_eff_static);
    expect(Math.abs(j.z0_ohm - 50) / 50).toBeLessThan(1e-9);
    expect(j.width_m).toBeGreaterThan(1.50e-3);
    expect(j.width_m).toBeLessThan(1.52e-3);
    expect(j.width_m).toBeCloseTo(synthesizeLine(FR4, 50, 0).width, 12);
    expect(j).not.toHaveProperty('lambda_g_m'); // not applicable without a frequency: left out, never null
    expect(j).not.toHaveProperty('skin_depth_m');
  });
  it('analysis at f with --deg adds length_m and deg; values match the core', async () => {
    const r = await run(['--er', '3.66', '--h', '0.508mm', '--t', '35um', '--tand', '0.0037', '--sigma', '58MS/m', '--width', '1.0734mm', '--f', '2.45GHz', '--deg', '90', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(Object.keys(j).sort()).toEqual([...KEYS, 'length_m', 'deg'].sort());
    const a = analyzeLine({ er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 }, 1.0734e-3, 2.45e9);
    expect(j.z0_ohm).toBe(a.z0);
    expect(j.eps_eff).toBe(a.epsEff);
    expect(j.alpha_c_db_per_m).toBe(a.alphaCdBPerM);
    expect(j.threshold_hz).toBe(a.thresholds.errorAt);
    expect(j.deg).toBe(90);
    expect(j.length_m).toBeCloseTo(a.lambdaG / 4, 12);
    // methods §4 worked example: 90° = 18.235 mm for this line at 2.45 GHz.
    expect(j.length_m * 1e3).toBeCloseTo(18.235, 2);
  });
  it('--length gives the electrical length; synthesis at --f targets Z0(f)', async () => {
    const r = await run(['--preset', 'glass-epoxy', '--z0', '50', '--f', '5.8GHz', '--length', '10mm', '--json']);
    const j = JSON.parse(r.stdout);
    expect(Math.abs(j.z0_ohm - 50) / 50).toBeLessThan(1e-9);
    expect(j.z0_static_ohm).not.toBeCloseTo(50, 3);
    expect(j.deg).toBeCloseTo((360 * 0.01) / j.lambda_g_m, 9);
  });
  it('prints a readable table with units, and the preset note', async () => {
    const r = await run(['--preset', 'glass-epoxy', '--z0', '50ohm', '--f', '5.8 GHz', '--deg', '90deg']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/width\s+3\.\d+ mm/);
    expect(r.stdout).toMatch(/Z0\s+50 Ω at f/);
    expect(r.stdout).toMatch(/data sheet wins/);
    expect(r.stdout).toMatch(/90° = \d+\.\d+ mm/);
    expect(r.stdout).toMatch(/models\s+static Hammerstad–Jensen 1980.*Kirschning–Jansen 1982.*Wheeler/);
  });
  it('units on every flag: 62mil = 1.5748 mm, 1oz = 35 µm', async () => {
    const a = JSON.parse((await run(['--er', '4.4', '--h', '62mil', '--t', '1oz', '--width', '3mm', '--json'])).stdout);
    const b = analyzeLine({ er: 4.4, h: 1.5748e-3, t: 35e-6, tanDelta: 0, sigma: 5.8e7, roughness: 0 }, 3e-3, 0);
    expect(a.z0_ohm).toBeCloseTo(b.z0, 9);
  });
  it('--f-measure carries εr to the design frequency (wideband Debye): lower εeff above the measurement frequency', async () => {
    const args = ['--er', '4.4', '--tand', '0.02', '--h', '1.6mm', '--width', '3mm', '--f', '5.8GHz', '--json'];
    const plain = JSON.parse((await run(args)).stdout);
    const deb = JSON.parse((await run([...args, '--f-measure', '1GHz'])).stdout);
    expect(deb.eps_eff).toBeLessThan(plain.eps_eff);
    const at = JSON.parse((await run(['--er', '4.4', '--tand', '0.02', '--h', '1.6mm', '--width', '3mm', '--f', '1GHz', '--f-measure', '1GHz', '--json'])).stdout);
    const at0 = JSON.parse((await run(['--er', '4.4', '--tand', '0.02', '--h', '1.6mm', '--width', '3mm', '--f', '1GHz', '--json'])).stdout);
    expect(at.eps_eff).toBeCloseTo(at0.eps_eff, 10);
  });
  it('bad values exit 1 with the field, what was expected and what was given', async () => {
    const r = await run(['--er', '4.4', '--h', '1.6', '--z0', '50']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/h: expected a length with a unit.*got "1\.6"/);
    const u = await run(['--er', '4.4', '--h', '1.6mm', '--z0', '900']);
    expect(u.code).toBe(1);
    expect(u.stderr).toMatch(/z0: expected an impedance from [\d.]+ Ω to [\d.]+ Ω/);
    const p = await run(['--preset', 'unobtainium', '--z0', '50']);
    expect(p.code).toBe(1);
    expect(p.stderr).toMatch(/preset: expected one of glass-epoxy/);
  });
  it('a bad command line exits 2 with the reason and the usage', async () => {
    for (const args of [['--er', '4.4', '--h', '1.6mm', '--z0', '50', '--frobnicate'], ['--er', '4.4', '--z0', '50'],
      ['--er', '4.4', '--h', '1.6mm'], ['--er', '4.4', '--h', '1.6mm', '--z0', '50', '--deg', '90'], ['stray', '--z0', '50']]) {
      const r = await run(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(/Usage: stripwright line/);
    }
    const s = spawn(['--er', '4.4', '--h', '1.6mm', '--z0', '50', '--frobnicate']);
    expect(s.code).toBe(2);
    expect(s.stderr.split('\n')[0]).toMatch(/stripwright line: .*'--frobnicate'/);
  });
  it('the installed way: exit 0 and JSON on stdout', () => {
    const s = spawn(['--preset', 'ptfe-woven-glass-2.2', '--z0', '50', '--json']);
    expect(s.code).toBe(0);
    expect(JSON.parse(s.stdout).width_m).toBeGreaterThan(0);
  });
});

describe('stripwright line --batch', () => {
  const dir = mkdtempSync(join(tmpdir(), 'sw-line-'));
  const csv = ['z0,f,deg,h', '50,5.8GHz,90,', '70.7,5.8GHz,90,', 'fifty,5.8GHz,90,', '100,,,0.8mm', ''].join('\n');
  writeFileSync(join(dir, 'lines.csv'), csv);

  it('sizes every good row, reports the bad one by line number and exits 1', async () => {
    const r = await run(['--er', '4.4', '--h', '1.6mm', '--tand', '0.02', '--batch', 'lines.csv'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/lines\.csv line 4: z0: expected an impedance/);
    const rows = r.stdout.trim().split('\n');
    expect(rows).toHaveLength(5);
    const head = rows[0]!.split(',');
    expect(head.slice(0, 5)).toEqual(['line', 'z0', 'f', 'deg', 'h']);
    const col = (row: string, name: string) => row.split(',')[head.indexOf(name)];
    expect(Number(col(rows[1]!, 'z0_ohm'))).toBeCloseTo(50, 8);
    expect(Number(col(rows[2]!, 'z0_ohm'))).toBeCloseTo(70.7, 8);
    expect(col(rows[3]!, 'z0_ohm')).toBe('');
    expect(rows[3]).toMatch(/expected an impedance/);
    // Row 5 overrides h and has no f: static sizing on 0.8 mm.
    const w = synthesizeLine({ er: 4.4, h: 0.8e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 }, 100, 0).width;
    expect(Number(col(rows[4]!, 'width_m'))).toBeCloseTo(w, 12);
    expect(Number(col(rows[1]!, 'length_m'))).toBeGreaterThan(0);
  });
  it('writes --out atomically and never over the batch file', async () => {
    const ok = await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'lines.csv', '--out', 'sized.csv'], dir);
    expect(ok.code).toBe(1); // the bad row still fails
    expect(readFileSync(join(dir, 'sized.csv'), 'utf8').split('\n')[0]).toMatch(/^line,z0,f,deg,h,width_m/);
    expect(readdirSync(dir).filter((n) => n.endsWith('.tmp'))).toEqual([]);
    // An existing results file is kept unless --force.
    writeFileSync(join(dir, 'sized.csv'), 'mine\n');
    const keep = await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'lines.csv', '--out', 'sized.csv'], dir);
    expect(keep.code).toBe(1);
    expect(keep.stderr).toMatch(/sized\.csv exists; .*--force/);
    expect(readFileSync(join(dir, 'sized.csv'), 'utf8')).toBe('mine\n');
    await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'lines.csv', '--out', 'sized.csv', '--force'], dir);
    expect(readFileSync(join(dir, 'sized.csv'), 'utf8')).toMatch(/^line,/);
    const same = await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'lines.csv', '--out', 'lines.csv'], dir);
    expect(same.code).toBe(1);
    expect(readFileSync(join(dir, 'lines.csv'), 'utf8')).toBe(csv);
  });
  it('refuses an unknown column and a missing file with a clear message', async () => {
    writeFileSync(join(dir, 'bad.csv'), 'z0,colour\n50,red\n');
    const r = await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'bad.csv'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/unknown column 'colour'/);
    const m = await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'nope.csv'], dir);
    expect(m.code).toBe(1);
    expect(m.stderr).toMatch(/cannot read nope\.csv: no such file/);
    expect(existsSync(join(dir, 'nope.csv'))).toBe(false);
  });
});

describe('stripwright line --batch on arbitrary text (fast-check, seeded)', () => {
  it('never crashes: every file gives exit 0 or 1 and a message for each bad row', async () => {
    const fc = (await import('fast-check')).default;
    const dir = mkdtempSync(join(tmpdir(), 'sw-line-fuzz-'));
    const cell = fc.oneof(fc.constantFrom('50', '70.7ohm', '5.8GHz', '1.6mm', '', 'x', '-3', '1e999', '"q,uoted"', 'NaN', '0', '90deg', 'glass-epoxy'), fc.string({ maxLength: 6 }));
    const header = fc.shuffledSubarray(['z0', 'width', 'f', 'deg', 'length', 'h', 'er', 'preset', 't'], { minLength: 1 });
    await fc.assert(fc.asyncProperty(header, fc.array(fc.array(cell, { maxLength: 10 }), { maxLength: 8 }), fc.boolean(), async (cols, rows, crlf) => {
      const text = [cols.join(','), ...rows.map((r) => r.join(','))].join(crlf ? '\r\n' : '\n');
      writeFileSync(join(dir, 'f.csv'), text);
      const r = await run(['--er', '4.4', '--h', '1.6mm', '--batch', 'f.csv'], dir);
      expect([0, 1]).toContain(r.code);
      if (r.code === 1) expect(r.stderr).toMatch(/stripwright line: f\.csv/);
    }), { seed: 42, numRuns: 150 });
  });
});
