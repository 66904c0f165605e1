/** Laminate data: the substrate spec, its validation, generic presets, εr/tanδ over frequency. */
export type { SubstrateSpec } from './types.ts';
export { validateSubstrate, SUBSTRATE_LIMITS } from './validate.ts';
export { substrateWithDefaults, DEFAULT_COPPER_T, ANNEALED_COPPER_SIGMA } from './defaults.ts';
export { SUBSTRATE_PRESETS, findPreset } from './presets.ts';
export type { SubstratePreset } from './presets.ts';
export { widebandDebyeAt, widebandDebyeEpsInf, DEBYE_F_LOW, DEBYE_F_HIGH } from './wideband-debye.ts';
export type { DielectricAt } from './wideband-debye.ts';
