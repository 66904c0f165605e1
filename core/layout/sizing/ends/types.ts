/** What an end handler gets: the node, its sized record, and the sized pieces meeting there (all with a direction). */
import type { DesignNode } from '../../../design/types.ts';
import type { Compensation, SizedNode } from '../../types.ts';
import type { SizingContext, Work } from '../context.ts';

export interface EndSite<K extends DesignNode['kind'] = DesignNode['kind']> {
  ctx: SizingContext;
  node: Extract<DesignNode, { kind: K }>;
  sized: SizedNode;
  /** The pieces at the node, in the order they were listed (each sized, each with a drawn direction). */
  segs: Work[];
}

export function comp(w: Work, c: Compensation): void { w.piece.compensations.push(c); }
