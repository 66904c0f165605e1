/**
 * The safety cautions that go with a fabrication process, for every face (the app's process panel, a block-made
 * design's notes): milling glass-fibre laminate makes fine dust; etching uses corrosive chemicals whose waste is
 * hazardous, and an etched board is still drilled and cut, which makes the same dust. Common practice, worded as our
 * own; each defers to the product's safety data sheet and local rules.
 */
import type { FabProcess } from '../design/types.ts';

export const DUST_CAUTION = 'Milling, drilling or cutting glass-fibre laminate (FR-4) makes fine dust: use extraction, a respirator and eye protection as the laminate\'s safety data sheet and your workplace rules ask.';
export const ETCHANT_CAUTION = 'Etchants (ferric chloride, persulfates, acid/peroxide) are corrosive and can give off harmful fumes: wear gloves and eye protection, ventilate, and never pour etchant or rinse water down the drain — take it to a hazardous-waste service as the product\'s safety data sheet and your local rules ask.';

/** The cautions for the process `fab`: etchants first for an etched board (then the dust of drilling and cutting it), dust for a milled one. */
export function processCautions(fab: FabProcess): string[] {
  return fab.kind === 'etch' ? [ETCHANT_CAUTION, DUST_CAUTION] : [DUST_CAUTION];
}
