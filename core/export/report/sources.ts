/**
 * The models behind the numbers of a report, with their published sources and stated validity, as the model files
 * cite them (core/line, core/substrate; the junction and end models cite themselves through each piece's corrections).
 */
import type { DesignDoc } from '../../design/types.ts';

export interface ModelSource { what: string; source: string; validity: string }

export function lineModelSources(doc: DesignDoc): ModelSource[] {
  const out: ModelSource[] = [
    { what: 'Static Z0 and εeff, strip thickness', source: 'E. Hammerstad, Ø. Jensen, "Accurate models for microstrip computer-aided design", IEEE MTT-S IMS Digest 1980, pp. 407–409, eqs. (1)–(8)', validity: 'εeff within 0.2 % for εr ≤ 128 and 0.01 ≤ W/h ≤ 100 (authors); thickness term checked to 1 % for t/h ≤ 0.28' },
    { what: 'εeff over frequency', source: 'M. Kirschning, R. H. Jansen, Electronics Letters 18(6), 1982, pp. 272–273', validity: '0.1 ≤ W/h ≤ 100, 1 ≤ εr ≤ 20, f·h ≤ 38.97 GHz·mm' },
    { what: 'Z0 over frequency (power–current)', source: 'R. H. Jansen, M. Kirschning, AEÜ 37, 1983, pp. 108–112', validity: '0.1 ≤ W/h ≤ 10, 1 ≤ εr ≤ 18, f·h ≤ 15 GHz·mm' },
    { what: 'Conductor loss', source: 'H. A. Wheeler, Proc. IRE 30(9), 1942 (incremental inductance), applied to microstrip by Pucel, Massé, Hartwig, IEEE Trans. MTT 16(6), 1968', validity: 'quasi-static; strip thickness above 0 and several skin depths' },
    { what: 'Surface roughness', source: 'E. Hammerstad, F. Bekkadal, Microstrip Handbook, ELAB report STF44 A74169, NTH Trondheim, 1975', validity: 'rms roughness up to a few skin depths (saturates at 2×)' },
    { what: 'Dielectric loss', source: 'J. D. Welch, H. J. Pratt, NEREM Record 8, 1966; Pucel, Massé, Hartwig, IEEE Trans. MTT 16(6), 1968 (filling factor)', validity: 'low-loss laminates (tan δ ≪ 1)' },
  ];
  if (doc.substrate.dielectricModel?.kind === 'wideband-debye') {
    out.push({ what: 'εr and tan δ over frequency', source: 'A. R. Djordjevic et al., IEEE Trans. EMC 43(4), 2001, pp. 662–667 (wideband Debye)', validity: 'laminates with nearly constant loss over decades of frequency' });
  }
  out.push({ what: 'Network response', source: 'nodal analysis of the pieces as lossy, dispersive lines; power-wave S-parameters (K. Kurokawa, IEEE Trans. MTT 13(2), 1965)', validity: 'as the line and junction models above' });
  return out;
}

/** What the response leaves out, said plainly so nobody reads more into the plots than they hold. */
export const NOT_MODELLED: readonly string[] = [
  'Radiation from open ends, bends and junctions: the made board loses more and couples more than the plots show, increasingly at higher frequencies.',
  'The enclosure or anything near the board (lids, cables, hands, mounting): box resonances and detuning are not included.',
  'Coupling between lines that are not drawn as a coupled pair; the tee junction susceptance; crosses and Y-shaped junctions (joined at the centre).',
  'Connectors and the launch beyond the pads drawn; solder, plating and the copper as etched or milled beyond the process settings.',
];

/** The usual cautions (common practice), deferring to local rules. */
export const CAUTIONS: readonly string[] = [
  'RF exposure: powered tests radiate from open lines and antennas. Keep power low, keep away from the board while transmitting, and follow the exposure limits and licensing rules where you are.',
  'Glass-fibre dust: cutting, milling or drilling FR-4 and similar laminates makes fine glass and resin dust. Use dust extraction or wet methods, a suitable mask and eye protection; do not blow it off with compressed air.',
  'Etchants: ferric chloride, ammonium or sodium persulfate and cupric chloride burn skin and eyes and stain. Wear gloves and eye protection, ventilate, and dispose of spent etchant as your local rules require — never down the drain.',
  'Spindles: a milling spindle or drill throws chips and breaks small tools. Wear eye protection, keep hands, hair and sleeves clear, clamp the work, and stop the spindle before reaching in.',
  'Test equipment: respect the input limits of analysers and use attenuators before a powered stage. These notes do not replace local codes, the makers\' instructions or licensed practice; follow those where they differ.',
];
