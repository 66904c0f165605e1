// Saving never replaces what it should not and never leaves a stale recovery copy (the project's own rule: "nothing the
// user made is lost"): a read-only file is refused with a way out (Save As), a change on disk that kept the file's
// time is still seen (content hash), and a save racing an autosave leaves no copy of saved work.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { atomicWriteFile, AtomicWriteError } from '../../electron/files/atomic-write.ts';
import { RecoveryStore } from '../../electron/files/recovery-store.ts';
import { Shell, type Dialogs } from '../../electron/shell.ts';

let dir: string;
let saveAsPath: string | null = null;
const dialogs: Dialogs = {
  openDesign: async () => null, openTouchstone: async () => null, saveDesign: async () => saveAsPath,
  saveExport: async () => null, chooseFolder: async () => null, confirmReplace: async () => false,
};
function shellFor(session: string, recovery = new RecoveryStore(join(dir, 'userData', 'recovery'), session)) {
  return { shell: new Shell({ userData: join(dir, 'userData'), documentsFolder: join(dir, 'docs'), recovery, dialogs, version: '0.1.0', platform: 'linux' }), recovery };
}
beforeEach(() => { dir = mkdtempSync(join(tmpdir(), 'sw-save-')); mkdirSync(join(dir, 'docs')); saveAsPath = null; });
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function opened(p: string, text: string) {
  writeFileSync(p, text);
  const { shell, recovery } = shellFor('s1');
  await shell.start();
  shell.grant(p);
  const o = await shell.openPath(p);
  if (!o.ok) throw new Error(o.error.message);
  return { shell, recovery, modifiedMs: o.value.modifiedMs };
}

describe('a read-only file is not replaced', () => {
  it('the atomic writer refuses a file marked read-only, leaves it and its mode as they were, and names Save As', async () => {
    const p = join(dir, 'docs', 'locked.stripwright');
    writeFileSync(p, 'keep me');
    chmodSync(p, 0o444);
    const before = statSync(p);
    let e: unknown;
    try { await atomicWriteFile(p, 'replaced', { backup: true }); } catch (x) { e = x; }
    expect(e).toBeInstanceOf(AtomicWriteError);
    expect((e as Error).message).toMatch(/read-only/);
    expect((e as Error).message).toMatch(/Save As/);
    expect(readFileSync(p, 'utf8')).toBe('keep me');
    expect(statSync(p).mode).toBe(before.mode);
    expect(statSync(p).ino).toBe(before.ino); // the very same file, not a copy renamed over it
  });
  it('the shell answers an io error the page shows with its Save As offer; Save As elsewhere works', async () => {
    const p = join(dir, 'docs', 'locked.stripwright');
    const { shell, modifiedMs } = await opened(p, 'theirs');
    chmodSync(p, 0o444);
    const r = await shell.save({ docId: 'd1', path: p, text: 'mine', expectedModifiedMs: modifiedMs });
    expect(r).toMatchObject({ ok: false, error: { code: 'io', message: expect.stringMatching(/read-only.*Save As/) } });
    expect(readFileSync(p, 'utf8')).toBe('theirs');
    saveAsPath = join(dir, 'docs', 'mine.stripwright');
    const as = await shell.saveAs({ docId: 'd1', suggestedName: 'mine', text: 'mine' });
    expect(as.ok).toBe(true);
    expect(readFileSync(saveAsPath, 'utf8')).toBe('mine');
  });
});

describe('changed on disk: by time and by content', () => {
  it('an edit by another program that kept the modification time is still refused', async () => {
    const p = join(dir, 'docs', 'feed.stripwright');
    const { shell, modifiedMs } = await opened(p, 'version A');
    const t = statSync(p).mtime;
    writeFileSync(p, 'version B');
    utimesSync(p, t, t); // the other program restored the time
    expect(Math.abs(statSync(p).mtimeMs - modifiedMs)).toBeLessThanOrEqual(1);
    const r = await shell.save({ docId: 'd1', path: p, text: 'mine', expectedModifiedMs: modifiedMs });
    expect(r).toMatchObject({ ok: false, error: { code: 'changed-on-disk', message: expect.stringMatching(/content differs/) } });
    expect(readFileSync(p, 'utf8')).toBe('version B');
  });
  it('saving twice in a row (our own write) is not taken for a change', async () => {
    const p = join(dir, 'docs', 'feed.stripwright');
    const { shell, modifiedMs } = await opened(p, 'version A');
    const one = await shell.save({ docId: 'd1', path: p, text: 'one', expectedModifiedMs: modifiedMs });
    if (!one.ok) throw new Error(one.error.message);
    const two = await shell.save({ docId: 'd1', path: p, text: 'two', expectedModifiedMs: one.value.modifiedMs });
    expect(two.ok).toBe(true);
    expect(readFileSync(p, 'utf8')).toBe('two');
  });
});

describe('a save racing an autosave leaves no recovery copy of saved work', () => {
  it('50 rounds of save and autosave of the same text sent together, in both orders: no copy left', async () => {
    const p = join(dir, 'docs', 'race.stripwright');
    const { shell, recovery, modifiedMs } = await opened(p, 'start');
    let expected = modifiedMs;
    let left = 0;
    for (let round = 0; round < 50; round++) {
      const text = `revision ${round} ` + 'x'.repeat(2000 + 37 * round);
      const snap = { docId: 'race', name: 'race', path: p, text };
      // The page's autosave timer fires around a save of that same state: just before it, or while the save is
      // still on its way (the page only learns the save succeeded when its answer arrives).
      const delayMs = round % 10;
      const later = (f: () => Promise<unknown>) => new Promise((r) => setTimeout(r, delayMs)).then(f);
      const save = () => shell.save({ docId: 'race', path: p, text, expectedModifiedMs: expected });
      const calls = round % 2 === 0 ? [shell.autosave(snap), later(save)] : [save(), later(() => shell.autosave(snap))];
      const results = (await Promise.all(calls)) as Awaited<ReturnType<typeof save>>[];
      const saved = results.find((r) => r.ok && 'path' in (r.value as object));
      if (!saved || !saved.ok) throw new Error('save failed');
      expected = (saved.value as { modifiedMs: number }).modifiedMs;
      if ((await recovery.list()).length > 0) { left++; await recovery.discard('race'); }
    }
    expect(left).toBe(0);
  });
  it('an autosave of newer, unsaved work after a save is kept', async () => {
    const p = join(dir, 'docs', 'race.stripwright');
    const { shell, recovery, modifiedMs } = await opened(p, 'start');
    await shell.save({ docId: 'race', path: p, text: 'saved', expectedModifiedMs: modifiedMs });
    await shell.autosave({ docId: 'race', name: 'race', path: p, text: 'saved, then edited' });
    expect((await recovery.read('race'))?.text).toBe('saved, then edited');
  });
});
