/** Vertex ends: two pieces meet; a width change there is a step (step.ts), a turn is a bend (bend.ts). */
import { dot, mul } from '../../copper.ts';
import { dirFrom, endOf, isLine, type Work } from '../context.ts';
import { bendAt } from './bend.ts';
import { widthStepAt } from './step.ts';
import type { EndSite } from './types.ts';

export function vertexEnd({ ctx, node: n, sized: sn, segs }: EndSite<'vertex'>): void {
  if (segs.length !== 2) return;
  const [w1, w2] = segs as [Work, Work];
  const d1 = mul(dirFrom(ctx, n.id, w1.seg)!, -1); // arriving along w1
  const d2 = dirFrom(ctx, n.id, w2.seg)!;          // leaving along w2
  const turn = Math.acos(Math.max(-1, Math.min(1, dot(d1, d2))));
  const lineish = isLine(w1) && isLine(w2);
  const e1 = endOf(w1, n.id)!, e2 = endOf(w2, n.id)!;
  const W1 = e1.width, W2 = e2.width;
  if (lineish && Math.abs(W1 - W2) > 1e-9 * Math.max(W1, W2)) widthStepAt(ctx, n.id, sn, { w: w1, e: e1 }, { w: w2, e: e2 }, turn);
  if (turn < 1e-6) return;
  bendAt(ctx, sn, { node: n.id, style: n.bend, turn, w1, w2, W1, W2, lineish });
}
