import { defineConfig } from '@playwright/test';
import { execSync } from 'node:child_process';

// Debian's chromium, never a downloaded browser (`npx playwright install` cannot work on this machine kind).
function chromiumPath(): string {
  if (process.env.CHROMIUM_PATH) return process.env.CHROMIUM_PATH;
  try {
    return execSync('command -v chromium', { shell: '/bin/sh' }).toString().trim();
  } catch {
    throw new Error('Debian chromium not found: install it with `apt-get install --no-install-recommends chromium` or set CHROMIUM_PATH.');
  }
}

// E2E_PORT lets a developer run the browser tests beside another server already on the default port.
const PORT = Number(process.env.E2E_PORT ?? 4173);

export default defineConfig({
  testDir: 'test/e2e',
  testIgnore: ['**/electron/**'],
  workers: 1,
  timeout: 60_000,
  outputDir: 'test-results',
  reporter: process.env.CI ? [['list'], ['json', { outputFile: 'reports/e2e.json' }]] : 'list',
  use: {
    baseURL: `http://127.0.0.1:${PORT}`,
    headless: true,
    acceptDownloads: true,
    viewport: { width: 1366, height: 768 },
    launchOptions: {
      executablePath: chromiumPath(),
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
        '--disable-component-update', '--disable-sync',
        // The same pixels every run (README images): one colour profile, unhinted grey-scale text, whole-tile
        // raster and no CPU-specific drawing paths.
        '--force-color-profile=srgb', '--font-render-hinting=none', '--disable-lcd-text', '--disable-partial-raster',
        '--disable-skia-runtime-opts'],
    },
  },
  projects: [
    { name: 'chromium', testIgnore: ['**/electron/**'] },
    // The desktop shell through Playwright's Electron driver; each test skips itself, with the reason, where no
    // Electron binary or display is available (test/e2e/electron/electron-binary.ts).
    { name: 'electron', testDir: 'test/e2e/electron', testIgnore: [] },
  ],
  webServer: {
    command: `node --import tsx scripts/serve.ts --port ${PORT}`,
    url: `http://127.0.0.1:${PORT}`,
    reuseExistingServer: false,
    timeout: 60_000,
  },
});
