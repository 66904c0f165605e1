/**
 * `design.setMeasured`: replaces the design's measured files (format 10). Kept apart from measured.ts, which the
 * schema imports, so the schema never loads the command helpers (they import the schema: a cycle otherwise).
 */
import type { DesignDoc } from './types.ts';
import { checkWith, type Args } from './command-args.ts';
import { measuredListSchema, type MeasuredFile } from './measured.ts';

/** Replaces the design's measured files as a whole list (load, remove, port-map edits); one undo step. */
export const setMeasured = {
  id: 'design.setMeasured', label: 'Change measured data',
  run(doc: DesignDoc, a: Args): DesignDoc {
    const measured = checkWith(measuredListSchema, a.measured, 'args.measured') as MeasuredFile[];
    return { ...doc, measured };
  },
};
