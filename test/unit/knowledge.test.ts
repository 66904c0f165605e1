/**
 * Self-contained knowledge (the project's own rule): every top folder and every core folder says in a README what it
 * owns; every model file named on a docs/models page exists and its leading doc comment cites a published source
 * (an author–year citation) or says the rule is common practice or the project's own; every file named for a
 * published method (a year in its name) cites that year; and nothing cites notes outside the repository.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join, relative } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');
const SKIP = new Set(['node_modules', 'dist', 'dist-cli', 'dist-electron', 'reports', 'test-results', 'playwright-report', 'release', 'coverage']);

function dirs(dir: string): string[] {
  return readdirSync(dir).filter((n) => !n.startsWith('.') && !SKIP.has(n) && statSync(join(dir, n)).isDirectory());
}

function files(dir: string, out: string[] = []): string[] {
  for (const n of readdirSync(dir)) {
    const p = join(dir, n);
    if (statSync(p).isDirectory()) files(p, out); else if (n.endsWith('.ts')) out.push(p);
  }
  return out;
}

/** The leading doc comment of a source file (up to its first closing). */
function header(path: string): string {
  const text = readFileSync(path, 'utf8');
  const end = text.indexOf('*/');
  return end < 0 ? '' : text.slice(0, end);
}

const CITES = /\b(1[89]\d\d|20[0-2]\d)\b|common practice|(project's|our) own/;

describe('self-contained knowledge', () => {
  it('every top folder has a README saying what it owns', () => {
    const missing = dirs(ROOT).filter((d) => !existsSync(join(ROOT, d, 'README.md')));
    expect(missing).toEqual([]);
  });

  it('every core folder (at any depth) has a README', () => {
    const walk = (d: string): string[] => [d, ...dirs(d).flatMap((x) => walk(join(d, x)))];
    const missing = walk(join(ROOT, 'core')).filter((d) => !existsSync(join(d, 'README.md'))).map((d) => relative(ROOT, d));
    expect(missing).toEqual([]);
  });

  const coreFiles = files(join(ROOT, 'core'));
  const pages = readdirSync(join(ROOT, 'docs', 'models')).filter((n) => n.endsWith('.md'));

  it('there is a docs/models page for every model family folder', () => {
    const index = readFileSync(join(ROOT, 'docs', 'models', 'README.md'), 'utf8');
    for (const folder of ['line', 'discontinuity', 'network', 'section', 'yield', 'toolpath']) expect(index).toContain(`core/${folder}`);
    for (const m of index.matchAll(/\]\(([\w-]+\.md)\)/g)) expect(pages).toContain(m[1]);
  });

  it('every model file named on a docs/models page exists and cites its source', () => {
    let named = 0;
    for (const page of pages) {
      const text = readFileSync(join(ROOT, 'docs', 'models', page), 'utf8');
      for (const m of text.matchAll(/(?<![\w./-])(?:core\/[\w/-]+\/)?[\w-]+\.ts\b/g)) {
        const name = m[0];
        const found = name.includes('/') ? coreFiles.filter((f) => relative(ROOT, f) === name) : coreFiles.filter((f) => basename(f) === name);
        expect(found.length, `${page}: ${name}`).toBeGreaterThan(0);
        for (const f of found) expect(header(f), `${relative(ROOT, f)} (named on ${page})`).toMatch(CITES);
        named++;
      }
    }
    expect(named).toBeGreaterThan(25);
  });

  it('every file named for a published method cites that year in its doc comment', () => {
    const byYear = coreFiles.filter((f) => /(19|20)\d\d/.test(basename(f)));
    expect(byYear.length).toBeGreaterThan(10);
    for (const f of byYear) {
      const year = basename(f).match(/(19|20)\d\d/)![0];
      expect(header(f), relative(ROOT, f)).toContain(year);
    }
  });

  it('no source, test or doc cites notes outside the repository', () => {
    const places = ['core', 'renderer', 'cli', 'electron', 'bridge', 'test', 'docs'].flatMap((d) => {
      const out: string[] = [];
      const walk = (p: string) => { for (const n of readdirSync(p)) { const q = join(p, n); if (statSync(q).isDirectory()) { if (!SKIP.has(n)) walk(q); } else if (/\.(ts|svelte|md|py)$/.test(n)) out.push(q); } };
      walk(join(ROOT, d));
      return out;
    });
    const self = relative(ROOT, import.meta.filename);
    const bad = [...places, join(ROOT, 'README.md'), join(ROOT, 'DEVELOPERS.md')]
      .filter((f) => relative(ROOT, f) !== self)
      .filter((f) => /methods\.md|practice\.md|reference notes|shared methods|\.\.\/shared\/|shared\/checks/.test(readFileSync(f, 'utf8')))
      .map((f) => relative(ROOT, f));
    expect(bad).toEqual([]);
  });
});
