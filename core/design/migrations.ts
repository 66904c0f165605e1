/**
 * Migrations of the design file, one per format version, applied in order: `{ from: N, up }` takes a document of
 * version N to N + 1. The list is consecutive from 1; DESIGN_VERSION is one past the last `from`. A migration is a
 * pure function on plain JSON: it never drops fields it does not know (they belong to the user or a newer app).
 *
 * History of the format:
 * - 1: the first slice of the app wrote only `{ format, version, name }`.
 * - 2: the full document of core/design/types.ts (substrate, frequency, process, nodes, segments, board, areas,
 *      phase groups).
 * - 3: targets (requirements on the response over a band) and tolerances (how a made board may differ), both
 *      empty lists in an upgraded file.
 * - 4: `junctions`: tees and width steps sized and swept with their published models ('modelled') or joined at
 *      the centre ('ideal').
 * - 5: `asMade` (how lines are sized for what is made); files written before it keep plain microstrip sizing.
 * - 6: segments may be coupled pairs (kind "coupled", four terminals a, b, c, d).
 * - 7: display units (mm or mil) are the app's view setting, no longer kept in the design (`view.units` dropped).
 * - 8: `blocks`: blocks placed from a spec keep it (kind, spec, place, members), so they can be re-generated.
 * - 9: `sweep`: a design may keep its own sweep settings (start, stop, points, spacing).
 * - 10: `measured`: Touchstone files of the whole board kept with the design, each with its port map.
 * - 11: `proximityLimit`: the shop check's limit for runs side by side (a multiple of h or a length); absent = 3 h.
 * - 12: every file says how its lines are sized (`asMade`): older files without it get plain-microstrip sizing
 *       written in (what absence meant), so a later change of the default cannot change them.
 * - 13: a milled process carries its isolation clearance (`process.clearance`, m); older milled files get the
 *       channel their G-code milled written in (two passes overlapping 0.4: 1.6 cuts), so their toolpaths stay.
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
    summary: 'added empty lists of targets (requirements on the response) and tolerances (how a made board may differ)',
    up(doc) {
      // Nothing was required of the response before; an empty list keeps every upgraded design passing as it did.
      return { ...doc, version: 3, targets: doc.targets ?? [], tolerances: doc.tolerances ?? [] };
    },
  },
  {
    from: 3,
    summary: 'junctions: tees (Hammerstad 1981) and width steps (Garg–Bahl 1978) are now modelled — tee arms are lengthened by their reference-plane shifts; set junctions to "ideal" to size as before',
    up(doc) {
      // Literal value on purpose (see the first migration). Earlier versions sized every junction as ideal; the
      // upgraded file asks for the published models, which size the arms so their electrical lengths are what the
      // file asks for.
      return { ...doc, version: 4, junctions: doc.junctions ?? 'modelled' };
    },
  },
  {
    from: 4,
    summary: 'added asMade: lines stay sized as plain microstrip (as before), side copper stitched; choose "as-made" sizing to size milled lines from their cross-section',
    up(doc) {
      // Keep what the file sized before: an older design's boards were cut from microstrip widths.
      return { ...doc, version: 5, asMade: doc.asMade ?? { sizing: 'microstrip', sideCopper: 'stitched' } };
    },
  },
  {
    from: 5,
    summary: 'the format now knows coupled pairs (segment kind "coupled" with four terminals); nothing in the file changed',
    up(doc) {
      // Purely additive: an older file has no coupled pairs, so only the version moves.
      return { ...doc, version: 6 };
    },
  },
  {
    from: 6,
    summary: 'display units (mm or mil) are now a setting of the app, not of the design: view.units was dropped (the snap grid stays)',
    up(doc) {
      // Switching units changed the file and the undo list; the unit is how one person looks at the board.
      const view = doc.view;
      if (!view || typeof view !== 'object' || Array.isArray(view) || !('units' in view)) return { ...doc, version: 7 };
      const { units: _units, ...rest } = view as Json;
      return { ...doc, version: 7, view: rest };
    },
  },
  {
    from: 7,
    summary: 'the format now knows placed blocks (blocks made from a spec keep it, so they can be re-generated); nothing in the file changed',
    up(doc) {
      // Purely additive: an older file placed no blocks (the list is optional), so every piece stays plain.
      return { ...doc, version: 8 };
    },
  },
  {
    from: 8,
    summary: 'designs may keep their own sweep settings (start, stop, points, linear or log); this file has none, so it is swept over its band as before',
    up(doc) {
      // Purely additive: without `sweep` every face sweeps the band widened to f0 at 201 points, as before.
      return { ...doc, version: 9 };
    },
  },
  {
    from: 9,
    summary: 'the format now keeps measured Touchstone files of the whole board, each with its port map; this file has none',
    up(doc) {
      // Purely additive: an older file had no measured data (the list is optional).
      return { ...doc, version: 10 };
    },
  },
  {
    from: 10,
    summary: 'designs may keep their own proximity limit for the shop check (runs closer than it get a coupling estimate); this file has none, so it is checked at three substrate heights as before',
    up(doc) {
      // Purely additive: without `proximityLimit` the check uses 3 h, as it did (core/design/proximity-limit.ts).
      return { ...doc, version: 11 };
    },
  },
  {
    from: 11,
    summary: 'every design now says how its lines are sized (plain microstrip or as made); this file said nothing, which meant plain microstrip, so that choice is written in',
    up(doc) {
      // Literal value on purpose (see the first migration). A missing asMade meant plain microstrip sizing; boards may
      // have been cut from those widths, so the file says so explicitly from now on.
      return { ...doc, version: 12, asMade: doc.asMade ?? { sizing: 'microstrip', sideCopper: 'stitched' } };
    },
  },
  {
    from: 12,
    summary: 'a milled process now says how wide its isolation is (clearance); this file milled two overlapping passes, so that channel (1.6 cut widths) is written in; lines sized as made now see that channel, not one cut',
    up(doc) {
      // Literal values on purpose (see the first migration): format 12 milled every design with 2 isolation passes
      // overlapping 0.4 of the cut, a channel of cut + 0.6·cut. The cut is the tool's (end mill) or the V's width at
      // the cutting depth, tip + 2·depth·tan(angle/2).
      const p = doc.process as Json | undefined;
      if (!p || typeof p !== 'object' || p.clearance !== undefined) return { ...doc, version: 13 };
      const n = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) ? x : NaN);
      const cut = p.kind === 'end-mill' ? n(p.toolDiameter)
        : p.kind === 'v-bit' ? n(p.tipWidth) + 2 * n(p.depth) * Math.tan((n(p.angleDeg) * Math.PI) / 360) : NaN;
      if (!(cut > 0)) return { ...doc, version: 13 };
      return { ...doc, version: 13, process: { ...p, clearance: Math.round(1.6 * cut * 1e9) / 1e9 } };
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
