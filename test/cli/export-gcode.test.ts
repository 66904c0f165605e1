/**
 * `stripwright export --format gcode` run from source as a user would: one .nc file per tool, the options read with
 * their units, bad values named by their flag, the work-area check refusing with nothing written, and the files read
 * back by gcode-toolpath (npm) through scripts/oracles/gcode-retrace.ts.
 */
import { describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { spawnSync } from 'node:child_process';
import { retrace } from '../../scripts/oracles/gcode-retrace.ts';

const ROOT = join(import.meta.dirname, '..', '..');
function cli(args: string[], cwd: string) {
  const tsx = pathToFileURL(join(ROOT, 'node_modules', 'tsx', 'dist', 'loader.mjs')).href;
  const r = spawnSync(process.execPath, ['--import', tsx, join(ROOT, 'cli', 'main.ts'), ...args], { cwd, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
function workdir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'sw-gcode-cli-'));
  copyFileSync(join(ROOT, 'assets', 'examples', 'shorted-stub-match.json'), join(dir, 'stub.json'));
  return dir;
}

describe('stripwright export --format gcode', () => {
  it('writes one file per tool in tool order, each read back whole, with the cautions on stderr', () => {
    const dir = workdir();
    const r = cli(['export', 'stub.json', '--format', 'gcode', '--passes', '3', '--feed', '150mm/min', '--out', 'mill/'], dir);
    expect(r.code).toBe(0);
    expect(readdirSync(join(dir, 'mill')).sort()).toEqual(['stub-T1-isolation.nc', 'stub-T2-drill-0.80mm.nc', 'stub-T3-cutout.nc']);
    expect(r.stdout).toMatch(/G-code, tool 1: 30 deg V-bit/);
    expect(r.stderr).toMatch(/glass-fibre[\s\S]*dust[\s\S]*eye protection[\s\S]*unattended/);
    expect(r.stderr).toMatch(/largest Z0 shift/);
    const iso = readFileSync(join(dir, 'mill', 'stub-T1-isolation.nc'), 'utf8');
    expect(iso).toMatch(/F150\b/);
    const t = retrace(iso);
    expect(t.units).toBe('G21');
    expect(t.ended).toBe(true);
    expect(t.moves.filter((m) => !m.rapid && m.a.z === m.b.z && m.b.z < 0).length).toBeGreaterThan(10);
  });
  it('--units inch writes G20 and the same board at 1/25.4 the numbers', () => {
    const dir = workdir();
    expect(cli(['export', 'stub.json', '--format', 'gcode', '--units', 'inch', '--no-drill', '--no-cutout', '--out', 'in.nc'], dir).code).toBe(0);
    expect(cli(['export', 'stub.json', '--format', 'gcode', '--no-drill', '--no-cutout', '--out', 'mm.nc'], dir).code).toBe(0);
    const a = retrace(readFileSync(join(dir, 'in.nc'), 'utf8')), b = retrace(readFileSync(join(dir, 'mm.nc'), 'utf8'));
    expect(a.units).toBe('G20');
    expect(a.moves.length).toBe(b.moves.length);
    a.moves.forEach((m, i) => expect(Math.abs(m.b.x - b.moves[i]!.b.x)).toBeLessThan(0.002)); // the reader turns inches into mm
  });
  it('names a bad value by its flag and writes nothing', () => {
    const dir = workdir();
    const r = cli(['export', 'stub.json', '--format', 'gcode', '--spindle', '90000', '--out', 'mill/'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--spindle: expected a whole number|--spindle: expected a value from 1000 rpm to 60000 rpm, got 90000 rpm/);
    expect(existsSync(join(dir, 'mill'))).toBe(false);
    expect(cli(['export', 'stub.json', '--format', 'gcode', '--feed', '200', '--out', 'mill/'], dir).stderr).toMatch(/--feed.*add a unit/);
    expect(cli(['export', 'stub.json', '--format', 'gcode', '--work-area', '300mm', '--out', 'mill/'], dir).stderr).toMatch(/--work-area takes two lengths/);
  });
  it('refuses a job that does not fit the stated work area, saying how big it is', () => {
    const dir = workdir();
    const r = cli(['export', 'stub.json', '--format', 'gcode', '--work-area', '20mm,20mm', '--out', 'mill/'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--work-area: .*outside the work area.*the job needs about/);
    expect(existsSync(join(dir, 'mill'))).toBe(false);
  });
  it('--plan prints the mill-readiness check and the widths as milled, writes nothing, and exits 1 when it would refuse', () => {
    const dir = workdir();
    const ok = cli(['export', 'stub.json', '--plan'], dir);
    expect(ok.code).toBe(0);
    expect(ok.stdout).toMatch(/T1 {2}30 deg V-bit/);
    expect(ok.stdout).toMatch(/stub +drawn \d\.\d{3} mm → \d\.\d{3} \/ \d\.\d{3} mm, Z0 \d+\.\d\d → \d+\.\d\d Ω/);
    expect(ok.stdout).toMatch(/Ready to mill/);
    const bad = cli(['export', 'stub.json', '--plan', '--work-area', '20mm,20mm'], dir);
    expect(bad.code).toBe(1);
    expect(bad.stdout).toMatch(/Not ready/);
    expect(readdirSync(dir)).toEqual(['stub.json']);
  });
});
