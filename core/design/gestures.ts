/**
 * Drawing gestures as design commands: a run through several corners, a tee with its branch, a stub, and a piece
 * inserted into a line. Each is composed of the basic commands (commands.ts) and is one command, hence one undo
 * step in History, and it is refused whole when any part of it is refused. The app's tools, block generators and
 * the CLI all call these, so a gesture behaves the same from every face.
 *
 * Starting and ending a run (the project's own rules):
 * - a run may start at a port that has no line yet, at an open or shorted end (it becomes a corner), at a corner
 *   left dangling (one line), at a corner with two lines (it becomes a tee) or at a tee with room (a cross);
 * - a run may end on a line (`onto: { segment }`: the line is split there by a tee) or on a node with room
 *   (`onto: { node }`), else its last point becomes an open end.
 */
import { InputError, describe } from '../util/errors.ts';
import type { Vec2 } from '../geometry/types.ts';
import { segmentEnds, type DesignDoc, type DesignSegment, type SmdSize, type WidthSpec } from './types.ts';
import { DESIGN_LIMITS } from './limits.ts';
import { DEGREE } from './crossref.ts';
import { argId, argVec, checkWith, findNode, findSegment, type Args, type DesignCommand } from './command-args.ts';
import { vec2Schema } from './schema.ts';
import { smdFootprint } from './footprints.ts';

/** What a gesture needs from the registry: run a basic command (commands.ts passes its own runner). */
export type RunBasic = (doc: DesignDoc, id: string, args: Args) => DesignDoc;

/** A gesture is a design command like any other. */
export type GestureCommand = DesignCommand;

/** Default reach of a stub drawn on the board before sizing gives it its length, m (the drawing only gives its direction). */
export const STUB_REACH = 5e-3;
/** Default span of an inserted taper on the drawing, m. */
export const TAPER_SPAN = 5e-3;

const degreeOf = (doc: DesignDoc, id: string): number => {
  let d = 0;
  for (const s of doc.segments) for (const e of segmentEnds(s)) if (e === id) d++;
  return d;
};

/** Ids added by a step: the new nodes and segments in the order they were appended. */
function added<T extends { id: string }>(before: readonly T[], after: readonly T[]): string[] {
  const had = new Set(before.map((x) => x.id));
  return after.filter((x) => !had.has(x.id)).map((x) => x.id);
}

function argPoints(a: Args, key: string): Vec2[] {
  const pts = a[key];
  if (!Array.isArray(pts) || pts.length === 0 || pts.length > DESIGN_LIMITS.polygonPoints) {
    throw new InputError('invalid-design', `args.${key}`, `a list of 1 to ${DESIGN_LIMITS.polygonPoints} points {x, y} in metres`, describe(pts));
  }
  // Each point named by its place in the list (args.points[2].x), as the user wrote it.
  return pts.map((p, i) => { const v = checkWith(vec2Schema, p, `args.${key}[${i}]`); return { x: v.x, y: v.y }; });
}

/** The width a new line leaving `node` takes: the width of a line already there, else 50 Ω. */
function widthAt(doc: DesignDoc, node: string): WidthSpec {
  const s = doc.segments.find((x) => x.a === node || x.b === node);
  if (s?.kind === 'line' || s?.kind === 'lumped' || s?.kind === 'sparams') return s.width;
  if (s?.kind === 'taper') return s.a === node ? s.from : s.to;
  return { by: 'z0', z0: 50 };
}

/**
 * Gives `id` room for one more line: a corner with two lines becomes a tee; an open or shorted end and a dangling
 * corner carry on as corners. Refuses a port that already has its line and a full tee.
 */
function makeRoom(doc: DesignDoc, id: string, field: string, run: RunBasic): DesignDoc {
  const { node } = findNode(doc, id, field);
  const d = degreeOf(doc, id);
  if (node.kind === 'vertex' && d >= 2) return run(doc, 'node.setSpec', { id, spec: { kind: 'junction' } });
  if ((node.kind === 'open' || node.kind === 'short') && d === 1) return run(doc, 'node.setSpec', { id, spec: { kind: 'vertex' } });
  if (d + 1 > DEGREE[node.kind].max) {
    const why = node.kind === 'port' ? 'a port takes one line: start from the open end or a corner of its run' : `a ${node.kind} with ${d} lines has no room for another`;
    throw new InputError('invalid-design', field, 'a port without a line, an open end, a corner or a tee with room', `${JSON.stringify(id)}: ${why}`);
  }
  return doc;
}

/** Where a run ends: on a line (split there by a tee) or on a node. */
type Onto = { segment: string } | { node: string } | null;

function argOnto(a: Args): Onto {
  const o = a.onto;
  if (o === undefined || o === null) return null;
  if (typeof o === 'object' && !Array.isArray(o)) {
    const r = o as Args;
    if (typeof r.segment === 'string') return { segment: argId(r, 'segment') };
    if (typeof r.node === 'string') return { node: argId(r, 'node') };
  }
  throw new InputError('invalid-design', 'args.onto', 'where the run ends: { segment: id } (makes a tee there) or { node: id }', describe(o));
}

/** Splits `segment` at `at` and makes the split point a tee; returns the design and the tee's id. */
function teeOn(doc: DesignDoc, segment: string, at: Vec2, run: RunBasic): { doc: DesignDoc; tee: string } {
  const split = run(doc, 'segment.split', { id: segment, at });
  const tee = added(doc.nodes, split.nodes)[0]!;
  return { doc: run(split, 'node.setSpec', { id: tee, spec: { kind: 'junction' } }), tee };
}

/** The run itself: from `from` through `points`; the last point is an open end, or the run joins `onto` there. */
function route(doc: DesignDoc, from: string, points: Vec2[], onto: Onto, run: RunBasic, spec?: unknown): DesignDoc {
  let d = doc;
  let target: string | null = null;
  if (onto && 'segment' in onto) {
    const t = teeOn(d, onto.segment, points[points.length - 1]!, run);
    d = t.doc; target = t.tee;
  } else if (onto) {
    target = onto.node;
    if (target === from) throw new InputError('invalid-design', 'args.onto.node', 'a node other than the run\'s start', JSON.stringify(target));
    d = makeRoom(d, target, 'args.onto.node', run);
  }
  d = makeRoom(d, from, 'args.from', run);
  let at = from;
  const free = target ? points.slice(0, -1) : points;
  free.forEach((p, i) => {
    const next = run(d, 'run.extend', { from: at, to: p, end: target || i < free.length - 1 ? 'vertex' : 'open', ...(spec && i === 0 ? { spec } : {}) });
    at = added(d.nodes, next.nodes).at(-1)!;
    d = next;
  });
  if (target) {
    const width = spec && free.length === 0 ? undefined : widthAt(d, at);
    d = run(d, 'segment.add', { a: at, b: target, spec: spec && free.length === 0 ? spec : { kind: 'line', width, length: { by: 'drawn' } } });
  }
  return d;
}

const routeCmd = (run: RunBasic): GestureCommand => ({
  id: 'run.route', label: 'Route',
  run(doc, a) {
    return route(doc, argId(a, 'from'), argPoints(a, 'points'), argOnto(a), run, a.spec);
  },
});

const teeCmd = (run: RunBasic): GestureCommand => ({
  id: 'run.tee', label: 'Add tee',
  run(doc, a) {
    const t = teeOn(doc, argId(a, 'segment'), argVec(a, 'at'), run);
    return route(t.doc, t.tee, argPoints(a, 'points'), argOnto(a), run, a.spec);
  },
});

function lineEnds(doc: DesignDoc, id: string, field: string): { seg: DesignSegment; a: Vec2; b: Vec2; width: WidthSpec } {
  const { segment } = findSegment(doc, id, field);
  const a = findNode(doc, segment.a, `${field}.a`).node.at, b = findNode(doc, segment.b, `${field}.b`).node.at;
  const width = segment.kind === 'taper' ? segment.from : segment.kind === 'coupled' ? { by: 'z0' as const, z0: 50 } : segment.width;
  return { seg: segment, a, b, width };
}

const stubCmd = (run: RunBasic): GestureCommand => ({
  id: 'run.stub', label: 'Add stub',
  run(doc, a) {
    const { a: pa, b: pb, width } = lineEnds(doc, argId(a, 'segment'), 'args.segment');
    const end = a.end ?? 'open';
    if (end !== 'open' && end !== 'short') throw new InputError('bad-choice', 'args.end', 'the stub\'s end: "open" or "short"', describe(end));
    const side = a.side === undefined ? 1 : a.side;
    if (side !== 1 && side !== -1) throw new InputError('bad-choice', 'args.side', 'the side of the line: 1 (left of a → b) or -1 (right)', describe(side));
    const reach = a.reach === undefined ? STUB_REACH : a.reach;
    if (typeof reach !== 'number' || !(reach > 0 && reach <= 0.1)) throw new InputError('out-of-range', 'args.reach', 'a drawn stub length above 0 and at most 0.1 m', describe(reach));
    const deg = a.deg === undefined ? 90 : a.deg;
    if (typeof deg !== 'number' || !(deg > 0 && deg < 360)) throw new InputError('out-of-range', 'args.deg', 'an electrical length above 0° and below 360°', describe(deg));
    const dir = { x: pb.x - pa.x, y: pb.y - pa.y };
    const l = Math.hypot(dir.x, dir.y);
    const at = argVec(a, 'at');
    const tip = { x: at.x - (side * dir.y / l) * reach, y: at.y + (side * dir.x / l) * reach };
    return run(doc, 'segment.split', {
      id: a.segment, at, branchTo: tip, branchEnd: end,
      branchSpec: { kind: 'line', width, length: { by: 'degrees', deg } },
    });
  },
});

/** The other width of a step or taper when none is given: 70.7 Ω beside 50 Ω (a quarter-wave 2:1 match), else 50 Ω. */
function otherWidth(w: WidthSpec): WidthSpec {
  return w.by === 'z0' && Math.abs(w.z0 - 50) < 1e-9 ? { by: 'z0', z0: 70.7 } : { by: 'z0', z0: 50 };
}

const PARTS = ['resistor', 'capacitor', 'inductor'] as const;
const SIZES: readonly SmdSize[] = ['0402', '0603', '0805', '1206'];

/**
 * Inserts a piece into a line at `at`:
 * - `step`: the line is split there and the side `side` ('a': from the line's start to here, 'b': from here to its
 *   end; by default the side whose end is nearer `at`) takes `width` (default: 70.7 Ω beside 50 Ω, else 50 Ω);
 * - `taper`: a linear taper of `span` from here towards b, the rest of the line taking its far width;
 * - `part`: a lumped part whose span is its land pattern's pad pitch, so the line keeps its drawn length and nothing
 *   else on the board moves (the line's copper stops at the pads, as sizing already does for parts).
 */
const insertCmd = (run: RunBasic): GestureCommand => ({
  id: 'run.insert', label: 'Insert piece',
  run(doc, a) {
    const id = argId(a, 'segment');
    const { seg, a: pa, b: pb, width } = lineEnds(doc, id, 'args.segment');
    if (seg.kind !== 'line') throw new InputError('invalid-design', 'args.segment', 'a line (tapers, parts and measured blocks are single pieces)', `a ${seg.kind} segment`);
    const at = argVec(a, 'at');
    const kind = a.kind;
    if (kind !== 'step' && kind !== 'taper' && kind !== 'part') throw new InputError('bad-choice', 'args.kind', '"step", "taper" or "part"', describe(kind));
    const newWidth = a.width === undefined ? otherWidth(width) : (a.width as WidthSpec);
    const split1 = run(doc, 'segment.split', { id, at });
    const mid = added(doc.nodes, split1.nodes)[0]!;
    const second = added(doc.segments, split1.segments)[0]!;
    if (kind === 'step') {
      const side = a.side ?? (Math.hypot(at.x - pa.x, at.y - pa.y) < Math.hypot(pb.x - at.x, pb.y - at.y) ? 'a' : 'b');
      if (side !== 'a' && side !== 'b') throw new InputError('bad-choice', 'args.side', '"a" (the line\'s start up to the step) or "b" (the step to the line\'s end)', describe(side));
      return run(split1, 'segment.setSpec', { id: side === 'a' ? id : second, spec: { width: newWidth } });
    }
    const total = Math.hypot(pb.x - pa.x, pb.y - pa.y);
    const left = Math.hypot(pb.x - at.x, pb.y - at.y);
    const dir = { x: (pb.x - pa.x) / total, y: (pb.y - pa.y) / total };
    let span: number;
    let partSpec: Record<string, unknown> | null = null;
    if (kind === 'part') {
      const part = a.part ?? 'resistor';
      if (!PARTS.includes(part as typeof PARTS[number])) throw new InputError('bad-choice', 'args.part', '"resistor", "capacitor" or "inductor"', describe(part));
      const size = (a.size ?? '0603') as SmdSize;
      if (!SIZES.includes(size)) throw new InputError('bad-choice', 'args.size', `a chip size ${SIZES.join(', ')}`, describe(a.size));
      // A 100 Ω resistor is an everyday placeholder the user then edits (common practice).
      const value = a.value ?? (part === 'resistor' ? 100 : part === 'capacitor' ? 10e-12 : 10e-9);
      span = smdFootprint(size).pitch;
      partSpec = { kind: 'lumped', part, value, size, width };
    } else {
      span = a.span === undefined ? Math.min(TAPER_SPAN, left * 0.6) : (a.span as number);
    }
    if (typeof span !== 'number' || !(span > 0) || span >= left) {
      throw new InputError('out-of-range', 'args.at', `a point with more than ${(span * 1e3).toFixed(2)} mm of the line after it (the ${kind}'s span)`, `${(left * 1e3).toFixed(2)} mm left`, 'click nearer the line\'s start, or lengthen the line');
    }
    const end = { x: at.x + dir.x * span, y: at.y + dir.y * span };
    const split2 = run(split1, 'segment.split', { id: second, at: end });
    void mid;
    if (partSpec) return run(split2, 'segment.setSpec', { id: second, spec: partSpec });
    const after = added(split1.segments, split2.segments)[0]!;
    const tapered = run(split2, 'segment.setSpec', { id: second, spec: { kind: 'taper', profile: 'linear', from: width, to: newWidth, length: { by: 'drawn' } } });
    return run(tapered, 'segment.setSpec', { id: after, spec: { width: newWidth } });
  },
});

/** The gesture commands, given the runner of the basic commands. */
export function gestureCommands(run: RunBasic): GestureCommand[] {
  return [routeCmd(run), teeCmd(run), stubCmd(run), insertCmd(run)];
}
