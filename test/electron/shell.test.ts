// The document services behind the bridge (electron/shell.ts) over a real temporary folder and scripted dialogs:
// path grants, atomic save with one-deep .bak (the LibreOffice "always create backup copy" scheme; common practice),
// changed-on-disk refusal (common practice: re-check the file's identity at save time), recovery copies
// offered only from earlier sessions (common practice), exports.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RecoveryStore } from '../../electron/files/recovery-store.ts';
import { tempNameFor } from '../../electron/files/temp-files.ts';
import { Shell, type Dialogs } from '../../electron/shell.ts';
import { LIMITS } from '../../bridge/contract.ts';

let dir: string;
let answers: { open?: string | null; data?: string | null; save?: string | null; folder?: string | null; replace?: boolean; exportPath?: string | null };
const dialogs: Dialogs = {
  openDesign: async () => answers.open ?? null,
  openTouchstone: async () => answers.data ?? null,
  saveDesign: async () => answers.save ?? null,
  saveExport: async () => answers.exportPath ?? null,
  chooseFolder: async () => answers.folder ?? null,
  confirmReplace: async () => answers.replace ?? false,
};
function shellFor(session: string) {
  const recovery = new RecoveryStore(join(dir, 'userData', 'recovery'), session);
  return new Shell({ userData: join(dir, 'userData'), documentsFolder: join(dir, 'docs'), recovery, dialogs, version: '0.1.0', platform: 'linux' });
}
beforeEach(() => { dir = mkdtempSync(join(tmpdir(), 'sw-shell-')); mkdirSync(join(dir, 'docs')); answers = {}; });
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const DESIGN = JSON.stringify({ format: 'stripwright-design', version: 2, name: 'Invented test network' });

describe('measured data (Touchstone) for a block', () => {
  // Series 100 Ω between 50 Ω ports (S11 = S21 = 0.5; Pozar, Microwave Engineering, 4th ed., §4.4), written here.
  const S2P = '# GHz S RI R 50\n1 0.5 0 0.5 0 0.5 0 0.5 0\n';
  it('answers the chosen file’s name and text (no path), and null when the dialog is cancelled', async () => {
    const p = join(dir, 'docs', 'r100.s2p');
    writeFileSync(p, S2P);
    const s = shellFor('t1'); await s.start();
    answers.data = p;
    expect(await s.openTouchstone()).toEqual({ ok: true, value: { name: 'r100.s2p', text: S2P } });
    answers.data = null;
    expect(await s.openTouchstone()).toEqual({ ok: true, value: null });
  });
  it('refuses binary, empty and oversized files with what was expected, and does not grant the path', async () => {
    const s = shellFor('t2'); await s.start();
    const bin = join(dir, 'docs', 'photo.s2p'); writeFileSync(bin, Buffer.from([0xff, 0xd8, 0xff, 0x00, 0x80]));
    answers.data = bin;
    expect(await s.openTouchstone()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/expected Touchstone text/) } });
    const empty = join(dir, 'docs', 'empty.s2p'); writeFileSync(empty, '');
    answers.data = empty;
    expect(await s.openTouchstone()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/empty/) } });
    const big = join(dir, 'docs', 'big.s2p'); writeFileSync(big, 'x'.repeat(LIMITS.touchstoneBytes + 1));
    answers.data = big;
    expect(await s.openTouchstone()).toMatchObject({ ok: false, error: { code: 'too-large', message: expect.stringMatching(/a Touchstone file may be at most/) } });
    expect((await s.openPath(bin)).ok).toBe(false); // reading measured data grants nothing
  });
});

describe('open and grants', () => {
  it('opens the file chosen in the dialog and remembers it as recent', async () => {
    const p = join(dir, 'docs', 'a.stripwright');
    writeFileSync(p, '\uFEFF' + DESIGN);
    const s = shellFor('s1'); await s.start();
    answers.open = p;
    const r = await s.openDialog();
    expect(r).toMatchObject({ ok: true, value: { path: p, name: 'a.stripwright', text: DESIGN } }); // BOM removed
    const recent = await s.listRecent();
    expect(recent.ok && recent.value.map((x) => x.path)).toEqual([p]);
    // The recent list survives a restart and grants the path again.
    const s2 = shellFor('s2'); await s2.start();
    expect((await s2.openPath(p)).ok).toBe(true);
  });
  it('answers null when the dialog is cancelled', async () => {
    const s = shellFor('s1'); await s.start();
    expect(await s.openDialog()).toEqual({ ok: true, value: null });
  });
  it('refuses a path it never handed out', async () => {
    const s = shellFor('s1'); await s.start();
    const r = await s.openPath('/etc/passwd');
    expect(r).toMatchObject({ ok: false, error: { code: 'forbidden' } });
    const w = await s.save({ docId: 'd1', path: join(dir, 'x.stripwright'), text: DESIGN, expectedModifiedMs: null });
    expect(w).toMatchObject({ ok: false, error: { code: 'forbidden' } });
    expect(existsSync(join(dir, 'x.stripwright'))).toBe(false);
  });
  it('refuses binary and UTF-16 files with words saying what was expected', async () => {
    const s = shellFor('s1'); await s.start();
    const bin = join(dir, 'docs', 'b.json');
    writeFileSync(bin, Buffer.from([0x89, 0x50, 0x4e, 0x47, 0xff, 0x00]));
    answers.open = bin;
    expect(await s.openDialog()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/expected/) } });
    writeFileSync(bin, Buffer.from('\uFEFF{}', 'utf16le'));
    expect(await s.openDialog()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/UTF-16/) } });
    writeFileSync(bin, '');
    expect(await s.openDialog()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/empty/) } });
  });
});

describe('save', () => {
  it('saves atomically over the opened file and keeps the previous version as .bak', async () => {
    const p = join(dir, 'docs', 'feed.stripwright');
    writeFileSync(p, 'version one');
    const s = shellFor('s1'); await s.start();
    answers.open = p;
    const o = await s.openDialog();
    if (!o.ok || !o.value) throw new Error('open failed');
    const r = await s.save({ docId: 'doc-1', path: p, text: DESIGN, expectedModifiedMs: o.value.modifiedMs });
    expect(r).toMatchObject({ ok: true, value: { path: p, backupPath: `${p}.bak` } });
    expect(readFileSync(p, 'utf8')).toBe(DESIGN);
    expect(readFileSync(`${p}.bak`, 'utf8')).toBe('version one');
  });
  it('refuses to overwrite a file another program changed since it was opened', async () => {
    const p = join(dir, 'docs', 'feed.stripwright');
    writeFileSync(p, 'mine');
    const s = shellFor('s1'); await s.start();
    answers.open = p;
    const o = await s.openDialog();
    if (!o.ok || !o.value) throw new Error('open failed');
    writeFileSync(p, 'theirs');
    utimesSync(p, new Date(), new Date(Date.now() + 5000));
    const r = await s.save({ docId: 'doc-1', path: p, text: 'mine, edited', expectedModifiedMs: o.value.modifiedMs });
    expect(r).toMatchObject({ ok: false, error: { code: 'changed-on-disk', message: expect.stringMatching(/Save As/) } });
    expect(readFileSync(p, 'utf8')).toBe('theirs');
  });
  it('save-as adds the design extension when the dialog returns a bare name, and drops the recovery copy', async () => {
    const s = shellFor('s1'); await s.start();
    await s.autosave({ docId: 'doc-2', name: 'New', path: null, text: DESIGN });
    answers.save = join(dir, 'docs', 'splitter');
    const r = await s.saveAs({ docId: 'doc-2', suggestedName: 'splitter', text: DESIGN });
    expect(r).toMatchObject({ ok: true, value: { path: join(dir, 'docs', 'splitter.stripwright'), backupPath: null } });
    expect(readFileSync(join(dir, 'docs', 'splitter.stripwright'), 'utf8')).toBe(DESIGN);
    const later = shellFor('s9'); await later.start();
    expect(await later.listRecovery()).toEqual({ ok: true, value: [] });
  });
});

describe('autosave and recovery', () => {
  it('offers copies from an earlier session, not from the current one', async () => {
    const a = shellFor('session-a'); await a.start();
    expect((await a.autosave({ docId: 'doc-1', name: 'Wilkinson try', path: null, text: DESIGN })).ok).toBe(true);
    expect(await a.listRecovery()).toEqual({ ok: true, value: [] }); // our own copy is not "recovered"
    // The app was killed; the next start is a new session.
    const b = shellFor('session-b'); await b.start();
    const list = await b.listRecovery();
    expect(list.ok && list.value).toEqual([expect.objectContaining({ docId: 'doc-1', name: 'Wilkinson try', originalPath: null, bytes: DESIGN.length })]);
    const got = await b.readRecovery('doc-1');
    expect(got).toMatchObject({ ok: true, value: { text: DESIGN } });
    await b.discard('doc-1');
    expect(await b.listRecovery()).toEqual({ ok: true, value: [] });
  });
  it('refuses a recovery copy pointing at a path it never handed out', async () => {
    const a = shellFor('a'); await a.start();
    expect(await a.autosave({ docId: 'doc-1', name: 'x', path: '/etc/cron.d/x', text: DESIGN })).toMatchObject({ ok: false, error: { code: 'forbidden' } });
  });
  it('grants the original path of a restored copy so it can be saved back', async () => {
    const p = join(dir, 'docs', 'row.stripwright');
    writeFileSync(p, DESIGN);
    const a = shellFor('a'); await a.start();
    answers.open = p; await a.openDialog();
    await a.autosave({ docId: 'doc-7', name: 'row', path: p, text: DESIGN + ' ' });
    // New session whose recent list was lost: the copy still lets the user save back to where it came from.
    rmSync(join(dir, 'userData', 'recent.json'));
    const b = shellFor('b'); await b.start();
    expect((await b.save({ docId: 'doc-7', path: p, text: 'x', expectedModifiedMs: null })).ok).toBe(false);
    await b.readRecovery('doc-7');
    expect((await b.save({ docId: 'doc-7', path: p, text: DESIGN, expectedModifiedMs: null })).ok).toBe(true);
  });
  it('removes stray temporaries of dead processes at start, in the recovery folder and beside recent files', async () => {
    const p = join(dir, 'docs', 'row.stripwright');
    writeFileSync(p, DESIGN);
    const a = shellFor('a'); await a.start();
    answers.open = p; await a.openDialog();
    writeFileSync(join(dir, 'docs', tempNameFor('row.stripwright', 999_999_7)), 'half');
    writeFileSync(join(dir, 'userData', 'recovery', tempNameFor('doc.recovery.json', 999_999_8)), 'half');
    const b = shellFor('b');
    expect(await b.start()).toEqual({ strayTempsRemoved: 2 });
    expect(readdirSync(join(dir, 'docs')).sort()).toEqual(['row.stripwright']);
  });
});

describe('export', () => {
  it('writes several files into the chosen folder and asks before replacing', async () => {
    const s = shellFor('a'); await s.start();
    const out = join(dir, 'out'); mkdirSync(out);
    writeFileSync(join(out, 'top.gbr'), 'old');
    answers.folder = out; answers.replace = false;
    const files = [{ name: 'top.gbr', data: 'G04 test*\nM02*\n' }, { name: 'mask.png', data: new Uint8Array([137, 80, 78, 71]) }];
    expect(await s.exportFiles({ title: 'Export', files })).toEqual({ ok: true, value: null });
    expect(readFileSync(join(out, 'top.gbr'), 'utf8')).toBe('old');
    answers.replace = true;
    expect(await s.exportFiles({ title: 'Export', files })).toEqual({ ok: true, value: { folder: out, written: ['top.gbr', 'mask.png'] } });
    expect(readFileSync(join(out, 'top.gbr'), 'utf8')).toBe('G04 test*\nM02*\n');
    expect([...readFileSync(join(out, 'mask.png'))]).toEqual([137, 80, 78, 71]);
  });
  it('writes a single file where the save dialog says', async () => {
    const s = shellFor('a'); await s.start();
    answers.exportPath = join(dir, 'docs', 'line.s2p');
    expect(await s.exportFiles({ title: 'Touchstone', files: [{ name: 'line.s2p', data: '! x\n' }] })).toMatchObject({ ok: true, value: { written: ['line.s2p'] } });
  });
});

describe('argv', () => {
  it('picks design paths out of a command line', () => {
    expect(Shell.designPathsIn(['--inspect', '/x/a.stripwright', 'b.json', '/app/package.json', 'readme.txt', 'dir'])).toEqual(['/x/a.stripwright', 'b.json']);
    // Freedesktop Desktop Entry spec: %U passes URLs; file:// ones become paths (RFC 8089), others are ignored.
    expect(Shell.designPathsIn(['file:///home/me/My%20feed.stripwright', 'https://example.com/x.stripwright', 'smb://host/x.json'])).toEqual(['/home/me/My feed.stripwright']);
  });
});
