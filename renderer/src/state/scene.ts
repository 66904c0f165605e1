/**
 * The board scene from the design (the sketch) and the core's geometry (true copper and centrelines), plus the
 * lookups the tools need. View data only: no physics is computed here.
 */
import type { DesignDoc, DesignNode } from '../../../core/design/types.ts';
import type { DrillHit, Vec2 } from '../../../core/geometry/types.ts';
import type { PieceOutline } from '../../../core/layout/geometry.ts';

export interface SceneCopper { outlines: PieceOutline[]; drills: DrillHit[] }
import type { Scene, SceneSegment } from '../board/scene.ts';

export function buildScene(doc: DesignDoc, geometry: SceneCopper | null, placed: ReadonlyMap<string, Vec2> | null = null): Scene {
  const byId = new Map<string, DesignNode>(doc.nodes.map((n) => [n.id, n]));
  // Where the layout placed a node (sized lengths move nodes off their drawn spots); the drawn spot until sized.
  const at = (n: DesignNode): Vec2 => placed?.get(n.id) ?? n.at;
  const pieces = new Map((geometry?.outlines ?? []).map((p) => [p.id, p]));
  const segments: SceneSegment[] = [];
  for (const s of doc.segments) {
    const a = byId.get(s.a), b = byId.get(s.b);
    if (!a || !b) continue;
    const piece = pieces.get(s.id);
    segments.push({ id: s.id, kind: s.kind, a: at(a), b: at(b), centreline: piece?.centreline });
  }
  return {
    nodes: doc.nodes.map((n) => ({ id: n.id, at: at(n), kind: n.kind, label: n.label, heading: n.kind === 'port' ? n.heading : undefined })),
    segments,
    pieces: geometry?.outlines ?? [],
    outline: doc.board?.outline ?? null,
    drills: (geometry?.drills ?? []).map((d) => ({ at: d.at, diameter: d.diameter })),
  };
}

/** Everything that has a position, for zoom to fit. */
export function scenePoints(doc: DesignDoc, geometry: SceneCopper | null): Vec2[] {
  const pts: Vec2[] = doc.nodes.map((n) => n.at);
  if (doc.board) pts.push(...doc.board.outline);
  for (const o of geometry?.outlines ?? []) for (const r of o.regions) pts.push(...r.outer);
  return pts;
}
