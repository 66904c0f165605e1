/**
 * Sizing step 2, widths: each piece's line at f0 — from its Z0 by exact synthesis with dispersion (core/line
 * the strip family's widthFor through the line cache: exact synthesis for microstrip), or as given; a coupled pair's strips from the pair's geometry or modes
 * (coupledPair.ts). A width that cannot be had becomes a 'bad-value' problem naming the piece.
 */
import type { DesignSegment, WidthSpec } from '../../design/types.ts';
import type { LineAt } from '../../line/index.ts';
import { InputError, describe } from '../../util/errors.ts';
import { figures } from '../lineCache.ts';
import { plainShift } from '../as-made-shift.ts';
import { pairDrawingProblem, sizePair, SECOND_STRIP, type CoupledSegment } from '../coupledPair.ts';
import type { SizedPiece } from '../types.ts';
import { pairId, pushWarnings, type SizingContext, type Work } from './context.ts';

/** The line of a width spec at f0, or null (and a problem) when it cannot be had. */
export function resolveWidth(ctx: SizingContext, spec: WidthSpec, field: string, segId: string): LineAt | null {
  try {
    if (!spec || typeof spec !== 'object') throw new InputError('invalid-design', field, "a width given by 'z0' or 'width'", describe(spec));
    if (spec.by === 'z0') return ctx.cache.forZ0(spec.z0, ctx.f0);
    if (spec.by === 'width') return ctx.cache.forWidth(spec.width, ctx.f0);
    throw new InputError('bad-choice', `${field}.by`, "'z0' or 'width'", describe((spec as { by?: unknown }).by));
  } catch (e) {
    if (e instanceof InputError) { ctx.problem('bad-value', `piece ${segId}: ${e.message}`, [segId]); return null; }
    throw e;
  }
}

/**
 * A pair's geometry and mode figures at f0 (once per design segment; its strips share them), and the single line of
 * its strip width, which the end corrections (open ends, bends, pads) use.
 */
export function resolvePair(ctx: SizingContext, seg: CoupledSegment, field: string): LineAt | null {
  const id = pairId(seg.id);
  try {
    const drawing = pairDrawingProblem(seg, (n) => ctx.nodeById.get(n));
    if (drawing) { ctx.problem('bad-topology', drawing, [id]); return null; }
    let data = ctx.pairs.get(id);
    if (!data) {
      const r = sizePair(ctx.subs, seg, ctx.f0, field, ctx.models);
      data = r.data;
      ctx.pairs.set(id, data);
      pushWarnings(ctx.warnings, r.warnings, id);
    }
    return ctx.cache.forWidth(data.width, ctx.f0);
  } catch (e) {
    if (e instanceof InputError) { ctx.problem('bad-value', `piece ${id}: ${e.message}`, [id]); return null; }
    throw e;
  }
}

/** A fresh work record for a segment (nothing sized yet). */
export function newWork(seg: DesignSegment): Work {
  const piece: SizedPiece = {
    id: seg.id, kind: seg.kind, a: seg.a, b: seg.b, z0: NaN, width: NaN, nominalLength: 0, length: 0, span: 0, deg: 0, effectiveDeg: 0,
    line: null, compensations: [], warnings: [],
  };
  if (seg.label !== undefined) piece.label = seg.label;
  return { seg, piece, endA: null, endB: null, cut: 0, pads: 0, arcExtra: 0, straightNeed: 0, teeReserve: 0, ok: true };
}

/** Every piece's width and line at f0, in the order of `ctx.segments`. */
export function sizeWidths(ctx: SizingContext): Work[] {
  return ctx.segments.map((seg, k) => {
    const w = newWork(seg);
    if (!ctx.nodeById.has(seg.a) || !ctx.nodeById.has(seg.b) || seg.a === seg.b) { w.ok = false; return w; } // reported by topology
    sizeWidth(ctx, w, `segments[${ctx.segIndex[k]!}]`);
    return w;
  });
}

/** One piece's width: its line at each end (a taper has two), figures, as-made shift and pair data. */
export function sizeWidth(ctx: SizingContext, w: Work, field: string): void {
  const { seg, piece } = w;
  let ra: LineAt | null, rb: LineAt | null;
  if (seg.kind === 'taper') { ra = resolveWidth(ctx, seg.from, `${field}.from`, seg.id); rb = resolveWidth(ctx, seg.to, `${field}.to`, seg.id); }
  else if (seg.kind === 'coupled') { ra = rb = resolvePair(ctx, seg, field); }
  else { ra = rb = resolveWidth(ctx, seg.width, `${field}.width`, seg.id); }
  if (!ra || !rb) { w.ok = false; return; }
  w.endA = { node: seg.a, width: ra.width, r: ra };
  w.endB = { node: seg.b, width: rb.width, r: rb };
  piece.z0 = ra.z0; piece.width = ra.width;
  piece.line = figures(ra);
  if (ctx.lineOpts?.crossSection) piece.asMade = plainShift(ctx.cache.family, ctx.subs, ra, ctx.f0, ctx.opts.line, ctx.lineOpts.crossSection);
  if (seg.kind === 'taper') { piece.widthB = rb.width; piece.z0B = rb.z0; }
  if (seg.kind === 'coupled') {
    const data = ctx.pairs.get(pairId(seg.id))!;
    const strip: 1 | 2 = seg.id.endsWith(SECOND_STRIP) ? 2 : 1;
    piece.pair = { ...data, segment: pairId(seg.id), partner: strip === 1 ? seg.id + SECOND_STRIP : pairId(seg.id), strip };
    // The coupled run's phase is the modes' mean, not the single strip's (coupledPair.ts).
    const beta = (data.betaEven + data.betaOdd) / 2;
    piece.line = { ...piece.line, beta, lambdaG: (2 * Math.PI) / beta, epsEff: ((beta * 299_792_458) / (2 * Math.PI * ctx.f0)) ** 2 };
  }
  pushWarnings(piece.warnings, ra.warnings, seg.id);
  if (rb !== ra) pushWarnings(piece.warnings, rb.warnings, seg.id);
}
