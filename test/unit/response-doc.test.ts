/**
 * The response worker's copy of the design (renderer/src/worker/response-doc.ts): the page sends each revision as
 * the change from the one sent before, cloned as postMessage clones it (v8 serialize, the structured clone), and the
 * worker applies it to its own copy.
 *  - After random edit sequences (commands, live drags committed or cancelled, undo, redo) the worker's copy is
 *    deep-equal to the page's design at every revision, has the same revision key (core documentHash, which keeps
 *    each record's text, equal to designHash of a fresh copy), and keeps the identity of every record the revision
 *    left alone (what the core's sizing memo keys on).
 *  - The response the worker computes from its patched copy with its live pipeline (sizing each revision from the
 *    one before, element values kept across revisions, only the view's entries) equals a fresh sweep of the page's
 *    design (a new pipeline, full sizing, every entry) to 1e-12 in every computed S entry.
 * The reference is the project's own full sweep, itself checked against scikit-rf elsewhere
 * (test/reference/*network*, *sweep*); this test checks only that the shortcut changes nothing.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { deserialize, serialize } from 'node:v8';
import { History, InputError, corporateFeed, parseDesign, designSweepSettings, viewEntries, compileNetwork, netlistFromSized, sizeDesign, sweepNetwork, entryAt, designHash, documentHash, type DesignDoc, type NetworkResponse } from '../../core/index.ts';
import { DesignPipeline, revisionOf, sweepDesign } from '../../core/pipeline/index.ts';
import { DesignReplica, DesignSender, OUT_OF_STEP, type DesignPost } from '../../renderer/src/worker/response-doc.ts';
import { responseSeries } from '../../renderer/src/worker/response-job.ts';

const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : 20261205;

function load(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(__dirname, '../../assets/examples', name), 'utf8'));
  if (!r.ok) throw new Error(`${name} does not load`);
  return r.doc;
}

/** As postMessage sends it: a structured clone. */
const cloned = (p: DesignPost) => deserialize(serialize(p)) as DesignPost;

type Op = [kind: number, i: number, a: number, b: number];
const op = fc.tuple(fc.nat({ max: 9 }), fc.nat(), fc.double({ min: -0.004, max: 0.004, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }));

/** One edit of the page's history: a command, a live drag (committed or cancelled), an undo or a redo. */
function edit(h: History, [kind, i, a, b]: Op): void {
  const d = h.doc;
  const node = d.nodes[i % d.nodes.length];
  const seg = d.segments.length ? d.segments[i % d.segments.length] : undefined;
  const run = (id: string, args: unknown) => { try { h.apply(id, args); h.mark(); } catch (e) { if (!(e instanceof InputError)) throw e; } };
  switch (kind) {
    case 0: run('selection.translate', { ids: [node?.id ?? 'none'], by: { x: a, y: -a / 2 } }); break;
    case 1: run('segment.setSpec', { id: seg?.id ?? 'none', spec: i % 2 ? { width: { by: 'z0', z0: 30 + b * 60 } } : { length: { by: 'degrees', deg: 20 + b * 160 } } }); break;
    case 2: run('design.setSubstrate', { substrate: { er: 2 + b * 8 } }); break;
    case 3: run('node.add', { at: { x: a, y: b / 100 }, spec: { kind: 'open' } }); break;
    case 4: run('selection.delete', { ids: [(i % 2 ? seg?.id : node?.id) ?? 'none'] }); break;
    case 5: case 6: {
      // A drag: a few moves in live mode, then committed (or, now and then, cancelled).
      h.beginLive('Drag');
      for (let k = 1; k <= 3; k++) { try { h.apply('selection.translate', { ids: [node?.id ?? 'none'], by: { x: a / 3, y: 0 } }); } catch (e) { if (!(e instanceof InputError)) throw e; } }
      if (kind === 6 && i % 3 === 0) h.cancelLive(); else h.commitLive();
      break;
    }
    case 7: h.undo(); break;
    case 8: h.redo(); break;
    default: run('design.setInfo', { name: `edited ${i % 7}` });
  }
}

describe('the response worker\'s copy of the design', () => {
  const starts = [load('demo.json'), load('wilkinson-2g45.json'), corporateFeed({ outputs: 8, pitch: 12e-3 })];

  it('follows random edits, undo and redo: deep-equal to the page\'s design, same revision key, untouched records kept', () => {
    fc.assert(fc.property(fc.nat({ max: starts.length - 1 }), fc.array(op, { minLength: 1, maxLength: 30 }), (k, ops) => {
      const h = new History(starts[k]!);
      const sender = new DesignSender(), replica = new DesignReplica();
      let held = replica.receive(cloned(sender.post(h.doc)));
      let page = h.doc;
      for (const o of ops) {
        edit(h, o);
        const next = replica.receive(cloned(sender.post(h.doc)));
        expect(next).toEqual(h.doc);
        expect(revisionOf(next)).toBe(revisionOf(h.doc));
        // The revision key's hash keeps each record's text by the record: the same hash as written out whole.
        expect(documentHash(next)).toBe(designHash(structuredClone(h.doc)));
        // A record the page kept (the same object) is the same object in the worker's copy too.
        for (const list of ['nodes', 'segments'] as const) {
          const before = new Map(page[list].map((r, n) => [r, held[list][n]]));
          h.doc[list].forEach((r, n) => { if (before.has(r)) expect(next[list][n]).toBe(before.get(r)); });
        }
        held = next;
        page = h.doc;
      }
    }), { seed: SEED, numRuns: 60 });
  });

  it('refuses a change written against a revision it does not hold, and takes a whole design again after', () => {
    const a = starts[0]!, b = { ...a, name: 'b' };
    const sender = new DesignSender(), replica = new DesignReplica();
    sender.post(a); // never delivered
    const post = sender.post(b);
    expect(() => replica.receive(post)).toThrow(expect.objectContaining({ field: OUT_OF_STEP }));
    sender.reset();
    expect(replica.receive(cloned(sender.post(b)))).toEqual(b);
  });
});

/** |ΔS| of every entry `live` computed against the fresh sweep of all entries, relative to max(1, |S|). */
function largestDifference(live: NetworkResponse, fresh: NetworkResponse): number {
  const P = live.ports.length;
  let worst = 0, seen = 0;
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    if (live.computed && !live.computed[i * P + j]) continue;
    const a = entryAt(live, i, j), b = entryAt(fresh, i, j);
    for (let k = 0; k < live.freqs.length; k++) {
      const ra = live.s[a.base + k * a.stride]!, ia = live.s[a.base + k * a.stride + 1]!;
      const rb = fresh.s[b.base + k * b.stride]!, ib = fresh.s[b.base + k * b.stride + 1]!;
      worst = Math.max(worst, Math.hypot(ra - rb, ia - ib) / Math.max(1, Math.hypot(rb, ib)));
      seen++;
    }
  }
  expect(seen).toBeGreaterThan(0);
  return worst;
}

describe('the response of the patched design', () => {
  it('equals a fresh sweep of the page\'s design to 1e-12 over a drag with undo and redo', async () => {
    const h = new History(corporateFeed({ outputs: 16, pitch: 12e-3 }));
    const bends = h.doc.nodes.filter((n) => n.kind === 'vertex').map((n) => n.id);
    const live = new DesignPipeline({ live: true });
    const sender = new DesignSender(), replica = new DesignReplica();
    const step = async () => {
      const doc = replica.receive(cloned(sender.post(h.doc)));
      const freqs = { ...designSweepSettings(doc), points: 11 };
      const net = live.netlist(doc);
      const got = (await sweepDesign(live, doc, freqs, { entries: viewEntries(net, doc) })).response;
      const sized = sizeDesign(h.doc);
      const want = await sweepNetwork(compileNetwork(netlistFromSized(sized)), freqs);
      expect(got.freqs).toEqual(want.freqs);
      expect(largestDifference(got, want)).toBeLessThanOrEqual(1e-12);
      // The worker's job from its copy and pipeline: the same series as the job on a fresh pipeline.
      const job = await responseSeries({ doc, settings: freqs, figures: false }, () => {}, undefined, live);
      const fresh = await responseSeries({ doc: h.doc, settings: freqs, figures: false }, () => {}, undefined, new DesignPipeline());
      expect(job.traces.map((t) => [t.i, t.j])).toEqual(fresh.traces.map((t) => [t.i, t.j]));
      job.smith.forEach((s, n) => s.re.forEach((x, k) => expect(Math.abs(x - fresh.smith[n]!.re[k]!)).toBeLessThanOrEqual(1e-12)));
    };
    await step();
    h.beginLive('Drag');
    for (let k = 1; k <= 4; k++) {
      h.apply('selection.translate', { ids: [bends[k % bends.length]!], by: { x: 4e-5 * k, y: 0 } });
      await step();
    }
    h.commitLive();
    h.apply('segment.setSpec', { id: h.doc.segments[3]!.id, spec: { width: { by: 'z0', z0: 60 } } });
    h.mark();
    await step();
    h.undo(); await step();
    h.undo(); await step();
    h.redo(); await step();
  }, 120_000);
});
