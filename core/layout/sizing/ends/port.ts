/**
 * Port ends: the port's reference impedance and heading go on the sized node; a heading that disagrees with the
 * drawing by more than 5° is noted (the drawing is used). An edge launch's pad carries part of the path, so the
 * line copper starts at its inner edge (common practice).
 */
import { warn } from '../../../util/warnings.ts';
import { deg, dirFrom, isLine, mm } from '../context.ts';
import { comp, type EndSite } from './types.ts';

export function portEnd({ ctx, node: n, sized: sn, segs }: EndSite<'port'>): void {
  sn.port = { zRef: n.zRef, heading: n.heading, ...(n.launch ? { launch: n.launch } : {}) };
  const w = segs[0];
  if (w && Number.isFinite(n.heading)) {
    const d = dirFrom(ctx, n.id, w.seg)!;
    const drawn = Math.atan2(d.y, d.x);
    const off = Math.abs(Math.atan2(Math.sin(drawn - n.heading), Math.cos(drawn - n.heading)));
    if (off > (5 * Math.PI) / 180) sn.warnings.push(warn('note', `port ${n.id} says its line leaves at ${deg(n.heading)}°, but ${w.seg.id} is drawn leaving at ${deg(drawn)}°; the drawing is used`, { subjects: [n.id, w.seg.id], severity: 'info' }));
  }
  if (w && n.launch && isLine(w)) {
    w.pads += n.launch.padLength;
    comp(w, { model: 'launch-pad', source: 'common practice', amount_m: n.launch.padLength, applied: true, node: n.id,
      note: `the edge-launch pad (${mm(n.launch.padWidth)} × ${mm(n.launch.padLength)} mm) carries this part of the path; the line copper starts at its inner edge` });
  }
}
