/**
 * The sized figures of one piece as the panels show them (the layout's numbers, renamed for display).
 * Filled from the core's sizing result in state/layoutView.ts; nothing here is computed by the renderer.
 */
import type { Warning } from '../../../core/index.ts';

export interface PieceFigures {
  id: string;
  /** Copper width, m (start width for tapers). */
  width: number;
  /** End width for tapers, m. */
  widthEnd?: number;
  /** Characteristic impedance at f0, Ω. */
  z0: number;
  /** Effective permittivity at f0. */
  eeff?: number;
  /** Physical length, m, after compensations. */
  length: number;
  /**
   * Electrical length the piece realises at f0, degrees: with its end corrections, and from a modelled tee's reference
   * planes (the sizing's effectiveDeg) — the number a degrees spec asks for.
   */
  electricalDeg: number;
  /** Length corrections at the ends (open end, via, bends, pads), applied or advisory, from the sizing. */
  compensations: { model: string; source: string; amount: number; applied: boolean; node: string; note: string }[];
  /** Every junction the piece meets (tees, steps, crosses): model, whether it is in the sweep, validity, residual. */
  junctions: JunctionRow[];
  warnings: Warning[];
}

/** One junction as the piece sheet lists it (from a compensation's `junction` record in the sizing). */
export interface JunctionRow {
  node: string;
  kind: 'tee' | 'step' | 'cross' | 'other';
  role: string;
  /** Citation of the model, or 'none at hand'. */
  source: string;
  modelled: boolean;
  inRange: boolean;
  validity: string;
  /** Reference-plane shift from the junction centre, m (tees), else null. */
  shift: number | null;
  residual: { phaseDeg: number; reflectionDb: number } | null;
}
