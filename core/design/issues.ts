/**
 * Problems found in a design file, as data. Every issue names where (a path such as `segments[3].width.z0`, or
 * `file` for the text as a whole), what was expected and what was found, so a face can list them all at once.
 */
import type { ErrorCode } from '../util/errors.ts';
import { describe } from '../util/errors.ts';

export interface DesignIssue {
  code: ErrorCode;
  /** Path of the field, e.g. `nodes[2].at.x`; `file` for problems of the text itself. */
  path: string;
  expected: string;
  found: string;
  /** How to fix it, in words (also the end of `message`). */
  fix?: string;
  /** The whole sentence to show: `path: expected …, found …, fix: …`. */
  message: string;
  /** 1-based position in the text, for syntax problems. */
  line?: number;
  column?: number;
}

export function issue(code: ErrorCode, path: string, expected: string, found: string, extra: Partial<DesignIssue> = {}): DesignIssue {
  const where = extra.line !== undefined ? ` (line ${extra.line}, column ${extra.column ?? 1})` : '';
  const fix = extra.fix ? `, fix: ${extra.fix}` : '';
  return { code, path, expected, found, message: `${path}: expected ${expected}, found ${found}${where}${fix}`, ...extra };
}

/** Path text from valibot-style keys: ['segments', 3, 'width'] → `segments[3].width`. */
export function pathText(keys: readonly (string | number)[]): string {
  let s = '';
  for (const k of keys) {
    if (typeof k === 'number') s += `[${k}]`;
    else if (/^[A-Za-z_$][\w$]*$/.test(k)) s += s ? `.${k}` : k;
    else s += `[${JSON.stringify(k)}]`;
  }
  return s || 'file';
}

/** What was found, for a message: numbers and short strings as written, otherwise the kind of value. */
export function found(value: unknown): string {
  return describe(value);
}
