/**
 * The board's tools and commands with mouse and keyboard, in Debian chromium under the app's CSP.
 * Facts checked: a quarter-wave stub ends in a via when shorted (trade practice: a shorted stub is grounded
 * through a via); a whole drag is one undo step (our requirement); mm ↔ mil display (1 mil = 25.4 µm).
 * Also takes the README screenshots (written into docs/screenshots/ only by `npm run screenshots`; see readme-shots.ts).
 */
import { expect, test, type Page } from '@playwright/test';
import { readmeShot } from './readme-shots.ts';

const count = (page: Page, sel: string) => page.locator(sel).count();

async function lineMid(page: Page, id: string) {
  const b = await page.locator(`[data-seg="${id}"]`).boundingBox();
  if (!b) throw new Error(`line ${id} not drawn`);
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

async function nodeAt(page: Page, id: string) {
  const b = await page.locator(`[data-node="${id}"]`).boundingBox();
  if (!b) throw new Error(`node ${id} not drawn`);
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

async function openDemo(page: Page) {
  await page.goto('/');
  await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
  await page.locator('[data-piece]').first().waitFor();
}

test('the demo opens with true copper, and the overview screenshots', async ({ page }) => {
  await openDemo(page);
  expect(await count(page, '[data-piece]')).toBeGreaterThan(10);
  await page.getByTestId('dock-response').click();
  await expect(page.getByTestId('response-plot')).toBeVisible({ timeout: 30_000 });
  await page.getByTestId('board-canvas').hover();
  await readmeShot(page, 'editor-light.png');
  await page.getByTestId('dock-paths').click();
  await expect(page.getByTestId('path-ledger').locator('tbody tr')).toHaveCount(4);
  await page.getByTestId('theme').click();
  await expect(page.locator('html')).toHaveClass(/dark/);
  await page.mouse.move((await lineMid(page, 'qwl')).x, (await lineMid(page, 'qwl')).y);
  await expect(page.getByTestId('hover-readout')).toContainText('Z0');
  await readmeShot(page, 'editor-dark-paths.png');
});

test('zoom with keys and wheel, fit, and switch to mil', async ({ page }) => {
  await openDemo(page);
  const scale = async () => parseFloat((await page.getByTestId('status').locator('..').innerText()).match(/([\d.]+) px\/mm/)![1]!);
  const s0 = await scale();
  await page.getByTestId('board-canvas').focus();
  // The status line follows the view after the key is handled: poll it rather than read it once.
  await page.keyboard.press('=');
  await expect.poll(scale).toBeGreaterThan(s0);
  await page.keyboard.press('-');
  await page.keyboard.press('-');
  await expect.poll(scale).toBeLessThan(s0);
  const zoomedOut = await scale();
  const box = (await page.getByTestId('board-canvas').boundingBox())!;
  await page.mouse.move(box.x + 300, box.y + 200);
  await page.mouse.wheel(0, -400);
  // The wheel is handled after mouse.wheel returns: wait for its zoom before pressing the next key.
  await expect.poll(scale).not.toBe(zoomedOut);
  await page.keyboard.press('f');
  await expect.poll(async () => Math.abs((await scale()) - s0) / s0).toBeLessThan(0.05);
  await page.keyboard.press('u');
  await expect(page.locator('.ruler .unit-label').first()).toHaveText('mil');
  await expect(page.getByTestId('units')).toHaveText('mil');
});

test('a whole drag is one undo step; rotate, mirror, copy, paste and delete', async ({ page }) => {
  await openDemo(page);
  await page.keyboard.press('v');
  const p0 = await nodeAt(page, 'in');
  await page.mouse.move(p0.x, p0.y);
  await page.mouse.down();
  for (let k = 1; k <= 10; k++) await page.mouse.move(p0.x + k * 4, p0.y, { steps: 2 });
  await page.mouse.up();
  await expect.poll(async () => (await nodeAt(page, 'in')).x).toBeGreaterThan(p0.x + 20);
  await page.keyboard.press('Control+z');
  await expect.poll(async () => Math.round((await nodeAt(page, 'in')).x)).toBe(Math.round(p0.x));
  await page.keyboard.press('Control+Shift+z');
  await expect.poll(async () => (await nodeAt(page, 'in')).x).toBeGreaterThan(p0.x + 20);
  await page.keyboard.press('Control+z');

  // Box-select the left half, copy, paste: the design grows by the copied pieces.
  const segs = await count(page, '[data-seg]');
  const b = (await page.getByTestId('board-canvas').boundingBox())!;
  await page.mouse.move(b.x + 30, b.y + 30);
  await page.mouse.down();
  await page.mouse.move(b.x + b.width * 0.45, b.y + b.height - 20, { steps: 5 });
  await page.mouse.up();
  await expect(page.getByTestId('piece-sheet')).toContainText('items selected');
  await page.keyboard.press('Control+c');
  await page.keyboard.press('Control+v');
  await expect.poll(() => count(page, '[data-seg]')).toBeGreaterThan(segs);
  const pasted = await count(page, '[data-seg]');
  await page.keyboard.press('q'); // turn the pasted copy
  await page.keyboard.press('m'); // and mirror it
  await page.keyboard.press('Delete');
  await expect.poll(() => count(page, '[data-seg]')).toBe(segs);
  await page.keyboard.press('Control+z'); // delete undone
  await expect.poll(() => count(page, '[data-seg]')).toBe(pasted);
});

test('stubs, a width step, a taper, a part, a port and a board edge from the tool strip', async ({ page }) => {
  await page.goto('/');
  await page.getByTestId('menu-file').click();
  await page.getByTestId('menu-file.new').click();
  const b = (await page.getByTestId('board-canvas').boundingBox())!;
  const y = b.y + b.height / 2;
  await page.getByTestId('tool-port').click();
  await page.mouse.click(b.x + 100, y);
  await page.getByTestId('tool-route').click();
  await page.mouse.click(b.x + 100, y);
  await page.mouse.click(b.x + b.width - 100, y);
  await page.keyboard.press('Enter');
  await expect.poll(() => count(page, '[data-seg]')).toBe(1);

  await page.getByTestId('tool-stub-open').click();
  await page.mouse.click(b.x + 250, y - 2);
  await expect.poll(() => count(page, '[data-node]')).toBe(4); // port, end, tee, stub end
  await page.getByTestId('tool-stub-short').click();
  await page.mouse.click(b.x + 400, y + 2);
  await expect.poll(() => count(page, '.node-short')).toBe(1);
  await expect.poll(() => count(page, '.drill')).toBe(1); // the shorted stub ends in a via
  const beforeStep = await count(page, '[data-seg]');
  await page.getByTestId('tool-step').click();
  await page.mouse.click(b.x + 550, y);
  await expect(page.getByTestId('status')).not.toContainText('Not done');
  await expect.poll(() => count(page, '[data-seg]')).toBe(beforeStep + 1);
  await page.getByTestId('tool-taper').click();
  await page.mouse.click(b.x + 650, y);
  await expect.poll(() => count(page, '.cl-taper')).toBe(1);
  await page.getByTestId('tool-part').click();
  await page.mouse.click(b.x + 180, y);
  await expect.poll(() => count(page, '.cl-lumped')).toBe(1);
  await page.keyboard.press('b');
  for (const [dx, dy] of [[60, 60], [b.width - 60, 60], [b.width - 60, b.height - 60], [60, b.height - 60]]) await page.mouse.click(b.x + dx, b.y + dy);
  await page.keyboard.press('Enter');
  await expect(page.locator('.board-outline')).toHaveCount(1);
  // Every one of these was one step: undo them all back to the single run.
  for (let i = 0; i < 6; i++) await page.keyboard.press('Control+z');
  await expect.poll(() => count(page, '[data-seg]')).toBe(1);
});

test('the command finder runs any command by name', async ({ page }) => {
  await openDemo(page);
  await page.keyboard.press('Control+k');
  await expect(page.getByTestId('command-finder')).toBeVisible();
  await page.keyboard.type('theme');
  await readmeShot(page, 'command-finder.png');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('command-finder')).toHaveCount(0);
  await expect(page.locator('html')).toHaveClass(/dark/);
});

test('ground copper and keep-out areas: draw, select, set the clearance, delete', async ({ page }) => {
  await openDemo(page);
  const b = (await page.getByTestId('board-canvas').boundingBox())!;
  const before = await count(page, '.area-ground');
  await page.keyboard.press('k');
  for (const [dx, dy] of [[40, 40], [160, 40], [160, 120], [40, 120]]) await page.mouse.click(b.x + dx, b.y + dy);
  await page.keyboard.press('Enter');
  await expect(page.locator('.area-keepout')).toHaveCount(1);
  await page.keyboard.press('v');
  await page.mouse.click(b.x + 100, b.y + 80);
  await expect(page.getByTestId('piece-sheet')).toContainText('keep-out area');
  await page.getByTestId('field-area-kind').selectOption('ground-copper');
  await expect(page.locator('.area-ground')).toHaveCount(before + 1);
  await page.getByTestId('field-clearance').fill('2 mm');
  await page.getByTestId('field-clearance').press('Enter');
  await page.getByTestId('board-canvas').focus();
  await page.keyboard.press('Delete');
  await expect(page.locator('.area-ground')).toHaveCount(before);
});

test('the two-way divider example: response with isolation, and its screenshot', async ({ page }) => {
  await openDemo(page);
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-wilkinson-2g45').click();
  await expect(page.getByTestId('design-name')).toContainText('2.45 GHz');
  await page.getByTestId('dock-response').click();
  await expect(page.getByTestId('f0-S32')).toBeVisible({ timeout: 30_000 });
  await page.mouse.move(10, 300);
  await readmeShot(page, 'divider-response.png');
});

test('the snap grid can be chosen in the status line and frames the selection with Shift+F', async ({ page }) => {
  await openDemo(page);
  await page.getByTestId('grid-step').selectOption({ label: '1 mm' });
  await expect(page.getByTestId('grid-step')).toHaveValue('0.001');
  await page.getByTestId('tab-pieces').click();
  await page.getByTestId('piece-row-qwl').click();
  const scale = async () => parseFloat((await page.getByTestId('status').locator('..').innerText()).match(/([\d.]+) px\/mm/)![1]!);
  const framed = await scale();
  await page.getByTestId('board-canvas').focus();
  await page.keyboard.press('f');
  await expect.poll(scale).toBeLessThan(framed);
  await page.keyboard.press('Shift+F');
  await expect.poll(scale).toBeCloseTo(framed, 1);
});

test('a part takes measured data from a Touchstone file chosen in the piece sheet, and the response follows', async ({ page }) => {
  // Series 100 Ω between 50 Ω ports: S11 = S22 = Z/(Z + 2Z0) = 0.5, S21 = S12 = 2Z0/(Z + 2Z0) = 0.5
  // (D. M. Pozar, Microwave Engineering, 4th ed., §4.4); written here for the test.
  const s2p = ['! series 100 ohm', '# GHz S RI R 50', ...[1, 2, 3, 4].map((f) => `${f} 0.5 0 0.5 0 0.5 0 0.5 0`)].join('\n');
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await openDemo(page);
  await page.getByTestId('menu-examples').click();
  await page.getByTestId('example-wilkinson-2g45').click();
  await expect(page.getByTestId('design-name')).toContainText('2.45 GHz');
  await page.getByTestId('tab-pieces').click();
  await page.getByTestId('piece-row-r1').click();
  await page.getByTestId('tab-sheet').click();
  const choose = async (name: string, text: string) => {
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('load-touchstone').click();
    await (await chooser).setFiles({ name, mimeType: 'text/plain', buffer: Buffer.from(text) });
  };
  await choose('bad.s2p', 'hello');
  await expect(page.getByTestId('touchstone-error')).toContainText('bad.s2p');
  await choose('r100.s2p', s2p);
  await expect(page.getByTestId('block-summary')).toContainText('2-port data, 4 points from 1 GHz to 4 GHz');
  await page.getByTestId('dock-response').click();
  await expect(page.getByTestId('f0-S32')).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId('response-error')).toHaveCount(0);
  await page.keyboard.press('Control+z');
  await page.getByTestId('tab-pieces').click();
  await page.getByTestId('piece-row-r1').click();
  await page.getByTestId('tab-sheet').click();
  await expect(page.getByTestId('field-part')).toBeVisible();
  expect(errors).toEqual([]);
});
