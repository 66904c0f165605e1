/**
 * Placed positions and centrelines of a sized design. Sizing places the network already (it needs the positions
 * to close loops and name overlaps); this gives faces the placement alone, without the physics.
 */
import type { Vec2 } from '../geometry/types.ts';
import type { SizedDesign } from './types.ts';

export interface PlacedDesign {
  /** The port placement started from (its drawn position is kept). */
  anchor: string | null;
  nodes: { id: string; pos: Vec2; drawn: Vec2 }[];
  /** Per piece, its centreline a → b through corner points. */
  centrelines: { id: string; points: Vec2[] }[];
}

export function placeDesign(sized: SizedDesign): PlacedDesign {
  return {
    anchor: sized.anchor,
    nodes: sized.nodes.filter((n) => Number.isFinite(n.pos.x)).map((n) => ({ id: n.id, pos: n.pos, drawn: n.at })),
    centrelines: sized.pieces.filter((p) => sized.centrelines[p.id]).map((p) => ({ id: p.id, points: sized.centrelines[p.id]! })),
  };
}
