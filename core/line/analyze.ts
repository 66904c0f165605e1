/**
 * Analysis W → Z0, εe, wavelength, velocity, delay and attenuation at f (static values at f = 0).
 *
 * Models (each in its own file, with citation): Hammerstad–Jensen 1980 static with thickness; Kirschning–Jansen
 * 1982 εe(f) and Jansen–Kirschning 1983 Z0(f) (default) or the Hammerstad–Jensen 1980 dispersion; conductor loss by
 * Wheeler's incremental-inductance rule (default) or the current-distribution form, times the Hammerstad–Bekkadal
 * roughness factor; dielectric loss by the filling-factor form with εe(f). Optionally εr and tanδ carried to f with
 * the wideband Debye model (core/substrate/wideband-debye.ts).
 *
 * DC / thin metal (the project's own rule): the strip's DC resistance gives αdc = 1/(σ W t)/(2 Z0); the conductor loss
 * reported is √(αskin² + αdc²), a heuristic blend that is continuous in f and t, adds about 1 % at t = 3δ and falls
 * as (δ/t)² above; below t = 3δ a thin-conductor warning flags the result as approximate.
 */
import { C0, ETA0, MU0, NP_TO_DB } from '../units/constants.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { DEBYE_F_HIGH, DEBYE_F_LOW, widebandDebyeAt } from '../substrate/wideband-debye.ts';
import type { Warning, WarningCode } from '../util/warnings.ts';
import { InputError, describe } from '../util/errors.ts';
import { evaluateModel, modelQuery, scratch } from './model.ts';
import { checkConductorLoss, checkDispersion, checkFrequency, checkQuasiTem, checkSubstrate, checkWidth } from './inputs.ts';
import { wheelerBracket } from './wheeler-incremental-inductance.ts';
import { currentDistributionAlphaC } from './current-distribution-loss.ts';
import { hammerstadBekkadalKr } from './hammerstad-bekkadal-roughness.ts';
import { limits, thresholdLimits, thresholdsFor } from './mode-thresholds.ts';
import { KJ1982_RANGE } from './kirschning-jansen-1982.ts';
import { JK1983_RANGE } from './jansen-kirschning-1983.ts';
import type { LineColumns, LineOptions, LineResult } from './types.ts';
import { analyzeMadeLine } from './made-line.ts';

/**
 * εr and tanδ at f for the substrate: the entered values, or the wideband Debye model when switched on (f = 0 →
 * entered values). εr is floored at 1.001, the lowest the models accept (the ε∞ ≥ 1 check of validateSubstrate
 * keeps a fit physical; the floor only guards rounding). Shared by analysis and synthesis so both see the same εr.
 */
export function dielectricAt(sub: SubstrateSpec, f: number): { er: number; tanDelta: number } {
  const dm = sub.dielectricModel;
  if (dm === undefined || dm.kind !== 'wideband-debye' || f === 0) return { er: sub.er, tanDelta: sub.tanDelta };
  const d = widebandDebyeAt(sub.er, sub.tanDelta, dm.fMeasure, f, dm.fLow ?? DEBYE_F_LOW, dm.fHigh ?? DEBYE_F_HIGH);
  if (d.er < 1.001) d.er = 1.001;
  return d;
}

function fmt(x: number): string { return String(Number(x.toPrecision(4))); }

/** A warning of this model: the same record as warn() from util/warnings.ts (same keys in the same order), built
 * directly as one object shape instead of by spreading an options object. */
function lineWarning(code: WarningCode, message: string, source: string, severity: Warning['severity'] = 'warning'): Warning {
  return { code, message, severity, source };
}

// Skin-effect terms depend only on f, σ and roughness: remembered for the last values (sweeps repeat them), as number
// fields of one object (V8 boxes a double written to a module-level `let` on every write).
const sk = { f: Number.NaN, sigma: Number.NaN, rough: Number.NaN, rs: 0.5, skin: 0.5, kr: 1.5 };
function skinTerms(f: number, sigma: number, rough: number): void {
  if (f === sk.f && sigma === sk.sigma && rough === sk.rough) return;
  sk.f = f; sk.sigma = sigma; sk.rough = rough;
  const k = Math.PI * f * MU0 * sigma; // 1/δ²
  const rs = Math.sqrt((Math.PI * f * MU0) / sigma);
  sk.rs = rs;
  sk.skin = f > 0 ? 1 / (sigma * rs) : 0; // δ = 1/√(π f μ0 σ) = 1/(σ Rs)
  sk.kr = rough === 0 ? 1 : hammerstadBekkadalKr(rough * rough * k);
}

/** What analyzeInto is asked (a record, not arguments: a double passed to a call that is not inlined is boxed). */
const ask = { width: 0.5, f: 0.5 };

/** One analysis' numbers (and the εr at f it used), written by analyzeInto (one record reused: no allocation). */
const r = {
  er: 0.5, z0: 0.5, z0s: 0.5, ees: 0.5, eef: 0.5, lambdaG: 0.5, vp: 0.5, delayPerM: 0.5, alphaC: 0.5, alphaD: 0.5, skinDepth: 0.5,
};

/**
 * The analysis of one strip with checked inputs (substrate, width and frequency valid; `disp` and `lossModel` from
 * the option checks): numbers to `r`, warnings appended to `warnings`. Shared by analyzeLine and analyzeLines so
 * that both give the same numbers to the last bit.
 */
function analyzeInto(sub: SubstrateSpec, a: { width: number; f: number }, disp: 0 | 1 | 2, lossModel: 0 | 1, warnings: Warning[]): void {
  const width = a.width; const f = a.f;
  const h = sub.h;
  let er = sub.er;
  let tanDelta = sub.tanDelta;
  const dm = sub.dielectricModel;
  if (dm !== undefined && dm.kind === 'wideband-debye' && f > 0) {
    const d = dielectricAt(sub, f);
    er = d.er; tanDelta = d.tanDelta;
    const fLow = dm.fLow ?? DEBYE_F_LOW; const fHigh = dm.fHigh ?? DEBYE_F_HIGH;
    if (f < fLow || f > fHigh) {
      warnings.push(lineWarning('validity', `f = ${fmt(f)} Hz lies outside the wideband Debye band ${fmt(fLow)}–${fmt(fHigh)} Hz; εr and tanδ are extrapolated.`, 'djordjevic-2001-wideband-debye'));
    }
  }

  checkQuasiTem(f, er, h);
  r.er = er;
  const t = sub.t;
  const u = width / h;
  const tn = t / h;
  const q = modelQuery;
  q.u = u; q.tn = tn; q.er = er; q.h = h; q.f = f; q.disp = disp;
  evaluateModel(q);
  const z0 = scratch.z0f; const z0s = scratch.z0s; const eef = scratch.eef; const ur = scratch.ur;

  // Wave quantities.
  const sq = Math.sqrt(eef);
  const vp = C0 / sq;
  r.z0 = z0; r.z0s = z0s; r.ees = scratch.ees; r.eef = eef;
  r.vp = vp; r.delayPerM = sq / C0; r.lambdaG = f > 0 ? vp / f : 0;

  // Conductor loss.
  const sigma = sub.sigma;
  skinTerms(f, sigma, sub.roughness);
  const rs = sk.rs; const skinDepth = sk.skin; const kr = sk.kr;
  let alphaSkin: number;
  if (f === 0) alphaSkin = 0;
  else if (lossModel === 0 && t > 0) {
    alphaSkin = kr * (rs / (ETA0 * z0s)) * (wheelerBracket(u, tn, scratch.s, scratch.T, scratch.X, scratch.lnX1, scratch.slopeU1) / h);
  }
  else {
    alphaSkin = kr * currentDistributionAlphaC(rs, z0, width);
    if (lossModel === 0) {
      warnings.push(lineWarning('validity', 'Wheeler\'s incremental-inductance rule needs a strip thickness above 0; the conductor loss uses the current-distribution form instead.', 'wheeler-1942', 'info'));
    }
  }
  const alphaDc = t > 0 ? 1 / (2 * sigma * width * t * z0s) : 0; // R_dc/(2 Z0), R_dc = 1/(σ W t)
  r.alphaC = alphaDc === 0 ? alphaSkin : Math.sqrt(alphaSkin * alphaSkin + alphaDc * alphaDc);
  // fillingFactorAlphaD, inlined with one division: (π f/c0)·(εr/√εe)·((εe − 1)/(εr − 1))·tanδ.
  r.alphaD = f > 0 && tanDelta > 0 ? (Math.PI * f * er * (eef - 1) * tanDelta) / (C0 * sq * (er - 1)) : 0;
  r.skinDepth = skinDepth;

  // Limits, as data.
  if (u < 0.01 || u > 100) {
    warnings.push(lineWarning('validity', `W/h = ${fmt(u)} is outside 0.01–100, where the static model is stated to 0.2 %.`, 'hammerstad-jensen-1980'));
  }
  if (tn > 0.28) {
    warnings.push(lineWarning('validity', `t/h = ${fmt(tn)} is above 0.28, beyond the range where the thickness correction was checked to 1 %.`, 'hammerstad-jensen-1980'));
  }
  if (f > 0) {
    const fn = f * h * 1e-6;
    if (disp === 1) {
      if (ur < KJ1982_RANGE.uMin || ur > KJ1982_RANGE.uMax || er > KJ1982_RANGE.erMax || fn > KJ1982_RANGE.fnMax) {
        warnings.push(lineWarning('validity', `Outside the stated range of the εe(f) model (0.1 ≤ W/h ≤ 100, εr ≤ 20, f·h ≤ 39 GHz·mm): W/h = ${fmt(ur)}, εr = ${fmt(er)}, f·h = ${fmt(fn)} GHz·mm.`, 'kirschning-jansen-1982'));
      }
      if (ur < JK1983_RANGE.uMin || ur > JK1983_RANGE.uMax || er > JK1983_RANGE.erMax || fn > JK1983_RANGE.fnMax) {
        warnings.push(lineWarning('validity', `Outside the usually quoted range of the Z0(f) model (0.1 ≤ W/h ≤ 10, εr ≤ 18, f·h ≤ 15 GHz·mm): W/h = ${fmt(ur)}, εr = ${fmt(er)}, f·h = ${fmt(fn)} GHz·mm.`, 'jansen-kirschning-1983'));
      }
    }
    thresholdLimits(er, h, width);
    const errorAt = limits.errorAt;
    if (f > errorAt) {
      warnings.push(lineWarning('higher-order-mode', `f = ${fmt(f / 1e9)} GHz is above the first higher-order-mode / surface-wave threshold ${fmt(errorAt / 1e9)} GHz: the quasi-TEM results do not hold; use a thinner substrate or a narrower strip.`, 'mode-thresholds', 'error'));
    } else if (f > limits.warnAt) {
      warnings.push(lineWarning('higher-order-mode', `f = ${fmt(f / 1e9)} GHz is above half the higher-order-mode / surface-wave threshold ${fmt(errorAt / 1e9)} GHz: radiation and coupling at discontinuities grow.`, 'mode-thresholds'));
    }
    if (t > 0 && t < 3 * skinDepth) {
      warnings.push(lineWarning('thin-conductor', `Copper t = ${fmt(t * 1e6)} µm is less than 3 skin depths (δ = ${fmt(skinDepth * 1e6)} µm): the conductor loss is an approximate DC/skin blend.`, 'skin-effect'));
    }
    if (sub.roughness > 3 * skinDepth) {
      warnings.push(lineWarning('validity', `Roughness ${fmt(sub.roughness * 1e6)} µm rms is more than 3 skin depths: the roughness factor saturates at 2 and may under-predict the loss.`, 'hammerstad-bekkadal-1975', 'info'));
    }
  }
}

/**
 * Analyses a strip of `width` (m) on `sub` at `f` (Hz; 0 for static values).
 * Example: analyzeLine({ er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 }, 1.0734e-3, 10e9).z0 ≈ 50.1.
 * Throws InputError for invalid input; leaving a model's published range is a warning in the result.
 */
export function analyzeLine(sub: SubstrateSpec, width: number, f: number, opts?: LineOptions): LineResult {
  if (opts !== undefined && opts.crossSection !== undefined) return analyzeMadeLine(sub, width, f, opts.crossSection, opts);
  checkSubstrate(sub);
  checkWidth(width, sub.h);
  checkFrequency(f);
  const disp = checkDispersion(opts);
  const lossModel = checkConductorLoss(opts);
  const warnings: Warning[] = [];
  ask.width = width; ask.f = f;
  analyzeInto(sub, ask, disp, lossModel, warnings);
  const { alphaC, alphaD, lambdaG } = r;
  return {
    width, f, z0: r.z0, z0Static: r.z0s, epsEff: r.eef, epsEffStatic: r.ees,
    lambdaG, vp: r.vp, delayPerM: r.delayPerM,
    alphaC, alphaD, alphaCdBPerM: alphaC * NP_TO_DB, alphaDdBPerM: alphaD * NP_TO_DB,
    lossDbPerWavelength: (alphaC + alphaD) * NP_TO_DB * lambdaG,
    skinDepth: r.skinDepth, thresholds: thresholdsFor(r.er, sub.h, width), warnings,
  };
}

/** An InputError about a width or a frequency, renamed for entry i of the batch (widths[i], freqs[i]). */
function atEntry(e: unknown, i: number): unknown {
  if (!(e instanceof InputError) || (e.field !== 'width' && e.field !== 'f')) return e;
  return new InputError(e.code, `${e.field === 'width' ? 'widths' : 'freqs'}[${i}]`, e.expected, e.got, e.hint);
}

function columnOf(name: string, v: ArrayLike<number> | number, n: number): (i: number) => number {
  if (typeof v === 'number') return () => v;
  if (v === null || typeof v !== 'object' || typeof v.length !== 'number') {
    throw new InputError('invalid-number', name, 'a number or an array of numbers', describe(v));
  }
  if (v.length !== n) throw new InputError('out-of-range', name, `${n} values, one per width`, `${v.length} values`, 'give one frequency per width, or one frequency for all');
  return (i) => v[i]!;
}

/**
 * Analyses many strips on one substrate, the form for sweeps and tables: widths[i] (m) at freqs[i] (Hz), or every
 * width at one frequency. Same numbers as analyzeLine to the last bit, written to columns (Float64Array, SI units)
 * instead of one object per analysis; warnings come with the index of the analysis they belong to.
 * Throws InputError naming the first bad entry (e.g. `widths[17]`); nothing is returned then.
 * Example: analyzeLines(glassEpoxy, [1.5e-3, 3e-3], 2.45e9).z0 → Float64Array [≈ 50, ≈ 33].
 */
export function analyzeLines(sub: SubstrateSpec, widths: ArrayLike<number>, freqs: ArrayLike<number> | number, opts?: LineOptions, into?: LineColumns): LineColumns {
  checkSubstrate(sub);
  const disp = checkDispersion(opts);
  const lossModel = checkConductorLoss(opts);
  if (widths === null || typeof widths !== 'object' || typeof widths.length !== 'number') {
    throw new InputError('invalid-number', 'widths', 'an array of strip widths in metres', describe(widths));
  }
  const n = widths.length;
  const fAt = columnOf('freqs', freqs, n);
  if (opts !== undefined && opts.crossSection !== undefined) return madeColumns(sub, widths, fAt, opts);
  for (let i = 0; i < n; i++) {
    try { checkWidth(widths[i], sub.h); checkFrequency(fAt(i)); } catch (e) { throw atEntry(e, i); }
  }
  // `into` (columns of the same length from an earlier call) is refilled instead of allocating twelve new arrays: a
  // loop that analyses many boards (the yield estimate) would otherwise spend its time collecting them.
  const cols: LineColumns = into !== undefined && into.width.length === n ? into : {
    width: new Float64Array(n), f: new Float64Array(n), z0: new Float64Array(n), z0Static: new Float64Array(n),
    epsEff: new Float64Array(n), epsEffStatic: new Float64Array(n), lambdaG: new Float64Array(n), vp: new Float64Array(n),
    delayPerM: new Float64Array(n), alphaC: new Float64Array(n), alphaD: new Float64Array(n), skinDepth: new Float64Array(n),
    warnings: [],
  };
  cols.width.set(widths);
  cols.warnings.length = 0;
  const pending: Warning[] = [];
  for (let i = 0; i < n; i++) {
    const f = fAt(i);
    ask.width = cols.width[i]!; ask.f = f;
    try { analyzeInto(sub, ask, disp, lossModel, pending); } catch (e) { throw atEntry(e, i); }
    cols.f[i] = f; cols.z0[i] = r.z0; cols.z0Static[i] = r.z0s; cols.epsEff[i] = r.eef; cols.epsEffStatic[i] = r.ees;
    cols.lambdaG[i] = r.lambdaG; cols.vp[i] = r.vp; cols.delayPerM[i] = r.delayPerM;
    cols.alphaC[i] = r.alphaC; cols.alphaD[i] = r.alphaD; cols.skinDepth[i] = r.skinDepth;
    if (pending.length > 0) {
      for (const warning of pending) cols.warnings.push({ index: i, warning });
      pending.length = 0;
    }
  }
  return cols;
}

/** analyzeLines for a line with a cross-section source: one analysis per entry (the source's tables are the cost). */
function madeColumns(sub: SubstrateSpec, widths: ArrayLike<number>, fAt: (i: number) => number, opts: LineOptions): LineColumns {
  const n = widths.length;
  const col = () => new Float64Array(n);
  const cols: LineColumns = {
    width: Float64Array.from(widths), f: col(), z0: col(), z0Static: col(), epsEff: col(), epsEffStatic: col(), lambdaG: col(), vp: col(),
    delayPerM: col(), alphaC: col(), alphaD: col(), skinDepth: col(), warnings: [],
  };
  for (let i = 0; i < n; i++) {
    let x: LineResult;
    try { x = analyzeLine(sub, widths[i]!, fAt(i), opts); } catch (e) { throw atEntry(e, i); }
    cols.f[i] = x.f; cols.z0[i] = x.z0; cols.z0Static[i] = x.z0Static; cols.epsEff[i] = x.epsEff; cols.epsEffStatic[i] = x.epsEffStatic;
    cols.lambdaG[i] = x.lambdaG; cols.vp[i] = x.vp; cols.delayPerM[i] = x.delayPerM; cols.alphaC[i] = x.alphaC; cols.alphaD[i] = x.alphaD;
    cols.skinDepth[i] = x.skinDepth;
    for (const warning of x.warnings) cols.warnings.push({ index: i, warning });
  }
  return cols;
}
