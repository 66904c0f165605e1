/**
 * A response crosses from the worker to the page packed in one Float64Array (renderer/src/worker/response-post.ts).
 * Transport only: after a real structured clone (Node's v8 serialize/deserialize, the algorithm postMessage uses) the
 * page's response equals the job's own, value for value, checked with vitest's deep equality (toStrictEqual on plain
 * copies).
 */
import { describe, expect, it } from 'vitest';
import { deserialize, serialize } from 'node:v8';
import { corporateFeed, designSweepSettings } from '../../core/index.ts';
import { parseDesign } from '../../core/design/index.ts';
import { responseJob } from '../../renderer/src/worker/jobs.ts';
import { packResponse, unpackResponse, type ResponsePost } from '../../renderer/src/worker/response-post.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

const none = () => {};
const plain = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

describe('response transport', () => {
  it('the demo: every series, reflection and figure arrives as the job made it', async () => {
    const r = parseDesign(exampleText('demo')!);
    if (!r.ok) throw new Error('demo unreadable');
    const out = await responseJob({ doc: r.doc }, none);
    const got = unpackResponse(deserialize(serialize(packResponse(out))) as ResponsePost);
    expect(plain(got)).toStrictEqual(plain(out));
    // Bit for bit, not only as printed: the same doubles (phase unwrapping and group delay included).
    for (let k = 0; k < out.traces.length; k++) {
      expect(Float64Array.from(got.traces[k]!.delay)).toStrictEqual(Float64Array.from(out.traces[k]!.delay));
      expect(Float64Array.from(got.traces[k]!.phase)).toStrictEqual(Float64Array.from(out.traces[k]!.phase));
    }
    expect(got.smith.map((s) => s.i)).toStrictEqual(out.smith.map((s) => s.i));
  });

  it('the 64-output feed at 21 points: 129 traces and 65 reflections in one block', { timeout: 60_000 }, async () => {
    const doc = corporateFeed({ outputs: 64, pitch: 12e-3 });
    const out = await responseJob({ doc, settings: { ...designSweepSettings(doc), points: 21 } }, none);
    const post = packResponse(out);
    expect(post.traces.length).toBe(out.traces.length);
    expect(post.series.length).toBe(out.freqs.length * (3 * out.traces.length + 2 * out.smith.length));
    // One block copy instead of 104 000 numbers cloned one by one (the bytes are about the same: the saving is in
    // the clone's work and in the page making lists only of the series it draws).
    expect(post.series).toBeInstanceOf(Float64Array);
    const got = unpackResponse(deserialize(serialize(post)) as ResponsePost);
    expect(plain(got.traces.at(-1))).toStrictEqual(plain(out.traces.at(-1)));
    expect(plain(got.smith[5])).toStrictEqual(plain(out.smith[5]));
  });
});
