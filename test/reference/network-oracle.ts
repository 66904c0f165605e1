/** Runs a scikit-rf oracle script of scripts/reference/ with Debian's own python3. */
import { execSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');
const PY_PATH = execSync('getconf PATH', { encoding: 'utf8' }).trim();

export function python(script: string, input: string, args: string[] = []): string {
  const r = spawnSync('python3', [join(ROOT, 'scripts', 'reference', script), ...args], { input, encoding: 'utf8', env: { PATH: PY_PATH, HOME: process.env.HOME ?? '/tmp' }, maxBuffer: 1 << 28 });
  if (r.status !== 0) throw new Error(`python ${script} failed (${r.status}): ${r.stderr}`);
  return r.stdout;
}
