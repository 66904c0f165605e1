/**
 * What every command does with an input that is not an ordinary text file: a device, a named pipe, a folder, a
 * file far over the limit (sparse, so the test is cheap), invalid UTF-8, a path through a file. Each is refused
 * before reading, in words (never a bare errno code), with exit 1 — and invalid UTF-8 with the very words the app
 * uses (bridge/text-decode.ts). Values that overflow give exit 1 and no `null` in JSON.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, openSync, closeSync, ftruncateSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { decodeTextBytes, DESIGN_TEXT } from '../../bridge/text-decode.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const TSX = pathToFileURL(join(ROOT, 'node_modules', 'tsx', 'dist', 'esm', 'index.mjs')).href;
/** The CLI from source, with a watchdog: a command that reads an endless device would otherwise never return. */
function cli(args: string[], cwd: string) {
  const r = spawnSync(process.execPath, ['--import', TSX, join(ROOT, 'cli', 'main.ts'), ...args], { cwd, encoding: 'utf8', timeout: 30_000, maxBuffer: 1 << 26 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr, killed: r.signal !== null };
}
const BARE_ERRNO = /\bE(NOENT|ISDIR|NOTDIR|ACCES|PERM|EXIST|LOOP|NXIO|AGAIN|INVAL|IO)\b/;

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sw-cli-in-'));
  writeFileSync(join(dir, 'plain.txt'), 'x');
  mkdirSync(join(dir, 'folder.json'));
  // 600 MB that take no disk space: the size alone must refuse it.
  const fd = openSync(join(dir, 'huge.json'), 'w'); ftruncateSync(fd, 600 * 1024 * 1024); closeSync(fd);
  const fd2 = openSync(join(dir, 'huge.s2p'), 'w'); ftruncateSync(fd2, 600 * 1024 * 1024); closeSync(fd2);
  spawnSync('mkfifo', [join(dir, 'pipe.json')]);
  writeFileSync(join(dir, 'latin1.json'), Buffer.from('{"name":"Caf\xe9"}', 'latin1'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('inputs that are not ordinary text files', () => {
  const cases: [string, string[], RegExp][] = [
    ['build on an endless device', ['build', '/dev/zero'], /not a file \(a device, pipe or socket\)/],
    ['sweep on an endless device named like Touchstone', ['sweep', '/dev/zero'], /not a file/],
    ['export on a named pipe without a writer', ['export', 'pipe.json', '--format', 'svg', '--out', 'o.svg'], /not a file/],
    ['build on a sparse 600 MB file', ['build', 'huge.json'], /600\.0 MiB; a design file may be at most 16\.0 MiB/],
    ['sweep on a sparse 600 MB Touchstone file', ['sweep', 'huge.s2p'], /600\.0 MiB; a Touchstone file may be at most 512\.0 MiB/],
    ['build on a folder', ['build', 'folder.json'], /is not a file \(a folder\)/],
    ['sweep on a path through a file', ['sweep', 'plain.txt/x.json'], /a part of the path is a file, not a folder/],
    ['line --batch on a folder', ['line', '--er', '4.4', '--h', '1.6mm', '--batch', 'folder.json'], /is not a file \(a folder\)/],
    ['build on a missing file', ['build', 'nope.json'], /cannot read nope\.json: no such file/],
  ];
  for (const [what, args, re] of cases) {
    it(`${what}: refused before reading, in words, exit 1`, () => {
      const r = cli(args, dir);
      expect(r.killed, 'the watchdog had to stop it').toBe(false);
      expect(r.code).toBe(1);
      expect(r.stderr).toMatch(re);
      expect(r.stderr).not.toMatch(BARE_ERRNO);
      expect(r.stderr).not.toMatch(/internal error/);
    });
  }
  it('export into a folder path that runs through a file: words, not ENOTDIR', () => {
    const r = cli(['export', join(ROOT, 'assets', 'examples', 'open-stub-match.json'), '--format', 'gerber', '--out', 'plain.txt/sub/'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/a part of the path is a file|is a file/);
    expect(r.stderr).not.toMatch(BARE_ERRNO);
  });
});

describe('one text reader for the CLI and the app', () => {
  it('invalid UTF-8 is refused by the CLI with the app’s own words', () => {
    const bytes = readFileSync(join(dir, 'latin1.json'));
    const app = decodeTextBytes(DESIGN_TEXT, 'latin1.json', bytes);
    expect(app.ok).toBe(false);
    const appMessage = app.ok ? '' : app.error.message;
    for (const cmd of [['build', 'latin1.json'], ['sweep', 'latin1.json'], ['export', 'latin1.json', '--format', 'svg', '--out', 'l.svg']]) {
      const r = cli(cmd, dir);
      expect(r.code).toBe(1);
      expect(r.stderr).toContain(appMessage);
    }
    expect(existsSync(join(dir, 'l.svg'))).toBe(false);
  });
});

describe('no null, NaN or Infinity in output; a value that cannot be produced exits non-zero', () => {
  it('sweep --json of a Touchstone file whose dB magnitudes overflow: exit 1 naming the line, nothing printed', () => {
    writeFileSync(join(dir, 'loud.s1p'), '# GHz S DB R 50\n1 -3 0\n2 9000 0\n');
    const r = cli(['sweep', 'loud.s1p', '--json'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/loud\.s1p:3/);
    expect(r.stdout).toBe('');
  });
  it('sweep --json of a design has no null (f0 present), build --json of a design with a part leaves z0 out', () => {
    const s = cli(['sweep', join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), '--points', '5', '--json'], dir);
    expect(s.code).toBe(0);
    expect(s.stdout).not.toMatch(/null|NaN|Infinity/);
    const b = cli(['build', join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), '--json'], dir);
    expect(b.stdout).not.toMatch(/null|NaN|Infinity/);
  });
});

describe('outputs', () => {
  it('--force does not replace a read-only output file: exit 1, words, the file unchanged', () => {
    writeFileSync(join(dir, 'kept.s3p'), 'a measured file the user protected');
    chmodSync(join(dir, 'kept.s3p'), 0o444);
    const r = cli(['sweep', join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), '--points', '3', '--out', 'kept.s3p', '--force'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/read-only, so it was not replaced/);
    expect(readFileSync(join(dir, 'kept.s3p'), 'utf8')).toBe('a measured file the user protected');
  });
});
