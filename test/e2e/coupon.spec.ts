/**
 * The laminate from a coupon, as a person does it in the browser: set the sheet's thickness, add a coupon to the
 * board, pick the two measured lines with the file chooser, type the lengths and width as made, read εr and tanδ,
 * make them the design's laminate and undo that. The files are the scikit-rf-made fixtures of test/fixtures/coupon
 * (εr 4.25, tanδ 0.017 behind them, t = 0; see its README) — the app uses the design's 35 µm copper, so εr is
 * checked loosely here; the close checks are the core's (test/reference/coupon-skrf.test.ts).
 */
import { readmeShot } from './readme-shots.ts';
import { expect, test } from '@playwright/test';
import { join } from 'node:path';

const FIX = join(import.meta.dirname, '..', 'fixtures', 'coupon');

test('measure the laminate from a coupon, apply it, undo', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  // The sheet in hand is 1.52 mm thick.
  await page.getByTestId('tab-stack').click();
  await page.getByTestId('field-h').fill('1.52mm');
  await page.getByTestId('field-h').press('Enter');
  const pieces = await page.locator('[data-piece]').count();

  // Add a coupon to the board (one undo step) from the Laminate tab.
  await page.getByTestId('dock-laminate').click();
  await page.getByTestId('coupon-add').click();
  await expect(page.getByTestId('coupon-plan')).toContainText('line A 25.00 mm');
  await expect.poll(() => page.locator('[data-piece]').count()).toBeGreaterThan(pieces);

  // Pick the two measured lines.
  for (const name of ['coupon-25mm.s2p', 'coupon-41.5mm.s2p']) {
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('coupon-pick').click();
    await (await chooser).setFiles(join(FIX, name));
  }
  await expect(page.getByTestId('coupon-line')).toHaveCount(2);
  // Lengths start from the coupon just added; type what was actually made and measured.
  await expect(page.getByTestId('coupon-length-0')).toHaveValue('25 mm');
  await page.getByTestId('coupon-length-1').fill('41.5 mm');
  await page.getByTestId('coupon-width').fill('2.9 mm');
  await page.getByTestId('coupon-run').click();

  await expect(page.getByTestId('coupon-result')).toBeVisible();
  const erText = (await page.getByTestId('coupon-er').textContent()) ?? '';
  const er = Number(/εr ([\d.]+)/.exec(erText)![1]);
  expect(Math.abs(er / 4.25 - 1)).toBeLessThan(0.02);
  const tand = Number(/tanδ ([\d.]+)/.exec((await page.getByTestId('coupon-tand').textContent()) ?? '')![1]);
  expect(Math.abs(tand / 0.017 - 1)).toBeLessThan(0.3);
  await expect(page.getByTestId('coupon-plot-eps').locator('canvas')).toBeVisible();
  await expect(page.getByTestId('coupon-plot-alpha').locator('canvas')).toBeVisible();
  await readmeShot(page, 'laminate.png');

  // Make it the design's laminate: εr, tanδ and the frequency they hold at (wideband Debye).
  await page.getByTestId('coupon-apply').click();
  await expect(page.getByTestId('coupon-apply')).toBeDisabled();
  await page.getByTestId('tab-stack').click();
  await expect(page.getByTestId('field-er')).toHaveValue(String(Number(er.toPrecision(4))));
  await expect(page.getByTestId('field-debye')).toBeChecked();
  await expect(page.getByTestId('field-fmeasure')).toHaveValue(/GHz/);

  // One undo step brings back the laminate it had; the coupon stays on the board.
  await page.locator('body').click({ position: { x: 5, y: 5 } });
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('field-er')).toHaveValue('4.4');
  await expect(page.getByTestId('field-debye')).not.toBeChecked();
  expect(await page.locator('[data-piece]').count()).toBeGreaterThan(pieces);
});

test('a one-port file and equal lengths are refused with the reason', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('dock-laminate').click();
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('coupon-pick').click();
  await (await chooser).setFiles({ name: 'open.s1p', mimeType: 'text/plain', buffer: Buffer.from('# GHz S RI R 50\n1 0.9 0\n2 0.9 0\n') });
  const chooser2 = page.waitForEvent('filechooser');
  await page.getByTestId('coupon-pick').click();
  await (await chooser2).setFiles(join(FIX, 'coupon-25mm.s2p'));
  await page.getByTestId('coupon-length-0').fill('25mm');
  await page.getByTestId('coupon-length-1').fill('40mm');
  await page.getByTestId('coupon-width').fill('2.9mm');
  await page.getByTestId('coupon-run').click();
  await expect(page.getByTestId('coupon-error')).toContainText('open.s1p: expected a two-port measurement');
  await page.getByRole('button', { name: 'Remove open.s1p' }).click();
  const chooser3 = page.waitForEvent('filechooser');
  await page.getByTestId('coupon-pick').click();
  await (await chooser3).setFiles(join(FIX, 'coupon-41.5mm.s2p'));
  // The remaining line keeps its 40 mm; give the new one the same length by mistake.
  await expect(page.getByTestId('coupon-length-0')).toHaveValue('40 mm');
  await page.getByTestId('coupon-length-1').fill('40mm');
  await page.getByTestId('coupon-run').click();
  await expect(page.getByTestId('coupon-error')).toContainText('a length different from');
});
