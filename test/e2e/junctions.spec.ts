/**
 * Junction models as a person meets them, in Debian chromium under the app's CSP: the branch-line example's shunt arm
 * lists the tee at each end (Hammerstad 1981, modelled) on the piece sheet; choosing ideal junctions in Stack & band
 * changes the copper and the response, and Undo brings the models back.
 */
import { expect, test, type Page } from '@playwright/test';

async function lineMid(page: Page, id: string) {
  const b = await page.locator(`[data-piece="${id}"]`).first().boundingBox();
  if (!b) throw new Error(`copper of ${id} not drawn`);
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

test('the branch-line hybrid: tees on the piece sheet, ideal junctions for comparison, undo', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-branchline-10g4').click();
  await expect(page.getByTestId('design-name')).toContainText('10.368 GHz');
  await page.locator('[data-piece]').first().waitFor();

  const at = await lineMid(page, 'shunt1');
  await page.mouse.click(at.x, at.y);
  await page.getByTestId('tab-sheet').click();
  const rows = page.getByTestId('junctions').locator('tbody tr');
  await expect(rows).toHaveCount(2);
  await expect(rows.first()).toContainText('tee (branch)');
  await expect(rows.first()).toContainText('modelled');
  const modelledLength = await page.getByTestId('fig-length').textContent();

  await page.getByTestId('dock-response').click();
  const s41 = page.getByTestId('f0-S41');
  await expect(s41).toBeVisible({ timeout: 30_000 });
  const isoModelled = await s41.textContent();

  await page.getByTestId('tab-stack').click();
  await page.getByTestId('field-junctions').selectOption('ideal');
  await page.getByTestId('tab-sheet').click();
  await expect(page.getByTestId('junctions').locator('tbody tr').first()).toContainText('ideal');
  await expect(page.getByTestId('fig-length')).not.toHaveText(modelledLength!);
  await expect(s41).not.toHaveText(isoModelled!, { timeout: 30_000 });

  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('junctions').locator('tbody tr').first()).toContainText('modelled');
  await expect(page.getByTestId('fig-length')).toHaveText(modelledLength!);
});
