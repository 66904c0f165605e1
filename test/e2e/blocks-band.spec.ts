/**
 * What placing a block does to the design beyond its pieces, as a person sees it: a low-pass filter placed into a
 * new design (band 2.4–2.5 GHz) widens the band to the block's own (its response is shown past its cut-off, not
 * only at 2.4–2.5 GHz), the design gets the default tolerances (the yield panel lists them and a small run shows a
 * spread), the design takes the block's name, and one undo takes back the pieces, the band, the tolerances and the
 * name together. The filter's figures are
 * checked against Matthaei, Young and Jones (1964) in test/unit/blocks-registry.test.ts; the defaults are common
 * practice (core/blocks/tolerance-defaults.ts).
 */
import { expect, test } from '@playwright/test';

test('a low-pass placed into a new design widens its band, brings default tolerances, and one undo takes all back', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.keyboard.press('Control+Alt+n');
  await expect(page.locator('[data-piece]')).toHaveCount(0);
  await page.keyboard.press('Control+k');
  await page.keyboard.type('(lowpass)');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('block-kind')).toHaveValue('lowpass');
  await page.getByTestId('block-cutoff').fill('2 GHz');
  await expect(page.getByTestId('block-preview-response')).toContainText('input match', { timeout: 30_000 });
  await page.getByTestId('block-place').click();
  // The block's band is 0.05·fc to 2·fc (core/blocks/kinds/filters.ts): 0.1–4 GHz, wider than the new design's.
  await expect(page.getByTestId('status')).toContainText('design band widened from 2.4 GHz–2.5 GHz to 0.1 GHz–4 GHz');
  await expect(page.getByTestId('status')).toContainText('default tolerances added');
  // The new design, unnamed and empty before, is named after the block and its design frequency.
  await expect(page.getByTestId('design-name')).toHaveText('Low-pass filter 2.45 GHz');
  await page.keyboard.press('Escape');
  await page.keyboard.press('Alt+3');
  await expect(page.getByTestId('sweep-summary')).toContainText('0.1000–4.0000 GHz', { timeout: 60_000 });
  await expect(page.getByTestId('sweep-summary')).toHaveAttribute('data-final', 'yes', { timeout: 60_000 });

  await page.getByTestId('dock-yield').click();
  await expect(page.getByTestId('yield-panel')).toBeVisible();
  await page.getByTestId('yield-view-edit').click();
  for (const q of ['er', 'h', 't', 'tool-width', 'width']) await expect(page.getByTestId(`tolerance-row-${q}`)).toBeVisible();

  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  await page.keyboard.press('Control+z');
  await expect(page.locator('[data-piece]')).toHaveCount(0);
  await expect(page.getByTestId('tolerance-row-er')).toHaveCount(0);
  await expect(page.getByTestId('design-name')).toHaveText('Untitled feed');
});
