// A stand-in for the parts of the 'electron' module the shell's window code uses, recording every call, so the
// factory and its hardening are tested without the Electron binary (the project's own rule: importing the real module
// tries to download it). Only what the code under test touches is modelled.
type Listener = (...args: unknown[]) => unknown;

export class FakeEmitter {
  readonly listeners = new Map<string, Listener[]>();
  on(name: string, l: Listener) { this.listeners.set(name, [...(this.listeners.get(name) ?? []), l]); return this; }
  once(name: string, l: Listener) { return this.on(name, l); }
  emit(name: string, ...args: unknown[]) { for (const l of this.listeners.get(name) ?? []) l(...args); }
}

export class FakeSession {
  permissionRequest: Listener | null = null;
  permissionCheck: Listener | null = null;
  devicePermission: Listener | null = null;
  beforeRequest: { filter: unknown; listener: Listener } | null = null;
  setPermissionRequestHandler(h: Listener) { this.permissionRequest = h; }
  setPermissionCheckHandler(h: Listener) { this.permissionCheck = h; }
  setDevicePermissionHandler(h: Listener) { this.devicePermission = h; }
  webRequest = { onBeforeRequest: (filter: unknown, listener: Listener) => { this.beforeRequest = { filter, listener }; } };
}

export class FakeWebContents extends FakeEmitter {
  session = new FakeSession();
  windowOpenHandler: Listener | null = null;
  loaded: string[] = [];
  sent: { channel: string; payload: unknown }[] = [];
  setWindowOpenHandler(h: Listener) { this.windowOpenHandler = h; }
  send(channel: string, payload: unknown) { this.sent.push({ channel, payload }); }
  devToolsClosed = 0;
  closeDevTools() { this.devToolsClosed++; }
}

export class FakeBrowserWindow extends FakeEmitter {
  static created: FakeBrowserWindow[] = [];
  webContents = new FakeWebContents();
  maximized = false;
  constructor(readonly options: Record<string, unknown>) {
    super();
    FakeBrowserWindow.created.push(this);
  }
  loadURL(url: string) { this.webContents.loaded.push(url); return Promise.resolve(); }
  maximize() { this.maximized = true; }
  isMaximized() { return this.maximized; }
  show() {}
  getNormalBounds() { return { x: 10, y: 20, width: 1200, height: 800 }; }
}

export const fakeElectron = { BrowserWindow: FakeBrowserWindow };

/** A whole stand-in 'electron' for importing electron/main.ts: records what the main process wires up. */
export function makeFakeMain(o: { lock?: boolean; userData: string; argv?: string[] }) {
  const appEvents = new FakeEmitter();
  let ready!: () => void;
  const whenReady = new Promise<void>((r) => { ready = r; });
  const calls: { name: string; args: unknown[] }[] = [];
  const rec = (name: string) => (...args: unknown[]) => { calls.push({ name, args }); };
  const handles = new Map<string, (...a: unknown[]) => unknown>();
  const protocolHandlers = new Map<string, (r: Request) => Promise<Response>>();
  const messageBoxAnswers: number[] = [];
  class MainWindow extends FakeBrowserWindow {
    static fromWebContents(wc: unknown) { return FakeBrowserWindow.created.find((w) => w.webContents === wc) ?? null; }
    title = '';
    closed = 0;
    setTitle(t: string) { this.title = t; }
    setDocumentEdited() {}
    isMinimized() { return false; }
    restore() {}
    focus() { calls.push({ name: 'focus', args: [] }); }
    isDestroyed() { return false; }
    close() {
      this.closed++;
      let prevented = false;
      this.emit('close', { preventDefault: () => { prevented = true; } });
      return prevented;
    }
  }
  const electron = {
    app: Object.assign(appEvents, {
      requestSingleInstanceLock: () => o.lock ?? true,
      quit: rec('app.quit'),
      whenReady: () => whenReady,
      getPath: (n: string) => (n === 'userData' ? o.userData : `${o.userData}-${n}`),
      setPath: rec('app.setPath'),
      enableSandbox: rec('app.enableSandbox'),
      setAppUserModelId: rec('app.setAppUserModelId'),
      getVersion: () => '0.1.0',
      isPackaged: false,
    }),
    protocol: {
      registerSchemesAsPrivileged: rec('protocol.registerSchemesAsPrivileged'),
      handle: (scheme: string, h: (r: Request) => Promise<Response>) => { protocolHandlers.set(scheme, h); },
    },
    BrowserWindow: MainWindow,
    dialog: {
      showOpenDialog: async () => ({ canceled: true, filePaths: [] }),
      showSaveDialog: async () => ({ canceled: true }),
      showMessageBox: async () => ({ response: 1 }),
      showMessageBoxSync: (...args: unknown[]) => { calls.push({ name: 'dialog.showMessageBoxSync', args }); return messageBoxAnswers.shift() ?? 2; },
      showErrorBox: rec('dialog.showErrorBox'),
    },
    ipcMain: { handle: (c: string, h: (...a: unknown[]) => unknown) => { handles.set(c, h); } },
    Menu: { buildFromTemplate: (t: unknown) => ({ template: t }), setApplicationMenu: rec('Menu.setApplicationMenu') },
    screen: { getAllDisplays: () => [{ workArea: { x: 0, y: 0, width: 1920, height: 1080 } }] },
    shell: { openPath: rec('shell.openPath') },
  };
  return { electron, appEvents, ready, calls, handles, protocolHandlers, messageBoxAnswers };
}
