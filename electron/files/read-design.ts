/**
 * The one reader of text files for every face with a file system (the desktop shell and the CLI), with the project's own
 * first two loading checks: refuse what is not a regular file (a folder, a device, a pipe) and a file over
 * its kind's size limit before reading it, read at most the limit (a file that grows while being read is refused
 * too), then decode (bridge/text-decode.ts, shared with the browser). Answers a result object so the main process
 * can hand it to the renderer unchanged and the CLI can print its message.
 */
import { constants } from 'node:fs';
import { open, type FileHandle } from 'node:fs/promises';
import { createHash } from 'node:crypto';
import { basename } from 'node:path';
import { fail, ok, type BridgeResult, type OpenedData, type OpenedDesign } from '../../bridge/contract.ts';
import { checkTextSize, decodeTextBytes, DESIGN_TEXT, TOUCHSTONE_TEXT, type TextFileKind } from '../../bridge/text-decode.ts';

export async function readDesignFile(path: string): Promise<BridgeResult<OpenedDesign & { sha256: string }>> {
  return readTextFile(path, DESIGN_TEXT, 'a .stripwright or .json design file');
}

/** A Touchstone file for a measured block, with the same checks (its own size limit and wording). */
export async function readTouchstoneFile(path: string): Promise<BridgeResult<OpenedData>> {
  const r = await readTextFile(path, TOUCHSTONE_TEXT, 'a Touchstone file (.s1p, .s2p or .ts)');
  return r.ok ? ok({ name: r.value.name, text: r.value.text }) : r;
}

/** Words for the errno values met when reading a file (never the bare code). */
export function explainReadErrno(e: NodeJS.ErrnoException): string {
  switch (e.code) {
    case 'ENOENT': return 'there is no such file (check the name and the folder)';
    case 'ENOTDIR': return 'a part of the path is a file, not a folder';
    case 'EISDIR': return 'it is a folder, not a file';
    case 'EACCES': case 'EPERM': return 'permission denied (you may not read it)';
    case 'ELOOP': return 'it is a loop of symbolic links';
    case 'ENAMETOOLONG': return 'the path is too long';
    case 'EMFILE': case 'ENFILE': return 'too many files are open; close some programs and try again';
    case 'EIO': return 'the disk reported a read error';
    case 'EAGAIN': case 'EWOULDBLOCK': return 'it is a pipe or device with nothing to read';
    case 'ENXIO': case 'ENODEV': return 'it is a device, not a file';
    default: return (e.message || 'the system refused').replace(/^E[A-Z]+:\s*/, '');
  }
}

/** SHA-256 of bytes, hex: how the shell recognises the content it read or wrote (a change that keeps the time). */
export const sha256Hex = (bytes: Uint8Array): string => createHash('sha256').update(bytes).digest('hex');

/**
 * Reads a text file of `kind`: the path itself, its file name, the decoded text, its modification time and the
 * SHA-256 of its bytes, or a result error whose message says what was wrong in words.
 */
export async function readTextFile(path: string, kind: TextFileKind, expected: string): Promise<BridgeResult<OpenedDesign & { sha256: string }>> {
  const name = basename(path);
  let fh: FileHandle;
  try {
    // Non-blocking, so a named pipe without a writer cannot stop us at open; it is refused below as not a file.
    fh = await open(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    if (err.code === 'ENOENT') return fail('not-found', `${path} does not exist (any more); it may have been moved or deleted.`);
    if (err.code === 'EISDIR') return fail('bad-request', `${path} is a folder, not a file; expected ${expected}.`);
    return fail('io', `cannot open ${path}: ${explainReadErrno(err)}.`);
  }
  try {
    const info = await fh.stat();
    if (!info.isFile()) return fail('bad-request', `${path} is not a file (${info.isDirectory() ? 'a folder' : 'a device, pipe or socket'}); expected ${expected}.`);
    const size = checkTextSize(kind, name, info.size);
    if (!size.ok) return size;
    const bytes = await readAtMost(fh, info.size, kind.maxBytes);
    if (bytes.length > kind.maxBytes) {
      return fail('too-large', `${name} grew past ${kind.maxBytes} bytes while it was read; ${kind.noun} may be at most that. Is another program still writing it?`);
    }
    const text = decodeTextBytes(kind, name, bytes);
    if (!text.ok) return text;
    return ok({ path, name, text: text.value, modifiedMs: info.mtimeMs, sha256: sha256Hex(bytes) });
  } catch (e) {
    return fail('io', `cannot read ${path}: ${explainReadErrno(e as NodeJS.ErrnoException)}.`);
  } finally {
    await fh.close().catch(() => {});
  }
}

/** Up to `max + 1` bytes (one more than allowed tells a file that grew), starting with a buffer of the stat size. */
async function readAtMost(fh: FileHandle, sizeHint: number, max: number): Promise<Uint8Array> {
  let buf = Buffer.allocUnsafe(Math.min(max + 1, Math.max(sizeHint + 1, 4096)));
  let used = 0;
  for (;;) {
    if (used === buf.length) {
      if (buf.length > max) break;
      const bigger = Buffer.allocUnsafe(Math.min(max + 1, buf.length * 2));
      buf.copy(bigger, 0, 0, used);
      buf = bigger;
    }
    const { bytesRead } = await fh.read(buf, used, buf.length - used, null);
    if (bytesRead === 0) break;
    used += bytesRead;
  }
  return buf.subarray(0, used);
}
