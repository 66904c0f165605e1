/**
 * Fabrication checks for the design's process (FabProcess): each finding names its pieces and location and says
 * what to change.
 *
 * - Cut width of the tool: end mill = its diameter; V-bit = tip + 2·depth·tan(angle/2) (the V's width at the cutting
 *   depth, plain geometry); etching = the process's minimum feature (artwork gaps shrink by 2 × edge bias).
 * - Gaps narrower than the cut cannot be made (the copper would stay and bridge); found by a morphological closing
 *   of the copper with a disc of the tool's radius: closing − copper = what the tool cannot remove. Leftovers between
 *   pieces that do not share a node are gaps (error); leftovers where pieces meet are inside corners a round tool
 *   leaves filleted (info; not for etching).
 * - Copper narrower than the cut (milling): fragile, lifts easily (common practice) → warning; etching: below the
 *   minimum feature → error.
 * - Ground copper closer than 3h to a line (project rule): the microstrip model no longer holds there; the
 *   size of the Z0 change is given for the one case the project computed with a 2-D field solver, otherwise said to be not modelled.
 * - Copper off the board or inside a keep-out → error. Non-adjacent pieces overlapping → error (impossible layout).
 * - Loss per path above a budget (default 1 dB, common practice); lossy laminate (tanδ ≥ 0.01) above 6 GHz → warning.
 * - Paths out of their phase tolerance (from the paths report) → warning.
 * Layout problems from sizing are carried over as errors.
 */
import type { BoardGeometry, Region, Vec2, Box } from '../geometry/types.ts';
import { differenceRegions, intersectRegions, offsetRegions, regionsArea, unionRegions, ringArea } from '../geometry/polygons.ts';
import { InputError, exhaustive } from '../util/errors.ts';
import type { FabProcess } from '../design/types.ts';
import { LineCache } from './lineCache.ts';
import { lineModels } from '../line/index.ts';
import { designPaths, type PathReport } from './paths.ts';
import { proximityHits } from './proximity.ts';
import { proximityLimitFor } from '../design/proximity-limit.ts';
import { defaultGroundClearance } from './geometry.ts';
import { fenceFindings } from './fence-check.ts';
import { asMadeTemplate } from './as-made.ts';
import type { SizedDesign, SizedPiece } from './types.ts';
import { namer } from '../design/names.ts';

export type FindingCode =
  | 'layout' | 'min-width' | 'min-gap' | 'inside-corner' | 'depth-sensitivity' | 'ground-near' | 'off-board' | 'keep-out'
  | 'overlap' | 'loss-budget' | 'lossy-laminate' | 'phase' | 'via-fence' | 'proximity';

export interface Finding {
  severity: 'error' | 'warning' | 'info';
  code: FindingCode;
  message: string;
  /** What to change. */
  fix: string;
  /** Pieces, nodes or areas involved. */
  subjects: string[];
  /** Where on the board, m. */
  at?: Vec2;
}

export interface CheckOptions {
  /** Path loss budget, dB (default 1). */
  lossLimitDb?: number;
  /** Paths report to check (default: designPaths(sized)). */
  paths?: PathReport[];
  /** Runs closer than this (edge to edge, m) get a coupling estimate (default: the design's own limit, else 3·h; 0 switches it off). */
  proximityLimit?: number;
}

export const DEFAULT_LOSS_LIMIT_DB = 1;
const MIN_AREA = 1e-12; // 1 µm², below which leftovers are numerical dust
/** Most tiles the round-tool check works in (a 1 m board in 5 mm tiles); beyond it the tiling is refused. */
const MAX_TILES = 40_000;

/** The process's cut width lives with the rest of what the process cuts (process-cut.ts). */
export { cutWidth } from './process-cut.ts';
import { cutWidth } from './process-cut.ts';

/** Reference Z0 change from top-side ground copper at gap s on both sides (the project's own 2-D field-solver reference, one case). */
const GROUND_TABLE: [number, number][] = [[0.25, -22.8], [0.63, -9.8], [1, -5.0], [2, -1.3], [3, -0.48], [5, -0.12]];
export function referenceGroundShiftPct(sOverH: number): number | null {
  if (sOverH < GROUND_TABLE[0]![0] || sOverH > GROUND_TABLE[GROUND_TABLE.length - 1]![0]) return null;
  for (let i = 0; i + 1 < GROUND_TABLE.length; i++) {
    const [x0, y0] = GROUND_TABLE[i]!, [x1, y1] = GROUND_TABLE[i + 1]!;
    if (sOverH >= x0 && sOverH <= x1) {
      const t = (Math.log(sOverH) - Math.log(x0)) / (Math.log(x1) - Math.log(x0));
      return y0 + t * (y1 - y0);
    }
  }
  return null;
}

function boxOfRegions(rs: Region[]): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const r of rs) for (const p of r.outer) {
    if (p.x < minX) minX = p.x; if (p.x > maxX) maxX = p.x; if (p.y < minY) minY = p.y; if (p.y > maxY) maxY = p.y;
  }
  return { minX, minY, maxX, maxY };
}
const boxesMeet = (a: Box, b: Box, m = 0) => a.minX - m <= b.maxX && b.minX - m <= a.maxX && a.minY - m <= b.maxY && b.minY - m <= a.maxY;

/**
 * Uniform grid over bounding boxes, so neighbour queries stay near-linear on big feeds. The cell is a few times the
 * typical (median) piece size; long pieces are entered in every cell they cover.
 */
class BoxGrid<T> {
  private cells = new Map<string, T[]>();
  constructor(private cell: number) {}
  private range(b: Box): [number, number, number, number] {
    const c = this.cell;
    return [Math.floor(b.minX / c), Math.floor(b.maxX / c), Math.floor(b.minY / c), Math.floor(b.maxY / c)];
  }
  insert(b: Box, item: T): void {
    const [x0, x1, y0, y1] = this.range(b);
    for (let gx = x0; gx <= x1; gx++) for (let gy = y0; gy <= y1; gy++) {
      const k = `${gx},${gy}`;
      const l = this.cells.get(k); if (l) l.push(item); else this.cells.set(k, [item]);
    }
  }
  query(b: Box): Set<T> {
    const out = new Set<T>();
    const [x0, x1, y0, y1] = this.range(b);
    // A window far larger than the cells (a huge tool radius): walk the filled cells instead of the empty ones.
    if ((x1 - x0 + 1) * (y1 - y0 + 1) > this.cells.size) {
      for (const [k, items] of this.cells) {
        const [gx, gy] = k.split(',').map(Number) as [number, number];
        if (gx >= x0 && gx <= x1 && gy >= y0 && gy <= y1) for (const it of items) out.add(it);
      }
      return out;
    }
    for (let gx = x0; gx <= x1; gx++) for (let gy = y0; gy <= y1; gy++) for (const it of this.cells.get(`${gx},${gy}`) ?? []) out.add(it);
    return out;
  }
  static cellFor(boxes: Box[]): number {
    if (!boxes.length) return 1e-3;
    const spans = boxes.map((b) => Math.max(b.maxX - b.minX, b.maxY - b.minY)).sort((a, b) => a - b);
    return Math.max(4 * spans[Math.floor(spans.length / 2)]!, 1e-4);
  }
}

/**
 * What a round tool of radius r cannot remove: closing(copper) − copper, with closing = dilate by r then erode by r
 * (round joins). Done in tiles built from the per-piece outlines, because the engine's erosion of one huge outline is
 * far slower than many small ones; a point's result depends only on copper within 2r, so each tile works on a window
 * 2r + 10 µm larger than the part it keeps. Slivers thinner than 1 µm (grid noise along long edges) are dropped.
 */
export function untoolableCopper(geometry: BoardGeometry, r: number, opts: { tile?: number } = {}): Region[] {
  const items = geometry.pieces.flatMap((p) => p.regions.map((reg) => ({ reg, box: boxOfRegions([reg]) })));
  if (!items.length || !(r > 0)) return [];
  const cell = BoxGrid.cellFor(items.map((i) => i.box));
  const grid = new BoxGrid<number>(cell);
  items.forEach((it, i) => grid.insert(it.box, i));
  const e = geometry.extent;
  const vertices = geometry.copper.reduce((n, c) => n + c.outer.length + c.holes.reduce((k, h) => k + h.length, 0), 0);
  // Small boards in one window; big ones in tiles of about 64 outlines each.
  const areaExt = Math.max(1e-12, (e.maxX - e.minX) * (e.maxY - e.minY));
  const T = opts.tile !== undefined ? Math.max(opts.tile, 4 * r) : vertices < 4000 ? Math.max(e.maxX - e.minX, e.maxY - e.minY) + 1e-3 : Math.max(cell, 20 * r, Math.sqrt((areaExt * 64) / items.length));
  const m = 2 * r + 10e-6;
  // Work bound: a tile count beyond this means a tile far finer than the board (or a radius far beyond it).
  const tiles = Math.ceil((e.maxX - Math.floor(e.minX / T) * T) / T) * Math.ceil((e.maxY - Math.floor(e.minY / T) * T) / T);
  if (!(tiles <= MAX_TILES)) {
    throw new InputError('impossible-layout', 'geometry', `at most ${MAX_TILES} tiles for the round-tool check`, `${tiles} tiles of ${mmS(T)} mm`, 'check the process tool size and the board size');
  }
  const out: Region[] = [];
  for (let x0 = Math.floor(e.minX / T) * T; x0 < e.maxX; x0 += T) {
    for (let y0 = Math.floor(e.minY / T) * T; y0 < e.maxY; y0 += T) {
      const win: Box = { minX: x0 - m, minY: y0 - m, maxX: x0 + T + m, maxY: y0 + T + m };
      const hits = [...grid.query(win)];
      if (!hits.length) continue;
      const winR: Region = { outer: [{ x: win.minX, y: win.minY }, { x: win.maxX, y: win.minY }, { x: win.maxX, y: win.maxY }, { x: win.minX, y: win.maxY }], holes: [] };
      const local = intersectRegions(unionRegions(hits.map((i) => items[i]!.reg)), [winR]);
      if (!local.length) continue;
      const closed = offsetRegions(offsetRegions(local, r, 'round'), -r, 'round');
      const left = differenceRegions(closed, local);
      if (!left.length) continue;
      const core: Region = { outer: [{ x: x0, y: y0 }, { x: x0 + T, y: y0 }, { x: x0 + T, y: y0 + T }, { x: x0, y: y0 + T }], holes: [] };
      for (const reg of intersectRegions(left, [core])) {
        const a = Math.abs(ringArea(reg.outer));
        if (a <= MIN_AREA) continue;
        let per = 0;
        for (let i = 0; i < reg.outer.length; i++) { const p = reg.outer[i]!, q = reg.outer[(i + 1) % reg.outer.length]!; per += Math.hypot(q.x - p.x, q.y - p.y); }
        if (a / (per / 2) < 1e-6) continue;
        out.push(reg);
      }
    }
  }
  return out;
}

/** Distance from p to a region's copper (0 inside). */
function distToRegion(p: Vec2, r: Region): number {
  let inside = false, d = Infinity;
  for (const ring of [r.outer, ...r.holes]) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[i]!, b = ring[j]!;
      if ((a.y > p.y) !== (b.y > p.y) && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
      d = Math.min(d, distToSegment(p, a, b));
    }
  }
  return inside ? 0 : d;
}

/**
 * The per-piece and per-node outlines of a board with who owns them: a piece touches its two end nodes; node copper
 * (a bend, a junction square, a pad) touches its node. Two owners are adjacent when they share a node, or when they
 * are the copper of two nodes joined by one piece.
 */
function outlineOwners(sized: SizedDesign, geometry: BoardGeometry) {
  const pieceById = new Map(sized.pieces.map((p) => [p.id, p]));
  const nodesOf = new Map<string, string[]>();
  for (const o of geometry.pieces) {
    const p = pieceById.get(o.id);
    nodesOf.set(o.id, p ? [p.a, p.b] : [o.id]);
  }
  const joined = new Set<string>();
  for (const p of sized.pieces) { joined.add(`${p.a}|${p.b}`); joined.add(`${p.b}|${p.a}`); }
  const items = geometry.pieces.filter((o) => o.regions.length).map((o) => ({ id: o.id, regions: o.regions, box: boxOfRegions(o.regions) }));
  const grid = new BoxGrid<number>(BoxGrid.cellFor(items.map((i) => i.box)));
  items.forEach((it, i) => grid.insert(it.box, i));
  return {
    near(c: Vec2, reach: number): { id: string; d: number }[] {
      const found = [...grid.query({ minX: c.x - reach, maxX: c.x + reach, minY: c.y - reach, maxY: c.y + reach })]
        .map((i) => ({ id: items[i]!.id, d: Math.min(...items[i]!.regions.map((r) => distToRegion(c, r))) }))
        .sort((a, b) => a.d - b.d);
      return found.slice(0, 2);
    },
    sharedNode(a: string, b: string): string | undefined {
      const na = nodesOf.get(a) ?? [a], nb = nodesOf.get(b) ?? [b];
      return na.find((n) => nb.includes(n));
    },
    adjacent(a: string, b: string): boolean {
      const na = nodesOf.get(a) ?? [a], nb = nodesOf.get(b) ?? [b];
      if (na.some((n) => nb.includes(n))) return true;
      return na.length === 1 && nb.length === 1 && joined.has(`${na[0]}|${nb[0]}`);
    },
    items, grid,
  };
}

function centreBox(sized: SizedDesign, p: SizedPiece, grow: number): Box | null {
  const c = sized.centrelines[p.id];
  if (!c || c.length < 2) return null;
  return {
    minX: Math.min(c[0]!.x, c[1]!.x) - grow, maxX: Math.max(c[0]!.x, c[1]!.x) + grow,
    minY: Math.min(c[0]!.y, c[1]!.y) - grow, maxY: Math.max(c[0]!.y, c[1]!.y) + grow,
  };
}

function centroid(r: Region): Vec2 {
  let cx = 0, cy = 0, a = 0;
  const ring = r.outer;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i]!, q = ring[(i + 1) % ring.length]!;
    const c = p.x * q.y - q.x * p.y;
    a += c; cx += (p.x + q.x) * c; cy += (p.y + q.y) * c;
  }
  if (Math.abs(a) < 1e-30) return ring[0]!;
  return { x: cx / (3 * a), y: cy / (3 * a) };
}

function distToSegment(p: Vec2, a: Vec2, b: Vec2): number {
  const dx = b.x - a.x, dy = b.y - a.y;
  const l2 = dx * dx + dy * dy;
  const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / l2));
  return Math.hypot(p.x - a.x - t * dx, p.y - a.y - t * dy);
}
const mmS = (m: number) => (m * 1e3).toFixed(3);
/** A readable list: the first 12 names, then how many more. */
const listNames = (names: string[]) => names.slice(0, 12).join(', ') + (names.length > 12 ? ` and ${names.length - 12} more` : '');
const at = (p: Vec2) => `(${mmS(p.x)}, ${mmS(p.y)}) mm`;

/**
 * All fabrication findings for a sized design and its geometry (from buildBoardGeometry). Needs the polygon engine.
 */
export function checkFabrication(sized: SizedDesign, geometry: BoardGeometry, opts: CheckOptions = {}): Finding[] {
  const out: Finding[] = [];
  const doc = sized.doc;
  // Messages name pieces and ports as the user labelled them; `subjects` keep the ids for selecting them.
  const name = namer(doc);
  const listOf = (ids: string[]) => listNames(ids.map(name));
  const proc = doc.process;
  const h = doc.substrate.h;
  const lines = sized.pieces.filter((p) => (p.kind === 'line' || p.kind === 'taper') && Number.isFinite(p.width));

  out.push(...problemFindings(sized));

  // ---- widths and gaps the tool cannot make
  const cut = cutWidth(proc);
  const procName = proc.kind === 'end-mill' ? `the ${mmS(proc.toolDiameter)} mm end mill`
    : proc.kind === 'v-bit' ? `the ${proc.angleDeg}° V-bit (${mmS(proc.tipWidth)} mm tip at ${mmS(proc.depth)} mm deep cuts ${mmS(cut)} mm wide)`
      : `etching (minimum feature ${mmS(proc.minFeature)} mm, edge bias ${mmS(proc.edgeBias)} mm)`;
  const minW = proc.kind === 'etch' ? proc.minFeature : cut;
  for (const p of lines) {
    const w = Math.min(p.width, p.widthB ?? p.width, ...(p.sections ?? []).map((s) => s.width));
    if (w < minW) {
      out.push({
        severity: proc.kind === 'etch' ? 'error' : 'warning', code: 'min-width', subjects: [p.id],
        message: `${name(p.id)} is ${mmS(w)} mm wide, narrower than ${proc.kind === 'etch' ? 'the minimum feature' : 'one cut'} of ${procName}`,
        fix: proc.kind === 'etch' ? 'use a thicker substrate (wider lines for the same Z0) or a finer process' : 'narrow copper lifts easily when milled (common practice): use a thicker substrate, lower Z0, or a finer tool',
        ...(pieceCentre(sized, p) ? { at: pieceCentre(sized, p)! } : {}),
      });
    }
  }
  if (proc.kind === 'v-bit' && lines.length) {
    // Depth error changes every line's width by ∓2·tan(α/2)·Δdepth (plain V geometry); show it on the narrowest line.
    const narrow = lines.reduce((a, b) => (b.width < a.width ? b : a));
    // ±0.05 mm: about what a clamped blank bows or varies in thickness (common practice).
    const dDepth = 0.05e-3;
    const dW = 2 * Math.tan(((proc.angleDeg * Math.PI) / 180) / 2) * dDepth;
    try {
      const cache = new LineCache(doc.substrate, undefined, (sized.lineModels ?? lineModels).strip());
      const zLo = cache.forWidth(Math.max(1e-6, narrow.width - dW), sized.f0).z0, zHi = cache.forWidth(narrow.width + dW, sized.f0).z0;
      out.push({
        severity: 'info', code: 'depth-sensitivity', subjects: [narrow.id],
        message: `±${mmS(dDepth)} mm of cutting depth moves every edge by ${mmS(dW / 2)} mm: ${name(narrow.id)} (${mmS(narrow.width)} mm, ${narrow.z0.toFixed(1)} Ω) then ranges ${zHi.toFixed(1)}–${zLo.toFixed(1)} Ω`,
        fix: 'level the blank (probe or face it) and set the depth carefully; a narrower V angle is less sensitive',
      });
    } catch { /* width outside the model: nothing to add */ }
  }
  if (geometry.copper.length) {
    const r = cut / 2;
    const left = untoolableCopper(geometry, r);
    const corners = new Map<string, { n: number; at: Vec2 }>();
    const gapPairs = new Set<string>();
    const owners = outlineOwners(sized, geometry);
    for (const reg of left) {
      const c = centroid(reg);
      // The two nearest outlines (pieces or node copper) of different owners, by distance to their copper.
      const near = owners.near(c, cut);
      if (near.length < 2) continue;
      const [a, b] = [near[0]!, near[1]!];
      const adjacent = owners.adjacent(a.id, b.id);
      const pairKey = a.id < b.id ? `${a.id}|${b.id}` : `${b.id}|${a.id}`;
      if (!adjacent && b.d < cut) {
        if (gapPairs.has(pairKey)) continue;
        gapPairs.add(pairKey);
        out.push({
          severity: 'error', code: 'min-gap', subjects: [a.id, b.id], at: c,
          message: `the gap between ${name(a.id)} and ${name(b.id)} near ${at(c)} is narrower than ${procName} can cut (${mmS(cut)} mm); the copper would stay and join them`,
          fix: `move them at least ${mmS(cut)} mm apart (better 3·W to limit coupling) or use a finer tool`,
        });
      } else if (proc.kind !== 'etch') {
        const key = owners.sharedNode(a.id, b.id) ?? a.id;
        const e = corners.get(key);
        if (e) e.n++; else corners.set(key, { n: 1, at: c });
      }
    }
    if (corners.size) {
      const list = [...corners.entries()];
      const names = list.slice(0, 12).map(([n]) => name(n)).join(', ') + (list.length > 12 ? ` and ${list.length - 12} more` : '');
      out.push({
        severity: 'info', code: 'inside-corner', subjects: list.map(([n]) => n), at: list[0]![1].at,
        message: `inside corners at ${names} keep fillets of radius ${mmS(r)} mm that ${procName} cannot cut`,
        fix: 'usually harmless; a smaller tool for the finishing pass makes them sharper',
      });
    }
  }

  // ---- ground copper near lines
  const defaultClear = defaultGroundClearance(sized);
  for (const a of doc.areas ?? []) {
    if (a.kind !== 'ground-copper') continue;
    const c = a.clearance ?? defaultClear;
    if (c < cut) {
      out.push({ severity: 'error', code: 'min-gap', subjects: [a.id], message: `ground copper ${a.id} keeps ${mmS(c)} mm from the network, narrower than ${procName} can cut`, fix: `set its clearance to at least ${mmS(cut)} mm` });
    }
    const wBig = Math.max(0, ...lines.map((p) => p.width));
    if (c >= 3 * h && c < 5 * wBig) {
      out.push({
        severity: 'info', code: 'ground-near', subjects: [a.id],
        message: `ground copper ${a.id} keeps ${mmS(c)} mm, less than 5 × the widest line (${mmS(5 * wBig)} mm): some makers size lines with a coplanar model below that; beyond 3h the microstrip model is used here`,
        fix: `keep ${mmS(5 * wBig)} mm if the board has room`,
      });
    }
    if (c < 3 * h && !asMadeTemplate(doc)) { // lines sized as made already carry the side copper (as-made.ts)
      const ground = geometry.groundCopper;
      if (!ground.length || !geometry.copper.length) continue;
      // The copper lying within 3h of ground copper, found in one pass; then which pieces that copper belongs to.
      const zone = intersectRegions(offsetRegions(ground, 3 * h * 0.999, 'round'), geometry.copper).filter((z) => Math.abs(ringArea(z.outer)) > MIN_AREA);
      if (!zone.length) continue;
      const wMax = Math.max(0, ...lines.map((p) => Math.max(p.width, p.widthB ?? 0)));
      const boxes = lines.map((p) => centreBox(sized, p, wMax));
      const grid = new BoxGrid<SizedPiece>(BoxGrid.cellFor(boxes.filter((b): b is Box => !!b)));
      lines.forEach((p, i) => { const b = boxes[i]; if (b) grid.insert(b, p); });
      const nearSet = new Set<string>();
      for (const z of zone) for (const q of z.outer) {
        for (const p of grid.query({ minX: q.x, maxX: q.x, minY: q.y, maxY: q.y })) {
          if (!nearSet.has(p.id) && centrelineDistance(sized, p, q) <= Math.max(p.width, p.widthB ?? 0) / 2 + 1e-6) nearSet.add(p.id);
        }
      }
      const near = lines.filter((p) => nearSet.has(p.id)).map((p) => p.id);
      if (!near.length) continue;
      const ref = referenceGroundShiftPct(c / h);
      const moved = ref === null
        ? 'how far Z0 moves is not modelled for this gap'
        : `for the one case computed with a 2-D field solver (50 Ω on εr 3.66, h 0.508 mm, copper on both sides) this gap ratio lowers Z0 by about ${Math.abs(ref).toFixed(1)} %; for these lines it is not modelled`;
      out.push({
        severity: 'warning', code: 'ground-near', subjects: [a.id, ...near],
        message: `ground copper ${a.id} comes ${mmS(c)} mm (${(c / h).toFixed(2)} h) from ${listOf(near)}, closer than 3h = ${mmS(3 * h)} mm where the microstrip model holds; ${moved}`,
        fix: `widen the clearance of ${a.id} to at least ${mmS(3 * h)} mm, or size these lines as grounded coplanar lines`,
      });
    }
  }

  // ---- side copper of lines sized as made: the via fence (fence-check.ts)
  out.push(...fenceFindings(doc));

  // ---- copper off the board and in keep-outs
  if (geometry.outline) {
    const off = differenceRegions(geometry.copper, [geometry.outline]);
    if (regionsArea(off) > MIN_AREA) {
      const who = geometry.pieces.filter((o) => o.regions.length && regionsArea(differenceRegions(o.regions, [geometry.outline!])) > MIN_AREA).map((o) => o.id);
      out.push({ severity: 'error', code: 'off-board', subjects: who, message: `copper of ${listOf(who)} lies outside the board outline (${(regionsArea(off) * 1e6).toFixed(3)} mm²)`, fix: 'enlarge the board outline or move these pieces inside it', at: centroid(off[0]!) });
    }
  }
  for (const k of geometry.keepouts) {
    const hit = intersectRegions(geometry.copper, [k]);
    if (regionsArea(hit) <= MIN_AREA) continue;
    const who = geometry.pieces.filter((o) => o.regions.length && regionsArea(intersectRegions(o.regions, [k])) > MIN_AREA).map((o) => o.id);
    const area = (doc.areas ?? []).find((a) => a.kind === 'keep-out' && a.polygon.length === k.outer.length);
    out.push({ severity: 'error', code: 'keep-out', subjects: [...(area ? [area.id] : []), ...who], message: `copper of ${listOf(who)} lies inside keep-out ${area ? name(area.id) : ''}`.trim(), fix: 'route these pieces around the keep-out or shrink it', at: centroid(hit[0]!) });
  }

  // ---- overlapping pieces (not sharing a node)
  out.push(...overlaps(sized, geometry));

  // ---- runs side by side: estimated coupling at f0 (proximity.ts)
  out.push(...proximityFindings(sized, opts.proximityLimit ?? proximityLimitFor(sized.doc)));

  // ---- loss and phase
  const limit = opts.lossLimitDb ?? DEFAULT_LOSS_LIMIT_DB;
  let paths: PathReport[] = [];
  try { paths = opts.paths ?? designPaths(sized); } catch { paths = []; }
  const lossy = doc.substrate.tanDelta >= 0.01;
  for (const rep of paths) {
    const over = rep.paths.filter((e) => e.lossDb > limit);
    if (over.length) {
      const worst = over.reduce((a, b) => (b.lossDb > a.lossDb ? b : a));
      const least = over.reduce((a, b) => (b.lossDb < a.lossDb ? b : a));
      // Every path over the budget is named and marked alike (its pieces are the finding's subjects).
      const alike = worst.lossDb - least.lossDb < 0.005;
      out.push({
        severity: 'warning', code: 'loss-budget', subjects: [...new Set([...over.map((e) => e.to), ...over.flatMap((e) => e.pieces)])],
        message: over.length === 1
          ? `path ${rep.fromName} → ${worst.toName} loses ${worst.lossDb.toFixed(2)} dB at f0 in its lines, above the ${limit} dB budget`
          : alike
            ? `${over.length} paths from ${rep.fromName} (to ${listNames(over.map((e) => e.toName))}) each lose ${worst.lossDb.toFixed(2)} dB at f0 in their lines, above the ${limit} dB budget`
            : `${over.length} paths from ${rep.fromName} (to ${listNames(over.map((e) => e.toName))}) lose ${least.lossDb.toFixed(2)}–${worst.lossDb.toFixed(2)} dB at f0 in their lines, above the ${limit} dB budget (most: ${worst.toName})`,
        fix: lossy ? `a low-loss laminate (tanδ ≈ 0.001–0.004) cuts the dielectric part, which dominates on this board (tanδ ${doc.substrate.tanDelta}); or shorten the paths` : 'shorten the paths or use wider (lower-loss) lines where the impedance allows',
      });
    }
    const bad = rep.warnings.filter((w) => w.severity !== 'info');
    const shown = bad.length > 8 ? bad.slice(0, 8) : bad;
    for (const w of shown) {
      out.push({ severity: w.severity === 'error' ? 'error' : 'warning', code: 'phase', subjects: w.subjects ?? [], message: w.message, fix: 'balance the paths\' electrical lengths (same lengths, widths and bend counts)' });
    }
    if (bad.length > shown.length) {
      out.push({ severity: 'warning', code: 'phase', subjects: [], message: `and ${bad.length - shown.length} more phase findings in ${rep.name}`, fix: 'see the paths report' });
    }
  }
  if (lossy && sized.f0 > 6e9) {
    out.push({ severity: 'warning', code: 'lossy-laminate', subjects: [], message: `tanδ ${doc.substrate.tanDelta} at ${(sized.f0 / 1e9).toFixed(2)} GHz: glass-epoxy boards lose quickly above about 6 GHz`, fix: 'use a low-loss laminate for this frequency, or keep every path short' });
  }
  return out;
}

/** Sizing problems as error findings (code 'layout'), each naming its pieces. */
export function problemFindings(sized: SizedDesign): Finding[] {
  return sized.problems.map((p) => ({
    severity: 'error' as const, code: 'layout' as const, message: p.message, subjects: p.subjects,
    fix: p.code === 'too-large' ? 'raise the design frequency or shorten the pieces named, so the board fits' : 'see the message: change the lengths, ends or topology it names',
  }));
}

function pieceCentre(sized: SizedDesign, p: SizedPiece): Vec2 | null {
  const c = sized.centrelines[p.id];
  return c && c.length >= 2 ? { x: (c[0]!.x + c[1]!.x) / 2, y: (c[0]!.y + c[1]!.y) / 2 } : null;
}

function centrelineDistance(sized: SizedDesign, p: SizedPiece, q: Vec2): number {
  const c = sized.centrelines[p.id];
  return c && c.length >= 2 ? distToSegment(q, c[0]!, c[1]!) : Infinity;
}

/** Pairs of pieces that do not share a node but whose copper overlaps; bucketed on a grid by bounding box. */
function overlaps(sized: SizedDesign, geometry: BoardGeometry): Finding[] {
  const name = namer(sized.doc);
  const owners = outlineOwners(sized, geometry);
  const { items, grid } = owners;
  const out: Finding[] = [];
  for (let i = 0; i < items.length; i++) {
    for (const j of grid.query(items[i]!.box)) {
      if (j <= i) continue;
      const A = items[i]!, B = items[j]!;
      if (owners.adjacent(A.id, B.id) || !boxesMeet(A.box, B.box)) continue;
      const hit = intersectRegions(A.regions, B.regions);
      if (regionsArea(hit) > MIN_AREA) {
        out.push({ severity: 'error', code: 'overlap', subjects: [A.id, B.id], at: centroid(hit[0]!), message: `${name(A.id)} and ${name(B.id)} overlap although they are not connected there`, fix: 'change the lengths or the drawn directions so the pieces do not cross' });
      }
    }
  }
  return out;
}

/** Proximity findings: each pair of runs closer than `limit`, with its estimated coupling; warning above −20 dB. */
function proximityFindings(sized: SizedDesign, limit: number): Finding[] {
  if (!(limit > 0)) return [];
  const h = sized.doc.substrate.h;
  const name = namer(sized.doc);
  return proximityHits(sized, limit).map((x) => ({
    severity: x.couplingDb > -20 ? 'warning' as const : 'info' as const, code: 'proximity' as const, subjects: [x.a, x.b], at: x.at,
    message: `${name(x.a)} and ${name(x.b)} run side by side for ${mmS(x.length)} mm, ${mmS(x.gap)} mm apart (${(x.gap / h).toFixed(2)} h, under the ${mmS(limit)} mm limit): about ${x.couplingDb.toFixed(1)} dB couples from one to the other at f0 (coupled-pair estimate)`,
    fix: `move them further apart (the coupling falls quickly beyond 3h = ${mmS(3 * h)} mm) or shorten the side-by-side stretch, if this coupling matters here`,
  }));
}
