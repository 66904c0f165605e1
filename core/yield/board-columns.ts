/**
 * A made board's element values in the nodal solver's stamped order (core/network/mna.ts), as columns: one kind code
 * per element and its numbers, so the per-point solve (point-solve.ts) reads plain typed arrays.
 */

/** Element kinds: line, conductance, capacitor, inductor, series R-L, any admittance, n-port. */
export const K_LINE = 0, K_G = 1, K_C = 2, K_L = 3, K_RL = 4, K_Y = 5, K_N = 6;

/**
 * Per kind — line: its table (zc re, im, γ re, im at 4k … 4k + 3 for grid point k), derivative table, own width
 * deviation and length (num); conductance: 1/R; capacitor: C; inductor: L; series R-L: L and R(f); admittance and
 * n-port: their function.
 *
 * A class, not an object literal, for the engine's sake: one record is made per solver (per run) and refilled for
 * every board. Made from a literal, the next run's record deoptimised the compiled per-point solve and setNominal
 * (point-solve.ts) once the previous run's record had been collected (seen with node --trace-deopt: "marking
 * dependent code … solve … code dependencies" while the new record was built), so the next run started unoptimised.
 * Class instances keep one shape for as long as the class lives.
 */
export class Columns {
  readonly kind: Int8Array;
  readonly table: (Float64Array | null)[];
  readonly deriv: (Float64Array | null)[];
  readonly delta: Float64Array;
  readonly num: Float64Array;
  readonly fn: (((f: number) => unknown) | null)[];

  /** Columns for `elements` elements, every entry empty until the solver fills it. */
  constructor(elements: number) {
    this.kind = new Int8Array(elements);
    this.table = new Array<Float64Array | null>(elements).fill(null);
    this.deriv = new Array<Float64Array | null>(elements).fill(null);
    this.delta = new Float64Array(elements);
    this.num = new Float64Array(elements);
    this.fn = new Array<((f: number) => unknown) | null>(elements).fill(null);
  }
}
