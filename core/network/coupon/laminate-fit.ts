/**
 * Least-squares fit of the laminate's εr and tanδ (and optionally the copper's rms roughness) through our own line
 * model (core/line: Hammerstad–Jensen static, the chosen dispersion, conductor loss with the Hammerstad–Bekkadal
 * roughness factor, filling-factor dielectric loss, optionally the wideband Debye dielectric) to the complex
 * effective permittivity measured at each frequency (Janezic and Jargon 1999, see janezic-jargon-1999.ts).
 *
 * Method: Levenberg–Marquardt (K. Levenberg 1944, D. W. Marquardt 1963) on the residuals ε_meas − ε_model, real and
 * loss parts, each frequency weighted by the inverse variance of its γ estimate (multiline Gauss–Markov factor)
 * carried to ε_eff (|dε| = 2|γ|/k0²·|dγ|). Derivatives by central differences.
 * Uncertainty (one standard uncertainty, k = 1): the sandwich covariance A⁻¹·(Σ w_k² σ_k² J_kᵀJ_k)·A⁻¹, A = JᵀWJ,
 * evaluated twice — with σ_k from the residuals (their weighted variance, separately for the real and the loss
 * part, which also carries model misfit) and with σ_k from the measured spread of γ — and combined in quadrature.
 */
import { C0 } from '../../units/constants.ts';
import { microstripFamily, stripColumns, type LineOptions, type StripLineFamily } from '../../line/index.ts';
import type { SubstrateSpec } from '../../substrate/types.ts';
import { SUBSTRATE_LIMITS } from '../../substrate/validate.ts';

/** What the fit varies. */
export type FitParameter = 'er' | 'tanDelta' | 'roughness';

export interface FitProblem {
  /** Frequencies used, Hz. */
  freqs: number[];
  /** Measured ε'_eff and ε''_eff at each frequency. */
  real: number[];
  loss: number[];
  /** Weight of each frequency (1/variance factor of ε). */
  weight: number[];
  /** Measured spread of ε_eff at each frequency (standard deviation, relative units of ε). */
  spread: number[];
  width: number;
  /** The laminate and copper; the fitted fields are the starting point. */
  substrate: SubstrateSpec;
  fit: FitParameter[];
  line?: LineOptions;
  /** The strip family of the line-model interface the coupon's lines are (default the core's microstrip). */
  family?: StripLineFamily;
}

export interface FitResult {
  substrate: SubstrateSpec;
  /** Standard uncertainty of each fitted parameter: total, from the residuals, from the measured spread. */
  uncertainty: Record<string, number>;
  fromResiduals: Record<string, number>;
  fromSpread: Record<string, number>;
  /** Model ε'_eff, ε''_eff, α (Np/m) and β (rad/m) at each used frequency. */
  model: { real: number[]; loss: number[]; alpha: number[]; beta: number[] };
  /** Weighted rms residual of the real and the loss part (relative ε units). */
  rms: { real: number; loss: number };
  iterations: number;
  /** False when the normal matrix could not be inverted (the parameters are not separable from these data); the
   * uncertainties are then 0 and must not be read as exact. */
  uncertaintyKnown: boolean;
}

const LIMIT: Record<FitParameter, readonly [number, number]> = {
  er: [1.01, SUBSTRATE_LIMITS.er[1]], tanDelta: [0, SUBSTRATE_LIMITS.tanDelta[1]], roughness: [0, SUBSTRATE_LIMITS.roughness[1]],
};

function withParams(sub: SubstrateSpec, fit: FitParameter[], p: number[]): SubstrateSpec {
  const next: SubstrateSpec = { ...sub };
  fit.forEach((name, i) => { next[name] = Math.min(LIMIT[name][1], Math.max(LIMIT[name][0], p[i]!)); });
  return next;
}

/** The model's γ and ε_eff at the problem's frequencies, or null where the model refuses the laminate. */
export function modelEps(sub: SubstrateSpec, width: number, freqs: number[], line?: LineOptions, family: StripLineFamily = microstripFamily): FitResult['model'] | null {
  let cols;
  try { cols = stripColumns(family, sub, new Array<number>(freqs.length).fill(width), freqs, line); } catch { return null; }
  const real: number[] = [], loss: number[] = [], alpha: number[] = [], beta: number[] = [];
  for (let k = 0; k < freqs.length; k++) {
    const k0 = (2 * Math.PI * freqs[k]!) / C0;
    const b = k0 * Math.sqrt(cols.epsEff[k]!);
    const a = cols.alphaC[k]! + cols.alphaD[k]!;
    alpha.push(a); beta.push(b);
    real.push((b * b - a * a) / (k0 * k0)); loss.push((2 * a * b) / (k0 * k0));
  }
  return { real, loss, alpha, beta };
}

function residuals(pr: FitProblem, m: FitResult['model']): number[] {
  const r: number[] = [];
  for (let k = 0; k < pr.freqs.length; k++) r.push(pr.real[k]! - m.real[k]!, pr.loss[k]! - m.loss[k]!);
  return r;
}

function step(name: FitParameter, v: number): number {
  if (name === 'er') return 1e-5 * v;
  if (name === 'tanDelta') return Math.max(1e-5 * v, 1e-8);
  return Math.max(1e-4 * v, 1e-10);
}

/** Jacobian of the model (rows as residuals, columns per parameter) by central differences. */
function jacobian(pr: FitProblem, p: number[]): number[][] | null {
  const cols: number[][] = [];
  for (let i = 0; i < p.length; i++) {
    const name = pr.fit[i]!;
    const h = step(name, p[i]!);
    const lo = Math.max(LIMIT[name][0], p[i]! - h), hi = Math.min(LIMIT[name][1], p[i]! + h);
    const pa = [...p]; pa[i] = hi; const pb = [...p]; pb[i] = lo;
    const ma = modelEps(withParams(pr.substrate, pr.fit, pa), pr.width, pr.freqs, pr.line, pr.family);
    const mb = modelEps(withParams(pr.substrate, pr.fit, pb), pr.width, pr.freqs, pr.line, pr.family);
    if (!ma || !mb || !(hi > lo)) return null;
    const col: number[] = [];
    for (let k = 0; k < pr.freqs.length; k++) col.push((ma.real[k]! - mb.real[k]!) / (hi - lo), (ma.loss[k]! - mb.loss[k]!) / (hi - lo));
    cols.push(col);
  }
  return cols;
}

/** Solves the small symmetric system A·x = b (p ≤ 3) by Gaussian elimination with partial pivoting; null if singular. */
export function solveSmall(A: number[][], b: number[]): number[] | null {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[piv]![c]!)) piv = r;
    if (!(Math.abs(M[piv]![c]!) > 1e-300)) return null;
    [M[c], M[piv]] = [M[piv]!, M[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = M[r]![c]! / M[c]![c]!;
      for (let k = c; k <= n; k++) M[r]![k]! -= f * M[c]![k]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r]![n]!;
    for (let k = r + 1; k < n; k++) s -= M[r]![k]! * x[k]!;
    x[r] = s / M[r]![r]!;
  }
  return x.every(Number.isFinite) ? x : null;
}

function inverse(A: number[][]): number[][] | null {
  const n = A.length;
  const cols: number[][] = [];
  for (let i = 0; i < n; i++) {
    const e = new Array<number>(n).fill(0); e[i] = 1;
    const x = solveSmall(A, e);
    if (!x) return null;
    cols.push(x);
  }
  return A.map((_, r) => cols.map((c) => c[r]!));
}

/** Runs the fit. Returns null when the model cannot follow the data at all (every trial refused). */
export function fitLaminate(pr: FitProblem): FitResult | null {
  const np = pr.fit.length;
  let p = pr.fit.map((name) => pr.substrate[name]);
  if (pr.fit.includes('roughness')) { const i = pr.fit.indexOf('roughness'); if (!(p[i]! > 0)) p[i] = 1e-6; }
  const w2 = (i: number) => pr.weight[i >> 1]!; // row i belongs to frequency i >> 1
  const cost = (m: FitResult['model']) => residuals(pr, m).reduce((s, r, i) => s + w2(i) * r * r, 0);
  let m = modelEps(withParams(pr.substrate, pr.fit, p), pr.width, pr.freqs, pr.line, pr.family);
  if (!m) return null;
  let c = cost(m);
  let mu = 1e-3;
  let it = 0;
  for (; it < 60; it++) {
    const J = jacobian(pr, p);
    if (!J) break;
    const r = residuals(pr, m);
    const A = J.map((ci) => J.map((cj) => ci.reduce((s, v, k) => s + w2(k) * v * cj[k]!, 0)));
    const g = J.map((ci) => ci.reduce((s, v, k) => s + w2(k) * v * r[k]!, 0));
    let improved = false;
    for (let tries = 0; tries < 12 && !improved; tries++) {
      const Ad = A.map((row, i) => row.map((v, j) => (i === j ? v * (1 + mu) + 1e-300 : v)));
      const d = solveSmall(Ad, g);
      if (!d) { mu *= 10; continue; }
      const pn = p.map((v, i) => Math.min(LIMIT[pr.fit[i]!][1], Math.max(LIMIT[pr.fit[i]!][0], v + d[i]!)));
      const mn = modelEps(withParams(pr.substrate, pr.fit, pn), pr.width, pr.freqs, pr.line, pr.family);
      const cn = mn ? cost(mn) : Number.POSITIVE_INFINITY;
      if (cn <= c) {
        const small = pn.every((v, i) => Math.abs(v - p[i]!) <= 1e-10 * Math.max(Math.abs(v), 1e-12));
        p = pn; m = mn!; improved = true; mu = Math.max(mu / 10, 1e-12);
        if (small || c - cn <= 1e-14 * c) { c = cn; it = 1000; break; }
        c = cn;
      } else mu *= 10;
    }
    if (!improved) break;
  }
  const sub = withParams(pr.substrate, pr.fit, p);
  // Uncertainty (sandwich form).
  const J = jacobian(pr, p);
  const r = residuals(pr, m);
  const n = pr.freqs.length;
  const zero = () => Object.fromEntries(pr.fit.map((k) => [k, 0]));
  let fromResiduals = zero(), fromSpread = zero();
  let uncertaintyKnown = false;
  let rmsReal = 0, rmsLoss = 0, wsum = 0;
  for (let k = 0; k < n; k++) { rmsReal += pr.weight[k]! * r[2 * k]! ** 2; rmsLoss += pr.weight[k]! * r[2 * k + 1]! ** 2; wsum += pr.weight[k]!; }
  const dofReal = Math.max(1, n - 1), dofLoss = Math.max(1, n - (np - 1));
  const s2Real = rmsReal / wsum * n / dofReal, s2Loss = rmsLoss / wsum * n / dofLoss;
  if (J) {
    const A = J.map((ci) => J.map((cj) => ci.reduce((s, v, k) => s + w2(k) * v * cj[k]!, 0)));
    const Ai = inverse(A);
    if (Ai) {
      const sandwich = (sigma2: (row: number) => number) => {
        const B = J.map((ci) => J.map((cj) => ci.reduce((s, v, k) => s + w2(k) ** 2 * sigma2(k) * v * cj[k]!, 0)));
        const AB = Ai.map((row) => B[0]!.map((_, j) => row.reduce((s, v, k) => s + v * B[k]![j]!, 0)));
        return pr.fit.map((_, i) => Math.sqrt(Math.max(0, AB[i]!.reduce((s, v, k) => s + v * Ai[k]![i]!, 0))));
      };
      // Residual variance per row: s² scaled by the row's own weight (σ_k² = s²·w̄/w_k), as the weights assume.
      const wMean = wsum / n;
      const ur = sandwich((row) => ((row & 1) === 0 ? s2Real : s2Loss) * wMean / w2(row));
      const us = sandwich((row) => pr.spread[row >> 1]! ** 2);
      fromResiduals = Object.fromEntries(pr.fit.map((k, i) => [k, ur[i]!]));
      fromSpread = Object.fromEntries(pr.fit.map((k, i) => [k, us[i]!]));
      uncertaintyKnown = [...ur, ...us].every(Number.isFinite);
      if (!uncertaintyKnown) { fromResiduals = zero(); fromSpread = zero(); }
    }
  }
  const uncertainty = Object.fromEntries(pr.fit.map((k) => [k, Math.hypot(fromResiduals[k]!, fromSpread[k]!)]));
  return {
    substrate: sub, uncertainty, fromResiduals, fromSpread, model: m,
    rms: { real: Math.sqrt(rmsReal / wsum), loss: Math.sqrt(rmsLoss / wsum) }, iterations: Math.min(it, 60), uncertaintyKnown,
  };
}
