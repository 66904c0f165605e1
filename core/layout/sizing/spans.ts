/**
 * Sizing step 5, spans: from the nominal length and the end corrections, the copper length (nominal − cuts − pads),
 * the corner-to-corner span (nominal − cuts + arc extras) and the phase in degrees. A drawn piece keeps its drawing:
 * its span is the drawn distance and its electrical length follows. A piece whose corrections take all of it, or
 * whose bends need more straight run than it spans, is a 'too-short' problem naming it and saying what to change.
 */
import type { SizedPiece } from '../types.ts';
import { mm, type SizingContext, type Work } from './context.ts';

/** β at f0 of a line or taper piece (taper: mean over its sections), rad/m. */
export function pieceBeta(p: SizedPiece): number {
  if (p.sections && p.sections.length) {
    let L = 0, ph = 0;
    for (const x of p.sections) { L += x.length; ph += x.beta * x.length; }
    return L > 0 ? ph / L : 0;
  }
  return p.line ? p.line.beta : 0;
}

export function sizeSpans(ctx: SizingContext, works: Work[]): void {
  for (const w of works) if (w.ok) sizeSpan(ctx, w);
}

export function sizeSpan(ctx: SizingContext, w: Work): void {
  const p = w.piece;
  if (w.seg.kind === 'lumped' || w.seg.kind === 'sparams') {
    p.length = 0; p.span = p.nominalLength; p.deg = 0; p.effectiveDeg = 0;
    return;
  }
  if ((w.seg.kind === 'line' || w.seg.kind === 'taper') && w.seg.length.by === 'drawn') {
    // A drawn piece keeps the drawing: its nodes stay where they were drawn, and the electrical length it realises
    // follows from its ends (an open end adds Δl, an arc path is shorter than the corner path).
    p.span = p.nominalLength;
    p.nominalLength = p.span + w.cut - w.arcExtra;
  }
  p.length = p.nominalLength - w.cut - w.pads;
  p.span = p.nominalLength - w.cut + w.arcExtra;
  const beta = pieceBeta(p);
  p.deg = (p.length * beta * 180) / Math.PI;
  p.effectiveDeg = (p.nominalLength * beta * 180) / Math.PI;
  if (!(p.length - w.teeReserve > 0)) {
    // A modelled tee keeps its static plane shift of line inside the junction (teeReserve), so that much must remain.
    const list = p.compensations.filter((c) => c.applied && c.amount_m !== 0).map((c) => `${c.model} ${mm(c.amount_m)} mm at ${c.node}`).join(', ');
    const tee = w.teeReserve > 0 ? `, and ${mm(w.teeReserve)} mm stays inside the tee as its reference plane at low frequency` : '';
    ctx.problem('too-short', `piece ${p.id} is ${mm(p.nominalLength)} mm long but its end corrections take ${mm(w.cut + w.pads + w.teeReserve)} mm (${list}${tee}); lengthen it (e.g. add 180° to a stub) or change its ends`, [p.id]);
  } else if (p.span - w.straightNeed < -1e-9) {
    ctx.problem('too-short', `piece ${p.id} spans ${mm(p.span)} mm but the bends at its ends need ${mm(w.straightNeed)} mm of straight run; lengthen it, use a smaller arc radius or a square bend`, [p.id]);
  }
}
