// electron-builder.yml, read and validated by electron-builder's own loader and JSON schema (app-builder-lib 26,
// the library behind the `npm run dist` step), and checked for the fuses the Electron fuses page
// (https://www.electronjs.org/docs/latest/tutorial/fuses) and the project's own hardening rule ask for.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { PNG } from 'pngjs';
import { DESIGN_EXTENSION } from '../../bridge/contract.ts';

const ROOT = resolve(fileURLToPath(new URL('../..', import.meta.url)));
const require = createRequire(join(ROOT, 'package.json'));
const { getConfig, validateConfiguration } = require('app-builder-lib/out/util/config/config.js') as {
  getConfig(dir: string, path: string, extra: null): Promise<Record<string, any>>;
  validateConfiguration(c: unknown, log: unknown): Promise<void>;
};
const { DebugLogger } = require('builder-util') as { DebugLogger: new (enabled: boolean) => unknown };

const load = () => getConfig(ROOT, 'electron-builder.yml', null);

describe('electron-builder.yml', () => {
  it('passes electron-builder’s own schema, which does refuse a misspelt option', async () => {
    const cfg = await load();
    await expect(validateConfiguration(cfg, new DebugLogger(false))).resolves.toBeUndefined();
    await expect(validateConfiguration({ ...cfg, electronFuses: { ...cfg.electronFuses, runAsNod: false } }, new DebugLogger(false))).rejects.toThrow(/electronFuses/);
  });
  it('flips the fuses: no run-as-node, no NODE_OPTIONS, no inspector flags; asar only, integrity-checked; cookies encrypted', async () => {
    expect((await load()).electronFuses).toEqual({
      runAsNode: false, enableNodeOptionsEnvironmentVariable: false, enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true, onlyLoadAppFromAsar: true, enableCookieEncryption: true,
      grantFileProtocolExtraPrivileges: false,
    });
  });
  it('packages our own app id and name for Linux (AppImage, deb), Windows (NSIS) and macOS (dmg)', async () => {
    const cfg = await load();
    expect(cfg.appId).toBe('org.stripwright.desktop');
    expect(cfg.productName).toBe('Stripwright');
    expect(cfg.linux.target).toEqual(['AppImage', 'deb']);
    expect(cfg.win.target).toEqual(['nsis']);
    expect(cfg.mac.target).toEqual(['dmg']);
    expect(cfg.asar).toBe(true);
  });
  it('claims the design extension the shell saves', async () => {
    const cfg = await load();
    expect(cfg.fileAssociations.map((a: { ext: string }) => a.ext)).toEqual([DESIGN_EXTENSION]);
    expect(cfg.nsis.perMachine).toBe(true); // electron-builder: NSIS registers associations only per machine
  });
  it('uses the 512×512 icon from assets/ (electron-builder wants at least 512×512 for macOS)', () => {
    const png = PNG.sync.read(readFileSync(join(ROOT, 'assets', 'icon.png')));
    expect([png.width, png.height]).toEqual([512, 512]);
  });
  it('ships the bundles main.ts loads: dist-electron/main.cjs as main, preload.cjs beside it, dist/renderer', async () => {
    const cfg = await load();
    expect(cfg.extraMetadata.main).toBe('dist-electron/main.cjs');
    expect(JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).main).toBe('dist-electron/main.cjs');
    // getConfig normalises the list into one { filter } set.
    expect(cfg.files.flatMap((f: string | { filter: string[] }) => (typeof f === 'string' ? [f] : f.filter))).toEqual(expect.arrayContaining(['dist/renderer/**', 'dist-electron/**', 'assets/icon.png']));
    const main = readFileSync(join(ROOT, 'electron', 'main.ts'), 'utf8');
    expect(main).toMatch(/join\(__dirname, 'preload\.cjs'\)/);
    expect(main).toMatch(/join\(__dirname, '\.\.', 'dist', 'renderer'\)/);
    expect(readFileSync(join(ROOT, 'scripts', 'build-electron.mjs'), 'utf8')).toMatch(/main: 'electron\/main\.ts', preload: 'electron\/preload\.ts'/);
  });
});
