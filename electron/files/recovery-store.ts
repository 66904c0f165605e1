/**
 * Recovery copies of unsaved work: one file per open document in a folder of its own (userData/recovery/ in the
 * app), `<docId>.recovery.json`, written atomically, holding the text and its metadata (original path, time,
 * the session that wrote it). A copy is never the user's file; it is dropped when the document is saved or its
 * changes are discarded. Copies written by an earlier session that ended without dropping them are the ones to
 * offer at start (the app runs as a single instance, so an earlier session is a dead one).
 */
import { mkdir, readdir, readFile, stat, unlink } from 'node:fs/promises';
import { join } from 'node:path';
import { atomicWriteFile } from './atomic-write.ts';
import { cleanStrayTemps } from './temp-files.ts';

export const RECOVERY_FORMAT = 'stripwright-recovery';
const SUFFIX = '.recovery.json';
export const DOC_ID_RE = /^[A-Za-z0-9_-]{1,64}$/;

export interface RecoveryMeta { docId: string; name: string; originalPath: string | null; savedAt: number; session: string; bytes: number }
export interface RecoveryCopy extends RecoveryMeta { text: string }

interface StoredV1 { format: typeof RECOVERY_FORMAT; version: 1; docId: string; name: string; originalPath: string | null; savedAt: number; session: string; text: string }

function parseStored(raw: string): StoredV1 | null {
  let v: unknown;
  try { v = JSON.parse(raw); } catch { return null; }
  if (!v || typeof v !== 'object') return null;
  const o = v as Record<string, unknown>;
  if (o.format !== RECOVERY_FORMAT || o.version !== 1) return null;
  if (typeof o.docId !== 'string' || !DOC_ID_RE.test(o.docId)) return null;
  if (typeof o.name !== 'string' || typeof o.text !== 'string' || typeof o.session !== 'string') return null;
  if (!(o.originalPath === null || typeof o.originalPath === 'string')) return null;
  if (typeof o.savedAt !== 'number' || !Number.isFinite(o.savedAt)) return null;
  return o as unknown as StoredV1;
}

export class RecoveryStore {
  constructor(readonly folder: string, private sessionId: string, private readonly now: () => number = Date.now) {}

  get session(): string { return this.sessionId; }

  /** Start a new session (after the page crashed): copies written so far become ones to offer for restoring. */
  renewSession(id: string): void { this.sessionId = id; }

  private file(docId: string): string {
    if (!DOC_ID_RE.test(docId)) throw new Error(`recovery: docId must be 1–64 letters, digits, '-' or '_', got ${JSON.stringify(docId).slice(0, 80)}`);
    return join(this.folder, docId + SUFFIX);
  }

  /** Create the folder and remove stray temporaries of earlier crashes; returns how many were removed. */
  async init(): Promise<number> {
    await mkdir(this.folder, { recursive: true });
    return (await cleanStrayTemps(this.folder)).length;
  }

  async write(c: { docId: string; name: string; originalPath: string | null; text: string }): Promise<RecoveryMeta> {
    const savedAt = this.now();
    const stored: StoredV1 = { format: RECOVERY_FORMAT, version: 1, docId: c.docId, name: c.name, originalPath: c.originalPath, savedAt, session: this.session, text: c.text };
    await atomicWriteFile(this.file(c.docId), JSON.stringify(stored));
    return { docId: c.docId, name: c.name, originalPath: c.originalPath, savedAt, session: this.session, bytes: c.text.length };
  }

  async read(docId: string): Promise<RecoveryCopy | null> {
    let raw: string;
    try { raw = await readFile(this.file(docId), 'utf8'); } catch { return null; }
    const s = parseStored(raw);
    return s ? { docId: s.docId, name: s.name, originalPath: s.originalPath, savedAt: s.savedAt, session: s.session, bytes: s.text.length, text: s.text } : null;
  }

  async discard(docId: string): Promise<void> {
    await unlink(this.file(docId)).catch((e: NodeJS.ErrnoException) => { if (e.code !== 'ENOENT') throw e; });
  }

  /** Every readable copy, newest first. Damaged files are left in place (the user may want them) and skipped. */
  async list(): Promise<RecoveryMeta[]> {
    let names: string[];
    try { names = await readdir(this.folder); } catch { return []; }
    const out: RecoveryMeta[] = [];
    for (const n of names) {
      if (!n.endsWith(SUFFIX)) continue;
      const docId = n.slice(0, -SUFFIX.length);
      if (!DOC_ID_RE.test(docId)) continue;
      const c = await this.read(docId);
      if (c) { const { text: _text, ...meta } = c; out.push(meta); }
    }
    return out.sort((a, b) => b.savedAt - a.savedAt);
  }

  /** Copies left by earlier sessions: the ones to offer for restoring. */
  async listEarlier(): Promise<RecoveryMeta[]> {
    return (await this.list()).filter((m) => m.session !== this.session);
  }

  async size(docId: string): Promise<number | null> {
    return stat(this.file(docId)).then((s) => s.size, () => null);
  }
}
