/** Options and results shared by every line model. SI units throughout. */
import type { Warning } from '../util/warnings.ts';
import type { ModeThresholds } from './mode-thresholds.ts';
import type { CrossSectionSource } from './cross-section.ts';

export type DispersionModel = 'kirschning-jansen' | 'hammerstad-jensen' | 'none';
export type ConductorLossModel = 'wheeler-incremental' | 'current-distribution';

export const DISPERSION_MODELS: readonly DispersionModel[] = ['kirschning-jansen', 'hammerstad-jensen', 'none'];
export const CONDUCTOR_LOSS_MODELS: readonly ConductorLossModel[] = ['wheeler-incremental', 'current-distribution'];

export interface LineOptions {
  /** Dispersion of εe and Z0 with frequency; default 'kirschning-jansen' (KJ 1982 εe(f) with JK 1983 Z0(f)). */
  dispersion?: DispersionModel;
  /** Conductor-loss model; default 'wheeler-incremental'. */
  conductorLoss?: ConductorLossModel;
  /**
   * The line as made (e.g. a 2-D field solution with side copper, core/section): its static values replace the
   * microstrip formulas; dispersion and loss models above still apply (made-line.ts). Absent = plain microstrip.
   */
  crossSection?: CrossSectionSource;
}

export interface LineResult {
  /** Strip width, m. */
  width: number;
  /** Frequency, Hz (0 = static). */
  f: number;
  /** Characteristic impedance at f, Ω (equals z0Static at f = 0 or with dispersion 'none'). */
  z0: number;
  /** Quasi-static characteristic impedance, Ω. */
  z0Static: number;
  /** Effective permittivity at f. */
  epsEff: number;
  /** Quasi-static effective permittivity. */
  epsEffStatic: number;
  /** Guided wavelength at f, m; 0 at f = 0 (no wavelength at DC). */
  lambdaG: number;
  /** Phase velocity, m/s. */
  vp: number;
  /** Phase delay per metre, s/m. */
  delayPerM: number;
  /** Conductor attenuation, Np/m (roughness and the DC/thin-metal blend included). */
  alphaC: number;
  /** Dielectric attenuation, Np/m. */
  alphaD: number;
  alphaCdBPerM: number;
  alphaDdBPerM: number;
  /** Total loss per guided wavelength, dB; 0 at f = 0. */
  lossDbPerWavelength: number;
  /** Skin depth in the conductor, m; 0 at f = 0 (not applicable at DC). */
  skinDepth: number;
  /** Higher-order-mode thresholds for this substrate and width. */
  thresholds: ModeThresholds;
  /** Validity, mode and thin-metal warnings, as data. */
  warnings: Warning[];
}

/** Many analyses on one substrate (analyzeLines): one column per quantity, index i for the i-th width. SI units. */
export interface LineColumns {
  width: Float64Array;
  f: Float64Array;
  z0: Float64Array;
  z0Static: Float64Array;
  epsEff: Float64Array;
  epsEffStatic: Float64Array;
  lambdaG: Float64Array;
  vp: Float64Array;
  delayPerM: Float64Array;
  /** Np/m. */
  alphaC: Float64Array;
  /** Np/m. */
  alphaD: Float64Array;
  skinDepth: Float64Array;
  /** The warnings of the analyses that have any, each with the index of its analysis. */
  warnings: { index: number; warning: Warning }[];
}
