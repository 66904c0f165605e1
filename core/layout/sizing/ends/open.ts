/**
 * Open ends: Kirschning–Jansen–Koster 1981 open-end extension Δl, applied (the copper ends Δl short of the
 * electrical length), with the end capacitance for the network.
 */
import { openEndExtension, openEndCapacitance, OPEN_END_SOURCE, OPEN_END_CITATION } from '../../../discontinuity/kirschningJansenKoster1981OpenEnd.ts';
import { endOf, isLine, mm, pushWarnings } from '../context.ts';
import { comp, type EndSite } from './types.ts';

export function openEnd({ ctx, node: n, sized: sn, segs }: EndSite<'open'>): void {
  const w = segs[0];
  if (!w || !isLine(w)) return;
  const e = endOf(w, n.id)!;
  const oe = openEndExtension({ u: e.width / ctx.subs.h, er: ctx.subs.er, eeStatic: e.r.epsEffStatic, h: ctx.subs.h });
  sn.open = { dl: oe.dl, capacitance: openEndCapacitance(oe.dl, e.r.epsEffStatic, e.r.z0Static) };
  pushWarnings(sn.warnings, oe.warnings, n.id);
  w.cut += oe.dl;
  comp(w, { model: 'open-end', source: OPEN_END_CITATION, amount_m: oe.dl, applied: true, node: n.id,
    note: `open-end extension Δl = ${mm(oe.dl)} mm (${OPEN_END_SOURCE}): the stub is drawn that much shorter than its electrical length` });
}
