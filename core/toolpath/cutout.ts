/**
 * The board cutout: the tool centre runs around the board profile offset outward by the tool radius (so the board
 * keeps its drawn size), in passes of `stepDown` to the full depth. On passes deeper than the tab top the tool rises
 * over `tabs` holding tabs spread evenly along the loop; each raised stretch is tabWidth + tool diameter long, so the
 * material left is tabWidth long and tabHeight thick. Loops run counter-clockwise for climb (board on the left of
 * travel with an M3 spindle, as for isolation), clockwise for conventional.
 */
import { offsetRegions } from '../geometry/polygons.ts';
import type { Region, Vec2 } from '../geometry/types.ts';
import { InputError } from '../util/errors.ts';
import type { MillingOptions } from './options.ts';
import type { Move } from './types.ts';

/** The tool-centre loop of the cutout (closed, not repeating its first point). */
export function cutoutLoop(board: Region, o: MillingOptions): Vec2[] {
  const grown = offsetRegions([board], o.cutoutTool / 2, 'round');
  const loop = grown.reduce((a, b) => (b.outer.length && Math.abs(area(b.outer)) > Math.abs(area(a.outer)) ? b : a)).outer;
  return o.direction === 'climb' ? loop : loop.slice().reverse();
}

function area(r: Vec2[]): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) { const p = r[i]!, q = r[(i + 1) % r.length]!; s += p.x * q.y - q.x * p.y; }
  return s / 2;
}

/**
 * Moves for the whole cutout from the travel height above `loop[0]` back to the travel height. `depth` is the full
 * depth below the copper surface (board + breakthrough); `board` the material thickness a tab is measured from.
 */
export function cutoutMoves(loop: Vec2[], depth: number, boardThickness: number, o: MillingOptions): Move[] {
  const n = loop.length;
  const s: number[] = [0];
  for (let i = 0; i < n; i++) { const p = loop[i]!, q = loop[(i + 1) % n]!; s.push(s[i]! + Math.hypot(q.x - p.x, q.y - p.y)); }
  const P = s[n]!;
  const half = (o.tabWidth + o.cutoutTool) / 2;
  if (o.tabs > 0 && 2 * half * o.tabs > 0.8 * P) {
    throw new InputError('out-of-range', 'tabs', `tabs that fit the ${(P * 1e3).toFixed(1)} mm cutout loop (each takes ${(2 * half * 1e3).toFixed(2)} mm)`, `${o.tabs} tabs`, 'use fewer or narrower tabs');
  }
  if (o.tabs > 0 && o.tabHeight >= boardThickness) {
    throw new InputError('out-of-range', 'tabHeight', `a tab thinner than the board (${(boardThickness * 1e3).toFixed(3)} mm)`, `${(o.tabHeight * 1e3).toFixed(3)} mm`);
  }
  const tabTop = -(boardThickness - o.tabHeight);
  // Stretch boundaries along the loop: vertices and tab edges, as (arc length, point).
  const marks: { s: number; p: Vec2 }[] = loop.map((p, i) => ({ s: s[i]!, p }));
  const zones: [number, number][] = [];
  for (let j = 0; j < o.tabs; j++) { const c = (P * (j + 0.5)) / o.tabs; zones.push([c - half, c + half]); }
  for (const [a, b] of zones) for (const t of [a, b]) marks.push({ s: t, p: pointAt(loop, s, t) });
  marks.push({ s: P, p: loop[0]! });
  marks.sort((x, y) => x.s - y.s);
  const inTab = (t: number) => zones.some(([a, b]) => t > a && t < b);

  const levels: number[] = [];
  for (let d = o.stepDown; d < depth - 1e-9; d += o.stepDown) levels.push(d);
  levels.push(depth);
  const moves: Move[] = [];
  for (const d of levels) {
    const z = -d;
    moves.push({ kind: 'line', to: { ...loop[0]!, z }, feed: o.plungeFeed });
    let zNow = z;
    for (let i = 1; i < marks.length; i++) {
      const a = marks[i - 1]!, b = marks[i]!;
      if (b.s - a.s < 1e-9) continue;
      const zSeg = inTab((a.s + b.s) / 2) && z < tabTop ? tabTop : z;
      if (zSeg !== zNow) { moves.push({ kind: 'line', to: { ...a.p, z: zSeg }, feed: zSeg > zNow ? o.cutoutFeed : o.plungeFeed }); zNow = zSeg; }
      moves.push({ kind: 'line', to: { ...b.p, z: zSeg }, feed: o.cutoutFeed });
    }
    if (zNow !== z) moves.push({ kind: 'line', to: { ...loop[0]!, z }, feed: o.plungeFeed });
  }
  moves.push({ kind: 'rapid', to: { ...loop[0]!, z: o.travelHeight } });
  return moves;
}

function pointAt(loop: Vec2[], s: number[], t: number): Vec2 {
  const n = loop.length;
  for (let i = 0; i < n; i++) {
    if (t <= s[i + 1]!) {
      const p = loop[i]!, q = loop[(i + 1) % n]!;
      const f = (t - s[i]!) / Math.max(1e-15, s[i + 1]! - s[i]!);
      return { x: p.x + f * (q.x - p.x), y: p.y + f * (q.y - p.y) };
    }
  }
  return loop[0]!;
}
