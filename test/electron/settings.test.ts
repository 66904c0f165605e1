// Small stores and helpers of the shell: window placement and recent files (validated JSON in userData; a damaged
// file reads as the default, never stops the start), recovery copies on disk, the menu template, text decoding
// (common practice for bad input: empty, BOM, UTF-16, binary, NUL).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { MENU_COMMANDS, LIMITS } from '../../bridge/contract.ts';
import { DEFAULT_WINDOW, placeOnDisplays, readJson, touchRecent, validateRecent, validateWindowState, writeJson } from '../../electron/files/json-store.ts';
import { RecoveryStore } from '../../electron/files/recovery-store.ts';
import { menuTemplate } from '../../electron/menu.ts';
import { decodeTextBytes, DESIGN_TEXT } from '../../bridge/text-decode.ts';

let dir: string;
beforeEach(() => { dir = mkdtempSync(join(tmpdir(), 'sw-settings-')); });
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('window placement', () => {
  it('round-trips a valid state and reads garbage as the default', async () => {
    const p = join(dir, 'window-state.json');
    await writeJson(p, { x: 100, y: 80, width: 1280, height: 800, maximized: true });
    expect(await readJson(p, validateWindowState, DEFAULT_WINDOW)).toEqual({ x: 100, y: 80, width: 1280, height: 800, maximized: true });
    for (const bad of ['{', '[]', 'null', '{"width":1e9,"height":800}', '{"width":"1280","height":800}', '{"width":100,"height":50}', '\u0000']) {
      writeFileSync(p, bad);
      expect(await readJson(p, validateWindowState, DEFAULT_WINDOW)).toEqual(DEFAULT_WINDOW);
    }
    expect(await readJson(join(dir, 'missing.json'), validateWindowState, DEFAULT_WINDOW)).toEqual(DEFAULT_WINDOW);
  });
  it('drops a position that is off every display (a monitor was unplugged), keeps the size', () => {
    const screens = [{ x: 0, y: 0, width: 1920, height: 1040 }];
    expect(placeOnDisplays({ x: 2500, y: 100, width: 1200, height: 800, maximized: false }, screens)).toEqual({ width: 1200, height: 800, maximized: false });
    expect(placeOnDisplays({ x: 100, y: 100, width: 1200, height: 800, maximized: false }, screens)).toMatchObject({ x: 100, y: 100 });
    expect(placeOnDisplays({ x: -1150, y: 10, width: 1200, height: 800, maximized: false }, screens)).not.toHaveProperty('x'); // 50 px showing is too little to grab
    expect(placeOnDisplays({ x: 1950, y: 10, width: 1200, height: 800, maximized: false }, [...screens, { x: 1920, y: 0, width: 1280, height: 1000 }])).toMatchObject({ x: 1950 });
  });
});

describe('recent files', () => {
  it('keeps valid entries only, without duplicates, at most LIMITS.recentFiles', () => {
    const list = [{ path: '/a', name: 'a', openedAt: 1 }, { path: '/a', name: 'a', openedAt: 2 }, { path: 5 }, null, { path: '/b\u0000', name: 'b', openedAt: 3 },
      ...Array.from({ length: 20 }, (_, i) => ({ path: `/f${i}`, name: `f${i}`, openedAt: i }))];
    const v = validateRecent(list, LIMITS.recentFiles)!;
    expect(v.length).toBe(LIMITS.recentFiles);
    expect(v[0]).toEqual({ path: '/a', name: 'a', openedAt: 1 });
    expect(new Set(v.map((r) => r.path)).size).toBe(v.length);
    expect(validateRecent({}, 10)).toBeNull();
  });
  it('moves a reopened file to the front', () => {
    const l = [{ path: '/a', name: 'a', openedAt: 1 }, { path: '/b', name: 'b', openedAt: 2 }];
    expect(touchRecent(l, { path: '/b', name: 'b', openedAt: 9 }, 10).map((r) => r.path)).toEqual(['/b', '/a']);
    expect(touchRecent(l, { path: '/c', name: 'c', openedAt: 9 }, 2).map((r) => r.path)).toEqual(['/c', '/a']);
  });
});

describe('recovery store', () => {
  it('writes one file per document, lists newest first, and skips damaged files without deleting them', async () => {
    let t = 100;
    const s = new RecoveryStore(join(dir, 'recovery'), 'now', () => t);
    await s.init();
    await s.write({ docId: 'a', name: 'A', originalPath: null, text: '{"a":1}' });
    t = 200;
    await s.write({ docId: 'b', name: 'B', originalPath: '/x/b.stripwright', text: '{"b":2}' });
    t = 300;
    await s.write({ docId: 'a', name: 'A', originalPath: null, text: '{"a":3}' }); // replaces a's copy
    writeFileSync(join(dir, 'recovery', 'c.recovery.json'), '{"format":"stripwright-recovery","version":1,"docId":"c"');
    expect((await s.list()).map((m) => [m.docId, m.savedAt])).toEqual([['a', 300], ['b', 200]]);
    expect((await s.read('a'))!.text).toBe('{"a":3}');
    expect(readdirSync(join(dir, 'recovery')).sort()).toEqual(['a.recovery.json', 'b.recovery.json', 'c.recovery.json']);
    expect(await s.listEarlier()).toEqual([]);
    s.renewSession('later');
    expect((await s.listEarlier()).map((m) => m.docId)).toEqual(['a', 'b']);
  });
  it('refuses a docId that could name another file', async () => {
    const s = new RecoveryStore(join(dir, 'recovery'), 'x');
    await expect(s.write({ docId: '../evil', name: 'n', originalPath: null, text: '' })).rejects.toThrow(/docId must be/);
  });
});

describe('text decoding', () => {
  const enc = (s: string) => new TextEncoder().encode(s);
  it('removes a UTF-8 BOM and keeps the text otherwise', () => {
    expect(decodeTextBytes(DESIGN_TEXT, 'a', new Uint8Array([0xef, 0xbb, 0xbf, ...enc('{"x":"Ω"}')]))).toEqual({ ok: true, value: '{"x":"Ω"}' });
  });
  it.each([
    ['empty', new Uint8Array(), /empty/],
    ['UTF-16 LE', new Uint8Array([0xff, 0xfe, 0x7b, 0x00]), /UTF-16/],
    ['UTF-16 BE', new Uint8Array([0xfe, 0xff, 0x00, 0x7b]), /UTF-16/],
    ['invalid UTF-8', new Uint8Array([0x7b, 0xc3, 0x28, 0x7d]), /not UTF-8/],
    ['NUL byte', enc('{"a":\u00001}'), /NUL byte at character 5/],
  ])('refuses %s with what was expected', (_n, bytes, re) => {
    const r = decodeTextBytes(DESIGN_TEXT, 'f.stripwright', bytes);
    expect(r.ok).toBe(false);
    if (!r.ok) { expect(r.error.code).toBe('not-text'); expect(r.error.message).toMatch(re); expect(r.error.message).toMatch(/f\.stripwright/); }
  });
  it('refuses a file over the size limit before decoding it', () => {
    const r = decodeTextBytes(DESIGN_TEXT, 'big.json', new Uint8Array(LIMITS.designBytes + 1));
    expect(r).toMatchObject({ ok: false, error: { code: 'too-large' } });
  });
});

describe('menu', () => {
  it('sends every app command of MENU_COMMANDS from some item, and only those', () => {
    const sent: string[] = [];
    const t = menuTemplate({ command: (id) => sent.push(id), openRecent: vi.fn(), clearRecent: vi.fn(), showRecoveryFolder: vi.fn(), showCautions: vi.fn(), showAbout: vi.fn() }, [], 'linux');
    const walk = (items: unknown[]): void => { for (const i of items as { click?: () => void; submenu?: unknown[] }[]) { i.click?.(); if (Array.isArray(i.submenu)) walk(i.submenu); } };
    walk(t);
    expect([...sent].sort()).toEqual([...MENU_COMMANDS].sort());
  });
  it('lists recent designs and shows the safety cautions natively', () => {
    const opened: string[] = [];
    const cautions = vi.fn();
    const t = menuTemplate({ command: vi.fn(), openRecent: (p) => opened.push(p), clearRecent: vi.fn(), showRecoveryFolder: vi.fn(), showCautions: cautions, showAbout: vi.fn() }, [{ path: '/d/a.stripwright', name: 'a.stripwright', openedAt: 1 }], 'linux');
    const file = t.find((m) => m.label === '&File')!.submenu as { label?: string; submenu?: { label?: string; click?: () => void }[] }[];
    file.find((i) => i.label === 'Open &Recent')!.submenu![0]!.click!();
    expect(opened).toEqual(['/d/a.stripwright']);
    const help = t.find((m) => m.label === '&Help')!.submenu as { label?: string; click?: () => void }[];
    help.find((i) => i.label === 'Safety &Cautions')!.click!();
    expect(cautions).toHaveBeenCalled();
  });
  it('never takes keys from the page: display-only on Linux/Windows, no bare keys on macOS (where menus own their keys)', () => {
    const acts = { command: vi.fn(), openRecent: vi.fn(), clearRecent: vi.fn(), showRecoveryFolder: vi.fn(), showCautions: vi.fn(), showAbout: vi.fn() };
    const items = (platform: string) => {
      const out: { label?: string; accelerator?: string; registerAccelerator?: boolean; role?: string }[] = [];
      const walk = (xs: unknown[]): void => { for (const x of xs as { submenu?: unknown[] }[]) { out.push(x as never); if (Array.isArray(x.submenu)) walk(x.submenu); } };
      walk(menuTemplate(acts, [], platform));
      return out;
    };
    for (const i of items('linux')) if (i.accelerator) expect(i.registerAccelerator, i.label).toBe(false);
    const mac = items('darwin');
    for (const i of mac) if (i.accelerator) expect(i.accelerator, i.label).toMatch(/CmdOrCtrl\+/);
    expect(mac.find((i) => i.label === '&Fit Board')!.accelerator).toBeUndefined();
  });
  it('keeps the cautions on RF exposure, glass-fibre dust and etchants, deferring to local rules', async () => {
    const { CAUTIONS_TEXT } = await import('../../electron/cautions.ts');
    for (const re of [/RF exposure/, /FR-4/, /respirator/, /Etchants/, /hazardous waste/, /local codes/]) expect(CAUTIONS_TEXT).toMatch(re);
  });
});

describe('window title', () => {
  it('adds the app name once and a dot while unsaved', async () => {
    const { windowTitle } = await import('../../bridge/contract.ts');
    expect(windowTitle('Feed', false)).toBe('Feed — Stripwright');
    expect(windowTitle('Feed — Stripwright', true)).toBe('• Feed — Stripwright');
    expect(windowTitle('', false)).toBe('Untitled — Stripwright');
  });
});
