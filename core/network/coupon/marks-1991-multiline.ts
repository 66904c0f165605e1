/**
 * Propagation constant of a line from two-port measurements of several lengths of it, by the eigenvalue method of
 * the multiline calibration.
 *
 * Source: R. B. Marks, "A multiline method of network analyzer calibration", IEEE Transactions on Microwave Theory
 * and Techniques, vol. 39, no. 7, pp. 1205–1215, July 1991 (the two-line eigenvalue problem and the Gauss–Markov
 * combination of line pairs sharing one common line; equation numbers not repeated here, the forms below are as
 * recalled and written out in docs/laminate-coupon.md).
 *
 * Each measured line i is an error box X at port 1, the line itself, and an error box Y at port 2. In cascade
 * (T) form, with the line's own Z0 as reference, the line is diag(e^{−γ l_i}, e^{γ l_i}), so
 *     M_ij = M_j · M_i^{-1} = X · diag(e^{−γ Δl}, e^{γ Δl}) · X^{-1},   Δl = l_j − l_i,
 * and the eigenvalues of M_ij are e^{∓γ Δl} whatever X and Y are — provided both lines have the same Z0 (same width)
 * and identical launches. The 50 Ω → Z0 step of the ports is part of X and Y.
 *
 * With more than two lines one line c is taken as common and each pair (c, j) gives an estimate y_j = γ·Δl_j.
 * Their errors are correlated through line c; Marks combines them by Gauss–Markov (best linear unbiased) weighting
 * with the covariance V = D·(I + 1·1ᵀ)·D, D = diag(1/|e^{−γΔl_j} − e^{γΔl_j}|), and picks per frequency the common
 * line that gives the smallest variance. Here V keeps only the magnitudes (real weights), a simplification of ours.
 *
 * Conditioning: a pair is useless where Δl is a multiple of half a guided wavelength (β·Δl = nπ), where both
 * eigenvalues meet. A frequency is kept only if some pair has β·Δl at least `minPhaseDeg` (default 20°: the usual
 * 20°–160° rule for a TRL line, common practice) away from every multiple of 180°.
 *
 * The 2π ambiguity of β·Δl is resolved with a first guess of γ (from the line model), which also tells which
 * eigenvalue is e^{−γΔl}.
 * Units: metres, hertz, γ in 1/m (α Np/m + jβ rad/m).
 */
import type { Complex } from '../complex.ts';
import { cabs, carg, cdiv, cexp, cinv, cmul, csqrt, csub, cx } from '../complex.ts';

/** A 2×2 complex matrix, row major: [a b; c d]. */
export interface Mat2 { a: Complex; b: Complex; c: Complex; d: Complex }

/**
 * Cascade matrix from S (power waves, any common real reference): [b1; a1] = T·[a2; b2].
 * T = (1/S21)·[S12·S21 − S11·S22, S11; −S22, 1]. Needs S21 ≠ 0.
 */
export function sToT(s11: Complex, s21: Complex, s12: Complex, s22: Complex): Mat2 {
  const det = csub(cmul(s12, s21), cmul(s11, s22));
  return { a: cdiv(det, s21), b: cdiv(s11, s21), c: cdiv({ re: -s22.re, im: -s22.im }, s21), d: cinv(s21) };
}

function mul2(x: Mat2, y: Mat2): Mat2 {
  const add = (p: Complex, q: Complex): Complex => ({ re: p.re + q.re, im: p.im + q.im });
  return {
    a: add(cmul(x.a, y.a), cmul(x.b, y.c)), b: add(cmul(x.a, y.b), cmul(x.b, y.d)),
    c: add(cmul(x.c, y.a), cmul(x.d, y.c)), d: add(cmul(x.c, y.b), cmul(x.d, y.d)),
  };
}

function inv2(x: Mat2): Mat2 {
  const det = csub(cmul(x.a, x.d), cmul(x.b, x.c));
  const k = cinv(det);
  const neg = (p: Complex): Complex => ({ re: -p.re, im: -p.im });
  return { a: cmul(x.d, k), b: cmul(neg(x.b), k), c: cmul(neg(x.c), k), d: cmul(x.a, k) };
}

/** Both eigenvalues of a 2×2 complex matrix. */
export function eigenvalues2(x: Mat2): [Complex, Complex] {
  const half = { re: (x.a.re + x.d.re) / 2, im: (x.a.im + x.d.im) / 2 };
  const det = csub(cmul(x.a, x.d), cmul(x.b, x.c));
  const root = csqrt(csub(cmul(half, half), det));
  return [{ re: half.re + root.re, im: half.im + root.im }, { re: half.re - root.re, im: half.im - root.im }];
}

/** One pair's estimate of γ·Δl (complex), with the disagreement of its two eigenvalues (a spread, in units of γΔl). */
export interface PairEstimate { gammaDl: Complex; spread: number }

/**
 * γ·Δl from the measured cascade matrices of line i (length li) and line j (length lj), with the guess γg used to
 * pick the eigenvalue and the multiple of 2π. Returns null when the eigenvalues cannot be told apart (they coincide).
 */
export function pairEstimate(mi: Mat2, mj: Mat2, dl: number, gammaGuess: Complex): PairEstimate | null {
  const [l1, l2] = eigenvalues2(mul2(mj, inv2(mi)));
  const e = cexp({ re: -gammaGuess.re * dl, im: -gammaGuess.im * dl }); // expected e^{−γΔl}
  const ei = cinv(e);
  const cost12 = cabs(csub(l1, e)) + cabs(csub(l2, ei));
  const cost21 = cabs(csub(l2, e)) + cabs(csub(l1, ei));
  const [down, up] = cost12 <= cost21 ? [l1, l2] : [l2, l1];
  if (cabs(up) === 0 || cabs(down) === 0) return null;
  // Marks' two-line estimate: the mean of e^{−γΔl} from one eigenvalue and from the reciprocal of the other.
  const upInv = cinv(up);
  const z = { re: (down.re + upInv.re) / 2, im: (down.im + upInv.im) / 2 };
  const mag = cabs(z);
  if (!(mag > 0) || !Number.isFinite(mag)) return null;
  // z = e^{−γΔl}: αΔl = −ln|z|, βΔl = −arg z − 2πn, n from the guess.
  const phi = -carg(z);
  const n = Math.round((gammaGuess.im * dl - phi) / (2 * Math.PI));
  const gammaDl = cx(-Math.log(mag), phi + 2 * Math.PI * n);
  // Disagreement of the two eigenvalues: ln(down) and −ln(up) should be equal; half their difference.
  const spread = cabs(csub(down, upInv)) / (2 * mag);
  return { gammaDl, spread };
}

/** The combined γ at one frequency, its relative variance factor, and the pairs it used. */
export interface MultilineEstimate {
  gamma: Complex;
  /** Variance factor of γ (per unit noise variance in γΔl), 1/m²; compare between frequencies only. */
  variance: number;
  /** The common line's index. */
  common: number;
  /** Largest distance of a used pair's β·Δl from a multiple of 180°, degrees (0–90); the conditioning. */
  phaseMarginDeg: number;
  /** Spread of the estimate, 1/m: eigenvalue disagreement and the pairs' scatter about the combined value. */
  spread: number;
}

/**
 * Marks' multiline estimate of γ at one frequency from the lines' cascade matrices and lengths (m), with the first
 * guess γg (1/m). Returns null when no pair is usable (every pair within `minPhaseDeg` of a multiple of 180°).
 */
export function multilineGamma(t: readonly Mat2[], lengths: readonly number[], gammaGuess: Complex, minPhaseDeg: number): MultilineEstimate | null {
  const n = t.length;
  let best: MultilineEstimate | null = null;
  for (let c = 0; c < n; c++) {
    const pairs: { dl: number; y: Complex; s: number; spread: number; marginDeg: number }[] = [];
    for (let j = 0; j < n; j++) {
      if (j === c) continue;
      const dl = lengths[j]! - lengths[c]!;
      const p = pairEstimate(t[c]!, t[j]!, dl, gammaGuess);
      if (!p) continue;
      const bdl = Math.abs(p.gammaDl.im) % Math.PI;
      const marginDeg = (Math.min(bdl, Math.PI - bdl) * 180) / Math.PI;
      // Sensitivity |e^{−γΔl} − e^{γΔl}| from the pair's own estimate.
      const s = cabs(csub(cexp({ re: -p.gammaDl.re, im: -p.gammaDl.im }), cexp(p.gammaDl)));
      pairs.push({ dl, y: p.gammaDl, s, spread: p.spread, marginDeg });
    }
    const usable = pairs.filter((p) => p.marginDeg >= minPhaseDeg);
    if (usable.length === 0) continue;
    // Gauss–Markov with V = D(I + 11ᵀ)D, D = diag(1/s): V⁻¹ = D⁻¹(I − 11ᵀ/(1 + m))D⁻¹, m pairs.
    const m = usable.length;
    let sw = 0, sww = 0; let sy = cx(0), swy = cx(0);
    for (const p of usable) {
      const w = p.s * p.dl;
      sw += w; sww += w * w;
      sy = { re: sy.re + p.s * p.y.re, im: sy.im + p.s * p.y.im };
      swy = { re: swy.re + w * p.s * p.y.re, im: swy.im + w * p.s * p.y.im };
    }
    const info = sww - (sw * sw) / (1 + m);
    if (!(info > 0)) continue;
    const gamma = { re: (swy.re - (sw * sy.re) / (1 + m)) / info, im: (swy.im - (sw * sy.im) / (1 + m)) / info };
    const variance = 1 / info;
    // Spread: eigenvalue disagreement of each pair and each pair's distance from the combined γ, weighted alike.
    let num = 0, den = 0;
    for (const p of usable) {
      const w = (p.s * p.dl) ** 2;
      const scatter = m > 1 ? cabs(csub(cx(p.y.re / p.dl, p.y.im / p.dl), gamma)) : 0;
      const own = p.spread / Math.abs(p.dl);
      num += w * (own * own + scatter * scatter); den += w;
    }
    const spread = Math.sqrt(num / den);
    const phaseMarginDeg = Math.max(...usable.map((p) => p.marginDeg));
    if (!best || variance < best.variance) best = { gamma, variance, common: c, phaseMarginDeg, spread };
  }
  return best;
}
