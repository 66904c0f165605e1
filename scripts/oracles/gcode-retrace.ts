/**
 * Re-tracing written G-code with an independent reader: gcode-toolpath (npm, MIT; the interpreter behind a widely
 * used CNC controller front end) turns the text into straight and arc moves in millimetres (it converts G20 inches
 * itself). Everything after that — arc flattening, the raster of what the tool sweeps, distances to copper — is
 * written here from plain geometry and shares no code with core/toolpath or core/export.
 */
import Toolpath from 'gcode-toolpath';

export interface P3 { x: number; y: number; z: number }
export interface Traced {
  /** Straight moves (arcs flattened to ≤ 0.5 µm chord error), mm. */
  moves: { rapid: boolean; a: P3; b: P3 }[];
  arcs: number;
  units: string;
  spindleOn: boolean;
  ended: boolean;
  /** Every G/M word seen, e.g. 'G0', 'M3'. */
  words: Set<string>;
}

/** Reads one program; `arcTol` is the chord error for flattening arcs, mm. */
export function retrace(text: string, arcTol = 0.0005): Traced {
  const moves: Traced['moves'] = [];
  let arcs = 0;
  const words = new Set<string>();
  const tp = new Toolpath({
    position: { x: 0, y: 0, z: 0 },
    addLine: (modal, v1, v2) => moves.push({ rapid: modal.motion === 'G0', a: { ...v1 }, b: { ...v2 } }),
    addArcCurve: (modal, v1, v2, v0) => {
      arcs++;
      const cw = modal.motion === 'G2';
      const r = Math.hypot(v1.x - v0.x, v1.y - v0.y);
      const a0 = Math.atan2(v1.y - v0.y, v1.x - v0.x);
      let sweep = Math.atan2(v2.y - v0.y, v2.x - v0.x) - a0;
      if (cw) { while (sweep >= -1e-12) sweep -= 2 * Math.PI; } else { while (sweep <= 1e-12) sweep += 2 * Math.PI; }
      const step = 2 * Math.acos(Math.max(-1, 1 - arcTol / Math.max(r, arcTol)));
      const n = Math.max(2, Math.ceil(Math.abs(sweep) / step));
      let prev = { ...v1 };
      for (let i = 1; i <= n; i++) {
        const u = a0 + (sweep * i) / n;
        const p = i === n ? { ...v2 } : { x: v0.x + r * Math.cos(u), y: v0.y + r * Math.sin(u), z: v1.z + ((v2.z - v1.z) * i) / n };
        moves.push({ rapid: false, a: prev, b: p });
        prev = p;
      }
    },
  });
  tp.loadFromStringSync(text, (data) => { for (const [w, v] of data.words) if (w === 'G' || w === 'M') words.add(`${w}${v}`); });
  return { moves, arcs, units: tp.getModal().units, spindleOn: words.has('M3'), ended: words.has('M2') || words.has('M30'), words };
}

// ---------------------------------------------------------------------------------------------------------------
// Plain geometry on copper outlines given as rings of {x, y} in mm.

export type Ring2 = { x: number; y: number }[];
export interface Poly { outer: Ring2; holes: Ring2[] }

function segDist(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax, dy = by - ay;
  const l2 = dx * dx + dy * dy;
  const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / l2));
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
}

function inRing(x: number, y: number, r: Ring2): boolean {
  let inside = false;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
    const a = r[i]!, b = r[j]!;
    if ((a.y > y) !== (b.y > y) && x < ((b.x - a.x) * (y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}
export function inPoly(x: number, y: number, p: Poly): boolean {
  return inRing(x, y, p.outer) && !p.holes.some((h) => inRing(x, y, h));
}

/** Distance from a point to a set of polygons (0 inside), with a uniform grid over their edges. */
export class CopperDistance {
  private cells = new Map<string, number[]>();
  private edges: number[] = [];
  constructor(private polys: Poly[], private cell = 0.5) {
    for (const p of polys) for (const r of [p.outer, ...p.holes]) for (let i = 0; i < r.length; i++) {
      const a = r[i]!, b = r[(i + 1) % r.length]!;
      const k = this.edges.length / 4;
      this.edges.push(a.x, a.y, b.x, b.y);
      for (let gx = Math.floor(Math.min(a.x, b.x) / cell); gx <= Math.floor(Math.max(a.x, b.x) / cell); gx++) {
        for (let gy = Math.floor(Math.min(a.y, b.y) / cell); gy <= Math.floor(Math.max(a.y, b.y) / cell); gy++) {
          const key = `${gx},${gy}`; const l = this.cells.get(key); if (l) l.push(k); else this.cells.set(key, [k]);
        }
      }
    }
  }
  /** Distance to the nearest copper edge within `reach` (or `reach` when none is nearer); 0 inside copper. */
  distance(x: number, y: number, reach: number): number {
    if (this.polys.some((p) => inPoly(x, y, p))) return 0;
    let best = reach;
    const c = this.cell;
    for (let gx = Math.floor((x - reach) / c); gx <= Math.floor((x + reach) / c); gx++) {
      for (let gy = Math.floor((y - reach) / c); gy <= Math.floor((y + reach) / c); gy++) {
        for (const k of this.cells.get(`${gx},${gy}`) ?? []) {
          const e = this.edges;
          const d = segDist(x, y, e[4 * k]!, e[4 * k + 1]!, e[4 * k + 2]!, e[4 * k + 3]!);
          if (d < best) best = d;
        }
      }
    }
    return best;
  }
}

/**
 * A raster of the board window: cells the tool sweeps (a disc of `radius` mm along each cutting move) and a flood
 * fill through the rest. Used to see that each copper island is enclosed by cuts.
 */
export class SweepRaster {
  readonly nx: number; readonly ny: number;
  /** 0 free, 1 swept, 2 reached by the fill. */
  readonly cell: Uint8Array;
  constructor(readonly x0: number, readonly y0: number, x1: number, y1: number, readonly step: number) {
    this.nx = Math.ceil((x1 - x0) / step); this.ny = Math.ceil((y1 - y0) / step);
    this.cell = new Uint8Array(this.nx * this.ny);
  }
  private cx(i: number) { return this.x0 + (i + 0.5) * this.step; }
  private cy(j: number) { return this.y0 + (j + 0.5) * this.step; }
  /** Marks every cell whose centre lies within `radius` of segment a–b. */
  sweep(a: { x: number; y: number }, b: { x: number; y: number }, radius: number): void {
    const s = this.step;
    const i0 = Math.max(0, Math.floor((Math.min(a.x, b.x) - radius - this.x0) / s)), i1 = Math.min(this.nx - 1, Math.floor((Math.max(a.x, b.x) + radius - this.x0) / s));
    const j0 = Math.max(0, Math.floor((Math.min(a.y, b.y) - radius - this.y0) / s)), j1 = Math.min(this.ny - 1, Math.floor((Math.max(a.y, b.y) + radius - this.y0) / s));
    for (let j = j0; j <= j1; j++) for (let i = i0; i <= i1; i++) {
      if (segDist(this.cx(i), this.cy(j), a.x, a.y, b.x, b.y) <= radius) this.cell[j * this.nx + i] = 1;
    }
  }
  /** Cells (indices) whose centres lie inside the polygon and were not swept. */
  cellsOf(p: Poly): number[] {
    const out: number[] = [];
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (const q of p.outer) { minX = Math.min(minX, q.x); maxX = Math.max(maxX, q.x); minY = Math.min(minY, q.y); maxY = Math.max(maxY, q.y); }
    const s = this.step;
    for (let j = Math.max(0, Math.floor((minY - this.y0) / s)); j <= Math.min(this.ny - 1, Math.floor((maxY - this.y0) / s)); j++) {
      for (let i = Math.max(0, Math.floor((minX - this.x0) / s)); i <= Math.min(this.nx - 1, Math.floor((maxX - this.x0) / s)); i++) {
        const k = j * this.nx + i;
        if (this.cell[k] === 0 && inPoly(this.cx(i), this.cy(j), p)) out.push(k);
      }
    }
    return out;
  }
  /** 4-connected fill through unswept cells from `start`; says whether it reached the window edge. Resets nothing. */
  fill(start: number): { reached: Uint8Array; edge: boolean } {
    const reached = new Uint8Array(this.cell.length);
    const stack = [start];
    reached[start] = 1;
    let edge = false;
    while (stack.length) {
      const k = stack.pop()!;
      const i = k % this.nx, j = (k - i) / this.nx;
      if (i === 0 || j === 0 || i === this.nx - 1 || j === this.ny - 1) edge = true;
      const nb = [i > 0 ? k - 1 : -1, i < this.nx - 1 ? k + 1 : -1, j > 0 ? k - this.nx : -1, j < this.ny - 1 ? k + this.nx : -1];
      for (const q of nb) if (q >= 0 && !reached[q] && this.cell[q] === 0) { reached[q] = 1; stack.push(q); }
    }
    return { reached, edge };
  }
}
