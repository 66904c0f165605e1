/**
 * Tests never rewrite tracked files (issue: every run rewrote the README screenshots, leaving the tree dirty):
 * a static scan of the test sources for writes into the tracked folders. The README screenshots are written only by
 * `npm run screenshots` through test/e2e/readme-shots.ts. (.ci/run also fails when a run leaves the tree changed.)
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');
const TRACKED = ['docs', 'assets', 'core', 'renderer', 'electron', 'cli', 'scripts', 'bench', 'test/fixtures'];

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? (n === 'fixtures' ? [] : files(p)) : /\.(ts|mjs|js)$/.test(n) ? [p] : [];
  });
}

describe('tests leave tracked files alone', () => {
  const sources = files(join(ROOT, 'test'));
  it('finds the test sources', () => expect(sources.length).toBeGreaterThan(20));
  it('no test writes a screenshot or file into a tracked folder by a literal path', () => {
    const offenders: string[] = [];
    const write = /(screenshot\(\{\s*path:|writeFileSync\(|mkdirSync\(|copyFileSync\(|rmSync\()\s*[`'"](\.\/)?([\w/-]+)/g;
    for (const f of sources) {
      const text = readFileSync(f, 'utf8');
      for (const m of text.matchAll(write)) {
        const target = m[3]!;
        if (TRACKED.some((t) => target === t || target.startsWith(`${t}/`))) offenders.push(`${relative(ROOT, f)}: ${m[0]}`);
      }
    }
    expect(offenders).toEqual([]);
  });
  it('the README screenshot helper writes into docs/ only when asked', () => {
    const helper = readFileSync(join(ROOT, 'test', 'e2e', 'readme-shots.ts'), 'utf8');
    expect(helper).toMatch(/STRIPWRIGHT_SCREENSHOTS === '1' \? README_SHOTS : join\('test-results'/);
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
    expect(pkg.scripts.screenshots).toMatch(/scripts\/screenshots\.ts/);
    expect(pkg.scripts.test).not.toMatch(/STRIPWRIGHT_SCREENSHOTS/);
  });
});
