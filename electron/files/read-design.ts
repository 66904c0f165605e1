/**
 * Reading a design file (or a Touchstone file for a measured block) from disk with the checks of reliability.md §3.1 steps 1–2: stat first (refuse a folder
 * or a file over the size limit before reading it), then decode (electron/text-decode.ts). Answers a result
 * object so the main process can hand it to the renderer unchanged.
 */
import { readFile, stat } from 'node:fs/promises';
import { basename } from 'node:path';
import { fail, ok, type BridgeResult, type OpenedData, type OpenedDesign } from '../contract.ts';
import { checkTextSize, decodeTextBytes, DESIGN_TEXT, TOUCHSTONE_TEXT, type TextFileKind } from '../text-decode.ts';
import { explainErrno } from './atomic-write.ts';

export async function readDesignFile(path: string): Promise<BridgeResult<OpenedDesign>> {
  return readTextFile(path, DESIGN_TEXT, 'a .stripwright or .json design file');
}

/** A Touchstone file for a measured block, with the same checks (its own size limit and wording). */
export async function readTouchstoneFile(path: string): Promise<BridgeResult<OpenedData>> {
  const r = await readTextFile(path, TOUCHSTONE_TEXT, 'a Touchstone file (.s1p, .s2p or .ts)');
  return r.ok ? ok({ name: r.value.name, text: r.value.text }) : r;
}

async function readTextFile(path: string, kind: TextFileKind, expected: string): Promise<BridgeResult<OpenedDesign>> {
  const name = basename(path);
  let info;
  try {
    info = await stat(path);
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    return err.code === 'ENOENT' ? fail('not-found', `${path} does not exist (any more); it may have been moved or deleted.`) : fail('io', `cannot open ${path}: ${explainErrno(err)}.`);
  }
  if (!info.isFile()) return fail('bad-request', `${path} is not a file; expected ${expected}.`);
  const size = checkTextSize(kind, name, info.size);
  if (!size.ok) return size;
  let bytes: Buffer;
  try { bytes = await readFile(path); } catch (e) { return fail('io', `cannot read ${path}: ${explainErrno(e as NodeJS.ErrnoException)}.`); }
  const text = decodeTextBytes(kind, name, bytes);
  if (!text.ok) return text;
  return ok({ path, name, text: text.value, modifiedMs: info.mtimeMs });
}
