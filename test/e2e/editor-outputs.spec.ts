/**
 * Outputs and the shop check in the browser, as a user drives them, read back with outside parsers.
 * - DXF: dxf-parser 1.1.2 (DXF reference, header variables): $INSUNITS 4 = mm, closed LWPOLYLINEs on the COPPER layer.
 * - Shop check: the FR-4 demo loses ≈1.84 dB per path against a 1 dB budget (common practice expects ≈1.5–2 dB and
 *   the budget warning); the finding's own fix — a low-loss laminate, tanδ ≈ 0.001–0.004 — clears it, because
 *   dielectric loss scales with tanδ (Pozar, Microwave Engineering, 4th ed., §3.8, eq. (3.198), from memory).
 *
 * Both run the polygon engine in the compute worker, under the worker's own CSP (electron/csp.ts policyFor).
 */
import { expect, test } from '@playwright/test';
import DxfParser from 'dxf-parser';
import { readFileSync } from 'node:fs';
import { readmeShot } from './readme-shots.ts';

test('export DXF of the demo and read it back', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.keyboard.press('Control+e');
  await expect(page.getByTestId('outputs-panel')).toBeVisible();
  await expect(page.getByTestId('export-preview').locator('img')).toBeVisible({ timeout: 30_000 });
  await page.getByTestId('mirror').check();
  await readmeShot(page, 'outputs.png');
  const download = page.waitForEvent('download');
  await page.getByTestId('export-now').click();
  const file = await download;
  expect(file.suggestedFilename()).toMatch(/\.dxf$/);
  const dxf = new DxfParser().parseSync(readFileSync(await file.path(), 'utf8')) as unknown as { header: Record<string, unknown>; entities: { type: string; layer: string; shape?: boolean }[] };
  expect(dxf.header.$INSUNITS).toBe(4);
  const copper = dxf.entities.filter((e) => e.layer === 'COPPER');
  expect(copper.length).toBeGreaterThan(0);
  expect(copper.every((e) => e.type === 'LWPOLYLINE' && e.shape)).toBe(true);
});

test('fix a shop-check finding: the loss budget, with a low-loss laminate', async ({ page }) => {
  await page.goto('/');
  await page.getByTestId('dock-findings').click();
  const finding = page.getByTestId('finding-loss-budget').first();
  await expect(finding).toBeVisible({ timeout: 30_000 });
  await finding.click(); // selects and frames the pieces of that path
  await expect(page.getByTestId('piece-sheet')).toContainText('items selected');
  await page.getByTestId('tab-stack').click();
  const tan = page.getByTestId('field-tan');
  await tan.fill('0.002');
  await tan.press('Enter');
  await expect(page.getByTestId('finding-loss-budget')).toHaveCount(0, { timeout: 30_000 });
});
