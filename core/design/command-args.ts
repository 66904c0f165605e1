/**
 * Checking the arguments of design commands. Every failure is an InputError naming the argument (as
 * `args.spec.width.z0`), what was expected and what was given; record contents are checked with the same valibot
 * schemas the file loader uses, so a command can never write what a file could not hold.
 */
import * as v from 'valibot';
import { InputError, describe } from '../util/errors.ts';
import type { Vec2 } from '../geometry/types.ts';
import type { DesignDoc, DesignNode, DesignSegment } from './types.ts';
import { pathText } from './issues.ts';
import { schemaWords } from './schema-words.ts';
import { idSchema, nodeSchema, segmentSchema, vec2Schema } from './schema.ts';

export type Args = Record<string, unknown>;

/** A design command: data in (`args`), a new design out; every command file's entries have this one shape. */
export interface DesignCommand {
  /** Stable id, e.g. 'node.move'; menus, shortcuts and scripts refer to it. */
  id: string;
  /** Short label for menus and the undo list. */
  label: string;
  run(doc: DesignDoc, args: Args): DesignDoc;
}

/** The fields a record's spec may hold: those of every variant of the record's schema, less the ones all records of
 * the kind share (ids, ends, position, label). Derived from the one schema, so a new field needs no second list. */
function specKeys(schema: { options: readonly { entries: Record<string, unknown> }[] }, shared: readonly string[]): ReadonlySet<string> {
  const keys = new Set<string>();
  for (const o of schema.options) for (const k of Object.keys(o.entries)) if (!shared.includes(k)) keys.add(k);
  return keys;
}

/** Fields of a node's spec (kind and its kind's fields); a kind change drops the old kind's. */
export const NODE_SPEC_KEYS = specKeys(nodeSchema, ['id', 'at', 'label']);
/** Fields of a segment's spec (kind and its kind's fields, the coupled pair's c, d and pair included). */
export const SEGMENT_SPEC_KEYS = specKeys(segmentSchema, ['id', 'a', 'b', 'label']);

export function argsObject(cmd: string, args: unknown): Args {
  if (args === null || typeof args !== 'object' || Array.isArray(args)) throw new InputError('invalid-design', `${cmd} args`, 'an object of named arguments', describe(args));
  return args as Args;
}

/** Validates `value` with `schema`; the first problem becomes an InputError whose field starts with `field`. */
export function checkWith<T>(schema: v.GenericSchema<unknown, T>, value: unknown, field: string): T {
  const r = v.safeParse(schema, value);
  if (r.success) return r.output;
  const i = r.issues[0];
  const w = schemaWords(schema, i);
  const sub = w.keys.length ? pathText(w.keys) : '';
  const where = sub ? (sub.startsWith('[') ? field + sub : `${field}.${sub}`) : field;
  throw new InputError(i.type === 'literal' || i.type === 'picklist' || i.type === 'variant' ? 'bad-choice' : 'invalid-design', where, w.expected, w.missing ? 'nothing' : describe(i.input));
}

export function argString(args: Args, key: string, what: string, opts: { optional?: boolean; max?: number } = {}): string | undefined {
  const x = args[key];
  if (x === undefined && opts.optional) return undefined;
  if (typeof x !== 'string' || x.length > (opts.max ?? 10_000)) throw new InputError('invalid-design', `args.${key}`, what, describe(x));
  return x;
}

export function argId(args: Args, key: string): string {
  return checkWith(idSchema, args[key], `args.${key}`);
}

export function argVec(args: Args, key: string): Vec2 {
  const p = checkWith(vec2Schema, args[key], `args.${key}`);
  return { x: p.x, y: p.y };
}

export function argNumber(args: Args, key: string, what: string, min: number, max: number): number {
  const x = args[key];
  if (typeof x !== 'number' || !Number.isFinite(x) || x < min || x > max) throw new InputError(typeof x === 'number' && Number.isFinite(x) ? 'out-of-range' : 'invalid-number', `args.${key}`, what, describe(x));
  return x;
}

export function argIds(args: Args, key: string): string[] {
  const x = args[key];
  if (!Array.isArray(x) || x.length === 0) throw new InputError('invalid-design', `args.${key}`, 'a non-empty list of record ids', describe(x));
  return x.map((id, i) => checkWith(idSchema, id, `args.${key}[${i}]`));
}

export function findNode(doc: DesignDoc, id: string, field: string): { node: DesignNode; index: number } {
  const index = doc.nodes.findIndex((n) => n.id === id);
  if (index < 0) throw new InputError('bad-choice', field, 'the id of a node in the design', JSON.stringify(id));
  return { node: doc.nodes[index]!, index };
}

export function findSegment(doc: DesignDoc, id: string, field: string): { segment: DesignSegment; index: number } {
  const index = doc.segments.findIndex((s) => s.id === id);
  if (index < 0) throw new InputError('bad-choice', field, 'the id of a segment in the design', JSON.stringify(id));
  return { segment: doc.segments[index]!, index };
}

/** Every id in use, across all record kinds. */
export function allIds(doc: DesignDoc): Set<string> {
  const s = new Set<string>();
  for (const list of [doc.nodes, doc.segments, doc.areas, doc.phaseGroups]) for (const r of list) s.add(r.id);
  return s;
}

/**
 * A new id `${prefix}${k}` with the smallest k ≥ 1 not in `taken` (which it then joins). Deterministic, so a
 * replayed command sequence yields the same ids.
 */
export function freshId(taken: Set<string>, prefix: string): string {
  let k = 1;
  while (taken.has(`${prefix}${k}`)) k++;
  const id = `${prefix}${k}`;
  taken.add(id);
  return id;
}

/** Positions are kept on a 1 nm grid so rotations and mirrors write short, stable numbers. */
export function snap(x: number): number {
  const r = Math.round(x * 1e9) / 1e9;
  return Object.is(r, -0) ? 0 : r;
}

export function snapVec(p: Vec2): Vec2 { return { x: snap(p.x), y: snap(p.y) }; }

/** Angle wrapped to (−π, π]; angles already inside are returned as they are (no rounding drift), −0 as 0. */
export function wrapAngle(a: number): number {
  let r = a;
  if (r <= -Math.PI || r > Math.PI) {
    r = a % (2 * Math.PI);
    if (r <= -Math.PI) r += 2 * Math.PI;
    if (r > Math.PI) r -= 2 * Math.PI;
  }
  return r === 0 ? 0 : r;
}
