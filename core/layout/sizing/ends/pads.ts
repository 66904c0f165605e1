/**
 * Lines meeting a lumped part at a node: the part's pad carries that part of the path (terminal at the pad centre),
 * so the line copper stops at the pad's edge (common practice); the extent along the line's direction is the pad's
 * half-size projected on it.
 */
import { crossZ, dot } from '../../copper.ts';
import { dirFrom, isLine, mm } from '../context.ts';
import { comp, type EndSite } from './types.ts';

export function padEnds({ ctx, node: n, segs }: EndSite): void {
  for (const lw of segs.filter((w) => w.seg.kind === 'lumped')) {
    const fp = lw.piece.part!.footprint;
    const axis = dirFrom(ctx, n.id, lw.seg)!;
    const across = Math.max(fp.padAcross, lw.endA?.width ?? 0);
    for (const w of segs) {
      if (!isLine(w)) continue;
      const d = dirFrom(ctx, n.id, w.seg)!;
      const e = Math.abs(dot(d, axis)) * fp.padAlong / 2 + Math.abs(crossZ(d, axis)) * across / 2;
      w.pads += e;
      comp(w, { model: 'lumped-pad', source: 'common practice', amount_m: e, applied: true, node: n.id,
        note: `the ${fp.size} pad of ${lw.seg.id} (terminal at the pad centre) carries ${mm(e)} mm of this path; the line copper stops at the pad edge` });
    }
  }
}
