/**
 * The README's test command does all the set-up on a fresh machine (issue: only .ci/run installed the Debian
 * packages). `npm test` runs scripts/system-packages.sh first (npm's pretest), .ci/run calls that same `npm test`
 * and has no package list of its own, and the script names every package the README names.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');
const read = (p: string) => readFileSync(join(ROOT, p), 'utf8');
const PACKAGES = ['chromium', 'python3-scikit-rf', 'python3-ezdxf', 'libxml2-utils', 'poppler-utils'];

describe('one set-up for npm test and CI', () => {
  const pkg = JSON.parse(read('package.json'));
  it('npm test installs missing system packages before anything else (pretest)', () => {
    expect(pkg.scripts.pretest).toBe('bash scripts/system-packages.sh');
  });
  it('.ci/run calls npm test and installs nothing itself', () => {
    const ci = read('.ci/run');
    expect(ci).toMatch(/^npm test \|\| rc=\$\?$/m);
    expect(ci).not.toMatch(/apt-get/);
  });
  it('the script and the README name the same packages', () => {
    const script = read('scripts/system-packages.sh');
    const readme = read('README.md');
    for (const p of PACKAGES) {
      expect(script).toMatch(new RegExp(`need\\+=\\(${p}\\)`));
      expect(readme).toContain(`\`${p}\``);
    }
  });
  it('says what it found (dry run here)', () => {
    const r = spawnSync('bash', [join(ROOT, 'scripts', 'system-packages.sh')], { encoding: 'utf8', env: { ...process.env, SYSTEM_PACKAGES_DRY_RUN: '1' } });
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^system packages: (all present|installing )/);
  });
});
