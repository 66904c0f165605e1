/**
 * The board as milled: the copper-clad blank minus everything the tools sweep (swept.ts), and what that does to the
 * design.
 * - Islands: each milled copper island is matched with the design's copper islands it overlaps. Two design islands
 *   in one milled island were joined (the cut could not pass between them); a design island that lost most of its
 *   copper or fell into several milled islands was destroyed or cut through; milled islands with no design copper
 *   are leftover copper (normal for isolation without clearing).
 * - Widths as milled: across the middle of every line piece, the chord of the milled copper through the centreline
 *   (top of the copper). The flanks of a V-bit cut slope at half its angle, so the copper's foot is wider than its
 *   top by 2·t·tan(angle/2) (plain cone geometry); an end mill cuts straight flanks. The trapezoid is taken as a
 *   rectangle of its mean width (an approximation: the line model knows only rectangular strips), and the Z0 shift is
 *   the line model's Z0 at that width minus Z0 at the drawn width, both at f0. The V-bit's trench in the dielectric
 *   below the gaps is not modelled.
 */
import { intersectRegions, pointInRegion, regionArea, regionsArea, differenceRegions } from '../geometry/polygons.ts';
import type { BoardGeometry, Region, Vec2 } from '../geometry/types.ts';
import { LineCache } from '../layout/lineCache.ts';
import { lineModels } from '../line/index.ts';
import type { SizedDesign } from '../layout/types.ts';
import type { Tool } from './types.ts';

export interface MilledPiece {
  id: string;
  /** Where the width was taken (middle of the centreline), m. */
  at: Vec2;
  /** Drawn copper width there, m. */
  drawnWidth: number;
  /** Milled copper width at the top of the copper, m. */
  topWidth: number;
  /** Milled copper width at its foot, m. */
  footWidth: number;
  /** Z0 at f0 of the drawn width and of the mean milled width, Ω. */
  z0Drawn: number;
  z0Milled: number;
  /** z0Milled − z0Drawn, Ω. */
  z0Shift: number;
  /** True when the milled copper runs on past the drawn edge by more than a cut (joined to other copper). */
  joined: boolean;
}

export interface MilledIsland {
  /** Copper left, m². */
  area: number;
  /** Indices into the design's copper islands (network copper first, then ground copper) it contains. */
  designIslands: number[];
}

export interface MilledBoard {
  /** Copper left on the board. */
  copper: Region[];
  /** The area the tools swept at the copper surface. */
  swept: Region[];
  islands: MilledIsland[];
  /** Per design island: the pieces it is made of (ground copper: its index as 'ground N'). */
  designIslands: { subjects: string[]; area: number; keptArea: number; milledIslands: number }[];
  pieces: MilledPiece[];
}

const MIN_AREA = 1e-12; // 1 µm²: below this, an overlap is numerical dust

function box(rs: Region[]) {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const r of rs) for (const p of r.outer) { if (p.x < minX) minX = p.x; if (p.x > maxX) maxX = p.x; if (p.y < minY) minY = p.y; if (p.y > maxY) maxY = p.y; }
  return { minX, minY, maxX, maxY };
}
const meets = (a: ReturnType<typeof box>, b: ReturnType<typeof box>) => a.minX <= b.maxX && b.minX <= a.maxX && a.minY <= b.maxY && b.minY <= a.maxY;

/** A point inside a piece's copper. */
function pieceProbe(regions: Region[], centreline: Vec2[]): Vec2 {
  if (centreline.length >= 2) {
    const a = centreline[0]!, b = centreline[centreline.length - 1]!;
    const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    if (regions.some((r) => pointInRegion(mid, r))) return mid;
  }
  const ring = regions[0]!.outer;
  let cx = 0, cy = 0, a2 = 0;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i]!, q = ring[(i + 1) % ring.length]!;
    const c = p.x * q.y - q.x * p.y;
    a2 += c; cx += (p.x + q.x) * c; cy += (p.y + q.y) * c;
  }
  return Math.abs(a2) < 1e-30 ? ring[0]! : { x: cx / (3 * a2), y: cy / (3 * a2) };
}

/**
 * Length of the chord of `regions` along the line through `p` with unit direction `n`, measured on both sides of p
 * up to `reach`; 0 when p is not in copper. Crossings of every ring edge with the line, nearest on each side.
 */
export function chordWidth(regions: Region[], p: Vec2, n: Vec2, reach: number): number {
  let lo = -reach, hi = reach, inside = 0;
  const x0 = Math.min(p.x - n.x * reach, p.x + n.x * reach), x1 = Math.max(p.x - n.x * reach, p.x + n.x * reach);
  const y0 = Math.min(p.y - n.y * reach, p.y + n.y * reach), y1 = Math.max(p.y - n.y * reach, p.y + n.y * reach);
  for (const r of regions) {
    for (const ring of [r.outer, ...r.holes]) {
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
        const a = ring[j]!, b = ring[i]!;
        // Edges wholly beyond the chord's box cannot cross it within reach (they still count for parity below).
        if ((a.x < x0 && b.x < x0) || (a.x > x1 && b.x > x1) || (a.y < y0 && b.y < y0) || (a.y > y1 && b.y > y1)) {
          if (!crossesRay(a, b, p, n)) continue;
          inside ^= 1; continue;
        }
        // Solve p + t·n = a + u·(b − a).
        const ex = b.x - a.x, ey = b.y - a.y;
        const den = n.x * ey - n.y * ex;
        if (Math.abs(den) < 1e-30) continue;
        const wx = a.x - p.x, wy = a.y - p.y;
        const t = (wx * ey - wy * ex) / den;
        const u = (wx * n.y - wy * n.x) / den;
        if (u < 0 || u >= 1) continue;
        if (t >= 0) { if (t < hi) hi = t; inside ^= 1; } else if (t > lo) lo = t;
      }
    }
  }
  return inside ? hi - lo : 0;
}

/** Whether edge a→b crosses the ray p + t·n, t ≥ 0 (half-open in u, as in chordWidth). */
function crossesRay(a: Vec2, b: Vec2, p: Vec2, n: Vec2): boolean {
  const ex = b.x - a.x, ey = b.y - a.y;
  const den = n.x * ey - n.y * ex;
  if (Math.abs(den) < 1e-30) return false;
  const wx = a.x - p.x, wy = a.y - p.y;
  const t = (wx * ey - wy * ex) / den, u = (wx * n.y - wy * n.x) / den;
  return u >= 0 && u < 1 && t >= 0;
}

export function milledBoard(g: BoardGeometry, sized: SizedDesign, blank: Region, swept: Region[], isolationTool: Tool): MilledBoard {
  const copper = differenceRegions([blank], swept);
  const design = [...g.copper, ...g.groundCopper];
  const owners: string[][] = g.copper.map(() => []);
  // Which pieces make each network island: the island holding a point inside the piece's own copper (the middle
  // of its centreline when that is in its copper, else the centroid of its first outline).
  const boxes = g.copper.map((c) => box([c]));
  for (const o of g.pieces) {
    if (!o.regions.length) continue;
    const probe = pieceProbe(o.regions, o.centreline);
    for (let i = 0; i < g.copper.length; i++) {
      const b = boxes[i]!;
      if (probe.x < b.minX || probe.x > b.maxX || probe.y < b.minY || probe.y > b.maxY) continue;
      if (pointInRegion(probe, g.copper[i]!)) { owners[i]!.push(o.id); break; }
    }
  }
  g.groundCopper.forEach((_, k) => owners.push([`ground copper ${k + 1}`]));
  const mBoxes = copper.map((c) => box([c]));
  const islands: MilledIsland[] = copper.map((c) => ({ area: regionArea(c), designIslands: [] }));
  const designIslands = design.map((d, i) => {
    const db = box([d]);
    let kept = 0, count = 0;
    for (let m = 0; m < copper.length; m++) {
      if (!meets(db, mBoxes[m]!)) continue;
      const a = regionsArea(intersectRegions([copper[m]!], [d]));
      if (a > MIN_AREA) { kept += a; count++; islands[m]!.designIslands.push(i); }
    }
    return { subjects: owners[i]!, area: regionArea(d), keptArea: kept, milledIslands: count };
  });
  const pieces: MilledPiece[] = [];
  const cache = new LineCache(sized.doc.substrate, undefined, (sized.lineModels ?? lineModels).strip());
  const t = sized.doc.substrate.t;
  const flank = isolationTool.kind === 'v-bit' ? 2 * t * Math.tan(((isolationTool.angleDeg ?? 0) * Math.PI) / 360) : 0;
  const byId = new Map(g.pieces.map((o) => [o.id, o]));
  for (const p of sized.pieces) {
    if (p.kind !== 'line' && p.kind !== 'taper') continue;
    const o = byId.get(p.id);
    if (!o || o.centreline.length < 2 || !o.regions.length) continue;
    const [a, b] = [o.centreline[0]!, o.centreline[o.centreline.length - 1]!];
    const L = Math.hypot(b.x - a.x, b.y - a.y);
    if (L < 1e-9) continue;
    const at = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    const n = { x: -(b.y - a.y) / L, y: (b.x - a.x) / L };
    const drawn = chordWidth(o.regions, at, n, 1);
    if (!(drawn > 0)) continue;
    const reach = drawn / 2 + 2 * isolationTool.cutWidth + 1e-3;
    const top = chordWidth(copper, at, n, reach);
    const joined = top > drawn + 2 * isolationTool.cutWidth;
    const foot = top > 0 ? top + flank : 0;
    let z0Drawn = p.z0, z0Milled = p.z0;
    try {
      z0Drawn = cache.forWidth(drawn, sized.f0).z0;
      z0Milled = top > 0 && !joined ? cache.forWidth((top + foot) / 2, sized.f0).z0 : z0Drawn;
    } catch { /* width outside the line model: report widths only */ }
    pieces.push({ id: p.id, at, drawnWidth: drawn, topWidth: top, footWidth: foot, z0Drawn, z0Milled, z0Shift: z0Milled - z0Drawn, joined });
  }
  return { copper, swept, islands, designIslands, pieces };
}
