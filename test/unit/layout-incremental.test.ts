/**
 * The live layout (core/layout/incremental.ts) against a full sizing of the same document: after every step of
 * random drags of bends (and of other nodes), and after a width change, the sized design must be the very one
 * sizeDesign gives, number for number to the bit (JSON text of both, with -0 and NaN told apart), and each piece's
 * copper must match pieceOutlines' to rounding (translated outlines) or exactly (redrawn ones).
 * The reference here is the project's own full sizing, itself checked against published models elsewhere
 * (layout-sizing.test.ts, layout-skrf.test.ts); this test checks only that the shortcut changes nothing.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { corporateFeed, liveLayout, liveSizing, parseDesign, pieceOutlines, runCommand, sizeDesign, LineCache, type DesignDoc, type LiveLayout, type LiveSizing } from '../../core/index.ts';

const EXAMPLES = join(__dirname, '../../assets/examples');

/** A text that differs whenever any number differs in any bit (JSON alone writes -0 as 0 and NaN as null). */
function exact(x: unknown): string {
  return JSON.stringify(x, (_k, v: unknown) => (typeof v === 'number' && (Object.is(v, -0) || !Number.isFinite(v)) ? `#${String(Object.is(v, -0) ? '-0' : v)}` : v));
}

/** A small seeded generator (mulberry32), so a failure can be replayed. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => { a = (a + 0x6d2b79f5) >>> 0; let t = a; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296; };
}

function examples(): [string, DesignDoc][] {
  const out: [string, DesignDoc][] = readdirSync(EXAMPLES).filter((f) => f.endsWith('.json')).map((f) => {
    const r = parseDesign(readFileSync(join(EXAMPLES, f), 'utf8'));
    if (!r.ok) throw new Error(`${f} does not load`);
    return [f, r.doc];
  });
  out.push(['corporate feed, 16 outputs', corporateFeed({ outputs: 16, pitch: 12e-3 })]);
  return out;
}

/** '' for equal texts, else both texts around where they first differ (a short failure message). */
function firstDifference(a: string, b: string): string {
  if (a === b) return '';
  let i = 0;
  while (i < a.length && a[i] === b[i]) i++;
  return `live …${a.slice(Math.max(0, i - 160), i + 80)}… | full …${b.slice(Math.max(0, i - 160), i + 80)}…`;
}

function expectSameAsFull(live: LiveLayout, doc: DesignDoc, opts: { cache: LineCache }): void {
  const full = sizeDesign(doc, opts);
  expect(firstDifference(exact({ ...live.sized, doc: null }), exact({ ...full, doc: null }))).toBe('');
  const want = pieceOutlines(full);
  expect(live.outlines.map((o) => o.id)).toEqual(want.outlines.map((o) => o.id));
  live.outlines.forEach((o, i) => {
    const w = want.outlines[i]!;
    expect(o.regions.length).toBe(w.regions.length);
    o.regions.forEach((r, k) => {
      const wr = w.regions[k]!;
      expect(r.outer.length).toBe(wr.outer.length);
      r.outer.forEach((p, j) => { expect(Math.abs(p.x - wr.outer[j]!.x)).toBeLessThan(1e-12); expect(Math.abs(p.y - wr.outer[j]!.y)).toBeLessThan(1e-12); });
    });
  });
  expect(live.drills.length).toBe(want.drills.length);
}

describe('live layout equals a full sizing', () => {
  for (const [name, start] of examples()) {
    it(`random drags of ${name}`, () => {
      const next = rng(name.length * 7919 + 17);
      const opts = { cache: new LineCache(start.substrate) };
      let doc = start;
      let live = liveLayout(null, doc, opts);
      expectSameAsFull(live, doc, opts);
      // The sizing alone (what a sweep of the dragged design may use), with options of its own and no line cache.
      const bare = {};
      let sizing: LiveSizing = liveSizing(null, doc, bare);
      const bends = doc.nodes.filter((n) => n.kind === 'vertex').map((n) => n.id);
      const movable = bends.length ? bends : doc.nodes.map((n) => n.id);
      let reused = 0;
      for (let drag = 0; drag < 3; drag++) {
        const id = movable[Math.floor(next() * movable.length)]!;
        for (let step = 0; step < 6; step++) {
          // Pointer steps of up to ±0.2 mm, as a drag makes them.
          doc = runCommand(doc, 'selection.translate', { ids: [id], by: { x: (next() - 0.5) * 4e-4, y: (next() - 0.5) * 4e-4 } });
          live = liveLayout(live, doc, opts);
          expectSameAsFull(live, doc, opts);
          sizing = liveSizing(sizing, doc, bare);
          expect(firstDifference(exact({ ...sizing.sized, doc: null }), exact({ ...sizeDesign(doc), doc: null }))).toBe('');
          reused += doc.nodes.length - live.redone.ends;
        }
      }
      // The point of it: most ends are replayed, not handled afresh.
      expect(reused).toBeGreaterThan(0);
    });
  }

  it('a width change reaches every piece it touches (and the copper below it)', () => {
    const start = corporateFeed({ outputs: 16, pitch: 12e-3 });
    const opts = { cache: new LineCache(start.substrate) };
    let live = liveLayout(null, start, opts);
    const seg = start.segments.find((s) => s.kind === 'line')!;
    const doc = runCommand(start, 'segment.setSpec', { id: seg.id, spec: { width: { by: 'z0', z0: 61 } } });
    live = liveLayout(live, doc, opts);
    expectSameAsFull(live, doc, opts);
    expect(live.sized.pieces.find((p) => p.id === seg.id)!.z0).not.toBe(sizeDesign(start, opts).pieces.find((p) => p.id === seg.id)!.z0);
  });

  it('a change of the board-wide figures drops the memo', () => {
    const start = corporateFeed({ outputs: 8, pitch: 12e-3 });
    const opts = { cache: new LineCache(start.substrate) };
    const live = liveLayout(null, start, opts);
    const doc = { ...start, frequency: { ...start.frequency, f0: start.frequency.f0 * 1.1 } };
    const again = liveLayout(live, doc, opts);
    expect(again.redone.ends).toBe(doc.nodes.length);
    expectSameAsFull(again, doc, opts);
  });
});
