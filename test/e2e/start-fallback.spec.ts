import { expect, test } from '@playwright/test';
import { spawn } from 'node:child_process';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');

// `npm start` on a machine where Electron cannot start (this one: the binary cannot be downloaded) must print the
// fallback address and why, and serve the same renderer there. Where Electron does start, this test is skipped.
test('npm start falls back to serving the renderer on 127.0.0.1 and the page loads', async ({ page }) => {
  // The start script may build first on a fresh clone: give the test more than its own 90 s wait for the address.
  test.setTimeout(150_000);
  const child = spawn('npm', ['start', '-s'], { cwd: ROOT, env: { ...process.env, PORT: '5291' }, detached: true });
  let out = '';
  child.stdout.on('data', (d: Buffer) => { out += d.toString(); });
  child.stderr.on('data', (d: Buffer) => { out += d.toString(); });
  try {
    const url = await new Promise<string>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no fallback address printed within 90 s:\n${out}`)), 90_000);
      const poll = setInterval(() => {
        const m = /serving the same app in your browser instead: (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
        if (m) { clearInterval(poll); clearTimeout(timer); resolve(m[1]!); }
        if (/opening the desktop app/i.test(out)) { clearInterval(poll); clearTimeout(timer); resolve(''); }
      }, 100);
    });
    test.skip(url === '', 'Electron started on this machine, so there is no fallback to check');
    expect(out).toMatch(/Electron cannot start here \(.+\)/);
    await page.goto(url);
    await expect(page).toHaveTitle(/Stripwright/);
    await expect(page.getByTestId('board')).toBeVisible();
  } finally {
    try { process.kill(-child.pid!, 'SIGTERM'); } catch { /* already gone */ }
  }
});
