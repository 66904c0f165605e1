/**
 * Classic closed-form width synthesis, used only as seeds for the exact inversion and for comparison.
 *
 * Hammerstad 1975: E. O. Hammerstad, "Equations for microstrip circuit design", Proc. 5th European Microwave
 * Conference, Hamburg, 1975, pp. 268–272 (the form reproduced in D. M. Pozar, Microwave Engineering, 4th ed., 2012,
 * §3.8). Two regimes split at W/h = 2. Known error against the HJ analysis: |ΔZ0| ≤ 0.26 % for εr 2.2–10.2,
 * Z0 20–150 Ω, t = 0 (the project's own comparison).
 *
 * Wheeler 1977: H. A. Wheeler, "Transmission-line properties of a strip on a dielectric sheet on a plane", IEEE
 * Trans. MTT, vol. 25, no. 8, pp. 631–647, Aug. 1977, synthesis forms split at Z0 = 44 − 2εr Ω. Known error: within
 * 0.6 % in Z0 except next to the split for low εr (2.9 % at εr 2.2, 40 Ω) (the project's own comparison).
 * Both ignore thickness and dispersion. Units: Z0 in Ω, result u = W/h.
 */

/** W/h by Hammerstad 1975 for target z0 (Ω) on relative permittivity er (zero thickness). */
export function hammerstad1975WidthRatio(z0: number, er: number): number {
  const A = (z0 / 60) * Math.sqrt((er + 1) / 2) + ((er - 1) / (er + 1)) * (0.23 + 0.11 / er);
  const eA = Math.exp(A);
  const den = eA * eA - 2;
  if (den > 0) {
    const u = (8 * eA) / den;
    if (u < 2) return u;
  }
  const B = (377 * Math.PI) / (2 * z0 * Math.sqrt(er));
  return (2 / Math.PI) * (B - 1 - Math.log(2 * B - 1) + ((er - 1) / (2 * er)) * (Math.log(B - 1) + 0.39 - 0.61 / er));
}

/** W/h by Wheeler 1977 for target z0 (Ω) on relative permittivity er (zero thickness). */
export function wheeler1977WidthRatio(z0: number, er: number): number {
  if (z0 > 44 - 2 * er) {
    const Hp = (z0 * Math.sqrt(2 * (er + 1))) / 119.9 + 0.5 * ((er - 1) / (er + 1)) * (Math.log(Math.PI / 2) + Math.log(4 / Math.PI) / er);
    const eH = Math.exp(Hp);
    return 1 / (eH / 8 - 1 / (4 * eH));
  }
  const d = (59.95 * Math.PI * Math.PI) / (z0 * Math.sqrt(er));
  return (2 / Math.PI) * (d - 1 - Math.log(2 * d - 1)) + ((er - 1) / (Math.PI * er)) * (Math.log(d - 1) + 0.293 - 0.517 / er);
}
