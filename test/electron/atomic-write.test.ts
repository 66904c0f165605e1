// Atomic save, backup and stray-temp clean-up (electron/files). The pattern checked is the one described in
// the ext4 application notes and Pillai et al. (OSDI 2014): temp in the same folder, fsync, rename,
// fsync the folder; faults are injected at each step as the project rule asks ("original intact = all, orphan
// temp files after clean-up = 0").
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import * as fs from 'node:fs/promises';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { atomicWriteFile, AtomicWriteError, backupPathOf, type FsOps } from '../../electron/files/atomic-write.ts';
import { cleanStrayTemps, parseTempName, tempNameFor } from '../../electron/files/temp-files.ts';

let dir: string;
beforeEach(() => { dir = mkdtempSync(join(tmpdir(), 'sw-atomic-')); });
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const strays = () => readdirSync(dir).filter((n) => parseTempName(n));

describe('atomicWriteFile', () => {
  it('creates a new file with the exact bytes and no backup', async () => {
    const p = join(dir, 'a.stripwright');
    const r = await atomicWriteFile(p, 'héllo Ω', { backup: true });
    expect(readFileSync(p, 'utf8')).toBe('héllo Ω');
    expect(r.backupPath).toBeNull();
    expect(existsSync(backupPathOf(p))).toBe(false);
    expect(strays()).toEqual([]);
  });

  it('keeps the previous version as <file>.bak and replaces it at each save (one-deep backup)', async () => {
    const p = join(dir, 'b.stripwright');
    await atomicWriteFile(p, 'v1', { backup: true });
    const r2 = await atomicWriteFile(p, 'v2', { backup: true });
    expect(r2.backupPath).toBe(`${p}.bak`);
    expect(readFileSync(p, 'utf8')).toBe('v2');
    expect(readFileSync(`${p}.bak`, 'utf8')).toBe('v1');
    await atomicWriteFile(p, 'v3', { backup: true });
    expect(readFileSync(p, 'utf8')).toBe('v3');
    expect(readFileSync(`${p}.bak`, 'utf8')).toBe('v2');
    expect(strays()).toEqual([]);
  });

  it('saves through a symlink to its target and keeps the link (common practice: Emacs resolves links before saving)', async () => {
    const real = join(dir, 'real.stripwright');
    const link = join(dir, 'link.stripwright');
    writeFileSync(real, 'v1');
    await fs.symlink(real, link);
    const r = await atomicWriteFile(link, 'v2', { backup: true });
    expect(r.path).toBe(await fs.realpath(real));
    expect((await fs.lstat(link)).isSymbolicLink()).toBe(true);
    expect(readFileSync(real, 'utf8')).toBe('v2');
    expect(readFileSync(`${real}.bak`, 'utf8')).toBe('v1');
  });

  it('writes binary data and large payloads completely', async () => {
    const p = join(dir, 'mask.png');
    const data = new Uint8Array(3 * 1024 * 1024).map((_, i) => (i * 31) & 0xff);
    await atomicWriteFile(p, data);
    expect(Buffer.compare(readFileSync(p), Buffer.from(data))).toBe(0);
  });

  it('refuses to replace a folder, leaving it alone', async () => {
    await fs.mkdir(join(dir, 'x.stripwright'));
    await expect(atomicWriteFile(join(dir, 'x.stripwright'), 'v')).rejects.toBeInstanceOf(AtomicWriteError);
    expect(strays()).toEqual([]);
  });

  // Fault injection: each step fails in turn with the errno a user meets there; the original must be intact and no
  // temporary file may remain.
  const faults: { step: string; errno: string; ops: (real: FsOps) => Partial<FsOps> }[] = [
    { step: 'open temp', errno: 'EACCES', ops: () => ({ open: (async () => { throw Object.assign(new Error('denied'), { code: 'EACCES' }); }) as FsOps['open'] }) },
    { step: 'write (disk full)', errno: 'ENOSPC', ops: (real) => ({ open: (async (...a: Parameters<FsOps['open']>) => { const fd = await real.open(...a); return Object.assign(Object.create(Object.getPrototypeOf(fd)), fd, { write: async () => { throw Object.assign(new Error('full'), { code: 'ENOSPC' }); }, close: () => fd.close(), sync: () => fd.sync() }); }) as FsOps['open'] }) },
    { step: 'fsync', errno: 'EIO', ops: (real) => ({ open: (async (...a: Parameters<FsOps['open']>) => { const fd = await real.open(...a); return Object.assign(Object.create(Object.getPrototypeOf(fd)), fd, { write: (...w: Parameters<typeof fd.write>) => fd.write(...w), sync: async () => { throw Object.assign(new Error('io'), { code: 'EIO' }); }, close: () => fd.close() }); }) as FsOps['open'] }) },
    { step: 'backup link and copy', errno: 'EACCES', ops: () => ({ link: (async () => { throw Object.assign(new Error('x'), { code: 'EACCES' }); }) as FsOps['link'] }) },
    { step: 'rename (locked)', errno: 'EBUSY', ops: () => ({ rename: (async () => { throw Object.assign(new Error('busy'), { code: 'EBUSY' }); }) as FsOps['rename'] }) },
  ];
  for (const f of faults) {
    it(`leaves the original intact and no temp file when ${f.step} fails (${f.errno})`, async () => {
      const p = join(dir, 'c.stripwright');
      writeFileSync(p, 'original');
      const real: FsOps = { open: fs.open, rename: fs.rename, link: fs.link, copyFile: fs.copyFile, unlink: fs.unlink, stat: fs.stat };
      const err = await atomicWriteFile(p, 'new contents', { backup: true, fs: { ...real, ...f.ops(real) }, renameRetries: 0 }).catch((e) => e);
      expect(err).toBeInstanceOf(AtomicWriteError);
      expect((err as AtomicWriteError).errno).toBe(f.errno);
      expect((err as Error).message).toMatch(/was not changed/);
      expect(readFileSync(p, 'utf8')).toBe('original');
      expect(strays()).toEqual([]);
    });
  }

  it('falls back to a copy for the backup where hard links are not supported (FAT, some network drives)', async () => {
    const p = join(dir, 'd.stripwright');
    writeFileSync(p, 'old');
    const real: FsOps = { open: fs.open, rename: fs.rename, link: fs.link, copyFile: fs.copyFile, unlink: fs.unlink, stat: fs.stat };
    await atomicWriteFile(p, 'new', { backup: true, fs: { ...real, link: (async () => { throw Object.assign(new Error('no'), { code: 'EPERM' }); }) as FsOps['link'] } });
    expect(readFileSync(p, 'utf8')).toBe('new');
    expect(readFileSync(`${p}.bak`, 'utf8')).toBe('old');
  });

  // graceful-fs's rename retry on Windows (isaacs/node-graceful-fs PR #97): a file held
  // for a moment by an antivirus or indexer fails with EBUSY/EPERM; a bounded retry gets through.
  it('retries a briefly locked rename on Windows, and gives up after the bound with the original intact', async () => {
    const p = join(dir, 'w.stripwright');
    writeFileSync(p, 'old');
    const real: FsOps = { open: fs.open, rename: fs.rename, link: fs.link, copyFile: fs.copyFile, unlink: fs.unlink, stat: fs.stat };
    let failures = 2;
    const flaky = (async (a: string, b: string) => { if (b === p && failures-- > 0) throw Object.assign(new Error('busy'), { code: 'EBUSY' }); return real.rename(a, b); }) as FsOps['rename'];
    await atomicWriteFile(p, 'new', { fs: { ...real, rename: flaky }, platform: 'win32' });
    expect(readFileSync(p, 'utf8')).toBe('new');
    const locked = (async (a: string, b: string) => { if (b === p) throw Object.assign(new Error('busy'), { code: 'EBUSY' }); return real.rename(a, b); }) as FsOps['rename'];
    const err = await atomicWriteFile(p, 'newer', { fs: { ...real, rename: locked }, platform: 'win32', renameRetries: 3 }).catch((e: unknown) => e);
    expect((err as AtomicWriteError).message).toMatch(/locked by another program/);
    expect(readFileSync(p, 'utf8')).toBe('new');
    expect(strays()).toEqual([]);
    // Elsewhere EBUSY is not transient: no retry.
    failures = 1;
    await expect(atomicWriteFile(p, 'x', { fs: { ...real, rename: flaky }, platform: 'linux' })).rejects.toBeInstanceOf(AtomicWriteError);
  });

  it('explains a full disk in words a user can act on', async () => {
    const p = join(dir, 'e.stripwright');
    const real: FsOps = { open: fs.open, rename: fs.rename, link: fs.link, copyFile: fs.copyFile, unlink: fs.unlink, stat: fs.stat };
    const err = (await atomicWriteFile(p, "x", { fs: { ...real, ...faults[1]!.ops(real) } }).catch((e: unknown) => e)) as Error;
    expect(err.message).toMatch(/disk is full/);
  });
});

describe('stray temp clean-up', () => {
  it('names temporaries with the pid and parses them back', () => {
    const n = tempNameFor('feed.stripwright', 4242);
    expect(parseTempName(n)).toEqual({ target: 'feed.stripwright', pid: 4242 });
    expect(parseTempName('feed.stripwright')).toBeNull();
    expect(parseTempName('feed.stripwright.bak')).toBeNull();
  });

  it('removes temporaries of dead processes, keeps live ones and every other file', async () => {
    const dead = tempNameFor('a.stripwright', 999_999_1);
    const live = tempNameFor('b.stripwright', process.pid);
    for (const n of [dead, live, 'a.stripwright', 'a.stripwright.bak', '.hidden']) writeFileSync(join(dir, n), 'x');
    const removed = await cleanStrayTemps(dir, { isAlive: (pid) => pid === process.pid });
    expect(removed).toEqual([dead]);
    expect(readdirSync(dir).sort()).toEqual([live, '.hidden', 'a.stripwright', 'a.stripwright.bak'].sort());
  });

  it('removes a live process’s temporary once it is older than the stale limit', async () => {
    const live = tempNameFor('b.stripwright', process.pid);
    writeFileSync(join(dir, live), 'x');
    expect(await cleanStrayTemps(dir, { staleAfterMs: 1000, now: () => Date.now() + 5000 })).toEqual([live]);
  });

  it('treats a missing folder as nothing to clean', async () => {
    expect(await cleanStrayTemps(join(dir, 'nope'))).toEqual([]);
  });
});
