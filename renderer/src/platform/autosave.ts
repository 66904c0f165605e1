/**
 * The autosave schedule: a recovery copy of unsaved changes IDLE_MS after the last edit, and never later than
 * MAX_MS after the first edit not yet in a copy, even while editing goes on. A crash loses at most MAX_MS plus the
 * time one copy takes to write (well under 2 s for a design file): within 10 s of continuous editing. The copy goes
 * to the platform's recovery store, never over the user's file.
 *
 *   const autosaver = createAutosaver({ platform, snapshot: () => dirty ? { docId, name, path, text } : null });
 *   store.onChange(() => autosaver.changed());   // after every edit
 *   // after a successful save or discard: autosaver.saved()
 */
import type { AutosaveSnapshot, BridgeError, Platform } from './types.ts';

export const IDLE_MS = 2_000;
/** 8 s plus up to 2 s to write the copy: at most 10 s of editing lost (test/electron/autosave-bound.test.ts). */
export const MAX_MS = 8_000;
/** How often a copy held back by a drag in progress asks again whether the drag has ended. */
export const HOLD_POLL_MS = 100;

export interface AutosaverOptions {
  platform: Platform;
  /** The current unsaved state, or null when there is nothing unsaved. Called only when a copy is due. */
  snapshot: () => AutosaveSnapshot | null;
  idleMs?: number;
  maxMs?: number;
  /** Told about each failed write (show it: the user should save by hand). Cleared by the next success. */
  onError?: (error: BridgeError) => void;
  onSaved?: (savedAt: number) => void;
  /**
   * While true (a drag in progress), a copy that falls due waits, asked again every HOLD_POLL_MS: serialising a large
   * design mid-drag costs the pointer frames. It is written as soon as this turns false (the drag's end), so the
   * bound above holds from then on; a flush the shell asks for (closing) is never held.
   */
  holdWhile?: () => boolean;
}

export interface Autosaver {
  /** Call after every edit. */
  changed(): void;
  /** Write the copy now (also wired to the platform's flush request). */
  flush(): Promise<void>;
  /** The document was saved or its changes discarded: cancel the pending copy. */
  saved(): void;
  /** Stop timers and listeners. */
  stop(): void;
  /** Time of the last good copy, or null. */
  readonly lastSavedAt: number | null;
}

export function createAutosaver(o: AutosaverOptions): Autosaver {
  const idleMs = o.idleMs ?? IDLE_MS;
  const maxMs = o.maxMs ?? MAX_MS;
  let idleTimer: ReturnType<typeof setTimeout> | null = null;
  let maxTimer: ReturnType<typeof setTimeout> | null = null;
  let lastSavedAt: number | null = null;
  let writing: Promise<void> | null = null;
  let again = false;

  const clear = () => {
    if (idleTimer) clearTimeout(idleTimer);
    if (maxTimer) clearTimeout(maxTimer);
    idleTimer = maxTimer = null;
  };

  let holdTimer: ReturnType<typeof setTimeout> | null = null;
  /** A copy that fell due: written now, unless a drag holds it back. */
  const due = (): void => {
    if (holdTimer) { clearTimeout(holdTimer); holdTimer = null; }
    if (o.holdWhile?.()) { clear(); holdTimer = setTimeout(due, HOLD_POLL_MS); return; }
    void write();
  };

  const write = async (): Promise<void> => {
    clear();
    if (holdTimer) { clearTimeout(holdTimer); holdTimer = null; }
    // One write at a time; an edit during a write asks for one more afterwards.
    if (writing) { again = true; return writing; }
    const snap = o.snapshot();
    if (!snap) return;
    writing = (async () => {
      const r = await o.platform.autosave(snap);
      if (r.ok) { lastSavedAt = r.value.savedAt; o.onSaved?.(r.value.savedAt); } else o.onError?.(r.error);
    })();
    try { await writing; } finally { writing = null; }
    if (again) { again = false; await write(); }
  };

  const unsubscribe = o.platform.onFlushAutosave(() => { void write(); });

  return {
    changed() {
      if (idleTimer) clearTimeout(idleTimer);
      // A copy already held back by a drag stays due: the drag's end writes it.
      if (holdTimer) return;
      idleTimer = setTimeout(due, idleMs);
      maxTimer ??= setTimeout(due, maxMs);
    },
    flush: write,
    saved() { clear(); if (holdTimer) { clearTimeout(holdTimer); holdTimer = null; } again = false; },
    stop() { clear(); if (holdTimer) { clearTimeout(holdTimer); holdTimer = null; } unsubscribe(); },
    get lastSavedAt() { return lastSavedAt; },
  };
}
