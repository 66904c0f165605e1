/**
 * √(x² + y²) without overflow or underflow, for the hot loops (line constants, |S| of every point of every board).
 * V8's Math.hypot takes any number of arguments and copies them into a new array on every call, which made it the
 * largest single source of garbage in the yield estimate. This is the same computation for two numbers: V8 divides
 * each |argument| by the largest and sums the squares (its Kahan compensation is exactly zero after the first of two
 * terms), then multiplies the square root by the largest, so the result is the engine's to the last bit —
 * test/unit/hypot.test.ts compares the two over a million pairs. Infinity wins over NaN, as ECMAScript requires
 * (ECMA-262, Math.hypot).
 */
export function hypot(x: number, y: number): number {
  const a = Math.abs(x), b = Math.abs(y);
  if (a === Infinity || b === Infinity) return Infinity;
  if (a !== a || b !== b) return Number.NaN;
  const m = a > b ? a : b;
  if (m === 0) return 0;
  const p = a / m, q = b / m;
  return Math.sqrt(p * p + q * q) * m;
}
