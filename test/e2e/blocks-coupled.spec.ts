/**
 * Blocks in the app, as a person uses them: the command finder opens a block's spec form, the block is placed into
 * the design as one undo step, and its response reads as the spec asked (coupling at f0 within 0.3 dB, the same
 * check as the unit test's). A spec the process cannot cut is refused in the form with the reason.
 */
import { expect, test, type Page } from '@playwright/test';

async function finder(page: Page, text: string): Promise<void> {
  await page.keyboard.press('Control+k');
  await page.keyboard.type(text);
  await page.keyboard.press('Enter');
}

test('place a 10 dB coupler from the command finder, read its coupling at f0, undo it', async ({ page }) => {
  await page.goto('/');
  await finder(page, 'new design');
  await page.getByTestId('tab-pieces').click();
  const before = await page.getByTestId('piece-list').locator('tr').count();
  await finder(page, 'coupled-line coupler');
  await expect(page.getByTestId('block-form')).toBeVisible();
  await page.getByTestId('block-coupling').fill('10 dB');
  await page.getByTestId('block-place').click();
  await expect(page.getByTestId('block-form')).toHaveCount(0);
  await expect(page.getByTestId('status')).toContainText('Placed: 10 dB coupled-line coupler');
  // The coupler's band (0.8–1.2·f0) is wider than the new design's: the status says so, in the CLI's words.
  await expect(page.getByTestId('status')).toContainText('design band widened from 2.4 GHz–2.5 GHz to 1.96 GHz–2.94 GHz');
  await expect(page.getByTestId('design-name')).toHaveText('Coupled-line coupler 2.45 GHz');
  await page.getByTestId('dock-response').click();
  const f0 = page.locator('[data-testid^="f0-"]');
  await expect(f0).toHaveCount(4, { timeout: 30_000 });
  const dbs = (await f0.allTextContents()).map((t) => Number(/(-?\d+\.\d+) dB/.exec(t)![1]));
  // One port is the coupled one: −10 dB within 0.3 dB (Pozar §7.6 coupler at its centre frequency).
  expect(dbs.some((d) => Math.abs(d + 10) < 0.3)).toBe(true);
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('status')).toContainText('Undone');
  await page.getByTestId('tab-pieces').click();
  await expect(page.getByTestId('piece-list').locator('tr')).toHaveCount(before);
});

test('a coupling the process cannot cut is refused in the form; a band-pass filter is placed', async ({ page }) => {
  await page.goto('/');
  await finder(page, 'new design');
  await finder(page, 'coupled-line coupler');
  await page.getByTestId('block-coupling').fill('6 dB');
  await page.getByTestId('block-place').click();
  await expect(page.getByTestId('block-error')).toContainText('tightest coupling');
  await page.getByTestId('block-cancel').click();
  await finder(page, 'band-pass filter');
  await page.getByTestId('block-order').fill('3');
  await page.getByTestId('block-place').click();
  await expect(page.getByTestId('status')).toContainText('Placed: Order 3 edge-coupled band-pass');
});
