/**
 * A drag's translated copper drawn as "base outline moved by a shift" (core LiveOutline.shift, renderer
 * board/drift.ts, BoardController's moving layer) must land where the true copper is.
 * References: the project's own full layout of the same document (sizeDesign + pieceOutlines from scratch, itself
 * checked against published models in layout-sizing.test.ts and layout-skrf.test.ts), and the meaning of a translation
 * in SVG and CSS (W3C SVG 1.1 §7.6: translate(tx ty) is the matrix [1 0 0 1 tx ty]; CSS Transforms Level 1: translate()
 * moves by the given CSS pixels).
 */
import { describe, expect, it } from 'vitest';
import { corporateFeed, liveLayout, pieceOutlines, runCommand, sizeDesign, type DesignDoc, type LiveLayout, type Vec2 } from '../../core/index.ts';
import { commonShift, driftMm, less, movedBy, placeMark, translateText, DRIFT_EPS } from '../../renderer/src/board/drift.ts';
import { toScreen, type View } from '../../renderer/src/board/viewport.ts';

/** mulberry32, seeded, so a failure can be replayed. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => { a = (a + 0x6d2b79f5) >>> 0; let t = a; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296; };
}

/** A translation as SVG applies it (SVG 1.1 §7.6): the point times [1 0 0 1 tx ty]. */
const svgTranslate = (p: Vec2, t: { x: number; y: number }): Vec2 => ({ x: 1 * p.x + 0 * p.y + t.x, y: 0 * p.x + 1 * p.y + t.y });

describe('the live layout says how translated copper moved', () => {
  it('each translated outline is its base moved by its shift, to 1e-9 m of a fresh layout, over a random drag', () => {
    const rand = rng(12);
    let doc: DesignDoc = corporateFeed({ outputs: 16, pitch: 12e-3 });
    const bend = doc.nodes.find((n) => n.kind === 'vertex')!.id;
    const opts = {};
    let live: LiveLayout = liveLayout(null, doc, opts);
    let shiftedSeen = 0;
    for (let k = 0; k < 12; k++) {
      doc = runCommand(doc, 'selection.translate', { ids: [bend], by: { x: (rand() - 0.3) * 2e-4, y: (rand() - 0.5) * 1e-4 } });
      live = liveLayout(live, doc, opts);
      const fresh = new Map(pieceOutlines(sizeDesign(doc)).outlines.map((o) => [o.id, o]));
      const shifts = new Set<Vec2>();
      for (const o of live.outlines) {
        if (!o.shift) continue;
        shifts.add(o.shift.by);
        // The base is an outline as drawn afresh: never itself a translated one.
        expect((o.shift.base as { shift?: unknown }).shift).toBeUndefined();
        const f = fresh.get(o.id)!;
        o.shift.base.regions.forEach((r, i) => r.outer.forEach((p, j) => {
          // Drawn: the base's points in mm under translate(by in mm), back in metres.
          const drawn = svgTranslate({ x: p.x * 1000, y: p.y * 1000 }, driftMm(o.shift!.by)!);
          const want = f.regions[i]!.outer[j]!;
          expect(Math.abs(drawn.x / 1000 - want.x)).toBeLessThan(1e-9);
          expect(Math.abs(drawn.y / 1000 - want.y)).toBeLessThan(1e-9);
          // And the outline's own (translated) regions are the true copper too.
          expect(Math.abs(o.regions[i]!.outer[j]!.x - want.x)).toBeLessThan(1e-12);
        }));
      }
      shiftedSeen += live.outlines.filter((o) => o.shift).length;
      // Copper moved together shares one shift object, so a face moves it as one group.
      if (k > 0) expect(shifts.size).toBeLessThanOrEqual(1);
    }
    // The drag did translate copper (the check above is not empty).
    expect(shiftedSeen).toBeGreaterThan(100);
  });
});

describe('marks follow the drift', () => {
  const drift = { x: 0.25, y: -1.5 };
  it('a mark moved by the drift joins the group as written; a still one stays; anything else is written', () => {
    expect(placeMark([1.25, 0.5], [1, 2], false, drift)).toBe('drift');
    expect(placeMark([1, 2], [1, 2], false, drift)).toBe('stay');
    // In the group but no longer moving with it, or moved otherwise: written again, in the group less the drift.
    expect(placeMark([1, 2], [1, 2], true, drift)).toBe('write-drift');
    expect(placeMark([1.3, 0.5], [1, 2], false, drift)).toBe('write-drift');
    expect(placeMark([1.25, 0.5], [1, 2], true, null)).toBe('write'); // the drag ended: back to the board
    // Written in the group less the drift, a mark that then moves with the drift is left alone.
    const local = less([1.3, 0.5], drift), next = { x: drift.x + 0.1, y: drift.y - 0.2 };
    expect(placeMark([1.4, 0.3], local, true, next)).toBe('drift');
    expect(movedBy([1 + DRIFT_EPS / 2, 2], [1, 2], null)).toBe(true);
    expect(movedBy([1 + DRIFT_EPS * 2, 2], [1, 2], null)).toBe(false);
    expect(movedBy([1, 2, 3, 4], [1, 2], null)).toBe(false);
  });

  it('the drift is the shift most pieces share (by identity)', () => {
    const a = { x: 1e-4, y: 0 }, b = { x: 1e-4, y: 0 };
    expect(commonShift([{ by: a }, { by: b }, { by: b }, {}])).toBe(b);
    expect(commonShift([{}, {}])).toBeNull();
    expect(translateText({ x: 0.5, y: -2 })).toBe('translate(0.5 -2)');
  });

  it('the moving layer\'s CSS shift in pixels is the board drift seen through the view', () => {
    const rand = rng(3);
    for (let i = 0; i < 50; i++) {
      const v: View = { cx: (rand() - 0.5) * 0.1, cy: (rand() - 0.5) * 0.1, scale: 100 + rand() * 1e5, width: 800, height: 600 };
      const p = { x: (rand() - 0.5) * 0.2, y: (rand() - 0.5) * 0.2 }, t = { x: (rand() - 0.5) * 0.01, y: (rand() - 0.5) * 0.01 };
      // BoardController.placeMoving: translate(t.x·scale px, −t.y·scale px).
      const css = { x: t.x * v.scale, y: -t.y * v.scale };
      const moved = toScreen(v, { x: p.x + t.x, y: p.y + t.y }), at = toScreen(v, p);
      expect(Math.abs(at.x + css.x - moved.x)).toBeLessThan(1e-6);
      expect(Math.abs(at.y + css.y - moved.y)).toBeLessThan(1e-6);
    }
  });
});
