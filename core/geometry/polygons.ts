/**
 * Polygon engine: union, difference, intersection and offset of copper regions over clipper2-wasm (Clipper2, BSL-1.0).
 *
 * Why this shape:
 * - The engine is WebAssembly and must be initialised once, asynchronously: `await initPolygons()` before the first
 *   call (the renderer passes `locateFile` so Vite can serve the .wasm; Node needs no options).
 * - Coordinates are metres outside and millimetres inside the engine, which works on an integer grid of
 *   10^-PRECISION mm: PRECISION = 5 gives a 10 nm grid (well below any milling or etching tolerance).
 * - Every PathD/PathsD the engine hands out lives on the wasm heap; each is deleted in a finally block.
 * - Outputs are plain `Region`s (core/geometry/types.ts): simple outer rings counter-clockwise, holes clockwise,
 *   each hole assigned to the smallest outer that contains it. Collinear points are dropped.
 */
import Clipper2ZFactory from 'clipper2-wasm/dist/es/clipper2z.js';
import type { MainModule, PathD, PathsD } from 'clipper2-wasm/dist/clipper2z';
import { InputError, describe } from '../util/errors.ts';
import type { Region, Ring, Vec2 } from './types.ts';

/** Decimal places of millimetres kept by the engine: 5 → a 10 nm grid. */
export const PRECISION = 5;
/** The grid step in metres (10 nm). */
export const GRID_M = 1e-3 * 10 ** -PRECISION;
/** Chord error allowed when round joins are flattened, m (1 µm, common practice). */
export const ARC_TOLERANCE_M = 1e-6;

const MM = 1e3;

let engine: MainModule | null = null;
let loading: Promise<void> | null = null;

/**
 * Loads the polygon engine once. Later calls return the same promise. `locateFile` maps the engine's file name
 * (clipper2z.wasm) to a URL, for bundlers that move it.
 */
export function initPolygons(opts: { locateFile?: (p: string) => string } = {}): Promise<void> {
  if (engine) return Promise.resolve();
  if (!loading) {
    const args: Record<string, unknown> = {};
    if (opts.locateFile) { const lf = opts.locateFile; args.locateFile = (p: string) => lf(p); }
    loading = Clipper2ZFactory(args).then((m) => { engine = m as unknown as MainModule; }, (e: unknown) => {
      loading = null;
      throw new Error(`the polygon engine (clipper2-wasm) failed to load: ${e instanceof Error ? e.message : String(e)}`);
    });
  }
  return loading;
}

/** True once initPolygons() has finished. */
export function polygonsReady(): boolean { return engine !== null; }

function E(): MainModule {
  if (!engine) throw new Error('polygon engine not initialised: call `await initPolygons()` once before geometry work');
  return engine;
}

// ---------------------------------------------------------------------------------------------------------------
// Pure ring helpers (no engine needed)

/** Signed area by the shoelace formula, m²: positive for counter-clockwise rings (y up). */
export function ringArea(ring: Ring): number {
  let s = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const p = ring[i]!, q = ring[(i + 1) % n]!;
    s += p.x * q.y - q.x * p.y;
  }
  return s / 2;
}

/** Area of a region: outer minus its holes, m² (orientation-independent). */
export function regionArea(region: Region): number {
  let a = Math.abs(ringArea(region.outer));
  for (const h of region.holes) a -= Math.abs(ringArea(h));
  return a;
}

/** Total area of several non-overlapping regions (as the engine returns them), m². */
export function regionsArea(regions: Region[]): number {
  let a = 0;
  for (const r of regions) a += regionArea(r);
  return a;
}

export function isCounterClockwise(ring: Ring): boolean { return ringArea(ring) > 0; }

/** Even-odd point-in-ring test (points exactly on an edge may go either way). */
export function pointInRing(p: Vec2, ring: Ring): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const a = ring[i]!, b = ring[j]!;
    if ((a.y > p.y) !== (b.y > p.y) && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}

/** Inside the region's outer and outside all its holes. */
export function pointInRegion(p: Vec2, region: Region): boolean {
  if (!pointInRing(p, region.outer)) return false;
  for (const h of region.holes) if (pointInRing(p, h)) return false;
  return true;
}

/**
 * Drops repeated points and points that lie on the straight line through their neighbours (within `tol` metres,
 * default one grid step), so a rectangle that went through several unions keeps 4 vertices.
 */
export function simplify(ring: Ring, tol = GRID_M): Ring {
  let pts = ring.slice();
  let changed = true;
  while (changed && pts.length > 3) {
    changed = false;
    const out: Vec2[] = [];
    const n = pts.length;
    for (let i = 0; i < n; i++) {
      const prev = out.length ? out[out.length - 1]! : pts[(i - 1 + n) % n]!;
      const p = pts[i]!, next = pts[(i + 1) % n]!;
      const dx = next.x - prev.x, dy = next.y - prev.y;
      const len = Math.hypot(dx, dy);
      const dist = len === 0 ? Math.hypot(p.x - prev.x, p.y - prev.y) : Math.abs((p.x - prev.x) * dy - (p.y - prev.y) * dx) / len;
      if (dist <= tol) { changed = true; continue; }
      out.push(p);
    }
    if (out.length < 3) break;
    pts = out;
  }
  return pts;
}

/** Axis-aligned rectangle ring (counter-clockwise) from its corners. */
export function rectRing(x0: number, y0: number, x1: number, y1: number): Ring {
  const ax = Math.min(x0, x1), bx = Math.max(x0, x1), ay = Math.min(y0, y1), by = Math.max(y0, y1);
  return [{ x: ax, y: ay }, { x: bx, y: ay }, { x: bx, y: by }, { x: ax, y: by }];
}

function oriented(ring: Ring, ccw: boolean): Ring {
  return isCounterClockwise(ring) === ccw ? ring : ring.slice().reverse();
}

// ---------------------------------------------------------------------------------------------------------------
// Conversion to and from the engine

/** Largest coordinate the engine is given, m: far beyond any board, far inside the engine's integer range. */
export const MAX_COORD_M = 100;

/**
 * Work bounds of one engine call, so no input can keep the engine busy for minutes (a cut metres wide once took
 * 200 s in one negative offset). Points: what a call takes in. Offset work: for each ring, its points times the
 * number of neighbouring edges its offset edges sweep over (2·|delta| over its mean edge length, at most all of
 * them), plus the points the round joins add. Measured here: 1.6 million units took about 4 s on a loaded machine,
 * 9 million took 200 s (it grows faster than linearly); real boards stay below 100 000.
 */
export const MAX_ENGINE_POINTS = 1_000_000;
export const MAX_OFFSET_WORK = 2_000_000;

/** 1234567 → "1 234 567" (thin grouping for messages, as the README writes numbers). */
function grouped(n: number): string { return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ' '); }

function tooMuch(what: string, found: string): InputError {
  return new InputError('impossible-layout', 'geometry', what, found,
    'the copper is far larger or far finer than a board: check the design frequency, the lengths, the process tool and the clearances');
}

/** Points in a list of regions; refused beyond MAX_ENGINE_POINTS before anything reaches the engine. */
function countPoints(regions: Region[], op: string): number {
  let n = 0;
  for (const r of regions) {
    n += Array.isArray(r.outer) ? r.outer.length : 0;
    for (const h of r.holes ?? []) n += Array.isArray(h) ? h.length : 0;
  }
  if (n > MAX_ENGINE_POINTS) throw tooMuch(`at most ${grouped(MAX_ENGINE_POINTS)} outline points in one polygon operation`, `${grouped(n)} points for ${op}`);
  return n;
}

/** The estimated work of offsetting `regions` by `delta` (see MAX_OFFSET_WORK); refused beyond the bound. */
function checkOffsetWork(regions: Region[], delta: number, join: JoinStyle, arcTol: number): void {
  countPoints(regions, 'an offset');
  const d = Math.abs(delta);
  const arcPoints = join === 'round' && d > arcTol ? Math.ceil(Math.PI / Math.acos(1 - arcTol / d)) : 4;
  let work = 0, extent = 0;
  for (const r of regions) {
    for (const ring of [r.outer, ...(r.holes ?? [])]) {
      const n = ring.length;
      if (n === 0) continue;
      let per = 0;
      for (let i = 0; i < n; i++) {
        const p = ring[i]!, q = ring[(i + 1) % n]!;
        per += Math.hypot(q.x - p.x, q.y - p.y);
        extent = Math.max(extent, Math.abs(p.x), Math.abs(p.y));
      }
      const mean = per / n;
      const reach = mean > 0 ? Math.min(n, 1 + (2 * d) / mean) : n;
      work += n * reach + arcPoints;
    }
  }
  if (!(work <= MAX_OFFSET_WORK)) {
    throw tooMuch(`an offset of at most ${grouped(MAX_OFFSET_WORK)} units of work (outline points times the edges each offset edge passes)`,
      `an offset of ${(delta * 1e3).toPrecision(4)} mm on outlines of ${grouped(countPoints(regions, 'an offset'))} points, about ${grouped(Math.round(work))} units`);
  }
  if (extent + d > MAX_COORD_M) {
    throw tooMuch(`outlines within ±${MAX_COORD_M} m of the origin after the offset`, `${(extent + d).toPrecision(4)} m`);
  }
}

function checkRing(ring: Ring, field: string): void {
  if (!Array.isArray(ring) || ring.length < 3) throw new InputError('out-of-range', field, 'a ring of at least 3 points', describe(ring));
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i]!;
    if (!p || !Number.isFinite(p.x) || !Number.isFinite(p.y)) {
      throw new InputError('invalid-number', `${field}[${i}]`, 'a point with finite x and y in metres', describe(p));
    }
    if (Math.abs(p.x) > MAX_COORD_M || Math.abs(p.y) > MAX_COORD_M) {
      throw new InputError('out-of-range', `${field}[${i}]`, `a point within ±${MAX_COORD_M} m of the origin`, `(${p.x}, ${p.y})`);
    }
  }
}

function toPath(m: MainModule, ring: Ring): PathD {
  const flat = new Array<number>(ring.length * 2);
  for (let i = 0; i < ring.length; i++) { flat[2 * i] = ring[i]!.x * MM; flat[2 * i + 1] = ring[i]!.y * MM; }
  return m.MakePathD(flat);
}

/** Region list → engine paths with outers counter-clockwise and holes clockwise (for the NonZero fill rule). */
function toPaths(m: MainModule, regions: Region[], field: string): PathsD {
  const paths = new m.PathsD();
  try {
    regions.forEach((r, i) => {
      checkRing(r.outer, `${field}[${i}].outer`);
      const p = toPath(m, oriented(r.outer, true));
      try { paths.push_back(p); } finally { p.delete(); }
      r.holes.forEach((h, j) => {
        checkRing(h, `${field}[${i}].holes[${j}]`);
        const q = toPath(m, oriented(h, false));
        try { paths.push_back(q); } finally { q.delete(); }
      });
    });
    return paths;
  } catch (e) { paths.delete(); throw e; }
}

function pathToRing(path: PathD): Ring {
  const v = path.view();
  // The Z build stores x, y, z per point.
  const n = Math.floor(v.length / 3);
  const ring: Ring = new Array(n);
  for (let i = 0; i < n; i++) ring[i] = { x: v[3 * i]! / MM, y: v[3 * i + 1]! / MM };
  return ring;
}

/** Engine output → regions: classify by orientation, drop collinear points, nest each hole in its smallest outer. */
function fromPaths(paths: PathsD): Region[] {
  const outers: { ring: Ring; area: number; holes: Ring[] }[] = [];
  const holes: Ring[] = [];
  const n = paths.size();
  for (let i = 0; i < n; i++) {
    const p = paths.get(i);
    let ring: Ring;
    try { ring = pathToRing(p); } finally { p.delete(); }
    ring = simplify(ring);
    if (ring.length < 3) continue;
    const a = ringArea(ring);
    if (Math.abs(a) < GRID_M * GRID_M) continue;
    if (a > 0) outers.push({ ring, area: a, holes: [] });
    else holes.push(ring);
  }
  for (const h of holes) {
    let best: (typeof outers)[number] | null = null;
    // A hole vertex can sit on its outer's boundary only in degenerate cases; probe an interior point of the hole's
    // first edge nudged into the hole instead of a vertex.
    const probe = holeProbe(h);
    for (const o of outers) {
      if ((best === null || o.area < best.area) && pointInRing(probe, o.ring)) best = o;
    }
    if (best) best.holes.push(h);
  }
  return outers.map((o) => ({ outer: o.ring, holes: o.holes }));
}

/** A point just inside a clockwise hole ring, next to the middle of its longest edge. */
function holeProbe(h: Ring): Vec2 {
  let bi = 0, bl = -1;
  for (let i = 0; i < h.length; i++) {
    const a = h[i]!, b = h[(i + 1) % h.length]!;
    const l = Math.hypot(b.x - a.x, b.y - a.y);
    if (l > bl) { bl = l; bi = i; }
  }
  const a = h[bi]!, b = h[(bi + 1) % h.length]!;
  const mx = (a.x + b.x) / 2, my = (a.y + b.y) / 2;
  // For a clockwise ring the interior lies to the right of each edge.
  const nx = (b.y - a.y) / bl, ny = -(b.x - a.x) / bl;
  const eps = Math.min(bl * 1e-3, 1e-7);
  return { x: mx + nx * eps, y: my + ny * eps };
}

function run(fn: (m: MainModule) => PathsD): Region[] {
  const m = E();
  let out: PathsD;
  try { out = fn(m); } catch (e) {
    if (e instanceof InputError || e instanceof Error) throw e;
    // The engine throws bare numbers (C++ exceptions) on input it cannot take.
    throw new InputError('impossible-layout', 'geometry', 'outlines the polygon engine can process', `an engine failure (${describe(e)})`, 'check for pieces drawn far from the board or folded back on themselves');
  }
  try { return fromPaths(out); } finally { out.delete(); }
}

// ---------------------------------------------------------------------------------------------------------------
// Operations

/** Union of any number of regions (overlapping or not) into simple, non-overlapping regions with holes. */
export function unionRegions(regions: Region[]): Region[] {
  if (regions.length === 0) return [];
  countPoints(regions, 'a union');
  return run((m) => {
    const s = toPaths(m, regions, 'regions');
    try { return m.UnionSelfD(s, m.FillRule.NonZero, PRECISION); } finally { s.delete(); }
  });
}

/** Union of plain filled rings (each taken as a polygon without holes, whatever its orientation). */
export function unionRings(rings: Ring[]): Region[] {
  return unionRegions(rings.map((r) => ({ outer: r, holes: [] })));
}

/** a minus b. */
export function differenceRegions(a: Region[], b: Region[]): Region[] {
  if (a.length === 0) return [];
  if (b.length === 0) return unionRegions(a);
  countPoints([...a, ...b], 'a difference');
  return run((m) => {
    const s = toPaths(m, a, 'a');
    try {
      const c = toPaths(m, b, 'b');
      try { return m.DifferenceD(s, c, m.FillRule.NonZero, PRECISION); } finally { c.delete(); }
    } finally { s.delete(); }
  });
}

/** Where a and b overlap. */
export function intersectRegions(a: Region[], b: Region[]): Region[] {
  if (a.length === 0 || b.length === 0) return [];
  countPoints([...a, ...b], 'an intersection');
  return run((m) => {
    const s = toPaths(m, a, 'a');
    try {
      const c = toPaths(m, b, 'b');
      try { return m.IntersectD(s, c, m.FillRule.NonZero, PRECISION); } finally { c.delete(); }
    } finally { s.delete(); }
  });
}

export type JoinStyle = 'round' | 'miter' | 'square';

/**
 * Grows (delta > 0) or shrinks (delta < 0) regions by `delta` metres; holes shrink as their outers grow.
 * Round joins are flattened to ARC_TOLERANCE_M; miter joins are limited at 2 × delta (Clipper2's default).
 */
export function offsetRegions(regions: Region[], delta: number, join: JoinStyle, opts: { arcTolerance?: number; miterLimit?: number } = {}): Region[] {
  if (!Number.isFinite(delta)) throw new InputError('invalid-number', 'delta', 'a finite offset in metres', describe(delta));
  if (join !== 'round' && join !== 'miter' && join !== 'square') throw new InputError('bad-choice', 'join', "'round', 'miter' or 'square'", describe(join));
  if (regions.length === 0) return [];
  const arcTol = opts.arcTolerance ?? ARC_TOLERANCE_M;
  checkOffsetWork(regions, delta, join, arcTol);
  return run((m) => {
    const s = toPaths(m, regions, 'regions');
    try {
      // Inflate works on the union of its input; unite first so touching regions offset as one.
      const u = m.UnionSelfD(s, m.FillRule.NonZero, PRECISION);
      try {
        const jt = join === 'round' ? m.JoinType.Round : join === 'miter' ? m.JoinType.Miter : m.JoinType.Square;
        return m.InflatePathsD(u, delta * MM, jt, m.EndType.Polygon, opts.miterLimit ?? 2, PRECISION, arcTol * MM);
      } finally { u.delete(); }
    } finally { s.delete(); }
  });
}

/**
 * The area a round tool of radius `radius` sweeps along tool-centre polylines: each polyline grown by the radius with
 * round ends and joins (Minkowski sum with a disc). `closed` paths are loops (the last point joins the first).
 * Used by core/toolpath to find what a cut removes.
 */
export function sweptArea(paths: { points: Ring; closed: boolean }[], radius: number, opts: { arcTolerance?: number } = {}): Region[] {
  if (!(Number.isFinite(radius) && radius > 0)) throw new InputError('out-of-range', 'radius', 'a tool radius in metres above 0', describe(radius));
  const open = paths.filter((p) => !p.closed && p.points.length >= 1);
  const loops = paths.filter((p) => p.closed && p.points.length >= 2);
  if (!open.length && !loops.length) return [];
  const arcTol = opts.arcTolerance ?? ARC_TOLERANCE_M;
  return run((m) => {
    const out = new m.PathsD();
    try {
      for (const [list, end] of [[open, m.EndType.Round], [loops, m.EndType.Joined]] as const) {
        if (!list.length) continue;
        const s = new m.PathsD();
        try {
          list.forEach((p, i) => {
            p.points.forEach((q, j) => {
              if (!Number.isFinite(q.x) || !Number.isFinite(q.y) || Math.abs(q.x) > MAX_COORD_M || Math.abs(q.y) > MAX_COORD_M) {
                throw new InputError('invalid-number', `paths[${i}].points[${j}]`, `a point with finite x and y within ±${MAX_COORD_M} m`, describe(q));
              }
            });
            // A single point (a plunge) is a zero-length path: give it a second point so the engine draws its disc.
            const pts = p.points.length === 1 ? [p.points[0]!, p.points[0]!] : p.points;
            const path = toPath(m, pts);
            try { s.push_back(path); } finally { path.delete(); }
          });
          const grown = m.InflatePathsD(s, radius * MM, m.JoinType.Round, end, 2, PRECISION, arcTol * MM);
          try { for (let i = 0, n = grown.size(); i < n; i++) { const g = grown.get(i); try { out.push_back(g); } finally { g.delete(); } } } finally { grown.delete(); }
        } finally { s.delete(); }
      }
      return m.UnionSelfD(out, m.FillRule.NonZero, PRECISION);
    } finally { out.delete(); }
  });
}
