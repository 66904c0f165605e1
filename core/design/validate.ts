/**
 * Validation of an in-memory design of the current version: the schema (every problem, up to a cap), then the
 * cross-record checks. parseDesign runs it after migration; faces can run it on a document they built.
 */
import * as v from 'valibot';
import type { Warning } from '../util/warnings.ts';
import type { DesignDoc } from './types.ts';
import { designSchema } from './schema.ts';
import { crossCheck } from './crossref.ts';
import { DESIGN_VERSION } from './migrations.ts';
import { DESIGN_LIMITS } from './limits.ts';
import { issue, pathText, type DesignIssue } from './issues.ts';
import { schemaWords } from './schema-words.ts';

export type ValidateResult = { ok: true; doc: DesignDoc; warnings: Warning[] } | { ok: false; errors: DesignIssue[] };

export interface ValidateOptions {
  /** Treat an unfinished network (a node with fewer segments than its kind needs) as an error. */
  complete?: boolean;
}

const SCHEMA = designSchema(DESIGN_VERSION);

/**
 * Checks `doc` against the current format. On success `doc` in the result is a fresh copy holding every field,
 * known and unknown.
 *
 * @example
 * const r = validateDesign(newDesign());
 * if (!r.ok) console.log(r.errors.map((e) => e.message).join('\n'));
 */
export function validateDesign(doc: unknown, opts: ValidateOptions = {}): ValidateResult {
  const r = v.safeParse(SCHEMA, doc, { abortEarly: false });
  if (!r.success) return { ok: false, errors: capIssues(r.issues.map(toIssue)) };
  const out = r.output as unknown as DesignDoc;
  const cross = crossCheck(out, opts);
  if (cross.errors.length > 0) return { ok: false, errors: capIssues(cross.errors) };
  return { ok: true, doc: out, warnings: cross.warnings };
}

function toIssue(i: v.BaseIssue<unknown>): DesignIssue {
  const w = schemaWords(SCHEMA, i);
  return issue('invalid-design', pathText(w.keys), w.expected, w.found, { fix: w.fix });
}

/** Keeps the first DESIGN_LIMITS.issues problems and counts the rest in one closing line. */
export function capIssues(list: DesignIssue[]): DesignIssue[] {
  if (list.length <= DESIGN_LIMITS.issues) return list;
  const more = list.length - DESIGN_LIMITS.issues;
  const kept = list.slice(0, DESIGN_LIMITS.issues);
  kept.push({ code: 'invalid-design', path: 'file', expected: 'fewer problems', found: `${more} more`, fix: 'fix the ones above first', message: `file: expected fewer problems, found ${more} more not listed, fix: fix the ones above first` });
  return kept;
}
