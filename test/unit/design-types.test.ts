/**
 * The design types are the one schema's (core/design/schema.ts and the schemas beside it), not a second hand-kept
 * copy: for each record, the fields the type names are exactly the schema's entries, and what the schema accepts is
 * the type (valibot's InferOutput, the loose objects' unknown fields aside). The `expectTypeOf` lines are checked by
 * the type-check (`npm run typecheck` covers test/); the key lists are also compared at run time. The project's own
 * rule (one source for the file format), so no outside source applies.
 */
import { describe, expect, expectTypeOf, it } from 'vitest';
import type * as v from 'valibot';
import type {
  Area, AsMade, BlockParamValue, DesignDoc, DesignNode, DesignSegment, FabProcess, MeasuredFile, PhaseGroup, PlacedBlock,
  SweepSpec, Target, TargetLimit, Tolerance,
} from '../../core/design/types.ts';
import {
  areaSchema, asMadeSchema, designSchema, nodeSchema, phaseGroupSchema, placedBlockSchema, processSchema, segmentSchema,
} from '../../core/design/schema.ts';
import { targetSchema, toleranceSchema } from '../../core/design/targets-schema.ts';
import { sweepSpecSchema } from '../../core/design/sweep-settings.ts';
import { measuredFileSchema } from '../../core/design/measured.ts';
import { NODE_SPEC_KEYS, SEGMENT_SPEC_KEYS } from '../../core/design/command-args.ts';
import { DESIGN_VERSION } from '../../core/design/migrations.ts';

/** Keys a type names, of every member of a union (keyof a union gives only the shared ones), less an index signature. */
type Named<T> = T extends unknown ? keyof { [K in keyof T as string extends K ? never : number extends K ? never : K]: 0 } & string : never;
/** Entry keys of an object schema, of every option of a variant, or of the object inside a pipe. */
type EntryKeys<S> = S extends { options: readonly (infer O)[] } ? EntryKeys<O>
  : S extends { entries: infer E } ? keyof E & string
  : S extends { pipe: readonly [infer First, ...unknown[]] } ? EntryKeys<First>
  : never;

/** Runtime twin of EntryKeys. */
function entryKeys(schema: unknown): string[] {
  const s = schema as { options?: unknown[]; entries?: Record<string, unknown>; pipe?: unknown[] };
  if (s.options) return [...new Set(s.options.flatMap(entryKeys))].sort();
  if (s.entries) return Object.keys(s.entries).sort();
  if (s.pipe) return entryKeys(s.pipe[0]);
  return [];
}

describe('design types are inferred from the one schema', () => {
  it('each record type names exactly the fields of its schema (checked by the type-check)', () => {
    expectTypeOf<Named<Target>>().toEqualTypeOf<EntryKeys<typeof targetSchema>>();
    expectTypeOf<Named<Tolerance>>().toEqualTypeOf<EntryKeys<typeof toleranceSchema>>();
    expectTypeOf<Named<SweepSpec>>().toEqualTypeOf<EntryKeys<typeof sweepSpecSchema>>();
    expectTypeOf<Named<MeasuredFile>>().toEqualTypeOf<EntryKeys<typeof measuredFileSchema>>();
    expectTypeOf<Named<PlacedBlock>>().toEqualTypeOf<EntryKeys<typeof placedBlockSchema>>();
    expectTypeOf<Named<DesignNode>>().toEqualTypeOf<EntryKeys<typeof nodeSchema>>();
    expectTypeOf<Named<DesignSegment>>().toEqualTypeOf<EntryKeys<typeof segmentSchema>>();
    expectTypeOf<Named<FabProcess>>().toEqualTypeOf<EntryKeys<typeof processSchema>>();
    expectTypeOf<Named<AsMade>>().toEqualTypeOf<EntryKeys<typeof asMadeSchema>>();
    expectTypeOf<Named<Area>>().toEqualTypeOf<EntryKeys<typeof areaSchema>>();
    expectTypeOf<Named<PhaseGroup>>().toEqualTypeOf<EntryKeys<typeof phaseGroupSchema>>();
    expectTypeOf<Named<DesignDoc>>().toEqualTypeOf<EntryKeys<ReturnType<typeof designSchema>>>();
  });

  it('what each schema accepts is the type, and the type is what the schema gives (both ways)', () => {
    expectTypeOf<v.InferOutput<typeof targetSchema>>().toExtend<Target>();
    expectTypeOf<Target>().toExtend<v.InferOutput<typeof targetSchema>>();
    expectTypeOf<v.InferOutput<typeof toleranceSchema>>().toExtend<Tolerance>();
    expectTypeOf<Tolerance>().toExtend<v.InferOutput<typeof toleranceSchema>>();
    expectTypeOf<v.InferOutput<typeof sweepSpecSchema>>().toExtend<SweepSpec>();
    expectTypeOf<SweepSpec>().toExtend<v.InferOutput<typeof sweepSpecSchema>>();
    expectTypeOf<v.InferOutput<typeof measuredFileSchema>>().toExtend<MeasuredFile>();
    expectTypeOf<v.InferOutput<typeof placedBlockSchema>>().toExtend<PlacedBlock>();
    expectTypeOf<TargetLimit>().toEqualTypeOf<Target['limit']>();
    expectTypeOf<Tolerance['distribution']>().toEqualTypeOf<'normal' | 'uniform'>();
    expectTypeOf<BlockParamValue>().toEqualTypeOf<string | number | boolean | number[] | { re: number; im: number }>();
    expectTypeOf<DesignDoc['targets']>().toEqualTypeOf<Target[]>();
    expectTypeOf<DesignDoc['tolerances']>().toEqualTypeOf<Tolerance[]>();
  });

  it('at run time, the schemas hold the fields the types name and the command field lists come from them', () => {
    const target: Record<keyof Target, true> = { id: true, name: true, figure: true, ports: true, group: true, band: true, limit: true };
    expect(entryKeys(targetSchema)).toEqual(Object.keys(target).sort());
    const tol: Record<keyof Tolerance, true> = { quantity: true, distribution: true, spread: true, scope: true };
    expect(entryKeys(toleranceSchema)).toEqual(Object.keys(tol).sort());
    const sweep: Record<keyof SweepSpec, true> = { start: true, stop: true, points: true, spacing: true };
    expect(entryKeys(sweepSpecSchema)).toEqual(Object.keys(sweep).sort());
    expect(entryKeys(designSchema(DESIGN_VERSION))).toContain('measured');
    // The commands' spec fields are the schema's entries less the shared ones (command-args.ts derives them).
    expect([...NODE_SPEC_KEYS].sort()).toEqual(entryKeys(nodeSchema).filter((k) => !['id', 'at', 'label'].includes(k)));
    expect([...SEGMENT_SPEC_KEYS].sort()).toEqual(entryKeys(segmentSchema).filter((k) => !['id', 'a', 'b', 'label'].includes(k)));
  });
});
