/**
 * Generic laminate presets: starting points by material family, never a maker's product. Every value is typical
 * for the family (sources: common practice; values marked "from memory" are just
 * that). The laminate's own data sheet wins: the user should always enter the εr, tanδ and thickness of the sheet
 * in hand, ideally the "design" εr quoted for microstrip at the working frequency.
 */
import type { SubstrateSpec } from './types.ts';

export interface SubstratePreset {
  /** Stable id for files and the CLI's --preset. */
  id: string;
  /** Short generic name. */
  name: string;
  /** Where the numbers come from and what to check; always says the data sheet wins. */
  note: string;
  spec: SubstrateSpec;
}

const DATASHEET = "Typical values for the material family; the laminate's own data sheet wins.";
/** Annealed copper, S/m (100 %IACS). */
const CU = 5.8e7;

function preset(id: string, name: string, detail: string, spec: Omit<SubstrateSpec, 'preset'>): SubstratePreset {
  return { id, name, note: `${DATASHEET} ${detail}`, spec: { preset: id, ...spec } };
}

export const SUBSTRATE_PRESETS: readonly SubstratePreset[] = [
  preset('glass-epoxy', 'Glass-epoxy (FR-4 class), 1.6 mm',
    'εr 4.4 and tanδ 0.02 near 1 GHz (common practice; real sheets span εr 4.2–4.8 and tanδ 0.015–0.03 between makers, lots and frequencies). Roughness 1.5 µm rms is a typical electro-deposited foil (from memory). Glass-fibre dust when milling: see the safety notes.',
    { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: CU, roughness: 1.5e-6 }),
  preset('glass-epoxy-0.8', 'Glass-epoxy (FR-4 class), 0.8 mm',
    'As glass-epoxy, thinner sheet.',
    { er: 4.4, h: 0.8e-3, t: 35e-6, tanDelta: 0.02, sigma: CU, roughness: 1.5e-6 }),
  preset('ptfe-woven-glass-2.2', 'PTFE / woven glass, εr 2.2, 0.787 mm',
    'εr 2.2 ± 0.02, tanδ about 0.0009 at 10 GHz (common practice for this family). Rolled foil, 0.4 µm rms (from memory).',
    { er: 2.2, h: 0.787e-3, t: 35e-6, tanDelta: 0.0009, sigma: CU, roughness: 0.4e-6 }),
  preset('ptfe-woven-glass-2.55', 'PTFE / woven glass, εr 2.55, 0.8 mm',
    'Higher glass content: εr 2.55–2.65, tanδ about 0.001–0.002 (common practice).',
    { er: 2.55, h: 0.8e-3, t: 35e-6, tanDelta: 0.0015, sigma: CU, roughness: 1.0e-6 }),
  preset('ceramic-ptfe-3.0', 'Ceramic-filled PTFE, εr 3.0, 0.508 mm',
    'εr 3.0, tanδ about 0.0013 (common practice for this family).',
    { er: 3.0, h: 0.508e-3, t: 35e-6, tanDelta: 0.0013, sigma: CU, roughness: 1.0e-6 }),
  preset('ceramic-hydrocarbon-3.66', 'Ceramic-filled hydrocarbon, εr 3.66, 0.508 mm',
    'Design εr 3.66 for microstrip (the process εr quoted by makers is lower, about 3.48), tanδ 0.0037 at 10 GHz; the family spans εr 3.4–3.7.',
    { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037, sigma: CU, roughness: 1.5e-6 }),
  preset('ceramic-ptfe-6.15', 'Ceramic-filled PTFE, εr 6.15, 0.635 mm',
    'εr 6.15, tanδ about 0.0027 (common practice for this family).',
    { er: 6.15, h: 0.635e-3, t: 17.5e-6, tanDelta: 0.0027, sigma: CU, roughness: 1.0e-6 }),
  preset('ceramic-ptfe-10.2', 'Ceramic-filled PTFE, εr 10.2, 0.635 mm',
    'εr 10.2, tanδ about 0.0023 (common practice for this family).',
    { er: 10.2, h: 0.635e-3, t: 17.5e-6, tanDelta: 0.0023, sigma: CU, roughness: 1.0e-6 }),
  preset('alumina-96', 'Alumina ceramic (96 %), 0.635 mm',
    'εr 9.8, tanδ about 0.0002 (common practice). Usually thin-film metal of a few µm: enter the real metal thickness and conductivity.',
    { er: 9.8, h: 0.635e-3, t: 5e-6, tanDelta: 0.0002, sigma: CU, roughness: 0.1e-6 }),
];

/** The preset with this id, or undefined. */
export function findPreset(id: string): SubstratePreset | undefined {
  return SUBSTRATE_PRESETS.find((p) => p.id === id);
}
