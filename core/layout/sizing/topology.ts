/**
 * Sizing step 1, topology: which pieces meet at each node, and whether each node has as many as its kind takes.
 * The degree rule is the design's own cross-check table (core/design/crossref.ts DEGREE), so sizing and loading
 * cannot disagree about what a finished network is; here each breach becomes a LayoutProblem naming the node and
 * its pieces, in words that say what to do.
 */
import { DEGREE } from '../../design/crossref.ts';
import type { DesignNode } from '../../design/types.ts';
import type { SizingContext } from './context.ts';

/** Pieces at each node, by node id (every node listed, possibly with none). */
export type Adjacency = Map<string, string[]>;

export function buildTopology(ctx: SizingContext): Adjacency {
  const adj: Adjacency = new Map();
  for (const n of ctx.doc.nodes) adj.set(n.id, []);
  for (const s of ctx.segments) {
    for (const end of [s.a, s.b]) {
      if (!ctx.nodeById.has(end)) { ctx.problem('bad-topology', `segment ${s.id} ends at node '${end}', which does not exist`, [s.id]); continue; }
      adj.get(end)!.push(s.id);
    }
    if (s.a === s.b) ctx.problem('bad-topology', `segment ${s.id} starts and ends at the same node ${s.a}`, [s.id, s.a]);
  }
  for (const n of ctx.doc.nodes) checkDegree(ctx, n, adj.get(n.id)!);
  return adj;
}

/** One node against the degree rule of its kind. */
export function checkDegree(ctx: SizingContext, n: DesignNode, segs: string[]): void {
  const k = segs.length;
  const rule = DEGREE[n.kind];
  if (k === 0) { ctx.problem('dangling-end', `node ${n.id} (${n.kind}) is not connected to any piece; delete it or connect it`, [n.id]); return; }
  if (k >= rule.min && k <= rule.max) return;
  const subjects = [n.id, ...segs];
  switch (n.kind) {
    case 'port': case 'open': case 'short':
      ctx.problem('bad-topology', `${n.kind} ${n.id} has ${k} pieces (${segs.join(', ')}); an end takes exactly one — put a junction there instead`, subjects);
      break;
    case 'vertex':
      if (k < rule.min) ctx.problem('dangling-end', `piece ${segs[0]} ends at vertex ${n.id} with nothing beyond it; end it with an open end, a short or a port`, subjects);
      else ctx.problem('bad-topology', `vertex ${n.id} joins ${k} pieces (${segs.join(', ')}); a vertex joins two — make it a junction`, subjects);
      break;
    case 'junction':
      if (k < rule.min) ctx.problem(k === 1 ? 'dangling-end' : 'bad-topology', `junction ${n.id} has ${k} piece(s) (${segs.join(', ')}); a tee needs three and a cross four${k === 2 ? ' — make it a vertex' : ''}`, subjects);
      else ctx.problem('bad-topology', `junction ${n.id} joins ${k} pieces; at most four (a cross) are modelled`, subjects);
      break;
  }
}
