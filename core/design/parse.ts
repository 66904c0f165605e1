/**
 * Loading a design file from its text, in the project's own order: size, decoding, syntax
 * (with line and column), unsafe keys and nesting, the envelope (format id, version), list sizes, migration,
 * defaults for sections a hand-written file left out (fill-defaults.ts), schema, cross-record checks. Each step stops with its own clear problem list; nothing half-loaded is returned.
 * Never throws for any text: every failure is `{ ok: false, errors }`.
 */
import type { Warning } from '../util/warnings.ts';
import { describe } from '../util/errors.ts';
import type { DesignDoc } from './types.ts';
import { DESIGN_FORMAT } from './types.ts';
import { DESIGN_LIMITS, formatBytes, utf8Length } from './limits.ts';
import { scanJson } from './json-scan.ts';
import { DESIGN_VERSION, MIGRATIONS, migrate } from './migrations.ts';
import { validateDesign, type ValidateOptions } from './validate.ts';
import { issue, type DesignIssue } from './issues.ts';
import { fillDefaults } from './fill-defaults.ts';

export type ParseResult =
  | { ok: true; doc: DesignDoc; warnings: Warning[]; migratedFrom?: number; /** `from` of each migration run */ migrations?: number[] }
  | { ok: false; errors: DesignIssue[] };

const fail = (...errors: DesignIssue[]): ParseResult => ({ ok: false, errors });

/**
 * Reads a design file. Older versions are migrated (see `migratedFrom`); a newer one is refused.
 *
 * @example
 * const r = parseDesign(text);
 * if (r.ok) editor.open(r.doc); else showProblems(r.errors);
 */
export function parseDesign(text: string, opts: ValidateOptions = {}): ParseResult {
  try {
    return parseInner(text, opts);
  } catch (e) {
    // Defence in depth: a bug in a check must not escape as an exception the face cannot read.
    return fail(issue('bad-file', 'file', 'a design file the app can read', `an internal error while reading it (${e instanceof Error ? e.message : String(e)})`, { fix: 'the file was not changed; keep it and report the problem' }));
  }
}

function parseInner(text: string, opts: ValidateOptions): ParseResult {
  if (typeof text !== 'string') return fail(issue('bad-file', 'file', 'the text of a design file', describe(text), { fix: 'open a design file' }));
  const warnings: Warning[] = [];
  // 1. Size, before any work proportional to it. text.length ≤ bytes ≤ 3·text.length for UTF-8.
  if (text.length > DESIGN_LIMITS.fileBytes || (text.length * 3 > DESIGN_LIMITS.fileBytes && utf8Length(text) > DESIGN_LIMITS.fileBytes)) {
    return fail(issue('bad-file', 'file', `a design file of at most ${formatBytes(DESIGN_LIMITS.fileBytes)}`, formatBytes(utf8Length(text)), { fix: 'open the design file itself: this one is far larger than a design' }));
  }
  // 2. Decoding: a byte-order mark is harmless; NULs mean binary or UTF-16 read as UTF-8.
  if (text.charCodeAt(0) === 0xfeff) {
    text = text.slice(1);
    warnings.push({ code: 'note', severity: 'info', message: 'The file starts with a byte-order mark; it was ignored and is not written back.', source: 'design-file' });
  }
  if (text.trim() === '') return fail(issue('bad-file', 'file', 'a Stripwright design (JSON text starting with {)', text.length === 0 ? 'an empty file' : 'only blank space', { fix: 'open the design file itself, or its backup copy' }));
  const nul = text.indexOf('\u0000');
  if (nul >= 0) {
    // UTF-16 read as UTF-8 puts a NUL beside every ASCII character near the start (after a mangled BOM).
    const utf16 = [0, 1, 2, 3].some((k) => text.charCodeAt(k) === 0);
    return fail(issue('bad-file', 'file', 'UTF-8 text', utf16 ? 'UTF-16 text or binary data (NUL bytes)' : 'binary data (NUL bytes): this is not a design file', { line: lineOf(text, nul), column: 1, fix: utf16 ? 'save the file as UTF-8' : 'open a design file' }));
  }
  // 3–5. Syntax, unsafe keys, depth and list sizes, with line and column.
  const scan = scanJson(text);
  if (scan) {
    const e = issue('bad-file', 'file', scan.expected, scan.found, { line: scan.line, column: scan.column, fix: 'correct the text there, or open the backup copy' });
    if (scan.truncated) e.message = `file: expected ${scan.expected}, found the end of the text at line ${scan.line}, column ${scan.column} (it looks cut short; nothing was loaded), fix: open the backup copy or a recovery snapshot`;
    return fail(e);
  }
  const raw: unknown = JSON.parse(text);
  // 6. The envelope.
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    return fail(issue('bad-file', 'file', `a JSON object with "format": "${DESIGN_FORMAT}"`, describe(raw), { fix: 'open a Stripwright design file' }));
  }
  const top = raw as Record<string, unknown>;
  if (top.format !== DESIGN_FORMAT) {
    return fail(issue('bad-file', 'format', `"${DESIGN_FORMAT}" (this file is not a Stripwright design)`, top.format === undefined ? 'nothing (the field is missing)' : describe(top.format), { fix: 'open a Stripwright design file' }));
  }
  const ver = top.version;
  if (typeof ver !== 'number' || !Number.isInteger(ver) || ver < 1) {
    return fail(issue('bad-file', 'version', `a whole format number from 1 to ${DESIGN_VERSION}`, ver === undefined ? 'nothing (the field is missing)' : describe(ver), { fix: 'set "version" to the format the file was written in' }));
  }
  if (ver > DESIGN_VERSION) {
    return fail(issue('unsupported-version', 'version', `format ${DESIGN_VERSION} or older (the format this version reads)`, `${ver} (made by a newer Stripwright)`, { fix: 'update the app' }));
  }
  // List sizes, before the schema walks them.
  const counted: [string, number][] = [['nodes', DESIGN_LIMITS.nodes], ['segments', DESIGN_LIMITS.segments], ['areas', DESIGN_LIMITS.areas], ['phaseGroups', DESIGN_LIMITS.phaseGroups]];
  const big = counted.filter(([k, max]) => Array.isArray(top[k]) && (top[k] as unknown[]).length > max)
    .map(([k, max]) => issue('bad-file', k, `at most ${max} ${k === 'phaseGroups' ? 'phase groups' : k}`, String((top[k] as unknown[]).length), { fix: 'split the design into smaller ones' }));
  if (big.length) return fail(...big);
  // 7. Migration.
  let doc: Record<string, unknown> = top;
  let applied: number[] = [];
  if (ver < DESIGN_VERSION) {
    const m = migrate(top, ver);
    doc = m.doc;
    applied = m.applied;
    const what = MIGRATIONS.filter((x) => applied.includes(x.from)).map((x) => `${x.from}→${x.from + 1}: ${x.summary}`).join('; ');
    warnings.push({ code: 'note', severity: 'info', message: `This file was written in format ${ver} and was upgraded to format ${DESIGN_VERSION} (${what}). Saving writes format ${DESIGN_VERSION}; keep the original if an older copy of the app still needs it.`, source: 'design-migration' });
  }
  // 8. Sections a hand-written file may leave out get their documented defaults; headings with a unit become radians.
  const filled = fillDefaults(doc);
  if (filled.errors.length) return fail(...filled.errors);
  doc = filled.doc;
  warnings.push(...filled.warnings);
  // 9–10. Schema and cross-record checks.
  const r = validateDesign(doc, opts);
  if (!r.ok) return r;
  warnings.push(...r.warnings);
  return applied.length ? { ok: true, doc: r.doc, warnings, migratedFrom: ver, migrations: applied } : { ok: true, doc: r.doc, warnings };
}

function lineOf(text: string, offset: number): number {
  let line = 1;
  for (let k = 0; k < offset; k++) if (text.charCodeAt(k) === 0x0a) line++;
  return line;
}
