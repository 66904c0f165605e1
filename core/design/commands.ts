/**
 * Edits of a design, as data: each command has an id, a label for menus and the undo list, and a pure `run` that
 * returns a new document (records not touched keep their identity, nothing is mutated). Arguments are checked and
 * a bad one throws InputError; the result is then checked across records, so no command can produce a document
 * the file loader would refuse. History (design/history.ts) records what each run changed as a diff.
 *
 * @example
 * let doc = newDesign();
 * doc = runCommand(doc, 'node.add', { at: { x: 0, y: 0 }, spec: { kind: 'port' } });
 */
import { blockPut, blockDetach, blockPaste } from './commands-blocks.ts';
import * as v from 'valibot';
import { InputError, describe } from '../util/errors.ts';
import type { Vec2 } from '../geometry/types.ts';
import { segmentEnds, type Area, type DesignDoc, type DesignNode, type DesignSegment, type FabProcess, type JunctionChoice, type NodeSpec, type PhaseGroup, type SegmentSpec } from './types.ts';
import { asMadeSchema, areaSchema, frequencySchema, junctionChoiceSchema, nodeSchema, phaseGroupSchema, processSchema, segmentSchema, substrateSchema, vec2Schema } from './schema.ts';
import { DESIGN_LIMITS } from './limits.ts';
import { crossCheck, DEGREE } from './crossref.ts';
import {
  allIds, NODE_SPEC_KEYS, SEGMENT_SPEC_KEYS, argId, argIds, argNumber, argString, argVec, argsObject, checkWith, findNode, findSegment, freshId, snapVec, wrapAngle, type Args, type DesignCommand,
} from './command-args.ts';
import { pasteClipboard } from './clipboard.ts';
import { setTargets, setTolerances } from './commands-targets.ts';
import { gestureCommands } from './gestures.ts';
import { applyEqualize, applyTune } from './commands-network.ts';
import { setSweep } from './commands-sweep.ts';
import { setMeasured } from './commands-measured.ts';
import { setProximityLimit } from './commands-proximity.ts';

export type { DesignCommand } from './command-args.ts';

/** Kind-specific defaults when a node is placed or changes kind. 50 Ω is the usual reference (common practice). */
export function defaultNodeSpec(kind: DesignNode['kind']): NodeSpec {
  switch (kind) {
    case 'port': return { kind, zRef: 50, heading: 0 };
    case 'vertex': return { kind, bend: { style: 'miter-optimal' } };
    case 'junction': return { kind };
    case 'open': return { kind };
    // 0.8 mm drill in a 1.4 mm pad: a usual hand-drilled ground via (common practice).
    case 'short': return { kind, via: { drill: 0.8e-3, pad: 1.4e-3, count: 1 } };
  }
}

/** A 50 Ω line sized from its drawn length: what a new run starts as. */
export const DEFAULT_SEGMENT_SPEC: SegmentSpec = { kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } };


function specArg(args: Args, key: string): Record<string, unknown> | undefined {
  const s = args[key];
  if (s === undefined) return undefined;
  if (s === null || typeof s !== 'object' || Array.isArray(s)) throw new InputError('invalid-design', `args.${key}`, 'an object of record fields', describe(s));
  for (const k of ['id', 'a', 'b', 'at']) if (k in s) throw new InputError('invalid-design', `args.${key}.${k}`, `no ${k} inside a spec (ids, ends and positions have their own commands)`, describe((s as Args)[k]));
  return s as Record<string, unknown>;
}

/** Builds a node from an old one (or none) and a partial spec; kind changes drop the old kind's fields. */
function buildNode(base: Record<string, unknown>, spec: Record<string, unknown> | undefined, field: string): DesignNode {
  const oldKind = base.kind as DesignNode['kind'] | undefined;
  const kind = (spec?.kind ?? oldKind) as DesignNode['kind'];
  if (typeof kind !== 'string' || !(kind in DEGREE)) throw new InputError('bad-choice', `${field}.kind`, 'a node kind "port", "vertex", "junction", "open" or "short"', describe(kind));
  let node: Record<string, unknown>;
  if (kind === oldKind) node = { ...base, ...spec };
  else {
    const keep = Object.fromEntries(Object.entries(base).filter(([k]) => !NODE_SPEC_KEYS.has(k)));
    node = { ...keep, ...defaultNodeSpec(kind), ...spec };
  }
  if (node.kind === 'port' && typeof node.heading === 'number' && Number.isFinite(node.heading)) node.heading = wrapAngle(node.heading);
  return checkWith(nodeSchema, node, field) as DesignNode;
}

function buildSegment(base: Record<string, unknown>, spec: Record<string, unknown> | undefined, field: string): DesignSegment {
  const oldKind = base.kind as string | undefined;
  const kind = (spec?.kind ?? oldKind) as string;
  let seg: Record<string, unknown>;
  if (kind === oldKind) seg = { ...base, ...spec };
  else {
    const keep = Object.fromEntries(Object.entries(base).filter(([k]) => !SEGMENT_SPEC_KEYS.has(k)));
    seg = { ...keep, ...spec };
  }
  return checkWith(segmentSchema, seg, field) as DesignSegment;
}

function label(args: Args): { label?: string } {
  const l = argString(args, 'label', `a label of at most ${DESIGN_LIMITS.label} characters`, { optional: true, max: DESIGN_LIMITS.label });
  return l === undefined ? {} : { label: l };
}

function degreeOf(doc: DesignDoc, id: string): number {
  let d = 0;
  for (const s of doc.segments) for (const e of segmentEnds(s)) if (e === id) d++;
  return d;
}

function requireRoom(doc: DesignDoc, node: DesignNode, field: string, extra = 1): void {
  const d = degreeOf(doc, node.id);
  const max = DEGREE[node.kind].max;
  if (d + extra > max) throw new InputError('invalid-design', field, `a node with room for another segment (${DEGREE[node.kind].words})`, `${JSON.stringify(node.id)}, a ${node.kind} with ${d} already`);
}

function checkCount(doc: DesignDoc): void {
  if (doc.nodes.length > DESIGN_LIMITS.nodes) throw new InputError('out-of-range', 'nodes', `at most ${DESIGN_LIMITS.nodes} nodes`, String(doc.nodes.length));
  if (doc.segments.length > DESIGN_LIMITS.segments) throw new InputError('out-of-range', 'segments', `at most ${DESIGN_LIMITS.segments} segments`, String(doc.segments.length));
  if (doc.areas.length > DESIGN_LIMITS.areas) throw new InputError('out-of-range', 'areas', `at most ${DESIGN_LIMITS.areas} areas`, String(doc.areas.length));
}

/** The cross-record check every result passes; the first problem is thrown so the edit is refused whole. */
function settle(cmd: string, doc: DesignDoc): DesignDoc {
  checkCount(doc);
  const c = crossCheck(doc);
  const e = c.errors[0];
  if (e) throw new InputError('invalid-design', e.path, e.expected, `${e.found} after ${cmd}`, 'the edit was not made');
  return doc;
}

const replaceAt = <T>(list: readonly T[], i: number, item: T): T[] => list.map((x, k) => (k === i ? item : x));

// ---- the commands ------------------------------------------------------------------------------------------------

const nodeAdd: DesignCommand = {
  id: 'node.add', label: 'Place node',
  run(doc, a) {
    const at = argVec(a, 'at');
    const spec = specArg(a, 'spec') ?? { kind: 'vertex' };
    const ids = allIds(doc);
    const id = a.id === undefined ? freshId(ids, 'n') : argId(a, 'id');
    if (a.id !== undefined && ids.has(id)) throw new InputError('invalid-design', 'args.id', 'an id not used in the design', JSON.stringify(id));
    const node = buildNode({ id, at: snapVec(at), ...label(a) }, spec, 'args.spec');
    return settle(this.id, { ...doc, nodes: [...doc.nodes, node] });
  },
};

const nodeMove: DesignCommand = {
  id: 'node.move', label: 'Move node',
  run(doc, a) {
    const { node, index } = findNode(doc, argId(a, 'id'), 'args.id');
    const at = snapVec(argVec(a, 'at'));
    return settle(this.id, { ...doc, nodes: replaceAt(doc.nodes, index, { ...node, at }) });
  },
};

const nodeSetSpec: DesignCommand = {
  id: 'node.setSpec', label: 'Change node',
  run(doc, a) {
    const { node, index } = findNode(doc, argId(a, 'id'), 'args.id');
    const spec = specArg(a, 'spec');
    const base: Record<string, unknown> = { ...node, ...label(a) };
    if (a.label === null) delete base.label;
    const next = buildNode(base, spec, 'args.spec');
    return settle(this.id, { ...doc, nodes: replaceAt(doc.nodes, index, next) });
  },
};

const segmentAdd: DesignCommand = {
  id: 'segment.add', label: 'Draw segment',
  run(doc, a) {
    const na = findNode(doc, argId(a, 'a'), 'args.a').node;
    const nb = findNode(doc, argId(a, 'b'), 'args.b').node;
    if (na.id === nb.id) throw new InputError('invalid-design', 'args.b', 'a node other than a', JSON.stringify(nb.id));
    requireRoom(doc, na, 'args.a');
    requireRoom(doc, nb, 'args.b');
    const ids = allIds(doc);
    const id = a.id === undefined ? freshId(ids, 's') : argId(a, 'id');
    if (a.id !== undefined && ids.has(id)) throw new InputError('invalid-design', 'args.id', 'an id not used in the design', JSON.stringify(id));
    const seg = buildSegment({ id, a: na.id, b: nb.id, ...label(a) }, specArg(a, 'spec') ?? DEFAULT_SEGMENT_SPEC, 'args.spec');
    return settle(this.id, { ...doc, segments: [...doc.segments, seg] });
  },
};

const segmentSetSpec: DesignCommand = {
  id: 'segment.setSpec', label: 'Change segment',
  run(doc, a) {
    const { segment, index } = findSegment(doc, argId(a, 'id'), 'args.id');
    const base: Record<string, unknown> = { ...segment, ...label(a) };
    if (a.label === null) delete base.label;
    const next = buildSegment(base, specArg(a, 'spec'), 'args.spec');
    return settle(this.id, { ...doc, segments: replaceAt(doc.segments, index, next) });
  },
};

/** The records a selection names, with unknown ids refused. */
function selection(doc: DesignDoc, ids: string[]) {
  const want = new Set(ids);
  const nodes = new Set(doc.nodes.filter((n) => want.has(n.id)).map((n) => n.id));
  const segments = new Set(doc.segments.filter((s) => want.has(s.id)).map((s) => s.id));
  const areas = new Set(doc.areas.filter((r) => want.has(r.id)).map((r) => r.id));
  const groups = new Set(doc.phaseGroups.filter((g) => want.has(g.id)).map((g) => g.id));
  ids.forEach((id, i) => {
    if (!nodes.has(id) && !segments.has(id) && !areas.has(id) && !groups.has(id)) throw new InputError('bad-choice', `args.ids[${i}]`, 'the id of a record in the design', JSON.stringify(id));
  });
  return { nodes, segments, areas, groups };
}

/** A node left with fewer lines than its kind needs after a delete: a corner with one line becomes an open end, a tee with two a corner. */
function settleKind(n: DesignNode, degree: number): DesignNode {
  const keep = { id: n.id, at: n.at, ...(n.label ? { label: n.label } : {}) };
  if (n.kind === 'vertex' && degree === 1) return buildNode(keep, { kind: 'open' }, 'nodes');
  if (n.kind === 'junction' && degree === 2) return buildNode(keep, { kind: 'vertex' }, 'nodes');
  return n;
}

const selectionDelete: DesignCommand = {
  id: 'selection.delete', label: 'Delete',
  run(doc, a) {
    const sel = selection(doc, argIds(a, 'ids'));
    // A port whose line stays leaves an open end there, so the run can be routed on or made a port again.
    const toOpen = new Set<string>();
    for (const n of doc.nodes) {
      if (n.kind !== 'port' || !sel.nodes.has(n.id)) continue;
      const line = doc.segments.find((s) => segmentEnds(s).includes(n.id));
      if (line && !sel.segments.has(line.id) && line.kind !== 'coupled') { toOpen.add(n.id); sel.nodes.delete(n.id); }
    }
    const goneSegs = new Set(sel.segments);
    for (const s of doc.segments) if (segmentEnds(s).some((e) => sel.nodes.has(e))) goneSegs.add(s.id);
    const segments = doc.segments.filter((s) => !goneSegs.has(s.id));
    // Bends, tees and stub ends left with no segment at all mean nothing on their own; ports stay.
    const touched = new Set<string>();
    for (const s of doc.segments) if (goneSegs.has(s.id)) for (const e of segmentEnds(s)) touched.add(e);
    const used = new Map<string, number>();
    for (const s of segments) for (const e of segmentEnds(s)) used.set(e, (used.get(e) ?? 0) + 1);
    const nodes = doc.nodes
      .filter((n) => !sel.nodes.has(n.id) && !(touched.has(n.id) && !used.has(n.id) && n.kind !== 'port'))
      .map((n) => (toOpen.has(n.id) ? buildNode({ id: n.id, at: n.at, ...(n.label ? { label: n.label } : {}) }, { kind: 'open' }, 'nodes') : touched.has(n.id) ? settleKind(n, used.get(n.id) ?? 0) : n));
    const ports = new Set(nodes.filter((n) => n.kind === 'port').map((n) => n.id));
    const phaseGroups: PhaseGroup[] = [];
    for (const g of doc.phaseGroups) {
      if (sel.groups.has(g.id) || !ports.has(g.from)) continue;
      const keep = g.to.map((id, i) => [id, i] as const).filter(([id]) => ports.has(id));
      if (keep.length === 0) continue;
      if (keep.length === g.to.length) { phaseGroups.push(g); continue; }
      const next: PhaseGroup = { ...g, to: keep.map(([id]) => id) };
      if (g.offsetsDeg) next.offsetsDeg = keep.map(([, i]) => g.offsetsDeg![i]!);
      phaseGroups.push(next);
    }
    const areas = doc.areas.filter((r) => !sel.areas.has(r.id));
    return settle(this.id, { ...doc, nodes, segments, areas, phaseGroups });
  },
};

/** Applies a point map to the selected nodes (and the ends of selected segments) and areas. */
function transformSelection(doc: DesignDoc, ids: string[], map: (p: Vec2) => Vec2, heading: (h: number) => number): DesignDoc {
  const sel = selection(doc, ids);
  const moving = new Set(sel.nodes);
  for (const s of doc.segments) if (sel.segments.has(s.id)) for (const e of segmentEnds(s)) moving.add(e);
  const nodes = doc.nodes.map((n) => {
    if (!moving.has(n.id)) return n;
    const moved = { ...n, at: snapVec(map(n.at)) } as DesignNode;
    if (moved.kind === 'port') moved.heading = wrapAngle(heading(moved.heading));
    return moved;
  });
  const areas = doc.areas.map((r) => (sel.areas.has(r.id) ? { ...r, polygon: r.polygon.map((p) => snapVec(map(p))) } : r));
  return { ...doc, nodes, areas };
}

const selectionTranslate: DesignCommand = {
  id: 'selection.translate', label: 'Move',
  run(doc, a) {
    const by = checkWith(vec2Schema, a.by, 'args.by');
    return settle(this.id, transformSelection(doc, argIds(a, 'ids'), (p) => ({ x: p.x + by.x, y: p.y + by.y }), (h) => h));
  },
};

const selectionRotate: DesignCommand = {
  id: 'selection.rotate', label: 'Rotate',
  run(doc, a) {
    const about = argVec(a, 'about');
    const deg = argNumber(a, 'angleDeg', 'an angle in degrees within ±360 (positive turns counter-clockwise)', -360, 360);
    const th = (deg * Math.PI) / 180;
    // Exact quarter turns keep exact coordinates.
    const q = Math.round(deg / 90);
    const exact = Math.abs(deg - q * 90) < 1e-12;
    const c = exact ? [1, 0, -1, 0][((q % 4) + 4) % 4]! : Math.cos(th);
    const s = exact ? [0, 1, 0, -1][((q % 4) + 4) % 4]! : Math.sin(th);
    const map = (p: Vec2) => {
      const dx = p.x - about.x, dy = p.y - about.y;
      return { x: about.x + c * dx - s * dy, y: about.y + s * dx + c * dy };
    };
    return settle(this.id, transformSelection(doc, argIds(a, 'ids'), map, (h) => h + th));
  },
};

const selectionMirror: DesignCommand = {
  id: 'selection.mirror', label: 'Mirror',
  run(doc, a) {
    const axis = a.axis;
    if (axis !== 'vertical' && axis !== 'horizontal') throw new InputError('bad-choice', 'args.axis', '"vertical" (flip left–right about x = about.x) or "horizontal" (flip top–bottom about y = about.y)', describe(axis));
    const about = argVec(a, 'about');
    const map = axis === 'vertical' ? (p: Vec2) => ({ x: 2 * about.x - p.x, y: p.y }) : (p: Vec2) => ({ x: p.x, y: 2 * about.y - p.y });
    const heading = axis === 'vertical' ? (h: number) => Math.PI - h : (h: number) => -h;
    const doc2 = transformSelection(doc, argIds(a, 'ids'), map, heading);
    // A mirrored polygon runs the other way round; keep outers counter-clockwise (geometry/types.ts).
    const sel = new Set(argIds(a, 'ids'));
    return settle(this.id, { ...doc2, areas: doc2.areas.map((r) => (sel.has(r.id) ? { ...r, polygon: [...r.polygon].reverse() } : r)) });
  },
};

const selectionPaste: DesignCommand = {
  id: 'selection.paste', label: 'Paste',
  run(doc, a) {
    const clip = argString(a, 'clipboard', 'clipboard text copied from a design', { max: DESIGN_LIMITS.fileBytes })!;
    const offset = a.offset === undefined ? { x: 0, y: 0 } : argVec(a, 'offset');
    return settle(this.id, pasteClipboard(doc, clip, offset).doc);
  },
};

const setSubstrate: DesignCommand = {
  id: 'design.setSubstrate', label: 'Change substrate',
  run(doc, a) {
    const patch = specArg(a, 'substrate');
    if (!patch) throw new InputError('invalid-design', 'args.substrate', 'an object of substrate fields (er, h, t, tanDelta, sigma, roughness, ...)', 'nothing');
    const next = { ...doc.substrate, ...patch };
    if (patch.preset === null) delete (next as Record<string, unknown>).preset;
    return { ...doc, substrate: checkWith(substrateSchema, next, 'args.substrate') };
  },
};

const setFrequency: DesignCommand = {
  id: 'design.setFrequency', label: 'Change frequency',
  run(doc, a) {
    const next = {
      ...doc.frequency,
      ...(a.f0 !== undefined ? { f0: a.f0 } : {}),
      ...(a.band !== undefined ? { band: a.band } : {}),
    };
    const f = checkWith(frequencySchema, next, 'args') as DesignDoc['frequency'];
    if (!(f.band.start < f.band.stop)) throw new InputError('out-of-range', 'args.band.stop', `a band stop above its start (${f.band.start} Hz)`, String(f.band.stop));
    return { ...doc, frequency: f };
  },
};

const setProcess: DesignCommand = {
  id: 'design.setProcess', label: 'Change process',
  run(doc, a) {
    return { ...doc, process: checkWith(processSchema, a.process, 'args.process') as FabProcess };
  },
};

const setJunctions: DesignCommand = {
  id: 'design.setJunctions', label: 'Change junction models',
  run(doc, a) {
    return { ...doc, junctions: checkWith(junctionChoiceSchema, a.junctions, 'args.junctions') as JunctionChoice };
  },
};

/** How lines are sized for what is made (design asMade: sizing, side copper, cover, via-fence pitch). */
const setAsMade: DesignCommand = {
  id: 'design.setAsMade', label: 'Change how lines are made',
  run(doc, a) {
    return { ...doc, asMade: checkWith(asMadeSchema, a.asMade, 'args.asMade') as NonNullable<DesignDoc['asMade']> };
  },
};

const setInfo: DesignCommand = {
  id: 'design.setInfo', label: 'Rename',
  run(doc, a) {
    const name = argString(a, 'name', `a design name of at most ${DESIGN_LIMITS.name} characters`, { optional: true, max: DESIGN_LIMITS.name });
    const notes = a.notes === null ? null : argString(a, 'notes', `notes of at most ${DESIGN_LIMITS.notes} characters`, { optional: true, max: DESIGN_LIMITS.notes });
    const next: DesignDoc = { ...doc };
    if (name !== undefined) next.name = name;
    if (notes === null) delete next.notes; else if (notes !== undefined) next.notes = notes;
    return next;
  },
};

const runExtend: DesignCommand = {
  id: 'run.extend', label: 'Extend run',
  run(doc, a) {
    const { node, index } = findNode(doc, argId(a, 'from'), 'args.from');
    const to = snapVec(argVec(a, 'to'));
    const endKind = a.end ?? 'open';
    if (endKind !== 'open' && endKind !== 'short' && endKind !== 'port' && endKind !== 'vertex') throw new InputError('bad-choice', 'args.end', 'the new end\'s kind: "open", "short", "port" or "vertex"', describe(endKind));
    const deg = degreeOf(doc, node.id);
    const prev = doc.segments.find((s) => s.a === node.id || s.b === node.id);
    let nodes = doc.nodes;
    if (node.kind === 'port' || node.kind === 'vertex' || node.kind === 'junction') {
      requireRoom(doc, node, 'args.from');
    } else if (deg === 1) {
      // An open or shorted end that carries on becomes a bend.
      nodes = replaceAt(nodes, index, buildNode({ id: node.id, at: node.at, ...(node.label ? { label: node.label } : {}) }, { kind: 'vertex' }, 'args.from'));
    } else requireRoom(doc, node, 'args.from');
    const ids = allIds(doc);
    const endId = freshId(ids, 'n');
    const segId = freshId(ids, 's');
    const end = buildNode({ id: endId, at: to }, { kind: endKind }, 'args.end');
    const spec = specArg(a, 'spec')
      ?? (prev && prev.kind === 'line' ? { kind: 'line', width: prev.width, length: { by: 'drawn' } }
        : prev && prev.kind === 'taper' ? { kind: 'line', width: prev.a === node.id ? prev.from : prev.to, length: { by: 'drawn' } }
          : DEFAULT_SEGMENT_SPEC);
    const seg = buildSegment({ id: segId, a: node.id, b: endId }, spec, 'args.spec');
    return settle(this.id, { ...doc, nodes: [...nodes, end], segments: [...doc.segments, seg] });
  },
};

function splitLength(l: DesignSegment & { kind: 'line' }, t: number): [unknown, unknown] {
  const len = l.length;
  if (len.by === 'degrees') return [{ ...len, deg: len.deg * t }, { ...len, deg: len.deg * (1 - t) }];
  if (len.by === 'length') return [{ ...len, length: len.length * t }, { ...len, length: len.length * (1 - t) }];
  return [len, len];
}

const segmentSplit: DesignCommand = {
  id: 'segment.split', label: 'Add tee',
  run(doc, a) {
    const { segment, index } = findSegment(doc, argId(a, 'id'), 'args.id');
    if (segment.kind !== 'line') throw new InputError('invalid-design', 'args.id', 'a line segment (tapers, parts and measured blocks are single pieces)', `a ${segment.kind} segment`);
    const pa = findNode(doc, segment.a, 'segment.a').node.at, pb = findNode(doc, segment.b, 'segment.b').node.at;
    const at = argVec(a, 'at');
    const dx = pb.x - pa.x, dy = pb.y - pa.y;
    const t = ((at.x - pa.x) * dx + (at.y - pa.y) * dy) / (dx * dx + dy * dy);
    // Both halves keep at least 10 µm (a part's pads may sit close to a long line's end; nothing shorter can be made).
    const len = Math.hypot(dx, dy);
    if (!(t * len >= 1e-5 && (1 - t) * len >= 1e-5)) throw new InputError('out-of-range', 'args.at', 'a point along the segment, away from its ends', `a point ${(t * 100).toFixed(1)} % of the way along`);
    const p = snapVec({ x: pa.x + t * dx, y: pa.y + t * dy });
    const ids = allIds(doc);
    const midId = freshId(ids, 'n');
    const branch = a.branchTo !== undefined;
    const mid = buildNode({ id: midId, at: p }, { kind: branch ? 'junction' : 'vertex' }, 'args');
    const [l1, l2] = splitLength(segment, t);
    const { id: _id, a: _a, b: _b, ...rest } = segment;
    const first = { ...segment, b: midId, length: l1 } as DesignSegment;
    const second = { ...rest, id: freshId(ids, 's'), a: midId, b: segment.b, length: l2 } as DesignSegment;
    if ('label' in second) delete (second as { label?: string }).label;
    const segments = [...doc.segments.slice(0, index), first, second, ...doc.segments.slice(index + 1)];
    const nodes = [...doc.nodes, mid];
    if (branch) {
      const tip = buildNode({ id: freshId(ids, 'n'), at: snapVec(argVec(a, 'branchTo')) }, { kind: a.branchEnd ?? 'open' }, 'args.branchEnd');
      const spec = specArg(a, 'branchSpec') ?? { kind: 'line', width: segment.width, length: { by: 'drawn' } };
      segments.push(buildSegment({ id: freshId(ids, 's'), a: midId, b: tip.id }, spec, 'args.branchSpec'));
      nodes.push(tip);
    }
    return settle(this.id, { ...doc, nodes, segments });
  },
};

const areaAdd: DesignCommand = {
  id: 'area.add', label: 'Add area',
  run(doc, a) {
    const ids = allIds(doc);
    const id = a.id === undefined ? freshId(ids, 'area') : argId(a, 'id');
    if (a.id !== undefined && ids.has(id)) throw new InputError('invalid-design', 'args.id', 'an id not used in the design', JSON.stringify(id));
    const area = checkWith(areaSchema, { id, kind: a.kind, polygon: a.polygon, ...(a.clearance !== undefined ? { clearance: a.clearance } : {}) }, 'args') as Area;
    return settle(this.id, { ...doc, areas: [...doc.areas, { ...area, polygon: area.polygon.map(snapVec) }] });
  },
};

const areaSet: DesignCommand = {
  id: 'area.set', label: 'Change area',
  run(doc, a) {
    const id = argId(a, 'id');
    const index = doc.areas.findIndex((r) => r.id === id);
    if (index < 0) throw new InputError('bad-choice', 'args.id', 'the id of an area in the design', JSON.stringify(id));
    const cur = doc.areas[index]!;
    const next = { ...cur, ...(a.kind !== undefined ? { kind: a.kind } : {}), ...(a.polygon !== undefined ? { polygon: a.polygon } : {}), ...(a.clearance !== undefined ? { clearance: a.clearance } : {}) };
    const area = checkWith(areaSchema, next, 'args') as Area;
    return settle(this.id, { ...doc, areas: replaceAt(doc.areas, index, { ...area, polygon: area.polygon.map(snapVec) }) });
  },
};

const boardSetOutline: DesignCommand = {
  id: 'board.setOutline', label: 'Set board outline',
  run(doc, a) {
    if (a.outline === null) return { ...doc, board: null };
    const outline = checkWith(v.pipe(v.array(vec2Schema, 'a list of points'), v.minLength(3, 'an outline of at least 3 points'), v.maxLength(DESIGN_LIMITS.polygonPoints, `an outline of at most ${DESIGN_LIMITS.polygonPoints} points`)), a.outline, 'args.outline');
    return settle(this.id, { ...doc, board: { ...(doc.board ?? {}), outline: outline.map(snapVec) } });
  },
};

/**
 * Creates or changes a phase group: its input port (`from`), its members (`to`; the first is the reference the
 * others are compared with), `toleranceDeg`, `name`. Offsets follow their ports when members are reordered, added
 * (offset 0) or dropped; the input leaves the members when it is chosen as input.
 */
const phaseGroupSet: DesignCommand = {
  id: 'phaseGroup.set', label: 'Set phase group',
  run(doc, a) {
    const ids = allIds(doc);
    const id = a.id === undefined ? freshId(ids, 'pg') : argId(a, 'id');
    const index = doc.phaseGroups.findIndex((g) => g.id === id);
    if (index < 0 && a.id !== undefined && ids.has(id)) throw new InputError('invalid-design', 'args.id', 'the id of a phase group, or an id not used in the design', JSON.stringify(id));
    const cur: Record<string, unknown> = index >= 0 ? { ...doc.phaseGroups[index]! } : { id, name: 'Phase group', toleranceDeg: 5 };
    const next = { ...cur, ...Object.fromEntries(['name', 'from', 'to', 'toleranceDeg', 'offsetsDeg'].filter((k) => a[k] !== undefined).map((k) => [k, a[k]])) };
    if (a.offsetsDeg === null) delete next.offsetsDeg;
    // The new input is no longer a member.
    if (a.from !== undefined && Array.isArray(next.to)) next.to = (next.to as unknown[]).filter((t) => t !== a.from);
    const oldOffsets = cur.offsetsDeg as number[] | undefined;
    if (oldOffsets && a.offsetsDeg === undefined && Array.isArray(next.to)) {
      const before = cur.to as string[];
      next.offsetsDeg = (next.to as unknown[]).map((t) => { const k = before.indexOf(t as string); return k >= 0 ? oldOffsets[k] ?? 0 : 0; });
    }
    const g = checkWith(phaseGroupSchema, next, 'args') as PhaseGroup;
    const phaseGroups = index >= 0 ? replaceAt(doc.phaseGroups, index, g) : [...doc.phaseGroups, g];
    return settle(this.id, { ...doc, phaseGroups });
  },
};

const phaseGroupDelete: DesignCommand = {
  id: 'phaseGroup.delete', label: 'Delete phase group',
  run(doc, a) {
    const id = argId(a, 'id');
    if (!doc.phaseGroups.some((g) => g.id === id)) throw new InputError('bad-choice', 'args.id', 'the id of a phase group in the design', JSON.stringify(id));
    // Requirements on that group's phase balance go with it (one undo step brings both back).
    const targets = doc.targets.filter((t) => (t as { group?: string }).group !== id);
    return settle(this.id, { ...doc, phaseGroups: doc.phaseGroups.filter((g) => g.id !== id), ...(targets.length !== doc.targets.length ? { targets } : {}) });
  },
};

const viewSet: DesignCommand = {
  id: 'view.set', label: 'Change view',
  run(doc, a) {
    const next: Record<string, unknown> = { ...(doc.view ?? {}) };
    // Display units are the app's own view setting (format 7), not part of the design.
    if (a.units !== undefined) throw new InputError('invalid-design', 'args.units', 'only the snap grid (display units are an app setting, not kept in the design)', describe(a.units));
    if (a.grid !== undefined) next.grid = argNumber(a, 'grid', 'a grid step in metres above 0 and at most 0.1 m', 1e-7, 0.1);
    return { ...doc, view: next as DesignDoc['view'] };
  },
};

/** Every command, by id. */
export const DESIGN_COMMANDS: ReadonlyMap<string, DesignCommand> = new Map(
  [nodeAdd, nodeMove, nodeSetSpec, segmentAdd, segmentSetSpec, selectionDelete, selectionTranslate, selectionRotate, selectionMirror,
    selectionPaste, setSubstrate, setFrequency, setProcess, setJunctions, setAsMade, setInfo, runExtend, segmentSplit, areaAdd, areaSet, boardSetOutline,
    phaseGroupSet, phaseGroupDelete, viewSet, setTargets, setTolerances, setSweep, setMeasured, setProximityLimit, applyEqualize, applyTune, blockPut, blockDetach, blockPaste, ...gestureCommands((d, id, args) => runCommand(d, id, args))].map((c) => [c.id, c]),
);

/** Runs command `id` on `doc`; throws InputError on an unknown id or bad arguments. `doc` is never changed. */
export function runCommand(doc: DesignDoc, id: string, args: unknown = {}): DesignDoc {
  const cmd = DESIGN_COMMANDS.get(id);
  if (!cmd) throw new InputError('bad-choice', 'command', `one of ${[...DESIGN_COMMANDS.keys()].join(', ')}`, JSON.stringify(id));
  return cmd.run(doc, argsObject(id, args));
}
