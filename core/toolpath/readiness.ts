/**
 * Mill readiness: checks on the programs as written, before anything reaches the machine.
 * - Work area: every move (arcs by their extreme points) stays inside the stated travel, with the board's lower-left
 *   corner at `boardAt` in it.
 * - Depth: nothing goes deeper than the board plus the breakthrough, nothing above the safe height.
 * - Feeds: plunge feeds no faster than cutting feeds would suggest is not checked (both are bounded in options.ts).
 */
import type { Vec2 } from '../geometry/types.ts';
import type { MillingOptions } from './options.ts';
import type { ToolProgram, Vec3 } from './types.ts';

export type MillFindingCode = 'narrow-gap' | 'joined' | 'destroyed' | 'split' | 'leftover' | 'work-area' | 'depth' | 'isolation-gap' | 'isolation-passes';

export interface MillFinding {
  severity: 'error' | 'warning' | 'info';
  code: MillFindingCode;
  message: string;
  /** What to change. */
  fix: string;
  /** Pieces (or tools) involved. */
  subjects: string[];
  at?: Vec2;
}

/** Extreme x and y of an arc from a to b about c (the quadrant points it passes, and its ends). */
export function arcBox(a: Vec3, b: Vec3, c: Vec2, clockwise: boolean): { minX: number; minY: number; maxX: number; maxY: number } {
  const r = Math.hypot(a.x - c.x, a.y - c.y);
  const a0 = Math.atan2(a.y - c.y, a.x - c.x);
  let t = Math.atan2(b.y - c.y, b.x - c.x) - a0;
  if (clockwise) { while (t >= 0) t -= 2 * Math.PI; } else { while (t <= 0) t += 2 * Math.PI; }
  const xs = [a.x, b.x], ys = [a.y, b.y];
  for (let q = -8; q <= 8; q++) {
    const ang = (q * Math.PI) / 2;
    const rel = ang - a0;
    if ((t > 0 && rel > 0 && rel < t) || (t < 0 && rel < 0 && rel > t)) { xs.push(c.x + r * Math.cos(ang)); ys.push(c.y + r * Math.sin(ang)); }
  }
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
}

/** The box all moves of the programs span, in file coordinates (origin subtracted), m. */
export function programsBox(programs: ToolProgram[], origin: Vec2): { minX: number; minY: number; maxX: number; maxY: number; minZ: number; maxZ: number } {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity, minZ = Infinity, maxZ = -Infinity;
  const add = (x: number, y: number, z: number) => {
    x -= origin.x; y -= origin.y;
    if (x < minX) minX = x; if (x > maxX) maxX = x; if (y < minY) minY = y; if (y > maxY) maxY = y; if (z < minZ) minZ = z; if (z > maxZ) maxZ = z;
  };
  for (const p of programs) {
    let at = p.start;
    add(at.x, at.y, at.z);
    for (const m of p.moves) {
      if (m.kind === 'arc') { const b = arcBox(at, m.to, m.centre, m.clockwise); add(b.minX, b.minY, m.to.z); add(b.maxX, b.maxY, m.to.z); }
      add(m.to.x, m.to.y, m.to.z);
      at = m.to;
    }
  }
  return { minX, minY, maxX, maxY, minZ, maxZ };
}

export function millReadiness(programs: ToolProgram[], origin: Vec2, o: MillingOptions, through: number): MillFinding[] {
  const out: MillFinding[] = [];
  if (!programs.length) return out;
  const b = programsBox(programs, origin);
  const mm = (m: number) => (m * 1e3).toFixed(2);
  // The work area in file coordinates: from −boardAt to travel − boardAt.
  const lo = { x: -o.boardAt.x, y: -o.boardAt.y }, hi = { x: o.workArea.width - o.boardAt.x, y: o.workArea.height - o.boardAt.y };
  const tol = 1e-7;
  if (b.minX < lo.x - tol || b.minY < lo.y - tol || b.maxX > hi.x + tol || b.maxY > hi.y + tol) {
    out.push({
      severity: 'error', code: 'work-area', subjects: [],
      message: `the moves span X ${mm(b.minX)} to ${mm(b.maxX)} mm and Y ${mm(b.minY)} to ${mm(b.maxY)} mm, outside the work area (X ${mm(lo.x)} to ${mm(hi.x)} mm, Y ${mm(lo.y)} to ${mm(hi.y)} mm with the board's corner ${mm(o.boardAt.x)}, ${mm(o.boardAt.y)} mm in)`,
      fix: `the job needs about ${mm(b.maxX - b.minX)} × ${mm(b.maxY - b.minY)} mm: state the machine's real travel (workArea) and where the board sits on it (boardAt), or make the board smaller`,
    });
  }
  if (b.minZ < -through - tol || b.maxZ > o.safeHeight + tol) {
    out.push({ severity: 'error', code: 'depth', subjects: [], message: `the moves reach Z ${mm(b.minZ)} to ${mm(b.maxZ)} mm, beyond the board depth (${mm(-through)} mm) or the safe height (${mm(o.safeHeight)} mm)`, fix: 'report this: the planner should never do it' });
  }
  return out;
}
