/**
 * Complex effective permittivity of a quasi-TEM line from its measured propagation constant.
 *
 * Source: M. D. Janezic and J. A. Jargon, "Complex permittivity determination from propagation constant
 * measurements", IEEE Microwave and Guided Wave Letters, vol. 9, no. 2, pp. 76–78, Feb. 1999 (doi
 * 10.1109/75.755052). What the paper does (its abstract, checked): a transmission-line method that finds the complex
 * permittivity from propagation constant measurements without a network-analyser calibration — the propagation
 * constant comes from uncalibrated measurements of two sample lengths — shown in X-band rectangular waveguide and
 * compared with transmission/reflection and cavity results. The relation used there, as recalled (equation numbers
 * not reproduced): for a filled guide with cutoff wavenumber k_c and μr = 1,
 *     ε_r = (k_c² − γ²) / k0²,   k0 = ω/c0 = 2π f / c0,   γ = α + jβ.
 * A microstrip's quasi-TEM mode has k_c = 0, so here it becomes the complex effective permittivity
 *     ε_eff = ε'_eff − j ε''_eff = −(γ / k0)²,   ε'_eff = (β² − α²)/k0²,   ε''_eff = 2αβ/k0².
 * The step from ε_eff to the laminate's εr and tanδ is ours, not the paper's: the line model (core/line: filling
 * factor, dispersion, conductor loss) fitted by least squares in laminate-fit.ts.
 * Valid while the line carries one quasi-TEM mode (below the surface-wave onset) and μr = 1.
 * Units: γ in 1/m, f in Hz; ε values are relative (no unit).
 */
import { C0 } from '../../units/constants.ts';
import type { Complex } from '../complex.ts';

/** ε'_eff and ε''_eff (ε_eff = ε' − jε'') from γ (1/m) at f (Hz > 0). */
export function effectivePermittivityFromGamma(gamma: Complex, f: number): { real: number; loss: number } {
  const k0 = (2 * Math.PI * f) / C0;
  const a = gamma.re / k0, b = gamma.im / k0;
  return { real: b * b - a * a, loss: 2 * a * b };
}

/** γ (1/m, principal root with β ≥ 0) from ε'_eff and ε''_eff at f (Hz > 0): γ = j k0 √(ε' − jε''). */
export function gammaFromEffectivePermittivity(real: number, loss: number, f: number): Complex {
  const k0 = (2 * Math.PI * f) / C0;
  // √(ε' − jε''): principal root; then multiply by j k0.
  const m = Math.hypot(real, loss);
  const sr = Math.sqrt((m + real) / 2);
  const si = -Math.sqrt(Math.max(0, (m - real) / 2)) * (loss >= 0 ? 1 : -1);
  return { re: -k0 * si, im: k0 * sr };
}
