/**
 * The yield panel as a person uses it, in Debian chromium under the shipped CSP: open the Wilkinson example, make
 * boards in the compute worker, read the yield, its interval, the histograms and the envelope; stop a long run; edit
 * a tolerance in the table. The numbers themselves are checked against outside references in test/reference/yield-*.
 */
import { readmeShot } from './readme-shots.ts';
import { expect, test } from '@playwright/test';


test.beforeEach(async ({ page }) => {
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-wilkinson-2g45').click();
  await expect(page.getByTestId('design-name')).toContainText('2.45 GHz');
  await page.getByTestId('dock-yield').click();
  await expect(page.getByTestId('yield-panel')).toBeVisible();
});

test('make boards of the divider: yield, interval, histograms, envelope', async ({ page }) => {
  await page.getByTestId('yield-samples').fill('120');
  await page.getByTestId('yield-seed').fill('7');
  await page.getByTestId('yield-run').click();
  await expect(page.getByTestId('yield-overall')).toContainText('of 120 boards meet every target', { timeout: 60_000 });
  await expect(page.getByTestId('yield-interval')).toContainText('95 % interval');
  await expect(page.getByTestId('yield-interval')).toContainText('seed 7');
  for (const id of ['amplitude', 'phase', 'input-match', 'isolation']) {
    await expect(page.getByTestId(`yield-hist-${id}`).locator('rect.bar')).toHaveCount(24);
  }
  await expect(page.getByTestId('yield-ranking').locator('li').first()).toBeVisible();
  await expect(page.getByTestId('yield-envelope').locator('canvas')).toBeVisible();
  await page.getByTestId('yield-env-1').click();
  await expect(page.getByTestId('yield-env-1')).toHaveClass(/on/);
  await page.mouse.move(10, 300);
  await readmeShot(page, 'yield.png');
});

test('stop a long run, then edit a tolerance and see the result marked as out of date', async ({ page }) => {
  await page.getByTestId('yield-samples').fill('20000');
  await page.getByTestId('yield-run').click();
  await expect(page.getByTestId('yield-progress')).toBeVisible();
  await expect.poll(async () => Number(await page.getByTestId('yield-progress').getAttribute('value')), { timeout: 30_000 }).toBeGreaterThan(0);
  await page.getByTestId('yield-cancel').click();
  await expect(page.getByTestId('yield-error')).toContainText('cancelled', { timeout: 15_000 });
  await expect(page.getByTestId('yield-run')).toBeVisible();

  await page.getByTestId('yield-samples').fill('40');
  await page.getByTestId('yield-run').click();
  await expect(page.getByTestId('yield-overall')).toContainText('of 40 boards', { timeout: 60_000 });
  await page.getByTestId('yield-view-edit').click();
  const spread = page.getByTestId('spread-er');
  await spread.click();
  await spread.fill('0.2');
  await spread.press('Enter');
  await expect(page.getByTestId('tolerance-row-er')).toBeVisible();
  await page.getByTestId('yield-view-run').click();
  await expect(page.getByTestId('yield-stale')).toBeVisible();
});
