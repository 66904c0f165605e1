// A stand-in for the parts of the 'electron' module the shell's window code uses, recording every call, so the
// factory and its hardening are tested without the Electron binary (toolchain.md §4: importing the real module
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
