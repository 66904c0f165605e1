/**
 * The Electron main process: one hardened window on app://stripwright/ (the built renderer), the native menu,
 * dialogs, recent files, remembered window placement, a single instance that takes over files opened later, and the
 * never-lose-work rules (atomic saves with a .bak, recovery copies, clean-up of stray temporaries at start).
 * Everything with a decision in it lives in a tested module; this file only wires Electron to them.
 */
import { app, BrowserWindow, dialog, ipcMain, Menu, protocol, screen, shell as electronShell, type IpcMainInvokeEvent } from 'electron';
import { randomUUID } from 'node:crypto';
import { join, resolve } from 'node:path';
import { DESIGN_EXTENSION, OPENABLE_EXTENSIONS, PUSH_CHANNELS, TOUCHSTONE_EXTENSIONS, windowTitle, type MenuCommandId, type OpenedDesign } from '../bridge/contract.ts';
import { DEFAULT_WINDOW, placeOnDisplays, readJson, validateWindowState, writeJson } from './files/json-store.ts';
import { RecoveryStore } from './files/recovery-store.ts';
import { registerBridge } from './ipc.ts';
import { menuTemplate } from './menu.ts';
import { APP_SCHEME, devToolsAllowed } from './policy.ts';
import { createBundleHandler } from './protocol.ts';
import { Shell, type Dialogs } from './shell.ts';
import { createMainWindow, hardenContents, windowStateOf } from './window.ts';
import { CAUTIONS_TEXT, CAUTIONS_TITLE } from './cautions.ts';

// Must run before 'ready': our scheme is standard (relative URLs, origin), secure (like https) and may use fetch.
protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true, stream: true } }]);
app.enableSandbox();
if (process.platform === 'win32') app.setAppUserModelId('org.stripwright.desktop'); // taskbar grouping = the package's appId
// A separate settings/recovery folder on request (portable use, the Electron smoke test); before anything reads it.
if (process.env.STRIPWRIGHT_USER_DATA) app.setPath('userData', resolve(process.env.STRIPWRIGHT_USER_DATA));

const RENDERER_ROOT = join(__dirname, '..', 'dist', 'renderer');
const PRELOAD = join(__dirname, 'preload.cjs');
const ICON = join(__dirname, '..', 'assets', 'icon.png');
const FILTERS = [{ name: 'Stripwright design', extensions: [...OPENABLE_EXTENSIONS] }];

/** Developer tools only when run from source, never in a packaged app. */
const DEVELOPMENT = devToolsAllowed(app.isPackaged);
let win: BrowserWindow | null = null;
let pageReady = false;
const pendingOpens: string[] = [];
let docState = { title: 'Stripwright', dirty: false };
/** Set when the user chose Save in the close prompt: close once the page reports it saved (within a minute). */
let closeAfterSaveUntil = 0;
let closeConfirmed = false;
let autosaveWaiter: (() => void) | null = null;
let crashes: number[] = [];

function parent(): BrowserWindow | undefined { return win && !win.isDestroyed() ? win : undefined; }

const dialogs: Dialogs = {
  async openDesign(defaultFolder) {
    const opts = { title: 'Open design', properties: ['openFile' as const], filters: FILTERS, ...(defaultFolder ? { defaultPath: defaultFolder } : {}) };
    const p = parent();
    const r = p ? await dialog.showOpenDialog(p, opts) : await dialog.showOpenDialog(opts);
    return r.canceled ? null : (r.filePaths[0] ?? null);
  },
  async openTouchstone(defaultFolder) {
    const opts = { title: 'Measured data (Touchstone)', properties: ['openFile' as const], filters: [{ name: 'Touchstone', extensions: [...TOUCHSTONE_EXTENSIONS] }, { name: 'All files', extensions: ['*'] }], ...(defaultFolder ? { defaultPath: defaultFolder } : {}) };
    const p = parent();
    const r = p ? await dialog.showOpenDialog(p, opts) : await dialog.showOpenDialog(opts);
    return r.canceled ? null : (r.filePaths[0] ?? null);
  },
  async saveDesign(defaultPath) {
    const opts = { title: 'Save design', defaultPath, filters: [{ name: 'Stripwright design', extensions: [DESIGN_EXTENSION] }], properties: ['createDirectory' as const, 'showOverwriteConfirmation' as const] };
    const p = parent();
    const r = p ? await dialog.showSaveDialog(p, opts) : await dialog.showSaveDialog(opts);
    return r.canceled ? null : (r.filePath || null);
  },
  async saveExport(title, defaultPath) {
    const opts = { title, defaultPath, properties: ['createDirectory' as const, 'showOverwriteConfirmation' as const] };
    const p = parent();
    const r = p ? await dialog.showSaveDialog(p, opts) : await dialog.showSaveDialog(opts);
    return r.canceled ? null : (r.filePath || null);
  },
  async chooseFolder(title, defaultFolder) {
    const opts = { title, buttonLabel: 'Export here', properties: ['openDirectory' as const, 'createDirectory' as const], ...(defaultFolder ? { defaultPath: defaultFolder } : {}) };
    const p = parent();
    const r = p ? await dialog.showOpenDialog(p, opts) : await dialog.showOpenDialog(opts);
    return r.canceled ? null : (r.filePaths[0] ?? null);
  },
  async confirmReplace(names) {
    const opts = { type: 'question' as const, buttons: ['Replace', 'Cancel'], defaultId: 1, cancelId: 1, message: `Replace ${names.length} existing file(s)?`, detail: names.slice(0, 12).join('\n') + (names.length > 12 ? '\n…' : '') };
    const p = parent();
    const r = p ? await dialog.showMessageBox(p, opts) : await dialog.showMessageBox(opts);
    return r.response === 0;
  },
};

function send(channel: string, payload?: unknown): void {
  const w = parent();
  if (w) w.webContents.send(channel, payload);
}

function runCommand(id: MenuCommandId): void { send(PUSH_CHANNELS.menuCommand, id); }

function messageBox(opts: Electron.MessageBoxOptions): Promise<Electron.MessageBoxReturnValue> {
  const p = parent();
  return p ? dialog.showMessageBox(p, opts) : dialog.showMessageBox(opts);
}

function start(): void {
  const session = randomUUID();
  const userData = app.getPath('userData');
  const recovery = new RecoveryStore(join(userData, 'recovery'), session);
  const shell = new Shell({ userData, documentsFolder: app.getPath('documents'), recovery, dialogs, version: app.getVersion() });
  const windowFile = join(userData, 'window-state.json');

  const deliver = async (path: string): Promise<void> => {
    shell.grant(path);
    const r = await shell.openPath(path);
    if (r.ok) send(PUSH_CHANNELS.openDesign, r.value satisfies OpenedDesign);
    else dialog.showErrorBox('Cannot open the design', r.error.message);
    await refreshMenu();
  };
  const openFromOs = (path: string): void => {
    shell.grant(path); // at once, so the page may ask for it before the push arrives
    if (pageReady) void deliver(path);
    else pendingOpens.push(path);
  };

  const refreshMenu = async (): Promise<void> => {
    const recent = await shell.listRecent();
    Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate({
      command: runCommand,
      openRecent: (p) => void deliver(p),
      clearRecent: () => void shell.clearRecent().then(refreshMenu),
      showRecoveryFolder: () => void electronShell.openPath(recovery.folder),
      showCautions: () => void messageBox({ type: 'warning', title: CAUTIONS_TITLE, message: CAUTIONS_TITLE, detail: CAUTIONS_TEXT, buttons: ['OK'] }),
      showAbout: () => void messageBox({ type: 'info', title: 'About Stripwright', message: `Stripwright ${app.getVersion()}`, detail: `Microstrip feed networks for boards made in-house.\nElectron ${process.versions.electron ?? '?'}, Chromium ${process.versions.chrome ?? '?'}.\nRecovery copies: ${recovery.folder}`, buttons: ['OK'] }),
    }, recent.ok ? recent.value : [], process.platform, { development: DEVELOPMENT })));
  };

  // macOS hands files over with this event, also before 'ready'.
  app.on('open-file', (event, path) => { event.preventDefault(); openFromOs(path); });
  app.on('second-instance', (_event, argv, workingDirectory) => {
    for (const p of Shell.designPathsIn(argv.slice(1))) openFromOs(resolve(workingDirectory, p));
    const w = parent();
    if (w) { if (w.isMinimized()) w.restore(); w.focus(); }
  });
  // Defence in depth: whatever contents are ever created get the same navigation and window rules.
  app.on('web-contents-created', (_e, contents) => hardenContents(contents, DEVELOPMENT));
  app.on('window-all-closed', () => app.quit());

  void app.whenReady().then(async () => {
    const { strayTempsRemoved } = await shell.start();
    if (strayTempsRemoved > 0) console.log(`stripwright: removed ${strayTempsRemoved} stray temporary file(s) left by an earlier crash`);
    protocol.handle(APP_SCHEME, createBundleHandler(RENDERER_ROOT));

    const windowOf = (e: IpcMainInvokeEvent) => BrowserWindow.fromWebContents(e.sender);
    registerBridge(ipcMain, shell, {
      setDocumentState(e, state) {
        docState = state;
        const w = windowOf(e);
        if (!w) return;
        w.setTitle(windowTitle(state.title, state.dirty));
        w.setDocumentEdited(state.dirty);
        if (!state.dirty && Date.now() < closeAfterSaveUntil) { closeAfterSaveUntil = 0; w.close(); }
      },
      autosaved() { autosaveWaiter?.(); },
    });

    const saved = await readJson(windowFile, validateWindowState, DEFAULT_WINDOW);
    const state = placeOnDisplays(saved, screen.getAllDisplays().map((d) => d.workArea));
    win = createMainWindow({ preloadPath: PRELOAD, iconPath: ICON, state, development: DEVELOPMENT });
    await refreshMenu();

    win.webContents.on('did-finish-load', () => {
      pageReady = true;
      for (const p of pendingOpens.splice(0)) void deliver(p);
    });
    win.webContents.on('render-process-gone', (_e, details) => {
      // The page crashed. Its recovery copies stay on disk; a new session id makes them "earlier" copies, so the
      // reloaded page offers to restore them like after a crash of the whole app.
      pageReady = false;
      docState = { title: docState.title, dirty: false }; // the page's unsaved state is gone; its copies remain
      recovery.renewSession(randomUUID());
      // Reload, but not in a loop: after three crashes within a minute, leave the window for the user to close.
      crashes = crashes.filter((t) => Date.now() - t < 60_000).concat(Date.now());
      if (crashes.length > 3) {
        dialog.showErrorBox('The Stripwright page keeps stopping', `Reason: ${details.reason}. Your autosaved work is in ${recovery.folder}; restart Stripwright to restore it.`);
        return;
      }
      dialog.showErrorBox('The Stripwright page stopped', `Reason: ${details.reason}. The page reloads now and offers the work it had autosaved.`);
      win?.webContents.reload();
    });
    win.on('close', (event) => {
      const w = win!;
      void writeJson(windowFile, windowStateOf(w)).catch(() => {});
      if (!docState.dirty || closeConfirmed) return;
      event.preventDefault();
      const choice = dialog.showMessageBoxSync(w, {
        type: 'warning', buttons: ['Save', 'Close, keep a recovery copy', 'Cancel'], defaultId: 0, cancelId: 2,
        message: `${windowTitle(docState.title, false).replace(/ — Stripwright$/, '')} has unsaved changes.`,
        detail: 'If you close without saving, the changes are kept as a recovery copy and offered the next time Stripwright starts.',
      });
      if (choice === 0) { closeAfterSaveUntil = Date.now() + 60_000; runCommand('file.save'); }
      else if (choice === 1) {
        // Ask the page for a fresh recovery copy, close when it is written (or after 3 s with the last one).
        const done = () => { autosaveWaiter = null; closeConfirmed = true; w.close(); };
        const timer = setTimeout(done, 3000);
        autosaveWaiter = () => { clearTimeout(timer); done(); };
        send(PUSH_CHANNELS.flushAutosave);
      }
    });
    // The page's own beforeunload guard (for the browser) would silently stop a close the user already confirmed
    // in our prompt. Let a confirmed close through; otherwise the page knows of unsaved changes we were not told
    // of, so mark them and ask through our prompt.
    win.webContents.on('will-prevent-unload', (event) => {
      if (closeConfirmed) { event.preventDefault(); return; }
      docState = { ...docState, dirty: true };
      setImmediate(() => parent()?.close());
    });
    // Remember the placement also while the window lives (a crash then keeps it), at most once a second.
    let placeTimer: NodeJS.Timeout | null = null;
    const rememberPlace = () => {
      if (placeTimer) clearTimeout(placeTimer);
      placeTimer = setTimeout(() => { const w = parent(); if (w) void writeJson(windowFile, windowStateOf(w)).catch(() => {}); }, 1000);
    };
    for (const e of ['resize', 'move', 'maximize', 'unmaximize'] as const) win.on(e as 'resize', rememberPlace);
    win.on('closed', () => { if (placeTimer) clearTimeout(placeTimer); win = null; });

    for (const p of Shell.designPathsIn(process.argv.slice(app.isPackaged ? 1 : 2))) openFromOs(resolve(p));
  });
}

// Last, after every binding above exists: one instance per user; a second one hands its files over and quits.
if (!app.requestSingleInstanceLock()) {
  app.quit();
} else {
  start();
}
