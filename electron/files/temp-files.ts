/**
 * Names of the temporary files of atomic writes, and their clean-up at start.
 *
 * Scheme: `.<target name>.<pid>-<8 hex>.swtmp` in the target's folder (hidden on Unix, never matching a design
 * extension). The pid lets clean-up leave alone the temporaries of a process that is still running (the CLI
 * writing in the same folder, say); those of dead processes are remnants of a crash and are removed.
 */
import { randomBytes } from 'node:crypto';
import { readdir, stat, unlink } from 'node:fs/promises';
import { join } from 'node:path';

export const TEMP_SUFFIX = '.swtmp';
const TEMP_RE = /^\.(.+)\.(\d+)-([0-9a-f]{8})\.swtmp$/;

export function tempNameFor(targetName: string, pid = process.pid): string {
  return `.${targetName}.${pid}-${randomBytes(4).toString('hex')}${TEMP_SUFFIX}`;
}

/** The pid and target of a temporary file name, or null when the name is not one of ours. */
export function parseTempName(name: string): { target: string; pid: number } | null {
  const m = TEMP_RE.exec(name);
  return m ? { target: m[1]!, pid: Number(m[2]) } : null;
}

export function processAlive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM'; // exists, owned by someone else
  }
}

export interface CleanOptions {
  /** Remove even temporaries of live processes when older than this (ms); default one day. */
  staleAfterMs?: number;
  isAlive?: (pid: number) => boolean;
  now?: () => number;
}

/** Remove our stray temporary files in `folder`; returns the names removed. A missing folder is not an error. */
export async function cleanStrayTemps(folder: string, o: CleanOptions = {}): Promise<string[]> {
  const isAlive = o.isAlive ?? processAlive;
  const staleAfter = o.staleAfterMs ?? 24 * 3600 * 1000;
  const now = (o.now ?? Date.now)();
  let names: string[];
  try { names = await readdir(folder); } catch { return []; }
  const removed: string[] = [];
  for (const name of names) {
    const t = parseTempName(name);
    if (!t) continue;
    const p = join(folder, name);
    const info = await stat(p).catch(() => null);
    if (!info?.isFile()) continue;
    if (isAlive(t.pid) && now - info.mtimeMs < staleAfter) continue;
    try { await unlink(p); removed.push(name); } catch { /* gone already, or not ours to delete */ }
  }
  return removed;
}
