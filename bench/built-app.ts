/**
 * What the browser benchmarks share: the renderer built, served under the app's CSP on a free port, and a page in
 * Debian chromium at 1366×768 (the size the issues measure at); everything is closed again whatever the bench does.
 * Also the order statistics they print. Not a bench itself (no `.bench.ts`), so `npm run bench` does not run it.
 */
import { chromium, type Page } from 'playwright-core';
import { execSync, spawn } from 'node:child_process';

export function median(xs: number[]): number { const s = [...xs].sort((a, b) => a - b); return s.length ? s[Math.floor(s.length / 2)]! : NaN; }
export function pct(xs: number[], p: number): number { const s = [...xs].sort((a, b) => a - b); return s[Math.min(s.length - 1, Math.floor(s.length * p))]!; }

/** Builds the renderer, serves it, opens `fn` a page on it and closes browser and server after. */
export async function withBuiltApp(fn: (page: Page, url: string) => Promise<void>): Promise<void> {
  // A profile needs the functions' own names: FRAME_BENCH_PROFILE builds without minifying.
  execSync(process.env.FRAME_BENCH_PROFILE ? 'npx vite build --minify false' : 'npx vite build', { stdio: 'ignore' });
  const port = 4500 + Math.floor(Math.random() * 400);
  const url = `http://127.0.0.1:${port}/`;
  const server = spawn(process.execPath, ['--import', 'tsx', 'scripts/serve.ts', '--port', String(port)], { stdio: 'ignore' });
  const exe = process.env.CHROMIUM_PATH ?? execSync('command -v chromium', { shell: '/bin/sh' }).toString().trim();
  const browser = await chromium.launch({ executablePath: exe, args: ['--no-sandbox', '--disable-gpu', '--no-first-run'] });
  try {
    // Wait for the server to answer (tsx start-up takes a moment on a busy machine).
    for (let i = 0; i < 100; i++) {
      if (await fetch(url).then((r) => r.ok, () => false)) break;
      await new Promise((r) => setTimeout(r, 200));
    }
    const page = await browser.newPage({ viewport: { width: 1366, height: 768 } });
    await page.goto(url);
    await fn(page, url);
  } finally {
    await browser.close();
    server.kill();
  }
}
