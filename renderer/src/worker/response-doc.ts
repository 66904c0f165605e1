/**
 * The design as the response worker holds it. The page sends each revision as the change from the revision it sent
 * before (core diffDesigns: records keyed by id, other top-level fields whole), and the worker applies it to its own
 * copy (core applyDiff). Records an edit left alone keep their identity in the worker, as they do on the page, so
 * the core's memo of a design being edited (the ends keyed by their records, core liveSizing) works there too;
 * sending the whole design cloned every record afresh and the worker sized each revision from scratch.
 *
 * Page and worker count the revisions they exchanged with a token. A change written against a revision the worker
 * does not hold (never expected: messages arrive in order) is refused with `OUT_OF_STEP`, and the page sends the
 * whole design next.
 */
import { applyDiff, diffDesigns, isEmptyDiff, type DesignDiff, type DesignDoc } from '../../../core/index.ts';

/** One revision as sent: whole, or as the change from revision `base`. */
export type DesignPost = { token: number; doc: DesignDoc } | { token: number; base: number; diff: DesignDiff };

/** The `field` of the error a worker answers a change it cannot apply with (client.ts JobError). */
export const OUT_OF_STEP = 'design-out-of-step';

/** The page's side: what to send for a revision. */
export class DesignSender {
  private sent: { token: number; doc: DesignDoc } | null = null;
  private next = 1;

  post(doc: DesignDoc): DesignPost {
    const token = this.next++;
    const before = this.sent;
    this.sent = { token, doc };
    if (!before) return { token, doc };
    return { token, base: before.token, diff: lean(diffDesigns(before.doc, doc)) };
  }

  /** The worker lost step (or restarted): the next post is the whole design. */
  reset(): void { this.sent = null; }
}

/**
 * A diff with only what applying it reads: the new records and field values (the `before` halves are what undo
 * needs, and a field's old value may be large, a measured file's whole text). An update's `before` is pointed at
 * its `after`, which a structured clone sends once.
 */
function lean(d: DesignDiff): DesignDiff {
  const records: DesignDiff['records'] = {};
  for (const [k, c] of Object.entries(d.records) as [keyof DesignDiff['records'], NonNullable<DesignDiff['records'][keyof DesignDiff['records']]>][]) {
    records[k] = { added: c.added, removed: c.removed, updated: c.updated.map((u) => ({ before: u.after, after: u.after })) };
  }
  const fields: DesignDiff['fields'] = {};
  for (const [k, f] of Object.entries(d.fields)) fields[k] = { before: undefined, after: f.after };
  return { records, fields };
}

/** The worker's side: the design of each post, built on the revision before it. */
export class DesignReplica {
  private held: { token: number; doc: DesignDoc } | null = null;

  receive(p: DesignPost): DesignDoc {
    if ('doc' in p) {
      this.held = { token: p.token, doc: p.doc };
      return p.doc;
    }
    if (!this.held || this.held.token !== p.base) {
      this.held = null;
      throw outOfStep(p.base);
    }
    // No change (a second pass of one revision): the very same document, whose stages the pipeline holds.
    if (isEmptyDiff(p.diff)) { this.held = { token: p.token, doc: this.held.doc }; return this.held.doc; }
    let doc: DesignDoc;
    try { doc = applyDiff(this.held.doc, p.diff); } catch {
      this.held = null; // the change does not fit the copy (never expected): start again from a whole design
      throw outOfStep(p.base);
    }
    this.held = { token: p.token, doc };
    return doc;
  }
}

function outOfStep(base: number): Error & { field: string; expected: string; got: string } {
  return Object.assign(new Error(`the response worker does not hold revision ${base} of the design`), {
    field: OUT_OF_STEP, expected: `the change from revision ${base}`, got: 'another revision',
  });
}
