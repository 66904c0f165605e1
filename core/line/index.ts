/**
 * Microstrip line models behind one interface: analysis, exact synthesis, electrical length, line constants and
 * mode thresholds. Each published model lives in its own file named for it.
 */
export type { LineOptions, LineResult, LineColumns, DispersionModel, ConductorLossModel } from './types.ts';
export { DISPERSION_MODELS, CONDUCTOR_LOSS_MODELS } from './types.ts';
export type { CrossSectionSource, CrossSectionStatics } from './cross-section.ts';
export { analyzeLine, analyzeLines, dielectricAt } from './analyze.ts';
export { synthesizeLine } from './synthesize.ts';
export { lengthForDegrees, degreesForLength, groupDelayPerM } from './electrical-length.ts';
export { lineConstants, lineConstantsFrom, lineConstantsAt } from './line-constants.ts';
export type { Complex } from './line-constants.ts';
export { modeThresholds } from './mode-thresholds.ts';
export type { ModeThresholds } from './mode-thresholds.ts';
export { hammerstad1975WidthRatio, wheeler1977WidthRatio } from './closed-form-synthesis.ts';
export { hammerstadJensenStatic, hjZ01, hjEpsEff } from './hammerstad-jensen-1980.ts';
export { kirschningJansenEpsEff, KJ1982_RANGE } from './kirschning-jansen-1982.ts';
export { jansenKirschningZ0, JK1983_RANGE } from './jansen-kirschning-1983.ts';
export { currentDistributionAlphaC } from './current-distribution-loss.ts';
export { U_MIN, U_MAX, F_MIN, F_MAX } from './inputs.ts';
export { SUBSTRATE_PRESETS, findPreset, validateSubstrate } from '../substrate/index.ts';
export type { SubstratePreset } from '../substrate/index.ts';
// Coupled microstrip pairs (issue 17).
export type { CoupledOptions, CoupledResult, CoupledMode, GuidedWave, CoupledTarget, CoupledDispersion } from './coupled-types.ts';
export { COUPLED_DISPERSIONS } from './coupled-types.ts';
export { analyzeCoupled, couplingFromModes, modesForCoupling, coupledInto, coupledNumbers, COUPLED_G_MIN, COUPLED_U_MIN, COUPLED_U_MAX } from './coupled.ts';
export { synthesizeCoupled, couplingAtGap, targetModes, coupledLine } from './coupled-synthesis.ts';
export type { CoupledAsk } from './coupled-synthesis.ts';
export { kjCoupledStatic, kjStatic, KJ1984_RANGE } from './kirschning-jansen-1984-coupled.ts';
export { getsingerEpsEff } from './getsinger-1973-coupled-dispersion.ts';
// The line-model interface (issue 12): cross-section description in, figures per mode out.
export type { ModeFigures, ModalFigures, CrossSectionDescription, MicrostripSection, CoupledMicrostripSection, LineModelFamily, SingleMode, CoupledModeName, LineAt, StripLineFamily, CoupledPairFamily, PairModes, PairAt } from './line-model.ts';
export { LineModels, lineModels, microstripFamily, coupledMicrostripFamily, microstripMode, microstripColumns, modeOfLine, stripAt, pairAt, stripColumns, SINGLE_MODE } from './line-model.ts';
