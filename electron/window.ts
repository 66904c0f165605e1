/**
 * The one window factory and the hardening of its session and contents (project hardening rules; checklist items refer
 * to https://www.electronjs.org/docs/latest/tutorial/security). Unit-tested against a stand-in 'electron' module.
 */
import { BrowserWindow, type Session, type WebContents, type WebPreferences } from 'electron';
import { APP_ENTRY, isAllowedNavigation, isAllowedRequest, permissionDecision } from './policy.ts';
import type { WindowState } from './files/json-store.ts';

/**
 * Every security-relevant preference spelled out, even where it is Electron's default, so a change is visible.
 * `development` (a run from source) is the only case with developer tools (policy.ts devToolsAllowed).
 */
export function secureWebPreferences(preloadPath: string, development = false): WebPreferences {
  return {
    preload: preloadPath,
    contextIsolation: true,            // item 3
    sandbox: true,                     // item 4
    nodeIntegration: false,            // item 2
    nodeIntegrationInWorker: false,    // item 2 (workers)
    nodeIntegrationInSubFrames: false, // item 2 (frames)
    webSecurity: true,                 // item 6
    allowRunningInsecureContent: false,// item 8
    experimentalFeatures: false,       // item 9
    enableBlinkFeatures: '',           // item 10
    webviewTag: false,                 // items 11–12: no <webview> at all
    navigateOnDragDrop: false,         // a file dropped on the window must not replace our page
    spellcheck: false,
    devTools: development,
  };
}

/** Item 5: deny every permission request and check; also refuse device (USB/HID/serial) access. */
export function hardenSession(s: Session, development = false): void {
  s.setPermissionRequestHandler((_wc, permission, callback) => callback(permissionDecision(permission)));
  s.setPermissionCheckHandler((_wc, permission) => permissionDecision(permission));
  s.setDevicePermissionHandler(() => false);
  // Items 1 and 18: nothing but our own origin loads; remote and file:// requests are cancelled.
  s.webRequest.onBeforeRequest({ urls: ['<all_urls>'] }, (details, callback) => callback({ cancel: !isAllowedRequest(details.url, { devTools: development }) }));
}

/** Items 13, 14, 11: no navigation away, no new windows, no webviews; outside development, no developer tools. */
export function hardenContents(wc: WebContents, development = false): void {
  if (!development) wc.on('devtools-opened', () => wc.closeDevTools());
  wc.on('will-navigate', (event, url) => { if (!isAllowedNavigation(url)) event.preventDefault(); });
  wc.on('will-redirect', (event, url) => { if (!isAllowedNavigation(url)) event.preventDefault(); });
  wc.on('will-frame-navigate', (event) => { if (!isAllowedNavigation(event.url)) event.preventDefault(); });
  wc.setWindowOpenHandler(() => ({ action: 'deny' }));
  wc.on('will-attach-webview', (event) => event.preventDefault());
}

export interface MainWindowOptions {
  preloadPath: string; iconPath?: string; state: WindowState;
  /** A run from source (`!app.isPackaged`): developer tools allowed. Packaged: none. */
  development?: boolean;
}

export function createMainWindow(o: MainWindowOptions): BrowserWindow {
  const win = new BrowserWindow({
    width: o.state.width,
    height: o.state.height,
    ...(o.state.x !== undefined && o.state.y !== undefined ? { x: o.state.x, y: o.state.y } : {}),
    minWidth: 800,
    minHeight: 520,
    show: false,
    title: 'Stripwright',
    backgroundColor: '#10202a',
    ...(o.iconPath ? { icon: o.iconPath } : {}),
    webPreferences: secureWebPreferences(o.preloadPath, o.development ?? false),
  });
  hardenSession(win.webContents.session, o.development ?? false);
  hardenContents(win.webContents, o.development ?? false);
  if (o.state.maximized) win.maximize();
  win.once('ready-to-show', () => win.show());
  void win.loadURL(APP_ENTRY);
  return win;
}

/** The placement to remember (the normal bounds even when maximized, so un-maximizing next time restores them). */
export function windowStateOf(win: BrowserWindow): WindowState {
  const b = win.getNormalBounds();
  return { x: b.x, y: b.y, width: b.width, height: b.height, maximized: win.isMaximized() };
}
