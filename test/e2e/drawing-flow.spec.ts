/**
 * Drawing as a person draws, with mouse and keys in Debian chromium: each test repeats what a practitioner did when
 * the editor got in the way, and checks it now works. Facts checked against outside sources: 1 mil = 25.4 µm exactly
 * (the inch is 25.4 mm: international yard and pound agreement, 1959); ruler steps of 1, 2 and 5 times a power of ten
 * (common practice for scales); a chip part's span on the board is its pad pitch (the land table in
 * core/design/footprints.ts); angles counted counter-clockwise from +x (plane geometry).
 * Everything else is the project's own drawing rules (where a run may start and end, which side a width step changes).
 */
import { expect, test, type Page } from '@playwright/test';
import { centreOf, lineMark, newDesign, nodeMark, readRulers, type Ruler } from './board-helpers.ts';

const count = (page: Page, sel: string) => page.locator(sel).count();

async function openDemo(page: Page) {
  await page.goto('/');
  await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
  await page.locator('[data-piece]').first().waitFor();
}

/** A new design on a 1 mm snap grid, with one port at (x0, 0) mm and a straight run from it to (x1, 0) mm. */
async function oneRun(page: Page, x0: number, x1: number): Promise<Ruler> {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await newDesign(page);
  await page.getByTestId('grid-step').selectOption('0.001');
  const r = await readRulers(page);
  const p = r.toScreen(x0, 0), q = r.toScreen(x1, 0);
  await page.keyboard.press('p');
  await page.mouse.click(p.x, p.y);
  await page.keyboard.press('r');
  await page.mouse.click(p.x, p.y);
  await page.mouse.click(q.x, q.y);
  await page.keyboard.press('Enter');
  await expect.poll(() => count(page, '[data-seg]')).toBe(1);
  return r;
}

const click = (page: Page, p: { x: number; y: number }) => page.mouse.click(p.x, p.y);

test('1 · a phase group is edited in the path ledger: input, members, reference, tolerance, delete, undo', async ({ page }) => {
  await openDemo(page);
  await page.getByTestId('dock-paths').click();
  const ledger = page.getByTestId('path-ledger');
  await expect(ledger.locator('tbody tr')).toHaveCount(4);
  // out1 becomes the input: the old input joins the members, so the paths now run from out1.
  await page.getByTestId('group-input-outputs').selectOption('out1');
  await expect(page.getByTestId('path-row-in')).toBeVisible();
  await expect(page.getByTestId('path-row-out1')).toHaveCount(0);
  // Drop the old input again; then the ledger compares out2, out3, out4.
  await page.getByTestId('group-member-outputs-in').uncheck();
  await expect(ledger.locator('tbody tr')).toHaveCount(3);
  // out3 is the reference: its own difference is zero and it is listed first.
  await page.getByTestId('group-ref-outputs').selectOption('out3');
  await expect(ledger.locator('tbody tr').first()).toHaveAttribute('data-testid', 'path-row-out3');
  await expect(page.getByTestId('path-diff-out3')).toHaveText('0.00°');
  await page.getByTestId('field-phase-tol').fill('2 deg');
  await page.getByTestId('field-phase-tol').press('Enter');
  await expect(ledger.locator('h4').first()).toContainText('±2°');
  await page.getByTestId('group-delete-outputs').click();
  await expect(page.getByTestId('ask-phase-match')).toBeVisible();
  await page.getByTestId('board-canvas').focus();
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('group-edit-outputs')).toBeVisible();
});

test('2 · a tee goes on a corner, runs start at a corner or an open end, and a run ending on a line makes a tee', async ({ page }) => {
  const r = await oneRun(page, -20, 0);
  const at = (x: number, y: number) => r.toScreen(x, y);
  // Carry on from the open end at (0, 0) up to (0, 10): (0, 0) becomes a corner.
  await click(page, at(0, 0));
  await click(page, at(0, 10));
  await page.keyboard.press('Enter');
  await expect.poll(() => count(page, '[data-seg]')).toBe(2);
  await expect(page.locator('.node-vertex')).toHaveCount(1);
  // A tee on that corner, with the Tee tool: the corner becomes a tee with a branch to (15, 0).
  await page.keyboard.press('t');
  await click(page, at(0, 0));
  await click(page, at(15, 0));
  await page.keyboard.press('Enter');
  await expect(page.locator('.node-junction')).toHaveCount(1);
  // A run from the open end (0, 10) that ends on the branch at (10, 0): the branch gets a tee there.
  await page.keyboard.press('r');
  await click(page, at(0, 10));
  await click(page, at(10, 10));
  await click(page, at(10, 0));
  await expect(page.getByTestId('status')).toContainText('joined to the line with a tee');
  await expect(page.locator('.node-junction')).toHaveCount(2);
  await expect.poll(() => count(page, '[data-seg]')).toBe(6);
  // Both were one step each: two undos take back the joining run and the tee.
  await page.keyboard.press('Control+z');
  await page.keyboard.press('Control+z');
  await expect.poll(() => count(page, '[data-seg]')).toBe(2);
});

test('3 · a width step changes the side the user clicked, and the sheet says which side is which', async ({ page }) => {
  const r = await oneRun(page, -20, 20);
  await page.keyboard.press('w');
  // Clicked at 14 mm, nearer the far end: the piece from the step to that end takes the new width.
  await click(page, r.toScreen(14, 0));
  await expect(page.getByTestId('status')).toContainText('is now 70.7 Ω; the other side keeps its width');
  await expect(page.getByTestId('field-z0')).toHaveValue(/70\.7/);
  await expect(page.getByTestId('piece-ends')).toContainText('to n2');
  await page.keyboard.press('v');
  await click(page, r.toScreen(-10, 0));
  await expect(page.getByTestId('field-z0')).toHaveValue(/^50/);
  // The step itself: its two sides, each with its width and the end it runs towards.
  await click(page, r.toScreen(14, 0));
  const sides = page.getByTestId('step-sides');
  await expect(sides).toContainText('50 Ω, towards n1');
  await expect(sides).toContainText('70.7 Ω, towards n2');
});

test('4 · a deleted port leaves an open end that can be routed from, and the ledger counts the ports left', async ({ page }) => {
  await openDemo(page);
  await page.keyboard.press('v');
  await click(page, await centreOf(nodeMark(page, 'out1')));
  await page.keyboard.press('Delete');
  await expect(nodeMark(page, 'out1')).toHaveClass(/node-open/);
  await page.getByTestId('dock-paths').click();
  await expect(page.getByTestId('path-ledger').locator('tbody tr')).toHaveCount(3, { timeout: 30_000 });
  await expect(page.getByTestId('ledger-empty')).toHaveCount(0);
  const segs = await count(page, '[data-seg]');
  await page.keyboard.press('r');
  const end = await centreOf(nodeMark(page, 'out1'));
  await click(page, end);
  await click(page, { x: end.x - 60, y: end.y });
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('status')).toContainText('Routed 1 line');
  await expect.poll(() => count(page, '[data-seg]')).toBe(segs + 1);
});

test('5 · a part inserted on a line moves nothing else; it is drawn with a body and its value, and hovering shows the part', async ({ page }) => {
  const r = await oneRun(page, -20, 20);
  const far = nodeMark(page, 'n1');
  await expect(page.locator('.cl-line:not(.unsized)')).toHaveCount(1, { timeout: 30_000 });
  const before = await centreOf(far);
  await page.keyboard.press('l');
  await click(page, r.toScreen(0, 0));
  await expect(page.locator('.part-body')).toHaveCount(1);
  await expect(page.locator('[data-part-value]')).toHaveText('100 Ω');
  // Wait for the new sizing, then the far end must be where it was.
  await expect(page.locator('.cl:not(.unsized)')).toHaveCount(3, { timeout: 30_000 });
  const after = await centreOf(far);
  expect(Math.abs(after.x - before.x)).toBeLessThan(0.5);
  expect(Math.abs(after.y - before.y)).toBeLessThan(0.5);
  await page.keyboard.press('v');
  const body = await centreOf(page.locator('.part-body'));
  await page.mouse.move(body.x, body.y - 1);
  await page.mouse.move(body.x, body.y);
  const tip = page.getByTestId('hover-readout');
  await expect(tip).toContainText('resistor 100 Ω');
  await expect(tip).toContainText('0603 chip');
  await expect(tip).not.toContainText('Z0');
});

test('6 · the loss finding names every path that loses alike, and marks each of them', async ({ page }) => {
  await openDemo(page);
  await page.getByTestId('dock-findings').click();
  const finding = page.getByTestId('finding-loss-budget').first();
  await expect(finding).toBeVisible({ timeout: 30_000 });
  await expect(finding).toContainText('4 paths from input (to patch 1, patch 2, patch 3, patch 4) each lose');
  for (const id of ['up1', 'up2', 'up3', 'up4']) await expect(lineMark(page, id)).toHaveClass(/flagged/);
});

test('7 · while routing: live length and angle, no start tip, pointer coordinates follow; a double-click ends the run without selecting text; the status names an opened example', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await newDesign(page);
  await page.getByTestId('grid-step').selectOption('0.001');
  const r = await readRulers(page);
  const at = (x: number, y: number) => r.toScreen(x, y);
  await page.keyboard.press('p');
  await click(page, at(-20, 0));
  await page.keyboard.press('r');
  await click(page, at(-20, 0));
  const measure = page.getByTestId('route-measure');
  await page.mouse.move(at(-5, 0).x, at(-5, 0).y, { steps: 3 });
  await expect(measure).toHaveText(/^15(\.0+)? mm · 0\.0°$/);
  await expect(page.getByTestId('status').locator('..')).toContainText('-5 mm, 0 mm');
  await page.mouse.move(at(-20, 12).x, at(-20, 12).y, { steps: 3 });
  await expect(measure).toHaveText(/^12(\.0+)? mm · 90\.0°$/);
  await expect(page.getByTestId('status').locator('..')).toContainText('-20 mm, 12 mm');
  // Back over the start port: no hover tip follows the pointer while drawing.
  await page.mouse.move(at(-20, 0).x + 2, at(-20, 0).y, { steps: 2 });
  await expect(page.getByTestId('hover-readout')).toHaveCount(0);
  await page.mouse.dblclick(at(-20, 12).x, at(-20, 12).y);
  await expect.poll(() => count(page, '[data-seg]')).toBe(1);
  expect(await page.evaluate(() => globalThis.getSelection()?.toString() ?? '')).toBe('');
  await page.getByTestId('menu-examples').click();
  const title = await page.getByTestId('example-wilkinson-2g45').innerText();
  await page.getByTestId('example-wilkinson-2g45').click();
  page.once('dialog', (d) => void d.accept());
  const discard = page.getByRole('button', { name: 'Discard changes' });
  if (await discard.isVisible().catch(() => false)) await discard.click();
  await expect(page.getByTestId('status')).toContainText(`Opened the example “${title}”`);
});

test('10 · rulers step 1-2-5 in the unit shown, never clip, show the unit, and the unit is a view setting', async ({ page }) => {
  await openDemo(page);
  const mmRuler = await readRulers(page);
  const labels = async () => page.locator('.ruler-x .tick-label').evaluateAll((els) => els.map((e) => ({ v: Number(e.getAttribute('data-value')), text: e.textContent ?? '' })));
  const steps125 = (vals: number[]) => {
    const d = vals.slice(1).map((v, i) => v - vals[i]!);
    const step = d[0]!;
    const m = step / Math.pow(10, Math.floor(Math.log10(step) + 1e-9));
    return d.every((x) => Math.abs(x - step) < step * 1e-6) && [1, 2, 5].some((k) => Math.abs(m - k) < 1e-6);
  };
  const inMm = await labels();
  expect(inMm.length).toBeGreaterThan(2);
  expect(steps125(inMm.map((l) => l.v))).toBe(true);
  // Labels say their value, without rounding it away.
  for (const l of inMm) expect(Number(l.text)).toBeCloseTo(l.v, 9);
  // Every label lies whole inside its ruler.
  for (const axis of ['x', 'y']) {
    const box = (await page.locator(`.ruler-${axis}`).boundingBox())!;
    for (const b of await page.locator(`.ruler-${axis} .tick-label`).evaluateAll((els) => els.map((e) => { const r = e.getBoundingClientRect(); return { l: r.left, r: r.right, t: r.top, b: r.bottom }; }))) {
      expect(b.l).toBeGreaterThanOrEqual(box.x - 0.5);
      expect(b.r).toBeLessThanOrEqual(box.x + box.width + 0.5);
      expect(b.t).toBeGreaterThanOrEqual(box.y - 0.5);
      expect(b.b).toBeLessThanOrEqual(box.y + box.height + 0.5);
    }
  }
  // The unit label is visible: nothing covers it.
  const unit = await centreOf(page.getByTestId('ruler-unit'));
  expect(await page.evaluate(({ x, y }) => document.elementFromPoint(x, y)?.closest('.ruler-corner') !== null, unit)).toBe(true);

  await page.getByTestId('units').click();
  await expect(page.getByTestId('ruler-unit')).toHaveText('mil');
  const inMil = await labels();
  expect(steps125(inMil.map((l) => l.v))).toBe(true);
  for (const l of inMil) expect(Number.isInteger(l.v)).toBe(true);
  // Each mil tick sits where its value in millimetres (× 0.0254) is on the board.
  const pos = await page.locator('.ruler-x .tick-label').evaluateAll((els) => els.map((e) => Number(e.getAttribute('x'))));
  const rx = (await page.locator('.ruler-x').boundingBox())!.x;
  inMil.forEach((l, i) => expect(Math.abs(rx + pos[i]! - mmRuler.toScreen(l.v * 0.0254, 0).x)).toBeLessThan(0.5));
  // A view setting: the design is not marked unsaved and there is nothing to undo.
  await expect(page.getByTestId('dirty')).toHaveCount(0);
  await expect(page.getByTestId('undo')).toBeDisabled();
});
