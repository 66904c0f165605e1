/**
 * Commands that replace a design's targets or tolerances as a whole list (the table editors send the edited list).
 * The list is checked with the file's own schemas and the cross-record check, so no edit can write what the loader
 * would refuse; undo records the field before and after (core/design/diff.ts compares these lists whole).
 */
import { InputError } from '../util/errors.ts';
import type { DesignDoc, Target, Tolerance } from './types.ts';
import { targetsSchema, tolerancesSchema } from './targets-schema.ts';
import { checkWith, type Args, type DesignCommand } from './command-args.ts';
import { crossCheck } from './crossref.ts';

type Command = DesignCommand;

function settled(id: string, doc: DesignDoc): DesignDoc {
  const e = crossCheck(doc).errors[0];
  if (e) throw new InputError('invalid-design', e.path, e.expected, `${e.found} after ${id}`, 'the edit was not made');
  return doc;
}

export const setTargets: Command = {
  id: 'design.setTargets', label: 'Change targets',
  run(doc, a) {
    const targets = checkWith(targetsSchema, a.targets, 'args.targets') as Target[];
    return settled(this.id, { ...doc, targets });
  },
};

export const setTolerances: Command = {
  id: 'design.setTolerances', label: 'Change tolerances',
  run(doc, a) {
    const tolerances = checkWith(tolerancesSchema, a.tolerances, 'args.tolerances') as Tolerance[];
    return settled(this.id, { ...doc, tolerances });
  },
};
