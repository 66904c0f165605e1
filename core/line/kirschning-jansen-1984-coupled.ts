/**
 * Quasi-static even- and odd-mode effective permittivity and characteristic impedance of a symmetric pair of coupled
 * microstrips (zero strip thickness).
 *
 * Source: M. Kirschning and R. H. Jansen, "Accurate wide-range design equations for the frequency-dependent
 * characteristic of parallel coupled microstrip lines", IEEE Trans. MTT, vol. 32, no. 1, pp. 83–90, Jan. 1984
 * (correction: vol. 33, no. 3, p. 288, March 1985) — the static part: εe,e(0) through the modified width v,
 * εe,o(0) through ao, bo, co, do, and Z0e(0), Z0o(0) through Q1 … Q10. The single line they start from is the
 * Hammerstad–Jensen zero-thickness line (Z01(u), εe(u, εr) with a(u), b(εr); hammerstad-jensen-1980.ts), as in
 * the paper. Symbols as in the paper: u = W/h, g = s/h (s the edge-to-edge gap).
 *
 * Validity (as stated by the authors): 0.1 ≤ u ≤ 10, 0.1 ≤ g ≤ 10, 1 ≤ εr ≤ 18; static accuracy about 1 % against
 * their full-wave data. The paper is for t = 0; copper thickness is not in this model. The free-space impedance in
 * the Z0 correction is written η0 (376.73 Ω).
 * Units: u, g, εr dimensionless; impedances in Ω.
 */
import { ETA0 } from '../units/constants.ts';
import { hjEpsEff, hjEpsEffExponent, hjZ01 } from './hammerstad-jensen-1980.ts';

/** Stated range of the static model. */
export const KJ1984_RANGE = { uMin: 0.1, uMax: 10, gMin: 0.1, gMax: 10, erMax: 18 } as const;

/** The Q-terms that depend on u and g (filled by kjQTerms): Q4 (even mode) and Q10 (odd mode), and their
 * derivatives with respect to u (analytic, for Wheeler's rule in coupled-losses.ts). */
export const kjQ = { q4: 0.5, q10: 0.5, dq4du: 0.5, dq10du: 0.5 };

/** The Q-terms of the paper that depend on g alone (Q2, Q3, Q5, Q6, Q9 and e^−g), for one g. */
interface GTerms { g: number; q2: number; q3: number; q5: number; q6: number; q9: number; eg: number }
const newG = (): GTerms => ({ g: Number.NaN, q2: 0.5, q3: 0.5, q5: 0.5, q6: 0.5, q9: 0.5, eg: 0.5 });
// Two remembered gap ratios: an analysis and its loss derivative alternate between g and g + dg.
const gSlots: [GTerms, GTerms] = [newG(), newG()];
let gNext = 0;

function gTerms(g: number): GTerms {
  if (gSlots[0].g === g) return gSlots[0];
  if (gSlots[1].g === g) return gSlots[1];
  const t = gSlots[gNext]!;
  gNext = 1 - gNext;
  const lnG = Math.log(g);
  const g2 = g * g, g5 = g2 * g2 * g, g10 = g5 * g5;
  const r84 = 8.4 / g, r84s = r84 * r84 * r84; // (8.4/g)^3
  const a34 = g / 3.4, a34s = a34 * a34, a34p5 = a34s * a34s * a34;
  const a58 = g / 5.8, a58s = a58 * a58, a58p5 = a58s * a58s * a58;
  const a15 = g / 0.15, a15s = a15 * a15;
  t.g = g;
  t.q2 = 1 + 0.7519 * g + 0.189 * Math.exp(2.31 * lnG);
  t.q3 = 0.1975 + Math.exp(-0.387 * Math.log(16.6 + r84s * r84s)) + Math.log(g10 / (1 + a34p5 * a34p5)) / 241;
  t.q5 = 1.794 + 1.14 * Math.log(1 + 0.638 / (g + 0.517 * Math.exp(2.43 * lnG)));
  t.q6 = 0.2305 + Math.log(g10 / (1 + a58p5 * a58p5)) / 281.3 + Math.log(1 + 0.598 * Math.exp(1.154 * lnG)) / 5.1;
  const q7 = (10 + 190 * g2) / (1 + 82.3 * g2 * g);
  const q8 = Math.exp(-6.5 - 0.95 * lnG - a15s * a15s * a15);
  t.q9 = Math.log(q7) * (q8 + 1 / 16.5);
  t.eg = Math.exp(-g);
  return t;
}

/** Q1 … Q10 of the paper for u, g: writes Q4 and Q10 to kjQ (the g-only terms are remembered for the last two g). */
export function kjQTerms(u: number, g: number): void {
  const t = gTerms(g);
  const lnU = Math.log(u);
  const q1 = 0.8695 * Math.exp(0.194 * lnU);
  const uQ3 = Math.exp(t.q3 * lnU);
  const D = t.eg * uQ3 + (2 - t.eg) / uQ3;
  const q4 = (2 * q1 / t.q2) / D;
  const uQ9 = Math.exp(-t.q9 * lnU);
  const E = Math.exp(t.q6 * lnU * uQ9);
  kjQ.q4 = q4;
  kjQ.q10 = q4 - (t.q5 / t.q2) * E;
  // d/du: Q1' = 0.194·Q1/u; D' = (Q3/u)·(e^−g·u^Q3 − (2 − e^−g)·u^−Q3); (Q6·ln u·u^−Q9)' = Q6·u^−Q9·(1 − Q9·ln u)/u.
  const dq4 = q4 * (0.194 - (t.q3 * (t.eg * uQ3 - (2 - t.eg) / uQ3)) / D) / u;
  kjQ.dq4du = dq4;
  kjQ.dq10du = dq4 - (t.q5 / t.q2) * E * (t.q6 * uQ9 * (1 - t.q9 * lnU)) / u;
}

/** Static results of one pair, written by kjCoupledStatic (one record reused: no allocation in sweeps). */
export const kjStatic = { z01: 0.5, z0: 0.5, ee: 0.5, eeE: 0.5, eeO: 0.5, z0E: 0.5, z0O: 0.5 };

/** εe,e(0), εe,o(0), Z0e(0), Z0o(0) for u, g, εr, and the single line's Z0, εe at u, into kjStatic. */
export function kjCoupledStatic(u: number, g: number, er: number): void {
  const ee = hjEpsEff(u, er);
  const z01 = hjZ01(u);
  const z0 = z01 / Math.sqrt(ee);
  // Even mode: the single-line εe formula at the modified width v.
  const g2 = g * g;
  const v = (u * (20 + g2)) / (10 + g2) + g * Math.exp(-g);
  const eeE = hjEpsEffFromV(v, er);
  // Odd mode.
  const half = (er + 1) / 2;
  const ao = 0.7287 * (ee - half) * (1 - Math.exp(-0.179 * u));
  const bo = (0.747 * er) / (0.15 + er);
  const co = bo - (bo - 0.207) * Math.exp(-0.414 * u);
  const dO = 0.593 + 0.694 * Math.exp(-0.562 * u);
  const eeO = (half + ao - ee) * Math.exp(-co * Math.pow(g, dO)) + ee;
  kjQTerms(u, g);
  const k = (z0 / ETA0) * Math.sqrt(ee);
  kjStatic.z01 = z01; kjStatic.z0 = z0; kjStatic.ee = ee; kjStatic.eeE = eeE; kjStatic.eeO = eeO;
  kjStatic.z0E = (z0 * Math.sqrt(ee / eeE)) / (1 - k * kjQ.q4);
  kjStatic.z0O = (z0 * Math.sqrt(ee / eeO)) / (1 - k * kjQ.q10);
}

/** εe(v, εr) of the Hammerstad–Jensen line at width ratio v (the paper's even-mode form). */
function hjEpsEffFromV(v: number, er: number): number {
  // Same as hjEpsEff(v, er); written through the exponent so the a(v)·ln(1 + 10/v) term is shared code.
  return (er + 1) / 2 + ((er - 1) / 2) * Math.exp(-hjEpsEffExponent(v) * bOf(er));
}

const bm = { er: Number.NaN, b: 0.5 };
function bOf(er: number): number {
  if (er !== bm.er) { bm.er = er; bm.b = 0.564 * Math.pow((er - 0.9) / (er + 3), 0.053); }
  return bm.b;
}

