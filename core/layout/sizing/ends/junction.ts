/**
 * Junction ends: three uniform lines in a T get Hammerstad 1981 reference-plane shifts at f0 (junctions.ts sizeTee:
 * each arm drawn that much longer, applied with 'modelled' junctions, reported with 'ideal'); a cross, or three arms
 * one of which is a taper, has no model here and is joined at the centre (reported).
 */
import { sizeTee, noJunctionModel } from '../../junctions.ts';
import { dirFrom, endOf, isLine, pushWarnings, type Work } from '../context.ts';
import { comp, type EndSite } from './types.ts';

export function junctionEnd({ ctx, node: n, sized: sn, segs }: EndSite<'junction'>, byId: Map<string, Work>): void {
  const arms = segs.filter(isLine);
  if (segs.length === 3 && segs.every((w) => w.seg.kind === 'line')) {
    const r = sizeTee(n.id, segs.map((w) => ({ id: w.seg.id, dir: dirFrom(ctx, n.id, w.seg)!, end: endOf(w, n.id)!.r })), { h: ctx.subs.h, f0: ctx.f0, junctions: ctx.junctions });
    if (r.tee) sn.tee = r.tee;
    pushWarnings(sn.warnings, r.warnings, n.id);
    for (const a of r.arms) {
      const w = byId.get(a.id)!;
      comp(w, a.compensation);
      if (a.compensation.applied) { w.cut += a.compensation.amount_m; w.teeReserve += a.reserve; }
    }
  } else if (arms.length >= 3 || segs.length === 4) {
    const cross = segs.length === 4;
    const r = noJunctionModel(n.id, cross ? 'cross' : 'other', arms.map((w) => w.seg.id), cross ? undefined : 'a taper meets it (the tee model is for uniform lines)');
    if (cross) sn.cross = { arms: segs.map((w) => w.seg.id) };
    sn.warnings.push(r.warning);
    for (const w of arms) comp(w, { ...r.compensation });
  }
}
