/**
 * Refusals of the pipeline: an InputError('impossible-layout') that names the pieces and says how to fix them, so
 * every face (CLI exit 1, the app's Outputs panel) shows the same words. At most six problems are listed, then a
 * count, so a broken 1000-piece design still gives a readable message.
 */
import { InputError } from '../util/errors.ts';

const SHOWN = 6;

export function refuse(field: string, expected: string, problems: readonly string[], fix: string): InputError {
  const listed = problems.slice(0, SHOWN).join('; ') + (problems.length > SHOWN ? `; and ${problems.length - SHOWN} more` : '');
  return new InputError('impossible-layout', field, expected, listed, fix);
}
