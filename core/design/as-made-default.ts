/**
 * How a design's lines are sized when its file does not say (format 12): isolation milling (end mill or V-bit)
 * leaves the rest of the top copper standing beside every line, so a milled design is sized as the cross-section it
 * will be ('as-made'); an etched design is sized as plain microstrip. Side copper is stitched unless the file says
 * otherwise. Files written before format 12 got their choice written in by the 11 → 12 migration, so they keep
 * meaning what they meant.
 */
import type { AsMade, DesignDoc, FabProcess } from './types.ts';

/** Whether the process is isolation milling (copper stays beside every line). */
export function isMilled(fab: FabProcess): boolean {
  return fab.kind === 'end-mill' || fab.kind === 'v-bit';
}

/** The design's as-made setting: its own, or the default for the way it is made. */
export function asMadeOf(doc: Pick<DesignDoc, 'asMade' | 'process'>): AsMade {
  return doc.asMade ?? { sizing: isMilled(doc.process) ? 'as-made' : 'microstrip', sideCopper: 'stitched' };
}
