/**
 * File output for every CLI command: one atomic writer, the desktop shell's (electron/files/atomic-write.ts,
 * plain Node, no Electron): temporary file in the same folder, fsync, rename, fsync the folder. A crash never
 * leaves half a file, and a failure leaves the previous file untouched.
 */
import { AtomicWriteError, atomicWriteFile } from '../electron/files/atomic-write.ts';

/** A write that failed, with a message that names the file and the reason. */
export class OutputError extends Error {
  override name = 'OutputError';
}

export async function writeOutputFile(path: string, text: string): Promise<void> {
  try {
    await atomicWriteFile(path, text);
  } catch (e) {
    const reason = e instanceof AtomicWriteError ? e.message : (e as Error).message;
    throw new OutputError(`could not write ${path}: ${reason}`);
  }
}
