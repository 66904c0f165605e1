/**
 * The one place where board geometry (metres, y up, design origin) becomes file coordinates (millimetres).
 * Every exporter goes through `makeFrame`, so origin choice, mirroring and rounding are the same in DXF, SVG,
 * Gerber, Excellon and the photo mask.
 *
 * Rounding: coordinates are rounded to 1 nm (6 decimals in mm), the grid Gerber's %FSLAX46Y46*% can express,
 * so a value written by one exporter is the same number in every other.
 */
import { InputError, describe } from '../util/errors.ts';
import type { BoardGeometry, Box, Region, Ring, Vec2 } from '../geometry/types.ts';

/** Where (0, 0) of the exported file lies. */
export type ExportOrigin = 'board' | 'design';

export interface FrameOptions {
  /** 'board': lower-left corner of the board outline (or copper extent) becomes (0, 0); 'design': keep the design origin. */
  origin?: ExportOrigin;
  /**
   * Mirror left-right (x ↦ −x). With origin 'board' the mirrored board stays in the same frame box
   * (x ↦ width − x); with origin 'design' it mirrors about the design's y axis.
   */
  mirror?: boolean;
}

/** A point in file millimetres. */
export interface PointMm { x: number; y: number }

export interface Frame {
  /** The board box in file millimetres (after origin shift and mirror). */
  box: { minX: number; minY: number; maxX: number; maxY: number };
  /** Board width and height, mm. */
  width: number;
  height: number;
  mirror: boolean;
  origin: ExportOrigin;
  /** Board metres → file millimetres, rounded to 1 nm. */
  point(p: Vec2): PointMm;
  /**
   * A ring in file millimetres, with its winding kept as given in the geometry (outer counter-clockwise,
   * holes clockwise) even when mirrored, so readers that use winding to tell holes see the same thing.
   */
  ring(r: Ring): PointMm[];
}

/** Round millimetres to 1 nm (6 decimals), and turn −0 into 0 so text output never shows "-0". */
export function roundMm(v: number): number {
  const r = Math.round(v * 1e6) / 1e6;
  return r === 0 ? 0 : r;
}

/** Metres → millimetres, rounded to 1 nm. */
export function toMm(m: number): number {
  return roundMm(m * 1000);
}

/** Fixed-point text of a millimetre value with up to `decimals` decimals, trailing zeros trimmed. */
export function fmtMm(v: number, decimals = 6): string {
  const s = roundMm(v).toFixed(decimals);
  const t = s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
  return t === '-0' ? '0' : t;
}

/** Twice the signed area of a ring (positive = counter-clockwise, y up). */
export function signedArea2(r: readonly PointMm[]): number {
  let a = 0;
  for (let i = 0, n = r.length; i < n; i++) {
    const p = r[i], q = r[(i + 1) % n];
    a += p.x * q.y - q.x * p.y;
  }
  return a;
}

/** Axis-aligned box of the board: the outline when there is one, else the geometry's extent. */
export function boardBox(g: BoardGeometry): Box {
  if (g.outline) return ringsBox([g.outline.outer]);
  return g.extent;
}

export function ringsBox(rings: readonly Ring[]): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const r of rings) for (const p of r) {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  }
  return { minX, minY, maxX, maxY };
}

/** Builds the frame for `g`. Validates the geometry first (see `checkGeometry`). */
export function makeFrame(g: BoardGeometry, opts: FrameOptions = {}): Frame {
  checkGeometry(g);
  const origin = opts.origin ?? 'board';
  if (origin !== 'board' && origin !== 'design') {
    throw new InputError('bad-choice', 'origin', "'board' or 'design'", describe(origin));
  }
  const mirror = opts.mirror ?? false;
  if (typeof mirror !== 'boolean') throw new InputError('bad-choice', 'mirror', 'true or false', describe(mirror));
  const b = boardBox(g);
  // x' = sx·x + dx, y' = y + dy, all in metres before the final conversion.
  let sx = 1, dx = 0, dy = 0;
  if (origin === 'board') {
    dy = -b.minY;
    if (mirror) { sx = -1; dx = b.maxX; } else { dx = -b.minX; }
  } else if (mirror) {
    sx = -1;
  }
  const point = (p: Vec2): PointMm => ({ x: toMm(sx * p.x + dx), y: toMm(p.y + dy) });
  const ring = (r: Ring): PointMm[] => {
    const out = r.map(point);
    return mirror ? out.reverse() : out;
  };
  const c1 = point({ x: b.minX, y: b.minY }), c2 = point({ x: b.maxX, y: b.maxY });
  const box = { minX: Math.min(c1.x, c2.x), minY: Math.min(c1.y, c2.y), maxX: Math.max(c1.x, c2.x), maxY: Math.max(c1.y, c2.y) };
  return { box, width: roundMm(box.maxX - box.minX), height: roundMm(box.maxY - box.minY), mirror, origin, point, ring };
}

/**
 * Rejects geometry no exporter can write faithfully: non-finite coordinates, rings with fewer than three
 * points, drills with a non-positive diameter, or nothing at all to export. Names the offending field.
 */
export function checkGeometry(g: BoardGeometry): void {
  if (g === null || typeof g !== 'object') throw new InputError('bad-file', 'geometry', 'a BoardGeometry object', describe(g));
  const regionLists: [string, Region[]][] = [
    ['copper', g.copper], ['groundCopper', g.groundCopper], ['clearance', g.clearance], ['keepouts', g.keepouts],
  ];
  for (const [name, list] of regionLists) {
    if (!Array.isArray(list)) throw new InputError('bad-file', `geometry.${name}`, 'a list of regions', describe(list));
    list.forEach((r, i) => checkRegion(`geometry.${name}[${i}]`, r));
  }
  if (g.outline !== null) checkRegion('geometry.outline', g.outline);
  if (!Array.isArray(g.drills)) throw new InputError('bad-file', 'geometry.drills', 'a list of drill hits', describe(g.drills));
  g.drills.forEach((d, i) => {
    checkPoint(`geometry.drills[${i}].at`, d.at);
    if (typeof d.diameter !== 'number' || !Number.isFinite(d.diameter) || d.diameter <= 0) {
      throw new InputError('out-of-range', `geometry.drills[${i}].diameter`, 'a finite hole diameter above 0 m', describe(d.diameter));
    }
  });
  const e = g.extent;
  for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) {
    if (!e || typeof e[k] !== 'number' || !Number.isFinite(e[k])) throw new InputError('invalid-number', `geometry.extent.${k}`, 'a finite coordinate in metres', describe(e?.[k]));
  }
  if (g.copper.length === 0 && g.groundCopper.length === 0 && g.outline === null) {
    throw new InputError('impossible-layout', 'geometry', 'some copper or a board outline to export', 'an empty board',
      'add at least one line to the design before exporting');
  }
  const b = boardBox(g);
  if (!(b.maxX > b.minX && b.maxY > b.minY)) {
    throw new InputError('impossible-layout', 'geometry.extent', 'a board with width and height above 0', `${b.maxX - b.minX} m × ${b.maxY - b.minY} m`);
  }
}

function checkRegion(field: string, r: Region): void {
  if (!r || typeof r !== 'object') throw new InputError('bad-file', field, 'a region { outer, holes }', describe(r));
  checkRing(`${field}.outer`, r.outer);
  if (!Array.isArray(r.holes)) throw new InputError('bad-file', `${field}.holes`, 'a list of rings', describe(r.holes));
  r.holes.forEach((h, i) => checkRing(`${field}.holes[${i}]`, h));
}

function checkRing(field: string, ring: Ring): void {
  if (!Array.isArray(ring) || ring.length < 3) {
    throw new InputError('bad-file', field, 'a closed ring of at least 3 points', Array.isArray(ring) ? `${ring.length} point(s)` : describe(ring));
  }
  ring.forEach((p, i) => checkPoint(`${field}[${i}]`, p));
}

function checkPoint(field: string, p: Vec2): void {
  if (!p || typeof p.x !== 'number' || typeof p.y !== 'number' || !Number.isFinite(p.x) || !Number.isFinite(p.y)) {
    throw new InputError('invalid-number', field, 'a point { x, y } with finite coordinates in metres', p ? `(${describe(p.x)}, ${describe(p.y)})` : describe(p));
  }
  // Gerber %FSLAX46Y46*% holds at most 4 integer digits of millimetres; no board is near 10 m anyway.
  if (Math.abs(p.x) >= 9.999 || Math.abs(p.y) >= 9.999) {
    throw new InputError('out-of-range', field, 'coordinates within ±9.999 m of the design origin', `(${p.x}, ${p.y}) m`);
  }
}
