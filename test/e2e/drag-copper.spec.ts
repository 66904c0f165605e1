/**
 * Dragging a bend of a corporate feed with the mouse, as a person does: while the pointer moves, the copper below the
 * bend is drawn once and moved as one layer (BoardController's moving svg); it must land where the true copper is.
 * When the button is released the worker lays the settled design out afresh (core pipeline), and every piece's copper
 * must match what was on screen at the last move to 1e-9 m (1e-6 mm). One Ctrl+Z takes the whole drag back.
 * Checks: the settled copper is the project's own fresh layout (sizing and outlines from scratch in the worker), the
 * outside reference for the moved layer is the SVG/CSS meaning of a translation (W3C SVG 1.1 §7.6 "translate(tx ty)"
 * is the matrix [1 0 0 1 tx ty]; CSS Transforms Level 1 `translate()` the same in CSS pixels).
 */
import { expect, test, type Page } from '@playwright/test';
import { corporateFeed, serializeDesign } from '../../core/index.ts';

/** Every piece's copper as drawn: its path's bounding box in board mm, the moved layer's drift added. */
async function drawnCopper(page: Page): Promise<Map<string, { box: number[]; moved: boolean }>> {
  const rows = (await page.evaluate(`(() => {
    const moving = document.querySelector('[data-testid="board-moving"]');
    const drift = (moving.getAttribute('data-drift-mm') || '0 0').split(' ').map(Number);
    // Board mm → page px of the board's own world layer (its view transform), for what the browser shows.
    const m = document.querySelector('[data-testid="board-canvas"] .world').getScreenCTM();
    return [...document.querySelectorAll('[data-piece]')].map((el) => {
      const moved = moving.contains(el);
      const r = el.getBoundingClientRect();
      return { id: el.getAttribute('data-piece'), d: el.getAttribute('d'), moved, dx: moved ? drift[0] : 0, dy: moved ? drift[1] : 0,
        screen: [r.left, r.top, r.right, r.bottom], ctm: [m.a, m.b, m.c, m.d, m.e, m.f] };
    });
  })()`)) as { id: string; d: string; moved: boolean; dx: number; dy: number; screen: number[]; ctm: number[] }[];
  const out = new Map<string, { box: number[]; moved: boolean }>();
  for (const r of rows) {
    const n = (r.d.match(/-?\d+(\.\d+)?(e-?\d+)?/g) ?? []).map(Number);
    const xs = n.filter((_, i) => i % 2 === 0).map((x) => x + r.dx), ys = n.filter((_, i) => i % 2 === 1).map((y) => y + r.dy);
    const box = [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
    // On screen the piece is where its board box maps to (the layer's CSS transform included), to half a pixel.
    const [a, , , d, e, f] = r.ctm as [number, number, number, number, number, number];
    const want = [a * box[0]! + e, d * box[3]! + f, a * box[2]! + e, d * box[1]! + f];
    want.forEach((v, i) => expect(Math.abs(v - r.screen[i]!), `${r.id} on screen [${i}]`).toBeLessThan(0.5));
    out.set(r.id, { box, moved: r.moved });
  }
  return out;
}

const settled = async (page: Page) => page.evaluate(`(() => {
  const svg = document.querySelector('[data-testid="board-canvas"]');
  const moving = document.querySelector('[data-testid="board-moving"]');
  return svg.getAttribute('data-copper-revision') === svg.getAttribute('data-revision') && moving.querySelectorAll('[data-piece]').length === 0;
})()`);

function expectSameCopper(a: Map<string, { box: number[] }>, b: Map<string, { box: number[] }>): void {
  expect([...a.keys()].sort()).toEqual([...b.keys()].sort());
  for (const [id, { box }] of a) box.forEach((v, i) => expect(Math.abs(v - b.get(id)!.box[i]!), `${id} [${i}]`).toBeLessThan(1e-6));
}

test('a dragged bend: the moved copper lands on the true copper, and the drag is one undo step', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  const doc = corporateFeed({ outputs: 8, pitch: 12e-3 });
  await page.getByTestId('menu-file').click();
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('menu-file.open').click();
  await (await chooser).setFiles({ name: 'feed8.json', mimeType: 'application/json', buffer: Buffer.from(serializeDesign(doc)) });
  await expect(page.getByTestId('design-name')).toContainText('8-way');
  await expect.poll(() => settled(page), { timeout: 30_000 }).toBe(true);
  const before = await drawnCopper(page);

  await page.keyboard.press('v');
  const bend = doc.nodes.find((n) => n.kind === 'vertex')!.id;
  const box = (await page.locator(`[data-node="${bend}"]`).boundingBox())!;
  const x0 = box.x + box.width / 2, y0 = box.y + box.height / 2;
  await page.mouse.move(x0, y0);
  await page.mouse.down();
  for (let k = 1; k <= 12; k++) await page.mouse.move(x0 + k * 3, y0 + (k % 3), { steps: 1 });
  // The last move's copper, as on screen with the button still down.
  await expect.poll(() => page.evaluate(`(() => { const s = document.querySelector('[data-testid="board-canvas"]'); return s.getAttribute('data-copper-revision') === s.getAttribute('data-revision'); })()`)).toBe(true);
  const during = await drawnCopper(page);
  const moved = [...during.values()].filter((p) => p.moved).length;
  // The copper below the bend moved as one layer (not as new path text per piece).
  expect(moved).toBeGreaterThan(4);
  await page.mouse.up();

  await expect.poll(() => settled(page), { timeout: 30_000 }).toBe(true);
  const after = await drawnCopper(page);
  expectSameCopper(during, after);
  // Something did move: the drag is not a no-op.
  expect([...after].some(([id, p]) => Math.abs(p.box[0]! - before.get(id)!.box[0]!) > 1e-3)).toBe(true);

  await page.keyboard.press('Control+z');
  await expect.poll(() => settled(page), { timeout: 30_000 }).toBe(true);
  expectSameCopper(await drawnCopper(page), before);
  // One step: nothing is left to undo (the design was opened from a file with no history).
  await expect(page.getByTestId('undo')).toBeDisabled();
  expect(errors).toEqual([]);
});
