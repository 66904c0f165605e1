/**
 * The bridge contract: every message between the renderer and the desktop shell, in one place.
 *
 * Each channel maps to a request type and a response value type. The preload exposes one function per channel
 * (electron/preload.ts), the main process registers one validated handler per channel (electron/ipc.ts), and the
 * renderer's platform layer (renderer/src/platform/) calls them. Answers are result objects, never exceptions:
 * `{ ok: true, value } | { ok: false, error: { code, message } }`, because an Error thrown across the bridge loses
 * its type and most of its text.
 *
 * This file is pure (no Node, no Electron, no DOM; only the core's pure limits) so the renderer may import it; keep it that way.
 */

import { DESIGN_LIMITS } from '../core/design/limits.ts';

/** The file extension of a design (its content is the JSON design document, core/design/types.ts). */
export const DESIGN_EXTENSION = 'stripwright';
/** Extensions the open dialog and the OS hand-over accept (plain .json designs, e.g. the examples, open too). */
export const OPENABLE_EXTENSIONS = [DESIGN_EXTENSION, 'json'] as const;

/** Limits the main process enforces on every request (bytes are UTF-16 code units for text). */
export const LIMITS = {
  /** A design file larger than this is refused before reading (the project's own rule; the core's limit). */
  designBytes: DESIGN_LIMITS.fileBytes,
  /** A Touchstone file for a measured block (the design keeps at most this many characters of it). */
  touchstoneBytes: DESIGN_LIMITS.touchstone,
  /** One exported file. */
  exportFileBytes: 100 * 1024 * 1024,
  /** All files of one export together. */
  exportTotalBytes: 300 * 1024 * 1024,
  exportFiles: 64,
  fileNameChars: 120,
  docIdChars: 64,
  titleChars: 200,
  pathChars: 4096,
  recentFiles: 10,
} as const;

export type BridgeErrorCode =
  | 'bad-request'   // an argument of the wrong type, size or shape (a bug in the caller)
  | 'forbidden'     // the sender is not our page, or the path was never granted by a dialog or the OS
  | 'not-found'     // the file or recovery copy does not exist (any more)
  | 'too-large'     // over a LIMITS figure
  | 'not-text'      // not UTF-8 text (binary, NUL bytes, UTF-16)
  | 'changed-on-disk' // the file changed since it was opened or last saved; save-as or reload
  | 'io';           // the operating system refused (permission, disk full, locked by another program, ...)

export interface BridgeError { code: BridgeErrorCode; message: string }
export type BridgeResult<T> = { ok: true; value: T } | { ok: false; error: BridgeError };

export const ok = <T>(value: T): BridgeResult<T> => ({ ok: true, value });
export const fail = (code: BridgeErrorCode, message: string): { ok: false; error: BridgeError } => ({ ok: false, error: { code, message } });

/** A design read from disk. `text` is the file's content (UTF-8 decoded, BOM removed); the renderer parses it. */
export interface OpenedDesign {
  path: string;
  /** File name without folders, for titles. */
  name: string;
  text: string;
  /** mtime in ms, used to detect a change on disk at the next save. */
  modifiedMs: number;
}

export interface SavedDesign {
  path: string;
  name: string;
  modifiedMs: number;
  /** Where the previous version was kept (`<file>.bak`), or null when there was no previous version. */
  backupPath: string | null;
}

export interface ExportFile {
  /** A plain file name, e.g. 'feed-top.gbr' (no folders). */
  name: string;
  /** Text, or raw bytes (a PNG mask, for example). */
  data: string | Uint8Array;
}

export interface ExportedFiles { folder: string; written: string[] }

export interface RecentFile { path: string; name: string; openedAt: number }

/** An autosave snapshot as the renderer sends it. `docId` is stable for the life of an open document. */
export interface AutosaveSnapshot {
  docId: string;
  /** Display name of the document. */
  name: string;
  /** Where the document was last opened or saved, or null for a new, never-saved one. */
  path: string | null;
  text: string;
}

/** A recovery copy left by an earlier session that did not save it (a crash, power loss, a forced close). */
export interface RecoveryEntry {
  docId: string;
  name: string;
  originalPath: string | null;
  /** When the copy was written, ms since the epoch. */
  savedAt: number;
  bytes: number;
}

export interface RecoveredDesign extends RecoveryEntry { text: string }

export interface AppInfo {
  shell: 'electron';
  version: string;
  platform: string;
  /** The folder where recovery copies live (shown in the recovery prompt and the README). */
  recoveryFolder: string;
}

/** Extensions the measured-data dialog offers (Touchstone 1.x .sNp for 1 and 2 ports, and 2.0 .ts). */
export const TOUCHSTONE_EXTENSIONS = ['s1p', 's2p', 'ts'] as const;

/** A Touchstone file read for a measured block: its name (no folders) and its text. No path: nothing is written back. */
export interface OpenedData { name: string; text: string }

/**
 * Channel → request and response. `void` requests take no argument. Paths in requests must be ones the main process
 * handed out itself (from a dialog, the recent list, the command line or the OS), so a compromised page cannot read
 * or write anywhere else.
 */
export interface BridgeChannels {
  'design:open-dialog': { request: void; response: OpenedDesign | null };
  'design:open-path': { request: { path: string }; response: OpenedDesign };
  'data:open-touchstone': { request: void; response: OpenedData | null };
  'design:save': { request: { docId: string; path: string; text: string; expectedModifiedMs: number | null }; response: SavedDesign };
  'design:save-as': { request: { docId: string; suggestedName: string; text: string }; response: SavedDesign | null };
  'export:files': { request: { title: string; files: ExportFile[] }; response: ExportedFiles | null };
  'recent:list': { request: void; response: RecentFile[] };
  'recent:clear': { request: void; response: null };
  'autosave:write': { request: AutosaveSnapshot; response: { savedAt: number } };
  'autosave:discard': { request: { docId: string }; response: null };
  'recovery:list': { request: void; response: RecoveryEntry[] };
  'recovery:read': { request: { docId: string }; response: RecoveredDesign };
  'recovery:discard': { request: { docId: string }; response: null };
  'document:state': { request: { title: string; dirty: boolean }; response: null };
  'app:info': { request: void; response: AppInfo };
}

export type Channel = keyof BridgeChannels;
export type RequestOf<C extends Channel> = BridgeChannels[C]['request'];
export type ResponseOf<C extends Channel> = BridgeChannels[C]['response'];

export const CHANNELS = [
  'design:open-dialog', 'design:open-path', 'data:open-touchstone', 'design:save', 'design:save-as', 'export:files', 'recent:list',
  'recent:clear', 'autosave:write', 'autosave:discard', 'recovery:list', 'recovery:read', 'recovery:discard',
  'document:state', 'app:info',
] as const satisfies readonly Channel[];

/** The IPC channel name of a contract channel (prefixed so nothing else on the bus can collide). */
export const ipcName = (c: Channel): string => `stripwright:${c}`;

/**
 * Commands the native menu sends to the renderer. The renderer's command registry uses these same ids, so a menu
 * item and a keyboard shortcut run one command.
 */
export const MENU_COMMANDS = [
  'file.new', 'file.open', 'file.save', 'file.save-as', 'file.export', 'file.report', 'file.recover',
  'edit.undo', 'edit.redo', 'edit.delete', 'edit.select-all',
  'view.zoom-in', 'view.zoom-out', 'view.zoom-fit',
] as const;
export type MenuCommandId = (typeof MENU_COMMANDS)[number];

/** The window title for a document: its name, a dot while unsaved, the app's name once (even if the page added it). */
export function windowTitle(title: string, dirty: boolean): string {
  const name = title.replace(/\s+[—-]\s+Stripwright\s*$/, '').slice(0, LIMITS.titleChars) || 'Untitled';
  return `${dirty ? '• ' : ''}${name} — Stripwright`;
}

/** Messages the main process pushes to the renderer (not request/response). */
export const PUSH_CHANNELS = {
  menuCommand: 'stripwright:push:menu-command',
  /** A design the OS or a second instance asked us to open; payload OpenedDesign. */
  openDesign: 'stripwright:push:open-design',
  /** The window is closing with unsaved changes kept as a recovery copy: write the autosave now. */
  flushAutosave: 'stripwright:push:flush-autosave',
} as const;

/** The arguments of a channel's function: none for a `void` request, else the one request object. */
export type ArgsOf<C extends Channel> = RequestOf<C> extends void ? [] : [RequestOf<C>];

/** One function per channel, keyed by the channel name. */
export type BridgeCalls = { readonly [C in Channel]: (...args: ArgsOf<C>) => Promise<BridgeResult<ResponseOf<C>>> };

/** The object the preload exposes as `window.stripwright`. Callbacks receive data only, never the IPC event. */
export interface StripwrightBridge {
  readonly shell: 'electron';
  readonly calls: BridgeCalls;
  /** Subscribe to menu commands; returns the unsubscribe function. */
  onMenuCommand(handler: (id: MenuCommandId) => void): () => void;
  onOpenDesign(handler: (design: OpenedDesign) => void): () => void;
  onFlushAutosave(handler: () => void): () => void;
}
