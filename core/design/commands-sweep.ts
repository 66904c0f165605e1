/**
 * `design.setSweep`: sets the design's own sweep settings (format 9), or removes them with `sweep: null` so the band
 * is swept by default again. Checked with the file's own schema, so no edit can write what the loader would refuse;
 * undo records the field before and after.
 */
import type { DesignDoc } from './types.ts';
import { sweepSpecSchema, type SweepSpec } from './sweep-settings.ts';
import { checkWith, type Args, type DesignCommand } from './command-args.ts';

type Command = DesignCommand;

export const setSweep: Command = {
  id: 'design.setSweep', label: 'Change sweep settings',
  run(doc, a) {
    if (a.sweep === null) { const { sweep: _old, ...rest } = doc; void _old; return rest as DesignDoc; }
    const sweep = checkWith(sweepSpecSchema, a.sweep, 'args.sweep') as SweepSpec;
    return { ...doc, sweep: { start: sweep.start, stop: sweep.stop, points: sweep.points, spacing: sweep.spacing } };
  },
};
