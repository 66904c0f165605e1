/**
 * Coupled microstrip pair: analysis (W, s) → even- and odd-mode Z0, εe, β and losses at f.
 *
 * Models (each in its own file, with citation): Kirschning–Jansen 1984 static even/odd εe and Z0 (t = 0);
 * Getsinger 1973 dispersion of each mode's εe (or none); conductor loss per mode by Wheeler's incremental-inductance
 * rule as a ratio to the single line's (coupled-losses.ts), times the Hammerstad–Bekkadal roughness factor;
 * dielectric loss per mode by the filling-factor form. εr and tanδ at f as the single line (wideband Debye when
 * switched on). Leaving a model's stated range is a warning in the result, never silent.
 */
import { C0, ETA0, MU0 } from '../units/constants.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import type { Warning, WarningCode } from '../util/warnings.ts';
import { InputError, describe } from '../util/errors.ts';
import { checkFrequency, checkQuasiTem, checkSubstrate } from './inputs.ts';
import { dielectricAt } from './analyze.ts';
import { KJ1984_RANGE, kjCoupledStatic, kjStatic } from './kirschning-jansen-1984-coupled.ts';
import { getsingerEpsEff } from './getsinger-1973-coupled-dispersion.ts';
import { coupledLossRatios, lossRatio, modeAlphaD } from './coupled-losses.ts';
import { evaluateModel, modelQuery, scratch } from './model.ts';
import { wheelerBracket } from './wheeler-incremental-inductance.ts';
import { currentDistributionAlphaC } from './current-distribution-loss.ts';
import { hammerstadBekkadalKr } from './hammerstad-bekkadal-roughness.ts';
import { limits, thresholdLimits, thresholdsFor } from './mode-thresholds.ts';
import { COUPLED_DISPERSIONS, type CoupledMode, type CoupledOptions, type CoupledResult } from './coupled-types.ts';

/** Accepted width and gap ratios (InputError outside); the paper's range (warning outside) is KJ1984_RANGE. */
export const COUPLED_U_MIN = 0.01;
export const COUPLED_U_MAX = 100;
export const COUPLED_G_MIN = 0.01;
export const COUPLED_G_MAX = 100;

function fmt(x: number): string { return String(Number(x.toPrecision(4))); }
function w(code: WarningCode, message: string, source: string, severity: Warning['severity'] = 'warning'): Warning {
  return { code, message, severity, source };
}

export function checkCoupledDispersion(opts: CoupledOptions | undefined): 0 | 1 {
  const d = opts?.dispersion;
  if (d === undefined || d === 'getsinger') return 1;
  if (d === 'none') return 0;
  throw new InputError('bad-choice', 'dispersion', `one of ${COUPLED_DISPERSIONS.join(', ')}`, describe(d));
}

function checkRatio(field: 'width' | 'spacing', v: unknown, h: number, lo: number, hi: number): number {
  if (typeof v !== 'number' || !(v >= lo * h && v <= hi * h)) {
    throw new InputError(typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number', field,
      `a ${field === 'width' ? 'strip width' : 'gap between the strips'} from ${lo}·h to ${hi}·h (${fmt(lo * h * 1e3)} mm to ${fmt(hi * h * 1e3)} mm for h = ${fmt(h * 1e3)} mm)`,
      describe(v), field === 'spacing' ? 'a gap narrower than h/100 cannot be made or modelled; widen it' : undefined);
  }
  return v;
}

/** The numbers of one analysis (reused record) for the hot path: the network stamps a coupled pair per frequency. */
export const coupledNumbers = {
  z0E: 0.5, z0O: 0.5, eeE: 0.5, eeO: 0.5, eeE0: 0.5, eeO0: 0.5, acE: 0.5, acO: 0.5, adE: 0.5, adO: 0.5, er: 0.5, skin: 0.5,
};

/**
 * The analysis with checked inputs, into coupledNumbers. `disp` 1 = Getsinger, 0 = none.
 */
export function coupledInto(sub: SubstrateSpec, width: number, spacing: number, f: number, disp: 0 | 1): void {
  const h = sub.h;
  const dm = sub.dielectricModel;
  const d = dm === undefined || dm.kind !== 'wideband-debye' ? sub : dielectricAt(sub, f);
  const er = d.er, tanDelta = d.tanDelta;
  geometryTerms(width / h, spacing / h, sub.t / h, er, h, width);
  const n = coupledNumbers;
  const z0E = geo.z0E, z0O = geo.z0O;
  n.er = er; n.z0E = z0E; n.z0O = z0O; n.eeE0 = geo.eeE; n.eeO0 = geo.eeO;
  n.eeE = disp === 1 ? getsingerEpsEff(geo.eeE, z0E / 2, er, h, f) : geo.eeE;
  n.eeO = disp === 1 ? getsingerEpsEff(geo.eeO, 2 * z0O, er, h, f) : geo.eeO;
  if (f === 0) { n.acE = n.acO = n.adE = n.adO = 0; n.skin = 0; return; }
  const sigma = sub.sigma, t = sub.t;
  const k = Math.PI * f * MU0;
  const rs = Math.sqrt(k / sigma);
  n.skin = 1 / (sigma * rs);
  const kr = sub.roughness === 0 ? 1 : hammerstadBekkadalKr(sub.roughness * sub.roughness * k * sigma);
  const skinE = kr * rs * geo.kE, skinO = kr * rs * geo.kO;
  if (t > 0) {
    const dcE = 1 / (2 * sigma * width * t * z0E), dcO = 1 / (2 * sigma * width * t * z0O);
    n.acE = Math.sqrt(skinE * skinE + dcE * dcE);
    n.acO = Math.sqrt(skinO * skinO + dcO * dcO);
  } else { n.acE = skinE; n.acO = skinO; }
  n.adE = modeAlphaD(f, er, n.eeE, tanDelta);
  n.adO = modeAlphaD(f, er, n.eeO, tanDelta);
}

/**
 * The frequency-independent part of an analysis, remembered for the last few geometries (a sweep of a filter repeats
 * each of its sections at every frequency): static mode values, and each mode's conductor loss over Rs (the single
 * line's Wheeler loss at the same width and copper, times the mode ratio of coupled-losses.ts and Z0single/Z0mode).
 */
interface Geo { u: number; g: number; tn: number; er: number; z0E: number; z0O: number; eeE: number; eeO: number; kE: number; kO: number }
const SLOTS = 16;
const slots: Geo[] = Array.from({ length: SLOTS }, () => ({ u: Number.NaN, g: Number.NaN, tn: Number.NaN, er: Number.NaN, z0E: 0.5, z0O: 0.5, eeE: 0.5, eeO: 0.5, kE: 0.5, kO: 0.5 }));
let nextSlot = 0;
let geo: Geo = slots[0]!;
function geometryTerms(u: number, g: number, tn: number, er: number, h: number, width: number): void {
  if (u === geo.u && g === geo.g && tn === geo.tn && er === geo.er) return;
  for (let i = 0; i < SLOTS; i++) {
    const s = slots[i]!;
    if (u === s.u && g === s.g && tn === s.tn && er === s.er) { geo = s; return; }
  }
  geo = slots[nextSlot]!;
  nextSlot = (nextSlot + 1) % SLOTS;
  kjCoupledStatic(u, g, er);
  const z0s0 = kjStatic.z0;
  geo.z0E = kjStatic.z0E; geo.z0O = kjStatic.z0O; geo.eeE = kjStatic.eeE; geo.eeO = kjStatic.eeO;
  let single: number; // the single line's αc/Rs at this width and copper, 1/m
  if (tn > 0) {
    const q = modelQuery;
    q.u = u; q.tn = tn; q.er = er; q.h = h; q.f = 0; q.disp = 0;
    evaluateModel(q);
    single = wheelerBracket(u, tn, scratch.s, scratch.T, scratch.X, scratch.lnX1, scratch.slopeU1) / (h * ETA0 * scratch.z0s);
  } else single = currentDistributionAlphaC(1, z0s0, width);
  coupledLossRatios(u, g, kjStatic.z01);
  geo.kE = single * lossRatio.even * (z0s0 / geo.z0E);
  geo.kO = single * lossRatio.odd * (z0s0 / geo.z0O);
  geo.u = u; geo.g = g; geo.tn = tn; geo.er = er;
}

function mode(z0: number, ee: number, ee0: number, f: number, ac: number, ad: number): CoupledMode {
  const sq = Math.sqrt(ee);
  return {
    z0, z0Static: z0, epsEff: ee, epsEffStatic: ee0,
    beta: (2 * Math.PI * f * sq) / C0, lambdaG: f > 0 ? C0 / (f * sq) : 0, vp: C0 / sq, alphaC: ac, alphaD: ad,
  };
}

/** Coupling factor and its dB value from the mode impedances (dB capped at 400). */
export function couplingFromModes(z0Even: number, z0Odd: number): { factor: number; db: number } {
  const c = (z0Even - z0Odd) / (z0Even + z0Odd);
  return { factor: c, db: c > 1e-20 ? Math.min(400, -20 * Math.log10(c)) : 400 };
}

/**
 * Analyses a pair of strips, each `width` (m) wide with an edge-to-edge gap `spacing` (m), on `sub` at `f` (Hz;
 * 0 for static values). Throws InputError for invalid input; leaving a model's stated range is a warning.
 * Example: analyzeCoupled({ er: 3.66, h: 0.508e-3, t: 0, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 },
 * 0.508e-3, 0.1016e-3, 0).even.z0 ≈ 100.1 Ω (odd ≈ 47.2 Ω).
 */
export function analyzeCoupled(sub: SubstrateSpec, width: number, spacing: number, f: number, opts?: CoupledOptions): CoupledResult {
  checkSubstrate(sub);
  const h = sub.h;
  checkRatio('width', width, h, COUPLED_U_MIN, COUPLED_U_MAX);
  checkRatio('spacing', spacing, h, COUPLED_G_MIN, COUPLED_G_MAX);
  checkFrequency(f);
  const disp = checkCoupledDispersion(opts);
  const er0 = dielectricAt(sub, f).er;
  checkQuasiTem(f, er0, h);
  coupledInto(sub, width, spacing, f, disp);
  const n = coupledNumbers;
  const c = couplingFromModes(n.z0E, n.z0O);
  const warnings = coupledWarnings(sub, width, spacing, f, n.er, n.skin);
  return {
    width, spacing, f,
    even: mode(n.z0E, n.eeE, n.eeE0, f, n.acE, n.adE),
    odd: mode(n.z0O, n.eeO, n.eeO0, f, n.acO, n.adO),
    couplingFactor: c.factor, couplingDb: c.db, z0System: Math.sqrt(n.z0E * n.z0O),
    models: { static: 'kirschning-jansen-1984', dispersion: disp === 1 ? 'getsinger' : 'none', conductorLoss: 'wheeler-incremental-mode-ratio', dielectricLoss: 'filling-factor' },
    thresholds: thresholdsFor(n.er, h, 2 * width + spacing),
    warnings,
  };
}

/** Validity, mode and thin-metal warnings of one analysis, as data. */
export function coupledWarnings(sub: SubstrateSpec, width: number, spacing: number, f: number, er: number, skin: number): Warning[] {
  const out: Warning[] = [];
  const h = sub.h, u = width / h, g = spacing / h, R = KJ1984_RANGE;
  if (u < R.uMin || u > R.uMax || g < R.gMin || g > R.gMax || er > R.erMax) {
    out.push(w('validity', `Outside the stated range of the coupled-line model (0.1 ≤ W/h ≤ 10, 0.1 ≤ s/h ≤ 10, εr ≤ 18): W/h = ${fmt(u)}, s/h = ${fmt(g)}, εr = ${fmt(er)}.`, 'kirschning-jansen-1984'));
  }
  if (sub.t > 0) {
    out.push(w('validity', `The coupled-line model is for zero copper thickness; t = ${fmt(sub.t * 1e6)} µm is not in Z0e, Z0o or εe (a thick strip lowers Z0o most, by more as the gap narrows).`, 'kirschning-jansen-1984', 'info'));
  }
  if (f > 0) {
    thresholdLimits(er, h, 2 * width + spacing);
    if (f > limits.errorAt) {
      out.push(w('higher-order-mode', `f = ${fmt(f / 1e9)} GHz is above the first higher-order-mode / surface-wave threshold ${fmt(limits.errorAt / 1e9)} GHz of this pair: the quasi-TEM results do not hold.`, 'mode-thresholds', 'error'));
    } else if (f > limits.warnAt) {
      out.push(w('higher-order-mode', `f = ${fmt(f / 1e9)} GHz is above half the higher-order-mode / surface-wave threshold ${fmt(limits.errorAt / 1e9)} GHz of this pair: radiation and coupling at the ends grow.`, 'mode-thresholds'));
    }
    if (sub.t > 0 && sub.t < 3 * skin) {
      out.push(w('thin-conductor', `Copper t = ${fmt(sub.t * 1e6)} µm is less than 3 skin depths (δ = ${fmt(skin * 1e6)} µm): the conductor loss is an approximate DC/skin blend.`, 'skin-effect'));
    }
  }
  return out;
}

/** Mode impedances of a coupled-line coupler of `couplingDb` (dB, > 0) in a system of `z0` Ω (Pozar, Microwave
 * Engineering, 4th ed., 2012, §7.6): C = 10^(−dB/20), Z0e = Z0·√((1 + C)/(1 − C)), Z0o = Z0·√((1 − C)/(1 + C)). */
export function modesForCoupling(couplingDb: number, z0: number): { z0Even: number; z0Odd: number } {
  const c = 10 ** (-couplingDb / 20);
  return { z0Even: z0 * Math.sqrt((1 + c) / (1 - c)), z0Odd: z0 * Math.sqrt((1 - c) / (1 + c)) };
}

