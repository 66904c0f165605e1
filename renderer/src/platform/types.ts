/**
 * The renderer's view of the platform: every file operation the app makes goes through a `Platform`
 * (getPlatform() in ./index.ts). In the desktop app it is the preload bridge (window.stripwright); in a plain
 * browser it is a fallback over file pickers, downloads and localStorage. Both answer with result objects
 * (`{ ok: true, value } | { ok: false, error: { code, message } }`); neither throws for an expected failure, and a
 * cancelled dialog is `{ ok: true, value: null }`, not an error.
 */
import type {
  AutosaveSnapshot, BridgeResult, ExportedFiles, ExportFile, MenuCommandId, OpenedData, OpenedDesign, RecentFile,
  RecoveredDesign, RecoveryEntry, SavedDesign,
} from '../../../bridge/contract.ts';

export type {
  AutosaveSnapshot, BridgeError, BridgeErrorCode, BridgeResult, ExportedFiles, ExportFile, MenuCommandId, OpenedData, OpenedDesign,
  RecentFile, RecoveredDesign, RecoveryEntry, SavedDesign,
} from '../../../bridge/contract.ts';
export { DESIGN_EXTENSION, MENU_COMMANDS, OPENABLE_EXTENSIONS, LIMITS } from '../../../bridge/contract.ts';

export interface SaveRequest {
  /** Stable id of the open document (the same one given to autosave); its recovery copy is dropped once saved. */
  docId: string;
  /** The path the document was opened from or last saved to (OpenedDesign.path / SavedDesign.path). */
  path: string;
  text: string;
  /** OpenedDesign.modifiedMs / SavedDesign.modifiedMs of that path; a different mtime on disk refuses the save. */
  expectedModifiedMs: number | null;
}

export interface SaveAsRequest { docId: string; suggestedName: string; text: string }
export interface ExportRequest { /** Shown in the dialog, e.g. 'Export Gerber and drill'. */ title: string; files: ExportFile[] }

export interface Platform {
  /** 'desktop' inside the Electron shell, 'browser' when served by `npm start`'s fallback or the tests. */
  readonly kind: 'desktop' | 'browser';
  /** Ask the user for a design file (native dialog or <input type=file>); null when cancelled. */
  openDesign(): Promise<BridgeResult<OpenedDesign | null>>;
  /** Ask the user for a Touchstone file for a measured block (native dialog or <input type=file>); null when cancelled. */
  openTouchstone(): Promise<BridgeResult<OpenedData | null>>;
  /** Reopen an entry of listRecent() (desktop only; the browser has no paths and answers 'not-found'). */
  openRecent(path: string): Promise<BridgeResult<OpenedDesign>>;
  /** Save over `path` atomically, keeping the previous version as `<path>.bak` (desktop) / download (browser). */
  saveDesign(req: SaveRequest): Promise<BridgeResult<SavedDesign>>;
  /** Ask where to save (native dialog) or download under the suggested name (browser); null when cancelled. */
  saveDesignAs(req: SaveAsRequest): Promise<BridgeResult<SavedDesign | null>>;
  /** Write a set of export files into a folder the user picks (desktop) or download each (browser). */
  exportFiles(req: ExportRequest): Promise<BridgeResult<ExportedFiles | null>>;
  listRecent(): Promise<BridgeResult<RecentFile[]>>;
  clearRecent(): Promise<BridgeResult<null>>;
  /** Store a recovery copy of unsaved changes (use createAutosaver() from ./autosave.ts rather than calling it). */
  autosave(snapshot: AutosaveSnapshot): Promise<BridgeResult<{ savedAt: number }>>;
  /** Drop the current session's recovery copy of a document (after the user discards the changes). */
  discardAutosave(docId: string): Promise<BridgeResult<null>>;
  /** Recovery copies left by earlier sessions that ended without saving them; offer these at start. */
  checkRecovery(): Promise<BridgeResult<RecoveryEntry[]>>;
  readRecovery(docId: string): Promise<BridgeResult<RecoveredDesign>>;
  /** Drop an earlier session's recovery copy (after it was restored and saved, or the user declined it). */
  discardRecovery(docId: string): Promise<BridgeResult<null>>;
  /** The document's name and the unsaved-changes flag; the shell makes the window title (windowTitle in the contract)
   *  and asks before closing a dirty window. */
  setDocumentState(state: { title: string; dirty: boolean }): Promise<BridgeResult<null>>;
  /** Native menu commands (desktop); the browser never sends any. Returns the unsubscribe function. */
  onMenuCommand(handler: (id: MenuCommandId) => void): () => void;
  /** A design the OS or a second app instance asked to open. */
  onOpenDesign(handler: (design: OpenedDesign) => void): () => void;
  /** The shell is about to close a dirty window: write the autosave now (createAutosaver wires this). */
  onFlushAutosave(handler: () => void): () => void;
}
