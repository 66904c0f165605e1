/**
 * Tables of the line models' one-variable terms (core/util/smooth-table.ts, octave tables: 16 pieces per octave,
 * found from the bits of the argument), fitted on first use from the formulas in the model files, so that an analysis
 * makes about a third of the library exp/log calls it otherwise would.
 *
 *  - widthTerms(), over u = W/h from 2^-10 to 2^11 (the accepted 0.001–1000 plus the thickness increment):
 *    Hammerstad–Jensen Z01(u), dZ01/du, the εe exponent a(u)·ln(1 + 10/u) and tanh √(6.517u) of the thickness
 *    correction; the Kirschning–Jansen width terms of P1 and P3; the Jansen–Kirschning R3, 1 − exp(−R2), exp(−R6)
 *    and the R16 width factor.
 *  - frequencyTerms(), over fn = f·h from 2^-14 to 2^8 GHz·mm: the Kirschning–Jansen P3 factor and fn^1.5763; the
 *    Jansen–Kirschning (fn/18.365)^2.745, (fn/12.3)^1.097 and exp(−0.026·fn^1.15656).
 * A piece spans 0.06 in ln of its variable; a term whose k-th derivative in ln u grows like a^k is reproduced to about
 * 2·(0.015·a)^10/10! relative. Terms that vary too fast for that somewhere (exp(−c·u^k) with a large c·u^k) are read
 * from the table only where that bound stays below 1e-13 of the quantity they enter, and from the formula (or the
 * limit the model file states) above: WIDTH_U_MAX says where. Outside the tables the formulas are used.
 * test/unit/line-term-tables.test.ts holds every column to its tolerance against its formula.
 */
import { buildOctaveTable, type OctaveTable } from '../util/smooth-table.ts';
import { hjEpsEffExponent, hjZ01, hjZ01Derivative } from './hammerstad-jensen-1980.ts';
import { KJ_P1_WIDTH_TERM_NEGLIGIBLE_ABOVE, kjFnPower, kjP1WidthTerm, kjP3FrequencyFactor, kjP3WidthTerm } from './kirschning-jansen-1982.ts';
import { JK_R6_TERM_NEGLIGIBLE_ABOVE, JK_R7_WIDTH_FACTOR_IS_ONE_ABOVE, jkExpMinusR6, jkR15FrequencyFactor, jkR16WidthFactor, jkR17FrequencyFactor, jkR3, jkR7WidthFactor, jkR8FrequencyFactor } from './jansen-kirschning-1983.ts';

/** Column order of widthTerms(): dZ01/du and Z01 side by side (both wanted at u1), Z01 and the εe exponent then the
 * dispersion models' terms (all wanted at ur), so that each lookup reads one run of columns. */
export const W_Z01_SLOPE = 0;
export const W_Z01 = 1;
export const W_EE_EXPONENT = 2;
export const W_KJ_P1 = 3;
export const W_KJ_P3 = 4;
export const W_JK_R3 = 5;
export const W_JK_R7 = 6;
export const W_JK_R6 = 7;
export const W_JK_R16 = 8;
export const W_TANH = 9;
export const WIDTH_COLUMNS = 10;

/** Octaves of u covered: [2^-10, 2^11). */
export const WIDTH_OCTAVES = [-10, 11] as const;

/**
 * Upper ends in u of the columns read from the table only on part of it. Above r3 and p3 the analysis uses the
 * formula: R3's relative slope in ln u, 2.07·u^0.641, reaches 14 at u = 20; the P3 term's 4.6u reaches 37 at u = 8,
 * where the term is 4e-18 against the 0.1844 it is added to. Above r16 and tanh it uses 1, which each is to the last
 * bit (the R16 factor above u = 27.5, tanh √(6.517u) above u = 61.4, √(6.517u) > 20). Above p1, r7 and r6 the model
 * files themselves use their limits (their own constants), so what the table holds there is never read.
 */
export const WIDTH_U_MAX = {
  r3: 20, p3: 8, r16: 27.5, tanh: 61.4,
  p1: KJ_P1_WIDTH_TERM_NEGLIGIBLE_ABOVE, r7: JK_R7_WIDTH_FACTOR_IS_ONE_ABOVE, r6: JK_R6_TERM_NEGLIGIBLE_ABOVE,
} as const;

/** Column order of frequencyTerms(). */
export const F_KJ_P3 = 0;
export const F_KJ_POWER = 1;
export const F_JK_R8 = 2;
export const F_JK_R15 = 3;
export const F_JK_R17 = 4;
export const FREQUENCY_COLUMNS = 5;

/** Octaves of fn = f·h (GHz·mm) covered: [2^-14, 2^8). */
export const FREQUENCY_OCTAVES = [-14, 8] as const;

let widthTable: OctaveTable | undefined;
let frequencyTable: OctaveTable | undefined;

/** The width-term table, built on first use (about 34 000 formula evaluations: some 25 ms once, with the frequency table). */
export function widthTerms(): OctaveTable {
  return widthTable ??= buildOctaveTable([
    hjZ01Derivative, hjZ01, hjEpsEffExponent,
    kjP1WidthTerm, kjP3WidthTerm,
    jkR3, jkR7WidthFactor, jkExpMinusR6, jkR16WidthFactor,
    (u) => Math.tanh(Math.sqrt(6.517 * u)),
  ], WIDTH_OCTAVES[0], WIDTH_OCTAVES[1]);
}

/** The frequency-term table, built on first use. */
export function frequencyTerms(): OctaveTable {
  return frequencyTable ??= buildOctaveTable([
    kjP3FrequencyFactor, kjFnPower, jkR8FrequencyFactor, jkR15FrequencyFactor, jkR17FrequencyFactor,
  ], FREQUENCY_OCTAVES[0], FREQUENCY_OCTAVES[1]);
}
