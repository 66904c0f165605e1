/**
 * Complex effective permittivity of a quasi-TEM line from its measured propagation constant.
 *
 * Source: M. D. Janezic and J. A. Jargon, "Complex permittivity determination from propagation constant
 * measurements", IEEE Microwave and Guided Wave Letters, vol. 9, no. 2, pp. 76–78, Feb. 1999. What is used here,
 * as recalled (the paper's equation numbers are not reproduced): for a quasi-TEM line with γ = α + jβ,
 *     ε_eff = ε'_eff − j ε''_eff = −(γ / k0)²,   k0 = ω/c0 = 2π f / c0,
 * i.e. ε'_eff = (β² − α²)/k0² and ε''_eff = 2αβ/k0². The substrate's εr and tanδ then follow by matching a line
 * model to ε_eff (their paper maps ε_eff to εr with a numerical model of the line and removes the conductor loss
 * computed separately; here the mapping is our own line model, core/line, fitted in laminate-fit.ts).
 * Valid where the line carries one quasi-TEM mode (below the surface-wave onset) and μr = 1.
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
