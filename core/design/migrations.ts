/**
 * Migrations of the design file, one per format version, applied in order: `{ from: N, up }` takes a document of
 * version N to N + 1. The list is consecutive from 1; DESIGN_VERSION is one past the last `from`. A migration is a
 * pure function on plain JSON: it never drops fields it does not know (they belong to the user or a newer app).
 *
 * History of the format:
 * - 1: the first slice of the app wrote only `{ format, version, name }`.
 * - 2: the full document of core/design/types.ts (substrate, frequency, process, nodes, segments, board, areas,
 *      phase groups).
 * - 3: segments may be coupled pairs (kind "coupled", four terminals a, b, c, d).
 */
type Json = Record<string, unknown>;

export interface Migration {
  from: number;
  /** What changed, for the "this file was upgraded" note. */
  summary: string;
  up(doc: Json): Json;
}

export const MIGRATIONS: readonly Migration[] = [
  {
    from: 1,
    summary: 'added substrate (glass-epoxy FR-4 1.6 mm), frequency (2.45 GHz, 2.4–2.5 GHz), process: 30° V-bit, and an empty network',
    up(doc) {
      // Version 1 had no physics; fill the same defaults a new design gets, keeping anything already present.
      // The literal values are repeated here on purpose: a migration must not change when defaults change later.
      return {
        ...doc,
        version: 2,
        substrate: doc.substrate ?? { preset: 'glass-epoxy', er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 },
        frequency: doc.frequency ?? { f0: 2.45e9, band: { start: 2.4e9, stop: 2.5e9 } },
        process: doc.process ?? { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 },
        nodes: doc.nodes ?? [],
        segments: doc.segments ?? [],
        board: doc.board === undefined ? null : doc.board,
        areas: doc.areas ?? [],
        phaseGroups: doc.phaseGroups ?? [],
      };
    },
  },
  {
    from: 2,
    summary: 'the format now knows coupled pairs (segment kind "coupled" with four terminals); nothing in the file changed',
    up(doc) {
      // Purely additive: a version-2 file has no coupled pairs, so only the version moves.
      return { ...doc, version: 3 };
    },
  },
];

/** The format version this app writes and reads up to. */
export const DESIGN_VERSION: number = MIGRATIONS.length + 1;

/**
 * Brings `doc` (of version `from`, already checked to be a whole number 1..DESIGN_VERSION) to DESIGN_VERSION.
 * Returns the new document and the `from` of every migration applied, in order.
 */
export function migrate(doc: Json, from: number): { doc: Json; applied: number[] } {
  let cur = doc;
  const applied: number[] = [];
  for (const m of MIGRATIONS) {
    if (m.from < from) continue;
    cur = m.up(cur);
    applied.push(m.from);
  }
  return { doc: cur, applied };
}
