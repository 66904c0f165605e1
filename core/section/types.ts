/**
 * The cross-section a 2-D quasi-static field solution is asked for, and what it returns. SI units throughout
 * (metres; angles in degrees only where the name says `Deg`).
 *
 * Coordinates: the ground plane's top surface is y = 0, the substrate fills 0 ≤ y ≤ h, the strip stands on y = h
 * and is centred on x = 0 (a coupled pair: centred on ±(spacing + width)/2).
 */
import type { Warning } from '../util/warnings.ts';

/** Top-side copper beside the strip(s), at `gap` from the strip's foot (measured on the substrate). */
export interface SideCopper {
  /** Gap between the strip's foot and the side copper's foot, m. */
  gap: number;
  /** Width of each side copper strip, m; Infinity (or any width reaching the solution's edge) = wide copper. */
  width: number;
  /** Which sides carry copper (default both). */
  sides?: 'both' | 'left' | 'right';
  /** 'stitched': at ground potential (vias to the ground plane); 'floating': unconnected, zero net charge. */
  connection: 'stitched' | 'floating';
}

/** A groove cut into the substrate in every gap between copper (isolation milling), below the copper's foot. */
export interface Trench {
  /** Depth into the substrate, m. */
  depth: number;
  /** Included angle of a V-bit, degrees (walls narrow with depth); absent = straight walls (end mill). */
  angleDeg?: number;
}

/** A dielectric coat (solder mask or conformal coat) of even thickness over everything exposed on top. */
export interface Cover { er: number; thickness: number }

export interface SectionSpec {
  /** Substrate relative permittivity. */
  er: number;
  /** Substrate height, m. */
  h: number;
  /** Strip width at its foot (on the substrate), m. */
  width: number;
  /** Copper thickness, m (0 = a thin sheet). */
  t: number;
  /** Side-wall angle of all copper edges to the substrate plane, degrees; 90 (default) = vertical walls. */
  etchAngleDeg?: number;
  /** A second, equal strip at this edge-to-edge spacing, m (coupled pair: even and odd modes). */
  spacing?: number;
  side?: SideCopper;
  trench?: Trench;
  cover?: Cover;
  /** A grounded metal lid at this height above the ground plane's top, m. */
  lid?: number;
}

export type SectionModeName = 'single' | 'even' | 'odd';

/** One quasi-TEM mode's per-unit-length values, each with its own error estimate. */
export interface SectionMode {
  mode: SectionModeName;
  /** Capacitance per length with the dielectrics, F/m. */
  c: number;
  /** Capacitance per length with every dielectric replaced by vacuum, F/m. */
  cAir: number;
  /** Inductance per length, H/m (1/(c0²·cAir)). */
  l: number;
  /** Characteristic impedance, Ω. */
  z0: number;
  /** Effective permittivity c/cAir. */
  epsEff: number;
  /**
   * Estimated relative error of c, cAir, z0 and epsEff (Richardson: the change between two nested grids divided by
   * 2^p − 1, p the observed order; see docs/cross-section-solver.md).
   */
  error: { c: number; cAir: number; z0: number; epsEff: number };
  /**
   * Wheeler's incremental-inductance rule: ∂L/∂n, the growth of L when every conductor surface recedes by dn, H/m
   * per m. Conductor loss αc = Rs·(∂L/∂n)/(2·μ0·Z0) Np/m (Rs surface resistance, Ω). 0 when not computed (t = 0).
   */
  dLdn: number;
  /** C and Ca on each grid level, coarse to fine, F/m (the convergence study reads them). */
  levels: { c: number[]; cAir: number[] };
}

/** A potential map on the (non-uniform) grid, for drawing equipotentials: v[j·x.length + i] at (x[i], y[j]), V. */
export interface PotentialMap { x: Float64Array; y: Float64Array; v: Float64Array }

export interface SectionResult {
  spec: SectionSpec;
  /** 'single' for one strip; 'even' and 'odd' for a pair. */
  modes: SectionMode[];
  /** Potential of the first mode with the dielectrics (strip at 1 V), when asked for. */
  potential?: PotentialMap;
  /** Unknowns of the finer grid, and PCG iterations spent in all solves (for the benchmark and the docs). */
  stats: { nodesFine: number; iterations: number; order: number };
  warnings: Warning[];
}

export interface SolveOptions {
  /** Grid fineness: 1 (default) is tuned for ≈ 0.2 % estimated error; larger is finer (cost ∝ fineness²). */
  fineness?: number;
  /** Also return the potential map of the first mode (for the cross-section view). */
  potential?: boolean;
  /** Compute ∂L/∂n for Wheeler's rule (one more pair of vacuum solves per mode; default true when t > 0). */
  loss?: boolean;
  /** Levels of nested refinement (2 = coarse + fine, Richardson; 3 for convergence studies). Default 2. */
  levels?: 2 | 3;
}
