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
 */
export interface Columns {
  kind: Int8Array;
  table: (Float64Array | null)[];
  deriv: (Float64Array | null)[];
  delta: Float64Array;
  num: Float64Array;
  fn: (((f: number) => unknown) | null)[];
}
