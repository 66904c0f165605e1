/**
 * Surface-roughness factor on conductor loss.
 *
 * Source: E. Hammerstad and F. Bekkadal, "Microstrip Handbook", ELAB report STF44 A74169, University of Trondheim
 * (NTH), Norway, 1975:  Kr = 1 + (2/π)·arctan(1.4·(Δrms/δ)²). Multiplies αc; saturates at 2, so it under-predicts
 * very rough foil at high frequency. Validity: Δrms up to a few skin depths. Units: Δrms and δ in m.
 */

/** Kr for rms roughness and skin depth given as (Δrms/δ)² (dimensionless). */
export function hammerstadBekkadalKr(roughOverDeltaSq: number): number {
  return 1 + (2 / Math.PI) * Math.atan(1.4 * roughOverDeltaSq);
}
