/**
 * The laminate from a measured coupon: εr and tanδ (optionally the copper roughness) from two-port measurements of
 * two or more lines of one width and different lengths with identical launches. The one function every face calls.
 *
 * Steps: read each Touchstone text (core/network/touchstoneRead.ts) and check it (two ports, one common frequency
 * grid, different lengths); at each frequency the propagation constant γ by Marks' eigenvalue / multiline method
 * (marks-1991-multiline.ts), the eigenvalue and the 2π multiple chosen with the line model's γ for the first guess;
 * ε_eff = −(γ/k0)² (janezic-jargon-1999.ts); εr and tanδ fitted through the line model (laminate-fit.ts). After a
 * fit the guesses are remade from the fitted laminate and the estimates and the fit repeated until the phase
 * multiples stop changing (at most three rounds).
 * Frequencies are left out, and reported with the reason, where every line pair is within `minPhaseDeg` of β·Δl =
 * n·180° (ill-conditioned), at 0 Hz, where a line shows no transmission (|S21| < 1e-3), or above the substrate's
 * first higher-order mode / surface-wave threshold (core/line/mode-thresholds.ts) where quasi-TEM models stop.
 */
import { InputError, describe } from '../../util/errors.ts';
import type { Warning } from '../../util/warnings.ts';
import type { SubstrateSpec } from '../../substrate/types.ts';
import { validateSubstrate } from '../../substrate/validate.ts';
import { ANNEALED_COPPER_SIGMA } from '../../substrate/defaults.ts';
import { DEBYE_F_HIGH, DEBYE_F_LOW } from '../../substrate/wideband-debye.ts';
import { thresholdsFor } from '../../line/mode-thresholds.ts';
import { lineModels, stripColumns, type LineModels, type LineOptions } from '../../line/index.ts';
import { C0 } from '../../units/constants.ts';
import { cabs } from '../complex.ts';
import { readTouchstone, type TouchstoneData } from '../touchstoneRead.ts';
import { multilineGamma, sToT, type Mat2 } from './marks-1991-multiline.ts';
import { effectivePermittivityFromGamma } from './janezic-jargon-1999.ts';
import { fitLaminate, modelEps, type FitParameter } from './laminate-fit.ts';

export interface CouponLineFile {
  /** File name (for messages and the .s2p port count). */
  name: string;
  /** Touchstone text. */
  text: string;
  /** Length of the line between the two connector reference planes, m (only differences matter). */
  length: number;
}

export interface CouponExtractInput {
  lines: CouponLineFile[];
  /** Strip width of every line, m. */
  width: number;
  /** Dielectric height, m. */
  h: number;
  /** Copper thickness, m (0 allowed). */
  t: number;
  /** Conductivity, S/m (default annealed copper 5.8e7). */
  sigma?: number;
  /** Copper rms roughness, m (default 0); the starting value when `fitRoughness`. */
  roughness?: number;
  /** First guess of εr (default 4.4) and tanδ (default 0.01). */
  erGuess?: number;
  tanDeltaGuess?: number;
  /** Also fit the copper roughness (default false; ill-conditioned unless the band is wide). */
  fitRoughness?: boolean;
  /** 'wideband-debye' (default): εr, tanδ fitted as values at fMeasure carried over the band by the wideband Debye
   * model; 'constant': the same εr and tanδ at every frequency. */
  dielectric?: 'wideband-debye' | 'constant';
  /** Frequency the result is stated at, Hz (default: the geometric middle of the frequencies used). */
  fMeasure?: number;
  /** Conditioning margin, degrees (default 20): frequencies where no line pair has β·Δl this far from n·180° are left out. */
  minPhaseDeg?: number;
  line?: LineOptions;
  /** Line models the coupon's strips are asked of (the line-model interface; default the core's). */
  models?: LineModels;
}

export interface CouponPoint {
  f: number;
  used: boolean;
  /** Why the frequency was left out. */
  reason?: string;
  /** Measured values (0 where no estimate exists): ε'_eff, ε''_eff, α Np/m, β rad/m. */
  epsEff: number;
  epsEffLoss: number;
  alpha: number;
  beta: number;
  /** The fitted model's ε'_eff and α (Np/m) at this frequency; absent where the model does not apply (0 Hz, above
   * the higher-order-mode threshold). */
  fitEpsEff?: number;
  fitAlpha?: number;
  /** Conditioning: the best line pair's β·Δl distance from n·180°, degrees (0–90). */
  phaseMarginDeg: number;
}

export interface CouponResult {
  /** Fitted relative permittivity and loss tangent at fMeasure. */
  er: number;
  tand: number;
  /** Fitted rms roughness, m (when asked for). */
  roughness?: number;
  fMeasure: number;
  dielectric: 'wideband-debye' | 'constant';
  /** Standard uncertainties (k = 1), total: residuals and measured spread combined in quadrature. */
  uncertainty: { er: number; tand: number; roughness?: number };
  uncertaintyParts: { residuals: { er: number; tand: number; roughness?: number }; spread: { er: number; tand: number; roughness?: number } };
  /** The laminate as fitted, ready to become the design's substrate. */
  substrate: SubstrateSpec;
  points: CouponPoint[];
  excluded: { f: number; reason: string }[];
  /** Weighted rms misfit of ε'_eff and ε''_eff. */
  rms: { epsEff: number; epsEffLoss: number };
  lines: { name: string; length: number }[];
  warnings: Warning[];
}

const fmtHz = (f: number) => `${Number((f / 1e9).toPrecision(5))} GHz`;

function positive(field: string, v: unknown, expected: string, lo = 0, hi = Number.POSITIVE_INFINITY): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || !(v > lo && v <= hi)) {
    throw new InputError(typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number', field, expected, describe(v));
  }
  return v;
}

function readLine(file: CouponLineFile, i: number): TouchstoneData {
  if (typeof file !== 'object' || file === null || typeof file.text !== 'string') {
    throw new InputError('bad-file', `lines[${i}]`, 'a measured line: file name, Touchstone text and length', describe(file));
  }
  const name = typeof file.name === 'string' && file.name !== '' ? file.name : `line ${i + 1}`;
  const data = readTouchstone(file.text, { fileName: name });
  if (data.ports.length !== 2) {
    throw new InputError('bad-file', name, 'a two-port measurement of one line (.s2p: port 1 at one end, port 2 at the other)',
      `${data.ports.length}-port data`, 'measure each coupon line as a two-port and save it as .s2p');
  }
  if (data.ports[0]!.zRef !== data.ports[1]!.zRef) {
    throw new InputError('bad-file', name, 'one reference impedance on both ports', `${data.ports[0]!.zRef} Ω and ${data.ports[1]!.zRef} Ω`);
  }
  return data;
}

function checkGrids(data: TouchstoneData[], names: string[]): void {
  const f0 = data[0]!.freqs;
  for (let i = 1; i < data.length; i++) {
    const f = data[i]!.freqs;
    const same = f.length === f0.length && f.every((x, k) => Math.abs(x - f0[k]!) <= 1e-9 * Math.max(x, 1));
    if (!same) {
      throw new InputError('bad-file', names[i]!, `the same frequencies as ${names[0]} (${f0.length} points, ${fmtHz(f0[0]!)} to ${fmtHz(f0[f0.length - 1]!)})`,
        `${f.length} points, ${fmtHz(f[0]!)} to ${fmtHz(f[f.length - 1]!)}`, 'measure every coupon line with the same analyser settings (start, stop, points)');
    }
  }
}

/** S-parameters of line i at frequency k as a cascade matrix, or null without transmission. */
function cascadeAt(d: TouchstoneData, k: number): Mat2 | null {
  const s = d.s; const o = 8 * k;
  const s11 = { re: s[o]!, im: s[o + 1]! }, s12 = { re: s[o + 2]!, im: s[o + 3]! };
  const s21 = { re: s[o + 4]!, im: s[o + 5]! }, s22 = { re: s[o + 6]!, im: s[o + 7]! };
  if (!(cabs(s21) >= 1e-3) || !(cabs(s12) >= 1e-3)) return null;
  return sToT(s11, s21, s12, s22);
}

/** Extracts εr and tanδ of the laminate from the coupon's measured lines. Throws InputError for bad input. */
export function extractLaminate(input: CouponExtractInput): CouponResult {
  if (typeof input !== 'object' || input === null || !Array.isArray(input.lines)) {
    throw new InputError('invalid-number', 'lines', 'a list of measured lines (file, text, length)', describe(input?.lines));
  }
  if (input.lines.length < 2) {
    throw new InputError('out-of-range', 'lines', 'at least two measured lines of different length', `${input.lines.length}`, 'measure both coupon lines');
  }
  if (input.lines.length > 16) throw new InputError('out-of-range', 'lines', 'at most 16 measured lines', `${input.lines.length}`);
  const width = positive('width', input.width, 'the strip width of the coupon lines, above 0 m', 0, 0.1);
  const family = (input.models ?? lineModels).strip();
  const h = positive('h', input.h, 'the dielectric height, from 1 µm to 100 mm', 1e-6 - 1e-18, 0.1);
  const lengths = input.lines.map((l, i) => positive(`lines[${i}].length`, l?.length, 'the line length between the reference planes, above 0 m', 0, 10));
  const names = input.lines.map((l, i) => (typeof l?.name === 'string' && l.name !== '' ? l.name : `line ${i + 1}`));
  for (let i = 0; i < lengths.length; i++) for (let j = 0; j < i; j++) {
    if (Math.abs(lengths[i]! - lengths[j]!) < 1e-4) {
      throw new InputError('out-of-range', `lines[${i}].length`, `a length different from ${names[j]}'s by at least 0.1 mm (only the difference carries the propagation constant)`,
        `${lengths[i]} m, the same as ${names[j]}`, 'measure lines of different length');
    }
  }
  const minPhaseDeg = input.minPhaseDeg ?? 20;
  if (typeof minPhaseDeg !== 'number' || !(minPhaseDeg >= 1 && minPhaseDeg <= 60)) {
    throw new InputError('out-of-range', 'minPhaseDeg', 'a conditioning margin from 1° to 60°', describe(minPhaseDeg));
  }
  const dielectric = input.dielectric ?? 'wideband-debye';
  if (dielectric !== 'wideband-debye' && dielectric !== 'constant') throw new InputError('bad-choice', 'dielectric', "'wideband-debye' or 'constant'", describe(dielectric));
  const start: SubstrateSpec = validateSubstrate({
    er: input.erGuess ?? 4.4, h, t: input.t, tanDelta: input.tanDeltaGuess ?? 0.01,
    sigma: input.sigma ?? ANNEALED_COPPER_SIGMA, roughness: input.roughness ?? 0,
  }, '');
  if (width < 1e-3 * h || width > 1e3 * h) throw new InputError('out-of-range', 'width', `a strip width from 0.001·h to 1000·h`, String(width));

  const data = input.lines.map((l, i) => readLine(l, i));
  checkGrids(data, names);
  const warnings: Warning[] = [];
  for (const d of data) warnings.push(...d.warnings);
  const freqs = Array.from(data[0]!.freqs);
  const F = freqs.length;

  // Frequencies that cannot be used whatever the fit: DC, no transmission, above the quasi-TEM limit at the guess.
  const fixedReason: (string | undefined)[] = new Array(F).fill(undefined);
  const t: (Mat2[] | null)[] = new Array(F).fill(null);
  const fTop = thresholdsFor(start.er, h, width).errorAt;
  for (let k = 0; k < F; k++) {
    const f = freqs[k]!;
    if (!(f > 0)) { fixedReason[k] = 'DC point'; continue; }
    if (f > fTop) { fixedReason[k] = `above ${fmtHz(fTop)}, the first higher-order mode / surface-wave threshold of this substrate and width`; continue; }
    const ts = data.map((d) => cascadeAt(d, k));
    if (ts.some((x) => x === null)) { fixedReason[k] = 'a line shows no transmission (|S21| < 1e-3)'; continue; }
    t[k] = ts as Mat2[];
  }

  const inModel: number[] = [];
  for (let k = 0; k < F; k++) if (freqs[k]! > 0 && freqs[k]! <= fTop) inModel.push(k);
  const fitList: FitParameter[] = input.fitRoughness ? ['er', 'tanDelta', 'roughness'] : ['er', 'tanDelta'];
  let sub = start;
  let fMeasure = input.fMeasure;
  let lastKey = '';
  let result: ReturnType<typeof fitLaminate> = null;
  let est: (ReturnType<typeof multilineGamma>)[] = [];
  let used: number[] = [];
  for (let round = 0; round < 4; round++) {
    // γ guesses from the line model with the current laminate.
    // (only where the model applies: above 0 Hz and up to the higher-order-mode threshold).
    const guess = modelEps(sub, width, inModel.map((k) => freqs[k]!), input.line, family);
    if (!guess) throw new InputError('out-of-range', 'erGuess', 'a first guess the line model accepts for this width and height', String(sub.er));
    est = freqs.map(() => null);
    inModel.forEach((k, i) => { if (t[k]) est[k] = multilineGamma(t[k]!, lengths, { re: guess.alpha[i]!, im: guess.beta[i]! }, minPhaseDeg); });
    used = [];
    for (let k = 0; k < F; k++) if (est[k]) used.push(k);
    if (used.length < 3) {
      throw new InputError('out-of-range', 'lines', `at least 3 frequencies where the lines' phase difference β·Δl is ${minPhaseDeg}° or more away from a multiple of 180°`,
        `${used.length} such frequencies of ${F}`, 'measure over a wider band, or use lines whose length difference suits the band (the coupon generator sizes them)');
    }
    const key = used.map((k) => Math.round(est[k]!.gamma.im * 1e3)).join(',');
    if (round > 0 && key === lastKey && result) break;
    lastKey = key;
    if (fMeasure === undefined) fMeasure = Math.sqrt(freqs[used[0]!]! * freqs[used[used.length - 1]!]!);
    const withModel: SubstrateSpec = dielectric === 'constant' ? { ...sub } : {
      ...sub, dielectricModel: { kind: 'wideband-debye', fMeasure: positive('fMeasure', fMeasure, `a frequency between ${DEBYE_F_LOW} Hz and ${DEBYE_F_HIGH} Hz`, DEBYE_F_LOW, DEBYE_F_HIGH) },
    };
    if (dielectric === 'constant') delete withModel.dielectricModel;
    const realM: number[] = [], lossM: number[] = [], weight: number[] = [], spread: number[] = [];
    for (const k of used) {
      const e = est[k]!;
      const eps = effectivePermittivityFromGamma(e.gamma, freqs[k]!);
      const k0 = (2 * Math.PI * freqs[k]!) / C0;
      const scale = (2 * cabs(e.gamma)) / (k0 * k0); // |dε|/|dγ|
      realM.push(eps.real); lossM.push(eps.loss);
      weight.push(1 / (e.variance * scale * scale));
      spread.push(e.spread * scale);
    }
    // Normalise weights to a mean of 1 (only their ratios matter).
    const wMean = weight.reduce((s, w) => s + w, 0) / weight.length;
    result = fitLaminate({
      freqs: used.map((k) => freqs[k]!), real: realM, loss: lossM, weight: weight.map((w) => w / wMean), spread,
      width, substrate: withModel, fit: fitList, line: input.line, family,
    });
    if (!result) throw new InputError('out-of-range', 'lines', 'measurements the line model can follow', 'no laminate the model accepts fits them', 'check the lengths, width and height given for the coupon');
    sub = result.substrate;
  }
  const fit = result!;
  const fitted = modelEps(fit.substrate, width, inModel.map((k) => freqs[k]!), input.line, family);
  const fitAt = new Map<number, { eps: number; alpha: number }>();
  if (fitted) inModel.forEach((k, i) => { const k0 = (2 * Math.PI * freqs[k]!) / C0; fitAt.set(k, { eps: (fitted.beta[i]! / k0) ** 2, alpha: fitted.alpha[i]! }); });
  const points: CouponPoint[] = [];
  const excluded: { f: number; reason: string }[] = [];
  for (let k = 0; k < F; k++) {
    const e = est[k];
    const reason = fixedReason[k] ?? (e ? undefined : `β·Δl within ${minPhaseDeg}° of a multiple of 180° for every line pair (ill-conditioned)`);
    if (reason) excluded.push({ f: freqs[k]!, reason });
    const eps = e ? effectivePermittivityFromGamma(e.gamma, freqs[k]!) : { real: 0, loss: 0 };
    const m = fitAt.get(k);
    points.push({
      f: freqs[k]!, used: !reason, ...(reason ? { reason } : {}),
      epsEff: eps.real, epsEffLoss: eps.loss, alpha: e ? e.gamma.re : 0, beta: e ? e.gamma.im : 0,
      ...(m ? { fitEpsEff: m.eps, fitAlpha: m.alpha } : {}),
      phaseMarginDeg: e ? e.phaseMarginDeg : 0,
    });
  }
  if (excluded.length > 0) {
    warnings.push({ code: 'note', severity: 'info', source: 'marks-1991-multiline', message: `${excluded.length} of ${F} frequencies were left out (see the list of excluded frequencies).` });
  }
  // The model's own warnings at the used frequencies (validity ranges, thin copper …), once each.
  try {
    const cols = stripColumns(family, fit.substrate, used.map(() => width), used.map((k) => freqs[k]!), input.line);
    const seen = new Set<string>();
    for (const w of cols.warnings) if (!seen.has(w.warning.message.replace(/[\d.]+/g, '#'))) { seen.add(w.warning.message.replace(/[\d.]+/g, '#')); warnings.push(w.warning); }
  } catch { /* the fit already ran through the same model */ }
  if (!fit.uncertaintyKnown) {
    warnings.push({ code: 'note', severity: 'warning', source: 'coupon-fit', message: 'The uncertainties could not be worked out (the fitted quantities cannot be told apart from these data); they are given as 0 and are not meaningful. Measure over a wider band or do not fit the roughness.' });
  }
  const u = fit.uncertainty, ur = fit.fromResiduals, us = fit.fromSpread;
  const pick = (r: Record<string, number>) => ({ er: r.er!, tand: r.tanDelta!, ...(input.fitRoughness ? { roughness: r.roughness! } : {}) });
  const substrate: SubstrateSpec = dielectric === 'constant'
    ? { ...fit.substrate }
    : { ...fit.substrate, dielectricModel: { kind: 'wideband-debye', fMeasure: fMeasure! } };
  return {
    er: fit.substrate.er, tand: fit.substrate.tanDelta, ...(input.fitRoughness ? { roughness: fit.substrate.roughness } : {}),
    fMeasure: fMeasure!, dielectric,
    uncertainty: pick(u), uncertaintyParts: { residuals: pick(ur), spread: pick(us) },
    substrate, points, excluded, rms: { epsEff: fit.rms.real, epsEffLoss: fit.rms.loss },
    lines: names.map((name, i) => ({ name, length: lengths[i]! })), warnings,
  };
}

