import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import pkg from '../../package.json' with { type: 'json' };

const ROOT = join(import.meta.dirname, '..', '..');
/** Runs the CLI from source through tsx, as a user would run the installed one. */
export function cli(args: string[], opts: { cwd?: string; input?: string } = {}) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'cli', 'main.ts'), ...args], { cwd: opts.cwd ?? ROOT, encoding: 'utf8', input: opts.input });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('stripwright CLI basics', () => {
  it('prints its version', () => {
    const r = cli(['--version']);
    expect(r.code).toBe(0);
    expect(r.stdout.trim()).toBe(pkg.version);
  });
  it('prints usage with --help', () => {
    const r = cli(['--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Usage: stripwright <command>/);
  });
  it('refuses an unknown command with a one-line reason, the usage and exit 2', () => {
    const r = cli(['frobnicate']);
    expect(r.code).toBe(2);
    expect(r.stderr.split('\n')[0]).toBe("stripwright: unknown command 'frobnicate'.");
    expect(r.stderr).toMatch(/Usage: stripwright/);
  });
  it('refuses an unknown top-level flag with exit 2', () => {
    const r = cli(['--frobnicate']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/unknown option '--frobnicate'/);
  });
  it('the installed bin prints the version (bundle built by prepare)', () => {
    const r = spawnSync(process.execPath, [join(ROOT, 'bin', 'stripwright.mjs'), '--version'], { encoding: 'utf8' });
    expect(r.stdout.trim()).toBe(pkg.version);
  });
});
