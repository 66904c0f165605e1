/**
 * Every block of the registry placed as a person would (new design, the command finder's "Place a block: …", the
 * picker's defaults, Place), then its copper on the board and its response at the design's band, for the README's
 * blocks gallery (docs/screenshots/block-KIND.png, written by `npm run screenshots`; see readme-shots.ts). Each block
 * must place without an error and show its at-f0 figures; the figures themselves are checked against outside
 * references in test/unit/blocks-registry.test.ts and test/reference/blocks-skrf.test.ts.
 */
import { expect, test } from '@playwright/test';
import { writeFileSync } from 'node:fs';
import type { Page } from '@playwright/test';
import { readmeShotPath, settledScreenshot } from './readme-shots.ts';

/**
 * The page once it has stopped changing: screenshots are taken until two in a row are the same (at most 20), so an
 * image never catches a frame half drawn. Animations are stopped and the caret hidden.
 */
async function stableShot(page: Page, name: string): Promise<void> {
  writeFileSync(readmeShotPath(name), await settledScreenshot(page));
}

/** Fields a block has no default for (our own example load). */
const FILL: Record<string, Record<string, string>> = { 'stub-match': { load: '30-20j' } };
/** The band each response is shown over (start, stop), wide enough to see the block's pass and stop bands. */
const BAND: Record<string, [string, string]> = {
  corporate: ['2 GHz', '2.9 GHz'], wilkinson: ['1.8 GHz', '3.1 GHz'], branchline: ['1.8 GHz', '3.1 GHz'], ratrace: ['1.8 GHz', '3.1 GHz'],
  transformer: ['1 GHz', '3.9 GHz'], taper: ['0.5 GHz', '6 GHz'], 'stub-match': ['1.8 GHz', '3.1 GHz'], lowpass: ['0.1 GHz', '5 GHz'],
  bandstop: ['0.5 GHz', '4.4 GHz'], launch: ['1 GHz', '3.9 GHz'],
};
const KINDS = ['corporate', 'wilkinson', 'branchline', 'ratrace', 'transformer', 'taper', 'stub-match', 'lowpass', 'bandstop', 'launch'];

test('each block places from the picker and shows its copper and its response', async ({ page }) => {
  test.setTimeout(KINDS.length * 60_000);
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  for (const kind of KINDS) {
    await page.keyboard.press('Control+Alt+n');
    // The block before this one is unsaved: the app asks first.
    const discard = page.getByRole('button', { name: 'Discard changes' });
    if (kind !== KINDS[0]) await discard.click();
    await expect(page.locator('[data-piece]')).toHaveCount(0);
    await page.keyboard.press('Control+k');
    await page.keyboard.type(`(${kind})`);
    await page.keyboard.press('Enter');
    await expect(page.getByTestId('block-picker')).toBeVisible();
    await expect(page.getByTestId('block-kind')).toHaveValue(kind);
    for (const [field, text] of Object.entries(FILL[kind] ?? {})) await page.getByTestId(`block-${field}`).fill(text);
    await expect(page.getByTestId('block-preview-response')).toContainText('input match', { timeout: 30_000 });
    await page.getByTestId('block-place').click();
    await expect(page.getByTestId('block-picker')).toHaveCount(0);
    await expect(page.getByTestId('status')).toContainText('Placed:');
    await page.keyboard.press('Escape');
    await page.keyboard.press('Alt+3');
    await expect(page.getByTestId('f0-S11')).toBeVisible({ timeout: 60_000 });
    const [start, stop] = BAND[kind]!;
    await page.getByTestId('sweep-settings').click();
    await page.getByTestId('sweep-start').fill(start);
    await page.getByTestId('sweep-stop').fill(stop);
    await page.getByTestId('sweep-points').fill('201');
    await page.getByTestId('sweep-points').press('Enter');
    await expect(page.getByTestId('sweep-form')).toHaveCount(0);
    // The full sweep over the new band, not its coarse first pass, then a moment for the plot to draw it.
    const range = `${Number.parseFloat(start).toFixed(4)}–${Number.parseFloat(stop).toFixed(4)} GHz`;
    await expect(page.getByTestId('sweep-summary')).toContainText(range, { timeout: 60_000 });
    await expect(page.getByTestId('sweep-summary')).toContainText('201 points', { timeout: 60_000 });
    await expect(page.getByTestId('sweep-summary')).not.toContainText('first pass', { timeout: 60_000 });
    // The response of the design's last revision, swept in full (not a coarse pass, not an older revision's).
    await expect(page.getByTestId('sweep-summary')).toHaveAttribute('data-final', 'yes', { timeout: 60_000 });
    await page.mouse.move(1, 760);
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))));
    // The worker's timing in the status bar differs run to run: removed, so the images are the same every time.
    // Taken out of the flow, not only hidden: its width (two or three digits) moved the status text's cut-off.
    await page.getByTestId('layout-ms').evaluate((e) => { (e as HTMLElement).style.display = 'none'; });
    await stableShot(page, `block-${kind}.png`);
  }
});
