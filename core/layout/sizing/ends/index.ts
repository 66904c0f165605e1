/**
 * Sizing step 4, ends: one handler per node kind (port, open, short, vertex, junction), then the pads of lumped
 * parts at any node. Each adds its compensations to the pieces and its data to the sized node.
 */
import type { DesignNode } from '../../../design/types.ts';
import type { SizedNode } from '../../types.ts';
import { dirFrom, other, type SizingContext, type Work } from '../context.ts';
import type { Adjacency } from '../topology.ts';
import { junctionEnd } from './junction.ts';
import { openEnd } from './open.ts';
import { padEnds } from './pads.ts';
import { portEnd } from './port.ts';
import { shortEnd } from './short.ts';
import type { EndSite } from './types.ts';
import { vertexEnd } from './vertex.ts';

export { MAX_CORNER_TURN } from './bend.ts';

/** The sized nodes (positions still unknown), with every end handled. */
export function sizeEnds(ctx: SizingContext, adj: Adjacency, byId: Map<string, Work>): SizedNode[] {
  const sizedNodes: SizedNode[] = ctx.doc.nodes.map((n) => ({ id: n.id, kind: n.kind, at: n.at, pos: { x: NaN, y: NaN }, segments: adj.get(n.id)!.slice(), warnings: [] }));
  ctx.doc.nodes.forEach((n, i) => handleNode(ctx, n, sizedNodes[i]!, adj.get(n.id)!, byId));
  return sizedNodes;
}

/** One node: its pieces must all be sized and drawn with a direction; then its kind's handler and the pads. */
export function handleNode(ctx: SizingContext, n: DesignNode, sized: SizedNode, ids: string[], byId: Map<string, Work>): void {
  const segs = ids.map((id) => byId.get(id)!).filter((w) => w && w.ok);
  if (segs.length !== ids.length) return; // a piece here failed to size; its problem is reported
  for (const w of segs) if (!dirFrom(ctx, n.id, w.seg)) ctx.problem('bad-topology', `piece ${w.seg.id} is drawn with both ends at the same point, so its direction is unknown; move node ${other(w.seg, n.id)}`, [w.seg.id]);
  if (segs.some((w) => !dirFrom(ctx, n.id, w.seg))) return;
  const site = { ctx, node: n, sized, segs } as EndSite;
  switch (n.kind) {
    case 'port': portEnd(site as EndSite<'port'>); break;
    case 'open': openEnd(site as EndSite<'open'>); break;
    case 'short': shortEnd(site as EndSite<'short'>); break;
    case 'vertex': vertexEnd(site as EndSite<'vertex'>); break;
    case 'junction': junctionEnd(site as EndSite<'junction'>, byId); break;
  }
  padEnds(site);
}
