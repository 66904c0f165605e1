/**
 * What a person uses to find places on the board: the rulers (read like a ruler: two labelled ticks give the scale
 * and the origin) and the drawn marks of nodes and lines. Also a counter of a person's actions (a click, a drag, a
 * key chord, one field committed) for the tests that bound how much work a job takes.
 */
import { expect, type Locator, type Page } from '@playwright/test';

export interface Ruler { toScreen(xMm: number, yMm: number): { x: number; y: number } }

async function ticks(page: Page, axis: 'x' | 'y'): Promise<{ pos: number; value: number }[]> {
  const svg = page.locator(`.ruler-${axis}`);
  const box = (await svg.boundingBox())!;
  const labels = await svg.locator('.tick-label').evaluateAll((els) => els.map((e) => ({
    value: Number(e.getAttribute('data-value')),
    x: Number(e.getAttribute('x')),
    t: e.getAttribute('transform') ?? '',
  })));
  return labels.map((l) => ({ value: l.value, pos: axis === 'x' ? box.x + l.x : box.y + Number(/translate\(\S+ ([-\d.e]+)\)/.exec(l.t)![1]) }));
}

/** Board millimetres → page pixels, read off the two rulers (the display unit must be mm). */
export async function readRulers(page: Page): Promise<Ruler> {
  await expect(page.getByTestId('ruler-unit')).toHaveText('mm');
  const xs = await ticks(page, 'x'), ys = await ticks(page, 'y');
  if (xs.length < 2 || ys.length < 2) throw new Error('the rulers show fewer than two labels');
  const kx = (xs.at(-1)!.pos - xs[0]!.pos) / (xs.at(-1)!.value - xs[0]!.value);
  const ky = (ys.at(-1)!.pos - ys[0]!.pos) / (ys.at(-1)!.value - ys[0]!.value);
  return { toScreen: (x, y) => ({ x: xs[0]!.pos + (x - xs[0]!.value) * kx, y: ys[0]!.pos + (y - ys[0]!.value) * ky }) };
}

/** The centre of a drawn mark; marks are redrawn when the layout lands, so wait until one is there. */
export async function centreOf(loc: Locator): Promise<{ x: number; y: number }> {
  let box: Awaited<ReturnType<Locator['boundingBox']>> = null;
  await expect.poll(async () => { box = await loc.boundingBox().catch(() => null); return box !== null; }, { timeout: 10_000 }).toBe(true);
  const b = box!;
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

export const nodeMark = (page: Page, id: string) => page.locator(`[data-node="${id}"]`);
export const lineMark = (page: Page, id: string) => page.locator(`[data-seg="${id}"]`);

/** A new, empty design (File → New). */
export async function newDesign(page: Page, act?: Actions): Promise<void> {
  await (act ? act.click(page.getByTestId('menu-file')) : page.getByTestId('menu-file').click());
  await (act ? act.click(page.getByTestId('menu-file.new')) : page.getByTestId('menu-file.new').click());
  await expect(page.getByTestId('design-name')).toHaveText('Untitled feed');
}

/** Counts what a person does: each click, drag, key chord and committed field is one action. */
export class Actions {
  count = 0;
  readonly log: string[] = [];
  constructor(private readonly page: Page) {}
  private note(what: string): void { this.count++; this.log.push(what); }
  async click(target: Locator | { x: number; y: number }, what = ''): Promise<void> {
    this.note(`click ${what}`);
    if ('x' in target) await this.page.mouse.click(target.x, target.y);
    else await target.click();
  }
  async key(chord: string): Promise<void> { this.note(`key ${chord}`); await this.page.keyboard.press(chord); }
  /** Types into a field and commits it with Enter: one action. */
  async field(loc: Locator, text: string): Promise<void> { this.note(`field ${text}`); await loc.fill(text); await loc.press('Enter'); }
  async choose(loc: Locator, value: string): Promise<void> { this.note(`choose ${value}`); await loc.selectOption(value); }
}
