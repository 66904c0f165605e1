/**
 * `stripwright export` end to end, run from source as a user would run it. The files it writes are checked with
 * the outside oracles (our Gerber/Excellon rule checker, gerber-parser/plotter, ezdxf), and the file handling against
 * the project's own rule: nothing overwritten without --force, no temp files left behind.
 */
import { describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { spawnSync } from 'node:child_process';
import { lintExcellon, lintGerber } from '../../scripts/oracles/gerber-lint.ts';
import { readBack } from '../../scripts/oracles/gerber-read.ts';
import { ezdxfAudit } from '../../scripts/oracles/dxf-audit.ts';

const ROOT = join(import.meta.dirname, '..', '..');
/** Runs the CLI from source through tsx (as test/cli/cli-basics.test.ts does). */
function cli(args: string[], opts: { cwd?: string } = {}) {
  // tsx by absolute URL: the work folders live outside the repository, where `--import tsx` would not resolve.
  const tsx = pathToFileURL(join(ROOT, 'node_modules', 'tsx', 'dist', 'loader.mjs')).href;
  const r = spawnSync(process.execPath, ['--import', tsx, join(ROOT, 'cli', 'main.ts'), ...args], { cwd: opts.cwd ?? ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
/** An example design with vias (plated holes), copied so the test never touches the original. */
function workdir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'sw-export-cli-'));
  copyFileSync(join(ROOT, 'assets', 'examples', 'shorted-stub-match.json'), join(dir, 'stub.json'));
  return dir;
}

describe('stripwright export: command line errors (exit 2)', () => {
  it('wants a FILE, --format and --out, and names the unknown format', () => {
    expect(cli(['export', '--format', 'dxf', '--out', 'x']).stderr).toMatch(/give the design FILE/);
    const r = cli(['export', 'a.json', '--out', 'x']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/give --format/);
    expect(cli(['export', 'a.json', '--format', 'dxf']).stderr).toMatch(/give --out/);
    const f = cli(['export', 'a.json', '--format', 'dxf,step', '--out', 'x']);
    expect(f.code).toBe(2);
    expect(f.stderr).toMatch(/unknown format 'step': expected dxf, svg, gerber, drill, mask/);
    expect(cli(['export', 'a.json', '--format', 'dxf', '--out', 'x', '--origin', 'centre']).stderr).toMatch(/--origin must be board or design/);
    expect(cli(['export', 'a.json', '--format', 'dxf', '--out', 'x', '--frobnicate']).code).toBe(2);
  });
});

describe('stripwright export: bad input (exit 1, nothing written)', () => {
  it('a missing file, a broken design and a bias without a unit', () => {
    const dir = workdir();
    const missing = cli(['export', 'nope.json', '--format', 'dxf', '--out', 'o.dxf'], { cwd: dir });
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/cannot read nope.json: no such file/);
    writeFileSync(join(dir, 'broken.json'), '{ "format": "stripwright-design", ');
    const broken = cli(['export', 'broken.json', '--format', 'dxf', '--out', 'o.dxf'], { cwd: dir });
    expect(broken.code).toBe(1);
    expect(broken.stderr).toMatch(/broken.json is not a valid design/);
    const bias = cli(['export', 'stub.json', '--format', 'dxf', '--bias', '35', '--out', 'o.dxf'], { cwd: dir });
    expect(bias.code).toBe(1);
    expect(bias.stderr).toMatch(/--bias: expected/);
    expect(existsSync(join(dir, 'o.dxf'))).toBe(false);
  });
});

describe('stripwright export: writing files', () => {
  it('writes every format into a folder, lists them, and each passes its oracle', async () => {
    const dir = workdir();
    const r = cli(['export', 'stub.json', '--format', 'dxf,svg,gerber,drill,mask,mask-pdf', '--tool', '0.2mm', '--out', 'fab'], { cwd: dir });
    expect(r.stderr).not.toMatch(/internal error/);
    expect(r.code).toBe(0);
    const files = readdirSync(join(dir, 'fab')).sort();
    expect(files).toEqual(['stub-copper-bottom.gbr', 'stub-copper-top.gbr', 'stub-mask.pdf', 'stub-mask.svg', 'stub-plated.drl', 'stub-profile.gbr', 'stub.dxf', 'stub.svg']);
    for (const f of files) expect(r.stdout).toContain(join(dir, 'fab', f));
    const read = (f: string) => readFileSync(join(dir, 'fab', f), 'utf8');
    expect(lintGerber(read('stub-copper-top.gbr')).problems).toEqual([]);
    expect(lintGerber(read('stub-profile.gbr')).problems).toEqual([]);
    expect(lintGerber(read('stub-copper-bottom.gbr')).problems).toEqual([]);
    expect(lintExcellon(read('stub-plated.drl')).problems).toEqual([]);
    expect((await readBack(read('stub-copper-top.gbr'))).warnings).toEqual([]);
    const dxf = ezdxfAudit(read('stub.dxf'), 'stub.dxf');
    expect([dxf.code, dxf.report.audit_errors, dxf.report.audit_fixes]).toEqual([0, [], []]);
    expect(dxf.report.layers).toContain('ISOLATION_PATH');
    const info = spawnSync('pdfinfo', [join(dir, 'fab', 'stub-mask.pdf')], { encoding: 'utf8' }); // poppler-utils
    expect([info.status, info.stderr]).toEqual([0, '']);
    expect(info.stdout).toMatch(/\(A4\)/);
    expect(read('stub-copper-top.gbr')).toMatch(/%TF.GenerationSoftware,Stripwright,Stripwright,\d+\.\d+\.\d+\*%/);
  });

  it('writes one format to a file path, refuses to overwrite without --force, and replaces with it', () => {
    const dir = workdir();
    const two = cli(['export', 'stub.json', '--format', 'gerber', '--out', 'one.gbr'], { cwd: dir });
    expect(two.code).toBe(1);
    expect(two.stderr).toMatch(/one.gbr looks like a file name, but 3 files are to be written .*give a folder, e.g. --out one\//);
    expect(existsSync(join(dir, 'one.gbr'))).toBe(false);
    const first = cli(['export', 'stub.json', '--format', 'svg', '--out', 'board.svg'], { cwd: dir });
    expect(first.code).toBe(0);
    writeFileSync(join(dir, 'board.svg'), 'my own edits');
    const again = cli(['export', 'stub.json', '--format', 'svg', '--out', 'board.svg'], { cwd: dir });
    expect(again.code).toBe(1);
    expect(again.stderr).toMatch(/not overwriting .*board.svg; nothing was written \(add --force/);
    expect(readFileSync(join(dir, 'board.svg'), 'utf8')).toBe('my own edits');
    const forced = cli(['export', 'stub.json', '--format', 'svg', '--out', 'board.svg', '--force'], { cwd: dir });
    expect(forced.code).toBe(0);
    expect(readFileSync(join(dir, 'board.svg'), 'utf8')).toMatch(/^<\?xml/);
    expect(readdirSync(dir).sort()).toEqual(['board.svg', 'stub.json']); // no temporary file or backup left behind
  });

  it('--origin design and --mirror change the Gerber coordinates as documented', async () => {
    const dir = workdir();
    expect(cli(['export', 'stub.json', '--format', 'gerber', '--out', 'a/'], { cwd: dir }).code).toBe(0);
    expect(cli(['export', 'stub.json', '--format', 'gerber', '--origin', 'design', '--mirror', '--out', 'b/'], { cwd: dir }).code).toBe(0);
    const a = await readBack(readFileSync(join(dir, 'a', 'stub-profile.gbr'), 'utf8'));
    const b = await readBack(readFileSync(join(dir, 'b', 'stub-profile.gbr'), 'utf8'));
    // Board origin: the profile starts at (0,0) less half the 0.1 mm line. Mirrored about the design's y axis:
    // the same width, with x running negative.
    expect(a.box![0]).toBeCloseTo(-0.05, 9);
    expect(a.box![1]).toBeCloseTo(-0.05, 9);
    expect(b.box![2] - b.box![0]).toBeCloseTo(a.box![2] - a.box![0], 6);
    expect(b.box![2]).toBeLessThanOrEqual(0.05 + 1e-9);
  });
});

describe('stripwright export: layer choice', () => {
  it('names the bad layer against --layers, and writes only the layers asked for', () => {
    const dir = workdir();
    const bad = cli(['export', 'stub.json', '--format', 'dxf', '--layers', 'copper,silk', '--out', 'x.dxf'], { cwd: dir });
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/--layers: expected layer names among copper, ground, outline/);
    const ok = cli(['export', 'stub.json', '--format', 'dxf', '--layers', 'copper,outline', '--out', 'x.dxf'], { cwd: dir });
    expect(ok.code).toBe(0);
    const { report } = ezdxfAudit(readFileSync(join(dir, 'x.dxf'), 'utf8'), 'x.dxf');
    expect([...new Set(report.entities.map((e) => e.layer))].sort()).toEqual(['BOARD_EDGE', 'COPPER']);
    const r12 = cli(['export', 'stub.json', '--format', 'dxf', '--dxf-version', 'r12', '--out', 'r12.dxf'], { cwd: dir });
    expect(r12.code).toBe(0);
    const a = ezdxfAudit(readFileSync(join(dir, 'r12.dxf'), 'utf8'), 'r12.dxf');
    expect([a.code, a.report.version, a.report.audit_fixes]).toEqual([0, 'AC1009', []]);
    expect(cli(['export', 'stub.json', '--format', 'dxf', '--dxf-version', '14', '--out', 'x14.dxf'], { cwd: dir }).stderr).toMatch(/--dxf-version must be 2007 or r12/);
  });
});

describe('stripwright export: etch bias', () => {
  it('--bias 0.1mm widens every copper edge in the Gerber by 0.1 mm and is stated on the mask', async () => {
    const dir = workdir();
    expect(cli(['export', 'stub.json', '--format', 'gerber', '--out', 'plain/'], { cwd: dir }).code).toBe(0);
    const r = cli(['export', 'stub.json', '--format', 'gerber,mask', '--bias', '0.1mm', '--out', 'biased/'], { cwd: dir });
    expect(r.code).toBe(0);
    const box = async (d: string) => (await readBack(readFileSync(join(dir, d, 'stub-copper-top.gbr'), 'utf8'))).box!;
    const [a, b] = [await box('plain'), await box('biased')];
    // The copper extent grows by the bias on every side (the frame is the unchanged board outline); the polygon
    // engine works on a 10 nm grid, hence 4 decimals of mm.
    expect(b[0]).toBeCloseTo(a[0] - 0.1, 4);
    expect(b[1]).toBeCloseTo(a[1] - 0.1, 4);
    expect(b[2]).toBeCloseTo(a[2] + 0.1, 4);
    expect(b[3]).toBeCloseTo(a[3] + 0.1, 4);
    expect(readFileSync(join(dir, 'biased', 'stub-mask.svg'), 'utf8')).toContain('etch bias +0.100 mm per edge');
  });
});
