/**
 * One tool's program: its pieces of work ordered (order.ts) and linked by rapid moves at the travel height, starting
 * and ending at the safe height. Also the run-time estimate, from the same moves the G-code writer writes.
 */
import type { Vec2 } from '../geometry/types.ts';
import type { MillingOptions } from './options.ts';
import { nearestVertex, orderItems, rotateLoop } from './order.ts';
import type { CutPath, Move, OperationKind, Tool, ToolProgram, Vec3 } from './types.ts';

/** A piece of work that starts and ends above the same point at the travel height. */
export interface WorkItem {
  /** Where it may be entered. */
  entries: Vec2[];
  /** Its moves when entered at `entries[i]`: from the travel height above that point back to the travel height. */
  moves(i: number): Move[];
}

/** A closed tool-centre loop at one depth as a work item: plunge, go round, retract. */
export function loopItem(path: CutPath, o: MillingOptions): WorkItem {
  return {
    entries: path.points,
    moves(i) {
      const pts = rotateLoop(path.points, i);
      const z = -path.depth;
      const m: Move[] = [{ kind: 'line', to: { ...pts[0]!, z }, feed: o.plungeFeed }];
      for (let k = 1; k < pts.length; k++) m.push({ kind: 'line', to: { ...pts[k]!, z }, feed: o.feed });
      m.push({ kind: 'line', to: { ...pts[0]!, z }, feed: o.feed });
      m.push({ kind: 'rapid', to: { ...pts[0]!, z: o.travelHeight } });
      return m;
    },
  };
}

/**
 * Orders the items from `home` and links them into one program; `last` (the cutout, which frees the board) runs
 * after all of them, entered at its point nearest to where the tool is.
 */
export function buildProgram(tool: Tool, operations: OperationKind[], items: WorkItem[], home: Vec2, spindleRpm: number, o: MillingOptions, last?: WorkItem): ToolProgram {
  const { order, entry } = orderItems(items.map((it) => it.entries), home);
  const visits = order.map((i) => ({ item: items[i]!, e: entry[i]! }));
  if (last) {
    const tail = visits.length ? visits[visits.length - 1]! : null;
    visits.push({ item: last, e: nearestVertex(last.entries, tail ? tail.item.entries[tail.e]! : home) });
  }
  const moves: Move[] = [];
  let first: Vec2 | null = null;
  for (const { item, e } of visits) {
    const p = item.entries[e]!;
    first ??= p;
    moves.push({ kind: 'rapid', to: { x: p.x, y: p.y, z: o.travelHeight } });
    for (const m of item.moves(e)) moves.push(m);
  }
  const start: Vec3 = { x: (first ?? home).x, y: (first ?? home).y, z: o.safeHeight };
  if (moves.length) moves.push({ kind: 'rapid', to: { ...(moves[moves.length - 1]!.to), z: o.safeHeight } });
  const p: ToolProgram = { tool, operations, spindleRpm, start, moves, seconds: 0, cutLength: 0, travelLength: 0 };
  Object.assign(p, estimateProgram(p, o.rapidRate));
  return p;
}

/** XY length of an arc from `a` to `b` about `c`, with its helix rise, m. */
export function arcMoveLength(a: Vec3, b: Vec3, c: Vec2, clockwise: boolean): number {
  const r = Math.hypot(a.x - c.x, a.y - c.y);
  let t = Math.atan2(b.y - c.y, b.x - c.x) - Math.atan2(a.y - c.y, a.x - c.x);
  if (clockwise) { while (t >= 0) t -= 2 * Math.PI; } else { while (t <= 0) t += 2 * Math.PI; }
  return Math.hypot(Math.abs(t) * r, b.z - a.z);
}

/**
 * Run time: cutting length over each move's feed plus rapid length over the rapid rate (acceleration ignored, so
 * short zig-zags run somewhat longer than this; tool changes and spindle start are not counted).
 */
export function estimateProgram(p: ToolProgram, rapidRate: number): { seconds: number; cutLength: number; travelLength: number } {
  let at = p.start, seconds = 0, cut = 0, travel = 0;
  for (const m of p.moves) {
    if (m.kind === 'rapid') { const l = Math.hypot(m.to.x - at.x, m.to.y - at.y, m.to.z - at.z); travel += l; seconds += l / rapidRate; }
    else {
      const l = m.kind === 'line' ? Math.hypot(m.to.x - at.x, m.to.y - at.y, m.to.z - at.z) : arcMoveLength(at, m.to, m.centre, m.clockwise);
      cut += l; seconds += l / m.feed;
    }
    at = m.to;
  }
  return { seconds, cutLength: cut, travelLength: travel };
}
