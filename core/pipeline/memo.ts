/**
 * A small bounded memo of pipeline stages: one entry per (stage, key), the oldest dropped first once `capacity` is
 * reached (a Map keeps insertion order, and a hit moves its entry to the end). A refusal is kept like a value, so a
 * second job on a design that cannot be built is refused at once with the same words.
 *
 * `computed` counts how often each stage really ran: the tests and the reuse benchmark read it.
 */
export type StageOutcome<T> = { ok: true; value: T } | { ok: false; error: unknown };

export class StageMemo {
  private readonly entries = new Map<string, StageOutcome<unknown>>();
  readonly computed = new Map<string, number>();

  constructor(readonly capacity = 48) {
    if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError('a memo holds at least one entry');
  }

  /** The stage's value for `key`: from the memo, or computed once now (its refusal is kept and thrown again). */
  get<T>(stage: string, key: string, compute: () => T): T {
    const id = `${stage}\u0000${key}`;
    let hit = this.entries.get(id) as StageOutcome<T> | undefined;
    if (hit) {
      this.entries.delete(id);
      this.entries.set(id, hit);
    } else {
      this.computed.set(stage, (this.computed.get(stage) ?? 0) + 1);
      try { hit = { ok: true, value: compute() }; } catch (error) { hit = { ok: false, error }; }
      this.entries.set(id, hit);
      while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value as string);
    }
    if (!hit.ok) throw hit.error;
    return hit.value;
  }

  /** How many times `stage` was computed (not served from the memo). */
  count(stage: string): number { return this.computed.get(stage) ?? 0; }

  get size(): number { return this.entries.size; }

  clear(): void { this.entries.clear(); this.computed.clear(); }
}
