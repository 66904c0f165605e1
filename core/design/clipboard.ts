/**
 * Copy and paste of part of a design. The clipboard is JSON text of our own envelope
 * `{ format: "stripwright-clipboard", version: 1, nodes, segments, areas }`: the selected nodes, the selected
 * segments with their end nodes, segments whose two ends are both selected, and selected areas. Pasting gives every
 * record a fresh id (links remapped) and shifts it by an offset; the pasted records are checked like a file's.
 */
import * as v from 'valibot';
import { InputError, describe } from '../util/errors.ts';
import type { Vec2 } from '../geometry/types.ts';
import { segmentEnds, type Area, type DesignDoc, type DesignNode, type DesignSegment } from './types.ts';
import { areaSchema, nodeSchema, segmentSchema } from './schema.ts';
import { DESIGN_LIMITS } from './limits.ts';
import { scanJson } from './json-scan.ts';
import { allIds, checkWith, freshId, snapVec } from './command-args.ts';

export const CLIPBOARD_FORMAT = 'stripwright-clipboard';

export interface ClipboardContent {
  format: typeof CLIPBOARD_FORMAT;
  version: 1;
  nodes: DesignNode[];
  segments: DesignSegment[];
  areas: Area[];
}

/** Clipboard text of the records named by `ids` (unknown ids are ignored: a selection may be stale). */
export function copySelection(doc: DesignDoc, ids: readonly string[]): string {
  const want = new Set(ids);
  const nodeIds = new Set(doc.nodes.filter((n) => want.has(n.id)).map((n) => n.id));
  for (const s of doc.segments) if (want.has(s.id)) for (const n of segmentEnds(s)) nodeIds.add(n);
  const segments = doc.segments.filter((s) => want.has(s.id) || segmentEnds(s).every((n) => nodeIds.has(n)));
  const content: ClipboardContent = {
    format: CLIPBOARD_FORMAT, version: 1,
    nodes: doc.nodes.filter((n) => nodeIds.has(n.id)),
    segments,
    areas: doc.areas.filter((r) => want.has(r.id)),
  };
  return JSON.stringify(content);
}

const CLIP_SCHEMA = v.looseObject({
  format: v.literal(CLIPBOARD_FORMAT, `"${CLIPBOARD_FORMAT}" (text copied from a Stripwright design)`),
  version: v.literal(1, 'clipboard version 1'),
  nodes: v.pipe(v.array(nodeSchema, 'a list of nodes'), v.maxLength(DESIGN_LIMITS.nodes, `at most ${DESIGN_LIMITS.nodes} nodes`)),
  segments: v.pipe(v.array(segmentSchema, 'a list of segments'), v.maxLength(DESIGN_LIMITS.segments, `at most ${DESIGN_LIMITS.segments} segments`)),
  areas: v.pipe(v.array(areaSchema, 'a list of areas'), v.maxLength(DESIGN_LIMITS.areas, `at most ${DESIGN_LIMITS.areas} areas`)),
});

/**
 * `doc` with the clipboard's records added under fresh ids, moved by `offset`, and the map old id → new id.
 * Throws InputError if the text is not a clipboard of ours or a record in it is malformed.
 */
export function pasteClipboard(doc: DesignDoc, text: string, offset: Vec2): { doc: DesignDoc; ids: Map<string, string> } {
  const problem = scanJson(text);
  if (problem) throw new InputError('bad-file', 'clipboard', `clipboard text copied from a design (${problem.expected})`, problem.found);
  const clip = checkWith(CLIP_SCHEMA, JSON.parse(text), 'clipboard') as unknown as ClipboardContent;
  const taken = allIds(doc);
  const map = new Map<string, string>();
  const nodes = clip.nodes.map((n) => {
    if (map.has(n.id)) throw new InputError('invalid-design', 'clipboard.nodes', 'each node id once', JSON.stringify(n.id));
    const id = freshId(taken, 'n');
    map.set(n.id, id);
    return { ...n, id, at: snapVec({ x: n.at.x + offset.x, y: n.at.y + offset.y }) } as DesignNode;
  });
  const segments = clip.segments.map((s, i) => {
    const missing = segmentEnds(s).find((n) => !map.has(n));
    if (missing !== undefined) throw new InputError('invalid-design', `clipboard.segments[${i}]`, 'a segment whose ends are copied with it', describe(missing));
    const id = freshId(taken, 's');
    map.set(s.id, id);
    // A coupled pair has four terminals (c, d besides a, b): all are remapped.
    return (s.kind === 'coupled' ? { ...s, id, a: map.get(s.a)!, b: map.get(s.b)!, c: map.get(s.c)!, d: map.get(s.d)! } : { ...s, id, a: map.get(s.a)!, b: map.get(s.b)! }) as DesignSegment;
  });
  const areas = clip.areas.map((r) => {
    const id = freshId(taken, 'area');
    map.set(r.id, id);
    return { ...r, id, polygon: r.polygon.map((p) => snapVec({ x: p.x + offset.x, y: p.y + offset.y })) };
  });
  return { doc: { ...doc, nodes: [...doc.nodes, ...nodes], segments: [...doc.segments, ...segments], areas: [...doc.areas, ...areas] }, ids: map };
}
