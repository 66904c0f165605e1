/**
 * `npm start`: open the desktop app on the demo design. Where the Electron binary is missing or cannot start
 * (for example on a machine that cannot download it), build the renderer if needed and serve the very same
 * renderer on http://127.0.0.1:PORT instead, say so and why, and keep serving until stopped (Ctrl+C).
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, statSync, readdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { RENDERER_DIR, serveRenderer } from './serve.ts';

const ROOT = resolve(fileURLToPath(new URL('..', import.meta.url)));

function newestMtime(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    if (e.name === 'node_modules' || e.name.startsWith('.')) continue;
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return t;
}

function buildIfNeeded(): void {
  const index = join(RENDERER_DIR, 'index.html');
  const mainCjs = join(ROOT, 'dist-electron', 'main.cjs');
  const sources = Math.max(newestMtime(join(ROOT, 'renderer')), newestMtime(join(ROOT, 'core')), newestMtime(join(ROOT, 'electron')));
  const built = existsSync(index) && existsSync(mainCjs) ? Math.min(statSync(index).mtimeMs, statSync(mainCjs).mtimeMs) : 0;
  if (built >= sources) return;
  console.log('stripwright: building the app (npm run build) ...');
  const r = spawnSync('npm', ['run', '-s', 'build'], { cwd: ROOT, stdio: 'inherit' });
  if (r.status !== 0) { console.error('stripwright: the build failed; see the messages above.'); process.exit(1); }
}

/** The Electron binary's path, or the reason it cannot be used. */
function findElectron(): { path: string } | { reason: string } {
  if (process.env.STRIPWRIGHT_NO_ELECTRON) return { reason: 'STRIPWRIGHT_NO_ELECTRON is set' };
  const require = createRequire(import.meta.url);
  let pkgDir: string;
  try { pkgDir = resolve(require.resolve('electron/package.json'), '..'); } catch { return { reason: 'the electron package is not installed' }; }
  // Read path.txt ourselves: requiring 'electron' would try to download the binary (and fail offline).
  const pathTxt = join(pkgDir, 'path.txt');
  const override = process.env.ELECTRON_OVERRIDE_DIST_PATH;
  if (override) return { path: join(override, process.platform === 'win32' ? 'electron.exe' : 'electron') };
  if (!existsSync(pathTxt)) return { reason: 'the Electron binary was never downloaded (no network access to its host)' };
  const { readFileSync } = require('node:fs') as typeof import('node:fs');
  const bin = join(pkgDir, 'dist', readFileSync(pathTxt, 'utf8').trim());
  return existsSync(bin) ? { path: bin } : { reason: `the Electron binary is missing at ${bin}` };
}

async function serveFallback(reason: string): Promise<void> {
  const wanted = Number(process.env.PORT ?? 5180);
  for (let port = wanted; port < wanted + 20; port++) {
    try {
      await serveRenderer(port);
      console.log(`stripwright: Electron cannot start here (${reason}).`);
      console.log(`stripwright: serving the same app in your browser instead: http://127.0.0.1:${port}/`);
      console.log('stripwright: files open, save and export through the browser; press Ctrl+C to stop.');
      return;
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw err;
    }
  }
  console.error(`stripwright: no free port in ${wanted}..${wanted + 19}; set PORT to another one.`);
  process.exit(1);
}

async function main(): Promise<void> {
  buildIfNeeded();
  const electron = findElectron();
  if ('reason' in electron) return serveFallback(electron.reason);
  const args = [ROOT, ...process.argv.slice(2)];
  console.log(`stripwright: opening the desktop app (${electron.path})`);
  const child = spawn(electron.path, args, { stdio: ['ignore', 'inherit', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => { stderr += d.toString(); process.stderr.write(d); });
  const started = Date.now();
  child.on('error', (err) => void serveFallback(`it failed to launch: ${err.message}`));
  child.on('exit', (code) => {
    // Exiting within a few seconds with an error means it could not start (no display, missing libraries, ...).
    if (code !== 0 && Date.now() - started < 5000) void serveFallback(`it exited with code ${code}: ${stderr.trim().split('\n').pop() ?? ''}`);
    else process.exit(code ?? 0);
  });
}

void main();
