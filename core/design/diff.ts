/**
 * Record-level differences between two designs, and their inverse. Nodes, segments, areas and phase groups are
 * compared by id (added with their index in the new list, removed with their index in the old one, updated as
 * before/after pairs); every other top-level field is compared whole. Applying a diff and then its inverse gives
 * back the identical document, order of every list included. Undo (design/history.ts) is built on this.
 */
import { InputError } from '../util/errors.ts';
import type { DesignDoc } from './types.ts';

export const RECORD_LISTS = ['nodes', 'segments', 'areas', 'phaseGroups'] as const;
export type RecordList = (typeof RECORD_LISTS)[number];

interface Rec { id: string }

export interface RecordChanges<T extends Rec = Rec> {
  added: { index: number; record: T }[];
  updated: { before: T; after: T }[];
  removed: { index: number; record: T }[];
}

export interface DesignDiff {
  records: Partial<Record<RecordList, RecordChanges>>;
  /** Top-level fields that changed; `undefined` stands for "absent". A list whose order changed is here whole. */
  fields: Record<string, { before: unknown; after: unknown }>;
}

export function isEmptyDiff(d: DesignDiff): boolean {
  return Object.keys(d.records).length === 0 && Object.keys(d.fields).length === 0;
}

/** Structural equality of JSON values (records not touched by a command are the same object: fast path). */
export function jsonEqual(a: unknown, b: unknown): boolean {
  // Object.is: 0 and −0 differ here, so a change between them is recorded and undone exactly.
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a)) {
    const bb = b as unknown[];
    if (a.length !== bb.length) return false;
    for (let i = 0; i < a.length; i++) if (!jsonEqual(a[i], bb[i])) return false;
    return true;
  }
  const ka = Object.keys(a).filter((k) => (a as Record<string, unknown>)[k] !== undefined);
  const kb = Object.keys(b).filter((k) => (b as Record<string, unknown>)[k] !== undefined);
  if (ka.length !== kb.length) return false;
  for (const k of ka) if (!jsonEqual((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k])) return false;
  return true;
}

function diffList(before: readonly Rec[], after: readonly Rec[]): RecordChanges | 'reordered' | null {
  const bi = new Map(before.map((r, i) => [r.id, i]));
  const ai = new Map(after.map((r, i) => [r.id, i]));
  if (bi.size !== before.length || ai.size !== after.length) return 'reordered'; // duplicate ids: compare whole
  const keptBefore = before.filter((r) => ai.has(r.id)).map((r) => r.id);
  const keptAfter = after.filter((r) => bi.has(r.id)).map((r) => r.id);
  for (let i = 0; i < keptBefore.length; i++) if (keptBefore[i] !== keptAfter[i]) return 'reordered';
  const c: RecordChanges = { added: [], updated: [], removed: [] };
  before.forEach((r, index) => { if (!ai.has(r.id)) c.removed.push({ index, record: r }); });
  after.forEach((r, index) => {
    const k = bi.get(r.id);
    if (k === undefined) c.added.push({ index, record: r });
    else if (!jsonEqual(before[k], r)) c.updated.push({ before: before[k]!, after: r });
  });
  return c.added.length || c.updated.length || c.removed.length ? c : null;
}

/** What changed from `before` to `after`. */
export function diffDesigns(before: DesignDoc, after: DesignDoc): DesignDiff {
  const d: DesignDiff = { records: {}, fields: {} };
  const lists = new Set<string>(RECORD_LISTS);
  for (const key of RECORD_LISTS) {
    const c = diffList(before[key], after[key]);
    if (c === 'reordered') d.fields[key] = { before: before[key], after: after[key] };
    else if (c) d.records[key] = c;
  }
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  for (const k of keys) {
    if (lists.has(k)) continue;
    if (!jsonEqual(before[k], after[k])) d.fields[k] = { before: before[k], after: after[k] };
  }
  return d;
}

export function invertDiff(d: DesignDiff): DesignDiff {
  const records: DesignDiff['records'] = {};
  for (const [k, c] of Object.entries(d.records) as [RecordList, RecordChanges][]) {
    records[k] = { added: c.removed, removed: c.added, updated: c.updated.map((u) => ({ before: u.after, after: u.before })) };
  }
  const fields: DesignDiff['fields'] = {};
  for (const [k, f] of Object.entries(d.fields)) fields[k] = { before: f.after, after: f.before };
  return { records, fields };
}

/**
 * `doc` with `d` applied. Throws InputError if `doc` is not the state `d` was taken from (a record to update or
 * remove is missing): history and document have parted, which must never pass silently.
 */
export function applyDiff(doc: DesignDoc, d: DesignDiff): DesignDoc {
  const out: DesignDoc = { ...doc };
  for (const [k, f] of Object.entries(d.fields)) {
    if (f.after === undefined) delete out[k]; else out[k] = f.after;
  }
  for (const [k, c] of Object.entries(d.records) as [RecordList, RecordChanges][]) {
    const gone = new Set(c.removed.map((r) => r.record.id));
    const upd = new Map(c.updated.map((u) => [u.after.id, u.after]));
    const present = new Set((doc[k] as Rec[]).map((r) => r.id));
    for (const id of [...gone, ...upd.keys()]) {
      if (!present.has(id)) throw new InputError('invalid-design', `${k}`, `a record ${JSON.stringify(id)} to change`, 'none (the history does not match the document)');
    }
    const list: Rec[] = (doc[k] as Rec[]).filter((r) => !gone.has(r.id)).map((r) => upd.get(r.id) ?? r);
    for (const a of [...c.added].sort((x, y) => x.index - y.index)) list.splice(a.index, 0, a.record);
    (out as Record<string, unknown>)[k] = list;
  }
  return out;
}
