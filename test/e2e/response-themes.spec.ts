/**
 * The response and the measured data at 1366×768, in the light and the dark theme, as a person meets them on the
 * demo (a four-way feed whose ports are named "input", "patch 1" … "patch 4"):
 * - the response plot is at least 240 px tall with the solver's notes closed and open, and the Smith chart lies whole
 *   inside the window, the dock and its own column (nothing of it clipped or scrolled away);
 * - the legend and the marker table name ports by their labels, and say which traces coincide;
 * - on the Measured tab, with a file loaded, every label is readable: its text contrast against the background it
 *   is painted on is at least 4.5:1, the WCAG 2.1 minimum for normal text (W3C, Web Content Accessibility Guidelines
 *   2.1, success criterion 1.4.3), with the contrast ratio and relative luminance as WCAG 2.1 defines them; the
 *   measured traces are dashed, their legend says "measured" and which traces coincide, and the plots are at least
 *   240 px tall.
 */
import { readmeShot } from './readme-shots.ts';
import { expect, test, type Locator, type Page } from '@playwright/test';
import { join } from 'node:path';

const FILE = join(import.meta.dirname, '..', 'fixtures', 'measured', 'demo-board.s5p');
const THEMES = ['light', 'dark'] as const;

async function openDemo(page: Page, theme: (typeof THEMES)[number]): Promise<void> {
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  const dark = async () => /\bdark\b/.test((await page.locator('html').getAttribute('class')) ?? '');
  if ((await dark()) !== (theme === 'dark')) await page.getByTestId('theme').click();
  await expect.poll(dark).toBe(theme === 'dark');
}

type Box = { x: number; y: number; width: number; height: number };
const box = async (l: Locator): Promise<Box> => (await l.boundingBox())!;
function expectInside(inner: Box, outer: Box, what: string): void {
  const slack = 0.5;
  expect(inner.x, `${what}: left edge`).toBeGreaterThanOrEqual(outer.x - slack);
  expect(inner.y, `${what}: top edge`).toBeGreaterThanOrEqual(outer.y - slack);
  expect(inner.x + inner.width, `${what}: right edge`).toBeLessThanOrEqual(outer.x + outer.width + slack);
  expect(inner.y + inner.height, `${what}: bottom edge`).toBeLessThanOrEqual(outer.y + outer.height + slack);
}

/**
 * Every visible element under `root` that paints text of its own: its text colour and the colour behind it (the
 * nearest ancestor's opaque background, with translucent ones composited over it), and their WCAG 2.1 contrast ratio
 * (relative luminance of sRGB: channel c/255 linearised as c/12.92 at or below 0.03928, else ((c+0.055)/1.055)^2.4;
 * L = 0.2126 R + 0.7152 G + 0.0722 B; ratio (L1 + 0.05)/(L2 + 0.05)).
 */
async function textContrasts(root: Locator): Promise<{ text: string; fg: string; bg: string; ratio: number }[]> {
  return root.evaluate((el) => {
    const parse = (c: string): [number, number, number, number] => {
      const m = /rgba?\(([^)]+)\)/.exec(c);
      if (!m) return [0, 0, 0, 0];
      const p = m[1]!.split(/[\s,/]+/).filter(Boolean).map(Number);
      return [p[0]!, p[1]!, p[2]!, p.length > 3 ? p[3]! : 1];
    };
    const over = (top: number[], under: number[]) => [0, 1, 2].map((k) => top[k]! * top[3]! + under[k]! * (1 - top[3]!)).concat(1);
    const background = (e: Element | null): number[] => {
      const layers: number[][] = [];
      for (let n = e; n; n = n.parentElement) {
        const c = parse(getComputedStyle(n).backgroundColor);
        if (c[3] > 0) { layers.push(c); if (c[3] >= 1) break; }
      }
      let acc = [255, 255, 255, 1];
      for (const l of layers.reverse()) acc = over(l, acc);
      return acc;
    };
    const lum = (c: number[]) => {
      const lin = c.slice(0, 3).map((v) => { const s = v / 255; return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4; });
      return 0.2126 * lin[0]! + 0.7152 * lin[1]! + 0.0722 * lin[2]!;
    };
    const out: { text: string; fg: string; bg: string; ratio: number }[] = [];
    for (const e of [el, ...el.querySelectorAll('*')]) {
      const own = [...e.childNodes].filter((n) => n.nodeType === Node.TEXT_NODE).map((n) => n.textContent ?? '').join('').trim();
      if (!own) continue;
      const r = e.getBoundingClientRect(), cs = getComputedStyle(e);
      if (r.width === 0 || r.height === 0 || cs.visibility === 'hidden' || cs.display === 'none') continue;
      // SVG text (the Smith chart's circle labels) is painted with its fill, HTML text with its colour.
      const bg = background(e), fg = over(parse(e instanceof SVGElement ? cs.fill : cs.color), bg);
      const a = lum(fg), b = lum(bg);
      out.push({ text: own.slice(0, 40), fg: cs.color, bg: `rgb(${bg.slice(0, 3).map(Math.round).join(', ')})`, ratio: (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05) });
    }
    return out;
  });
}

for (const theme of THEMES) {
  test(`response at 1366×768, ${theme}: tall plot with notes open or closed, whole Smith chart, ports by their labels`, async ({ page }) => {
    await openDemo(page, theme);
    await page.getByTestId('dock-response').click();
    await expect(page.getByTestId('f0-S21')).toBeVisible({ timeout: 30_000 });
    const notes = page.getByText(/notes? from the solver/);
    for (const open of [false, true]) {
      if (open && (await notes.count())) await notes.click();
      expect((await box(page.getByTestId('response-plot'))).height, `plot height, notes ${open ? 'open' : 'closed'}`).toBeGreaterThanOrEqual(240);
      const smith = await box(page.getByTestId('smith'));
      expect(smith.width).toBeGreaterThan(200);
      expectInside(smith, { x: 0, y: 0, width: 1366, height: 768 }, 'Smith chart in the window');
      expectInside(smith, await box(page.getByTestId('dock')), 'Smith chart in the dock');
      expectInside(smith, await box(page.getByTestId('smith').locator('xpath=ancestor::div[contains(@class,"side")][1]')), 'Smith chart in its column');
    }
    // Ports by their labels in the legend and the chips; the four outputs of the even split coincide and say so.
    await expect(page.getByTestId('legend-S21')).toContainText('input → patch 1');
    await expect(page.getByTestId('legend-S51')).toContainText('input → patch 4');
    await expect(page.getByTestId('pick-S11')).toContainText('at input');
    await expect(page.getByTestId('same-S31')).toContainText('S21');
    // The panel's words are readable in this theme too (WCAG 2.1 contrast, as for the measured tab below).
    const words = await textContrasts(page.getByTestId('response-panel'));
    expect(words.length).toBeGreaterThan(20);
    const low = words.filter((c) => c.ratio < 4.5);
    expect(low, `text below 4.5:1 in the ${theme} theme`).toEqual([]);
    await readmeShot(page, `response-demo-${theme}.png`);
  });

  test(`measured tab at 1366×768, ${theme}: readable labels, dashed measured traces named "measured"`, async ({ page }) => {
    await openDemo(page, theme);
    await page.getByTestId('dock-measured').click();
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('measured-load').click();
    await (await chooser).setFiles(FILE);
    await expect(page.getByTestId('compare-table')).toBeVisible({ timeout: 30_000 });
    // One legend for both plots names each S-parameter's ports by label, with a solid simulated and a dashed
    // measured swatch (the same pattern the plot strokes with).
    await expect(page.getByTestId('measured-legend-S21')).toContainText('input → patch 1');
    await expect(page.getByTestId('legend-S21 measured')).toContainText('measured');
    await expect(page.getByTestId('legend-S21 simulated')).toContainText('simulated');
    expect(await page.getByTestId('legend-S21 measured').locator('line').getAttribute('stroke-dasharray')).toMatch(/^\d+ \d+$/);
    expect(await page.getByTestId('legend-S21 simulated').locator('line').getAttribute('stroke-dasharray')).toBe('');
    // The fixture's outputs 2 to 4 are all 0.9× the design (test/fixtures/measured/README.md), so their measured traces
    // lie on one another, and the legend says so.
    await expect(page.getByTestId('legend-S51 measured')).toContainText(/= S\d1 measured/);
    // Every legend entry is inside the panel, not cut off below it.
    const panel = await box(page.getByTestId('measured-panel'));
    for (const e of await page.getByTestId('measured-legend').locator('.lg').all()) expectInside(await box(e), panel, `legend ${await e.textContent()}`);
    expect((await box(page.getByTestId('measured-overlay'))).height).toBeGreaterThanOrEqual(240);
    // Port map and table name the design's ports by their labels.
    await expect(page.getByTestId('port-map-1').locator('option:checked')).toHaveText('input');
    await expect(page.getByTestId('compare-row-S21')).toContainText('patch 1←input');
    const words = await textContrasts(page.getByTestId('measured-panel'));
    expect(words.length).toBeGreaterThan(20);
    const low = words.filter((c) => c.ratio < 4.5);
    expect(low, `text below 4.5:1 in the ${theme} theme`).toEqual([]);
    await readmeShot(page, `measured-${theme}.png`);
  });
}
