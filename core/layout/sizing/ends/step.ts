/**
 * A width change where two lines meet: Garg–Bahl 1978 step L and C, for the network only (no length change), each
 * part within its fit range; at a bend (outside the in-line fits) or with ideal junctions it is reported, not swept.
 */
import { widthStep, STEP_CITATION } from '../../../discontinuity/gargBahl1978Step.ts';
import { stepResidual } from '../../../discontinuity/junctionResidual.ts';
import { warn } from '../../../util/warnings.ts';
import type { SizedNode } from '../../types.ts';
import { deg, pushWarnings, type End, type SizingContext, type Work } from '../context.ts';
import { comp } from './types.ts';

export function widthStepAt(ctx: SizingContext, node: string, sn: SizedNode, a: { w: Work; e: End }, b: { w: Work; e: End }, turn: number): void {
  const { h, er } = ctx.subs;
  const wide = a.e.width > b.e.width ? a : b;
  const nar = a.e.width > b.e.width ? b : a;
  const st = widthStep({ W1: wide.e.width, W2: nar.e.width, h, er, z1: wide.e.r.z0Static, z2: nar.e.r.z0Static, ee1: wide.e.r.epsEffStatic, ee2: nar.e.r.epsEffStatic });
  // The fits are for an in-line step; at a bend the corner dominates and no model is at hand.
  const inLine = turn < Math.PI / 180;
  const modelled = ctx.junctions === 'modelled' && inLine && (st.cValid || st.lValid);
  sn.step = { ...st, wide: wide.w.seg.id, narrow: nar.w.seg.id, modelled };
  pushWarnings(sn.warnings, st.warnings, node);
  const parts = [st.lValid ? `L ${(st.Ls * 1e12).toFixed(1)} pH` : '', st.cValid ? `C ${(st.Cs * 1e15).toFixed(1)} fF` : ''].filter(Boolean).join(' and ');
  const ratio = (wide.e.width / nar.e.width).toFixed(2);
  const validity = !inLine ? `a ${deg(turn)}° bend with a width change: outside the in-line step fits, not modelled`
    : st.cValid && st.lValid ? `W1/W2 = ${ratio}, εr ${er}: inside both fits`
    : `W1/W2 = ${ratio}, εr ${er}: ${parts ? `only ${parts} inside its fit` : 'outside both fits'}; the rest is left out`;
  const residual = stepResidual({ L1: st.lValid ? st.L1 : 0, L2: st.lValid ? st.L2 : 0, C: st.cValid ? st.Cs : 0, z1: wide.e.r.z0, z2: nar.e.r.z0, w: 2 * Math.PI * ctx.f0 });
  for (const [x, role] of [[wide, 'wide'], [nar, 'narrow']] as const) {
    comp(x.w, { model: 'width-step', source: STEP_CITATION, amount_m: 0, applied: modelled, node,
      note: modelled ? `width step: ${parts} in the sweep (Garg–Bahl fits); the step is not moved` : `width step: not in the sweep (${!inLine ? 'at a bend' : ctx.junctions === 'ideal' ? 'ideal junctions chosen' : 'outside the fits'})`,
      junction: { kind: 'step', role, modelled, inRange: inLine && st.cValid && st.lValid, validity, residual } });
  }
  if (!modelled && ctx.junctions === 'modelled') sn.warnings.push(warn('advisory-model', `step ${node}: not in the sweep (${validity})`, { source: 'garg-bahl-1978-step', subjects: [node], severity: 'info' }));
}
