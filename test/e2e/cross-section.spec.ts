/**
 * The cross-section view as a person uses it, in Debian chromium under the app's CSP: pick a line from the piece
 * list, open the Cross-section tab, read Z0 and εeff from the field solution, widen the gap to the side copper and
 * see Z0 rise (side copper closer than a few substrate heights lowers Z0: the conductor-backed coplanar formulas of
 * Ghione & Naldi 1984 and every field solution agree on the direction), take the side copper away and see it rise
 * further towards plain microstrip.
 * The second test opens an example sized as made (the default for milled designs) and finds the view on the very
 * cross-section the line was sized as: its field solution gives the line's own 50 Ω. With STRIPWRIGHT_SCREENSHOTS=1
 * (npm run screenshots:section) that view is docs/screenshots/cross-section.png.
 */
import { stableReadmeShot } from './readme-shots.ts';
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
  expect(errors).toEqual([]);
});

test('a line sized as made: the view opens on the cross-section it was sized as, at its own Z0', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-open-stub-match').click();
  await page.getByTestId('tab-pieces').click();
  await page.getByTestId('piece-row-toload').click();
  await page.getByTestId('dock-section').click();
  const z0 = page.getByTestId('section-z0');
  await expect(z0).toContainText('Ω', { timeout: 30_000 });
  await expect(page.getByTestId('section-side-stitched')).toHaveClass(/on/);
  await expect(page.locator('[data-testid="section-svg"] path.equi')).toHaveCount(10);
  // Sized from a table of the same solver (interpolated to within 0.1 %, each value within its 0.2 % estimate), so a
  // direct solve at the sized width lands on the 50 Ω asked for within 1 %.
  await expect.poll(async () => Math.abs(ohms(await z0.innerText()) - 50), { timeout: 30_000 }).toBeLessThan(0.5);
  if (process.env.STRIPWRIGHT_SCREENSHOTS === '1') await stableReadmeShot(page, 'cross-section.png');
  expect(errors).toEqual([]);
});
