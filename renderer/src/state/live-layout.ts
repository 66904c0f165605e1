/**
 * The layout while a bend (or any selection) is dragged: the core's live layout (core/layout/incremental.ts, which
 * re-sizes only the ends a move changed and moves the copper below it) run here on the main thread, so each
 * pointer move's copper is on the board before the next frame. A move costs a few milliseconds on the 64-output
 * feed, less than a round trip to the worker would queue behind its running job.
 *
 * What the drag leaves out: path and phase reports (the last settled ones stay on screen) and, as ever while live,
 * the board's union and the shop check. When the drag ends the worker lays out the settled design as usual
 * (Compute.request), and that result replaces this one.
 */
import { liveLayout, type LiveLayout, type LiveOutline, type PieceOutline, type SizeOptions } from '../../../core/index.ts';
import { regionsPath } from '../board/paths.ts';
import { lazy, nodeNotes, placedFrom, type FiguresCache, type LayoutView } from './layoutView.ts';

/** One options object for every drag: the core keeps its memo while the object is the same. */
const OPTIONS: SizeOptions = {};
/**
 * A live layout slower than this (ms) hands the next SKIP_AFTER_SLOW moves to the worker, so a design too large to
 * lay out within a few frames never freezes the page (the worker coalesces moves to the newest).
 */
export const LIVE_BUDGET_MS = 100;
const SKIP_AFTER_SLOW = 10;

export class LiveDragLayout {
  private last: LiveLayout | null = null;
  /** Moves still left to the worker after a slow live layout. */
  private skip = 0;
  /** Path text per outline object: an outline the move did not touch is the same object, and keeps its text. */
  private readonly text = new WeakMap<PieceOutline, string>();
  /** The view this made last: a drag's first move finds another one on screen (the worker's settled layout). */
  private lastView: LayoutView | null = null;

  constructor(private readonly figures: FiguresCache) {}

  /**
   * The layout view of `doc` at `revision`, or null when the core refuses the design as a whole (the worker then
   * says why) or after a slow one (LIVE_BUDGET_MS). `held` is the view on screen, whose path reports are kept.
   */
  view(doc: Parameters<typeof liveLayout>[1], revision: number, held: LayoutView | null): LayoutView | null {
    if (this.skip > 0) { this.skip--; return null; }
    const t0 = performance.now();
    try {
      this.last = liveLayout(this.last, doc, OPTIONS);
    } catch {
      this.last = null;
      return null;
    }
    // A drag's first move draws its translated copper afresh and becomes the base of the drag's later moves: what
    // the board shows now (the settled layout) is where its marks were written, so shifts start from here.
    if (held !== this.lastView) this.last = { ...this.last, outlines: this.last.outlines.map(unshifted) };
    const { doc: _doc, ...sized } = this.last.sized;
    // Translated copper goes to the board as the path text of its base and the shift (board/drift.ts).
    const outlines = this.last.outlines.map((o) => ({ ...o, d: this.pathOf(o.shift?.base ?? o), by: o.shift?.by }));
    const view: LayoutView = {
      revision, sized, outlines, drills: this.last.drills, paths: held?.paths ?? [], placed: placedFrom(sized),
      // Figures and notes are only read by a hover readout or a panel: made when first asked, not on every move.
      figures: lazy(() => this.figures.of(sized)), notes: lazy(() => nodeNotes(sized)), ms: performance.now() - t0,
    };
    // Only a layout that could reuse the last one counts: the first of all (or after a board-wide change) sizes
    // every piece with cold code, and says nothing about how long the moves after it take.
    if (view.ms > LIVE_BUDGET_MS && this.last.reused) this.skip = SKIP_AFTER_SLOW;
    this.lastView = view;
    return view;
  }

  /**
   * Lays `doc` out once while the page is idle, if no drag did yet: the first drag of a session then starts from a
   * kept sizing (and with the line models' tables made), instead of sizing every piece with cold code on its first move.
   */
  prime(doc: Parameters<typeof liveLayout>[1]): void {
    if (this.last || this.priming || typeof requestIdleCallback !== 'function') return;
    this.priming = true;
    requestIdleCallback(() => {
      this.priming = false;
      if (this.last) return;
      try { this.last = liveLayout(null, doc, OPTIONS); } catch { /* the worker says why; the drag then starts cold */ }
    }, { timeout: 3000 });
  }
  private priming = false;

  private pathOf(o: PieceOutline): string {
    let d = this.text.get(o);
    if (d === undefined) { d = regionsPath(o.regions); this.text.set(o, d); }
    return d;
  }
}

/** The outline without its shift: the base of later translations. */
function unshifted(o: LiveOutline): LiveOutline {
  return o.shift ? { id: o.id, regions: o.regions, centreline: o.centreline } : o;
}
