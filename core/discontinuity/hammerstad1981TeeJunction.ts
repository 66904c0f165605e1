/**
 * Reference-plane shifts of a microstrip T-junction (parallel-plate model). ADVISORY: methods.md §6.3 marks the whole
 * model VERIFY (written from secondary sources, not checked against the paper), so the layout shows these shifts
 * and never applies them.
 *
 * Source: E. Hammerstad, "Computer-aided design of microstrip couplers with accurate discontinuity models",
 * IEEE MTT-S International Microwave Symposium Digest, 1981, pp. 54–56 (as transcribed in methods.md §6.3).
 * Main arms of impedance Z1 (both sides), branch Z2; ee1, ee2 their static effective permittivities.
 *   D1 = η0 h/(√ee1 Z1),  D2 = η0 h/(√ee2 Z2)          parallel-plate widths
 *   fp1 = Z1/(2 μ0 h),  r = Z1/Z2,  F = (f/fp1)²
 *   d1 = 0.055 D2 r (1 − 2 r F)                         main-arm planes from the branch centreline
 *   d2 = D1 (0.5 − r (0.05 + 0.7 exp(−1.6 r) + 0.25 r F − 0.17 ln r))   branch plane from the main centreline
 *   n² = 1 − π F (r²/12 + (0.5 − d2/D1)²)              branch transformer ratio
 * Units: h in m, Z in Ω, f in Hz. Validity: not stated here (VERIFY).
 */
export const TEE_SOURCE = 'hammerstad-1981-tee (VERIFY)';
export const TEE_CITATION = 'Hammerstad, IEEE MTT-S IMS Digest 1981, pp. 54–56 — transcription not verified';
const MU0 = 1.25663706212e-6;
const ETA0 = 376.730313668;

export interface TeePlanes { D1: number; D2: number; d1: number; d2: number; n2: number }

export function teeReferencePlanes(p: { z1: number; z2: number; ee1: number; ee2: number; h: number; f: number }): TeePlanes {
  const { z1, z2, ee1, ee2, h, f } = p;
  const D1 = (ETA0 * h) / (Math.sqrt(ee1) * z1);
  const D2 = (ETA0 * h) / (Math.sqrt(ee2) * z2);
  const fp1 = z1 / (2 * MU0 * h);
  const r = z1 / z2;
  const F = (f / fp1) ** 2;
  const d1 = 0.055 * D2 * r * (1 - 2 * r * F);
  const d2 = D1 * (0.5 - r * (0.05 + 0.7 * Math.exp(-1.6 * r) + 0.25 * r * F - 0.17 * Math.log(r)));
  const n2 = 1 - Math.PI * F * (r * r / 12 + (0.5 - d2 / D1) ** 2);
  return { D1, D2, d1, d2, n2 };
}
