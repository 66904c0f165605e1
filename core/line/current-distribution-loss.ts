/**
 * Conductor loss by the current-distribution-factor form (alternative, conductorLoss: 'current-distribution'),
 * kept for comparison with general-purpose RF libraries.
 *
 * Source: attributed to E. Hammerstad and Ø. Jensen, IEEE MTT-S Symposium Digest 1980, pp. 407–409, in the form used
 * by scikit-rf's MLine (the exact printed form is still to be checked against the paper):
 *     Ki = exp(−1.2·(Z0/η0)^0.7),   αc = Rs·Ki·Kr/(Z0·W)        [Np/m]
 * Conventions here (those of the scikit-rf table test/fixtures/line/line-reference.csv): Z0 = Z0(f), W = physical width.
 * Typically 25–45 % above Wheeler's rule for 1 ≤ W/h ≤ 5 (the project's own comparison). Units: Rs Ω, Z0 Ω, W m.
 */
import { ETA0 } from '../units/constants.ts';

/** αc, Np/m, without roughness (multiply by Kr). */
export function currentDistributionAlphaC(rs: number, z0: number, width: number): number {
  const Ki = Math.exp(-1.2 * Math.pow(z0 / ETA0, 0.7));
  return (rs * Ki) / (z0 * width);
}
