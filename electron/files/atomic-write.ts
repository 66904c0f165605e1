/**
 * Atomic replacement of a file, keeping the previous version as a backup (the project's own rule):
 *
 *   1. write the new bytes to a temporary file in the same folder (rename is atomic only within one file system),
 *      fsync it and close it;
 *   2. if the target exists and a backup is wanted, make `<target>.bak` the current version: a hard link to the
 *      target under a second temporary name (a copy, fsynced, where links are not supported), renamed over the .bak;
 *   3. rename the temporary file over the target;
 *   4. fsync the folder so the new name itself survives a power cut (best effort: not possible on Windows).
 *
 * A symlinked target is resolved first, so the link stays and the file it points to is replaced.
 * At every instant the target is either the complete old or the complete new file, and the .bak either the
 * previous backup or the complete old file. A crash can leave a temporary file behind; cleanStrayTemps()
 * (./temp-files.ts) removes those at the next start. Plain Node: no Electron, so the CLI can use it too.
 */
import * as nodeFs from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { tempNameFor } from './temp-files.ts';

/** The file-system calls used, so tests can inject a fault at each step. */
export interface FsOps {
  open: typeof nodeFs.open;
  rename: typeof nodeFs.rename;
  link: typeof nodeFs.link;
  copyFile: typeof nodeFs.copyFile;
  unlink: typeof nodeFs.unlink;
  stat: typeof nodeFs.stat;
}
const realFs: FsOps = { open: nodeFs.open, rename: nodeFs.rename, link: nodeFs.link, copyFile: nodeFs.copyFile, unlink: nodeFs.unlink, stat: nodeFs.stat };

export type AtomicStep = 'check' | 'write-temp' | 'sync-temp' | 'backup' | 'replace' | 'sync-folder';

export class AtomicWriteError extends Error {
  override name = 'AtomicWriteError';
  constructor(readonly step: AtomicStep, readonly path: string, override readonly cause: NodeJS.ErrnoException) {
    super(step === 'check'
      ? `${path} is read-only, so it was not replaced and is unchanged. Save your version under another name (Save As in the app, another --out on the command line), or make the file writable first.`
      : `${describeStep(step)} ${path} failed: ${explainErrno(cause)}. ${step === 'sync-folder' ? 'The new version is in place but may not survive a power cut.' : 'The file on disk was not changed.'}`);
  }
  get errno(): string | undefined { return this.cause.code; }
}

function describeStep(step: AtomicStep): string {
  return { check: 'Checking', 'write-temp': 'Writing a temporary copy next to', 'sync-temp': 'Flushing the temporary copy of', backup: 'Keeping the previous version of', replace: 'Replacing', 'sync-folder': 'Flushing the folder of' }[step];
}

/** Words a user can act on for the errno values a save meets in practice. */
export function explainErrno(e: NodeJS.ErrnoException): string {
  switch (e.code) {
    case 'ENOSPC': return 'the disk is full (free some space and save again)';
    case 'EDQUOT': return 'the disk quota is used up';
    case 'EACCES': case 'EPERM': return 'permission denied (the folder or file is read-only, or another program holds it; choose Save As to put it elsewhere)';
    case 'EBUSY': return 'the file is locked by another program (an antivirus scan or a sync client, perhaps); try again';
    case 'EROFS': return 'the disk is read-only';
    case 'ENOENT': return 'the folder does not exist (any more)';
    case 'ENAMETOOLONG': return 'the path is too long';
    case 'EISDIR': return 'a folder has that name';
    case 'ENOTDIR': return 'a part of the path is a file, not a folder';
    case 'EEXIST': return 'something with that name is already there';
    case 'ELOOP': return 'the path is a loop of symbolic links';
    case 'EIO': return 'the disk reported an input/output error';
    case 'EMFILE': case 'ENFILE': return 'too many files are open; close some programs and try again';
    case 'EXDEV': return 'the file and its folder are on different disks';
    case 'ETXTBSY': return 'the file is in use by a running program';
    case 'EFBIG': return 'the file is larger than the disk allows';
    // Never a bare code: Node's messages start with it ("ENOTEMPTY: directory not empty, ..."); keep the words.
    default: return (e.message || 'the system refused').replace(/^E[A-Z0-9]+:\s*/, '').replace(/,\s*\w+\s+'[^']*'(\s*->\s*'[^']*')?$/, '');
  }
}

export interface AtomicWriteOptions {
  /** Keep the replaced version as `<path>.bak` (default false). */
  backup?: boolean;
  /** File mode of a new file (an existing file's mode is kept). */
  mode?: number;
  fs?: FsOps;
  /** Windows: rename over a file held by an indexer or antivirus fails with EPERM/EACCES/EBUSY for a moment. */
  renameRetries?: number;
  /** The platform whose rules apply (tests); default process.platform. */
  platform?: NodeJS.Platform;
}

export interface AtomicWriteResult { path: string; backupPath: string | null; bytes: number }

export const backupPathOf = (path: string): string => `${path}.bak`;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function renameWithRetry(fs: FsOps, from: string, to: string, retries: number, platform: NodeJS.Platform): Promise<void> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await fs.rename(from, to);
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      const transient = platform === 'win32' && (code === 'EPERM' || code === 'EACCES' || code === 'EBUSY');
      if (!transient || attempt >= retries) throw err;
      await sleep(Math.min(50 * 2 ** attempt, 1000));
    }
  }
}

async function syncFolder(fs: FsOps, folder: string, platform: NodeJS.Platform): Promise<void> {
  if (platform === 'win32') return; // folders cannot be opened for fsync there
  const fd = await fs.open(folder, 'r');
  try {
    await fd.sync();
  } catch (err) {
    // Some file systems (certain network and FUSE mounts) refuse fsync on a folder; the rename is still atomic.
    if (!['EINVAL', 'ENOTSUP', 'EISDIR', 'EBADF'].includes((err as NodeJS.ErrnoException).code ?? '')) throw err;
  } finally {
    await fd.close();
  }
}

/**
 * Whether the user may change the file itself: the OS says so (access W_OK) and the file is not marked read-only
 * for everyone (no write bit at all; also what Windows' read-only attribute shows as). The second test matters for
 * an administrator, whom the OS lets write anything.
 */
async function userMayWrite(path: string, mode: number): Promise<boolean> {
  if ((mode & 0o222) === 0) return false;
  return nodeFs.access(path, nodeFs.constants.W_OK).then(() => true, () => false);
}

export async function atomicWriteFile(givenPath: string, data: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<AtomicWriteResult> {
  const fs = options.fs ?? realFs;
  const platform = options.platform ?? process.platform;
  // Save through a symlink to the file it points at: renaming over the link itself would replace it with a copy.
  const path = await nodeFs.realpath(givenPath).catch(() => givenPath);
  const folder = dirname(path);
  const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
  const temp = join(folder, tempNameFor(basename(path)));
  let step: AtomicStep = 'write-temp';
  let tempExists = false;
  let bakTemp: string | null = null;
  try {
    const existing = await fs.stat(path).catch((e: NodeJS.ErrnoException) => { if (e.code === 'ENOENT') return null; throw e; });
    if (existing && !existing.isFile()) throw Object.assign(new Error(`${path} is not a regular file`), { code: 'EISDIR' });
    // A rename replaces a file whatever its permissions (only the folder's count), so a read-only file would be
    // silently swapped for a writable copy with our owner. Refuse it instead: the user marked it so on purpose.
    if (existing && !(await userMayWrite(path, existing.mode))) {
      step = 'check';
      throw Object.assign(new Error(`${path} is read-only`), { code: 'EACCES' });
    }
    const fd = await fs.open(temp, 'wx', existing ? existing.mode & 0o777 : (options.mode ?? 0o644));
    tempExists = true;
    try {
      let off = 0;
      while (off < bytes.length) {
        const { bytesWritten } = await fd.write(bytes, off, bytes.length - off);
        off += bytesWritten;
      }
      step = 'sync-temp';
      await fd.sync();
    } finally {
      await fd.close();
    }
    let backupPath: string | null = null;
    if (options.backup && existing) {
      step = 'backup';
      backupPath = backupPathOf(path);
      bakTemp = join(folder, tempNameFor(basename(backupPath)));
      try {
        await fs.link(path, bakTemp);
      } catch (e) {
        const code = (e as NodeJS.ErrnoException).code;
        if (!['EPERM', 'ENOTSUP', 'EXDEV', 'EMLINK', 'ENOSYS', 'EOPNOTSUPP'].includes(code ?? '')) throw e;
        await fs.copyFile(path, bakTemp);
        const bfd = await fs.open(bakTemp, 'r+');
        try { await bfd.sync(); } finally { await bfd.close(); }
      }
      await renameWithRetry(fs, bakTemp, backupPath, options.renameRetries ?? 8, platform);
      bakTemp = null;
    }
    step = 'replace';
    await renameWithRetry(fs, temp, path, options.renameRetries ?? 8, platform);
    tempExists = false;
    step = 'sync-folder';
    await syncFolder(fs, folder, platform);
    return { path, backupPath, bytes: bytes.length };
  } catch (err) {
    if (tempExists) await fs.unlink(temp).catch(() => {});
    if (bakTemp) await fs.unlink(bakTemp).catch(() => {});
    // After 'replace' the new file is in place and only its durability across a power cut is unconfirmed; still an
    // error, so the caller does not claim a save it cannot vouch for.
    throw new AtomicWriteError(step, path, err as NodeJS.ErrnoException);
  }
}
