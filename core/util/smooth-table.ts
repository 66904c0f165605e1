/**
 * Piecewise-polynomial tables of smooth one-variable functions of x > 0, built from the functions themselves on first
 * use.
 *
 * Why: the line model's terms that depend on W/h alone or on f·h alone are exp/log compositions, each a library call
 * of about 10 ns; a degree-9 polynomial on a short piece, evaluated in Estrin's form (independent products, so the
 * processor overlaps them), costs a few ns and reproduces the function to the function's own rounding noise
 * (≈ 1e-14 relative; every table is held to its tolerance against the formula in test/unit/smooth-table.test.ts and
 * test/unit/line-term-tables.test.ts). The formula stays the source of truth: the table is fitted from it at run time,
 * no coefficient is written down.
 *
 * Method: interpolation at the 10 Chebyshev points of each piece (near-best polynomial
 * approximation; L. N. Trefethen, Approximation Theory and Approximation Practice, SIAM 2013, ch. 3–4, 16), converted
 * to powers of the local variable t ∈ [−1, 1]. For a function whose k-th derivative grows like a^k, the error on a
 * piece of half-width r is about 2·(a·r/2)^10/10!, so a table is only used where a·r stays small; callers fall back to
 * the formula outside the range they tabulate.
 */

/** Coefficients per function and piece (degree 9). */
const NC = 10;

/** Chebyshev-point interpolant of g on [a, b] as powers of t ∈ [−1, 1] (x = a + (b − a)(t + 1)/2). */
function fitPiece(g: (x: number) => number, a: number, b: number, out: Float64Array, at: number): void {
  const values = new Array<number>(NC);
  for (let k = 0; k < NC; k++) values[k] = g(a + (b - a) * (Math.cos((Math.PI * (k + 0.5)) / NC) + 1) / 2);
  // Chebyshev coefficients by the discrete cosine sum, then the power basis from T0…T9.
  const c = new Array<number>(NC).fill(0);
  for (let j = 0; j < NC; j++) {
    let s = 0;
    for (let k = 0; k < NC; k++) s += values[k]! * Math.cos((Math.PI * j * (k + 0.5)) / NC);
    c[j] = (2 * s) / NC;
  }
  c[0] = c[0]! / 2;
  let prev = [1]; let cur = [0, 1];
  const power = new Array<number>(NC).fill(0);
  power[0] = c[0]!;
  power[1] = c[1]!;
  for (let j = 2; j < NC; j++) {
    const next = new Array<number>(j + 1).fill(0);
    for (let i = 0; i < cur.length; i++) next[i + 1]! += 2 * cur[i]!;
    for (let i = 0; i < prev.length; i++) next[i]! -= prev[i]!;
    for (let i = 0; i <= j; i++) power[i]! += c[j]! * next[i]!;
    prev = cur; cur = next;
  }
  for (let j = 0; j < NC; j++) out[at + j] = power[j]!;
}

/**
 * A table over x > 0 whose pieces are found from the bits of x instead of its logarithm: 16 pieces per octave
 * (x from 2^e·(1 + j/16) to 2^e·(1 + (j + 1)/16)), each a polynomial in x itself. A piece spans a ratio of at most
 * 17/16, about as much as 0.06 in ln x, so functions that are smooth in ln x are reproduced as well as by a table over
 * ln x, without the library log call that would locate them.
 */
export interface OctaveTable {
  /** The table covers [lo, hi) = [2^eLo, 2^eHi). */
  readonly lo: number;
  readonly hi: number;
  readonly pieces: number;
  /** Number of functions sharing the pieces. */
  readonly count: number;
  /** coef[(piece·count + k)·10 + j]: power-basis coefficient j of function k on the piece. */
  readonly coef: Float64Array;
  /** Key of the first piece: the top 16 bits of the IEEE 754 double 2^eLo (sign, exponent and 4 mantissa bits). */
  readonly keyLo: number;
  /** Per piece: its start and 2/width. */
  readonly start: Float64Array;
  readonly twoOverWidth: Float64Array;
}

const PIECES_PER_OCTAVE = 16;

/** Tables of `fns` (functions of x > 0) on [2^eLo, 2^eHi), 16 pieces per octave. Example: buildOctaveTable([Math.log], -4, 4). */
export function buildOctaveTable(fns: readonly ((x: number) => number)[], eLo: number, eHi: number): OctaveTable {
  if (!Number.isInteger(eLo) || !Number.isInteger(eHi) || !(eHi > eLo) || eLo < -1000 || eHi > 1000) throw new RangeError(`buildOctaveTable: need whole octaves eLo < eHi, got ${eLo}, ${eHi}`);
  const pieces = (eHi - eLo) * PIECES_PER_OCTAVE;
  const count = fns.length;
  const coef = new Float64Array(pieces * count * NC);
  const start = new Float64Array(pieces); const twoOverWidth = new Float64Array(pieces);
  for (let i = 0; i < pieces; i++) {
    const oct = 2 ** (eLo + Math.floor(i / PIECES_PER_OCTAVE));
    const j = i % PIECES_PER_OCTAVE;
    const a = oct * (1 + j / PIECES_PER_OCTAVE); const b = oct * (1 + (j + 1) / PIECES_PER_OCTAVE);
    start[i] = a; twoOverWidth[i] = 2 / (b - a);
    for (let k = 0; k < count; k++) fitPiece(fns[k]!, a, b, coef, (i * count + k) * NC);
  }
  for (let i = 0; i < coef.length; i++) {
    if (!Number.isFinite(coef[i]!)) throw new RangeError(`buildOctaveTable: function ${Math.floor(i / NC) % count} is not finite on [2^${eLo}, 2^${eHi})`);
  }
  const keyLo = (eLo + 1023) * PIECES_PER_OCTAVE;
  return { lo: 2 ** eLo, hi: 2 ** eHi, pieces, count, coef, keyLo, start, twoOverWidth };
}

// The bits of a double, read through two views of one buffer; HI is the 32-bit word with the sign, the exponent and
// the top 20 mantissa bits (word 1 on little-endian machines, every platform the app ships for).
const bits64 = new Float64Array(1);
const bits32 = new Uint32Array(bits64.buffer);
const HI = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;

/** Where an octave table is read: the argument as a field, because a double passed to a call that the compiler does
 * not inline is boxed on the heap, and a field of a long-lived record is updated in place. */
export interface TablePoint { x: number }

/**
 * Writes functions first … first + n − 1 of the octave table at p.x to out[0 … n − 1] and returns true, or returns
 * false (writing nothing) when p.x lies outside the table: the caller then uses the formula.
 */
export function readOctaveTable(tb: OctaveTable, p: TablePoint, first: number, n: number, out: Float64Array): boolean {
  const x = p.x;
  bits64[0] = x;
  const i = (bits32[HI]! >>> 16) - tb.keyLo;
  if (!(i >= 0 && i < tb.pieces)) return false; // also false for NaN, negative x and x beyond the table
  const t = (x - tb.start[i]!) * tb.twoOverWidth[i]! - 1;
  const t2 = t * t; const t4 = t2 * t2; const t8 = t4 * t4;
  const c = tb.coef;
  let b = (i * tb.count + first) * NC;
  for (let k = 0; k < n; k++, b += NC) {
    out[k] = (c[b]! + c[b + 1]! * t + t2 * (c[b + 2]! + c[b + 3]! * t))
      + t4 * ((c[b + 4]! + c[b + 5]! * t) + t2 * (c[b + 6]! + c[b + 7]! * t))
      + t8 * (c[b + 8]! + c[b + 9]! * t);
  }
  return true;
}

const point: TablePoint = { x: 0 };

/** As readOctaveTable, with x as an argument (tests and cold paths). */
export function evaluateOctaveTable(tb: OctaveTable, x: number, first: number, n: number, out: Float64Array): boolean {
  point.x = x;
  return readOctaveTable(tb, point, first, n, out);
}
