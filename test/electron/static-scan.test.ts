// A static scan of the shell's sources for the settings the Electron security checklist forbids
// (https://www.electronjs.org/docs/latest/tutorial/security, items 1, 2, 3, 4, 6, 8, 9, 10, 11, 15, 20;
// the project's own "static scan" rule), so a later edit cannot switch one back on unnoticed. The unit tests of the
// window factory check the values actually used; this catches a second window or a stray option anywhere.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = resolve(fileURLToPath(new URL('../..', import.meta.url)));
function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => { const p = join(dir, n); return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : []; });
}
const sources = files(join(ROOT, 'electron')).map((p) => ({ path: relative(ROOT, p), text: readFileSync(p, 'utf8').replace(/\/\*[\s\S]*?\*\//g, "").replace(/(^|\s)\/\/.*$/gm, "$1") }));

const forbidden: [RegExp, string][] = [
  [/nodeIntegration\w*\s*:\s*true/, 'item 2: Node integration'],
  [/contextIsolation\s*:\s*false/, 'item 3: context isolation off'],
  [/sandbox\s*:\s*false/, 'item 4: sandbox off'],
  [/webSecurity\s*:\s*false/, 'item 6: webSecurity off'],
  [/allowRunningInsecureContent\s*:\s*true/, 'item 8: insecure content'],
  [/experimentalFeatures\s*:\s*true/, 'item 9: experimental features'],
  [/enableBlinkFeatures\s*:\s*['"][^'"]+['"]/, 'item 10: Blink features'],
  [/webviewTag\s*:\s*true|allowpopups/, 'item 11: webview'],
  [/openExternal\s*\(/, 'item 15: shell.openExternal'],
  [/exposeInMainWorld\([^)]*ipcRenderer\b/, 'item 20: raw ipcRenderer exposed'],
  [/['"`]https?:\/\//, 'item 1: a remote URL'],
  [/loadFile\(|file:\/\//, 'item 18: file:// instead of the app protocol'],
  [/new BrowserWindow\(/, 'one window factory only'],
];

describe('static scan of electron/', () => {
  it('finds the sources', () => expect(sources.map((s) => s.path)).toContain('electron/main.ts'));
  for (const [re, what] of forbidden) {
    it(`has no ${what}`, () => {
      const hits = sources.filter((s) => re.test(s.text) && !(what === 'one window factory only' && s.path === 'electron/window.ts'));
      expect(hits.map((h) => h.path)).toEqual([]);
    });
  }
  it('exposes exactly one object to the page, from the preload only', () => {
    const exposing = sources.filter((s) => /exposeInMainWorld\(/.test(s.text));
    expect(exposing.map((s) => s.path)).toEqual(['electron/preload.ts']);
    expect(exposing[0]!.text.match(/exposeInMainWorld\(/g)).toHaveLength(1);
  });
  it('handles IPC only through the guarded registration', () => {
    const registering = sources.filter((s) => /ipcMain\.(handle|handleOnce|on|once)\(/.test(s.text));
    expect(registering.map((s) => s.path)).toEqual(['electron/ipc.ts']);
    const calls = registering[0]!.text.match(/ipcMain\.\w+\([^\n]*/g)!;
    expect(calls.length).toBeGreaterThan(0);
    for (const c of calls) expect(c).toMatch(/^ipcMain\.handle\(ipcName\(c\), guarded\(/);
  });
});
