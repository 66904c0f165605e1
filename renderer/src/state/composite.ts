/**
 * Editor gestures that take several design commands (a run of many corners, a stub, an inserted taper), composed
 * here from the core's registry so that each gesture is one command to History, hence one undo step, and fails
 * as a whole (a bad step leaves the design untouched).
 */
import { runCommand, type DesignDoc } from '../../../core/index.ts';
import type { Vec2 } from '../../../core/index.ts';
import { InputError } from '../../../core/index.ts';

type Args = Record<string, unknown>;

/** The node a command appended (new ids are fresh, so it is the one not in `before`). */
function newNodes(before: DesignDoc, after: DesignDoc): string[] {
  const had = new Set(before.nodes.map((n) => n.id));
  return after.nodes.filter((n) => !had.has(n.id)).map((n) => n.id);
}

/** Extends a run from node `from` through `points`: corners become bends, the last point an open end. */
function extend(doc: DesignDoc, from: string, points: Vec2[], spec?: unknown): DesignDoc {
  let d = doc;
  let at = from;
  points.forEach((p, i) => {
    const next = runCommand(d, 'run.extend', { from: at, to: p, end: i === points.length - 1 ? 'open' : 'vertex', ...(spec && i === 0 ? { spec } : {}) });
    const made = newNodes(d, next);
    d = next;
    at = made[made.length - 1]!;
  });
  return d;
}

function segmentEnds(doc: DesignDoc, id: string): { a: Vec2; b: Vec2; width: unknown } {
  const s = doc.segments.find((x) => x.id === id);
  if (!s) throw new InputError('bad-choice', 'segment', 'a segment of the design', JSON.stringify(id));
  const a = doc.nodes.find((n) => n.id === s.a)!.at, b = doc.nodes.find((n) => n.id === s.b)!.at;
  return { a, b, width: s.kind === 'line' ? s.width : undefined };
}

/** The segment that starts at `node` after a split (the second half). */
function segmentFrom(doc: DesignDoc, before: DesignDoc, node: string): string {
  const had = new Set(before.segments.map((s) => s.id));
  const s = doc.segments.find((x) => !had.has(x.id) && x.a === node);
  if (!s) throw new InputError('impossible-layout', 'segment', 'a split that leaves a second half', 'none');
  return s.id;
}

export const COMPOSITES: Record<string, (doc: DesignDoc, a: Args) => DesignDoc> = {
  /** { from, points } */
  'editor.route': (doc, a) => extend(doc, a.from as string, a.points as Vec2[]),

  /** { segment, at, points }: a junction on the segment and a branch through the points. */
  'editor.tee': (doc, a) => {
    const points = a.points as Vec2[];
    const split = runCommand(doc, 'segment.split', { id: a.segment, at: a.at, branchTo: points[0], branchEnd: points.length > 1 ? 'vertex' : 'open' });
    if (points.length === 1) return split;
    const made = newNodes(doc, split);
    return extend(split, made[made.length - 1]!, points.slice(1));
  },

  /** { segment, at, side, end, length }: a quarter-wave stub (90° at f0) off the segment, open or shorted. */
  'editor.stub': (doc, a) => {
    const { a: pa, b: pb, width } = segmentEnds(doc, a.segment as string);
    const d = { x: pb.x - pa.x, y: pb.y - pa.y };
    const l = Math.hypot(d.x, d.y);
    const side = (a.side as number) >= 0 ? 1 : -1;
    const at = a.at as Vec2;
    const reach = (a.length as number) ?? 5e-3;
    const tip = { x: at.x - (side * d.y / l) * reach, y: at.y + (side * d.x / l) * reach };
    return runCommand(doc, 'segment.split', {
      id: a.segment, at, branchTo: tip, branchEnd: a.end,
      branchSpec: { kind: 'line', width: width ?? { by: 'z0', z0: 50 }, length: { by: 'degrees', deg: 90 } },
    });
  },

  /** { segment, at, kind: 'step' | 'taper' | 'part', span }: splits the segment and makes the piece. */
  'editor.insert': (doc, a) => {
    const id = a.segment as string;
    const { a: pa, b: pb, width } = segmentEnds(doc, id);
    const at = a.at as Vec2;
    const split1 = runCommand(doc, 'segment.split', { id, at });
    const mid = newNodes(doc, split1)[0]!;
    const second = segmentFrom(split1, doc, mid);
    const w = (width ?? { by: 'z0', z0: 50 }) as { by: 'z0'; z0: number } | { by: 'width'; width: number };
    // The other width of a step or taper: 70.7 Ω from 50 Ω (a quarter-wave 2:1 match), else 50 Ω.
    const other = w.by === 'z0' && Math.abs(w.z0 - 50) < 1e-9 ? { by: 'z0', z0: 70.7 } : { by: 'z0', z0: 50 };
    if (a.kind === 'step') return runCommand(split1, 'segment.setSpec', { id: second, spec: { width: other } });
    // Taper and part take a span of the line after the split point.
    const dir = { x: pb.x - pa.x, y: pb.y - pa.y };
    const total = Math.hypot(dir.x, dir.y);
    const left = Math.hypot(pb.x - at.x, pb.y - at.y);
    const span = Math.min((a.span as number) ?? 5e-3, left * 0.6);
    const end = { x: at.x + (dir.x / total) * span, y: at.y + (dir.y / total) * span };
    const split2 = runCommand(split1, 'segment.split', { id: second, at: end });
    if (a.kind === 'taper') {
      const spec = { kind: 'taper', profile: 'linear', from: w, to: other, length: { by: 'drawn' } };
      const d2 = runCommand(split2, 'segment.setSpec', { id: second, spec });
      const after = segmentFrom(split2, split1, newNodes(split1, split2)[0]!);
      return runCommand(d2, 'segment.setSpec', { id: after, spec: { width: other } });
    }
    // A 100 Ω 0603 resistor: an everyday placeholder the user then edits (common practice).
    return runCommand(split2, 'segment.setSpec', { id: second, spec: { kind: 'lumped', part: 'resistor', value: 100, size: '0603', width: w } });
  },
};

/** The run function History uses: our composites first, then the core's registry. */
export function runWithComposites(doc: DesignDoc, id: string, args: unknown): DesignDoc {
  const c = COMPOSITES[id];
  return c ? c(doc, (args ?? {}) as Args) : runCommand(doc, id, args);
}

export const COMPOSITE_LABELS: Record<string, string> = {
  'editor.route': 'Route', 'editor.tee': 'Add tee', 'editor.stub': 'Add stub', 'editor.insert': 'Insert piece',
};
