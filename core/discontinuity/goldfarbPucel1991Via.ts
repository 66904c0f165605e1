/**
 * Inductance and resistance of a via hole to ground.
 *
 * Source: M. E. Goldfarb and R. A. Pucel, "Modeling via hole grounds in microstrip", IEEE Microwave and Guided Wave
 * Letters, vol. 1, no. 6, pp. 135–137, June 1991. A cylinder of radius r and length h:
 *   L_via = (μ0/2π) [ h ln((h + √(r² + h²))/r) + 1.5 (r − √(r² + h²)) ]          [H]
 *   R_via = R_dc √(1 + f/f_δ),  R_dc = ρ h / (π (r² − (r − tp)²)),  f_δ = ρ/(π μ0 tp²)
 * (tp plating thickness; a solid via has R_dc = ρ h/(π r²)). Pad, anti-pad and ground-return spreading are not
 * included. N vias in parallel: L/N is a lower bound (mutual inductance raises it) — a warning says so.
 * Units: h, r, tp in m; ρ in Ω·m; f in Hz. Quasi-static; the validity range is not restated (not checked against the paper here).
 */
import { requireRange } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';

export const VIA_SOURCE = 'goldfarb-pucel-1991';
export const VIA_CITATION = 'Goldfarb, Pucel, IEEE Microwave and Guided Wave Letters 1(6), 1991, pp. 135–137';
const MU0 = 1.25663706212e-6;

export function viaInductance(h: number, r: number): number {
  requireRange('h', h, 0, Infinity, 'a via length (substrate height) above 0 m', { minExclusive: true });
  requireRange('r', r, 0, Infinity, 'a via radius above 0 m', { minExclusive: true });
  const s = Math.sqrt(r * r + h * h);
  return (MU0 / (2 * Math.PI)) * (h * Math.log((h + s) / r) + 1.5 * (r - s));
}

/** Via resistance at f, Ω. `tp` undefined (or ≥ r) means a solid via. */
export function viaResistance(p: { h: number; r: number; rho: number; f: number; tp?: number }): number {
  const { h, r, rho, f } = p;
  const tp = p.tp !== undefined && p.tp < r ? p.tp : undefined;
  if (tp === undefined) {
    // Solid: skin effect with the radius as the wall thickness.
    const rdc = (rho * h) / (Math.PI * r * r);
    const fd = rho / (Math.PI * MU0 * r * r);
    return rdc * Math.sqrt(1 + f / fd);
  }
  const rdc = (rho * h) / (Math.PI * (r * r - (r - tp) ** 2));
  const fd = rho / (Math.PI * MU0 * tp * tp);
  return rdc * Math.sqrt(1 + f / fd);
}

export interface ViaGround {
  /** Inductance of one via, H. */
  L1: number;
  /** Inductance of the group (L1/count, lower bound), H. */
  L: number;
  /** Resistance of the group at f, Ω. */
  R: number;
  /** Reactance ωL at f, Ω. */
  X: number;
  warnings: Warning[];
}

export function viaGround(p: { h: number; drill: number; count: number; f: number; rho: number; plating?: number }): ViaGround {
  const count = requireRange('count', p.count, 1, 1000, 'a via count of at least 1');
  if (!Number.isInteger(count)) requireRange('count', NaN, 1, 1000, 'a whole number of vias');
  const r = p.drill / 2;
  const L1 = viaInductance(p.h, r);
  const R1 = viaResistance({ h: p.h, r, rho: p.rho, f: p.f, ...(p.plating !== undefined ? { tp: p.plating } : {}) });
  const warnings: Warning[] = [];
  if (count > 1) warnings.push(warn('note', `${count} vias in parallel taken as L/${count}; mutual inductance makes the real value larger unless they are spaced well apart`, { source: VIA_SOURCE, severity: 'info' }));
  const L = L1 / count;
  return { L1, L, R: R1 / count, X: 2 * Math.PI * p.f * L, warnings };
}

/**
 * The via's reactance as an equivalent length of the stub's own line: a short-circuited line of length Δl has
 * Z_in = j Z0 tan(β Δl), so an inductive termination jX looks like Δl = arctan(X/Z0)/β (transmission-line theory,
 * e.g. Pozar, Microwave Engineering, 4th ed., §2.3). A shorted stub is drawn that much shorter.
 */
export function viaEquivalentLength(X: number, z0: number, beta: number): number {
  return Math.atan(X / z0) / beta;
}
