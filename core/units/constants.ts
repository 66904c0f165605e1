/**
 * Physical constants, SI. Source: CODATA 2018 recommended values (NIST SP 961, 2019); c0 exact by the SI definition
 * of the metre, mu0 measured since the 2019 SI revision (4π·1e-7 differs by 5e-10 relative).
 */
/** Speed of light in vacuum, m/s (exact). */
export const C0 = 299_792_458;
/** Vacuum permeability, H/m (CODATA 2018). */
export const MU0 = 1.25663706212e-6;
/** Vacuum permittivity, F/m: 1/(mu0·c0²). */
export const EPS0 = 1 / (MU0 * C0 * C0);
/** Wave impedance of free space, Ω: mu0·c0 = 376.730313668 Ω. */
export const ETA0 = MU0 * C0;
/** Decibels per neper: 20/ln(10) = 8.685889638. */
export const NP_TO_DB = 20 / Math.LN10;
