/**
 * The response panel as a person uses it, in Debian chromium under the shipped CSP: markers placed by clicking,
 * dragged along the traces and stepped with the keys, with a delta marker and the same frequency on the Smith
 * chart; zoom and pan of the frequency axis; the design's own sweep settings (saved as an undoable edit, swept again,
 * answered from the cache on undo); cancelling a long sweep; the figures and targets table. The numbers themselves
 * are checked against outside references in test/reference and test/unit (network-*, plot-math, figure-table).
 */
import { readmeShot } from './readme-shots.ts';
import { expect, test, type Page } from '@playwright/test';

async function openWilkinson(page: Page): Promise<void> {
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-wilkinson-2g45').click();
  await expect(page.getByTestId('design-name')).toContainText('2.45 GHz');
  await page.getByTestId('dock-response').click();
  await expect(page.getByTestId('f0-S21')).toBeVisible({ timeout: 30_000 });
}

const num = async (page: Page, id: string) => parseFloat(((await page.getByTestId(id).textContent()) ?? '').replace('Δ', '').replace('−', '-').trim());

async function setSweep(page: Page, start: string, stop: string, points: string): Promise<void> {
  await page.getByTestId('sweep-settings').click();
  await page.getByTestId('sweep-start').fill(start);
  await page.getByTestId('sweep-stop').fill(stop);
  await page.getByTestId('sweep-points').fill(points);
  await page.getByTestId('sweep-points').press('Enter');
  await expect(page.getByTestId('sweep-form')).toHaveCount(0);
}

test('plots are tall enough with the notes open or closed, and name ports by their labels', async ({ page }) => {
  await openWilkinson(page);
  for (const notes of [false, true]) {
    if (notes) await page.getByText(/notes? from the solver/).click();
    const box = await page.getByTestId('response-plot').boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(240);
  }
  await expect(page.getByTestId('pick-S21')).toContainText('input → output 1');
  await expect(page.getByTestId('legend-S31')).toContainText('input → output 2');
  // The two outputs of the divider coincide: the second is dashed and the legend says so.
  await expect(page.getByTestId('same-S31')).toContainText('S21');
  await page.getByTestId('plot-phase').click();
  await expect(page.getByTestId('same-S31')).toContainText('S21');
});

test('markers: click to place, drag along the trace, step with the keys, delta, and the Smith chart', async ({ page }) => {
  await openWilkinson(page);
  await setSweep(page, '2', '2.9', '401');
  await expect(page.getByTestId('sweep-summary')).toContainText('401 points', { timeout: 30_000 });
  const s = (await page.getByTestId('response-plot-surface').boundingBox())!;
  const y = s.y + s.height / 2;
  await page.mouse.click(s.x + s.width * 0.3, y);
  await expect(page.getByTestId('marker-table')).toBeVisible();
  const f1 = await num(page, 'marker-f-1');
  expect(f1).toBeGreaterThan(2);
  expect(f1).toBeLessThan(2.9);
  // The readout of every shown trace at the marker.
  for (const t of ['S11', 'S21', 'S31', 'S32']) await expect(page.getByTestId(`marker-1-${t}`)).toHaveText(/-?\d+\.\d\d/);
  // Drag the marker to the right along the trace.
  const x1 = s.x + s.width * 0.3;
  await page.mouse.move(x1, y);
  await page.mouse.down();
  for (let k = 1; k <= 10; k++) await page.mouse.move(x1 + k * 15, y);
  await page.mouse.up();
  const f1b = await num(page, 'marker-f-1');
  expect(f1b).toBeGreaterThan(f1 + 0.05);
  // Keys: → moves the active marker by one swept point (0.9 GHz / 400 = 2.25 MHz).
  await page.keyboard.press('ArrowRight');
  expect(await num(page, 'marker-f-1')).toBeGreaterThan(f1b);
  // A second marker and the delta.
  await page.mouse.click(s.x + s.width * 0.8, y);
  await expect(page.getByTestId('marker-f-2')).toBeVisible();
  const db1 = await num(page, 'marker-1-S21'), db2 = await num(page, 'marker-2-S21');
  await page.getByTestId('marker-delta').check();
  await expect(page.getByTestId('marker-2-S21')).toContainText('Δ');
  expect(await num(page, 'marker-2-S21')).toBeCloseTo(db2 - db1, 1);
  // The same frequencies on the Smith chart: one dot per marker and reflection.
  await expect(page.getByTestId('smith').locator('circle.sm-marker')).toHaveCount(2 * 3);
  // Hovering a reflection trace reads Γ, Z and VSWR.
  const dot = page.getByTestId('smith').locator('circle.sm-marker').first();
  const d = (await dot.boundingBox())!;
  await page.mouse.move(d.x + d.width / 2, d.y + d.height / 2);
  await expect(page.getByTestId('smith-readout')).toContainText(/Γ .* Z .* Ω, VSWR \d/);
  await readmeShot(page, 'response-markers.png');
  // Delete removes the active marker.
  await page.getByTestId('response-plot-surface').focus();
  await page.keyboard.press('Delete');
  await expect(page.getByTestId('marker-f-2')).toHaveCount(0);
  await page.getByTestId('theme').click();
  await expect(page.locator('html')).toHaveClass(/dark/);
  await readmeShot(page, 'response-dark.png');
});

test('zoom with the wheel, pan by dragging, keys, and back to the whole sweep', async ({ page }) => {
  await openWilkinson(page);
  const plot = page.getByTestId('response-plot');
  const s = (await page.getByTestId('response-plot-surface').boundingBox())!;
  const lo0 = Number(await plot.getAttribute('data-lo')), hi0 = Number(await plot.getAttribute('data-hi'));
  await page.mouse.move(s.x + s.width / 2, s.y + s.height / 2);
  for (let k = 0; k < 3; k++) await page.mouse.wheel(0, -100);
  const lo1 = Number(await plot.getAttribute('data-lo')), hi1 = Number(await plot.getAttribute('data-hi'));
  expect(hi1 - lo1).toBeLessThan(0.6 * (hi0 - lo0));
  // Drag to the right: the window moves to lower frequencies.
  await page.mouse.down();
  await page.mouse.move(s.x + s.width / 2 + 80, s.y + s.height / 2, { steps: 5 });
  await page.mouse.up();
  expect(Number(await plot.getAttribute('data-lo'))).toBeLessThan(lo1);
  await expect(page.getByTestId('marker-table')).toHaveCount(0);
  await page.keyboard.press('0');
  await expect(plot).toHaveAttribute('data-lo', String(lo0));
  await page.keyboard.press('+');
  expect(Number(await plot.getAttribute('data-hi')) - Number(await plot.getAttribute('data-lo'))).toBeLessThan(hi0 - lo0);
  await page.getByTestId('zoom-reset').click();
  await expect(plot).toHaveAttribute('data-hi', String(hi0));
});

test('sweep settings are an undoable edit of the design; undo is answered from the cache', async ({ page }) => {
  await openWilkinson(page);
  await expect(page.getByTestId('sweep-summary')).toContainText('201 points');
  await setSweep(page, '1.5 GHz', '3.5 GHz', '301');
  await expect(page.getByTestId('sweep-summary')).toContainText('301 points', { timeout: 30_000 });
  await expect(page.getByTestId('sweep-summary')).toContainText('1.5000–3.5000 GHz');
  // A bad value is refused in words and nothing changes.
  await page.getByTestId('sweep-settings').click();
  await page.getByTestId('sweep-points').fill('1');
  await page.getByTestId('sweep-apply').click();
  await expect(page.getByTestId('sweep-error')).toContainText('points');
  await page.getByRole('button', { name: 'Close the sweep settings' }).click();
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('sweep-summary')).toContainText('201 points', { timeout: 30_000 });
  await expect(page.getByTestId('sweep-summary')).toContainText('(cached)');
  await page.keyboard.press('Control+Shift+z');
  await expect(page.getByTestId('sweep-summary')).toContainText('301 points');
  await expect(page.getByTestId('sweep-summary')).toContainText('(cached)');
});

test('cancel a long sweep: the last finished response stays', async ({ page }) => {
  await openWilkinson(page);
  await expect(page.getByTestId('sweep-summary')).toContainText('201 points');
  await setSweep(page, '0.5', '10', '100001');
  await expect(page.getByTestId('sweep-progress')).toBeVisible({ timeout: 10_000 });
  await page.getByTestId('sweep-cancel').click();
  await expect(page.getByTestId('sweep-cancelled')).toBeVisible();
  await expect(page.getByTestId('sweep-progress')).toHaveCount(0);
  // The last finished response stays: the new settings' 21-point first pass when it finished before the click (it
  // usually has), else the 201-point sweep before them; never the cancelled 100 001 points, never marked a first pass.
  await expect(page.getByTestId('sweep-summary')).toContainText(/^(21 points.*0\.5000–10\.0000 GHz|201 points)/);
  await expect(page.getByTestId('sweep-summary')).not.toContainText('first pass');
  await expect(page.getByTestId('sweep-summary')).not.toContainText('100001');
});

test('figures and targets: worst over the band, pass or fail as build says, copied as a table', async ({ page, context }) => {
  await context.grantPermissions(['clipboard-read', 'clipboard-write']);
  await openWilkinson(page);
  await expect(page.getByTestId('targets-summary')).toContainText('of 4 targets met');
  await page.getByTestId('targets-summary').click();
  const fig = page.getByTestId('figures-table');
  for (const k of ['return-loss', 'vswr', 'insertion-loss', 'group-delay', 'isolation', 'amplitude-balance', 'phase-balance']) {
    await expect(fig.locator(`tr[data-kind="${k}"]`).first()).toBeVisible();
  }
  await expect(page.getByTestId('targets-table').locator('tbody tr')).toHaveCount(4);
  await page.getByTestId('figures-copy').click();
  await expect(page.getByTestId('figures-copied')).toContainText('Copied');
  const text = await page.evaluate('navigator.clipboard.readText()') as string;
  expect(text.split('\n')[0]).toBe('figure\tof\tworst over the band\tat\tat f0');
  expect(text).toContain('return loss\tinput\t');
});
