/**
 * What each bridge channel does, over plain Node and an injected set of dialogs: the main process's document
 * services. No Electron import, so every path (grants, save conflicts, backups, recovery, exports) is tested with
 * a temporary folder and scripted dialogs. ipc.ts validates the sender and arguments before anything here runs.
 *
 * Path grants: the page can only name paths the shell handed it (chosen in a dialog, in the recent list, given on
 * the command line or by the OS), so a compromised page cannot read or overwrite arbitrary files.
 */
import { stat, mkdir, readFile } from 'node:fs/promises';
import { basename, dirname, extname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  DESIGN_EXTENSION, fail, LIMITS, ok, OPENABLE_EXTENSIONS, type AppInfo, type BridgeResult, type ExportedFiles, type ExportFile,
  type OpenedData, type OpenedDesign, type RecentFile, type RecoveredDesign, type RecoveryEntry, type SavedDesign,
} from '../bridge/contract.ts';
import { atomicWriteFile, AtomicWriteError, explainErrno } from './files/atomic-write.ts';
import { readJson, touchRecent, validateRecent, writeJson } from './files/json-store.ts';
import { readDesignFile, readTouchstoneFile, sha256Hex } from './files/read-design.ts';
import type { RecoveryStore } from './files/recovery-store.ts';
import { cleanStrayTemps } from './files/temp-files.ts';

export interface Dialogs {
  /** Native open dialog for a design; the chosen path or null. */
  openDesign(defaultFolder: string | null): Promise<string | null>;
  /** Native open dialog for a Touchstone file (measured data); the chosen path or null. */
  openTouchstone(defaultFolder: string | null): Promise<string | null>;
  /** Native save dialog (it asks before replacing a file); the chosen path or null. */
  saveDesign(defaultPath: string): Promise<string | null>;
  /** Save dialog for a single export file. */
  saveExport(title: string, defaultPath: string): Promise<string | null>;
  /** Folder chooser for a set of export files. */
  chooseFolder(title: string, defaultFolder: string | null): Promise<string | null>;
  /** Ask before replacing existing export files; true to go on. */
  confirmReplace(names: string[]): Promise<boolean>;
}

export interface ShellOptions {
  userData: string;
  documentsFolder: string;
  recovery: RecoveryStore;
  dialogs: Dialogs;
  version: string;
  platform?: string;
  now?: () => number;
}

const hasOpenableExtension = (p: string) => OPENABLE_EXTENSIONS.some((e) => p.toLowerCase().endsWith(`.${e}`));

const ioFail = (what: string, e: unknown) =>
  e instanceof AtomicWriteError ? fail('io', e.message) : fail('io', `${what}: ${explainErrno(e as NodeJS.ErrnoException)}.`);

const textHash = (text: string): string => sha256Hex(Buffer.from(text, 'utf8'));

export class Shell {
  private readonly grants = new Set<string>();
  /** SHA-256 of the bytes last read from or written to each path: a change on disk that keeps the time shows here. */
  private readonly contentHash = new Map<string, string>();
  /** Hash of the text last saved per document: an autosave of exactly that text is already safe, no copy needed. */
  private readonly savedHash = new Map<string, string>();
  /** Saves, autosaves and discards of one document run one after another in the order they arrived. */
  private readonly queues = new Map<string, Promise<unknown>>();
  private recent: RecentFile[] = [];
  private lastFolder: string | null = null;
  private readonly now: () => number;
  readonly recentPath: string;

  constructor(private readonly o: ShellOptions) {
    this.now = o.now ?? Date.now;
    this.recentPath = join(o.userData, 'recent.json');
  }

  /** Load settings, prepare the recovery folder and remove stray temporaries (there and beside recent files). */
  async start(): Promise<{ strayTempsRemoved: number }> {
    await mkdir(this.o.userData, { recursive: true });
    this.recent = await readJson(this.recentPath, (v) => validateRecent(v, LIMITS.recentFiles), []);
    for (const r of this.recent) this.grants.add(r.path);
    let removed = await this.o.recovery.init();
    const folders = new Set(this.recent.map((r) => dirname(r.path)));
    for (const f of folders) removed += (await cleanStrayTemps(f)).length;
    return { strayTempsRemoved: removed };
  }

  /** A path the OS, the command line or a second instance handed us: allowed from now on. */
  grant(path: string): void { this.grants.add(path); }
  isGranted(path: string): boolean { return this.grants.has(path); }

  private async remember(path: string): Promise<void> {
    this.grants.add(path);
    this.lastFolder = dirname(path);
    this.recent = touchRecent(this.recent, { path, name: basename(path), openedAt: this.now() }, LIMITS.recentFiles);
    await writeJson(this.recentPath, this.recent).catch(() => {}); // a settings file never fails a save or an open
  }

  private async open(path: string): Promise<BridgeResult<OpenedDesign>> {
    const r = await readDesignFile(path);
    if (!r.ok) return r;
    const { sha256, ...opened } = r.value;
    this.contentHash.set(path, sha256);
    await this.remember(path);
    return ok(opened);
  }

  /**
   * One document's file work in arrival order. Without it an autosave that started before a save could finish
   * after the save had dropped the recovery copy, leaving a copy of saved work to be offered as unsaved.
   */
  private inOrder<T>(docId: string, work: () => Promise<T>): Promise<T> {
    const before = this.queues.get(docId) ?? Promise.resolve();
    const run = before.then(work, work);
    const tail = run.catch(() => {});
    this.queues.set(docId, tail);
    void tail.then(() => { if (this.queues.get(docId) === tail) this.queues.delete(docId); });
    return run;
  }

  /** True when the file at `path` no longer holds the bytes we last read or wrote there (unknown: false). */
  private async contentChanged(path: string, size: number): Promise<boolean> {
    const known = this.contentHash.get(path);
    if (known === undefined) return false;
    if (size > LIMITS.designBytes) return true; // we never read or wrote anything that large
    const bytes = await readFile(path).catch(() => null);
    return bytes === null || sha256Hex(bytes) !== known;
  }

  async openDialog(): Promise<BridgeResult<OpenedDesign | null>> {
    const path = await this.o.dialogs.openDesign(this.lastFolder ?? this.o.documentsFolder);
    if (!path) return ok(null);
    return this.open(path);
  }

  /** Measured data for a block: the file's name and text (the path stays here; nothing is written back to it). */
  async openTouchstone(): Promise<BridgeResult<OpenedData | null>> {
    const path = await this.o.dialogs.openTouchstone(this.lastFolder ?? this.o.documentsFolder);
    if (!path) return ok(null);
    return readTouchstoneFile(path);
  }

  async openPath(path: string): Promise<BridgeResult<OpenedDesign>> {
    if (!this.grants.has(path)) return fail('forbidden', `the shell did not hand out ${path}; open it through File ▸ Open.`);
    return this.open(path);
  }

  async save(req: { docId: string; path: string; text: string; expectedModifiedMs: number | null }): Promise<BridgeResult<SavedDesign>> {
    if (!this.grants.has(req.path)) return fail('forbidden', `the shell did not hand out ${req.path}; use Save As to choose where to save.`);
    return this.inOrder(req.docId, async () => {
      const current = await stat(req.path).catch(() => null);
      // Another program (or a second copy on a shared drive) changed the file since we read or wrote it: by its
      // time, or by its content when the time was kept (a sync client or a tool that restores timestamps).
      if (current && req.expectedModifiedMs !== null) {
        const timeMoved = Math.abs(current.mtimeMs - req.expectedModifiedMs) > 1;
        if (timeMoved || (await this.contentChanged(req.path, current.size))) {
          return fail('changed-on-disk', `${basename(req.path)} was changed by another program since it was opened (${timeMoved ? new Date(current.mtimeMs).toISOString() : 'its content differs, though its time was kept'}). Nothing was written; use Save As to keep your version under another name, then compare.`);
        }
      }
      return this.write(req.docId, req.path, req.text);
    });
  }

  private async write(docId: string, path: string, text: string): Promise<BridgeResult<SavedDesign>> {
    let backupPath: string | null;
    try {
      ({ backupPath } = await atomicWriteFile(path, text, { backup: true }));
    } catch (e) {
      return ioFail(`saving ${path}`, e);
    }
    const after = await stat(path);
    this.contentHash.set(path, textHash(text));
    this.savedHash.set(docId, textHash(text));
    await this.remember(path);
    await this.o.recovery.discard(docId).catch(() => {}); // saved: the recovery copy has done its job
    return ok({ path, name: basename(path), modifiedMs: after.mtimeMs, backupPath });
  }

  async saveAs(req: { docId: string; suggestedName: string; text: string }): Promise<BridgeResult<SavedDesign | null>> {
    const base = basename(req.suggestedName.replace(/\\/g, '/')).replace(/[\u0000-\u001f<>:"|?*]/g, '_') || 'design';
    const named = hasOpenableExtension(base) ? base : `${base}.${DESIGN_EXTENSION}`;
    let path = await this.o.dialogs.saveDesign(join(this.lastFolder ?? this.o.documentsFolder, named));
    if (!path) return ok(null);
    // GTK's dialog does not add the extension; without one the OS would not know the file is ours.
    if (!hasOpenableExtension(path)) path += `.${DESIGN_EXTENSION}`;
    const chosen = path;
    return this.inOrder(req.docId, () => this.write(req.docId, chosen, req.text));
  }

  async exportFiles(req: { title: string; files: ExportFile[] }): Promise<BridgeResult<ExportedFiles | null>> {
    if (req.files.length === 1) {
      const f = req.files[0]!;
      const path = await this.o.dialogs.saveExport(req.title, join(this.lastFolder ?? this.o.documentsFolder, f.name));
      if (!path) return ok(null);
      try { await atomicWriteFile(path, f.data); } catch (e) { return ioFail(`writing ${path}`, e); }
      return ok({ folder: dirname(path), written: [basename(path)] });
    }
    const folder = await this.o.dialogs.chooseFolder(req.title, this.lastFolder ?? this.o.documentsFolder);
    if (!folder) return ok(null);
    const existing: string[] = [];
    for (const f of req.files) if (await stat(join(folder, f.name)).catch(() => null)) existing.push(f.name);
    if (existing.length > 0 && !(await this.o.dialogs.confirmReplace(existing))) return ok(null);
    const written: string[] = [];
    for (const f of req.files) {
      try {
        await atomicWriteFile(join(folder, f.name), f.data);
        written.push(f.name);
      } catch (e) {
        const r = ioFail(`writing ${f.name} in ${folder}`, e);
        return fail('io', `${r.error.message}${written.length ? ` Already written: ${written.join(', ')}.` : ''}`);
      }
    }
    return ok({ folder, written });
  }

  /** The recent list, without files that no longer exist. */
  async listRecent(): Promise<BridgeResult<RecentFile[]>> {
    const present: RecentFile[] = [];
    for (const r of this.recent) if (await stat(r.path).then((s) => s.isFile(), () => false)) present.push(r);
    return ok(present);
  }

  async clearRecent(): Promise<BridgeResult<null>> {
    this.recent = [];
    try { await writeJson(this.recentPath, []); } catch (e) { return ioFail('clearing the recent list', e); }
    return ok(null);
  }

  async autosave(s: { docId: string; name: string; path: string | null; text: string }): Promise<BridgeResult<{ savedAt: number }>> {
    // A recovery copy may only point back at a path the shell handed out, so restoring it cannot widen the grants.
    if (s.path !== null && !this.grants.has(s.path)) return fail('forbidden', `the shell did not hand out ${s.path}; autosave the document with path null.`);
    return this.inOrder(s.docId, async () => {
      // Exactly the text last saved: nothing is unsaved, so no copy (and none left from before).
      if (this.savedHash.get(s.docId) === textHash(s.text)) {
        await this.o.recovery.discard(s.docId).catch(() => {});
        return ok({ savedAt: this.now() });
      }
      try {
        const m = await this.o.recovery.write({ docId: s.docId, name: s.name, originalPath: s.path, text: s.text });
        return ok({ savedAt: m.savedAt });
      } catch (e) {
        return ioFail(`writing the recovery copy in ${this.o.recovery.folder}`, e);
      }
    });
  }

  async discard(docId: string): Promise<BridgeResult<null>> {
    return this.inOrder(docId, async () => {
      try { await this.o.recovery.discard(docId); } catch (e) { return ioFail('dropping the recovery copy', e); }
      return ok(null);
    });
  }

  async listRecovery(): Promise<BridgeResult<RecoveryEntry[]>> {
    const list = await this.o.recovery.listEarlier();
    return ok(list.map(({ session: _s, ...m }) => m));
  }

  async readRecovery(docId: string): Promise<BridgeResult<RecoveredDesign>> {
    const c = await this.o.recovery.read(docId);
    if (!c) return fail('not-found', `no recovery copy with id ${docId}; it may have been discarded already.`);
    if (c.originalPath) this.grants.add(c.originalPath); // it was checked when the copy was written
    const { session: _s, ...rest } = c;
    return ok(rest);
  }

  appInfo(): AppInfo {
    return { shell: 'electron', version: this.o.version, platform: this.o.platform ?? process.platform, recoveryFolder: this.o.recovery.folder };
  }

  /**
   * Files given on the command line (the first instance's or a second one's): the design-looking ones. Linux
   * desktop entries pass `%U`, so a file:// URL is turned into its path; other URLs are ignored.
   */
  static designPathsIn(argv: string[]): string[] {
    const out: string[] = [];
    for (const a of argv) {
      let p = a;
      if (/^file:\/\//i.test(a)) { try { p = fileURLToPath(a); } catch { continue; } }
      else if (/^[a-z][a-z0-9+.-]*:\/\//i.test(a)) continue;
      if (!p.startsWith('-') && hasOpenableExtension(p) && extname(p) !== '' && !p.endsWith('package.json')) out.push(p);
    }
    return out;
  }
}
