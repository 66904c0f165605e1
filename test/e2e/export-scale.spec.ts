/**
 * Exported SVG drawings and photo masks shown in Debian's Chromium come out at true size.
 * Scale rule: CSS Values and Units (absolute lengths) (1 in = 96 px = 25.4 mm), so a length in CSS px × 25.4 / 96 is mm.
 * Chromium lays out in 1/64 px (≈ 4 µm, from memory), well inside the 0.01 mm asked for.
 */
import { expect, test } from '@playwright/test';
import { toSvg } from '../../core/export/svg.ts';
import { toMask } from '../../core/export/mask.ts';
import { stripOnlyFixture, boardFixture } from '../fixtures/export/hand-made.ts';

const MM_PER_PX = 25.4 / 96;

test('a 10 × 2 mm strip in the exported SVG measures 10.00 × 2.00 mm, inline and as an image', async ({ page }) => {
  const svg = toSvg(stripOnlyFixture(), { layers: ['copper'], marginMm: 1 }).replace(/^<\?xml[^>]*>\n/, '');
  const dataUrl = `data:image/svg+xml;base64,${Buffer.from(svg).toString('base64')}`;
  await page.setContent(`<!doctype html><html><body style="margin:0">${svg}<img id="as-image" src="${dataUrl}"></body></html>`);
  await page.locator('#as-image').evaluate((img: HTMLImageElement) => img.decode());
  const m = await page.evaluate(() => {
    const r = document.querySelector('#copper path')!.getBoundingClientRect();
    const i = document.querySelector('#as-image')!.getBoundingClientRect();
    return { w: r.width, h: r.height, iw: i.width, ih: i.height };
  });
  expect(Math.abs(m.w * MM_PER_PX - 10)).toBeLessThan(0.01);
  expect(Math.abs(m.h * MM_PER_PX - 2)).toBeLessThan(0.01);
  // The whole drawing as an <img>: 10 × 2 mm strip plus 1 mm margins = 12 × 4 mm.
  expect(Math.abs(m.iw * MM_PER_PX - 12)).toBeLessThan(0.01);
  expect(Math.abs(m.ih * MM_PER_PX - 4)).toBeLessThan(0.01);
});

test('the photo mask page is A4 and its scale bar and the mitered bend measure true', async ({ page }) => {
  const mask = toMask(boardFixture(), { page: 'a4', mirror: true });
  const svg = mask.svg.replace(/^<\?xml[^>]*>\n/, '');
  await page.setContent(`<!doctype html><html><body style="margin:0">${svg}</body></html>`);
  const m = await page.evaluate(() => {
    const page = document.querySelector('svg')!.getBoundingClientRect();
    const bar = document.querySelector('#scale-bar-line')!.getBoundingClientRect();
    const copper = document.querySelector('#copper path')!.getBoundingClientRect();
    return { pw: page.width, ph: page.height, bar: bar.width, cw: copper.width, ch: copper.height };
  });
  expect(Math.abs(m.pw * MM_PER_PX - 210)).toBeLessThan(0.02);
  expect(Math.abs(m.ph * MM_PER_PX - 297)).toBeLessThan(0.02);
  expect(Math.abs(m.bar * MM_PER_PX - 100)).toBeLessThan(0.01);
  // All top copper together spans the ground copper box of the fixture: 46 × 36 mm.
  expect(Math.abs(m.cw * MM_PER_PX - 46)).toBeLessThan(0.01);
  expect(Math.abs(m.ch * MM_PER_PX - 36)).toBeLessThan(0.01);
});
