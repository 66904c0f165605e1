// Where the Electron binary is, or why it cannot be used: read node_modules/electron/path.txt ourselves, because
// requiring 'electron' in Node tries to download the binary (project rule: never fetch it). Same rule as scripts/start.ts.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

export function electronBinary(): { path: string } | { reason: string } {
  const override = process.env.ELECTRON_OVERRIDE_DIST_PATH;
  if (override) {
    const p = join(override, process.platform === 'win32' ? 'electron.exe' : 'electron');
    return existsSync(p) ? { path: p } : { reason: `ELECTRON_OVERRIDE_DIST_PATH is set but ${p} does not exist` };
  }
  let pkgDir: string;
  try { pkgDir = dirname(createRequire(import.meta.url).resolve('electron/package.json')); } catch { return { reason: 'the electron package is not installed' }; }
  const pathTxt = join(pkgDir, 'path.txt');
  if (!existsSync(pathTxt)) return { reason: 'the Electron binary was never downloaded (node_modules/electron/path.txt is missing: no network access to its host); run on a machine that can fetch it' };
  const bin = join(pkgDir, 'dist', readFileSync(pathTxt, 'utf8').trim());
  return existsSync(bin) ? { path: bin } : { reason: `the Electron binary is missing at ${bin}` };
}
