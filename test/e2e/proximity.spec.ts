/**
 * The proximity limit as a person sets it: open the branch-line example, find no runs side by side at the default
 * 3 substrate heights (common practice), type a wider limit in the shop check, see the two shunt arms named and marked
 * on the board, then undo and see the finding go. The arms' gap (≈ 6.2 h edge to edge) comes from the example's own
 * drawing; the coupling figure itself is checked in test/unit/layout-proximity.test.ts (Pozar §7.6).
 */
import { expect, test } from '@playwright/test';

test('widening the proximity limit brings a finding naming both shunt arms, marked on the board; undo takes it away', async ({ page }) => {
  await page.goto('/');
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-branchline-10g4').click();
  await page.getByTestId('dock-findings').click();
  const field = page.getByTestId('proximity-limit');
  await expect(field).toHaveValue('3h');
  // Wait for the first check of this design: its list (findings, or "nothing to report") fills once it arrives.
  await expect(page.getByTestId('shop-check').locator('li').first()).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId('shop-check')).not.toContainText('checking…', { timeout: 30_000 });
  await expect(page.getByTestId('finding-proximity')).toHaveCount(0);

  await field.fill('7h');
  await field.press('Enter');
  await expect(page.getByTestId('proximity-limit-metres')).toContainText('3.56 mm');
  const finding = page.getByTestId('finding-proximity').filter({ hasText: 'shunt arm (shunt1)' });
  await expect(finding).toHaveCount(1, { timeout: 30_000 });
  await expect(finding).toContainText('shunt arm (shunt2)');
  await expect(page.locator('[data-piece="shunt1"]')).toHaveClass(/\bnear\b/);
  await expect(page.locator('[data-piece="shunt2"]')).toHaveClass(/\bnear\b/);
  // A slip is refused in words, and the setting stays.
  await field.fill('3 furlongs');
  await field.press('Enter');
  await expect(page.getByTestId('proximity-limit-error')).toContainText('expected a multiple of the substrate height');

  await page.getByTestId('undo').click();
  await expect(field).toHaveValue('3h');
  await expect(page.getByTestId('finding-proximity')).toHaveCount(0, { timeout: 30_000 });
  await expect(page.locator('[data-piece="shunt1"]')).not.toHaveClass(/\bnear\b/);
});
