/**
 * A four-output, in-phase corporate feed for 2.45 GHz on 1.6 mm glass-epoxy (FR-4), drawn by hand with mouse and
 * keys the way a person would, counting every action (a click, a drag, a key chord, one field committed): the job
 * must take 80 or fewer.
 *
 * The network (a scenario of our own): a 50 Ω input; a quarter-wave 35.36 Ω line into the first tee; two 50 Ω arms
 * each to a quarter-wave 35.36 Ω riser into a second tee; four 50 Ω lines to the outputs. Facts checked: a
 * quarter-wave of Z = √(50 · 25) = 35.36 Ω matches the 25 Ω of two 50 Ω lines in parallel to 50 Ω (the quarter-wave
 * transformer, Pozar, "Microwave Engineering", 4th ed., 2012, sect. 2.5, eq. 2.62); four paths drawn alike, with the
 * same widths, lengths, bends and tees, are equal in phase (common practice: a symmetric corporate feed), so the
 * ledger finds every path within ±5°.
 */
import { expect, test } from '@playwright/test';
import { Actions, newDesign, readRulers } from './board-helpers.ts';

test('a four-output 2.45 GHz feed drawn by hand takes 80 actions or fewer', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  const act = new Actions(page);
  await newDesign(page, act);
  // A 1 mm snap grid: every click lands on whole millimetres.
  await act.choose(page.getByTestId('grid-step'), '0.001');
  const r = await readRulers(page);
  const at = (x: number, y: number) => r.toScreen(x, y);
  const segs = () => page.locator('[data-seg]').count();

  await act.key('p');
  await act.click(at(0, -15), 'input port');
  await act.key('r');
  // The left side in one run: the input, the first tee's place, the arm, the riser, a branch, the output.
  await act.click(at(0, -15), 'start at the input');
  for (const [x, y] of [[0, -5], [-12, -5], [-12, 5], [-18, 5], [-18, 15]] as const) await act.click(at(x, y));
  await act.key('Enter');
  await expect.poll(segs).toBe(5);
  // The right side starts at the corner (0, -5), which becomes the first tee.
  await act.click(at(0, -5), 'start at a corner');
  for (const [x, y] of [[12, -5], [12, 5], [18, 5], [18, 15]] as const) await act.click(at(x, y));
  await act.key('Enter');
  await expect.poll(segs).toBe(9);
  // The inner outputs start at the riser tops, which become the second tees.
  for (const s of [-1, 1]) {
    await act.click(at(12 * s, 5), 'start at a corner');
    await act.click(at(6 * s, 5));
    await act.click(at(6 * s, 15));
    await act.key('Enter');
  }
  await expect.poll(segs).toBe(13);
  await expect(page.locator('.node-junction')).toHaveCount(3);

  // The four open ends become output ports.
  await act.key('v');
  for (const x of [-18, -6, 6, 18]) {
    await act.click(at(x, 15), 'output end');
    await act.click(page.getByTestId('end-port'), 'make port');
  }
  await expect(page.locator('.node-port')).toHaveCount(5);

  // The three quarter-wave transformers: risers first (placing works outward from the input, so the feed's new
  // length moves them), then the feed.
  for (const [x, y] of [[-12, 0], [12, 0], [0, -10]] as const) {
    await act.click(at(x, y), 'quarter-wave line');
    await expect(page.getByTestId('piece-sheet')).toContainText('line');
    await act.field(page.getByTestId('field-z0'), '35.36');
    await act.click(page.getByTestId('length-by-degrees'));
    await act.field(page.getByTestId('field-deg'), '90');
    await expect(page.getByTestId('fig-deg')).toHaveText('90.0°');
  }

  // Ask the ledger for the four outputs in phase.
  await act.click(page.getByTestId('dock-paths'));
  await act.click(page.getByTestId('ask-phase-match'));
  const ledger = page.getByTestId('path-ledger');
  await expect(ledger.locator('tbody tr')).toHaveCount(4);
  await expect(ledger.getByText('in tolerance', { exact: true })).toHaveCount(4, { timeout: 30_000 });
  await expect(ledger.getByText('out of tolerance')).toHaveCount(0);

  expect(act.count, act.log.join('\n')).toBeLessThanOrEqual(80);
  test.info().annotations.push({ type: 'actions', description: String(act.count) });
  expect(errors).toEqual([]);
});
