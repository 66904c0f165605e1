/**
 * SVG board drawing and photo mask, checked by rasterising with resvg at an exact pixel grid (the project's own rule)
 * and by xmllint for well-formedness. Scale rule: CSS Values and Units (absolute lengths), 1 in = 96 px = 25.4 mm, so a
 * file in mm with a matching viewBox renders at true size in any viewer.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { toSvg } from '../../core/export/svg.ts';
import { toMask } from '../../core/export/mask.ts';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { InputError } from '../../core/util/errors.ts';
import { darkArea, isDark, rasterise } from '../../scripts/oracles/svg-raster.ts';
import { boardFixture, stripOnlyFixture, rectMm } from '../fixtures/export/hand-made.ts';

beforeAll(() => initPolygons());

function xmllint(text: string): number | null {
  return spawnSync('xmllint', ['--noout', '-'], { input: text, encoding: 'utf8' }).status;
}

/** Dark run along one pixel row, in mm from the image's left edge. */
function darkRuns(png: ReturnType<typeof rasterise>, yMm: number, pxPerMm: number): [number, number][] {
  const y = Math.round(yMm * pxPerMm);
  const runs: [number, number][] = [];
  let start = -1;
  for (let x = 0; x <= png.width; x++) {
    const d = x < png.width && isDark(png, x, y);
    if (d && start < 0) start = x;
    if (!d && start >= 0) { runs.push([start / pxPerMm, x / pxPerMm]); start = -1; }
  }
  return runs;
}

describe('SVG board drawing', () => {
  it('states width and height in mm with a matching viewBox, and is well-formed XML (xmllint)', () => {
    const svg = toSvg(boardFixture());
    expect(svg).toMatch(/<svg [^>]*width="54mm" height="44mm" viewBox="0 0 54 44"/); // 50 × 40 board + 2 mm margins
    expect(xmllint(svg)).toBe(0);
    expect(xmllint(svg.replace('</svg>', ''))).not.toBe(0); // the oracle can fail
  });
  it('has one group per layer with readable ids', () => {
    const ids = [...toSvg(boardFixture()).matchAll(/<g id="([^"]+)"/g)].map((m) => m[1]);
    expect(ids).toEqual(['clear-area', 'ground-copper', 'copper', 'keepout', 'board-edge', 'drills']);
  });
  it('renders a known feature true to size: the 10 × 2 mm strip measures 10.00 × 2.00 mm at 50 px/mm', () => {
    const svg = toSvg(stripOnlyFixture(), { layers: ['copper'], marginMm: 1 });
    const a = darkArea(svg.replace(/fill="#b87333"/, 'fill="#000"'), 50);
    expect(a.bbox).not.toBeNull();
    expect(a.bbox!.x0).toBeCloseTo(1, 2);
    expect(a.bbox!.x1 - a.bbox!.x0).toBeCloseTo(10, 2);
    expect(a.bbox!.y1 - a.bbox!.y0).toBeCloseTo(2, 2);
  });
  it('puts y up: a tab above the strip appears at the top of the picture', () => {
    const g = stripOnlyFixture(); // strip 10…20 × 20…22 mm
    g.copper.push({ outer: rectMm(10, 22, 11, 23), holes: [] }); // 1 × 1 mm tab on top of its left end
    g.extent = { ...g.extent, maxY: 23e-3 };
    const png = rasterise(toSvg(g, { layers: ['copper'], marginMm: 0 }).replace(/fill="#b87333"/, 'fill="#000"'), 20);
    expect(darkRuns(png, 0.5, 20)).toEqual([[0, 1]]); // SVG row 0.5 mm = board y 22.5 mm: only the tab
    expect(darkRuns(png, 2, 20)).toEqual([[0, 10]]); // SVG row 2 mm = board y 21 mm: the strip
  });
  it('mirror puts a left-hand feature on the right', () => {
    const g = boardFixture();
    const plain = rasterise(toSvg(g, { layers: ['copper'], marginMm: 0 }).replace(/fill="#b87333"/, 'fill="#000"'), 20);
    const mir = rasterise(toSvg(g, { layers: ['copper'], marginMm: 0, mirror: true }).replace(/fill="#b87333"/, 'fill="#000"'), 20);
    // Row at board y = 10.8 mm (SVG y = 29.2 mm, above the miter): the bend's leg spans x 5…21 mm; mirrored 29…45 mm.
    expect(darkRuns(plain, 29.2, 20)).toEqual([[5, 21]]);
    expect(darkRuns(mir, 29.2, 20)).toEqual([[29, 45]]);
  });
  it('outline style fills nothing', () => {
    const svg = toSvg(boardFixture(), { style: 'outline' });
    expect(svg).not.toMatch(/fill="#/);
    expect(() => toSvg(boardFixture(), { style: 'hatched' as 'filled' })).toThrow(InputError);
  });
});

describe('Photo mask', () => {
  const PX = 600 / 25.4; // 600 dpi, a common laser-printer resolution
  it('draws a scale bar that measures 100 mm and the strip at its true width, at 600 dpi', () => {
    const m = toMask(stripOnlyFixture(), { page: 'a4' });
    const png = rasterise(m.svg, PX);
    const bar = darkRuns(png, m.layout.scaleBar.y + 0.5, PX);
    expect(bar.length).toBe(1);
    expect(bar[0][1] - bar[0][0]).toBeCloseTo(100, 1); // one 600-dpi pixel is 0.042 mm
    const b = m.layout.board;
    const strip = darkRuns(png, b.y + 1, PX); // middle of the 2 mm tall strip
    expect(strip.length).toBe(1);
    expect(strip[0][1] - strip[0][0]).toBeCloseTo(10, 1);
    expect(m.svg).toMatch(/width="210mm" height="297mm" viewBox="0 0 210 297"/);
    expect(xmllint(m.svg)).toBe(0);
  });
  it('Letter page is 215.9 × 279.4 mm (8.5 × 11 in)', () => {
    expect(toMask(stripOnlyFixture(), { page: 'letter' }).svg).toMatch(/width="215.9mm" height="279.4mm"/);
  });
  it('negative polarity makes copper clear inside an opaque field; positive the other way', () => {
    const g = boardFixture();
    const pos = toMask(g, { polarity: 'positive' }), neg = toMask(g, { polarity: 'negative' });
    const at = (m: typeof pos, xMm: number, yMm: number) => isDark(rasterise(m.svg, 10), Math.round((m.layout.board.x + xMm) * 10), Math.round((m.layout.board.y + 40 - yMm) * 10));
    // Strip centre (37.5, 16) is network copper; (10, 20) lies in a ground window away from the bend (no copper).
    expect(at(pos, 37.5, 16)).toBe(true);
    expect(at(pos, 10, 20)).toBe(false);
    expect(at(neg, 37.5, 16)).toBe(false);
    expect(at(neg, 10, 20)).toBe(true);
    expect(neg.svg).toContain('NEGATIVE');
  });
  it('etch bias widens the strip by twice the bias (0.1 mm per edge → 2.2 mm)', () => {
    const m = toMask(stripOnlyFixture(), { bias: 0.1e-3 });
    const png = rasterise(m.svg, PX);
    const x = m.layout.board.x + 5; // middle of the strip, board box unchanged by the bias
    const col: number[] = [];
    for (let y = 0; y < png.height; y++) if (isDark(png, Math.round(x * PX), y)) col.push(y);
    const inBoard = col.filter((y) => y / PX > m.layout.board.y - 1 && y / PX < m.layout.board.y + 3);
    expect((inBoard.length) / PX).toBeCloseTo(2.2, 1);
    expect(m.svg).toContain('etch bias +0.100 mm per edge');
  });
  it('refuses a board that does not fit the page, saying what fits and what to do', () => {
    const big = stripOnlyFixture();
    big.copper = [{ outer: rectMm(0, 0, 300, 100), holes: [] }];
    big.extent = { minX: 0, minY: 0, maxX: 0.3, maxY: 0.1 };
    try { toMask(big, { page: 'a4' }); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('page');
      expect((e as Error).message).toMatch(/300 × 100 mm.*try --page letter/);
    }
  });
  it('turns to landscape when only landscape fits (200 × 60 mm board on A4)', () => {
    const wide = stripOnlyFixture();
    wide.copper = [{ outer: rectMm(0, 0, 200, 60), holes: [] }];
    wide.extent = { minX: 0, minY: 0, maxX: 0.2, maxY: 0.06 };
    const m = toMask(wide, { page: 'a4' });
    expect(m.layout.page).toEqual({ w: 297, h: 210, landscape: true });
  });
});
