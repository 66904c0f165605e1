/**
 * Open-end length extension of a microstrip line.
 *
 * Source: M. Kirschning, R. H. Jansen and N. H. L. Koster, "Accurate model for open end effect of microstrip
 * lines", Electronics Letters, vol. 17, no. 3, pp. 123–125, Feb. 1981 (eqs. for ξ1…ξ5). The paper's five factors
 * ξ1…ξ5 are written x1…x5 here:
 *   x1 = 0.434907 (ee^0.81 + 0.26)/(ee^0.81 − 0.189) · (u^0.8544 + 0.236)/(u^0.8544 + 0.87)
 *   x2 = 1 + u^0.371/(2.358 er + 1)
 *   x3 = 1 + 0.5274 arctan(0.084 u^(1.9413/x2)) / ee^0.9236
 *   x4 = 1 + 0.0377 arctan(0.067 u^1.456) (6 − 5 exp(0.036 (1 − er)))
 *   x5 = 1 − 0.218 exp(−7.5 u)
 *   Δl/h = x1 x3 x5 / x4,   C_oc = Δl √ee / (c0 Z0)
 * Inputs: u = W/h (dimensionless), er (relative permittivity), ee = STATIC effective permittivity at u; h in m.
 * Validity: 0.01 ≤ u ≤ 100, er ≤ 50 (as usually quoted, from memory; the paper's own statement of the range is still to be checked, and the
 * formula reproduces the project's checked example). Static (quasi-TEM) model.
 * Layout use: an open stub of electrical length θ is drawn Δl shorter than l(θ).
 */
import { requireRange } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { rangeWarning } from './validity.ts';

export const OPEN_END_SOURCE = 'kirschning-jansen-koster-1981';
export const OPEN_END_CITATION = 'Kirschning, Jansen, Koster, Electronics Letters 17(3), 1981, pp. 123–125';
const C0 = 299_792_458;

export interface OpenEndResult {
  /** Length extension Δl, m. */
  dl: number;
  /** Δl/h. */
  dlOverH: number;
  warnings: Warning[];
}

export function openEndExtension(p: { u: number; er: number; eeStatic: number; h: number }): OpenEndResult {
  const u = requireRange('u', p.u, 0, Infinity, 'a width-to-height ratio W/h above 0', { minExclusive: true });
  const er = requireRange('er', p.er, 1, Infinity, 'a relative permittivity of at least 1');
  const ee = requireRange('eeStatic', p.eeStatic, 1, er, 'an effective permittivity between 1 and er');
  const h = requireRange('h', p.h, 0, Infinity, 'a substrate height above 0 m', { minExclusive: true });
  const e81 = ee ** 0.81, u8544 = u ** 0.8544;
  const x1 = 0.434907 * ((e81 + 0.26) / (e81 - 0.189)) * ((u8544 + 0.236) / (u8544 + 0.87));
  const x2 = 1 + u ** 0.371 / (2.358 * er + 1);
  const x3 = 1 + (0.5274 * Math.atan(0.084 * u ** (1.9413 / x2))) / ee ** 0.9236;
  const x4 = 1 + 0.0377 * Math.atan(0.067 * u ** 1.456) * (6 - 5 * Math.exp(0.036 * (1 - er)));
  const x5 = 1 - 0.218 * Math.exp(-7.5 * u);
  const dlOverH = (x1 * x3 * x5) / x4;
  const warnings: Warning[] = [];
  const w1 = rangeWarning(OPEN_END_SOURCE, 'W/h', u, 0.01, 100); if (w1) warnings.push(w1);
  const w2 = rangeWarning(OPEN_END_SOURCE, 'εr', er, 1, 50); if (w2) warnings.push(w2);
  return { dl: dlOverH * h, dlOverH, warnings };
}

/** Equivalent end capacitance C_oc = Δl √ee / (c0 Z0), F (Kirschning, Jansen & Koster 1981). */
export function openEndCapacitance(dl: number, eeStatic: number, z0: number): number {
  return (dl * Math.sqrt(eeStatic)) / (C0 * z0);
}

/**
 * Hammerstad 1975 alternative, for comparison only (E. O. Hammerstad, "Equations for microstrip circuit design",
 * Proc. 5th European Microwave Conference, 1975, pp. 268–272): Δl/h = 0.102 (u + 0.106)/(u + 0.264) ·
 * [1.166 + ((ee + 1)/ee)(0.9 + ln(u + 2.475))].
 */
export function openEndExtensionHammerstad1975(p: { u: number; eeStatic: number; h: number }): number {
  const { u, eeStatic: ee, h } = p;
  return h * 0.102 * ((u + 0.106) / (u + 0.264)) * (1.166 + ((ee + 1) / ee) * (0.9 + Math.log(u + 2.475)));
}
