/**
 * Turning the bytes of a design file into text, with the checks of reliability.md §3.1 steps 1–2 (size first,
 * then UTF-8 with the BOM removed, refusing UTF-16, invalid UTF-8 and NUL bytes). Pure (TextDecoder only), so the
 * main process and the browser fallback refuse the same files with the same words. Parsing and schema checks of
 * the design itself belong to core/design.
 */
import { fail, LIMITS, ok, type BridgeResult } from './contract.ts';

export function describeBytes(n: number): string {
  if (n < 1024) return `${n} bytes`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KiB`;
  return `${(n / 1024 / 1024).toFixed(1)} MiB`;
}

/** Refuse a file before reading it when its size is already known to be over the limit. */
export function checkDesignSize(name: string, bytes: number): BridgeResult<null> {
  if (bytes > LIMITS.designBytes) {
    return fail('too-large', `${name} is ${describeBytes(bytes)}; a design file may be at most ${describeBytes(LIMITS.designBytes)}. Is it really a Stripwright design?`);
  }
  return ok(null);
}

export function decodeDesignBytes(name: string, bytes: Uint8Array): BridgeResult<string> {
  const size = checkDesignSize(name, bytes.length);
  if (!size.ok) return size;
  if (bytes.length === 0) return fail('not-text', `${name} is empty; expected the JSON text of a design.`);
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) {
    return fail('not-text', `${name} is UTF-16 text; expected UTF-8. Re-save it as UTF-8 in a text editor.`);
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    return fail('not-text', `${name} is not UTF-8 text (it looks binary); expected the JSON text of a design.`);
  }
  const nul = text.indexOf('\u0000');
  if (nul >= 0) return fail('not-text', `${name} contains a NUL byte at character ${nul}; expected plain JSON text (the file may be damaged or binary).`);
  return ok(text);
}
