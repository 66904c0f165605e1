// Arguments the bridge's checks did not foresee (found by test/fuzz/bridge.fuzz.test.ts): a BigInt docId (the IPC
// structured clone carries BigInts) made the message builder throw, so the page got an exception instead of a
// result object. Every such value is refused with 'bad-request' in words.
import { describe, expect, it } from 'vitest';
import { guarded } from '../../electron/ipc.ts';

const ours = { senderFrame: { url: 'app://stripwright/index.html', parent: null } } as never;
const never = async () => { throw new Error('the handler must not run'); };

describe('hostile bridge arguments', () => {
  it('a BigInt docId is refused in words, not thrown', async () => {
    const r = await guarded('recovery:discard', never)(ours, { docId: 10n });
    expect(r).toEqual({ ok: false, error: { code: 'bad-request', message: expect.stringMatching(/docId: expected .* got a big integer/) } });
  });
  it('an argument whose field throws when read is refused, not thrown', async () => {
    const evil = Object.defineProperty({}, 'docId', { enumerable: true, get() { throw new Error('boom'); } });
    const r = await guarded('autosave:discard', never)(ours, evil);
    expect(r).toMatchObject({ ok: false, error: { code: 'bad-request' } });
    expect(JSON.stringify(r)).not.toMatch(/boom/);
  });
  it('a cyclic object as a save request is refused', async () => {
    const o: Record<string, unknown> = { path: '/x.stripwright', text: '{}', expectedModifiedMs: null };
    o.docId = o;
    const r = await guarded('design:save', never)(ours, o);
    expect(r).toMatchObject({ ok: false, error: { code: 'bad-request', message: expect.stringMatching(/docId: .* got an object/) } });
  });
});
