/** Options and results of the coupled-pair models (coupled.ts). SI units throughout. */
import type { Warning } from '../util/warnings.ts';
import type { ModeThresholds } from './mode-thresholds.ts';

/** Dispersion of the modes' εe: Getsinger 1973 per mode (default) or none (static values at every f). */
export type CoupledDispersion = 'getsinger' | 'none';
export const COUPLED_DISPERSIONS: readonly CoupledDispersion[] = ['getsinger', 'none'];

export interface CoupledOptions {
  dispersion?: CoupledDispersion;
}

/**
 * What every guided quasi-TEM wave has, whatever carries it (a single strip, one mode of a pair, a solved section):
 * its impedance and effective permittivity at f and static, its phase constant and guided wavelength. SI units. The
 * line layer's mode figures, the coupled modes and the sized pieces' figures all extend it.
 */
export interface GuidedWave {
  /** Characteristic impedance at f, and quasi-static, Ω. */
  z0: number;
  z0Static: number;
  /** Effective permittivity at f, and quasi-static. */
  epsEff: number;
  epsEffStatic: number;
  /** Phase constant at f, rad/m (0 at f = 0). */
  beta: number;
  /** Guided wavelength at f, m (0 at f = 0). */
  lambdaG: number;
}

/** One propagation mode of the pair (even: both strips at the same potential; odd: opposite); its z0 is one strip's (the dispersion model keeps it static). */
export interface CoupledMode extends GuidedWave {
  /** Phase velocity, m/s. */
  vp: number;
  /** Conductor and dielectric attenuation, Np/m (roughness and the DC blend included). */
  alphaC: number;
  alphaD: number;
}

export interface CoupledResult {
  /** Each strip's width and the edge-to-edge gap, m. */
  width: number;
  spacing: number;
  /** Frequency, Hz (0 = static). */
  f: number;
  even: CoupledMode;
  odd: CoupledMode;
  /** Voltage coupling factor C = (Z0e − Z0o)/(Z0e + Z0o) of a quarter-wave section at its centre frequency. */
  couplingFactor: number;
  /** −20·log10 C, dB (capped at 400 dB). */
  couplingDb: number;
  /** √(Z0e·Z0o), Ω: the system impedance the pair is matched to as a coupler. */
  z0System: number;
  /** The models used, by id. */
  models: { static: 'kirschning-jansen-1984'; dispersion: CoupledDispersion; conductorLoss: 'wheeler-incremental-mode-ratio'; dielectricLoss: 'filling-factor' };
  /** Higher-order-mode thresholds for this substrate and the pair's total width (2W + s). */
  thresholds: ModeThresholds;
  warnings: Warning[];
}

/** What a coupled pair is synthesised from: its mode impedances, or a coupling in dB and a system impedance. */
export type CoupledTarget = { z0Even: number; z0Odd: number } | { couplingDb: number; z0: number };
