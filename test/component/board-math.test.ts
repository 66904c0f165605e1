/**
 * The board's pure maths: view transforms, snapping, grid steps, shortcut matching.
 * Sources: plane geometry (a rotation-free similarity maps a point and back exactly), the definition of the
 * international inch (25.4 mm, 1959 agreement; 1 mil = 25.4 µm), and common practice for drawing grids.
 */
import { describe, expect, it } from 'vitest';
import { fitBox, panBy, toBoard, toScreen, zoomAt, visibleBox, type View } from '../../renderer/src/board/viewport.ts';
import { snapHeading, snapToGrid, headingRuleFor, distToSegment } from '../../renderer/src/board/snap.ts';
import { gridLines, niceStep, rulerLabel, UNIT_METRES } from '../../renderer/src/board/grid.ts';
import { matches, parseShortcut } from '../../renderer/src/lib/keys.ts';
import { fuzzyScore, rank } from '../../renderer/src/lib/fuzzy.ts';

const view: View = { cx: 0.01, cy: -0.005, scale: 20000, width: 800, height: 600 };
const key = (k: string, m: Partial<{ ctrlKey: boolean; shiftKey: boolean; altKey: boolean; metaKey: boolean }> = {}) =>
  ({ key: k, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...m });

describe('viewport', () => {
  it('maps board to screen and back (geometry: inverse of a similarity)', () => {
    const p = { x: 0.0123, y: -0.0045 };
    const q = toBoard(view, toScreen(view, p));
    expect(q.x).toBeCloseTo(p.x, 12);
    expect(q.y).toBeCloseTo(p.y, 12);
    // y up on the board, y down on screen: a point above the centre is above the middle of the screen.
    expect(toScreen(view, { x: view.cx, y: view.cy + 0.001 }).y).toBeLessThan(view.height / 2);
  });

  it('keeps the point under the cursor fixed while zooming', () => {
    const at = { x: 123, y: 456 };
    const before = toBoard(view, at);
    const z = zoomAt(view, at, 2.5);
    expect(z.scale).toBeCloseTo(view.scale * 2.5, 6);
    const after = toBoard(z, at);
    expect(after.x).toBeCloseTo(before.x, 12);
    expect(after.y).toBeCloseTo(before.y, 12);
  });

  it('pans by the dragged pixels', () => {
    const p = panBy(view, 100, -50);
    const s0 = toScreen(view, { x: 0, y: 0 });
    const s1 = toScreen(p, { x: 0, y: 0 });
    expect(s1.x - s0.x).toBeCloseTo(100, 9);
    expect(s1.y - s0.y).toBeCloseTo(-50, 9);
  });

  it('zoom to fit shows the whole box', () => {
    const box = { minX: -0.03, minY: 0.01, maxX: 0.05, maxY: 0.02 };
    const f = fitBox(view, box, 20);
    const vis = visibleBox(f);
    expect(vis.minX).toBeLessThanOrEqual(box.minX);
    expect(vis.maxX).toBeGreaterThanOrEqual(box.maxX);
    expect(vis.minY).toBeLessThanOrEqual(box.minY);
    expect(vis.maxY).toBeGreaterThanOrEqual(box.maxY);
    // The wider dimension fills the view less the margins.
    expect((box.maxX - box.minX) * f.scale).toBeCloseTo(800 - 40, 6);
  });
});

describe('snapping', () => {
  it('snaps to the nearest grid point', () => {
    const p = snapToGrid({ x: 0.00126, y: -0.00074 }, 0.0005);
    expect(p.x).toBeCloseTo(0.0015, 12);
    expect(p.y).toBeCloseTo(-0.0005, 12);
  });

  it('rounds the heading to 45° steps and keeps the length on the grid', () => {
    // Cursor at 40° from the start: nearest 45° step is 45°, so both components are equal (cos 45° = sin 45°).
    const from = { x: 0, y: 0 };
    const c = { x: 0.01 * Math.cos((40 * Math.PI) / 180), y: 0.01 * Math.sin((40 * Math.PI) / 180) };
    const p = snapHeading(from, c, 'deg45', 0.001);
    expect(p.x).toBeCloseTo(p.y, 12);
    expect(Math.hypot(p.x, p.y) / 0.001).toBeCloseTo(Math.round(Math.hypot(p.x, p.y) / 0.001), 9);
    // 90° rule sends the same cursor along +x.
    const q = snapHeading(from, c, 'deg90', 0.001);
    expect(q.y).toBe(0);
    expect(q.x).toBeCloseTo(0.008, 12);
  });

  it('modifier keys pick the heading rule (Shift 90°, Alt free)', () => {
    expect(headingRuleFor({ shiftKey: false, altKey: false })).toBe('deg45');
    expect(headingRuleFor({ shiftKey: true, altKey: false })).toBe('deg90');
    expect(headingRuleFor({ shiftKey: false, altKey: true })).toBe('free');
  });

  it('distance to a segment (geometry)', () => {
    expect(distToSegment({ x: 1, y: 1 }, { x: 0, y: 0 }, { x: 2, y: 0 })).toBeCloseTo(1, 12);
    expect(distToSegment({ x: 5, y: 0 }, { x: 0, y: 0 }, { x: 2, y: 0 })).toBeCloseTo(3, 12);
  });
});

describe('grid and rulers', () => {
  it('1 mil is 25.4 µm exactly (international inch, 1959)', () => {
    expect(UNIT_METRES.mil).toBe(25.4e-6);
    expect(UNIT_METRES.mil * 1000).toBeCloseTo(0.0254e-3 * 1000, 15);
  });

  it('grid lines are snap lines and never closer than the minimum spacing', () => {
    const g = gridLines(view, 0.0001, 'mm', 8);
    expect(g.step * view.scale).toBeGreaterThanOrEqual(8);
    expect((g.step / 0.0001) % 1).toBeCloseTo(0, 9);
    for (let i = 1; i < g.xs.length; i++) expect(g.xs[i] - g.xs[i - 1]).toBeCloseTo(g.step, 12);
  });

  it('nice steps follow 1-2-5 in mm (common practice)', () => {
    expect(niceStep('mm', 10000, 8) / 1e-3).toBeCloseTo(1, 12); // 10 px per mm → 1 mm
    expect(niceStep('mm', 5000, 8) / 1e-3).toBeCloseTo(2, 12);
  });

  it('ruler labels in the chosen unit', () => {
    expect(rulerLabel(0.0254, 'mil', 100 * 25.4e-6)).toBe('1000');
    expect(rulerLabel(0.0015, 'mm', 0.0005)).toBe('1.5');
    expect(rulerLabel(-0.0000001, 'mm', 0.001)).toBe('0');
  });
});

describe('shortcuts and the command finder', () => {
  it('parses and matches shortcuts', () => {
    expect(parseShortcut('Mod+Shift+Z')).toEqual({ key: 'z', mod: true, shift: true, alt: false });
    expect(matches(key('z', { ctrlKey: true }), 'Mod+Z')).toBe(true);
    expect(matches(key('Z', { ctrlKey: true, shiftKey: true }), 'Mod+Z')).toBe(false);
    expect(matches(key('Z', { metaKey: true, shiftKey: true }), 'Mod+Shift+Z')).toBe(true);
    expect(matches(key('+', { shiftKey: true }), '+')).toBe(true);
    expect(matches(key('Delete'), 'Delete')).toBe(true);
    expect(matches(key('r'), 'R')).toBe(true);
    expect(matches(key('r', { ctrlKey: true }), 'R')).toBe(false);
  });

  it('ranks in-order letter matches, word starts first', () => {
    expect(fuzzyScore('zf', 'Zoom to fit')).not.toBeNull();
    expect(fuzzyScore('xq', 'Zoom to fit')).toBeNull();
    const labels = ['Export outputs', 'Undo', 'Zoom out', 'Open design'];
    expect(rank(labels, 'zo', (s) => s)[0]).toBe('Zoom out');
  });
});

import { gammaOf, reactanceArc, resistanceCircle } from '../../renderer/src/board/smith.ts';

describe('Smith chart construction (P. H. Smith, Electronics, Jan. 1939; Pozar, Microwave Engineering, 4th ed., §2.4)', () => {
  it('Γ of z = r + jx lies on the r circle and on the x arc', () => {
    for (const [r, x] of [[0.5, 1], [1, -2], [2, 0.2], [0.2, 5]] as const) {
      const g = gammaOf(r, x);
      const c = resistanceCircle(r), a = reactanceArc(x);
      expect(Math.hypot(g.re - c.cx, g.im - c.cy)).toBeCloseTo(c.radius, 12);
      expect(Math.hypot(g.re - a.cx, g.im - a.cy)).toBeCloseTo(a.radius, 12);
    }
    // z = 1 (matched) is the centre; the r = 0 circle is the unit circle.
    expect(gammaOf(1, 0)).toEqual({ re: 0, im: 0 });
    expect(resistanceCircle(0)).toEqual({ cx: 0, cy: 0, radius: 1 });
  });
});

import { insidePolygon, signedArea } from '../../renderer/src/board/hit.ts';

describe('areas (plane geometry: even-odd rule, shoelace formula)', () => {
  const sq = [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }];
  it('finds points inside and outside a polygon', () => {
    expect(insidePolygon({ x: 1, y: 1 }, sq)).toBe(true);
    expect(insidePolygon({ x: 3, y: 1 }, sq)).toBe(false);
  });
  it('signed area is positive counter-clockwise', () => {
    expect(signedArea(sq)).toBe(4);
    expect(signedArea([...sq].reverse())).toBe(-4);
  });
});
