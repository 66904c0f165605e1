// @vitest-environment happy-dom
// The browser fallback of the Platform (renderer/src/platform/browser.ts) and the autosave schedule
// (autosave.ts): recovery copies offered only from sessions that stopped (project rule: "a session marker
// distinguishes crashed from another instance still running"), idle 2 s / at most every 30 s (the project's rule),
// opening through <input type=file>, saving through <a download>.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createBrowserPlatform, HEARTBEAT_MS, SESSION_DEAD_MS } from '../../renderer/src/platform/browser.ts';
import { createAutosaver, HOLD_POLL_MS, IDLE_MS, MAX_MS } from '../../renderer/src/platform/autosave.ts';
import { createDesktopPlatform } from '../../renderer/src/platform/desktop.ts';
import { getPlatform, setPlatformForTesting } from '../../renderer/src/platform/index.ts';
import type { Platform } from '../../renderer/src/platform/types.ts';
import { buildBridge } from '../../electron/bridge.ts';

const DESIGN = '{"format":"stripwright-design","version":2,"name":"Invented"}';

beforeEach(() => localStorage.clear());
afterEach(() => { vi.restoreAllMocks(); vi.useRealTimers(); setPlatformForTesting(null); });

describe('browser recovery copies', () => {
  it('does not offer the copies of the current session, nor of another open tab', async () => {
    let t = 1_000_000;
    const a = createBrowserPlatform({ sessionId: 'tab-a', heartbeat: false, now: () => t });
    const b = createBrowserPlatform({ sessionId: 'tab-b', heartbeat: false, now: () => t });
    expect((await a.autosave({ docId: 'd1', name: 'Feed', path: null, text: DESIGN })).ok).toBe(true);
    expect(await a.checkRecovery()).toEqual({ ok: true, value: [] });
    t += HEARTBEAT_MS; // tab a is still beating (its last beat is recent)
    expect(await b.checkRecovery()).toEqual({ ok: true, value: [] });
  });
  it('offers the copies of a session whose heartbeat stopped, with name, time and size', async () => {
    let t = 1_000_000;
    const a = createBrowserPlatform({ sessionId: 'tab-a', heartbeat: false, now: () => t });
    await a.autosave({ docId: 'd1', name: 'Feed', path: 'feed.stripwright', text: DESIGN });
    t += SESSION_DEAD_MS + 1; // the tab crashed
    const b = createBrowserPlatform({ sessionId: 'tab-b', heartbeat: false, now: () => t });
    const list = await b.checkRecovery();
    expect(list).toEqual({ ok: true, value: [{ docId: 'd1', name: 'Feed', originalPath: 'feed.stripwright', savedAt: 1_000_000, bytes: DESIGN.length }] });
    expect(await b.readRecovery('d1')).toMatchObject({ ok: true, value: { text: DESIGN } });
    await b.discardRecovery('d1');
    expect(await b.checkRecovery()).toEqual({ ok: true, value: [] });
    expect(await b.readRecovery('d1')).toMatchObject({ ok: false, error: { code: 'not-found' } });
  });
  it('reports a full storage as an error telling the user to save, never a throw', async () => {
    const full = { ...localStorage, length: 0, key: () => null, getItem: () => null, removeItem: () => {}, clear: () => {},
      setItem: (k: string) => { if (k.startsWith('stripwright.recovery')) throw new DOMException('full', 'QuotaExceededError'); } } as unknown as Storage;
    const p = createBrowserPlatform({ storage: full, heartbeat: false });
    const r = await p.autosave({ docId: 'd1', name: 'Feed', path: null, text: DESIGN });
    expect(r).toMatchObject({ ok: false, error: { code: 'too-large', message: expect.stringMatching(/Save the design/) } });
  });
  it('skips a damaged entry instead of failing the whole list', async () => {
    localStorage.setItem('stripwright.recovery.v1.old.d9', '{not json');
    const p = createBrowserPlatform({ sessionId: 'x', heartbeat: false });
    expect(await p.checkRecovery()).toEqual({ ok: true, value: [] });
  });
});

describe('browser files', () => {
  it('opens the picked file, and answers null when the picker is cancelled', async () => {
    const p = createBrowserPlatform({ heartbeat: false });
    const file = new File([DESIGN], 'row.stripwright', { lastModified: 1234 });
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) {
      expect(this.accept).toBe('.stripwright,.json');
      Object.defineProperty(this, 'files', { value: [file] });
      this.dispatchEvent(new Event('change'));
    });
    expect(await p.openDesign()).toEqual({ ok: true, value: { path: 'row.stripwright', name: 'row.stripwright', text: DESIGN, modifiedMs: 1234 } });
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) { this.dispatchEvent(new Event('cancel')); });
    expect(await p.openDesign()).toEqual({ ok: true, value: null });
  });
  it('picks a Touchstone file for a measured block (name and text), or refuses a binary one saying what was expected', async () => {
    const p = createBrowserPlatform({ heartbeat: false });
    const s2p = '# GHz S RI R 50\n1 0.5 0 0.5 0 0.5 0 0.5 0\n'; // series 100 Ω in 50 Ω (Pozar §4.4)
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) {
      expect(this.accept).toBe('.s1p,.s2p,.ts');
      Object.defineProperty(this, 'files', { value: [new File([s2p], 'r100.s2p')] });
      this.dispatchEvent(new Event('change'));
    });
    expect(await p.openTouchstone()).toEqual({ ok: true, value: { name: 'r100.s2p', text: s2p } });
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) {
      Object.defineProperty(this, 'files', { value: [new File([new Uint8Array([0xff, 0xd8, 0xff, 0x00])], 'photo.s2p')] });
      this.dispatchEvent(new Event('change'));
    });
    expect(await p.openTouchstone()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/expected Touchstone text/) } });
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) { this.dispatchEvent(new Event('cancel')); });
    expect(await p.openTouchstone()).toEqual({ ok: true, value: null });
  });
  it('refuses a binary file with a message saying what was expected', async () => {
    const p = createBrowserPlatform({ heartbeat: false });
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) {
      Object.defineProperty(this, 'files', { value: [new File([new Uint8Array([0xff, 0xd8, 0xff, 0x00, 0x80])], 'photo.json')] });
      this.dispatchEvent(new Event('change'));
    });
    expect(await p.openDesign()).toMatchObject({ ok: false, error: { code: 'not-text', message: expect.stringMatching(/expected/) } });
  });
  it('saves by download under the design extension and drops the session’s recovery copy', async () => {
    const p = createBrowserPlatform({ sessionId: 's', heartbeat: false });
    const names: string[] = [];
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) { names.push(this.download); });
    await p.autosave({ docId: 'd1', name: 'Feed', path: null, text: DESIGN });
    const r = await p.saveDesignAs({ docId: 'd1', suggestedName: 'my feed', text: DESIGN });
    expect(r).toMatchObject({ ok: true, value: { name: 'my feed.stripwright', backupPath: null } });
    expect(names).toEqual(['my feed.stripwright']);
    expect(Object.keys(localStorage).filter((k) => k.startsWith('stripwright.recovery'))).toEqual([]);
    await p.exportFiles({ title: 'Gerber', files: [{ name: 'top.gbr', data: 'x' }, { name: 'drill.drl', data: new Uint8Array([1]) }] });
    expect(names.slice(1)).toEqual(['top.gbr', 'drill.drl']);
    expect(await p.openRecent('/x')).toMatchObject({ ok: false, error: { code: 'not-found' } });
  });
});

describe('getPlatform', () => {
  it('picks the desktop bridge when the preload exposed one, the browser fallback otherwise', () => {
    expect(getPlatform().kind).toBe('browser');
    setPlatformForTesting(null);
    (globalThis as Record<string, unknown>).stripwright = buildBridge({ invoke: async () => ({ ok: true, value: [] }), on: () => () => {} });
    try { expect(getPlatform().kind).toBe('desktop'); } finally { delete (globalThis as Record<string, unknown>).stripwright; }
  });
  it('turns a rejected bridge call into an error result', async () => {
    const p = createDesktopPlatform(buildBridge({ invoke: async () => { throw new Error('main process gone'); }, on: () => () => {} }));
    expect(await p.listRecent()).toEqual({ ok: false, error: { code: 'io', message: expect.stringMatching(/main process gone/) } });
  });
});

describe('autosave schedule', () => {
  function recorder() {
    const writes: number[] = [];
    let flush: (() => void) | null = null;
    const platform = { autosave: async () => { writes.push(Date.now()); return { ok: true, value: { savedAt: Date.now() } }; }, onFlushAutosave: (h: () => void) => { flush = h; return () => { flush = null; }; } } as unknown as Platform;
    return { writes, platform, flush: () => flush?.() };
  }
  it('writes IDLE_MS after the last edit', async () => {
    vi.useFakeTimers({ now: 0 });
    const r = recorder();
    const a = createAutosaver({ platform: r.platform, snapshot: () => ({ docId: 'd', name: 'n', path: null, text: DESIGN }) });
    a.changed();
    await vi.advanceTimersByTimeAsync(IDLE_MS - 1);
    expect(r.writes).toEqual([]);
    await vi.advanceTimersByTimeAsync(1);
    expect(r.writes).toEqual([IDLE_MS]);
    expect(a.lastSavedAt).toBe(IDLE_MS);
  });
  it('writes at least every MAX_MS (8 s) while editing never pauses', async () => {
    vi.useFakeTimers({ now: 0 });
    const r = recorder();
    const a2 = createAutosaver({ platform: r.platform, snapshot: () => ({ docId: 'd', name: 'n', path: null, text: DESIGN }) });
    for (let t = 0; t < 95_000; t += 500) { a2.changed(); await vi.advanceTimersByTimeAsync(500); }
    const gaps = r.writes.slice(1).map((w, i) => w - r.writes[i]!);
    expect(r.writes.length).toBeGreaterThanOrEqual(3);
    expect(Math.max(r.writes[0]!, ...gaps)).toBeLessThanOrEqual(MAX_MS);
  });
  it('a copy that falls due during a drag waits for the drag to end, then is written within HOLD_POLL_MS', async () => {
    vi.useFakeTimers({ now: 0 });
    const r = recorder();
    let dragging = true;
    const snaps: number[] = [];
    const a = createAutosaver({ platform: r.platform, snapshot: () => { snaps.push(Date.now()); return { docId: 'd', name: 'n', path: null, text: DESIGN }; }, holdWhile: () => dragging });
    for (let t = 0; t < 3 * MAX_MS; t += 50) { a.changed(); await vi.advanceTimersByTimeAsync(50); }
    // Nothing serialised mid-drag, however long it lasts.
    expect(snaps).toEqual([]);
    expect(r.writes).toEqual([]);
    dragging = false;
    await vi.advanceTimersByTimeAsync(HOLD_POLL_MS);
    expect(r.writes).toEqual([3 * MAX_MS + HOLD_POLL_MS]);
    // A flush (the shell closing) is never held.
    dragging = true;
    r.flush();
    await vi.advanceTimersByTimeAsync(0);
    expect(r.writes.length).toBe(2);
    a.stop();
  });
  it('writes nothing when the snapshot says nothing is unsaved, and stops after saved()', async () => {
    vi.useFakeTimers({ now: 0 });
    const r = recorder();
    let dirty = false;
    const a = createAutosaver({ platform: r.platform, snapshot: () => (dirty ? { docId: 'd', name: 'n', path: null, text: DESIGN } : null) });
    a.changed(); await vi.advanceTimersByTimeAsync(MAX_MS);
    expect(r.writes).toEqual([]);
    dirty = true; a.changed(); a.saved(); await vi.advanceTimersByTimeAsync(MAX_MS);
    expect(r.writes).toEqual([]);
  });
  it('writes at once when the shell asks for a flush before closing, and reports failures', async () => {
    const errors: string[] = [];
    let fail = true;
    let flush: () => void = () => {};
    const platform = { autosave: async () => (fail ? { ok: false, error: { code: 'io', message: 'disk full' } } : { ok: true, value: { savedAt: 5 } }), onFlushAutosave: (h: () => void) => { flush = h; return () => {}; } } as unknown as Platform;
    const a = createAutosaver({ platform, snapshot: () => ({ docId: 'd', name: 'n', path: null, text: DESIGN }), onError: (e) => errors.push(e.message) });
    flush();
    await vi.waitFor(() => expect(errors).toEqual(['disk full']));
    fail = false;
    await a.flush();
    expect(a.lastSavedAt).toBe(5);
  });
});
