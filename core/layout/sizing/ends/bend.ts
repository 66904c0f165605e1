/**
 * Bends at a vertex:
 * - miter/square: the path is measured through the corner point (common practice), amount 0; a mitered corner's cut
 *   (Douville–James 1978) needs straight run on both sides;
 * - arc: straight copper shortened by R tan(θ/2) on each side, the arc's centreline counted instead, so the
 *   corner-to-corner span grows and the path keeps its electrical length;
 * - a corner folding back past MAX_CORNER_TURN cannot be square or mitered (a problem).
 */
import type { BendStyle } from '../../../design/types.ts';
import { miterCut, MITER_CITATION } from '../../../discontinuity/douvilleJames1978Miter.ts';
import { arcBend, ARC_BEND_SOURCE } from '../../../discontinuity/curvedBend.ts';
import { InputError } from '../../../util/errors.ts';
import { warn } from '../../../util/warnings.ts';
import type { SizedNode } from '../../types.ts';
import { deg, mm, pushWarnings, type SizingContext, type Work } from '../context.ts';
import { comp } from './types.ts';

/** Largest turn a square or mitered corner may make (the miter fit's own limit), rad. */
export const MAX_CORNER_TURN = (135 * Math.PI) / 180;

export interface BendInput { node: string; style: BendStyle; turn: number; w1: Work; w2: Work; W1: number; W2: number; lineish: boolean }

export function bendAt(ctx: SizingContext, sn: SizedNode, b: BendInput): void {
  const { node, style, turn, w1, w2 } = b;
  const W = Math.min(b.W1, b.W2);
  const { h } = ctx.subs;
  if (style.style !== 'arc' && turn > MAX_CORNER_TURN) {
    ctx.problem('bad-topology', `${node} turns ${deg(turn)}°, more than ${deg(MAX_CORNER_TURN)}°: a corner that folds back this far cannot be ${style.style === 'square' ? 'drawn square' : 'mitered'}; use an arc bend or two bends`, [node, w1.seg.id, w2.seg.id]);
    return;
  }
  sn.bend = { style, turn, width: W };
  if (style.style === 'square' && b.lineish && ctx.f0 > 2e9 && h >= 0.8e-3 && Math.abs(turn - Math.PI / 2) < 0.2) {
    sn.warnings.push(warn('validity', `square ${deg(turn)}° bend at ${node} at ${(ctx.f0 / 1e9).toFixed(2)} GHz on a ${(h * 1e3).toFixed(2)} mm board: an unmitered corner reflects noticeably here (practice: flag above 2 GHz on boards of 0.8 mm and more); consider an optimal miter or an arc`, { subjects: [node], source: 'common practice' }));
  }
  if (!b.lineish) {
    if (turn > 1e-3) sn.warnings.push(warn('fabrication', `${node} turns ${deg(turn)}° next to a part; the part's pads are drawn along its own axis`, { subjects: [node], severity: 'info' }));
    return;
  }
  try {
    if (style.style === 'arc') arcCorner(sn, b, style.radius);
    else cornerThroughPoint(ctx, sn, b, W);
  } catch (err) {
    if (err instanceof InputError) { ctx.problem('bad-value', `bend at ${node}: ${err.message}`, [node, w1.seg.id, w2.seg.id]); delete sn.bend; }
    else throw err;
  }
}

function arcCorner(sn: SizedNode, b: BendInput, radius: number): void {
  const a = arcBend({ R: radius, W: Math.max(b.W1, b.W2), turnRad: b.turn });
  sn.bend!.arc = { radius, tangent: a.tangent, arcLength: a.arcLength };
  pushWarnings(sn.warnings, a.warnings, b.node);
  for (const w of [b.w1, b.w2]) {
    w.arcExtra += a.tangent - a.arcLength / 2;
    w.straightNeed += a.tangent;
    comp(w, { model: 'arc-bend', source: ARC_BEND_SOURCE, amount_m: a.tangent, applied: true, node: b.node,
      note: `straight copper ends R·tan(θ/2) = ${mm(a.tangent)} mm before the corner point; the arc's centreline (${mm(a.arcLength / 2)} mm on this side) counts instead, so the corner-to-corner span grows by ${mm(a.tangent - a.arcLength / 2)} mm and the path keeps its electrical length` });
  }
}

function cornerThroughPoint(ctx: SizingContext, sn: SizedNode, b: BendInput, W: number): void {
  const style = b.style;
  let intrusion = 0;
  if (style.style === 'miter' || style.style === 'miter-optimal') {
    const c = miterCut({ W, h: ctx.subs.h, er: ctx.subs.er, turnRad: b.turn, ...(style.style === 'miter' ? { fraction: style.fraction } : {}) });
    sn.bend!.miter = c;
    pushWarnings(sn.warnings, c.warnings, b.node);
    // How far back from the corner point the cut reaches along the outer edge.
    intrusion = Math.max(0, c.leg - (W / 2) * Math.tan(b.turn / 2));
  }
  for (const w of [b.w1, b.w2]) {
    w.straightNeed += intrusion;
    comp(w, { model: style.style === 'square' ? 'square-bend' : 'miter-bend', source: style.style === 'square' ? 'common practice' : MITER_CITATION, amount_m: 0, applied: true, node: b.node,
      note: style.style === 'square'
        ? 'unmitered bend: path measured through the corner point; an unmitered bend adds excess capacitance (no model applied)'
        : `${(sn.bend!.miter!.fraction * 100).toFixed(1)} % miter: path measured along the centreline through the corner point; keep equal bend counts on matched paths` });
  }
}
