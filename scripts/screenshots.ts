/**
 * `npm run screenshots`: refreshes the README screenshots in docs/screenshots/ (tracked files, so no ordinary test
 * run writes them; see test/e2e/readme-shots.ts). Builds the renderer, then runs the browser tests that take them
 * with STRIPWRIGHT_SCREENSHOTS=1. Review the images with `git diff --stat docs/screenshots` before committing.
 *   npx tsx scripts/screenshots.ts      (E2E_PORT picks the port, as for the tests)
 */
import { spawnSync } from 'node:child_process';

const SPECS = ['test/e2e/board-tools.spec.ts', 'test/e2e/blocks-feed.spec.ts', 'test/e2e/blocks-gallery.spec.ts', 'test/e2e/measured-report.spec.ts', 'test/e2e/editor-workflow.spec.ts', 'test/e2e/editor-outputs.spec.ts', 'test/e2e/coupon.spec.ts', 'test/e2e/cross-section.spec.ts', 'test/e2e/outputs-gcode.spec.ts', 'test/e2e/yield.spec.ts', 'test/e2e/response.spec.ts', 'test/e2e/response-themes.spec.ts'];

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): void {
  const r = spawnSync(cmd, args, { stdio: 'inherit', env, shell: process.platform === 'win32' });
  if (r.status !== 0) { console.error(`screenshots: ${cmd} ${args.join(' ')} failed (exit ${r.status ?? r.signal})`); process.exit(r.status ?? 1); }
}

run('npx', ['vite', 'build']);
run('npx', ['playwright', 'test', ...SPECS, '--project', 'chromium'], { ...process.env, STRIPWRIGHT_SCREENSHOTS: '1' });
console.log('screenshots: written to docs/screenshots/ (review with git diff --stat docs/screenshots)');
