/**
 * How a design's lines are sized when its file does not say: as plain microstrip, side copper stitched. Sizing as
 * made ('as-made': the cross-section isolation milling leaves, with the top copper standing beside every line) is
 * chosen per design (the Stack panel, `asMade` in the file; the examples that are milled choose it). It is not yet
 * the default for milled designs: the default 30° V-bit's 0.11 mm cut leaves side copper so close that lines above
 * about 88 Ω on 1.6 mm glass-epoxy cannot be made, and the 100 Ω arms of the tee-split blocks need them. From format 12
 * every file says which it uses (the 11 → 12 migration writes the choice into older files), so the default can change
 * later without changing what a saved file means. One place reads the setting: here.
 */
import type { AsMade, DesignDoc, FabProcess } from './types.ts';

/** Whether the process is isolation milling (copper stays beside every line). */
export function isMilled(fab: FabProcess): boolean {
  return fab.kind === 'end-mill' || fab.kind === 'v-bit';
}

/** The design's as-made setting: its own, or plain microstrip with stitched side copper. */
export function asMadeOf(doc: Pick<DesignDoc, 'asMade' | 'process'>): AsMade {
  return doc.asMade ?? { sizing: 'microstrip', sideCopper: 'stitched' };
}
