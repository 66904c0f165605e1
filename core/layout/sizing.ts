/**
 * Sizing: design document → sized pieces with compensations, node discontinuity data, and placed positions.
 *
 * Per piece (models cited where each is used below):
 * - width from its Z0 at f0 with dispersion (the line-model interface's strip family: exact synthesis for
 *   microstrip, core/line synthesizeLine), or as given;
 * - nominal length from its electrical length at f0 (l = θ λg/360, own εe(f0)), a physical length, or the drawn
 *   distance (through corner points);
 * - compensations at each end, reported per piece, applied where the model is verified:
 *     open end      Kirschning–Jansen–Koster 1981 Δl, applied (the copper ends Δl short);
 *     via to ground Goldfarb–Pucel 1991 L as an equivalent length Δl = arctan(ωL/Z0)/β, applied;
 *     miter/square  path measured through the corner point (common practice), amount 0;
 *     arc bend      straight copper shortened by R tan(θ/2) on each side, the arc's centreline counted instead, the
 *                   corner-to-corner span grown so the path keeps its electrical length;
 *     lumped pads   the line's own copper stops at the pad edge (the pad carries the rest of the path);
 *     launch pads   likewise at an edge launch;
 *     tee planes    Hammerstad 1981 reference-plane shifts at f0 (static line values): each arm's copper is drawn
 *                   that much longer, so its electrical length runs from plane to plane as asked (junctions
 *                   'modelled'); with 'ideal' junctions the shifts are only reported;
 *     width step    Garg–Bahl 1978 L/C, for the network only (no length change), each part within its fit range;
 *     cross, other  junctions with no model (four arms, or three not in a T): joined at the centre, reported.
 * Impossible requests become LayoutProblems naming pieces (or an InputError('impossible-layout') with `strict`).
 *
 * The steps live in sizing/, each a function of the shared context (sizing/context.ts), each testable alone:
 * topology (the design's own degree rule) → widths → nominal lengths → ends (one handler per node kind) → spans →
 * placement → board size. This file only runs them in order and assembles the SizedDesign.
 */
import type { DesignDoc } from '../design/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import { InputError } from '../util/errors.ts';
import type { SizedDesign, SizedNode, SmdFootprint } from './types.ts';
import { sizingContext, type SizeOptions, type SizingContext, type Work } from './sizing/context.ts';
import { buildTopology, type Adjacency } from './sizing/topology.ts';
import { sizeWidths } from './sizing/widths.ts';
import { sizeLengths } from './sizing/lengths.ts';
import { sizeEnds } from './sizing/ends/index.ts';
import { sizeSpans } from './sizing/spans.ts';
import { placeDesign } from './sizing/placement.ts';
import { checkBoardSize } from './sizing/board-size.ts';

export type { SizeOptions } from './sizing/context.ts';
export { mm } from './sizing/context.ts';
export { pieceBeta } from './sizing/spans.ts';
export { CLOSE_TOL } from './sizing/placement.ts';
export { BOARD_SIZE_LIMIT } from './sizing/board-size.ts';
export { DEFAULT_TAPER_RIPPLE_DB } from './sizing/lengths.ts';
export { MAX_CORNER_TURN } from './sizing/ends/index.ts';

export function sizeDesign(doc: DesignDoc, opts: SizeOptions = {}): SizedDesign {
  return sizeWithEnds(doc, opts, sizeEnds);
}

/** The ends step as a function of the context (sizeEnds, or the memoised one of incremental.ts). */
export type EndsStep = (ctx: SizingContext, adj: Adjacency, byId: Map<string, Work>) => SizedNode[];

/** sizeDesign with the ends step given: every other step is the same code. */
export function sizeWithEnds(doc: DesignDoc, opts: SizeOptions, ends: EndsStep): SizedDesign {
  const ctx = sizingContext(doc, opts);
  const adj = buildTopology(ctx);
  const works = sizeWidths(ctx);
  const byId = new Map<string, Work>(works.map((w) => [w.seg.id, w]));
  sizeLengths(ctx, works);
  const sizedNodes = ends(ctx, adj, byId);
  sizeSpans(ctx, works);
  const nodeOut = new Map(sizedNodes.map((n) => [n.id, n]));
  const anchor = placeDesign(ctx, works, byId, adj, nodeOut);
  const pieces = works.map((w) => w.piece);
  // First in the list: a board too large explains the other problems it causes (loops that miss by metres).
  checkBoardSize(doc, pieces, sizedNodes, (code, message, subjects) => ctx.problems.unshift({ code, message, subjects }));
  const centrelines: Record<string, Vec2[]> = {};
  for (const w of works) {
    const pa = nodeOut.get(w.seg.a)?.pos, pb = nodeOut.get(w.seg.b)?.pos;
    if (pa && pb && Number.isFinite(pa.x) && Number.isFinite(pb.x)) centrelines[w.seg.id] = [pa, pb];
  }
  if (opts.strict && ctx.problems.length) {
    const p = ctx.problems[0]!;
    throw new InputError('impossible-layout', p.subjects[0] ? `segments.${p.subjects[0]}` : 'design', 'a layout that can be realised', p.message);
  }
  const out: SizedDesign = { name: doc.name, f0: ctx.f0, junctions: ctx.junctions, band: ctx.band, pieces, nodes: sizedNodes, centrelines, anchor, problems: ctx.problems, warnings: ctx.warnings, doc };
  // Not enumerable: the options hold the cross-section tables (functions), and a sized design crosses postMessage
  // and JSON as plain data; the network reads the property directly.
  if (ctx.lineOpts) Object.defineProperty(out, 'lineOptions', { value: ctx.lineOpts, enumerable: false });
  // Likewise the line models, when a caller planted its own: paths and the network then ask the same ones.
  if (opts.models) Object.defineProperty(out, 'lineModels', { value: opts.models, enumerable: false });
  return out;
}

export type { SmdFootprint };
