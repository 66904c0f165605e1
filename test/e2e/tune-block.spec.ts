/**
 * Tuning a placed block's parameter as a person does it, counting actions (a click, a key chord, a file chosen, or
 * one field committed), in Debian chromium under the shipped CSP: open a design whose Wilkinson block was made for an
 * equal split while its goals ask for a 3 dB split (test/fixtures/tune, invented), tick the block's ratio as the
 * variable in the Tune tab, widen its range, run the search (progress shown), read the before/after table, apply,
 * see the goals met in the Response tab, and undo it in one step.
 * Outside check: a lossless unequal Wilkinson sends P1/P2 = K² (D. M. Pozar, Microwave Engineering, 4th ed., 2012,
 * §7.3), so goals of a 3 dB split are met at a ratio near 3 dB (the block's line loss moves it by a few hundredths).
 */
import { expect, test, type Page } from '@playwright/test';
import { join } from 'node:path';

const FIXTURE = join(import.meta.dirname, '..', 'fixtures', 'tune', 'wilkinson-block-3db-goals.json');

let actions = 0;
const act = async (what: Promise<unknown>): Promise<void> => { actions++; await what; };
/** Filling a field and committing it with Enter is one action. */
async function commit(page: Page, field: ReturnType<Page['getByTestId']>, text: string): Promise<void> {
  actions++; await field.fill(text); await field.press('Enter');
}

test('tune a placed block\'s split ratio to the design\'s goals, apply, and undo in one step', async ({ page }) => {
  test.setTimeout(240_000);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  actions = 0;

  const chooser = page.waitForEvent('filechooser');
  await act(page.getByTestId('menu-file').click());                  // 1: File
  await act(page.getByTestId('menu-file.open').click());             // 2: Open…
  await act((await chooser).setFiles(FIXTURE));                      // 3: the design
  await expect(page.getByTestId('design-name')).toHaveText('Divider to retune (3 dB goals)');

  await act(page.getByTestId('dock-tune').click());                  // 4: Tune tab
  const panel = page.getByTestId('tune-panel');
  await expect(panel).toBeVisible();
  // The block's own pieces start unticked (they belong to the block); its parameters are offered.
  await expect(panel.getByLabel('vary b1.arm11 degrees')).not.toBeChecked();
  const row = panel.locator('tr', { hasText: 'ratioDb' });
  await act(row.getByLabel('vary block b1 ratioDb').check());         // 5: the ratio is the variable
  await commit(page, row.getByLabel('highest ratioDb'), '5');        // 6: its range reaches 5 dB
  await act(page.getByTestId('tune-run').click());                   // 7: tune
  await expect(page.getByTestId('tune-progress')).toBeVisible();
  await expect(page.getByTestId('tune-goal-after-b1.level-o1')).toContainText('✓', { timeout: 120_000 });
  await expect(page.getByTestId('tune-goal-after-b1.level-o2')).toContainText('✓');
  await expect(page.getByTestId('tune-goal-before-b1.level-o1')).toHaveClass(/bad/); // the equal split missed them
  const table = page.getByTestId('tune-result');
  await expect(table).toContainText('b1 ratioDb');
  const after = Number(await page.getByTestId('tune-after-0').textContent());
  expect(Math.abs(after - 3)).toBeLessThan(0.3); // Pozar §7.3: a 3 dB split needs K² = 2 (10·log10 2 = 3.01 dB)

  await act(page.getByTestId('tune-apply').click());                 // 8: apply
  await expect(page.getByTestId('tune-apply')).toContainText('Applied');
  await act(page.keyboard.press('Alt+3'));                           // 9: response
  const summary = page.getByTestId('targets-summary');
  await expect(summary).toHaveText('5 of 5 targets met', { timeout: 60_000 });
  await act(page.keyboard.press('Control+z'));                       // 10: undo, one step
  // Back to the equal split: the two level goals of the 3 dB split fail again, the other three still hold.
  await expect(summary).toHaveText('3 of 5 targets met', { timeout: 60_000 });
  expect(actions).toBeLessThanOrEqual(10);
  expect(errors).toEqual([]);
});
