/**
 * Regenerates the exporter golden files under test/fixtures/export/golden/ (compared in full by
 * test/reference/export-golden.test.ts). Run after an intended change to an exporter, then review the diff:
 *   npx tsx scripts/oracles/make-export-goldens.ts
 * Every golden file is also checked by the outside parsers in that test, so a reviewed golden is a checked one.
 */
import { mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { goldenSources, goldenFiles } from '../../test/fixtures/export/golden-sources.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const DIR = join(ROOT, 'test', 'fixtures', 'export', 'golden');
mkdirSync(DIR, { recursive: true });
for (const f of readdirSync(DIR)) rmSync(join(DIR, f));
let n = 0;
for (const src of await goldenSources()) {
  for (const [name, text] of Object.entries(goldenFiles(src.name, src.geometry))) {
    writeFileSync(join(DIR, name), text);
    n++;
  }
}
console.log(`wrote ${n} golden files to ${DIR}`);
