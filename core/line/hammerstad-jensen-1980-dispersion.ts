/**
 * Simpler dispersion model (alternative to Kirschning–Jansen), selectable as dispersion: 'hammerstad-jensen'.
 *
 * Source: E. Hammerstad and Ø. Jensen, IEEE MTT-S Symposium Digest 1980, pp. 407–409, dispersion eqs.
 * (as transcribed here):  fp = Z00/(2 μ0 h),  G = (π²/12)((εr − 1)/εe0)·√(2π Z00/η0),
 *   εe(f) = εr − (εr − εe0)/(1 + G (f/fp)²),  Z0(f) = Z00·√(εe0/εe(f))·(εe(f) − 1)/(εe0 − 1).
 * Units: f and fp in Hz, h in m, impedances in Ω. No separate validity range is stated; meant for comparison.
 */
import { ETA0, MU0 } from '../units/constants.ts';

/** εe(f) of the HJ dispersion model. */
export function hjDispersionEpsEff(er: number, ee0: number, z00: number, h: number, f: number): number {
  const fp = z00 / (2 * MU0 * h);
  const G = ((Math.PI * Math.PI) / 12) * ((er - 1) / ee0) * Math.sqrt((2 * Math.PI * z00) / ETA0);
  const r = f / fp;
  return er - (er - ee0) / (1 + G * r * r);
}

/** Z0(f) of the HJ dispersion model, Ω. */
export function hjDispersionZ0(ee0: number, eef: number, z00: number): number {
  return z00 * Math.sqrt(ee0 / eef) * ((eef - 1) / (ee0 - 1));
}
