/** Frame (origin, mirror, rounding) and input checks shared by every exporter. Expected values worked out by hand. */
import { describe, expect, it } from 'vitest';
import { checkGeometry, fmtMm, makeFrame, roundMm } from '../../core/export/frame.ts';
import { checkLayers } from '../../core/export/layers.ts';
import { toDxf } from '../../core/export/dxf.ts';
import { toGerber } from '../../core/export/gerber.ts';
import { InputError } from '../../core/util/errors.ts';
import { boardFixture, stripOnlyFixture } from '../fixtures/export/hand-made.ts';

function fails(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('export frame', () => {
  it('rounds to 1 nm and never prints -0', () => {
    expect(roundMm(1.9000000000000001)).toBe(1.9);
    expect(roundMm(-0.0000001)).toBe(0);
    expect(fmtMm(-0.0000001)).toBe('0');
    expect(fmtMm(12.5)).toBe('12.5');
    expect(fmtMm(3)).toBe('3');
  });
  it('origin board puts the outline corner at (0, 0); design keeps the design coordinates', () => {
    const g = stripOnlyFixture();
    expect(makeFrame(g).point({ x: 0.01, y: 0.02 })).toEqual({ x: 0, y: 0 });
    expect(makeFrame(g, { origin: 'design' }).point({ x: 0.01, y: 0.02 })).toEqual({ x: 10, y: 20 });
    expect(makeFrame(g).box).toEqual({ minX: 0, minY: 0, maxX: 10, maxY: 2 });
  });
  it('mirror maps x to width − x in the board frame and to −x about the design origin', () => {
    const g = stripOnlyFixture();
    expect(makeFrame(g, { mirror: true }).point({ x: 0.012, y: 0.021 })).toEqual({ x: 8, y: 1 });
    expect(makeFrame(g, { mirror: true, origin: 'design' }).point({ x: 0.012, y: 0.021 })).toEqual({ x: -12, y: 21 });
  });
});

describe('bad geometry gets a clear error naming the field', () => {
  it('non-finite coordinate', () => {
    const g = boardFixture();
    g.copper[0].outer[2] = { x: NaN, y: 0 };
    const e = fails(() => toDxf(g));
    expect(e.field).toBe('geometry.copper[0].outer[2]');
    expect(e.expected).toMatch(/finite coordinates in metres/);
  });
  it('ring with two points', () => {
    const g = boardFixture();
    g.groundCopper[0].holes[1] = g.groundCopper[0].holes[1].slice(0, 2);
    expect(fails(() => toGerber(g)).field).toBe('geometry.groundCopper[0].holes[1]');
  });
  it('drill with zero diameter', () => {
    const g = boardFixture();
    g.drills[1].diameter = 0;
    expect(fails(() => checkGeometry(g)).field).toBe('geometry.drills[1].diameter');
  });
  it('nothing to export', () => {
    const g = stripOnlyFixture();
    g.copper = [];
    expect(fails(() => checkGeometry(g)).message).toMatch(/some copper or a board outline/);
  });
  it('unknown origin and unknown layer', () => {
    expect(fails(() => makeFrame(boardFixture(), { origin: 'centre' as 'board' })).field).toBe('origin');
    expect(fails(() => checkLayers(['copper', 'silk'], boardFixture())).message).toMatch(/layer names among copper, ground/);
    expect(fails(() => checkLayers(['isolation'], boardFixture())).hint).toMatch(/tool diameter/);
  });
  it('a profile line width of zero', () => {
    expect(fails(() => toGerber(boardFixture(), { profileLine: 0 })).field).toBe('profileLine');
  });
  it('coordinates beyond what %FSLAX46Y46*% can hold', () => {
    const g = boardFixture();
    g.copper[1].outer[0] = { x: 12, y: 0 };
    expect(fails(() => toGerber(g)).code).toBe('out-of-range');
  });
});
