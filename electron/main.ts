// Electron main process (filled in by the desktop-shell work): one hardened window loading the built renderer.
import { app, BrowserWindow } from 'electron';
import { join } from 'node:path';

function createWindow(): BrowserWindow {
  const win = new BrowserWindow({
    width: 1366,
    height: 860,
    webPreferences: { preload: join(__dirname, 'preload.cjs'), contextIsolation: true, sandbox: true, nodeIntegration: false },
  });
  void win.loadFile(join(__dirname, '..', 'dist', 'renderer', 'index.html'));
  return win;
}

void app.whenReady().then(createWindow);
app.on('window-all-closed', () => app.quit());
