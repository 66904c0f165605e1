/**
 * The piecewise-polynomial tables of core/util/smooth-table.ts. Checks against the functions they are fitted from
 * (Math.log and Math.sqrt, the JavaScript library's own: the outside reference here) and the
 * Chebyshev-interpolation error bound of L. N. Trefethen, Approximation Theory and Approximation Practice, SIAM 2013,
 * Thm. 8.2: for a function analytic in a Bernstein ellipse the error of degree-9 interpolation on a short piece is far
 * below double rounding, so what remains is rounding in the power-basis form: the tolerances below are about 20 ulps.
 */
import { describe, expect, it } from 'vitest';
import { buildOctaveTable, evaluateOctaveTable, readOctaveTable } from '../../core/util/smooth-table.ts';

const grid = (lo: number, hi: number, n: number) => Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));

describe('octave tables (pieces found from the bits of x)', () => {
  const t = buildOctaveTable([Math.log, Math.sqrt], -4, 4);
  const out = new Float64Array(2);

  it('reproduce log and sqrt on [1/16, 16) to about 20 ulps, at piece edges as well as inside', () => {
    const xs: number[] = [];
    for (let e = -4; e < 4; e++) for (let j = 0; j < 16; j++) {
      const a = 2 ** e * (1 + j / 16); const b = 2 ** e * (1 + (j + 1) / 16);
      xs.push(a, b * (1 - 2 ** -52), (a + b) / 2, a + (b - a) * 0.123);
    }
    let wl = 0; let ws = 0;
    for (const x of xs) {
      expect(evaluateOctaveTable(t, x, 0, 2, out)).toBe(true);
      wl = Math.max(wl, Math.abs(out[0]! - Math.log(x))); // log crosses 0 at x = 1: absolute
      ws = Math.max(ws, Math.abs(out[1]! / Math.sqrt(x) - 1));
    }
    expect(wl).toBeLessThan(1e-14);
    expect(ws).toBeLessThan(5e-15);
  });

  it('say so (false) outside the table, for 0, negatives, NaN and infinities, and write nothing then', () => {
    out[0] = 42;
    for (const x of [2 ** -4 * (1 - 2 ** -52), 16, 1e300, 0, -1, -0.5, Number.NaN, Infinity, -Infinity]) {
      expect(evaluateOctaveTable(t, x, 0, 1, out)).toBe(false);
    }
    expect(out[0]).toBe(42);
    expect(evaluateOctaveTable(t, 2 ** -4, 0, 1, out)).toBe(true);
  });

  it('reads a run of columns from the one it is asked for', () => {
    evaluateOctaveTable(t, 3, 1, 1, out);
    expect(Math.abs(out[0]! / Math.sqrt(3) - 1)).toBeLessThan(5e-15);
  });

  it('read the argument from a record (the hot-path form) exactly as from an argument', () => {
    const a = new Float64Array(2); const b = new Float64Array(2);
    for (const x of grid(0.07, 15.9, 101)) {
      evaluateOctaveTable(t, x, 0, 2, a); readOctaveTable(t, { x }, 0, 2, b);
      expect(Array.from(b)).toEqual(Array.from(a));
    }
  });

  it('a function that varies too fast for a piece is not reproduced (the tests above can fail): exp(−12x) errs by > 1e-6', () => {
    const e = buildOctaveTable([(x) => Math.exp(-12 * x)], 0, 4);
    let w = 0;
    for (const x of grid(1, 15.9, 2001)) { evaluateOctaveTable(e, x, 0, 1, out); w = Math.max(w, Math.abs(out[0]! / Math.exp(-12 * x) - 1)); }
    expect(w).toBeGreaterThan(1e-6);
  });

  it('fail loudly when a function is not finite on the table', () => {
    expect(() => buildOctaveTable([() => Number.NaN], 0, 1)).toThrow(/not finite/);
  });

  it('refuse octaves that are not whole numbers', () => {
    expect(() => buildOctaveTable([Math.log], -1.5, 2)).toThrow(/whole octaves/);
    expect(() => buildOctaveTable([Math.log], 2, 2)).toThrow(/whole octaves/);
  });
});
