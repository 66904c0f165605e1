/**
 * The board scene from the design (the sketch) and the core's geometry (true copper and centrelines), plus the
 * lookups the tools need. View data only: no physics is computed here.
 */
import type { DesignDoc, DesignNode, DesignSegment } from '../../../core/index.ts';
import { smdFootprint } from '../../../core/index.ts';
import { formatQuantity, type QuantityKind } from '../../../core/index.ts';
import type { DrillHit, Region, Vec2 } from '../../../core/index.ts';
import type { PieceOutline } from '../../../core/index.ts';

export interface SceneCopper { outlines: (PieceOutline & { d?: string; by?: Vec2 })[]; drills: DrillHit[] }
import type { Scene, SceneSegment } from '../board/scene.ts';

export function buildScene(doc: DesignDoc, geometry: SceneCopper | null, placed: ReadonlyMap<string, { at: Vec2; pos: Vec2 }> | null = null, ground: Region[] = []): Scene {
  const byId = new Map<string, DesignNode>(doc.nodes.map((n) => [n.id, n]));
  // Where the layout placed a node (sized lengths move nodes off their drawn spots), plus how far the node was
  // dragged since that layout: a dragged node follows the pointer at once, before the worker's new layout lands.
  // Each node's place worked out once (a drag builds the scene every move): where the layout put it, unless the node
  // was dragged since, and which nodes were.
  const where = new Map<string, Vec2>();
  const movedIds = new Set<string>();
  for (const n of doc.nodes) {
    const p = placed?.get(n.id);
    if (!p) { where.set(n.id, n.at); continue; }
    const still = p.at.x === n.at.x && p.at.y === n.at.y;
    if (!still) movedIds.add(n.id);
    where.set(n.id, still ? p.pos : { x: p.pos.x + n.at.x - p.at.x, y: p.pos.y + n.at.y - p.at.y });
  }
  const moved = (n: DesignNode): boolean => movedIds.has(n.id);
  const at = (n: DesignNode): Vec2 => where.get(n.id) ?? n.at;
  const pieces = new Map((geometry?.outlines ?? []).map((p) => [p.id, p]));
  const segments: SceneSegment[] = [];
  const stale = new Set<string>();
  for (const s of doc.segments) {
    const a = byId.get(s.a), b = byId.get(s.b);
    if (!a || !b) continue;
    const piece = pieces.get(s.id);
    // A stale centreline of a piece whose end moved is dropped: the sketch line shows until the new layout arrives.
    const off = moved(a) || moved(b);
    if (off) { stale.add(s.id); stale.add(a.id); stale.add(b.id); }
    segments.push({ id: s.id, kind: s.kind, a: at(a), b: at(b), centreline: off ? undefined : piece?.centreline, ...(s.kind === 'lumped' ? { part: partOf(s) } : {}) });
  }
  return {
    nodes: doc.nodes.map((n) => ({ id: n.id, at: at(n), kind: n.kind, label: n.label, heading: n.kind === 'port' ? n.heading : undefined })),
    segments,
    pieces: stale.size ? (geometry?.outlines ?? []).filter((o) => !stale.has(o.id)) : geometry?.outlines ?? [],
    outline: doc.board?.outline ?? null,
    areas: doc.areas.map((a) => ({ id: a.id, kind: a.kind, polygon: a.polygon })),
    ground,
    drills: (geometry?.drills ?? []).map((d) => ({ at: d.at, diameter: d.diameter })),
  };
}

const PART_KIND: Record<string, QuantityKind> = { resistor: 'resistance', capacitor: 'capacitance', inductor: 'inductance' };

/** What the board draws for a lumped part: a body between its pads (the chip's size code) and its value. */
export function partOf(s: DesignSegment & { kind: 'lumped' }): NonNullable<SceneSegment['part']> {
  const fp = smdFootprint(s.size);
  const value = formatQuantity(s.value, PART_KIND[s.part]!, { digits: 3 });
  return { name: s.part, value, size: s.size, body: { along: Math.max(fp.pitch - fp.padAlong, fp.pitch * 0.4), across: fp.padAcross * 0.8 } };
}

/** Everything that has a position, for zoom to fit. */
export function scenePoints(doc: DesignDoc, geometry: SceneCopper | null): Vec2[] {
  const pts: Vec2[] = doc.nodes.map((n) => n.at);
  if (doc.board) pts.push(...doc.board.outline);
  for (const o of geometry?.outlines ?? []) for (const r of o.regions) pts.push(...r.outer);
  for (const a of doc.areas) pts.push(...a.polygon);
  return pts;
}
