/**
 * The safety notes the Help menu shows (the same points as the README's Cautions). Kept short for a message box;
 * they defer to local rules and licensed practice.
 */
export const CAUTIONS_TITLE = 'Safety cautions';

export const CAUTIONS_TEXT = [
  'Stripwright helps you design and make boards; it does not make the work safe. Your local codes, your institution’s rules and licensed practice come first.',
  '',
  'RF exposure: keep to the exposure limits that apply where you are (your regulator, ICNIRP or IEEE C95.1 guidance). Never touch or look closely at a radiating antenna or an open line under power; use an attenuator or a dummy load on the bench; transmit only within your licence or your band’s licence-exempt rules.',
  '',
  'Milling glass-epoxy (FR-4) and ceramic-filled laminates makes fine glass and resin dust: extract it at the tool or cut wet, wear a suitable respirator and eye protection, clean up with a HEPA vacuum, never by blowing.',
  '',
  'Etchants (ferric or cupric chloride, persulfates, acid/peroxide) are corrosive and some give off toxic gas when mixed: wear gloves and eye protection, work ventilated, follow the supplier’s safety data sheet, never mix etchants, and dispose of spent etchant (it carries dissolved copper) as hazardous waste, never down the drain.',
  '',
  'Test equipment (a network analyser measuring a coupon): stay within its input power and DC limits, use ESD precautions, keep connectors clean and torqued, and follow the instrument’s manual.',
].join('\n');
