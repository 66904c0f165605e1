/**
 * How a design's lines are sized when its file does not say: isolation milling (end mill or V-bit) leaves the rest
 * of the top copper standing beside every line, so a milled design is sized as the cross-section it will be
 * ('as-made', beside the isolation channel its process mills: core/layout/process-cut.ts `isolationPlan`); an etched
 * design is sized as plain microstrip. Side copper is stitched unless the file says otherwise. From format 12 every
 * saved file says which it uses (the 11 → 12 migration wrote the old choice, plain microstrip, into older files), and
 * `newDesign` writes the choice into new ones, so this default only fills designs built in memory without one.
 * One place reads the setting: here.
 */
import type { AsMade, DesignDoc, FabProcess } from './types.ts';

/** Whether the process is isolation milling (copper stays beside every line). */
export function isMilled(fab: FabProcess): boolean {
  return fab.kind === 'end-mill' || fab.kind === 'v-bit';
}

/** The setting a new design made with `process` gets: as made when milled, plain microstrip when etched. */
export function defaultAsMade(process: FabProcess): AsMade {
  return { sizing: isMilled(process) ? 'as-made' : 'microstrip', sideCopper: 'stitched' };
}

/** The design's as-made setting: its own, or the default for the way it is made. */
export function asMadeOf(doc: Pick<DesignDoc, 'asMade' | 'process'>): AsMade {
  return doc.asMade ?? defaultAsMade(doc.process);
}
