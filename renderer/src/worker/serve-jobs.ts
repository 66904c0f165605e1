/**
 * The message loop both workers speak (protocol.ts): a job request runs `run` and posts its progress, result or error;
 * a cancel stops the running job it names (between chunks, through its AbortSignal).
 */
import type { CancelRequest, JobRequest, WorkerMessage } from './protocol.ts';
import { toJobError, type Progress } from './client.ts';

/**
 * A job function. `begin` (optional to call) says the job's own work starts now: a job that first waits for its
 * turn (the response worker runs one pass at a time) reports the time of its work, not of its wait.
 */
export type JobRunner = (kind: JobRequest['kind'], input: unknown, progress: (p: Progress) => void, signal?: AbortSignal, begin?: () => void) => Promise<unknown>;

export function serveJobs(run: JobRunner): void {
  const post = (m: WorkerMessage) => (self as unknown as { postMessage(m: WorkerMessage): void }).postMessage(m);
  const running = new Map<number, AbortController>();
  self.onmessage = async (e: MessageEvent<JobRequest | CancelRequest>) => {
    if (e.data.type === 'cancel') { running.get(e.data.id)?.abort(); return; }
    const { id, kind, input } = e.data;
    let t0 = performance.now();
    const ctl = new AbortController();
    running.set(id, ctl);
    try {
      const value = await run(kind, input, (p) => post({ type: 'progress', id, ...p }), ctl.signal, () => { t0 = performance.now(); });
      post({ type: 'result', id, value, ms: performance.now() - t0 });
    } catch (err) {
      post({ type: 'error', id, ...toJobError(err) });
    } finally {
      running.delete(id);
    }
  };
}
