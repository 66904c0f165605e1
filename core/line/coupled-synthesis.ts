/**
 * Synthesis of a coupled pair: (Z0e, Z0o) — or a coupling in dB and a system impedance — → (W, s), by a damped
 * two-dimensional Newton iteration on (ln W/h, ln s/h) inverting the Kirschning–Jansen 1984 static model
 * (kirschning-jansen-1984-coupled.ts). The dispersion model used here keeps the mode impedances static, so the
 * geometry does not depend on frequency. Stops when both impedances are within 1e-10 relative; a target the model
 * cannot reach within W/h, s/h ∈ [0.01, 100] is an InputError('unreachable-target') that says what can be reached.
 */
import { InputError, describe } from '../util/errors.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { checkFrequency, checkSubstrate } from './inputs.ts';
import { dielectricAt } from './analyze.ts';
import { kjCoupledStatic, kjStatic } from './kirschning-jansen-1984-coupled.ts';
import { hammerstad1975WidthRatio } from './closed-form-synthesis.ts';
import { analyzeCoupled, checkCoupledDispersion, COUPLED_G_MAX, COUPLED_G_MIN, COUPLED_U_MAX, COUPLED_U_MIN, couplingFromModes, modesForCoupling } from './coupled.ts';
import type { CoupledOptions, CoupledResult, CoupledTarget } from './coupled-types.ts';

const X_LO = Math.log(COUPLED_U_MIN), X_HI = Math.log(COUPLED_U_MAX);
const Y_LO = Math.log(COUPLED_G_MIN), Y_HI = Math.log(COUPLED_G_MAX);
const TOL = 1e-10;
const MAX_ITER = 60;

function clamp(v: number, lo: number, hi: number): number { return v < lo ? lo : v > hi ? hi : v; }

/** The mode impedances a target asks for, checked. */
export function targetModes(target: CoupledTarget): { z0Even: number; z0Odd: number } {
  if (target === null || typeof target !== 'object') throw new InputError('invalid-number', 'target', 'mode impedances {z0Even, z0Odd} or {couplingDb, z0}', describe(target));
  if ('couplingDb' in target) {
    const { couplingDb, z0 } = target;
    if (typeof couplingDb !== 'number' || !(couplingDb >= 3 && couplingDb <= 60)) {
      throw new InputError(typeof couplingDb === 'number' && Number.isFinite(couplingDb) ? 'out-of-range' : 'invalid-number', 'couplingDb',
        'a coupling from 3 dB to 60 dB', describe(couplingDb), 'couplings tighter than about 6 dB need gaps a board shop cannot cut; use a branch-line or a multi-section coupler');
    }
    if (typeof z0 !== 'number' || !(z0 >= 1 && z0 <= 500)) {
      throw new InputError(typeof z0 === 'number' && Number.isFinite(z0) ? 'out-of-range' : 'invalid-number', 'z0', 'a system impedance from 1 Ω to 500 Ω', describe(z0));
    }
    return modesForCoupling(couplingDb, z0);
  }
  const { z0Even, z0Odd } = target;
  for (const [k, v] of [['z0Even', z0Even], ['z0Odd', z0Odd]] as const) {
    if (typeof v !== 'number' || !(v >= 1 && v <= 1000)) {
      throw new InputError(typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number', k, 'an impedance from 1 Ω to 1000 Ω', describe(v));
    }
  }
  if (!(z0Even > z0Odd)) throw new InputError('out-of-range', 'z0Odd', `an odd-mode impedance below the even-mode one (${z0Even} Ω)`, `${z0Odd} Ω`, 'Z0e is always above Z0o for a coupled microstrip pair');
  return { z0Even, z0Odd };
}

/** (u, g) whose static Z0e, Z0o equal the targets, or null when the iteration does not reach them. */
export function solveGeometry(er: number, z0Even: number, z0Odd: number): { u: number; g: number } | null {
  const le = Math.log(z0Even), lo = Math.log(z0Odd);
  const F = (x: number, y: number, out: number[]): void => {
    kjCoupledStatic(Math.exp(x), Math.exp(y), er);
    out[0] = Math.log(kjStatic.z0E) - le; out[1] = Math.log(kjStatic.z0O) - lo;
  };
  let x = Math.log(clamp(hammerstad1975WidthRatio(Math.sqrt(z0Even * z0Odd), er), COUPLED_U_MIN, COUPLED_U_MAX));
  let y = 0;
  const f0 = [0, 0], fx = [0, 0], fy = [0, 0], ft = [0, 0];
  const d = 1e-6;
  for (let it = 0; it < MAX_ITER; it++) {
    F(x, y, f0);
    const norm = Math.hypot(f0[0]!, f0[1]!);
    if (norm < TOL) return { u: Math.exp(x), g: Math.exp(y) };
    F(x + d, y, fx); F(x, y + d, fy);
    const a = (fx[0]! - f0[0]!) / d, b = (fy[0]! - f0[0]!) / d, c = (fx[1]! - f0[1]!) / d, e = (fy[1]! - f0[1]!) / d;
    const det = a * e - b * c;
    if (!(Math.abs(det) > 1e-300)) return null;
    let dx = -(e * f0[0]! - b * f0[1]!) / det, dy = -(-c * f0[0]! + a * f0[1]!) / det;
    const big = Math.max(Math.abs(dx), Math.abs(dy));
    if (big > 1) { dx /= big; dy /= big; }
    // Backtrack until the residual falls (a Newton step can overshoot far from the root).
    let s = 1;
    for (let k = 0; k < 30; k++) {
      const nx = clamp(x + s * dx, X_LO, X_HI), ny = clamp(y + s * dy, Y_LO, Y_HI);
      F(nx, ny, ft);
      if (Math.hypot(ft[0]!, ft[1]!) < norm || k === 29) { x = nx; y = ny; break; }
      s /= 2;
    }
  }
  F(x, y, f0);
  return Math.hypot(f0[0]!, f0[1]!) < 1e-8 ? { u: Math.exp(x), g: Math.exp(y) } : null;
}

/**
 * The width ratio u at which a pair with gap ratio g matches `z0` (√(Z0e·Z0o) = z0), by bisection on ln u, and
 * the coupling it gives; null when no u in the accepted range does.
 */
export function couplingAtGap(er: number, z0: number, g: number): { u: number; couplingDb: number } | null {
  const zAt = (x: number) => { kjCoupledStatic(Math.exp(x), g, er); return Math.sqrt(kjStatic.z0E * kjStatic.z0O); };
  let a = X_LO, b = X_HI;
  if (!(zAt(a) >= z0 && zAt(b) <= z0)) return null;
  for (let i = 0; i < 100 && b - a > 1e-12; i++) {
    const m = (a + b) / 2;
    if (zAt(m) > z0) a = m; else b = m;
  }
  const u = Math.exp((a + b) / 2);
  kjCoupledStatic(u, g, er);
  return { u, couplingDb: couplingFromModes(kjStatic.z0E, kjStatic.z0O).db };
}

/**
 * Width and gap of the pair that realises `target` on `sub`, returned as its full analysis at f (Hz; 0 static).
 * Example: synthesizeCoupled(sub, { couplingDb: 10, z0: 50 }, 2.45e9).couplingDb ≈ 10.
 */
export function synthesizeCoupled(sub: SubstrateSpec, target: CoupledTarget, f: number, opts?: CoupledOptions): CoupledResult {
  checkSubstrate(sub);
  checkFrequency(f);
  checkCoupledDispersion(opts);
  const { z0Even, z0Odd } = targetModes(target);
  const er = dielectricAt(sub, f).er;
  const sol = solveGeometry(er, z0Even, z0Odd);
  if (!sol) {
    const z0 = Math.sqrt(z0Even * z0Odd);
    const tight = couplingAtGap(er, z0, COUPLED_G_MIN);
    const loose = couplingAtGap(er, z0, COUPLED_G_MAX);
    const wanted = couplingFromModes(z0Even, z0Odd).db;
    throw new InputError('unreachable-target', 'couplingDb' in target ? 'couplingDb' : 'z0Odd',
      tight && loose
        ? `a coupling from ${tight.couplingDb.toFixed(2)} dB (gap ${COUPLED_G_MIN}·h) to ${loose.couplingDb.toFixed(1)} dB (gap ${COUPLED_G_MAX}·h) at √(Z0e·Z0o) = ${z0.toFixed(2)} Ω on this substrate`
        : `mode impedances whose geometric mean (${z0.toFixed(2)} Ω) a pair of strips from 0.01·h to 100·h wide can reach on this substrate`,
      `${wanted.toFixed(2)} dB (Z0e ${z0Even.toFixed(2)} Ω, Z0o ${z0Odd.toFixed(2)} Ω)`,
      'loosen the coupling, or use a thinner substrate or a different coupler type');
  }
  return analyzeCoupled(sub, sol.u * sub.h, sol.g * sub.h, f, opts);
}

/** What a coupled-pair question asks: a geometry to analyse, or a target to synthesise. */
export type CoupledAsk = { width: number; spacing: number } | CoupledTarget;

/**
 * The one entry point the faces use for a coupled pair: analyses (W, s), or synthesises from (Z0e, Z0o) or from a
 * coupling in dB and a system impedance, at f (Hz; 0 static).
 */
export function coupledLine(sub: SubstrateSpec, ask: CoupledAsk, f: number, opts?: CoupledOptions): CoupledResult {
  if (ask !== null && typeof ask === 'object' && 'width' in ask) return analyzeCoupled(sub, ask.width, ask.spacing, f, opts);
  return synthesizeCoupled(sub, ask, f, opts);
}
