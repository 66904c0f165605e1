/** The safety cautions the app shows (Help ▸ Safety cautions, and beside the outputs). They defer to local rules. */
export const CAUTIONS = [
  'RF exposure: this tool sizes copper; it does not assess exposure or licensing. An array feed concentrates power in the main beam: evaluate your station against your regulator\'s exposure limits.',
  'Milling glass-fibre laminate (FR-4) makes fine dust: use extraction, a respirator and eye protection as the laminate\'s safety data sheet and your workplace rules require.',
  'Etchants (ferric chloride, persulfate) and their waste never go down the drain: follow the product\'s safety data sheet and your local hazardous-waste rules.',
  'Test equipment (a network analyser measuring a coupon): stay within its input power and DC limits, use ESD precautions, keep connectors clean and torqued, and follow the instrument\'s manual.',
  'All of this defers to your local codes and licensed practice.',
].join('\n\n');
