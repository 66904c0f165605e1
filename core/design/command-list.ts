/**
 * A list of design commands as data, applied in order as one batch (the CLI's `edit`, scripts, generators). Each
 * entry is `{ "id": "run.route", "args": { … } }`: the id of a command in DESIGN_COMMANDS and its named arguments,
 * exactly what the app's editor hands to `History.apply` for one edit, so a list replays what a person did in the
 * app and the batch runs through the same `History.apply` the app's undo stack is built on.
 *
 * Refused whole (the project's own rule: nothing the user made is lost): the first entry that is malformed or that
 * its command refuses stops the batch with an InputError naming the entry (`commands[2] run.tee: args.segment`),
 * what was expected, what was found and how to fix it; the design given is never changed.
 */
import { InputError, describe } from '../util/errors.ts';
import { DESIGN_COMMANDS } from './commands.ts';
import { diffDesigns, RECORD_LISTS, type DesignDiff, type RecordList } from './diff.ts';
import { History } from './history.ts';
import { scanJson } from './json-scan.ts';
import { DESIGN_LIMITS } from './limits.ts';
import type { DesignDoc } from './types.ts';

/** One command as data. */
export interface CommandEntry {
  /** A command id, e.g. 'run.route' (DESIGN_COMMANDS). */
  id: string;
  /** Its named arguments; absent = none. */
  args?: Record<string, unknown>;
}

/** What a batch changed, by record id (the design's own ids, so a person can find them). */
export interface ChangeSummary {
  added: Record<RecordList, string[]>;
  removed: Record<RecordList, string[]>;
  /** Nodes whose position changed. */
  moved: string[];
  /** Records changed in another way (a node's kind, a segment's width …), with the fields that changed. */
  changed: { list: RecordList; id: string; fields: string[] }[];
  /** Top-level fields that changed (substrate, frequency, targets …). */
  fields: string[];
}

export interface BatchResult {
  doc: DesignDoc;
  /** Each entry's command label, in order (the undo list's words). */
  labels: string[];
  summary: ChangeSummary;
}

/** The most entries one batch may hold (a sanity bound far above any hand-written list). */
export const MAX_COMMANDS = 10_000;

const ENTRY_KEYS = new Set(['id', 'args']);
const FIX = 'correct this entry; nothing was applied';

function commandIds(): string {
  return [...DESIGN_COMMANDS.keys()].join(', ');
}

/** Checks one entry's shape (not its arguments: the command checks those). */
function readEntry(x: unknown, field: string): CommandEntry {
  if (x === null || typeof x !== 'object' || Array.isArray(x)) {
    throw new InputError('invalid-design', field, 'a command {"id": "...", "args": {...}}', describe(x), FIX);
  }
  const o = x as Record<string, unknown>;
  for (const k of Object.keys(o)) {
    if (!ENTRY_KEYS.has(k)) throw new InputError('invalid-design', `${field}.${k}`, 'only "id" and "args" in a command', JSON.stringify(k), 'remove the field, or put it inside "args"');
  }
  if (typeof o.id !== 'string' || !DESIGN_COMMANDS.has(o.id)) {
    throw new InputError('bad-choice', `${field}.id`, `a command id: one of ${commandIds()}`, describe(o.id), 'see `stripwright edit --help` for the drawing commands and their arguments');
  }
  if (o.args !== undefined && (o.args === null || typeof o.args !== 'object' || Array.isArray(o.args))) {
    throw new InputError('invalid-design', `${field}.args`, 'an object of named arguments', describe(o.args), FIX);
  }
  return o.args === undefined ? { id: o.id } : { id: o.id, args: o.args as Record<string, unknown> };
}

/** A command list from parsed JSON: one entry object, or a list of them. */
export function readCommandList(value: unknown, field = 'commands'): CommandEntry[] {
  const list = Array.isArray(value) ? value : [value];
  if (list.length === 0) throw new InputError('invalid-design', field, 'at least one command', 'an empty list', 'give the commands to apply');
  if (list.length > MAX_COMMANDS) throw new InputError('out-of-range', field, `at most ${MAX_COMMANDS} commands`, `${list.length}`, 'split the list into several runs');
  return list.map((x, i) => readEntry(x, Array.isArray(value) ? `${field}[${i}]` : field));
}

/**
 * A command list from JSON text, checked as strictly as a design file (json-scan.ts: syntax with line and column,
 * duplicate keys, `__proto__`, depth and list limits). `source` names the text in messages (a file name, `--command`).
 */
export function parseCommandList(text: string, source: string): CommandEntry[] {
  const problem = scanJson(text, DESIGN_LIMITS);
  if (problem) {
    throw new InputError('bad-file', `${source} line ${problem.line}, column ${problem.column}`, problem.expected, problem.found,
      'give JSON: a command {"id": "...", "args": {...}} or a list of them');
  }
  return readCommandList(JSON.parse(text), source);
}

function emptySummary(): ChangeSummary {
  const lists = () => Object.fromEntries(RECORD_LISTS.map((l) => [l, [] as string[]])) as Record<RecordList, string[]>;
  return { added: lists(), removed: lists(), moved: [], changed: [], fields: [] };
}

/** Field names whose values differ between two records. */
function changedFields(a: Record<string, unknown>, b: Record<string, unknown>): string[] {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  return [...keys].filter((k) => JSON.stringify(a[k]) !== JSON.stringify(b[k])).sort();
}

/** What changed from `before` to `after`, by record id. */
export function summarizeChanges(before: DesignDoc, after: DesignDoc): ChangeSummary {
  const d: DesignDiff = diffDesigns(before, after);
  const s = emptySummary();
  for (const list of RECORD_LISTS) {
    const c = d.records[list];
    if (!c) continue;
    s.added[list] = c.added.map((x) => x.record.id);
    s.removed[list] = c.removed.map((x) => x.record.id);
    for (const u of c.updated) {
      const fields = changedFields(u.before as unknown as Record<string, unknown>, u.after as unknown as Record<string, unknown>);
      if (list === 'nodes' && fields.includes('at')) s.moved.push(u.after.id);
      const other = fields.filter((f) => !(list === 'nodes' && f === 'at'));
      if (other.length) s.changed.push({ list, id: u.after.id, fields: other });
    }
  }
  // A list whose kept records changed order is recorded whole by the diff; name it as a changed field.
  s.fields = Object.keys(d.fields).sort();
  return s;
}

/**
 * Applies `entries` to `doc` in order, each through `History.apply` (as the app's editor does for one edit), and
 * returns the new design with what changed. Throws the first refusal as an InputError naming the entry (`where`
 * gives its name, default `commands[i]`); `doc` is untouched either way (commands never change their input).
 */
export function applyCommandList(doc: DesignDoc, entries: readonly CommandEntry[], opts: { where?: (index: number) => string } = {}): BatchResult {
  const where = opts.where ?? ((i: number) => `commands[${i}]`);
  const history = new History(doc);
  const labels: string[] = [];
  entries.forEach((e, i) => {
    const at = where(i);
    try {
      history.apply(e.id, e.args ?? {});
      history.mark();
    } catch (err) {
      if (err instanceof InputError) {
        throw new InputError(err.code, `${at} ${e.id}: ${err.field}`, err.expected, err.got, err.hint ?? FIX);
      }
      throw err;
    }
    labels.push(DESIGN_COMMANDS.get(e.id)!.label);
  });
  return { doc: history.doc, labels, summary: summarizeChanges(doc, history.doc) };
}
