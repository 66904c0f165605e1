/**
 * The yield panel on every example, as a person would use it: open the example from the menu, go to the Yield tab,
 * ask for a few boards and press the button, and read the overall yield, one histogram per target of the example
 * and the envelope. The numbers are checked in test/unit/yield-examples.test.ts (every board against the targets read
 * on its full S) and against outside references in test/reference/yield-*.test.ts.
 */
import { expect, test } from '@playwright/test';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const EXAMPLES = readdirSync(EX).filter((f) => f.endsWith('.json')).sort().map((f) => {
  const doc = JSON.parse(readFileSync(join(EX, f), 'utf8')) as { name: string; targets: { id: string }[] };
  return { id: f.replace(/\.json$/, ''), name: doc.name, targets: doc.targets.map((t) => t.id) };
});

for (const ex of EXAMPLES) {
  test(`make boards of the example ${ex.id} against its own targets`, async ({ page }) => {
    await page.goto('/');
    await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
    if (ex.id !== 'demo') {
      await page.getByTestId('menu-examples').click();
      await page.getByTestId(`example-${ex.id}`).click();
      await expect(page.getByTestId('design-name')).toContainText(ex.name.split(',').pop()!.trim());
    }
    await page.getByTestId('dock-yield').click();
    await expect(page.getByTestId('yield-panel')).toBeVisible();
    await page.getByTestId('yield-samples').fill('16');
    await page.getByTestId('yield-seed').fill('3');
    await page.getByTestId('yield-run').click();
    await expect(page.getByTestId('yield-overall')).toContainText('of 16 boards meet every target', { timeout: 60_000 });
    await expect(page.getByTestId('yield-interval')).toContainText('95 % interval');
    for (const id of ex.targets) {
      // One histogram per target, its bars holding all 16 boards (some bar is drawn with a height).
      const bars = page.getByTestId(`yield-hist-${id}`).locator('rect.bar');
      await expect(bars).toHaveCount(24);
      const heights = await bars.evaluateAll((els) => els.map((e) => Number(e.getAttribute('height'))));
      expect(Math.max(...heights)).toBeGreaterThan(0);
    }
    await expect(page.getByTestId('yield-envelope').locator('canvas')).toBeVisible();
  });
}
