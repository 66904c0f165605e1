/**
 * Undo and redo by document diffs. Each edit runs a command from the registry, and the change it made is kept as a
 * diff; an undo step is the diffs since the last mark, undone by applying their inverses in reverse order. A drag
 * runs in live mode: its many updates change the document at once but become one step when the drag commits (or
 * vanish when it is cancelled). A revision counter rises on every change so faces can key caches on it.
 *
 * @example
 * const h = new History(newDesign());
 * h.apply('node.add', { at: { x: 0, y: 0 }, spec: { kind: 'port' } }); h.mark();
 * h.undo();   // back to the empty design
 */
import { InputError } from '../util/errors.ts';
import type { DesignDoc } from './types.ts';
import { DESIGN_COMMANDS, runCommand } from './commands.ts';
import { applyDiff, diffDesigns, invertDiff, isEmptyDiff, type DesignDiff } from './diff.ts';

export interface HistoryStep { label: string; diffs: DesignDiff[] }

export interface HistoryOptions {
  /** Undo steps kept; the oldest go first. Default 500. */
  limit?: number;
  /** The function that runs a command; defaults to the design command registry. */
  run?: (doc: DesignDoc, id: string, args: unknown) => DesignDoc;
}

export class History {
  private current: DesignDoc;
  private undoStack: HistoryStep[] = [];
  private redoStack: HistoryStep[] = [];
  /** Diffs since the last mark: the step being built. */
  private open: HistoryStep | null = null;
  private liveStart: { doc: DesignDoc; label: string } | null = null;
  private rev = 0;
  private readonly limit: number;
  private readonly runFn: (doc: DesignDoc, id: string, args: unknown) => DesignDoc;
  private listeners = new Set<(doc: DesignDoc, revision: number) => void>();

  constructor(doc: DesignDoc, opts: HistoryOptions = {}) {
    this.current = doc;
    const limit = opts.limit ?? 500;
    if (!Number.isInteger(limit) || limit < 1) throw new InputError('out-of-range', 'limit', 'a whole number of undo steps, at least 1', String(limit));
    this.limit = limit;
    this.runFn = opts.run ?? runCommand;
  }

  get doc(): DesignDoc { return this.current; }
  /** Rises by one on every change of the design: edit, live update, undo, redo, reset. */
  get revision(): number { return this.rev; }
  get canUndo(): boolean { return (this.open !== null && this.open.diffs.length > 0) || this.undoStack.length > 0 || this.liveStart !== null; }
  get canRedo(): boolean { return this.redoStack.length > 0 && this.liveStart === null && this.open === null; }
  get isLive(): boolean { return this.liveStart !== null; }
  /** Labels of the undo steps, oldest first (the open step last). */
  get undoLabels(): string[] { return [...this.undoStack, ...(this.open ? [this.open] : [])].map((s) => s.label); }
  get redoLabels(): string[] { return this.redoStack.map((s) => s.label).reverse(); }

  /** Calls `fn` after every change; returns the function that stops it. */
  subscribe(fn: (doc: DesignDoc, revision: number) => void): () => void {
    this.listeners.add(fn);
    return () => this.listeners.delete(fn);
  }

  /**
   * Runs a command. Outside live mode its change joins the open step (closed by mark(), undo() or the next live
   * drag) and is returned; in live mode it only moves the document on, and null is returned: a drag's change is
   * worked out once, when it ends (commitLive), not on every pointer move. Throws InputError from the command; then
   * nothing changes.
   */
  apply(commandId: string, args: unknown = {}, label?: string): DesignDiff | null {
    const before = this.current;
    const after = this.runFn(before, commandId, args);
    if (this.liveStart !== null) {
      if (!sameRecords(before, after)) this.set(after);
      return null;
    }
    const diff = diffDesigns(before, after);
    if (isEmptyDiff(diff)) return diff;
    if (!this.open) this.open = { label: label ?? commandLabel(commandId), diffs: [] };
    this.open.diffs.push(diff);
    this.redoStack = [];
    this.set(after);
    return diff;
  }

  /** Closes the open step: the next undo stops here. */
  mark(): void {
    if (this.open && this.open.diffs.length > 0) this.push(this.open);
    this.open = null;
  }

  /** Starts a drag: following apply() calls show at once and become one step on commitLive(). */
  beginLive(label = 'Drag'): void {
    if (this.liveStart) throw new InputError('invalid-design', 'history', 'no drag in progress before a new one starts', 'a drag already in progress');
    this.mark();
    this.liveStart = { doc: this.current, label };
  }

  /** Ends a drag, recording everything it changed as one undo step. */
  commitLive(): DesignDiff | null {
    const live = this.liveStart;
    if (!live) return null;
    this.liveStart = null;
    const diff = diffDesigns(live.doc, this.current);
    if (isEmptyDiff(diff)) return null;
    this.push({ label: live.label, diffs: [diff] });
    this.redoStack = [];
    return diff;
  }

  /** Abandons a drag: the document returns to where the drag started. */
  cancelLive(): void {
    const live = this.liveStart;
    if (!live) return;
    this.liveStart = null;
    if (live.doc !== this.current) this.set(live.doc);
  }

  undo(): boolean {
    if (this.liveStart) this.cancelLive();
    this.mark();
    const step = this.undoStack.pop();
    if (!step) return false;
    let doc = this.current;
    for (let i = step.diffs.length - 1; i >= 0; i--) doc = applyDiff(doc, invertDiff(step.diffs[i]!));
    this.redoStack.push(step);
    this.set(doc);
    return true;
  }

  redo(): boolean {
    if (this.liveStart) return false;
    this.mark();
    const step = this.redoStack.pop();
    if (!step) return false;
    let doc = this.current;
    for (const d of step.diffs) doc = applyDiff(doc, d);
    this.undoStack.push(step);
    this.set(doc);
    return true;
  }

  /** Replaces the design with another (a file opened or reverted) and forgets the history. */
  reset(doc: DesignDoc): void {
    this.undoStack = [];
    this.redoStack = [];
    this.open = null;
    this.liveStart = null;
    this.set(doc);
  }

  private push(step: HistoryStep): void {
    this.undoStack.push(step);
    if (this.undoStack.length > this.limit) this.undoStack.splice(0, this.undoStack.length - this.limit);
  }

  private set(doc: DesignDoc): void {
    this.current = doc;
    this.rev++;
    for (const fn of this.listeners) fn(doc, this.rev);
  }
}

/**
 * The very same records (commands keep every record they do not change): no change, found without a diff. A record
 * made anew with equal contents counts as a change here; commitLive's diff then drops it.
 */
function sameRecords(a: DesignDoc, b: DesignDoc): boolean {
  if (a === b) return true;
  const x = a as unknown as Record<string, unknown>, y = b as unknown as Record<string, unknown>;
  const keys = Object.keys(x);
  if (keys.length !== Object.keys(y).length) return false;
  for (const k of keys) {
    const u = x[k], v = y[k];
    if (u === v) continue;
    if (!Array.isArray(u) || !Array.isArray(v) || u.length !== v.length) return false;
    for (let i = 0; i < u.length; i++) if (u[i] !== v[i]) return false;
  }
  return true;
}

function commandLabel(id: string): string { return DESIGN_COMMANDS.get(id)?.label ?? id; }
