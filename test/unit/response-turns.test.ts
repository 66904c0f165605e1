/**
 * The response worker's turns (renderer/src/worker/response-turns.ts): one pass at a time, and of the requests that
 * arrive while one runs only the newest is run; the others, and a request cancelled while it waits, are answered
 * with an AbortError (which the page reads as "cancelled": worker/client.ts toJobError).
 */
import { describe, expect, it } from 'vitest';
import { Turns } from '../../renderer/src/worker/response-turns.ts';
import { toJobError } from '../../renderer/src/worker/client.ts';

/** A pass that ends when told to, noting when it started and ended. */
function pass(name: string, log: string[]) {
  let end!: () => void;
  const ended = new Promise<void>((ok) => { end = ok; });
  return { end, work: async () => { log.push(`start ${name}`); await ended; log.push(`end ${name}`); return name; } };
}

const tick = () => new Promise((ok) => setTimeout(ok, 0));
const outcome = (p: Promise<string>) => p.then((v) => v, (e: unknown) => `${toJobError(e).field ?? 'error'}`);

describe('one response pass at a time', () => {
  it('runs the running pass to its end, drops the requests overtaken while waiting, then runs the newest', async () => {
    const turns = new Turns(), log: string[] = [];
    const a = pass('a', log), b = pass('b', log), c = pass('c', log);
    const ra = outcome(turns.run(a.work));
    await tick();
    const rb = outcome(turns.run(b.work));
    const rc = outcome(turns.run(c.work));
    await tick();
    expect(log).toEqual(['start a']); // b and c wait: one pass at a time
    a.end();
    expect(await ra).toBe('a');
    expect(await rb).toBe('cancelled'); // overtaken by c while it waited
    await tick();
    expect(log).toEqual(['start a', 'end a', 'start c']);
    c.end();
    expect(await rc).toBe('c');
    b.end();
    expect(log).not.toContain('start b');
  });

  it('of requests that arrive together, only the newest runs', async () => {
    const turns = new Turns(), log: string[] = [];
    const a = pass('a', log), b = pass('b', log);
    const ra = outcome(turns.run(a.work)), rb = outcome(turns.run(b.work));
    b.end();
    expect([await ra, await rb]).toEqual(['cancelled', 'b']);
    expect(log).toEqual(['start b', 'end b']);
  });

  it('a request cancelled while it waits never runs; the next one does', async () => {
    const turns = new Turns(), log: string[] = [];
    const a = pass('a', log), b = pass('b', log);
    const stop = new AbortController();
    const ra = outcome(turns.run(a.work, stop.signal));
    await tick();
    stop.abort(); // once running, a pass stops at its own next pause (the sweep's chunks), not here
    a.end();
    expect(await ra).toBe('a');
    const stopB = new AbortController();
    const rb = outcome(turns.run(b.work, stopB.signal));
    stopB.abort();
    expect(await rb).toBe('cancelled');
    expect(log).toEqual(['start a', 'end a']);
  });
});
