/**
 * Runs the long work (sizing and geometry on every edit, response sweeps on demand) in the compute worker and
 * puts the results on the editor. Requests made while a job runs coalesce: at most one job waits, always for the
 * newest revision, so fast typing or a drag never piles up stale work and the canvas never waits for it.
 */
import { untrack } from 'svelte';
import type { MeasuredFile } from '../../../core/index.ts';
import type { CompareOutput } from '../worker/measured-job.ts';
import { ComputeClient, type JobOutcome, type Progress } from '../worker/client.ts';
import { unpackResponse, type ResponsePost } from '../worker/response-post.ts';
import { DesignSender, OUT_OF_STEP } from '../worker/response-doc.ts';
import type { JobKind } from '../worker/protocol.ts';
import { runJob } from '../worker/jobs.ts';
import { designSweepSettings } from '../../../core/index.ts';
import type { EditorState } from './editor.svelte.ts';
import { FiguresCache, nodeNotes, placedFrom, type LayoutView } from './layoutView.ts';
import { LayoutReceiver, type LayoutPost } from '../worker/layout-post.ts';
import { LiveDragLayout } from './live-layout.ts';
import type { CheckOutput, ExportInput, ExportOutput, LayoutOutput, MillingInput, MillingOutput, ResponseInput, ResponseOutput, YieldOutput } from '../worker/jobs.ts';
import type { SectionOutput } from '../worker/section-job.ts';
import type { SectionSpec } from '../../../core/index.ts';
import type { OverlayTrace } from './response-view.ts';

/** Points of the quick first pass of a response (enough for the shape of a band; the full sweep follows). */
export const COARSE_POINTS = 21;
/**
 * A live full sweep whose design last took longer than this (ms) is stopped when a newer revision arrives (the
 * newest edit must not wait seconds behind a stale one; its coarse pass still shows the drag); a quicker one
 * finishes, so a drag keeps showing full responses instead of cancelling each one before it ends.
 */
export const LIVE_SWEEP_BUDGET_MS = 400;
/**
 * A design whose last full sweep took at most this (ms) is swept live without the coarse pass first. Measured on
 * the 64-output feed (bench/pipeline.bench.ts, Node): the coarse pass sizes the revision and builds its network,
 * which the full pass then reuses, yet coarse then full took 90 ms against 74 ms for the full pass alone, and a
 * drag then spends a pass on a coarse response before every full one. So the coarse pass goes first only where a full pass is as
 * slow as one that is stopped when stale (LIVE_SWEEP_BUDGET_MS): there something must move on screen meanwhile.
 */
export const DIRECT_FULL_MS = LIVE_SWEEP_BUDGET_MS;

export class Compute {
  private readonly client: ComputeClient;
  private running = false;
  private queued = false;
  busy = $state<string | null>(null);
  response = $state.raw<ResponseOutput | null>(null);
  responseError = $state<string | null>(null);
  responseProgress = $state.raw<Progress | null>(null);
  /** The revision the shown response was swept from, and whether the last sweep was cancelled. */
  responseRevision = $state<number | null>(null);
  responseCancelled = $state(false);
  /** The shown response is the quick first pass (COARSE_POINTS) while the full sweep still runs. */
  responseCoarse = $state(false);
  /** Extra traces other parts of the app draw on the response plots (state/response-view.ts). */
  overlays = $state.raw<OverlayTrace[]>([]);
  private sweepStop: AbortController | null = null;
  lastLayoutMs = $state(0);

  /** Sweeps run in a worker of their own, so the copper of each edit never waits behind a sweep. */
  private readonly sweeper: ComputeClient;
  /** The live sweep loop is running (follow), and how long the design's last full sweep took (ms). */
  private following = false;
  private lastFullMs = 0;

  /**
   * @param makeWorker the compute worker (layout and the rest); null runs every job inline (component tests)
   * @param makeResponseWorker the response worker (worker/response.worker.ts); by default one when `makeWorker` is given
   */
  constructor(private readonly editor: EditorState, makeWorker: (() => Worker) | null = defaultWorker(), makeResponseWorker: (() => Worker) | null = makeWorker ? responseWorker() : null) {
    this.client = new ComputeClient(makeWorker, runJob);
    this.sweeper = new ComputeClient(makeResponseWorker, runJob);
  }

  get threaded(): boolean { return this.client.threaded; }
  /** Runs any worker job (the equalize button and the tune panel use it). */
  run<T>(kind: JobKind, input: unknown, progress?: (p: Progress) => void, signal?: AbortSignal) { return this.client.run<T>(kind, input, progress, signal); }

  /** Ask for the layout of the current revision (while a drag is live: laid out here at once, live-layout.ts). */
  request(): void {
    if (this.editor.dragging && this.liveDrag()) return;
    if (this.running) { this.queued = true; return; }
    void this.layout();
  }

  /** The layout result the page holds, which the worker's next result is written against. */
  private readonly received = new LayoutReceiver();
  /** Each piece's figures, kept while the worker sends the same piece again. */
  private readonly figures = new FiguresCache();

  private async layout(): Promise<void> {
    this.running = true;
    const revision = this.editor.revision;
    const doc = this.editor.doc;
    const t = setTimeout(() => { this.busy = 'sizing…'; }, 150);
    // Only what changed since the result the page holds crosses from the worker (worker/layout-post.ts).
    const post = await this.client.run<LayoutPost>('layout', { doc, sensitivities: this.editor.showSensitivity, base: this.received.token });
    clearTimeout(t);
    this.busy = null;
    this.running = false;
    let value: LayoutOutput | null = null;
    if (post.ok) {
      try { value = this.received.decode(post.value); } catch {
        // Out of step with the worker (never expected): ask again for the whole result.
        this.received.reset();
        this.queued = true;
      }
    }
    if (post.ok && value) {
      const v: LayoutView = { revision, sized: value.sized, outlines: value.outlines, drills: value.drills, paths: value.paths, placed: placedFrom(value.sized), figures: this.figures.of(value.sized), notes: nodeNotes(value.sized), ms: post.ms };
      this.editor.applyLayout(v, value.geometryError);
      this.lastLayoutMs = post.ms;
      this.drag.prime(doc);
    } else if (!post.ok && 'error' in post) {
      this.editor.layoutFailed(post.error.message);
    }
    if (this.queued) { this.queued = false; void this.layout(); }
  }

  /** The drag's layouts, made on this thread (state/live-layout.ts). */
  private readonly drag = new LiveDragLayout(this.figures);

  private liveDrag(): boolean {
    // Untracked: the caller is an effect, and the layout it sets must not make it run again.
    return untrack(() => {
      const v = this.drag.view(this.editor.doc, this.editor.revision, this.editor.layout);
      if (v) this.editor.applyLayout(v, null);
      return v !== null;
    });
  }

  /** What the response worker holds of the design: each revision goes to it as a change (worker/response-doc.ts). */
  private readonly sent = new DesignSender();

  /** A response job on the sweeper, its series sent packed (worker/response-post.ts) and unpacked here. */
  private async respond(input: ResponseInput, progress: (p: Progress) => void, signal: AbortSignal): Promise<JobOutcome<ResponseOutput>> {
    const ask = () => {
      if (!this.sweeper.threaded) return input;
      const { doc, ...rest } = input;
      return { ...rest, design: this.sent.post(doc) };
    };
    // No lane: the live loop sends the next revision while a pass runs, and tells stale results apart itself.
    let out = await this.sweeper.run<ResponsePost>('response', ask(), progress, signal, null);
    // The worker lost step with the page's posts (never expected): once more with the whole design.
    if (!out.ok && 'error' in out && out.error.field === OUT_OF_STEP) { this.sent.reset(); out = await this.sweeper.run<ResponsePost>('response', ask(), progress, signal, null); }
    return out.ok ? { ok: true, value: unpackResponse(out.value), ms: out.ms } : out;
  }

  /**
   * Sweep the design at its own settings (or `input.settings`) and keep the response for the plots. A newer sweep
   * cancels the one it supersedes (its worker job stops at its next chunk), so edits never queue stale sweeps.
   */
  async sweep(input: Omit<ResponseInput, 'doc'> = {}): Promise<void> {
    this.following = false;
    this.sweepStop?.abort();
    const stop = new AbortController();
    this.sweepStop = stop;
    this.responseError = null;
    this.responseCancelled = false;
    this.responseProgress = { done: 0, total: 1, label: 'starting' };
    const revision = this.editor.revision;
    const doc = this.editor.doc;
    const settings = input.settings ?? designSweepSettings(doc);
    const onProgress = (p: Progress) => { if (this.sweepStop === stop) this.responseProgress = p; };
    // A coarse pass first, so the plots follow an edit at once; the full sweep replaces it when it is done.
    if (settings.points > COARSE_POINTS) {
      const coarse = await this.respond({ ...input, doc, settings: { ...settings, points: COARSE_POINTS } }, onProgress, stop.signal);
      if (this.sweepStop !== stop) return;
      if (coarse.ok) { this.responseCoarse = true; this.response = coarse.value; this.responseRevision = revision; }
      // A failed coarse pass says nothing the full sweep will not say again: go on to it.
    }
    const out = await this.respond({ ...input, doc, settings }, onProgress, stop.signal);
    if (this.sweepStop !== stop) return; // a newer sweep took over
    this.sweepStop = null;
    this.responseProgress = null;
    this.responseCoarse = false;
    if (out.ok) { this.response = out.value; this.responseRevision = revision; }
    else if ('error' in out) {
      if (out.error.field === 'cancelled') this.responseCancelled = true;
      else this.responseError = out.error.message;
    }
  }

  /**
   * Keeps the response up with the design while it is edited (the Response panel calls this on every revision).
   * One live sweep at a time; the newest revision made meanwhile is sent to the response worker at once and waits
   * there (older waiting ones are dropped), so the next pass starts the moment the running one ends. During a drag
   * the running pass of a stale revision finishes (stopping it at every pointer move would show nothing until the
   * drag ends); an edit made outside a drag (the drag's last move included: the pointer is up) and any revision of
   * a design whose full sweep is long (LIVE_SWEEP_BUDGET_MS) stop the stale pass between frequency chunks instead.
   * A design whose full sweep is slow gets a coarse pass first (DIRECT_FULL_MS). Numbers are those of `sweep()`.
   */
  follow(): void {
    if (!this.following) { void this.followLoop(); return; }
    if (this.livePassRevision === this.editor.revision) return; // the figure table asked for: the loop sees to it
    // Only a full pass is stopped: the coarse pass is short, and drawing it keeps the plots moving during a drag.
    if (this.livePassFull && (this.lastFullMs > LIVE_SWEEP_BUDGET_MS || !this.editor.dragging)) this.livePass?.abort();
    this.sendAhead();
  }

  /**
   * The figure table is on screen: live passes work it out too. Otherwise they leave it out (a quarter of a pass of
   * the 64-output feed), and showing the table asks for it (showFigures).
   */
  private figuresShown = false;

  /** The Response panel shows (or hides) the figure table; a shown table of a response without figures is worked out (the sweep itself comes from the worker's cache). */
  showFigures(on: boolean): void {
    this.figuresShown = on;
    if (on && this.response && this.response.figures === null) this.follow();
  }

  private livePass: AbortController | null = null;
  private livePassFull = false;
  private livePassRevision: number | null = null;
  /** The newest revision's full pass, sent while another pass runs (follow); the loop takes it up next. */
  private ahead: { revision: number; out: Promise<JobOutcome<ResponseOutput>>; pass: AbortController } | null = null;
  private liveProgress: (p: Progress) => void = () => {};

  /** The full settings of `doc` when its live sweep goes without a coarse pass (null: with one). */
  private directSettings(doc: typeof this.editor.doc) {
    const settings = designSweepSettings(doc);
    return settings.points > COARSE_POINTS && !(this.lastFullMs > 0 && this.lastFullMs <= DIRECT_FULL_MS) ? null : settings;
  }

  /** Sends the newest revision's full pass to wait in the response worker behind the running one. */
  private sendAhead(): void {
    const revision = this.editor.revision, doc = this.editor.doc;
    if (!this.sweeper.threaded || this.ahead?.revision === revision) return;
    const settings = this.directSettings(doc);
    if (!settings) return;
    this.ahead?.pass.abort();
    const pass = new AbortController();
    this.ahead = { revision, pass, out: this.respond({ doc, settings, figures: this.figuresShown }, (p) => this.liveProgress(p), pass.signal) };
  }

  private async followLoop(): Promise<void> {
    this.sweepStop?.abort();
    this.following = true;
    const stop = new AbortController();
    this.sweepStop = stop;
    this.responseCancelled = false;
    const onProgress = (p: Progress) => { if (this.sweepStop === stop) this.responseProgress = p; };
    this.liveProgress = onProgress;
    // Cancel (or an explicit sweep) stops the loop; a newer revision stops only a long pass (follow).
    const cancel = () => { this.livePass?.abort(); this.ahead?.pass.abort(); };
    stop.signal.addEventListener('abort', cancel);
    let retried = false;
    try {
      for (;;) {
        const revision = this.editor.revision;
        const doc = this.editor.doc;
        const settings = designSweepSettings(doc);
        this.responseProgress = { done: 0, total: 1, label: 'starting' };
        // A coarse pass first only where the full one is slow: a quick full pass is shown sooner alone.
        const coarseFirst = this.directSettings(doc) === null;
        const passes = coarseFirst ? [{ ...settings, points: COARSE_POINTS }, settings] : [settings];
        for (const s of passes) {
          // The pass sent ahead for this very revision is already waiting in the worker (or running).
          const sent = s === settings && this.ahead?.revision === revision ? this.ahead : null;
          if (this.ahead && this.ahead !== sent) this.ahead.pass.abort();
          this.ahead = null;
          const pass = sent?.pass ?? new AbortController();
          this.livePass = pass;
          this.livePassFull = s === settings;
          this.livePassRevision = revision;
          const out = await (sent?.out ?? this.respond({ doc, settings: s, figures: this.figuresShown }, onProgress, pass.signal));
          if (this.sweepStop !== stop) return; // an explicit sweep took over
          if (out.ok) {
            this.responseCoarse = s !== settings;
            this.responseRevision = revision;
            this.response = out.value;
            this.responseError = null;
            if (s === settings) this.lastFullMs = out.ms;
            continue;
          }
          if (!('error' in out)) break;
          if (out.error.field !== 'cancelled') { this.responseError = out.error.message; break; }
          if (stop.signal.aborted) { this.responseCancelled = true; return; }
          break; // a pass of a stale revision, stopped for the newest one
        }
        this.livePassRevision = null;
        if (this.editor.revision === revision) {
          // The table was asked for while a pass without it ran: once more, from the worker's cached sweep.
          if (!retried && this.figuresShown && this.response?.figures === null) { retried = true; continue; }
          return;
        }
      }
    } finally {
      stop.signal.removeEventListener('abort', cancel);
      this.livePass = null;
      this.livePassRevision = null;
      if (this.sweepStop === stop) {
        this.sweepStop = null;
        this.responseProgress = null;
        this.responseCoarse = false;
        this.following = false;
      }
    }
  }

  /** Stop the running sweep; the last finished response stays on screen. */
  cancelSweep(): void { this.sweepStop?.abort(); }

  get sweeping(): boolean { return this.responseProgress !== null; }
  /** The design against a measured file of the board (swept at the file's frequencies; core compareMeasured). */
  async compare(measured: MeasuredFile): Promise<{ ok: true; value: CompareOutput } | { ok: false; error: string }> {
    const out = await this.client.run<CompareOutput>('compare', { doc: this.editor.doc, measured: $state.snapshot(measured) });
    if (out.ok) return { ok: true, value: out.value };
    return { ok: false, error: 'error' in out ? out.error.message : 'a newer comparison replaced this one' };
  }

  /** Export preview and files of the current design (runs the polygon engine in the worker). */
  async exportFiles(opts: Omit<ExportInput, 'doc'>): Promise<{ ok: true; value: ExportOutput } | { ok: false; error: string } | { ok: false; superseded: true }> {
    // Writes run in a lane of their own: a live preview started meanwhile supersedes only older previews.
    const lane = opts.formats?.length || opts.extras?.length ? 'export:write' : 'export:preview';
    const out = await this.client.run<ExportOutput>('export', { ...opts, doc: this.editor.doc }, undefined, undefined, lane);
    if (out.ok) return { ok: true, value: out.value };
    return 'error' in out ? { ok: false, error: out.error.message } : { ok: false, superseded: true };
  }

  /**
   * The milling plan (preview, widths as milled, time) or, with `write`, the G-code files. The copper left after
   * milling goes to the editor for the board overlay, tagged with the revision it belongs to.
   */
  async milling(opts: Omit<MillingInput, 'doc'>): Promise<{ ok: true; value: MillingOutput } | { ok: false; error: string }> {
    const revision = this.editor.revision;
    const out = await this.client.run<MillingOutput>('milling', { ...opts, doc: this.editor.doc });
    if (out.ok) { this.editor.milled = { revision, regions: out.value.milled }; return { ok: true, value: out.value }; }
    return { ok: false, error: 'error' in out ? out.error.message : 'a newer plan replaced this one' };
  }

  findings = $state.raw<CheckOutput['findings'] | null>(null);
  findingsError = $state<string | null>(null);
  checking = $state(false);

  /** Run the fabrication checks on the current design. */
  async check(): Promise<void> {
    this.checking = true;
    const revision = this.editor.revision;
    const out = await this.client.run<CheckOutput>('check', { doc: this.editor.doc });
    this.checking = false;
    if (out.ok) {
      this.findings = out.value.findings;
      this.editor.ground = { revision, regions: out.value.ground };
      this.findingsError = null;
      this.editor.flagged = new Set(out.value.findings.filter((f) => f.severity !== 'info').flatMap((f) => f.subjects));
      this.editor.near = new Set(out.value.findings.filter((f) => f.code === 'proximity').flatMap((f) => f.subjects));
    } else if ('error' in out) this.findingsError = out.error.message;
  }

  // ---- yield: one run at a time, cancellable; the result belongs to the revision it was run on
  yieldResult = $state.raw<YieldOutput | null>(null);
  yieldRevision = $state<number | null>(null);
  yieldError = $state<string | null>(null);
  yieldProgress = $state.raw<Progress | null>(null);
  private yieldStop: AbortController | null = null;

  get yieldRunning(): boolean { return this.yieldProgress !== null; }

  /** Make `samples` boards of the current design with `seed` and keep the result. */
  async runYield(samples: number, seed: number): Promise<void> {
    this.yieldStop?.abort();
    const stop = new AbortController();
    this.yieldStop = stop;
    this.yieldError = null;
    this.yieldProgress = { done: 0, total: samples, label: 'starting' };
    const revision = this.editor.revision;
    const out = await this.client.run<YieldOutput>('yield', { doc: this.editor.doc, samples, seed }, (p) => { if (this.yieldStop === stop) this.yieldProgress = p; }, stop.signal);
    if (this.yieldStop !== stop) return; // a newer run took over
    this.yieldStop = null;
    this.yieldProgress = null;
    if (out.ok) { this.yieldResult = out.value; this.yieldRevision = revision; }
    else if ('error' in out) this.yieldError = out.error.field === 'cancelled' ? 'Stopped: the run was cancelled before it finished.' : out.error.message;
  }

  cancelYield(): void { this.yieldStop?.abort(); }

  /** The field solution of one cross-section, for the cross-section view (a newer request replaces an older one). */
  async section(spec: SectionSpec): Promise<{ ok: true; value: SectionOutput } | { ok: false; error: string | null }> {
    const out = await this.client.run<SectionOutput>('section', { spec });
    if (out.ok) return { ok: true, value: out.value };
    return { ok: false, error: 'error' in out ? out.error.message : null };
  }

  destroy(): void { this.client.destroy(); this.sweeper.destroy(); }
}

function responseWorker(): (() => Worker) | null {
  if (typeof Worker === 'undefined') return null;
  return () => new Worker(new URL('../worker/response.worker.ts', import.meta.url), { type: 'module' });
}

function defaultWorker(): (() => Worker) | null {
  if (typeof Worker === 'undefined') return null;
  return () => new Worker(new URL('../worker/compute.worker.ts', import.meta.url), { type: 'module' });
}
