/**
 * What the laminate panel holds between visits of its tab: the measured lines picked so far, their lengths, the
 * strip width and the last result. Not part of the design (measurements are read, not kept); the result becomes
 * part of the design only when the user applies it.
 */
import { extractLaminate, InputError, type CouponResult, type DesignDoc } from '../../../core/index.ts';

export interface MeasuredLine { name: string; text: string; /** m; 0 = not entered yet */ length: number }

export class CouponSession {
  lines = $state<MeasuredLine[]>([]);
  /** Strip width of the coupon lines, m; 0 = not known yet. */
  width = $state(0);
  result = $state.raw<CouponResult | null>(null);
  error = $state<string | null>(null);

  /** Coupon lines already in the design (their labels start with "coupon"), shortest first. */
  static couponLines(doc: DesignDoc): { length: number; width: number }[] {
    const out: { length: number; width: number }[] = [];
    for (const s of doc.segments) {
      if (s.kind === 'line' && s.label?.startsWith('coupon line') && s.length.by === 'length' && s.width.by === 'width') out.push({ length: s.length.length, width: s.width.width });
    }
    return out.sort((a, b) => a.length - b.length);
  }

  /** Adds a picked file; its length and the width start from the design's coupon lines, in order, when there are any. */
  add(name: string, text: string, doc: DesignDoc): void {
    const known = CouponSession.couponLines(doc);
    const guess = known[this.lines.length];
    this.lines = [...this.lines, { name, text, length: guess?.length ?? 0 }];
    if (this.width === 0 && known[0]) this.width = known[0].width;
    this.result = null;
  }

  remove(i: number): void { this.lines = this.lines.filter((_, k) => k !== i); this.result = null; this.error = null; }
  setLength(i: number, length: number): void { this.lines = this.lines.map((l, k) => (k === i ? { ...l, length } : l)); this.result = null; }

  /** Runs the core's extraction with the design's laminate for h, copper and the first guess. */
  run(doc: DesignDoc): void {
    this.error = null;
    this.result = null;
    const sub = doc.substrate;
    if (this.lines.some((l) => !(l.length > 0))) { this.error = 'Enter the port-to-port length of every measured line.'; return; }
    if (!(this.width > 0)) { this.error = 'Enter the strip width of the coupon lines as made.'; return; }
    try {
      this.result = extractLaminate({
        lines: this.lines.map((l) => ({ name: l.name, text: l.text, length: l.length })),
        width: this.width, h: sub.h, t: sub.t, sigma: sub.sigma, roughness: sub.roughness,
        erGuess: sub.er, tanDeltaGuess: Math.max(sub.tanDelta, 1e-4),
      });
    } catch (err) {
      this.error = err instanceof InputError ? err.message : String((err as Error).message ?? err);
    }
  }
}

/** One session for the app (the panel is remade whenever its tab is shown). */
export const couponSession = new CouponSession();
