/**
 * Turning the bytes of a text file the app reads (a design, a Touchstone file) into text, with the checks of
 * the project's own loading rule, steps 1–2 (size first, then UTF-8 with the BOM removed, refusing UTF-16, invalid UTF-8 and NUL bytes). Pure (TextDecoder only), so the
 * main process and the browser fallback refuse the same files with the same words. Parsing and schema checks of
 * the design itself belong to core/design.
 */
import { fail, LIMITS, ok, type BridgeResult } from './contract.ts';

export function describeBytes(n: number): string {
  if (n < 1024) return `${n} bytes`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KiB`;
  return `${(n / 1024 / 1024).toFixed(1)} MiB`;
}

/** A kind of text file the app reads: its name in messages, what its text should be, and its size limit. */
export interface TextFileKind {
  /** 'a design file' */
  noun: string;
  /** 'the JSON text of a design' */
  content: string;
  /** 'plain JSON text' */
  plain: string;
  maxBytes: number;
  /** Added to the too-large message. */
  tooLargeHint?: string;
}

export const DESIGN_TEXT: TextFileKind = {
  noun: 'a design file', content: 'the JSON text of a design', plain: 'plain JSON text', maxBytes: LIMITS.designBytes,
  tooLargeHint: ' Is it really a Stripwright design?',
};
export const TOUCHSTONE_TEXT: TextFileKind = {
  noun: 'a Touchstone file', content: 'Touchstone text (an option line and data)', plain: 'plain Touchstone text', maxBytes: LIMITS.touchstoneBytes,
};

/** Refuse a file before reading it when its size is already known to be over the limit. */
export function checkTextSize(kind: TextFileKind, name: string, bytes: number): BridgeResult<null> {
  if (bytes > kind.maxBytes) {
    return fail('too-large', `${name} is ${describeBytes(bytes)}; ${kind.noun} may be at most ${describeBytes(kind.maxBytes)}.${kind.tooLargeHint ?? ''}`);
  }
  return ok(null);
}

/** UTF-8 text of a file of `kind`, or the reason it is not (too large, empty, UTF-16, binary, NUL bytes). */
export function decodeTextBytes(kind: TextFileKind, name: string, bytes: Uint8Array): BridgeResult<string> {
  const size = checkTextSize(kind, name, bytes.length);
  if (!size.ok) return size;
  if (bytes.length === 0) return fail('not-text', `${name} is empty; expected ${kind.content}.`);
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) {
    return fail('not-text', `${name} is UTF-16 text; expected UTF-8. Re-save it as UTF-8 in a text editor.`);
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    return fail('not-text', `${name} is not UTF-8 text (it looks binary); expected ${kind.content}.`);
  }
  const nul = text.indexOf('\u0000');
  if (nul >= 0) return fail('not-text', `${name} contains a NUL byte at character ${nul}; expected ${kind.plain} (the file may be damaged or binary).`);
  return ok(text);
}
