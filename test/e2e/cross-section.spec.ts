/**
 * The cross-section view as a person uses it, in Debian chromium under the app's CSP: pick a line from the piece
 * list, open the Cross-section tab, read Z0 and εeff from the field solution, widen the gap to the side copper and
 * see Z0 rise (side copper closer than a few substrate heights lowers Z0: the conductor-backed coplanar formulas of
 * Ghione & Naldi 1984 and every field solution agree on the direction), take the side copper away and see it rise
 * further towards plain microstrip.
 * With STRIPWRIGHT_SCREENSHOTS=1 (npm run screenshots:section) it also writes docs/screenshots/cross-section.png.
 */
import { readmeShot } from './readme-shots.ts';
import { expect, test } from '@playwright/test';

const ohms = (t: string) => Number(t.replace(/[^\d.]/g, ''));

test('select a line, open its cross-section, change the gap, see Z0 change', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await page.getByTestId('tab-pieces').click();
  await page.getByTestId('piece-row-feed').click();
  await page.getByTestId('dock-section').click();
  const view = page.getByTestId('cross-section');
  await expect(view).toContainText('feed');
  const z0 = page.getByTestId('section-z0');
  await expect(z0).toContainText('Ω', { timeout: 30_000 });
  await expect(page.getByTestId('section-svg')).toBeVisible();
  // The demo is milled with a V-bit, so the view starts with stitched side copper at the cut's width.
  await expect(page.getByTestId('section-side-stitched')).toHaveClass(/on/);
  const before = ohms(await z0.innerText());
  expect(before).toBeGreaterThan(10);

  const gap = page.getByTestId('section-gap');
  await gap.click();
  await gap.fill('1.5 mm');
  await gap.press('Enter');
  await expect.poll(async () => ohms(await z0.innerText()), { timeout: 30_000 }).toBeGreaterThan(before * 1.01);
  const wider = ohms(await z0.innerText());

  await page.getByTestId('section-side-none').click();
  await expect.poll(async () => ohms(await z0.innerText()), { timeout: 30_000 }).toBeGreaterThan(wider);
  // The equipotentials are drawn (one path per level).
  expect(await page.locator('[data-testid="section-svg"] path.equi').count()).toBe(10);

  if (process.env.STRIPWRIGHT_SCREENSHOTS === '1') {
    await page.getByTestId('section-side-stitched').click();
    await gap.fill('0.3 mm');
    await gap.press('Enter');
    await expect.poll(async () => ohms(await z0.innerText()), { timeout: 30_000 }).toBeLessThan(wider);
    await readmeShot(page, 'cross-section.png');
  }
  expect(errors).toEqual([]);
});
