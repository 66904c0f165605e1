/**
 * Schema problems in the user's words: field, what was expected, what was found, how to fix it. The validation
 * library words some problems itself ("Invalid key: Expected "id" but received undefined" for a missing field, or
 * the message of the enclosing object); none of its wording reaches the user. A missing field is described by the
 * field's own schema, found by walking the schema along the problem's path.
 */
import type * as v from 'valibot';
import { found as describeFound, pathText } from './issues.ts';

/** A schema problem worded for the user; `keys` is the path of the field. */
export interface SchemaWords { keys: (string | number)[]; expected: string; found: string; fix: string; missing: boolean }

type AnySchema = { type?: string; kind?: string; message?: unknown; pipe?: AnySchema[]; wrapped?: AnySchema; entries?: Record<string, AnySchema>;
  item?: AnySchema; options?: AnySchema[]; key?: string; literal?: unknown };

/** The schema itself behind optional/nullable wrappers (a pipe keeps its first schema's fields). */
function unwrap(s: AnySchema | undefined): AnySchema | undefined {
  let x = s;
  for (let guard = 0; x && x.wrapped && guard < 8; guard++) x = x.wrapped;
  return x;
}

/** The schema that checks the field at `issue.path`, choosing variant options by the record's own discriminator. */
function schemaAt(root: AnySchema, issue: v.BaseIssue<unknown>): AnySchema | undefined {
  let s = unwrap(root);
  for (const item of issue.path ?? []) {
    if (!s) return undefined;
    // The discriminator itself (a record without its "kind"): the variant says which kinds there are.
    if (s.type === 'variant' && item.key === s.key) return s;
    if (s.type === 'variant' && s.options && s.key) {
      const record = item.input as Record<string, unknown> | undefined;
      const tag = record && typeof record === 'object' ? record[s.key] : undefined;
      s = unwrap(s.options.find((o) => unwrap(o.entries?.[s!.key!])?.literal === tag));
      if (!s) return undefined;
    }
    if (s.entries) s = unwrap(s.entries[String(item.key)]);
    else if (s.item) s = unwrap(s.item);
    else return undefined;
  }
  return s;
}

/** What a schema accepts, in its own words. */
function words(s: AnySchema | undefined): string | undefined {
  if (!s) return undefined;
  if (typeof s.message === 'string') return s.message;
  if (s.type === 'literal') return JSON.stringify(s.literal);
  return undefined;
}

/** How to fix a problem of this kind (the library's issue type). */
function fixFor(type: string, missing: boolean, input: unknown): string {
  if (missing) return 'add the field';
  if (type === 'variant' && typeof input !== 'string' && (input === null || typeof input !== 'object' || Array.isArray(input))) return 'give an object { … } with the fields listed in the README';
  switch (type) {
    case 'number': case 'finite': case 'integer': case 'min_value': case 'max_value': case 'gt_value': case 'lt_value':
      return 'change the number to fit (SI units: metres, hertz, ohms)';
    case 'literal': case 'picklist': case 'variant':
      return 'use one of the names listed';
    case 'min_length': case 'max_length':
      return Array.isArray(input) ? 'add or remove entries to fit' : 'change the text to fit';
    case 'string':
      return 'give text in quotes';
    case 'regex':
      return 'change the text to fit';
    case 'array':
      return 'give a list [ … ]';
    case 'object': case 'loose_object': case 'strict_object':
      return 'give an object { … } with the fields listed in the README';
    default:
      return 'change the value to fit';
  }
}

/**
 * Words a library issue for the user. `root` is the schema the value was checked with; `fallback` replaces any
 * expectation the schema cannot describe.
 */
export function schemaWords(root: v.GenericSchema, issue: v.BaseIssue<unknown>, fallback = 'a value of the right kind'): SchemaWords {
  const keys = (issue.path ?? []).map((p) => p.key as string | number);
  // A missing field arrives with its parent's path plus the key and an undefined input.
  const missing = issue.input === undefined && keys.length > 0;
  let expected = missing ? words(schemaAt(root as AnySchema, issue)) : issue.message;
  if (!expected || /\b(Invalid|received)\b|Expected /.test(expected)) expected = words(schemaAt(root as AnySchema, issue)) ?? fallback;
  return { keys, expected, found: missing ? 'nothing (the field is missing)' : describeFound(issue.input), fix: fixFor(issue.type, missing, issue.input), missing };
}

export { pathText };
