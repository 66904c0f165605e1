/**
 * The interface a cross-section model plugs into the line layer with: a description of the line as made (the
 * laminate plus what the process puts around the strip) in, static values per width out. The line layer applies
 * its single-line dispersion and loss models on top (made-line.ts), so a line sized from a 2-D field solution
 * (core/section) goes through the same analysis, synthesis, electrical-length and network code as plain microstrip.
 *
 * Two implementations: plain microstrip (this layer's Hammerstad–Jensen analysis, used when no source is given),
 * and the field solver's tables (core/section/line-source.ts).
 */
import type { Warning } from '../util/warnings.ts';

/** Static (quasi-TEM) values of one strip width. SI units. */
export interface CrossSectionStatics {
  /** Characteristic impedance, Ω. */
  z0: number;
  /** Effective permittivity. */
  epsEff: number;
  /**
   * ∂L/∂n of Wheeler's incremental-inductance rule, H/m per m (αc = Rs·∂L/∂n/(2·μ0·Z0)); 0 when the source has
   * none (thin-sheet copper), in which case the microstrip conductor loss is scaled by the impedance ratio.
   */
  dLdn: number;
  /** Estimated relative error of z0 (the source's own convergence estimate). */
  z0Error: number;
  warnings: Warning[];
}

export interface CrossSectionSource {
  /** Identity for caches: two sources with the same key give the same numbers. */
  readonly key: string;
  /** What the source is, in words, for the piece sheet (e.g. 'field solution: stitched side copper at 0.4 mm'). */
  readonly label: string;
  /** Widths it covers, m (outside: an InputError naming the width). */
  readonly widthRange: { min: number; max: number };
  /** Static values of a strip of `width` metres on the laminate the source was built for. */
  staticAt(width: number): CrossSectionStatics;
}
