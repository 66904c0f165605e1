/**
 * One pass at a time in the response worker, and of the requests that arrive while one runs only the newest waits:
 * the page sends the newest revision while a pass runs (compute.svelte.ts follow), so the next pass starts the
 * moment the running one ends instead of after a round trip through the busy page. A request overtaken before it
 * started (a newer one came while it waited) is answered with an AbortError, which the page reads as a pass of a
 * stale revision, stopped.
 */
export class Turns {
  private turn: Promise<void> = Promise.resolve();
  private newest = 0;

  /** Runs `work` when every earlier request is done, unless a newer request came meanwhile or `signal` fired. */
  async run<T>(work: () => Promise<T>, signal?: AbortSignal): Promise<T> {
    const ticket = ++this.newest;
    const before = this.turn;
    let done!: () => void;
    this.turn = new Promise<void>((ok) => { done = ok; });
    try {
      await before;
      if (ticket !== this.newest || signal?.aborted) throw overtaken();
      return await work();
    } finally {
      done();
    }
  }
}

function overtaken(): Error {
  return Object.assign(new Error('a newer revision was asked for before this one was swept'), { name: 'AbortError' });
}
