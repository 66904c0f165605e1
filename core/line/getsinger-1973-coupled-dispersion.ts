/**
 * Frequency dependence of the even- and odd-mode effective permittivity of coupled microstrip.
 *
 * Sources: W. J. Getsinger, "Microstrip dispersion model", IEEE Trans. MTT, vol. 21, no. 1, pp. 34–39, Jan. 1973
 * (the single-line model), and W. J. Getsinger, "Dispersion of parallel-coupled microstrip", IEEE Trans. MTT,
 * vol. 21, no. 3, pp. 144–145, March 1973 (its use per mode):
 *     εe(f) = εr − (εr − εe0)/(1 + G·(f/fp)²),   fp = Z/(2 μ0 h),   G = 0.6 + 0.009·Z   (Z in Ω)
 * with Z = Z0e/2 for the even mode (the two strips side by side against ground) and Z = 2·Z0o for the odd mode
 * (the two strips in series), each mode's εe0 from the static model (kirschning-jansen-1984-coupled.ts).
 * Written from memory of the papers (not checked against the print here); the 1984 Kirschning–Jansen paper's own
 * dispersion equations are not used because they could not be checked. The model gives no dispersion of the mode
 * impedances: Z0e and Z0o stay at their static values. No validity range is stated by the author; the tool's
 * higher-order-mode limits apply. Units: f Hz, h m, Z Ω.
 */
import { MU0 } from '../units/constants.ts';

/** εe(f) of one mode, from its static εe0, the mode's model impedance Z (Z0e/2 or 2·Z0o), εr, h and f. */
export function getsingerEpsEff(eps0: number, z: number, er: number, h: number, f: number): number {
  if (f === 0) return eps0;
  const fp = z / (2 * MU0 * h);
  const G = 0.6 + 0.009 * z;
  const r = f / fp;
  return er - (er - eps0) / (1 + G * r * r);
}
