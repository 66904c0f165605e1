/**
 * The block picker's side of its preview worker (worker/block-preview.worker.ts): the newest spec wins. A spec typed
 * while a preview runs waits for it (only the newest waiting one is kept), unless the running one has already taken
 * a while: then the worker is ended and a fresh one starts on the newest spec (a fold can run for seconds and cannot
 * stop half-way). A result for a spec that is no longer the newest is dropped. Without Workers (component tests) the
 * same job runs inline.
 */
import { ComputeClient, type JobError } from '../worker/client.ts';
import { blockPreviewJob, type BlockPreviewInput, type BlockPreviewOutput } from '../worker/block-preview-job.ts';

export type { BlockPreviewOutput } from '../worker/block-preview-job.ts';

/** What the picker shows: the newest finished preview or error, and whether a newer one is being made. */
export interface PreviewState { working: boolean; preview: BlockPreviewOutput | null; error: JobError | null }

/** A running preview older than this when a newer spec arrives is stopped (the worker restarted), ms. */
export const STALE_AFTER_MS = 400;

export class BlockPreviewer {
  private client: ComputeClient;
  /** The newest spec asked for, and the one running (by sequence number). */
  private wanted = 0;
  private running: { seq: number; since: number } | null = null;
  private waiting: { seq: number; input: BlockPreviewInput } | null = null;
  private closed = false;
  state: PreviewState = { working: false, preview: null, error: null };

  /**
   * @param makeWorker the preview worker; null runs the job inline (component tests)
   * @param staleAfterMs a running preview older than this when a newer spec arrives is stopped
   */
  constructor(private readonly onChange: (s: PreviewState) => void, private readonly makeWorker: (() => Worker) | null = blockWorker(), private readonly staleAfterMs = STALE_AFTER_MS) {
    this.client = this.newClient();
  }

  /** Asks for the preview of a spec; the answer arrives through `onChange`. */
  request(input: BlockPreviewInput): void {
    const seq = ++this.wanted;
    this.set({ working: true });
    if (!this.running) { this.start(seq, input); return; }
    if (this.client.threaded && performance.now() - this.running.since > this.staleAfterMs) {
      // Stop the stale pass: end the worker (its pending answer is ignored below) and start on the newest spec.
      this.client.destroy();
      this.client = this.newClient();
      this.running = null;
      this.start(seq, input);
      return;
    }
    this.waiting = { seq, input };
  }

  destroy(): void {
    this.closed = true;
    this.client.destroy();
  }

  private newClient(): ComputeClient {
    return new ComputeClient(this.makeWorker, (_kind, input) => blockPreviewJob(input as BlockPreviewInput));
  }

  private start(seq: number, input: BlockPreviewInput): void {
    const client = this.client;
    this.running = { seq, since: performance.now() };
    void client.run<BlockPreviewOutput>('block-preview', input).then((o) => {
      // An answer from a worker that was ended (a stale pass stopped) is not this preview's.
      if (this.closed || client !== this.client || this.running?.seq !== seq) return;
      this.running = null;
      const next = this.waiting;
      this.waiting = null;
      if (seq === this.wanted) {
        if (o.ok) this.set({ working: false, preview: o.value, error: null });
        else if ('error' in o) this.set({ working: false, preview: null, error: o.error });
      }
      if (next) this.start(next.seq, next.input);
    });
  }

  private set(s: Partial<PreviewState>): void {
    this.state = { ...this.state, ...s };
    this.onChange(this.state);
  }
}

function blockWorker(): (() => Worker) | null {
  if (typeof Worker === 'undefined') return null;
  return () => new Worker(new URL('../worker/block-preview.worker.ts', import.meta.url), { type: 'module' });
}
