/**
 * Checks of written G-code against the board it was made for, through the independent reader in
 * scripts/oracles/gcode-retrace.ts (gcode-toolpath from npm + plain geometry). The expected cut widths come from the
 * tool geometry alone: an end mill or drill cuts its diameter; a V-bit with tip w and included angle α cuts
 * w + 2·d·tan(α/2) at depth d below its tip's reach (cone geometry; common practice).
 *
 * Tolerances: coordinates are written to 1 µm (mm files) or 0.1 thou = 2.54 µm (inch files), and the tool-centre
 * loops are polygons whose chords stay within 1 µm of the true offset arcs. So a cut may come 2.5 µm (mm) or 4 µm
 * (inch) closer to copper than its radius, and a hole lands within 1 µm (mm) or 2.6 µm (inch) of its centre.
 */
import type { BoardGeometry, DesignDoc, GcodeExport } from '../../core/index.ts';
import { CopperDistance, SweepRaster, retrace, type Poly, type Traced } from '../../scripts/oracles/gcode-retrace.ts';

export const TOL_MM = { mm: 0.0025, inch: 0.004 };
export const HOLE_TOL_MM = { mm: 0.001, inch: 0.0026 };
const ALLOWED = new Set(['G0', 'G1', 'G2', 'G3', 'G17', 'G20', 'G21', 'G90', 'M3', 'M5', 'M2', 'M6']);

/** Cut width (mm) a tool leaves at `depth` mm below the copper surface, from the design's process (cone geometry). */
export function cutWidthMm(doc: DesignDoc, depth: number): number {
  const p = doc.process;
  if (p.kind === 'v-bit') return Math.max(0, p.tipWidth * 1e3 + 2 * depth * Math.tan((p.angleDeg * Math.PI) / 360));
  if (p.kind === 'end-mill') return p.toolDiameter * 1e3;
  throw new Error('etch has no tool');
}

/** Geometry in file millimetres: shifted so the board's lower-left corner is (0, 0). */
export function fileFrame(g: BoardGeometry) {
  const ring = g.outline ? g.outline.outer : [{ x: g.extent.minX, y: g.extent.minY }, { x: g.extent.maxX, y: g.extent.maxY }];
  const ox = Math.min(...ring.map((p) => p.x)), oy = Math.min(...ring.map((p) => p.y));
  const P = (p: { x: number; y: number }) => ({ x: (p.x - ox) * 1e3, y: (p.y - oy) * 1e3 });
  const poly = (r: { outer: { x: number; y: number }[]; holes: { x: number; y: number }[][] }): Poly => ({ outer: r.outer.map(P), holes: r.holes.map((h) => h.map(P)) });
  const xs = ring.map((p) => (p.x - ox) * 1e3), ys = ring.map((p) => (p.y - oy) * 1e3);
  const islands = [...g.copper, ...g.groundCopper].map(poly);
  return { islands, drills: g.drills.map((d) => ({ ...P(d.at), d: d.diameter * 1e3 })), board: { w: Math.max(...xs), h: Math.max(...ys) } };
}

export interface CheckReport { problems: string[]; traced: Traced[] }

/**
 * Every check of the issue on one export. `units` says which tolerance applies. Returns problems in words (empty
 * when all hold) so a failing test says what went wrong.
 */
export function checkExport(doc: DesignDoc, ex: GcodeExport, units: 'mm' | 'inch', o: { workArea: [number, number]; boardAt: [number, number]; breakthrough: number; cutoutTool: number; raster?: number }): CheckReport {
  const problems: string[] = [];
  const F = fileFrame(ex.geometry);
  const h = doc.substrate.h * 1e3, t = doc.substrate.t * 1e3;
  const depth = (doc.process as { depth: number }).depth * 1e3;
  const traced = ex.files.map((f) => retrace(f.text));
  ex.files.forEach((f, i) => {
    const tr = traced[i]!;
    const head = f.text.split('\n').slice(0, 16).join('\n');
    if (!/^\(Stripwright /.test(f.text)) problems.push(`${f.name}: does not start with the header comment`);
    for (const must of [/design hash [0-9a-f]{8}:/, /Units: /, /Origin: X0 Y0 = lower-left corner of the board/, /CAUTION: Milling glass-fibre/, /eye protection/, /unattended/]) {
      if (!must.test(head)) problems.push(`${f.name}: header lacks ${must}`);
    }
    if (tr.units !== (units === 'mm' ? 'G21' : 'G20')) problems.push(`${f.name}: units ${tr.units}`);
    if (!tr.ended || !tr.spindleOn || !tr.words.has('M5')) problems.push(`${f.name}: missing M3, M5 or M2`);
    for (const w of tr.words) if (!ALLOWED.has(w)) problems.push(`${f.name}: word ${w} outside the subset`);
    if (/[^\x0a\x20-\x7e]/.test(f.text)) problems.push(`${f.name}: non-ASCII bytes`);
    // Work area and depth.
    const [W, H] = o.workArea, [bx, by] = o.boardAt;
    for (const m of tr.moves) for (const p of [m.a, m.b]) {
      if (p.x < -bx - 1e-6 || p.x > W - bx + 1e-6 || p.y < -by - 1e-6 || p.y > H - by + 1e-6) { problems.push(`${f.name}: move to (${p.x}, ${p.y}) outside the work area`); break; }
      if (p.z < -(h + t + o.breakthrough) - HOLE_TOL_MM[units]) { problems.push(`${f.name}: Z ${p.z} below the board and breakthrough`); break; }
    }
  });
  const tol = TOL_MM[units];
  // 1. The isolation file: every cut at the process depth, none closer to copper than its radius (less tol).
  const iso = traced[0]!;
  const rTop = cutWidthMm(doc, depth) / 2;
  const dist = new CopperDistance(F.islands, 0.5);
  let closest = Infinity;
  for (const m of iso.moves) {
    if (m.rapid || m.a.z >= 0 || m.b.z >= 0) continue;
    if (Math.abs(m.a.z + depth) > HOLE_TOL_MM[units] || Math.abs(m.b.z + depth) > HOLE_TOL_MM[units]) { problems.push(`isolation cut at Z ${m.b.z}, not −${depth}`); break; }
    const L = Math.hypot(m.b.x - m.a.x, m.b.y - m.a.y);
    const n = Math.max(1, Math.ceil(L / 0.01));
    for (let k = 0; k <= n; k++) {
      const x = m.a.x + ((m.b.x - m.a.x) * k) / n, y = m.a.y + ((m.b.y - m.a.y) * k) / n;
      closest = Math.min(closest, dist.distance(x, y, rTop + 0.05) - rTop);
    }
  }
  if (closest < -tol) problems.push(`an isolation cut comes ${(-closest * 1e3).toFixed(2)} µm into copper (tolerance ${tol * 1e3} µm)`);
  // 2. Drills land on their holes and go through.
  const plunges: { x: number; y: number; z: number; file: string }[] = [];
  ex.files.forEach((f, i) => {
    if (!/-drill-/.test(f.name)) return;
    for (const m of traced[i]!.moves) if (!m.rapid && Math.abs(m.a.x - m.b.x) < 1e-9 && Math.abs(m.a.y - m.b.y) < 1e-9 && m.b.z < m.a.z) plunges.push({ ...m.b, file: f.name });
  });
  for (const d of F.drills) {
    const size = d.d.toFixed(2);
    const hits = plunges.filter((p) => p.file.includes(`drill-${size}mm`) && Math.hypot(p.x - d.x, p.y - d.y) <= HOLE_TOL_MM[units]);
    if (!hits.length) problems.push(`no ${size} mm drill at (${d.x.toFixed(3)}, ${d.y.toFixed(3)})`);
    else if (Math.min(...hits.map((p) => p.z)) > -(h + t) + 1e-6) problems.push(`the ${size} mm hole at (${d.x.toFixed(3)}, ${d.y.toFixed(3)}) is not drilled through`);
  }
  for (const p of plunges) if (!F.drills.some((d) => Math.hypot(p.x - d.x, p.y - d.y) <= HOLE_TOL_MM[units])) { problems.push(`${p.file}: a plunge at (${p.x}, ${p.y}) where there is no hole`); break; }
  // 3. True scale: the cutout's cutting moves span the board plus one cutout tool diameter.
  const cutFile = ex.files.findIndex((f) => /-cutout\.nc$/.test(f.name));
  if (cutFile >= 0) {
    const pts = traced[cutFile]!.moves.filter((m) => !m.rapid && m.b.z < -(h + t) + 1e-6).flatMap((m) => [m.a, m.b]);
    const span = { w: Math.max(...pts.map((p) => p.x)) - Math.min(...pts.map((p) => p.x)), h: Math.max(...pts.map((p) => p.y)) - Math.min(...pts.map((p) => p.y)) };
    if (Math.abs(span.w - (F.board.w + o.cutoutTool)) > 2 * tol || Math.abs(span.h - (F.board.h + o.cutoutTool)) > 2 * tol) {
      problems.push(`cutout spans ${span.w.toFixed(4)} × ${span.h.toFixed(4)} mm, expected ${(F.board.w + o.cutoutTool).toFixed(4)} × ${(F.board.h + o.cutoutTool).toFixed(4)}`);
    }
  }
  // 4. Every island isolated: the copper the tools cut through (below the copper's foot, at the width there) leaves
  //    each island in a pocket of its own, reached by no other island and not cut apart.
  const step = o.raster ?? 0.02;
  const cuts: { a: { x: number; y: number }; b: { x: number; y: number }; r: number }[] = [];
  ex.files.forEach((f, i) => {
    const isIso = i === 0;
    const toolD = isIso ? 0 : /-drill-([\d.]+)mm/.test(f.name) ? Number(/-drill-([\d.]+)mm/.exec(f.name)![1]) : o.cutoutTool;
    for (const m of traced[i]!.moves) {
      if (m.rapid) continue;
      const zDeep = Math.min(m.a.z, m.b.z);
      if (zDeep > -t - 1e-9) continue;
      const r = isIso ? cutWidthMm(doc, -zDeep - t) / 2 : toolD / 2;
      cuts.push({ a: m.a, b: m.b, r });
    }
  });
  F.islands.forEach((isl, k) => {
    let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
    for (const p of isl.outer) { x0 = Math.min(x0, p.x); x1 = Math.max(x1, p.x); y0 = Math.min(y0, p.y); y1 = Math.max(y1, p.y); }
    const R = new SweepRaster(x0 - 2, y0 - 2, x1 + 2, y1 + 2, step);
    for (const c of cuts) {
      if (Math.max(c.a.x, c.b.x) + c.r < R.x0 || Math.min(c.a.x, c.b.x) - c.r > x1 + 2 || Math.max(c.a.y, c.b.y) + c.r < R.y0 || Math.min(c.a.y, c.b.y) - c.r > y1 + 2) continue;
      R.sweep(c.a, c.b, c.r);
    }
    const own = R.cellsOf(isl);
    if (!own.length) { problems.push(`island ${k}: no copper left`); return; }
    const { reached, edge } = R.fill(own[0]!);
    if (edge) problems.push(`island ${k}: not enclosed by cuts (the fill reaches the edge of its window)`);
    const lost = own.filter((c) => !reached[c]).length;
    if (lost > 0.001 * own.length) problems.push(`island ${k}: cut apart (${lost} of ${own.length} cells unreached)`);
    F.islands.forEach((other, j) => {
      if (j === k) return;
      if (R.cellsOf(other).some((c) => reached[c])) problems.push(`islands ${k} and ${j} are joined`);
    });
  });
  return { problems: [...new Set(problems)].slice(0, 12), traced };
}
