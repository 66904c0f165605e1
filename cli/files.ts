/**
 * File output for every CLI command: one atomic writer, the desktop shell's (electron/files/atomic-write.ts,
 * plain Node, no Electron): temporary file in the same folder, fsync, rename, fsync the folder. A crash never
 * leaves half a file, and a failure leaves the previous file untouched.
 */
import { AtomicWriteError, atomicWriteFile } from '../electron/files/atomic-write.ts';
import { readTextFile } from '../electron/files/read-design.ts';
import { DESIGN_TEXT, type TextFileKind } from '../bridge/text-decode.ts';

/** A write that failed, with a message that names the file and the reason. */
export class OutputError extends Error {
  override name = 'OutputError';
}

export async function writeOutputFile(path: string, text: string | Uint8Array): Promise<void> {
  try {
    await atomicWriteFile(path, text);
  } catch (e) {
    const reason = e instanceof AtomicWriteError ? e.message : (e as Error).message;
    throw new OutputError(`could not write ${path}: ${reason}`);
  }
}

/**
 * Input files of every command go through the desktop shell's one text reader (electron/files/read-design.ts):
 * not a regular file (a folder, a device, a pipe) or over the kind's limit is refused before reading, at most the
 * limit is read, and invalid UTF-8, UTF-16 and NUL bytes are refused with the same words as in the app.
 */
export async function readInputText(file: string, shown: string, kind: TextFileKind, expected: string): Promise<{ ok: true; text: string } | { ok: false; message: string }> {
  const r = await readTextFile(file, kind, expected);
  if (r.ok) return { ok: true, text: r.value.text };
  if (r.error.code === 'not-found') return { ok: false, message: `cannot read ${shown}: no such file (check the name and the folder)` };
  return { ok: false, message: r.error.message };
}

const MIB = 1024 * 1024;
/** A Touchstone file given to `sweep` (a 1001-point 65-port file is about 200 MB in RI at full precision). */
export const TOUCHSTONE_INPUT: TextFileKind = {
  noun: 'a Touchstone file', content: 'Touchstone text (an option line and data)', plain: 'plain Touchstone text', maxBytes: 512 * MIB,
  tooLargeHint: ' Is it the right file?',
};
/** A batch table for `line --batch`. */
export const CSV_INPUT: TextFileKind = {
  noun: 'a batch CSV file', content: 'CSV text with a header row', plain: 'plain CSV text', maxBytes: 20 * MIB,
};
/** A command list for `edit` (design commands as JSON data). */
export const COMMANDS_INPUT: TextFileKind = {
  noun: 'a command list', content: 'the JSON text of design commands', plain: 'plain JSON text', maxBytes: 20 * MIB,
};
export { DESIGN_TEXT };
