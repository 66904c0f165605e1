/**
 * Equal-ripple band-stop of N shunt open stubs joined by N − 1 connecting lines, every piece a quarter wave at f0,
 * designed exactly in Richards' variable instead of by the narrow-band form.
 *
 * Sources:
 * - P. I. Richards, "Resistor-transmission-line circuits", Proc. IRE 36, 217–220, 1948; D. M. Pozar, Microwave
 *   Engineering, 4th ed., Wiley, 2012, §8.4 (eq. 8.67): with every piece commensurate, an open stub of impedance Zs
 *   is a shunt admittance j·tan θ/Zs and a line a unit element, θ = (π/2)·f/f0. The ABCD matrices are Pozar Table 4.1.
 * - The band-stop as a low-pass in Ω = tan θ: the stubs short the line at θ = π/2, the pass band is θ < θc with
 *   θc = (π/2)(1 − Δ/2) (Pozar §8.5 gives the edges f0(1 ∓ Δ/2)), mirrored about f0.
 * - The prototype it must meet: equal ripple L_Ar up to the edge (Matthaei, Young and Jones 1964, §4.03, eq. 4.03-3:
 *   L_A = 10 log10(1 + ε·T_N²(ω'/ω'1)), ε = 10^(L_Ar/10) − 1).
 *
 * - The response it is made to have: the optimum equal-ripple function of N stubs and N − 1 non-redundant lines,
 *   1/|S21|² = 1 + ε·F², F = cos or cosh of [N·arccos(tan θ/tan θc) + (N − 1)·arccos(sin θ/sin θc)] (M. C. Horton and
 *   R. J. Wenzel, "General theory and design of optimum quarter-wave TEM filters", IEEE Trans. MTT-13(3), 316–327,
 *   1965; the form quoted from memory, and confirmed here: an unconstrained search for the most selective row
 *   with ripple L_Ar converges on it). It is equal ripple with its edge at θc and steeper than the prototype mapped
 *   by Ω = tan θ (the lines add N − 1 to the order of the skirt).
 *
 * Why not Pozar's eq. 8.79 (Zs = 4·Z0/(π·g·Δ) with Z0 lines): its lines are inverters only at f0, so across a wide
 * band the ripple comes out several times the asked one (a 0.5 dB, 50 %, order 3 design swept at 1.9 dB). Here the
 * N free impedances of the symmetric row are fitted to the optimum response (least squares in dB over the pass
 * band and the near stop band, which has an exact solution).
 * The search is the downhill simplex of J. A. Nelder and R. Mead, Computer Journal 7(4), 308–313, 1965, in the
 * logarithms of the impedances, kept within 0.2–5 × Z0 (stubs) and 0.3–3 × Z0 (lines).
 */
import { InputError, describe } from '../util/errors.ts';

/** Stub and connecting-line impedances of the row, normalised to the ports' Z0; stub k sits between lines k − 1 and k. */
export interface StubRow { stubZ: number[]; lineZ: number[] }

/** Insertion loss (dB) of the ideal row at electrical length θ of every piece (θ = π/2 at f0), ports at 1. */
export function rowLossDb(row: StubRow, theta: number): number {
  const c = Math.cos(theta), s = Math.sin(theta), t = Math.tan(theta);
  // ABCD of the row as complex entries [re, im]; a stub is [[1, 0], [j t/zs, 1]], a line [[c, j z s], [j s/z, c]].
  let A: [number, number] = [1, 0], B: [number, number] = [0, 0], C: [number, number] = [0, 0], D: [number, number] = [1, 0];
  for (let k = 0; k < row.stubZ.length; k++) {
    const y = t / row.stubZ[k]!;
    // [A B; C D]·[1 0; j y 1] = [A + j y B, B; C + j y D, D]
    A = [A[0] - y * B[1], A[1] + y * B[0]];
    C = [C[0] - y * D[1], C[1] + y * D[0]];
    const z = row.lineZ[k];
    if (z === undefined) continue;
    // [A B; C D]·[c j z s; j s/z c]
    const nA: [number, number] = [A[0] * c - (B[1] * s) / z, A[1] * c + (B[0] * s) / z];
    const nB: [number, number] = [-A[1] * z * s + B[0] * c, A[0] * z * s + B[1] * c];
    const nC: [number, number] = [C[0] * c - (D[1] * s) / z, C[1] * c + (D[0] * s) / z];
    const nD: [number, number] = [-C[1] * z * s + D[0] * c, C[0] * z * s + D[1] * c];
    A = nA; B = nB; C = nC; D = nD;
  }
  const re = A[0] + B[0] + C[0] + D[0], im = A[1] + B[1] + C[1] + D[1];
  return 10 * Math.log10((re * re + im * im) / 4);
}

/** Chebyshev polynomial T_N(w) for any real w. */
function chebyshevT(n: number, w: number): number {
  const a = Math.abs(w);
  if (a <= 1) return Math.cos(n * Math.acos(a));
  const v = Math.cosh(n * Math.acosh(a));
  return w < 0 && n % 2 === 1 ? -v : v;
}

/** The equal-ripple prototype's attenuation at ω'/ω'1 = w (Matthaei, Young and Jones 1964, eq. 4.03-3). */
export function prototypeLossDb(n: number, rippleDb: number, w: number): number {
  return 10 * Math.log10(1 + (10 ** (rippleDb / 10) - 1) * chebyshevT(n, w) ** 2);
}

const STUB_RANGE = [Math.log(0.2), Math.log(5)] as const, LINE_RANGE = [Math.log(0.3), Math.log(3)] as const;

/**
 * The optimum equal-ripple loss (dB) of N stubs and N − 1 lines with its pass band ending at θc (Horton and Wenzel
 * 1965, as above), at θ in [0, π/2).
 */
export function optimumLossDb(n: number, rippleDb: number, thetaC: number, theta: number): number {
  const a = Math.tan(theta) / Math.tan(thetaC), b = Math.sin(theta) / Math.sin(thetaC);
  const F = a <= 1
    ? Math.cos(n * Math.acos(a) + (n - 1) * Math.acos(Math.min(1, b)))
    : Math.cosh(n * Math.acosh(a) + (n - 1) * Math.acosh(Math.max(1, b)));
  return 10 * Math.log10(1 + (10 ** (rippleDb / 10) - 1) * F * F);
}

/** The symmetric row from its free half: ⌈N/2⌉ stub logarithms then ⌈(N−1)/2⌉ line logarithms. */
function rowOf(x: readonly number[], n: number): StubRow {
  const ns = Math.ceil(n / 2);
  return {
    stubZ: Array.from({ length: n }, (_, k) => Math.exp(x[Math.min(k, n - 1 - k)]!)),
    lineZ: Array.from({ length: n - 1 }, (_, k) => Math.exp(x[ns + Math.min(k, n - 2 - k)]!)),
  };
}

/** Downhill simplex (Nelder and Mead 1965; coefficients 1, 2, ½, ½), each trial point clamped by `clamp`. */
function simplex(f: (x: number[]) => number, start: number[], step: number, maxIter: number, clamp: (x: number[]) => number[]): { x: number[]; v: number } {
  const n = start.length;
  const mk = (x: number[]) => { const c = clamp(x); return { x: c, v: f(c) }; };
  let pts = [mk(start), ...start.map((_, i) => mk(start.map((v, j) => (i === j ? v + step : v))))];
  for (let it = 0; it < maxIter; it++) {
    pts.sort((a, b) => a.v - b.v);
    if (pts[n]!.v - pts[0]!.v < 1e-10) break;
    const centre = start.map((_, j) => pts.slice(0, n).reduce((s, p) => s + p.x[j]!, 0) / n);
    const worst = pts[n]!;
    const along = (t: number) => mk(centre.map((cj, j) => cj + t * (worst.x[j]! - cj)));
    const r = along(-1);
    if (r.v < pts[0]!.v) { const e = along(-2); pts[n] = e.v < r.v ? e : r; continue; }
    if (r.v < pts[n - 1]!.v) { pts[n] = r; continue; }
    const k = along(r.v < worst.v ? -0.5 : 0.5);
    if (k.v < Math.min(r.v, worst.v)) { pts[n] = k; continue; }
    const best = pts[0]!;
    pts = pts.map((p, i) => (i === 0 ? p : mk(p.x.map((v, j) => best.x[j]! + 0.5 * (v - best.x[j]!)))));
  }
  pts.sort((a, b) => a.v - b.v);
  return pts[0]!;
}

/**
 * The equal-ripple row of order n (1–7) whose pass band ends at θc (0 < θc < π/2) with ripple `rippleDb`.
 * Starts from the narrow-band form in Richards' variable (Zs/Z0 = tan θc/g_k, lines at Z0) and two other line
 * levels, and keeps the best; a `near` row (one fitted for a slightly different band or ripple) is tried first.
 */
export function equalRippleRow(g: readonly number[], n: number, rippleDb: number, thetaC: number, near?: StubRow): StubRow & { fitDb: number } {
  if (!Number.isInteger(n) || n < 1 || n > 7) throw new InputError('out-of-range', 'bandstop.order', 'an equal-ripple band-stop order from 1 to 7', describe(n));
  // The same question gets the same answer from the memo (a block is generated again for its preview, placing, a
  // re-opened spec): the fit is a pure function of its inputs, so remembering it keeps results identical.
  const key = JSON.stringify([g, n, rippleDb, thetaC, near?.stubZ, near?.lineZ]);
  const known = FITS.get(key);
  if (known) return { stubZ: [...known.stubZ], lineZ: [...known.lineZ], fitDb: known.fitDb };
  const fit = fitRow(g, n, rippleDb, thetaC, near);
  if (FITS.size >= FITS_KEPT) FITS.delete(FITS.keys().next().value!);
  FITS.set(key, fit);
  return { stubZ: [...fit.stubZ], lineZ: [...fit.lineZ], fitDb: fit.fitDb };
}

/** Fits already made, oldest first (a bounded memo: a block's correction loop asks about ten). */
const FITS = new Map<string, StubRow & { fitDb: number }>();
const FITS_KEPT = 64;

function fitRow(g: readonly number[], n: number, rippleDb: number, thetaC: number, near?: StubRow): StubRow & { fitDb: number } {
  const ns = Math.ceil(n / 2), nl = Math.ceil((n - 1) / 2);
  const pass = Array.from({ length: 48 }, (_, k) => (thetaC * (k + 1)) / 48);
  const passWant = pass.map((th) => optimumLossDb(n, rippleDb, thetaC, th));
  /** The worst pass-band error of a row, dB: near zero when it is the optimum. */
  const passError = (row: StubRow) => Math.max(...pass.map((th, k) => Math.abs(rowLossDb(row, th) - passWant[k]!)));
  const clamp = (x: number[]) => x.map((v, i) => { const [lo, hi] = i < ns ? STUB_RANGE : LINE_RANGE; return v < lo ? lo : v > hi ? hi : v; });
  // Line levels to start from: the fitted lines fall from about 1.2·Z0 (0.1 dB) to 0.6·Z0 (3 dB).
  const starts = [1, 0.85, 1.15, 0.6].map((line) => [...Array.from({ length: ns }, (_, k) => Math.log(Math.tan(thetaC) / g[k + 1]!)), ...Array<number>(nl).fill(Math.log(line))]);
  if (near && near.stubZ.length === n) starts.unshift([...near.stubZ.slice(0, ns), ...near.lineZ.slice(0, nl)].map(Math.log));
  let best: { row: StubRow; fitDb: number } | null = null;
  // The fit runs over the pass band and part of the stop band: how much of it changes which local minimum the search
  // finds (high orders at 3 dB), so a second and third span are tried when the first misses.
  for (const span of [1.3, 1.6, 2]) {
    const grid = Array.from({ length: 64 }, (_, k) => (Math.min(thetaC * span, Math.PI / 2 - 0.02) * (k + 1)) / 64);
    const want = grid.map((th) => optimumLossDb(n, rippleDb, thetaC, th));
    const cost = (x: number[]) => {
      const row = rowOf(x, n);
      // dB errors, those in the stop band (tens of dB) weighted down so the ripple is fitted as closely.
      return grid.reduce((sum, th, k) => { const e = rowLossDb(row, th) - want[k]!; return sum + (th <= thetaC ? e * e : (e * e) / 25); }, 0);
    };
    for (const start of starts) {
      // Restarted while it still improves (a simplex can stall on a ridge; a fresh one around its best goes on).
      let r = simplex(cost, start, 0.1, 1500, clamp);
      for (let again = 0; again < 4; again++) {
        const next = simplex(cost, r.x, again % 2 ? 0.1 : 0.02, 1500, clamp);
        const gain = r.v - next.v;
        r = next.v < r.v ? next : r;
        if (!(gain > 1e-9)) break;
      }
      const row = rowOf(r.x, n), fitDb = passError(row);
      if (!best || fitDb < best.fitDb) best = { row, fitDb };
      if (best.fitDb < 1e-3) break;
    }
    if (best!.fitDb < 1e-3) break;
  }
  // fitDb stays large when an impedance bound held the row back (a band too narrow for stubs of 5·Z0).
  const { row, fitDb } = best!;
  return { ...row, fitDb };
}
