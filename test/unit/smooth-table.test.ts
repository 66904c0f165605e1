/**
 * The piecewise-polynomial tables of core/util/smooth-table.ts. Checks against the functions they are fitted from
 * (Math.exp, Math.sin, Math.log, Math.sqrt — the JavaScript library's own, the outside reference here) and the
 * Chebyshev-interpolation error bound of L. N. Trefethen, Approximation Theory and Approximation Practice, SIAM 2013,
 * Thm. 8.2: for a function analytic in a Bernstein ellipse the error of degree-9 interpolation on a short piece is far
 * below double rounding, so what remains is rounding in the power-basis form: the tolerances below are about 20 ulps.
 */
import { describe, expect, it } from 'vitest';
import { buildOctaveTable, buildTable, evaluateOctaveTable, evaluateTable, lookup } from '../../core/util/smooth-table.ts';

function worst(fn: (x: number) => number, approx: (x: number) => number, xs: number[]): number {
  let w = 0;
  for (const x of xs) { const a = fn(x); w = Math.max(w, Math.abs(approx(x) - a) / Math.max(Math.abs(a), 1e-300)); }
  return w;
}
const grid = (lo: number, hi: number, n: number) => Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));

describe('tables over a linear variable', () => {
  it('reproduce exp on [0, 1] in 8 pieces and sin on [1, 10] in 64 pieces to about 20 ulps', () => {
    const e = buildTable([Math.exp], 0, 1, 8);
    expect(worst(Math.exp, (x) => lookup(e, 0, x), grid(0, 1, 10_001))).toBeLessThan(5e-15);
    const s = buildTable([Math.sin, Math.cos], 1, 10, 64);
    // sin has zeros at π, 2π, 3π: compare absolutely there.
    const out = new Float64Array(2);
    let w = 0;
    for (const x of grid(1, 10, 10_001)) { evaluateTable(s, x, 0, 2, out); w = Math.max(w, Math.abs(out[0]! - Math.sin(x)), Math.abs(out[1]! - Math.cos(x))); }
    expect(w).toBeLessThan(5e-15);
  });

  it('fail loudly on a bad interval or a function that is not finite', () => {
    expect(() => buildTable([Math.exp], 1, 1, 4)).toThrow(/lo < hi/);
    expect(() => buildTable([Math.exp], 0, 1, 2.5)).toThrow(/whole number/);
    expect(() => buildTable([() => Number.NaN], 0, 1, 1)).toThrow(/not finite/);
  });

  it('a function with a kink is not reproduced (the test can fail): |x − 0.3| on one piece errs by more than 1e-3', () => {
    const k = buildTable([(x) => Math.abs(x - 0.3)], 0, 1, 1);
    expect(worst((x) => Math.abs(x - 0.3), (x) => lookup(k, 0, x), grid(0, 1, 1001).filter((x) => Math.abs(x - 0.3) > 0.05))).toBeGreaterThan(1e-3);
  });
});

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

  it('refuse octaves that are not whole numbers', () => {
    expect(() => buildOctaveTable([Math.log], -1.5, 2)).toThrow(/whole octaves/);
    expect(() => buildOctaveTable([Math.log], 2, 2)).toThrow(/whole octaves/);
  });
});
