/**
 * Types of the design file inferred from its one schema (valibot's InferOutput), so the file format, its checks and
 * the types code uses cannot drift apart.
 */
import type * as v from 'valibot';

/**
 * The fields code may name: drops the `[key: string]: unknown` index a loose object adds (unknown fields are kept at
 * run time, but code names only the fields it knows). A record (`v.record`: an index of a known value type) stays.
 */
export type Known<T> = T extends readonly (infer U)[] ? Known<U>[]
  : T extends object ? {
    [K in keyof T as string extends K ? (unknown extends T[K] ? never : K) : number extends K ? never : K]: Known<T[K]>
  }
  : T;

/** Omit over each member of a union (a plain Omit would merge the kinds). */
export type OmitEach<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/** The type of what `schema` accepts, as code names it. */
export type Out<S extends v.GenericSchema> = Known<v.InferOutput<S>>;
