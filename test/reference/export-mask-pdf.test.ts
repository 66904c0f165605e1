/**
 * The photo mask as PDF, read by an outside implementation: poppler's pdfinfo (page size) and pdftoppm (rendering
 * at 600 dpi), Debian package poppler-utils (installed by .ci/run). The printed scale is measured in the rendered
 * pixels: the 100 mm scale bar and the 10 mm strip of the fixture, the same checks the SVG sheet passes in
 * export-svg.test.ts. Any syntax complaint from poppler fails the test.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { toMask } from '../../core/export/mask.ts';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { boardFixture, stripOnlyFixture } from '../fixtures/export/hand-made.ts';

beforeAll(() => initPolygons());
const dir = mkdtempSync(join(tmpdir(), 'sw-pdf-'));
const DPI = 600, PX = DPI / 25.4;

function need(tool: string): void {
  if (spawnSync('sh', ['-c', `command -v ${tool}`]).status !== 0) throw new Error(`${tool} not found: apt-get install poppler-utils (see .ci/run)`);
}

/** Renders page 1 to 8-bit grey (PGM P5) and returns it. */
function render(pdf: string, name: string): { w: number; h: number; px: Uint8Array; stderr: string } {
  need('pdftoppm');
  const file = join(dir, `${name}.pdf`);
  writeFileSync(file, pdf, 'latin1');
  const r = spawnSync('pdftoppm', ['-r', String(DPI), '-gray', '-singlefile', file, join(dir, name)], { encoding: 'utf8' });
  expect(r.status, r.stderr).toBe(0);
  const buf = readFileSync(join(dir, `${name}.pgm`));
  // P5 header: "P5\n<w> <h>\n<max>\n" then one byte per pixel (Netpbm PGM format).
  const m = /^P5\s+(\d+)\s+(\d+)\s+(\d+)\s/.exec(buf.subarray(0, 40).toString('latin1'))!;
  const start = m[0].length;
  return { w: Number(m[1]), h: Number(m[2]), px: buf.subarray(start), stderr: r.stderr };
}

function runs(img: { w: number; px: Uint8Array }, yMm: number): [number, number][] {
  const y = Math.round(yMm * PX), out: [number, number][] = [];
  let s = -1;
  for (let x = 0; x <= img.w; x++) {
    const dark = x < img.w && img.px[y * img.w + x] < 128;
    if (dark && s < 0) s = x;
    if (!dark && s >= 0) { out.push([s / PX, x / PX]); s = -1; }
  }
  return out;
}

describe('photo mask as PDF (poppler)', () => {
  it('is an A4 page (595.276 × 841.89 pt) with no syntax complaints', () => {
    need('pdfinfo');
    const file = join(dir, 'info.pdf');
    writeFileSync(file, toMask(stripOnlyFixture()).pdf, 'latin1');
    const r = spawnSync('pdfinfo', [file], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout).toMatch(/Page size:\s+595\.276 x 841\.89 pts \(A4\)/); // ISO 216: 210 × 297 mm
    expect(r.stdout).toMatch(/Pages:\s+1/);
  });

  it('Letter is 612 × 792 pt (8.5 × 11 in)', () => {
    const file = join(dir, 'letter.pdf');
    writeFileSync(file, toMask(stripOnlyFixture(), { page: 'letter' }).pdf, 'latin1');
    expect(spawnSync('pdfinfo', [file], { encoding: 'utf8' }).stdout).toMatch(/Page size:\s+612 x 792 pts \(letter\)/);
  });

  it('prints the 100 mm scale bar and the 10 × 2 mm strip true to size at 600 dpi', () => {
    const m = toMask(stripOnlyFixture());
    const img = render(m.pdf, 'strip');
    expect(img.stderr).toBe('');
    expect(img.w).toBe(Math.round(210 * PX));
    const bar = runs(img, m.layout.scaleBar.y + 0.5);
    expect(bar.length).toBe(1);
    expect(bar[0][1] - bar[0][0]).toBeCloseTo(100, 1); // one pixel is 0.042 mm
    expect(bar[0][0]).toBeCloseTo(m.layout.scaleBar.x, 1);
    const strip = runs(img, m.layout.board.y + 1);
    expect(strip.length).toBe(1);
    expect(strip[0][1] - strip[0][0]).toBeCloseTo(10, 1);
  });

  it('draws the same sheet as the SVG: mirrored negative fixture, copper clear where the SVG has it clear', () => {
    const m = toMask(boardFixture(), { polarity: 'negative', mirror: true });
    const img = render(m.pdf, 'board');
    const b = m.layout.board;
    // Mirrored: the strip (x 30…45 mm on the board) lands at 5…20 mm from the board's left edge; clear on negative.
    const row = runs(img, b.y + (40 - 16));
    // Between dark runs lies the clear strip: 15 mm wide starting 5 mm in (mirrored x = 50 − 45).
    const clear = row.map(([, x1], i) => [x1, row[i + 1]?.[0]] as [number, number]).filter(([a, c]) => c !== undefined && c - a > 14 && c - a < 16);
    expect(clear.length).toBe(1);
    expect(clear[0][0] - b.x).toBeCloseTo(5, 1);
  });
});
