// The window factory and its hardening, key by key against the Electron security checklist
// (https://www.electronjs.org/docs/latest/tutorial/security, items as numbered there),
// with a stand-in 'electron' module (never the real one: the project's own rule).
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { FakeBrowserWindow } from './fake-electron.ts';

vi.mock('electron', async () => (await import('./fake-electron.ts')).fakeElectron);

const { createMainWindow, hardenContents, secureWebPreferences, windowStateOf } = await import('../../electron/window.ts');
const { APP_ENTRY } = await import('../../electron/policy.ts');

beforeEach(() => { FakeBrowserWindow.created.length = 0; });

function make(state = { width: 1300, height: 820, maximized: false } as { x?: number; y?: number; width: number; height: number; maximized: boolean }) {
  createMainWindow({ preloadPath: '/app/dist-electron/preload.cjs', state });
  return FakeBrowserWindow.created[0]!;
}

describe('webPreferences of the one window', () => {
  const expected: [string, unknown, string][] = [
    ['contextIsolation', true, 'item 3'], ['sandbox', true, 'item 4'], ['nodeIntegration', false, 'item 2'],
    ['nodeIntegrationInWorker', false, 'item 2'], ['nodeIntegrationInSubFrames', false, 'item 2'], ['webSecurity', true, 'item 6'],
    ['allowRunningInsecureContent', false, 'item 8'], ['experimentalFeatures', false, 'item 9'], ['enableBlinkFeatures', '', 'item 10'],
    ['webviewTag', false, 'items 11–12'], ['navigateOnDragDrop', false, 'dropping a file must not replace the page'],
  ];
  for (const [key, value, why] of expected) {
    it(`${key} = ${JSON.stringify(value)} (${why})`, () => {
      const prefs = make().options.webPreferences as Record<string, unknown>;
      expect(prefs[key]).toBe(value);
    });
  }
  it('uses the bundled CommonJS preload and nothing else', () => {
    const prefs = make().options.webPreferences as Record<string, unknown>;
    expect(prefs.preload).toBe('/app/dist-electron/preload.cjs');
    expect(Object.keys(prefs).sort()).toEqual(Object.keys(secureWebPreferences('x')).sort());
  });
  it('loads our app:// entry, never file:// (item 18)', () => {
    expect(make().webContents.loaded).toEqual([APP_ENTRY]);
    expect(APP_ENTRY).toBe('app://stripwright/index.html');
  });
  it('restores the remembered size, place and maximized state', () => {
    const w = make({ x: 40, y: 50, width: 1000, height: 700, maximized: true });
    expect(w.options).toMatchObject({ x: 40, y: 50, width: 1000, height: 700 });
    expect(w.maximized).toBe(true);
    expect(windowStateOf(w as never)).toEqual({ x: 10, y: 20, width: 1200, height: 800, maximized: true });
  });
});

describe('session hardening (items 5, 1, 18)', () => {
  it('denies every permission request and check', () => {
    const s = make().webContents.session;
    for (const p of ['media', 'geolocation', 'notifications', 'clipboard-read', 'openExternal', 'serial']) {
      const cb = vi.fn();
      s.permissionRequest!(null, p, cb);
      expect(cb).toHaveBeenCalledWith(false);
      expect(s.permissionCheck!(null, p)).toBe(false);
    }
    expect(s.devicePermission!({})).toBe(false);
  });
  it('cancels every request that is not our own origin', () => {
    const s = make().webContents.session;
    expect(s.beforeRequest!.filter).toEqual({ urls: ['<all_urls>'] });
    const decide = (url: string) => { let r: unknown; s.beforeRequest!.listener({ url }, (x: unknown) => { r = x; }); return r; };
    expect(decide('https://example.com/x.js')).toEqual({ cancel: true });
    expect(decide('file:///etc/passwd')).toEqual({ cancel: true });
    expect(decide('app://stripwright/assets/a.js')).toEqual({ cancel: false });
  });
});

describe('contents hardening (items 13, 14, 11)', () => {
  it('prevents navigation and redirects away from the bundle, allows a reload of it', () => {
    const wc = make().webContents;
    for (const ev of ['will-navigate', 'will-redirect']) {
      const away = { preventDefault: vi.fn() };
      wc.emit(ev, away, 'https://attacker.example/');
      expect(away.preventDefault).toHaveBeenCalled();
      const home = { preventDefault: vi.fn() };
      wc.emit(ev, home, 'app://stripwright/index.html');
      expect(home.preventDefault).not.toHaveBeenCalled();
    }
    const frame = { url: 'file:///etc/passwd', preventDefault: vi.fn() };
    wc.emit('will-frame-navigate', frame);
    expect(frame.preventDefault).toHaveBeenCalled();
  });
  it('denies every new window', () => {
    const wc = make().webContents;
    for (const url of ['https://example.com', 'app://stripwright/index.html', 'about:blank']) expect(wc.windowOpenHandler!({ url })).toEqual({ action: 'deny' });
  });
  it('prevents any webview from attaching', () => {
    const wc = make().webContents;
    const ev = { preventDefault: vi.fn() };
    wc.emit('will-attach-webview', ev, {}, {});
    expect(ev.preventDefault).toHaveBeenCalled();
  });
  it('hardens contents created elsewhere the same way', async () => {
    const { FakeWebContents } = await import('./fake-electron.ts');
    const wc = new FakeWebContents();
    hardenContents(wc as never);
    expect(wc.windowOpenHandler!({ url: 'https://x' })).toEqual({ action: 'deny' });
    expect(wc.listeners.get('will-navigate')?.length).toBe(1);
  });
});
