/**
 * The live layout crosses from the worker to the page as changes against the result the page holds
 * (renderer/src/worker/layout-post.ts). Transport only: what the page rebuilds must be the worker's full result
 * (layoutJob, the core's sizing and copper) entry for entry, checked with vitest's own deep equality
 * (toStrictEqual, independent of the project's sameData) after a real structured clone (Node's v8
 * serialize/deserialize, the algorithm postMessage uses). Drags are of the 64-output corporate feed the frame
 * benchmark drags, and of the demo design.
 */
import { describe, expect, it } from 'vitest';
import { deserialize, serialize } from 'node:v8';
import { corporateFeed, type DesignDoc } from '../../core/index.ts';
import { parseDesign } from '../../core/design/index.ts';
import { layoutJob, layoutPostJob } from '../../renderer/src/worker/jobs.ts';
import { LayoutReceiver, LayoutSender, type LayoutPost } from '../../renderer/src/worker/layout-post.ts';
import { decodeList, encodeList, sameData } from '../../renderer/src/worker/layout-diff.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

const none = () => {};
const moved = (doc: DesignDoc, id: string, dx: number): DesignDoc =>
  ({ ...doc, nodes: doc.nodes.map((n) => (n.id === id ? { ...n, at: { x: n.at.x + dx, y: n.at.y } } : n)) });
const clone = (p: LayoutPost): LayoutPost => deserialize(serialize(p)) as LayoutPost;
const demo = () => { const r = parseDesign(exampleText('demo')!); if (!r.ok) throw new Error('demo unreadable'); return r.doc; };

describe('layout transport', () => {
  it('a drag of a bend of the 64-output feed: the page rebuilds each full result, from a small part of it', { timeout: 120_000 }, async () => {
    const doc = corporateFeed({ outputs: 64, pitch: 12e-3 });
    const bend = doc.nodes.find((n) => n.kind === 'vertex')!.id;
    const page = new LayoutReceiver();
    let prev: Awaited<ReturnType<typeof layoutJob>> | null = null;
    for (let k = 0; k < 4; k++) {
      const d = moved(doc, bend, k * 1e-4);
      const post = clone(await layoutPostJob({ doc: d, base: page.token }, none));
      const full = await layoutJob({ doc: d }, none);
      const got = page.decode(post);
      expect(got).toStrictEqual(full);
      if (k === 0) { expect(post.base).toBeNull(); prev = got; continue; }
      // A bend move re-sizes the two pieces at the bend: every other piece is sent as "the same as before" and the
      // page keeps its own object for it (keyed drawing and the figures cache see it unchanged).
      const same = post.pieces.filter((e) => typeof e === 'number').length;
      expect(same).toBeGreaterThan(full.sized.pieces.length - 10);
      const kept = got.sized.pieces.filter((p, i) => p === prev!.sized.pieces[i]).length;
      expect(kept).toBe(same);
      expect(serialize(post).length).toBeLessThan(serialize(full).length / 4);
      prev = got;
    }
  });

  it('a base the worker no longer holds, or none, brings the whole result', async () => {
    const doc = demo();
    const out = await layoutJob({ doc }, none);
    const sender = new LayoutSender(2);
    const first = sender.encode(out, undefined);
    expect(first.base).toBeNull();
    sender.encode(out, first.token);
    sender.encode(out, first.token); // the first token is now evicted (keep 2)
    const late = sender.encode(out, first.token);
    expect(late.base).toBeNull();
    expect(new LayoutReceiver().decode(clone(late))).toStrictEqual(out);
  });

  it('a post written against a result the page does not hold is refused, not misread', async () => {
    const doc = demo();
    const out = await layoutJob({ doc }, none);
    const sender = new LayoutSender();
    const a = sender.encode(out, undefined);
    const b = sender.encode(out, a.token);
    expect(() => new LayoutReceiver().decode(b)).toThrow(/written against .*, but the page holds none/);
  });

  it('lists: fields set and dropped, entries added, removed and reordered round-trip', () => {
    const base = [{ id: 'a', x: 1, note: 'kept' }, { id: 'b', x: 2, extra: true }, { id: 'c', x: 3 }];
    const next = [{ id: 'c', x: 3 }, { id: 'b', x: 5 }, { id: 'd', x: 4 }];
    const enc = encodeList(base, next, (t) => t.id);
    expect(enc[0]).toBe(2);
    expect(enc[1]).toEqual({ at: 1, set: { x: 5 }, drop: ['extra'] });
    expect(enc[2]).toEqual({ item: { id: 'd', x: 4 } });
    expect(decodeList(base, enc)).toStrictEqual(next);
    expect(sameData({ a: [1, { b: 'x' }] }, { a: [1, { b: 'x' }] })).toBe(true);
    expect(sameData({ a: [1, 2] }, { a: [1, 2, 3] })).toBe(false);
    expect(sameData({ a: 1 }, { b: 1 })).toBe(false);
    expect(sameData([1], { 0: 1 })).toBe(false);
  });
});
