// Developer tools only in development (a run from source), never in a packaged app: the window's preference, the
// menu item, the devtools: requests and a devtools window opened anyway (issue: all three were on in packages).
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { FakeBrowserWindow } from './fake-electron.ts';

vi.mock('electron', async () => (await import('./fake-electron.ts')).fakeElectron);

const { createMainWindow } = await import('../../electron/window.ts');
const { devToolsAllowed, isAllowedRequest } = await import('../../electron/policy.ts');
const { menuTemplate } = await import('../../electron/menu.ts');

beforeEach(() => { FakeBrowserWindow.created.length = 0; });
const state = { width: 1300, height: 820, maximized: false };
const DEVTOOLS_URL = 'devtools://devtools/bundled/inspector.html';

function window(development: boolean | undefined) {
  createMainWindow({ preloadPath: '/p.cjs', state, ...(development === undefined ? {} : { development }) });
  return FakeBrowserWindow.created.at(-1)!;
}
function menuRoles(development: boolean | undefined): string[] {
  const acts = { command: vi.fn(), openRecent: vi.fn(), clearRecent: vi.fn(), showRecoveryFolder: vi.fn(), showCautions: vi.fn(), showAbout: vi.fn() };
  const roles: string[] = [];
  const walk = (xs: unknown[]): void => { for (const x of xs as { role?: string; submenu?: unknown[] }[]) { if (x.role) roles.push(x.role); if (Array.isArray(x.submenu)) walk(x.submenu); } };
  walk(menuTemplate(acts, [], 'linux', development === undefined ? {} : { development }));
  return roles;
}
function devtoolsRequestCancelled(w: FakeBrowserWindow): boolean {
  let r: { cancel: boolean } | undefined;
  w.webContents.session.beforeRequest!.listener({ url: DEVTOOLS_URL }, (x: { cancel: boolean }) => { r = x; });
  return r!.cancel;
}

describe('developer tools', () => {
  it('the decision: allowed only when the app is not packaged', () => {
    expect(devToolsAllowed(true)).toBe(false);
    expect(devToolsAllowed(false)).toBe(true);
  });
  for (const [what, dev] of [['packaged', false], ['by default', undefined]] as const) {
    it(`${what}: no devTools preference, no menu item, devtools: requests cancelled, an opened devtools window closed`, () => {
      const w = window(dev);
      expect((w.options.webPreferences as Record<string, unknown>).devTools).toBe(false);
      expect(menuRoles(dev)).not.toContain('toggleDevTools');
      expect(devtoolsRequestCancelled(w)).toBe(true);
      expect(isAllowedRequest(DEVTOOLS_URL)).toBe(false);
      w.webContents.emit('devtools-opened');
      expect(w.webContents.devToolsClosed).toBe(1);
    });
  }
  it('development (run from source): all of them available', () => {
    const w = window(true);
    expect((w.options.webPreferences as Record<string, unknown>).devTools).toBe(true);
    expect(menuRoles(true)).toContain('toggleDevTools');
    expect(devtoolsRequestCancelled(w)).toBe(false);
    w.webContents.emit('devtools-opened');
    expect(w.webContents.devToolsClosed).toBe(0);
  });
});
