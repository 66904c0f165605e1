/**
 * `npm run bench`: every benchmark of the project, printing figures (never a pass/fail timing test).
 * Each bench file under bench/ exports `run(): Promise<void>` and prints its own table.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';

const only = process.argv[2];
const dir = import.meta.dirname;
const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only))).sort();
for (const f of files) {
  console.log(`\n## ${f}`);
  const mod = (await import(join(dir, f))) as { run: () => Promise<void> };
  await mod.run();
}
if (files.length === 0) console.log('no benchmarks matched');
