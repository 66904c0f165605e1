/**
 * The revision of a design: a hash of its content without the name of the app that last wrote it (`app`), so the same design
 * gives the same key in the app and in the CLI, and an undo back to earlier content finds that content's stages
 * again. The hash of one document object is remembered (a WeakMap on the object), because the faces never mutate
 * a document in place: an edit makes a new one.
 */
import type { DesignDoc } from '../design/types.ts';
import { documentHash } from '../network/sweep.ts';

const known = new WeakMap<object, string>();

export function revisionOf(doc: DesignDoc): string {
  let r = known.get(doc);
  if (r === undefined) {
    r = documentHash({ ...doc, app: undefined });
    known.set(doc, r);
  }
  return r;
}
