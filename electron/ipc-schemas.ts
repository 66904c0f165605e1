/**
 * The valibot schemas of every channel's argument, checked in the main process (ipc.ts); the push payloads' schemas,
 * checked in the preload, are in push-schemas.ts (the preload may bundle nothing that touches Node). Each check words its own problem; `problemOf` puts the
 * field's path in front ("files[2].name: …"). Problems the user can act on by making something smaller (a design
 * over the size limit, an export file too big) are marked too-large.
 *
 * The schemas are typed against the contract (bridge/contract.ts): a schema whose output is not the channel's
 * request type fails the type-check.
 */
import * as v from 'valibot';
import { LIMITS, type Channel, type ExportFile, type RequestOf } from '../bridge/contract.ts';
import { DOC_ID_RE } from './files/recovery-store.ts';
import { plainFileNameProblem } from './policy.ts';

/** A problem with an argument; `tooLarge` ones answer 'too-large' (the user can act on it), the rest 'bad-request'. */
export interface Problem { problem: string; tooLarge?: boolean }

/** Marks a message as a too-large problem (stripped before it reaches the page). */
const BIG = '\u0001';

function isPlainObject(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x) && (Object.getPrototypeOf(x) === Object.prototype || Object.getPrototypeOf(x) === null);
}

/** A value as shown in a message: text quoted and cut, anything else by its kind (a BigInt or a cycle cannot be JSON). */
function shown(x: unknown): string {
  if (typeof x === 'string') return JSON.stringify(x.slice(0, 80));
  if (x === null || x === undefined || typeof x === 'number' || typeof x === 'boolean') return String(x);
  if (typeof x === 'bigint') return 'a big integer';
  return Array.isArray(x) ? 'a list' : `${typeof x === 'object' ? 'an object' : `a ${typeof x}`}`;
}

const typeName = (x: unknown) => (x === null ? 'null' : typeof x);
const lengthOf = (x: unknown) => (typeof x === 'string' || x instanceof Uint8Array || Array.isArray(x) ? x.length : 0);

/**
 * An object with these fields checked (other keys dropped). A missing field is worded by the field's own schema
 * (as if it were given as undefined), so the library's own wording never reaches the page.
 */
function fields<E extends v.ObjectEntries>(entries: E) {
  return v.object(entries, (issue) => {
    const key = issue.path?.[issue.path.length - 1]?.key;
    const field = typeof key === 'string' ? entries[key] : undefined;
    const r = field ? v.safeParse(field, undefined) : null;
    return r && !r.success ? r.issues[0].message : 'expected an object with the fields of the bridge contract';
  });
}

/** A plain object (no prototype tricks, no array) with exactly these fields checked; other keys are dropped. */
function record<E extends v.ObjectEntries>(entries: E) {
  return v.pipe(
    v.custom<Record<string, unknown>>(isPlainObject, (i) => `expected an object, got ${Array.isArray(i.input) ? 'an array' : typeName(i.input)}`),
    fields(entries),
  );
}

function text(max: number) {
  return v.pipe(
    v.string((i) => `expected text, got ${typeName(i.input)}`),
    v.maxLength(max, (i) => `expected at most ${max} characters, got ${lengthOf(i.input)}`),
  );
}

const pathSchema = v.pipe(
  text(LIMITS.pathChars),
  v.check((p) => p.length > 0 && !p.includes('\0'), (i) => `expected a file path, got ${JSON.stringify(i.input).slice(0, 80)}`),
);

/** The design text: over the limit is something the user can fix (split the design), so it says so. */
const designText = v.pipe(
  v.string((i) => `expected text, got ${typeName(i.input)}`),
  v.check((t) => t.length <= LIMITS.designBytes, (i) => `${BIG}the design is ${(lengthOf(i.input) / 1024 / 1024).toFixed(1)} MiB of text; at most ${(LIMITS.designBytes / 1024 / 1024).toFixed(0)} MiB can be saved (expected a smaller design: remove unused pieces or long Touchstone blocks)`),
);

const docId = v.pipe(
  v.string((i) => `expected 1–${LIMITS.docIdChars} letters, digits, '-' or '_', got ${shown(i.input)}`),
  v.regex(DOC_ID_RE, (i) => `expected 1–${LIMITS.docIdChars} letters, digits, '-' or '_', got ${shown(i.input)}`),
);

const exportFile = v.pipe(
  v.custom<Record<string, unknown>>(isPlainObject, 'expected { name, data }'),
  fields({
    name: v.custom<string>((n) => plainFileNameProblem(n, LIMITS.fileNameChars) === null, (i) => plainFileNameProblem(i.input, LIMITS.fileNameChars) ?? 'expected a plain file name'),
    data: v.pipe(
      v.union([v.string(), v.instance(Uint8Array)], (i) => `expected text or bytes (Uint8Array), got ${typeName(i.input)}`),
      v.check((d) => d.length <= LIMITS.exportFileBytes, (i) => `${BIG}expected at most ${LIMITS.exportFileBytes} bytes, got ${lengthOf(i.input)}`),
    ),
  }),
);

const exportFiles = v.pipe(
  v.array(exportFile, 'expected a non-empty list of { name, data }'),
  v.minLength(1, 'expected a non-empty list of { name, data }'),
  v.maxLength(LIMITS.exportFiles, (i) => `expected at most ${LIMITS.exportFiles} files, got ${lengthOf(i.input)}`),
  v.check((files) => firstRepeat(files) === null, (i) => `${firstRepeat(i.input as ExportFile[])} appears twice (names must differ also ignoring case)`),
  v.check((files) => files.reduce((s, f) => s + f.data.length, 0) <= LIMITS.exportTotalBytes,
    (i) => `${BIG}expected at most ${LIMITS.exportTotalBytes} bytes in all, got ${(i.input as ExportFile[]).reduce((s, f) => s + f.data.length, 0)}`),
);

/** The first file name that repeats another, ignoring case; null when all differ. */
function firstRepeat(files: readonly ExportFile[]): string | null {
  const seen = new Set<string>();
  for (const f of files) {
    const k = f.name.toLowerCase();
    if (seen.has(k)) return f.name;
    seen.add(k);
  }
  return null;
}

const none = v.undefined((i) => `expected no argument, got ${typeof i.input}`);
const timeOrNull = v.union(
  [v.null(), v.pipe(v.number(), v.finite((i) => `expected a time in ms or null, got ${typeof i.input}`))],
  (i) => `expected a time in ms or null, got ${typeof i.input}`,
);

/** One schema per channel, typed against the contract's request type. */
export const REQUEST_SCHEMAS: { [C in Channel]: v.GenericSchema<unknown, RequestOf<C>> } = {
  'design:open-dialog': none,
  'data:open-touchstone': none,
  'design:open-path': record({ path: pathSchema }),
  'design:save': record({ docId, path: pathSchema, text: designText, expectedModifiedMs: timeOrNull }),
  'design:save-as': record({ docId, suggestedName: text(LIMITS.fileNameChars), text: designText }),
  'export:files': record({ title: text(LIMITS.titleChars), files: exportFiles }),
  'recent:list': none,
  'recent:clear': none,
  'autosave:write': record({ docId, name: text(LIMITS.titleChars), path: v.nullable(pathSchema), text: designText }),
  'autosave:discard': record({ docId }),
  'recovery:list': none,
  'recovery:read': record({ docId }),
  'recovery:discard': record({ docId }),
  'document:state': record({ title: text(LIMITS.titleChars), dirty: v.boolean((i) => `expected true or false, got ${typeof i.input}`) }),
  'app:info': none,
};

/** The field path of an issue as text: files[2].name. */
function pathOf(issue: v.BaseIssue<unknown>): string {
  let out = '';
  for (const item of issue.path ?? []) {
    const k = item.key;
    out += typeof k === 'number' ? `[${k}]` : `${out ? '.' : ''}${String(k)}`;
  }
  return out;
}

/** The first problem of `value` against `schema`, worded with its field path; null when it passes. */
export function problemOf<T>(schema: v.GenericSchema<unknown, T>, value: unknown): { value: T } | Problem {
  const r = v.safeParse(schema, value);
  if (r.success) return { value: r.output };
  const issue = r.issues[0];
  const tooLarge = issue.message.startsWith(BIG);
  const message = tooLarge ? issue.message.slice(BIG.length) : issue.message;
  const where = pathOf(issue);
  return { problem: where ? `${where}: ${message}` : message, ...(tooLarge ? { tooLarge } : {}) };
}

/** The check of one channel's argument. */
export function checkRequest<C extends Channel>(channel: C, value: unknown): { value: RequestOf<C> } | Problem {
  return problemOf(REQUEST_SCHEMAS[channel] as v.GenericSchema<unknown, RequestOf<C>>, value);
}
