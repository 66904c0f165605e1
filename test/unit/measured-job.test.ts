/**
 * The app's Touchstone and report files (renderer/src/worker/measured-job.ts) against the CLI: run in Node they are
 * the very same bytes as `stripwright sweep DESIGN --out FILE.sNp` and `stripwright report DESIGN --out FILE.pdf`
 * for a design file of the same name (the project's rule: one core function behind every face).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDesign, initPolygons, type DesignDoc } from '../../core/index.ts';
import { touchstoneFile, reportFile, setReportFont } from '../../renderer/src/worker/measured-job.ts';
import pkg from '../../package.json' with { type: 'json' };

const ROOT = join(import.meta.dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'sw-mjob-'));
const cli = (args: string[]) => spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'cli', 'main.ts'), ...args], { cwd: ROOT, encoding: 'utf8' });
let doc: DesignDoc;

beforeAll(async () => {
  await initPolygons();
  const p = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), 'utf8'));
  if (!p.ok) throw new Error('example does not load');
  doc = p.doc;
  copyFileSync(join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), join(dir, 'wilk.json'));
  setReportFont(async () => new Uint8Array(readFileSync(join(ROOT, 'node_modules', 'dejavu-fonts-ttf', 'ttf', 'DejaVuSans.ttf'))));
});

describe('app files are the CLI files', () => {
  it('Touchstone: same bytes as stripwright sweep --out', async () => {
    const r = cli(['sweep', join(dir, 'wilk.json'), '--out', join(dir, 'cli.s3p')]);
    expect(r.status, r.stderr).toBe(0);
    const app = await touchstoneFile(doc, 'wilk.json', `stripwright ${pkg.version}`);
    expect(app.name).toBe('wilk.s3p');
    expect(app.data).toBe(readFileSync(join(dir, 'cli.s3p'), 'utf8'));
  }, 60_000);
  it('report: same bytes as stripwright report --out', async () => {
    const r = cli(['report', join(dir, 'wilk.json'), '--out', join(dir, 'cli.pdf')]);
    expect(r.status, r.stderr).toBe(0);
    const app = await reportFile(doc, 'wilk', `stripwright ${pkg.version}`);
    expect(app.name).toBe('wilk-report.pdf');
    expect(Buffer.from(app.data).equals(readFileSync(join(dir, 'cli.pdf')))).toBe(true);
  }, 60_000);
});
