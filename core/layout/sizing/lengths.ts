/**
 * Sizing step 3, nominal lengths: from the electrical length at f0 (l = θ λg/360, the piece's own εe(f0)), a
 * physical length, or the drawn distance; a coupled run from its modes' mean phase; a taper's sections from its
 * impedance profile (linear in width, or Klopfenstein 1956); a part's pad pitch; an S-parameter block's length.
 */
import type { DesignSegment } from '../../design/types.ts';
import type { Vec2 } from '../../geometry/types.ts';
import type { LineAt } from '../../line/index.ts';
import { lengthForDegrees } from '../../line/index.ts';
import { InputError, describe } from '../../util/errors.ts';
import { lossDbPerM, type LineCache } from '../lineCache.ts';
import { klopfensteinProfile } from '../klopfenstein1956Taper.ts';
import { smdFootprint } from '../footprints.ts';
import { len, sub } from '../copper.ts';
import { pairLength } from '../coupledPair.ts';
import type { TaperSection } from '../types.ts';
import { at, type SizingContext, type Work } from './context.ts';

/** Klopfenstein default ripple when the design gives none: return loss 34 dB (|Γm| ≈ 0.02; Klopfenstein 1956, Proc. IRE 44(1), worked example, from memory). */
export const DEFAULT_TAPER_RIPPLE_DB = 34;

/** Every sized piece's nominal length; a length that cannot be had is a 'bad-value' problem and the piece stops here. */
export function sizeLengths(ctx: SizingContext, works: Work[]): void {
  const atNode = (id: string) => at(ctx, id);
  works.forEach((w, i) => {
    if (!w.ok) return;
    const { seg, piece } = w;
    const field = `segments[${ctx.segIndex[i]!}]`;
    try {
      if (seg.kind === 'line') piece.nominalLength = nominalLength(seg.length, w.endA!.r, seg, atNode, `${field}.length`);
      else if (seg.kind === 'coupled') piece.nominalLength = pairLength(seg, piece.line!.beta, field);
      else if (seg.kind === 'taper') sizeTaper(w, ctx.cache, ctx.f0, Math.max(ctx.band.stop, ctx.f0), atNode, field);
      else if (seg.kind === 'lumped') {
        const fp = smdFootprint(seg.size);
        piece.part = { part: seg.part, value: seg.value, footprint: fp };
        piece.nominalLength = fp.pitch;
      } else if (seg.kind === 'sparams') {
        piece.sparams = { name: seg.name, touchstone: seg.touchstone };
        piece.nominalLength = seg.length.length;
      }
    } catch (e) {
      if (e instanceof InputError) { ctx.problem('bad-value', `piece ${seg.id}: ${e.message}`, [seg.id]); w.ok = false; return; }
      throw e;
    }
  });
}

/** Length from degrees at f0 (the line's own λg), a given length, or the drawn distance between the nodes. */
export function nominalLength(spec: { by: string; deg?: number; length?: number }, r: LineAt, seg: DesignSegment, atNode: (id: string) => Vec2, field: string): number {
  switch (spec.by) {
    case 'degrees': return lengthForDegrees(r, spec.deg as number);
    case 'length': {
      const l = spec.length as number;
      if (typeof l !== 'number' || !(l > 0) || !Number.isFinite(l)) throw new InputError('out-of-range', `${field}.length`, 'a length above 0 m', describe(l));
      return l;
    }
    case 'drawn': return len(sub(atNode(seg.b), atNode(seg.a)));
    default: throw new InputError('bad-choice', `${field}.by`, "'degrees', 'length' or 'drawn'", describe(spec.by));
  }
}

/** Taper widths along its length (synthesised from the impedance profile) and its nominal length. */
export function sizeTaper(w: Work, cache: LineCache, f0: number, fTop: number, atNode: (id: string) => Vec2, field: string): void {
  const seg = w.seg as Extract<DesignSegment, { kind: 'taper' }>;
  const ra = w.endA!.r, rb = w.endB!.r;
  const widthAt = taperWidth(seg, ra, rb, cache, f0, field);
  const build = (n: number) => Array.from({ length: n }, (_, k) => { const wm = widthAt((k + 0.5) / n); return { width: wm, r: cache.forWidth(wm, f0) }; });
  let n = 24;
  let secs = build(n);
  const meanBeta = (s: typeof secs) => s.reduce((acc, x) => acc + (2 * Math.PI) / x.r.lambdaG, 0) / s.length;
  const spec = seg.length;
  let L = spec.by === 'degrees' ? ((spec.deg * Math.PI) / 180) / meanBeta(secs) : nominalLength(spec, ra, seg, atNode, `${field}.length`);
  // At least 20 sections per guided wavelength at the top of the band (common practice for sampling a continuous taper).
  const lgTop = Math.min(...[ra, rb].map((r) => cache.forWidth(r.width, fTop).lambdaG));
  const need = Math.ceil((20 * L) / lgTop);
  if (need > n) {
    n = Math.min(need, 400); secs = build(n);
    if (spec.by === 'degrees') L = ((spec.deg * Math.PI) / 180) / meanBeta(secs);
  }
  const sections: TaperSection[] = secs.map((s) => ({ width: s.width, length: L / n, z0: s.r.z0, beta: (2 * Math.PI) / s.r.lambdaG, lossDbPerM: lossDbPerM(s.r) }));
  w.piece.sections = sections;
  w.piece.taperWidths = Array.from({ length: n + 1 }, (_, k) => widthAt(k / n));
  w.piece.nominalLength = L;
}

/** Width at a fraction along a taper: linear in width, or synthesised from the Klopfenstein impedance profile. */
function taperWidth(seg: Extract<DesignSegment, { kind: 'taper' }>, ra: LineAt, rb: LineAt, cache: LineCache, f0: number, field: string): (frac: number) => number {
  if (seg.profile === 'linear') return (frac) => ra.width + (rb.width - ra.width) * frac;
  if (seg.profile !== 'klopfenstein') throw new InputError('bad-choice', `${field}.profile`, "'linear' or 'klopfenstein'", describe((seg as { profile?: unknown }).profile));
  const gm = 10 ** (-Math.abs(seg.rippleDb ?? DEFAULT_TAPER_RIPPLE_DB) / 20);
  const prof = klopfensteinProfile(ra.z0, rb.z0, gm);
  return (frac) => (frac <= 0 ? ra.width : frac >= 1 ? rb.width : cache.forZ0(prof.z(frac), f0).width);
}
