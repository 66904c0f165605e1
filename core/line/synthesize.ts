/**
 * Exact synthesis Z0 → W: safeguarded Newton/secant on x = ln(W/h) inverting the active analysis model
 * (Hammerstad & Jensen 1980, IEEE MTT-S Digest, with Kirschning & Jansen 1982 for dispersion), static or at f. The Hammerstad 1975 closed form is only the seed. Bracket
 * x ∈ [ln 0.001, ln 1000] (Z0 falls monotonically with W); a step that leaves the bracket is replaced by bisection;
 * stops when |Z0(W) − target| < 1e-10·target. A target outside the bracket's impedances is an
 * InputError('unreachable-target') that gives the reachable range.
 */
import { InputError, describe } from '../util/errors.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { evaluateModel, modelQuery, scratch } from './model.ts';
import { checkConductorLoss, checkDispersion, checkFrequency, checkQuasiTem, checkSubstrate, U_MAX, U_MIN } from './inputs.ts';
import { hammerstad1975WidthRatio } from './closed-form-synthesis.ts';
import { hjDeltaU1, hjDeltaUr } from './hammerstad-jensen-1980.ts';
import { analyzeLine, dielectricAt } from './analyze.ts';
import type { LineOptions, LineResult } from './types.ts';
import { synthesizeMadeLine } from './made-line.ts';

const X_LO = Math.log(U_MIN);
const X_HI = Math.log(U_MAX);
const REL_TOL = 1e-10;
const MAX_ITER = 100;

/**
 * The width (as a full analysis at f) whose Z0 — at f with the chosen dispersion, or static when f = 0 or
 * dispersion 'none' — equals `z0` (Ω) to 1e-10 relative.
 * Example: synthesizeLine(glassEpoxy, 50, 0).width ≈ 1.5 mm for εr 4.4, h 0.79 mm.
 */
export function synthesizeLine(sub: SubstrateSpec, z0: number, f: number, opts?: LineOptions): LineResult {
  if (opts !== undefined && opts.crossSection !== undefined) return synthesizeMadeLine(sub, z0, f, opts.crossSection, opts);
  checkSubstrate(sub);
  checkFrequency(f);
  const disp = checkDispersion(opts);
  checkConductorLoss(opts);
  if (typeof z0 !== 'number' || !(z0 > 0 && z0 <= 1e4)) {
    throw new InputError(typeof z0 === 'number' && Number.isFinite(z0) ? 'out-of-range' : 'invalid-number', 'z0', 'a target impedance above 0 Ω and up to 10 kΩ', describe(z0));
  }
  const { er } = dielectricAt(sub, f);
  const h = sub.h;
  checkQuasiTem(f, er, h);
  const tn = sub.t / h;
  // u is taken as (e^x·h)/h, exactly what the final analysis of the width e^x·h will see, so its evaluation is reused.
  const q = modelQuery;
  const G = (x: number): number => {
    q.u = (Math.exp(x) * h) / h; q.tn = tn; q.er = er; q.h = h; q.f = f; q.disp = disp;
    evaluateModel(q);
    return scratch.z0f - z0;
  };
  const tol = REL_TOL * z0;

  const unreachable = (): never => {
    const zMax = G(X_LO) + z0;
    const zMin = G(X_HI) + z0;
    const at = f > 0 && disp !== 0 ? ` at ${Number((f / 1e9).toPrecision(4))} GHz` : ' (static)';
    throw new InputError('unreachable-target', 'z0',
      `an impedance from ${zMin.toFixed(2)} Ω to ${zMax.toFixed(2)} Ω, the range of W/h 0.001–1000 on this substrate${at}`,
      `${z0} Ω`, 'choose a target in that range or change the substrate height or εr');
  };

  // Bracket [a, b] with g(a) > 0 > g(b) once evaluated (Z0 decreases with W).
  let a = X_LO; let b = X_HI;
  let aKnown = false; let bKnown = false;
  // Seed: the closed form gives the width of a zero-thickness strip; a strip of thickness t acts as one Δur wider
  // (HJ 1980 eq. 7), so start Δur narrower. The closed form's slope, scaled the same way, makes the first step.
  const cf = hammerstad1975WidthRatio(z0, er);
  let seed = cf;
  if (tn > 0 && cf > 0) {
    const du = hjDeltaUr(hjDeltaU1(cf, tn), er);
    if (cf - du > U_MIN) seed = cf - du;
  }
  if (!(seed > U_MIN && seed < U_MAX)) seed = seed >= U_MAX ? U_MAX * 0.5 : seed <= U_MIN ? U_MIN * 2 : 1;
  let x0 = Math.log(seed);
  let g0 = G(x0);
  let x = x0;
  let done = Math.abs(g0) < tol;
  if (!done) {
    if (g0 > 0) { a = x0; aKnown = true; } else { b = x0; bKnown = true; }
    // First step: the slope dx/dZ0 of the closed form (cheap, and close to the model's), then secant steps.
    const cfUp = hammerstad1975WidthRatio(z0 * 1.001, er);
    const dxdz = cfUp > 0 && cf > 0 ? (Math.log(cfUp / cf) / (0.001 * z0)) * (cf / seed) : Number.NaN;
    let slope = dxdz < 0 && Number.isFinite(dxdz) ? 1 / dxdz : Number.NaN;
    let x1 = x0; let g1 = g0;
    for (let i = 0; i < MAX_ITER; i++) {
      let xn = slope < 0 ? x1 - g1 / slope : Number.NaN;
      if (!(xn > a && xn < b)) {
        // The step leaves the bracket: make sure the far end brackets the root, then bisect.
        if (!aKnown) { const ga = G(a); if (ga < 0) unreachable(); if (Math.abs(ga) < tol) { x = a; done = true; break; } aKnown = true; }
        if (!bKnown) { const gb = G(b); if (gb > 0) unreachable(); if (Math.abs(gb) < tol) { x = b; done = true; break; } bKnown = true; }
        xn = 0.5 * (a + b);
      }
      const gn = G(xn);
      x = xn;
      if (Math.abs(gn) < tol || b - a < 1e-14) { done = true; break; }
      if (gn > 0) { if (xn > a) { a = xn; aKnown = true; } } else if (xn < b) { b = xn; bKnown = true; }
      slope = (gn - g1) / (xn - x1);
      x1 = xn; g1 = gn;
    }
  }
  if (!done) {
    throw new InputError('unreachable-target', 'z0', 'a target the width search can converge on', `${z0} Ω`, 'the model did not converge; please report this case');
  }
  return analyzeLine(sub, Math.exp(x) * h, f, opts);
}
