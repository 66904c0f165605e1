/**
 * Reading a design file from disk with the checks of reliability.md §3.1 steps 1–2: stat first (refuse a folder
 * or a file over the size limit before reading it), then decode (electron/text-decode.ts). Answers a result
 * object so the main process can hand it to the renderer unchanged.
 */
import { readFile, stat } from 'node:fs/promises';
import { basename } from 'node:path';
import { fail, ok, type BridgeResult, type OpenedDesign } from '../contract.ts';
import { checkDesignSize, decodeDesignBytes } from '../text-decode.ts';
import { explainErrno } from './atomic-write.ts';

export async function readDesignFile(path: string): Promise<BridgeResult<OpenedDesign>> {
  const name = basename(path);
  let info;
  try {
    info = await stat(path);
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    return err.code === 'ENOENT' ? fail('not-found', `${path} does not exist (any more); it may have been moved or deleted.`) : fail('io', `cannot open ${path}: ${explainErrno(err)}.`);
  }
  if (!info.isFile()) return fail('bad-request', `${path} is not a file; expected a .stripwright or .json design file.`);
  const size = checkDesignSize(name, info.size);
  if (!size.ok) return size;
  let bytes: Buffer;
  try { bytes = await readFile(path); } catch (e) { return fail('io', `cannot read ${path}: ${explainErrno(e as NodeJS.ErrnoException)}.`); }
  const text = decodeDesignBytes(name, bytes);
  if (!text.ok) return text;
  return ok({ path, name, text: text.value, modifiedMs: info.mtimeMs });
}
