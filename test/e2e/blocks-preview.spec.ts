/**
 * The block picker's preview as a person meets it: the form keeps answering while a large block folds. A 16-output
 * corporate feed at a 20 mm pitch asked to fit 310 × 90 mm (then 310 × 95 mm) folds for seconds; while it is being made (the preview
 * says "working…" and the worker has it), keys typed into another field reach that field at once — each key's input
 * event fires while the folded preview is still being made, and the page keeps painting frames in between — and the
 * preview that finally shows is the newest spec's, folded, with its plot and its figures at f0. No wall-clock bound
 * on the fold itself (speed is measured in `npm run bench -- block-fold`).
 * The split: an equal 16-way split is −12.04 dB per output, lossless (10·log10(1/16)); the preview shows each output
 * below that by the laminate's line loss.
 */
import { expect, test } from '@playwright/test';

test('typing into the form while a 16-output folded feed previews: every key reaches its field while the fold runs', async ({ page }) => {
  test.setTimeout(180_000);
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.keyboard.press('Control+Alt+n');
  await page.keyboard.press('Control+k');
  await page.keyboard.type('corporate');
  await page.keyboard.press('Enter');
  const preview = page.getByTestId('block-preview');
  await expect(preview).toHaveAttribute('data-phase', 'done', { timeout: 30_000 });
  await page.getByTestId('block-outputs').fill('16');
  await page.getByTestId('block-pitch').fill('20 mm');
  await page.getByTestId('block-footprint').fill('310mm, 90mm');
  // The fold is now in the worker.
  await expect(preview).toHaveAttribute('data-phase', 'worker', { timeout: 10_000 });
  await expect(page.getByTestId('block-preview-working')).toBeVisible();
  // Record, in the page, what each key meets: the preview's phase when its input event fires, and frames painted.
  await page.evaluate(() => {
    const w = window as unknown as { seen: { phase: string | null; frame: number; value: string }[]; frames: number };
    w.seen = []; w.frames = 0;
    const tick = () => { w.frames++; requestAnimationFrame(tick); };
    requestAnimationFrame(tick);
    const box = document.querySelector('[data-testid="block-preview"]')!;
    document.querySelector('[data-testid="block-footprint"]')!.addEventListener('input', (e) => {
      w.seen.push({ phase: box.getAttribute('data-phase'), frame: w.frames, value: (e.target as HTMLInputElement).value });
    }, { capture: true });
  });
  const field = page.getByTestId('block-footprint');
  await field.press('End');
  for (let k = 0; k < 3; k++) await field.press('Backspace');
  await page.keyboard.type('5mm', { delay: 60 });
  const seen = await page.evaluate(() => (window as unknown as { seen: { phase: string | null; frame: number; value: string }[] }).seen);
  expect(seen.map((s) => s.value)).toEqual(['310mm, 90m', '310mm, 90', '310mm, 9', '310mm, 95', '310mm, 95m', '310mm, 95mm']);
  // The first key met the fold in the worker (not a page frozen until it ended): the page had it while the worker worked.
  expect(seen[0]!.phase).toBe('worker');
  // Frames kept coming between keys (a frozen page paints none).
  for (let k = 1; k < seen.length; k++) expect(seen[k]!.frame, `frames before key ${k + 1}`).toBeGreaterThan(seen[k - 1]!.frame);
  await expect(field).toHaveValue('310mm, 95mm');
  // The newest spec's preview: folded, its plot and figures.
  await expect(preview).toHaveAttribute('data-phase', 'done', { timeout: 120_000 });
  await expect(page.getByTestId('block-error')).toHaveCount(0);
  await expect(preview).toContainText(/Folded \d+ lines? \(mitered bends/);
  await expect(page.getByTestId('block-preview-plot').locator('path[data-trace="transmission"]')).toHaveCount(16);
  const levels = await page.getByTestId('block-preview-response').locator('[data-deg]').evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-db'))));
  expect(levels).toHaveLength(16);
  // −12.04 dB (equal 16-way split, lossless) less the line loss of glass-epoxy over a few hundred mm: between −16 and −12.
  for (const db of levels) expect(db).toBeLessThan(-12.04), expect(db).toBeGreaterThan(-16);
});
