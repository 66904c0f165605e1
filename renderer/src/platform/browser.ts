/**
 * The Platform in a plain browser (the `npm start` fallback and the browser tests): <input type=file> to open,
 * downloads (a Blob and <a download>) to save and export, localStorage for recovery copies.
 *
 * Recovery across sessions: each page load is a session with its own id and writes a heartbeat every
 * HEARTBEAT_MS. checkRecovery() offers the copies of sessions whose heartbeat stopped (the tab was closed or
 * crashed), never those of another tab that is still open.
 */
import { DESIGN_EXTENSION, fail, LIMITS, ok, OPENABLE_EXTENSIONS, TOUCHSTONE_EXTENSIONS, windowTitle, type BridgeResult, type OpenedDesign, type RecoveryEntry } from '../../../bridge/contract.ts';
import { checkTextSize, decodeTextBytes, DESIGN_TEXT, TOUCHSTONE_TEXT, type TextFileKind } from '../../../bridge/text-decode.ts';
import type { Platform } from './types.ts';

const PREFIX = 'stripwright.recovery.v1.';
const ALIVE = 'stripwright.alive.v1.';
export const HEARTBEAT_MS = 10_000;
/** A session whose heartbeat is older than this is over (3 missed beats). */
export const SESSION_DEAD_MS = 3 * HEARTBEAT_MS;

interface StoredCopy { docId: string; name: string; originalPath: string | null; savedAt: number; session: string; text: string }

export interface BrowserPlatformOptions {
  storage?: Storage;
  now?: () => number;
  /** Start the heartbeat timer (off in tests that drive time themselves). */
  heartbeat?: boolean;
  sessionId?: string;
}

const plainName = (s: string): string => (s.split(/[\\/]/).pop() ?? s).replace(/[\u0000-\u001f<>:"|?*]/g, '_').slice(0, LIMITS.fileNameChars) || 'design';

function withDesignExtension(name: string): string {
  const n = plainName(name);
  return OPENABLE_EXTENSIONS.some((e) => n.toLowerCase().endsWith(`.${e}`)) ? n : `${n}.${DESIGN_EXTENSION}`;
}

function download(name: string, data: string | Uint8Array, type: string): void {
  const blob = new Blob([typeof data === 'string' ? data : new Uint8Array(data)], { type });
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.style.display = 'none';
  document.body.append(a);
  a.click();
  a.remove();
  // Revoke later: revoking at once can cancel the download in some browsers.
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** Show the browser's file picker; resolves with the chosen file or null when the user cancels. */
function pickFile(accept: string): Promise<File | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    let done = false;
    const finish = (f: File | null) => { if (done) return; done = true; input.remove(); resolve(f); };
    input.addEventListener('change', () => finish(input.files?.[0] ?? null));
    input.addEventListener('cancel', () => finish(null));
    document.body.append(input);
    input.click();
  });
}

export function createBrowserPlatform(options: BrowserPlatformOptions = {}): Platform {
  const storage = options.storage ?? globalThis.localStorage;
  const now = options.now ?? Date.now;
  const session = options.sessionId ?? (globalThis.crypto?.randomUUID?.() ?? `${now()}-${Math.random().toString(36).slice(2)}`);

  const beat = () => { try { storage.setItem(ALIVE + session, String(now())); } catch { /* storage full: recovery copies report it */ } };
  beat();
  if (options.heartbeat !== false && typeof setInterval === 'function') setInterval(beat, HEARTBEAT_MS);
  if (typeof addEventListener === 'function') addEventListener('pagehide', () => storage.removeItem(ALIVE + session));

  const copies = (): StoredCopy[] => {
    const out: StoredCopy[] = [];
    for (let i = 0; i < storage.length; i++) {
      const key = storage.key(i);
      if (!key?.startsWith(PREFIX)) continue;
      try {
        const c = JSON.parse(storage.getItem(key) ?? '') as StoredCopy;
        if (typeof c.text === 'string' && typeof c.docId === 'string' && typeof c.session === 'string') out.push(c);
      } catch { /* a damaged entry is skipped, not deleted: the user may still want it by hand */ }
    }
    return out;
  };
  const sessionAlive = (s: string): boolean => {
    if (s === session) return true;
    const t = Number(storage.getItem(ALIVE + s));
    return Number.isFinite(t) && t > 0 && now() - t < SESSION_DEAD_MS;
  };
  const key = (s: string, docId: string) => `${PREFIX}${s}.${docId}`;
  const entry = (c: StoredCopy): RecoveryEntry => ({ docId: c.docId, name: c.name, originalPath: c.originalPath, savedAt: c.savedAt, bytes: c.text.length });
  const findEarlier = (docId: string) => copies().find((c) => c.docId === docId && !sessionAlive(c.session));
  const noPaths = fail('not-found', 'a browser cannot reopen files by path; use Open and pick the file.');

  /** The text of a picked file of `kind`: its size refused before reading, then the text checks. */
  const readPicked = async (kind: TextFileKind, file: File): Promise<BridgeResult<string>> => {
    const size = checkTextSize(kind, file.name, file.size);
    if (!size.ok) return size;
    return decodeTextBytes(kind, file.name, new Uint8Array(await file.arrayBuffer()));
  };

  const saveByDownload = (docId: string, name: string, text: string) => {
    download(name, text, 'application/json');
    storage.removeItem(key(session, docId));
    return ok({ path: name, name, modifiedMs: now(), backupPath: null });
  };

  return {
    kind: 'browser',
    async openDesign() {
      const file = await pickFile(OPENABLE_EXTENSIONS.map((e) => `.${e}`).join(','));
      if (!file) return ok(null);
      const text = await readPicked(DESIGN_TEXT, file);
      return text.ok ? ok({ path: file.name, name: file.name, text: text.value, modifiedMs: file.lastModified }) : text;
    },
    openRecent: async () => noPaths,
    async openTouchstone() {
      const file = await pickFile(TOUCHSTONE_EXTENSIONS.map((e) => `.${e}`).join(','));
      if (!file) return ok(null);
      const text = await readPicked(TOUCHSTONE_TEXT, file);
      return text.ok ? ok({ name: file.name, text: text.value }) : text;
    },
    saveDesign: async (req) => saveByDownload(req.docId, withDesignExtension(req.path), req.text),
    saveDesignAs: async (req) => saveByDownload(req.docId, withDesignExtension(req.suggestedName), req.text),
    async exportFiles(req) {
      if (req.files.length === 0) return fail('bad-request', 'export: expected at least one file, got none.');
      for (const f of req.files) download(plainName(f.name), f.data, typeof f.data === 'string' ? 'text/plain' : 'application/octet-stream');
      return ok({ folder: 'your browser’s download folder', written: req.files.map((f) => plainName(f.name)) });
    },
    listRecent: async () => ok([]),
    clearRecent: async () => ok(null),
    async autosave(s) {
      const savedAt = now();
      const copy: StoredCopy = { docId: s.docId, name: s.name, originalPath: s.path, savedAt, session, text: s.text };
      try {
        storage.setItem(key(session, s.docId), JSON.stringify(copy));
      } catch (err) {
        return fail('too-large', `the browser refused to keep a recovery copy (${err instanceof Error ? err.name : 'storage error'}; its storage holds about 5 MB). Save the design to a file now.`);
      }
      return ok({ savedAt });
    },
    discardAutosave: async (docId) => { storage.removeItem(key(session, docId)); return ok(null); },
    checkRecovery: async () => ok(copies().filter((c) => !sessionAlive(c.session)).sort((a, b) => b.savedAt - a.savedAt).map(entry)),
    async readRecovery(docId) {
      const c = findEarlier(docId);
      return c ? ok({ ...entry(c), text: c.text }) : fail('not-found', `no recovery copy with id ${docId}; it may have been discarded already.`);
    },
    async discardRecovery(docId) {
      for (const c of copies()) if (c.docId === docId && !sessionAlive(c.session)) storage.removeItem(key(c.session, docId));
      return ok(null);
    },
    setDocumentState: async (state) => {
      if (typeof document !== 'undefined') document.title = windowTitle(state.title, state.dirty);
      return ok(null);
    },
    onMenuCommand: () => () => {},
    onOpenDesign: () => () => {},
    onFlushAutosave: (h) => {
      // Closing the tab: the last chance to write the recovery copy (localStorage writes are synchronous).
      if (typeof addEventListener !== 'function') return () => {};
      const listener = () => h();
      addEventListener('pagehide', listener);
      return () => removeEventListener('pagehide', listener);
    },
  };
}
