/**
 * Shorted ends (vias to ground): Goldfarb–Pucel 1991 via inductance L, taken as an equivalent length of the line
 * Δl = arctan(ωL/Z0)/β and applied (the stub is drawn that much shorter).
 */
import { viaGround, viaEquivalentLength, VIA_CITATION } from '../../../discontinuity/goldfarbPucel1991Via.ts';
import { InputError } from '../../../util/errors.ts';
import { endOf, isLine, mm, pushWarnings } from '../context.ts';
import { comp, type EndSite } from './types.ts';

export function shortEnd({ ctx, node: n, sized: sn, segs }: EndSite<'short'>): void {
  const w = segs[0];
  if (!w || !isLine(w)) return;
  const e = endOf(w, n.id)!;
  try {
    const g = viaGround({ h: ctx.subs.h, drill: n.via.drill, count: n.via.count, f: ctx.f0, rho: 1 / ctx.subs.sigma, ...(n.via.plating !== undefined ? { plating: n.via.plating } : {}) });
    const beta = (2 * Math.PI) / e.r.lambdaG;
    const dl = viaEquivalentLength(g.X, e.r.z0, beta);
    sn.via = { ...n.via, L: g.L, R: g.R, X: g.X, dlEquivalent: dl };
    pushWarnings(sn.warnings, g.warnings, n.id);
    w.cut += dl;
    comp(w, { model: 'via', source: VIA_CITATION, amount_m: dl, applied: true, node: n.id,
      note: `via inductance ${(g.L * 1e12).toFixed(1)} pH (X = ${g.X.toFixed(2)} Ω at f0) looks like ${mm(dl)} mm more of this line (Δl = arctan(X/Z0)/β), so the stub is drawn that much shorter` });
  } catch (err) {
    if (err instanceof InputError) ctx.problem('bad-value', `via at ${n.id}: ${err.message}`, [n.id, w.seg.id]);
    else throw err;
  }
}
