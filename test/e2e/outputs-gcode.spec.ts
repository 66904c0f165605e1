/**
 * G-code from the app, as a person makes it: open Outputs, choose G-code, look at the toolpath preview, the time and
 * the widths as milled, show the milled board over the design, export, and read the downloaded files back with
 * gcode-toolpath (npm) through scripts/oracles/gcode-retrace.ts. The demo is a V-bit board, so the isolation file
 * comes first and the cutout last; the polygon work runs in the compute worker under its own CSP.
 */
import { readmeShot } from './readme-shots.ts';
import { expect, test, type Download } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { retrace } from '../../scripts/oracles/gcode-retrace.ts';

test('export G-code of the demo from Outputs and read it back', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('dock-outputs').click();
  await expect(page.getByTestId('outputs-panel')).toBeVisible();
  await page.getByTestId('kind-dxf').uncheck();
  await page.getByTestId('kind-gcode').check();
  await expect(page.getByTestId('milling-options')).toBeVisible();
  await expect(page.getByTestId('milling-cautions')).toContainText('glass-fibre');
  await expect(page.getByTestId('toolpath-preview')).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId('milling-time')).toContainText(/Estimated machining: \d+ (min|s)/);
  await expect(page.getByTestId('milled-widths').locator('tbody tr').first()).toBeVisible();
  // Three passes instead of two: the plan follows (typed as a person types, then Tab).
  const passes = page.getByTestId('mill-passes');
  await passes.fill('3');
  await passes.press('Tab');
  // The board as milled, drawn over the design.
  await page.getByTestId('show-milled').check();
  await expect(page.locator('[data-testid="milled-overlay"]')).toHaveCount(1, { timeout: 30_000 });
  await readmeShot(page, 'outputs-gcode.png');

  const downloads: Download[] = [];
  page.on('download', (d) => downloads.push(d));
  await page.getByTestId('export-now').click();
  await expect.poll(() => downloads.length, { timeout: 30_000 }).toBeGreaterThanOrEqual(2);
  const names = downloads.map((d) => d.suggestedFilename());
  expect(names[0]).toMatch(/-T1-isolation\.nc$/);
  expect(names[names.length - 1]).toMatch(/-cutout\.nc$/);
  const text = readFileSync((await downloads[0]!.path())!, 'utf8');
  const lines = text.split('\n');
  expect(lines[0]).toMatch(/^\(Stripwright [\d.]+: .*design hash [0-9a-f]{8}:/);
  expect(lines[1]).toMatch(/^\(Tool 1 of \d+: 30 deg V-bit/);
  expect(text).toMatch(/\(CAUTION: Milling glass-fibre laminate/);
  const t = retrace(text);
  expect(t.units).toBe('G21');
  expect(t.ended).toBe(true);
  // Three isolation passes: three plunges to the cutting depth.
  expect(t.moves.filter((m) => !m.rapid && m.a.x === m.b.x && m.a.y === m.b.y && m.b.z < 0 && m.a.z > 0).length).toBeGreaterThanOrEqual(3);
});
