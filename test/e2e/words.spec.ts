/**
 * Words in the app as a person meets them (issue 14, faults 8, 9 and 13), with mouse and keys:
 * - a length typed key by key ("13 mm") passes no half-typed value and shows no error until Enter; a bare number
 *   takes the unit the field shows; a refusal is worded for the user;
 * - ports are named by their labels in the response chips, the path ledger and the shop check;
 * - an example opens with its notes (scenario and targets) on show, and the notes carry the project's own figures.
 * The figures compared are the app's own (the same core as the CLI), so nothing here is hard-coded physics.
 */
import { expect, test, type Page } from '@playwright/test';

async function openExample(page: Page, id: string): Promise<void> {
  await page.getByTestId('menu-examples').click();
  await page.getByTestId(`example-${id}`).click();
}

test('typing "13 mm" key by key: nothing half-typed reaches the design, Enter commits, a bare number takes mm', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('tab-pieces').click();
  await page.getByTestId('piece-row-feed').click();
  await page.getByTestId('tab-sheet').click();
  await page.getByTestId('length-by-length').click();
  const field = page.getByTestId('field-length');
  await expect(field).toHaveValue(/ mm$/);
  const before = await page.getByTestId('fig-length').innerText();
  await field.click();
  await page.keyboard.press('Control+a');
  for (const ch of '13 mm') {
    await page.keyboard.type(ch);
    await expect(page.getByTestId('field-length-error')).toHaveCount(0);
    await expect(page.getByTestId('status')).not.toContainText('Not done');
    await expect(page.getByTestId('fig-length')).toHaveText(before);
  }
  await page.keyboard.press('Enter');
  await expect(field).toHaveValue('13 mm');
  await expect(page.getByTestId('fig-length')).not.toHaveText(before); // the board follows the committed entry
  await expect(page.getByTestId('status')).not.toContainText('Not done');
  const at13 = await page.getByTestId('fig-length').innerText();
  // A bare number takes the unit the field shows (mm).
  await field.click();
  await page.keyboard.press('Control+a');
  await page.keyboard.type('21');
  await page.keyboard.press('Enter');
  await expect(field).toHaveValue('21 mm');
  await expect(page.getByTestId('fig-length')).not.toHaveText(at13);
  // A slip is refused beside the field in the user's words, and Esc puts the field back.
  await field.click();
  await page.keyboard.press('Control+a');
  await page.keyboard.type('21 mn');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('field-length-error')).toContainText("'mn' is not a unit of length");
  await expect(page.getByTestId('field-length-error')).not.toContainText('args');
  await page.keyboard.press('Escape');
  await expect(field).toHaveValue('21 mm');
  // One undo step per entry: undo goes back to 13 mm.
  await page.getByTestId('board-canvas').focus();
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('fig-length')).toHaveText(at13);
  await expect(field).toHaveValue('13 mm');
});

test('ports are named by their labels in the response chips, the path ledger and the shop check', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  // The demo loses more than its budget on every path: the finding names the outputs by label.
  await page.getByTestId('dock-findings').click();
  const loss = page.getByTestId('finding-loss-budget');
  await expect(loss).toContainText('from input (to patch 1, patch 2, patch 3, patch 4)', { timeout: 30_000 });
  await expect(loss).not.toContainText('out1');

  await openExample(page, 'wilkinson-2g45');
  await page.getByTestId('dock-paths').click();
  await expect(page.getByTestId('path-ledger')).toContainText('output 1');
  await expect(page.getByTestId('path-ledger')).not.toContainText(/\bo1\b/);
  await page.getByTestId('dock-response').click();
  await expect(page.getByTestId('pick-S21')).toHaveText('S21 input → output 1', { timeout: 30_000 });
  await expect(page.getByTestId('pick-S11')).toHaveText('S11 at input');
  await expect(page.getByTestId('f0-S21')).toHaveAttribute('title', /^input → output 1: /);
});

test('an example opens with its notes on show; the notes give the project\'s own figures', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  // The demo's notes, one tab away: each path's length as the path ledger measures it.
  await page.getByTestId('dock-notes').click();
  const notes = page.getByTestId('design-notes');
  await expect(notes).toContainText('four-way corporate feed');
  const said = /about (\d+) mm of FR-4/.exec(await notes.innerText());
  expect(said).not.toBeNull();
  await page.getByTestId('dock-paths').click();
  const row = page.getByTestId('path-row-out1');
  await expect(row).toBeVisible({ timeout: 30_000 });
  const measured = parseFloat((await row.locator('td').nth(1).innerText()).replace(/[^\d.]/g, ''));
  expect(Math.round(measured)).toBe(Number(said![1]));

  // Opening an example from the menu shows its notes at once.
  await openExample(page, 'three-section-transformer');
  await expect(page.getByTestId('design-notes')).toContainText('binomial');
  await expect(page.getByTestId('design-notes')).toContainText('from 1.77 to 3.09 GHz');
  // The user can add to the notes; one undo step takes it back.
  await page.getByTestId('notes-edit').click();
  await page.getByTestId('notes-text').press('End');
  await page.keyboard.type(' Milled on the bench mill.');
  await page.getByTestId('notes-keep').click();
  await expect(page.getByTestId('design-notes')).toContainText('Milled on the bench mill.');
  await page.getByTestId('board-canvas').focus();
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('design-notes')).not.toContainText('Milled on the bench mill.');
});
