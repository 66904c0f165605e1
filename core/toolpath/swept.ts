/**
 * What the tools remove from the copper: the area each cutting move sweeps at the copper surface (z = 0), from the
 * moves the G-code writer writes. A move cuts copper when it runs below z = 0. The cutter's radius at the surface is
 * half its cut width there: an end mill or drill its diameter; a V-bit at depth d is tip + 2·d·tan(angle/2) wide
 * (plain cone geometry). Arcs are flattened within 1 µm.
 */
import { sweptArea, unionRegions } from '../geometry/polygons.ts';
import type { Region, Vec2 } from '../geometry/types.ts';
import type { Tool, ToolProgram, Vec3 } from './types.ts';

/** Width a tool cuts at the copper surface when its tip is `depth` metres below it. */
export function toolWidthAtSurface(tool: Tool, depth: number): number {
  if (depth <= 0) return 0;
  if (tool.kind === 'v-bit') return (tool.tipWidth ?? 0) + 2 * depth * Math.tan(((tool.angleDeg ?? 0) * Math.PI) / 360);
  return tool.diameter;
}

/** Points along an arc from a to b about c (excluding a), at most 1 µm from the true arc. */
export function flattenArc(a: Vec3, b: Vec3, c: Vec2, clockwise: boolean, tol = 1e-6): Vec2[] {
  const r = Math.hypot(a.x - c.x, a.y - c.y);
  const a0 = Math.atan2(a.y - c.y, a.x - c.x);
  let t = Math.atan2(b.y - c.y, b.x - c.x) - a0;
  if (clockwise) { while (t >= 0) t -= 2 * Math.PI; } else { while (t <= 0) t += 2 * Math.PI; }
  const step = r > tol ? 2 * Math.acos(Math.max(-1, 1 - tol / r)) : Math.PI;
  const n = Math.max(2, Math.ceil(Math.abs(t) / step));
  const out: Vec2[] = [];
  for (let i = 1; i <= n; i++) { const u = a0 + (t * i) / n; out.push({ x: c.x + r * Math.cos(u), y: c.y + r * Math.sin(u) }); }
  return out;
}

/** The copper area one program removes. */
export function programSwept(p: ToolProgram): Region[] {
  // Runs of cutting moves at one depth become one polyline (one width); a change of depth starts a new run.
  const byWidth = new Map<number, { points: Vec2[]; closed: boolean }[]>();
  let at: Vec3 = p.start;
  let run: Vec2[] | null = null, runW = 0;
  const flush = () => {
    if (run && runW > 0) {
      // A run that ends where it began is a loop: swept as a closed band (the engine does this faster than an open path).
      const a = run[0]!, b = run[run.length - 1]!;
      const loop = run.length > 3 && Math.abs(a.x - b.x) < 1e-12 && Math.abs(a.y - b.y) < 1e-12;
      const l = byWidth.get(runW) ?? []; l.push({ points: loop ? run.slice(0, -1) : run, closed: loop }); byWidth.set(runW, l);
    }
    run = null;
  };
  for (const m of p.moves) {
    const z = Math.max(at.z, m.to.z);
    const cutting = m.kind !== 'rapid' && Math.min(at.z, m.to.z) < 0;
    if (!cutting) { flush(); at = m.to; continue; }
    // A plunge or a ramp: the deeper end decides the width (a V-bit widens as it goes down).
    const w = toolWidthAtSurface(p.tool, -Math.min(at.z, m.to.z));
    const flat = at.z === m.to.z && z < 0;
    if (!flat || w !== runW || !run) { flush(); run = [{ x: at.x, y: at.y }]; runW = w; }
    if (m.kind === 'arc') run!.push(...flattenArc(at, m.to, m.centre, m.clockwise));
    else run!.push({ x: m.to.x, y: m.to.y });
    if (!flat) flush();
    at = m.to;
  }
  flush();
  const parts: Region[] = [];
  for (const [w, paths] of byWidth) parts.push(...sweptArea(paths, w / 2));
  return parts.length ? unionRegions(parts) : [];
}
