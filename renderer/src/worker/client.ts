/**
 * The editor's side of the compute worker: start a job, get progress callbacks and a promise of the result.
 * Falls back to running the same job function on the main thread where Workers are missing (component tests).
 */
import type { JobKind, WorkerMessage } from './protocol.ts';

export interface Progress { done: number; total: number; label: string }

export interface JobError { message: string; field?: string; expected?: string; got?: string }

export type JobOutcome<T> = { ok: true; value: T; ms: number } | { ok: false; error: JobError } | { ok: false; superseded: true };

type Runner = (kind: JobKind, input: unknown, progress: (p: Progress) => void, signal?: AbortSignal) => Promise<unknown>;

export class ComputeClient {
  private worker: Worker | null = null;
  private next = 1;
  /** The newest job id per lane (a lane is the job kind unless the caller names one). */
  private latest = new Map<string, number>();
  private pending = new Map<number, { resolve: (o: JobOutcome<unknown>) => void; progress?: (p: Progress) => void }>();

  /**
   * @param makeWorker creates the worker (the app passes Vite's `new Worker(new URL(...))`); null runs jobs inline
   * @param inline the job function for the inline fallback
   */
  constructor(makeWorker: (() => Worker) | null, private readonly inline: Runner) {
    if (makeWorker) {
      try {
        this.worker = makeWorker();
        this.worker.onmessage = (e: MessageEvent<WorkerMessage>) => this.receive(e.data);
        this.worker.onerror = (e) => this.failAll(e.message || 'the compute worker stopped');
      } catch {
        this.worker = null;
      }
    }
  }

  get threaded(): boolean { return this.worker !== null; }

  /**
   * Runs a job. A newer job in the same `lane` (by default its kind) makes an older one's result stale; callers with
   * two independent streams of one kind (the Outputs preview and a write) give them lanes of their own; a caller that
   * tells stale results apart itself (the live response, compute.svelte.ts) gives none (null).
   */
  run<T>(kind: JobKind, input: unknown, progress?: (p: Progress) => void, signal?: AbortSignal, lane: string | null = kind): Promise<JobOutcome<T>> {
    const id = this.next++;
    // A cancelled job stops at its next pause and answers with an AbortError.
    signal?.addEventListener('abort', () => { if (this.worker && this.pending.has(id)) this.worker.postMessage({ type: 'cancel', id }); }, { once: true });
    if (lane !== null) this.latest.set(lane, id);
    return new Promise<JobOutcome<T>>((resolve) => {
      const done = (o: JobOutcome<unknown>) => {
        // A newer job in the same lane makes this one stale.
        if (o.ok && lane !== null && this.latest.get(lane) !== id) resolve({ ok: false, superseded: true });
        else resolve(o as JobOutcome<T>);
      };
      if (this.worker) {
        this.pending.set(id, { resolve: done, progress });
        this.worker.postMessage({ type: 'job', id, kind, input });
        return;
      }
      const t0 = performance.now();
      this.inline(kind, input, (p) => progress?.(p), signal).then(
        (value) => done({ ok: true, value, ms: performance.now() - t0 }),
        (err: unknown) => done({ ok: false, error: toJobError(err) }),
      );
    });
  }

  destroy(): void {
    this.worker?.terminate();
    this.worker = null;
    this.failAll('the editor closed');
  }

  private receive(m: WorkerMessage): void {
    const p = this.pending.get(m.id);
    if (!p) return;
    if (m.type === 'progress') { p.progress?.({ done: m.done, total: m.total, label: m.label }); return; }
    this.pending.delete(m.id);
    if (m.type === 'result') p.resolve({ ok: true, value: m.value, ms: m.ms });
    else p.resolve({ ok: false, error: { message: m.message, field: m.field, expected: m.expected, got: m.got } });
  }

  private failAll(message: string): void {
    for (const [, p] of this.pending) p.resolve({ ok: false, error: { message } });
    this.pending.clear();
  }
}

export function toJobError(err: unknown): JobError {
  if (err instanceof Error && err.name === 'AbortError') return { message: err.message, field: 'cancelled' };
  if (err && typeof err === 'object' && 'field' in err && 'expected' in err) {
    const e = err as { message: string; field: string; expected: string; got: string };
    return { message: e.message, field: e.field, expected: e.expected, got: e.got };
  }
  return { message: err instanceof Error ? err.message : String(err) };
}
