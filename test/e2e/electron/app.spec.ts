/**
 * Smoke test of the packaged shell with Playwright's Electron driver: the app starts on app://stripwright/, the page
 * has no Node (Electron checklist items 2–4, https://www.electronjs.org/docs/latest/tutorial/security), an example
 * given on the command line opens, and saving it writes the file atomically with a .bak of the previous version.
 * Needs a real Electron binary and a display; where there is none it is reported as skipped, with the reason.
 * Run after `npm run build` (the app loads dist/renderer and dist-electron).
 */
import { _electron as electron, expect, test } from '@playwright/test';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { electronBinary } from './electron-binary.ts';

const ROOT = resolve(fileURLToPath(new URL('../../..', import.meta.url)));
const bin = electronBinary();
const display = process.platform !== 'linux' || !!process.env.DISPLAY || !!process.env.WAYLAND_DISPLAY;

test.skip(!('path' in bin), 'reason' in bin ? `Electron cannot run here: ${bin.reason}` : '');
test.skip(!display, 'Electron cannot run here: no display (set DISPLAY, e.g. run under xvfb-run)');

type Bridge = { calls: Record<string, (arg?: unknown) => Promise<{ ok: boolean; value?: unknown; error?: { code: string; message: string } }>> };

test('starts hardened, opens an example from the command line and saves it with a backup', async () => {
  const work = mkdtempSync(join(tmpdir(), 'sw-electron-'));
  const userData = join(work, 'userData');
  const design = join(work, 'demo.json');
  copyFileSync(join(ROOT, 'assets', 'examples', 'demo.json'), design);
  const app = await electron.launch({
    executablePath: (bin as { path: string }).path,
    args: [ROOT, design],
    env: { ...process.env, STRIPWRIGHT_USER_DATA: userData, ELECTRON_ENABLE_SECURITY_WARNINGS: 'true' },
  });
  try {
    const page = await app.firstWindow();
    await page.waitForLoadState('domcontentloaded');
    expect(page.url()).toBe('app://stripwright/index.html');
    expect(await page.evaluate(() => [typeof (window as unknown as { require?: unknown }).require, typeof (window as unknown as { process?: unknown }).process])).toEqual(['undefined', 'undefined']);
    // The file named on the command line is granted to the page; open it through the bridge like the app does.
    const opened = await page.evaluate((p) => (window as unknown as { stripwright: Bridge }).stripwright.calls['design:open-path']!({ path: p }), design);
    expect(opened.ok).toBe(true);
    const value = opened.value as { text: string; modifiedMs: number };
    expect(JSON.parse(value.text).format).toBe('stripwright-design');
    const edited = value.text.replace('"name": "', '"name": "Saved by the smoke test: ');
    const saved = await page.evaluate(([p, t, m]) => (window as unknown as { stripwright: Bridge }).stripwright.calls['design:save']!({ docId: 'smoke', path: p, text: t, expectedModifiedMs: m }), [design, edited, value.modifiedMs] as const);
    expect(saved).toMatchObject({ ok: true, value: { path: design, backupPath: `${design}.bak` } });
    expect(readFileSync(design, 'utf8')).toBe(edited);
    expect(readFileSync(`${design}.bak`, 'utf8')).toBe(value.text);
    // A path nobody handed out is refused.
    const refused = await page.evaluate(() => (window as unknown as { stripwright: Bridge }).stripwright.calls['design:open-path']!({ path: '/etc/passwd' }));
    expect(refused).toMatchObject({ ok: false, error: { code: 'forbidden' } });
    expect(existsSync(join(userData, 'recent.json'))).toBe(true);
  } finally {
    await app.close();
    rmSync(work, { recursive: true, force: true });
  }
});
