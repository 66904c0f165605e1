/**
 * `design.setProximityLimit`: sets the shop check's proximity limit (format 11), or removes it with `limit: null` so
 * the check uses three substrate heights again. Checked with the file's own schema (no edit can write what the loader
 * would refuse); one undo step.
 */
import type { DesignDoc } from './types.ts';
import { proximityLimitSchema, type ProximityLimitSetting } from './proximity-limit.ts';
import { checkWith, type Args } from './command-args.ts';

export const setProximityLimit = {
  id: 'design.setProximityLimit', label: 'Change the proximity limit',
  run(doc: DesignDoc, a: Args): DesignDoc {
    if (a.limit === null) { const { proximityLimit: _old, ...rest } = doc; void _old; return rest as DesignDoc; }
    const s = checkWith(proximityLimitSchema, a.limit, 'args.limit') as ProximityLimitSetting;
    return { ...doc, proximityLimit: s.by === 'heights' ? { by: 'heights', heights: s.heights } : { by: 'length', length: s.length } };
  },
};
