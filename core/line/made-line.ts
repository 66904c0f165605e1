/**
 * Analysis and synthesis of a line whose static values come from a cross-section source (cross-section.ts) instead
 * of the Hammerstad–Jensen microstrip formulas.
 *
 * Stated approximation: the single-line dispersion model of the options (default Kirschning–Jansen 1982 εe(f) with
 * Jansen–Kirschning 1983 Z0(f), or Hammerstad–Jensen 1980) is applied to the source's static Z0 and εeff with
 * u = W/h. Those fits were made for open microstrip; side copper, a trench or a cover change how the field moves
 * into the substrate with frequency, so the dispersive part is approximate (the static part is the field solution).
 * Conductor loss: Wheeler's incremental-inductance rule with the source's ∂L/∂n (Wheeler, Proc. IRE 30, 1942),
 * times the Hammerstad–Bekkadal roughness factor, blended with the DC resistance as for microstrip (analyze.ts).
 * Dielectric loss: the filling-factor form with the source's εeff(f) (the cover's own loss is not included).
 */
import { C0, MU0 } from '../units/constants.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { InputError, describe } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { NP_TO_DB } from '../units/constants.ts';
import { analyzeLine, dielectricAt } from './analyze.ts';
import { kirschningJansenEpsEff } from './kirschning-jansen-1982.ts';
import { jansenKirschningZ0 } from './jansen-kirschning-1983.ts';
import { hjDispersionEpsEff, hjDispersionZ0 } from './hammerstad-jensen-1980-dispersion.ts';
import { hammerstadBekkadalKr } from './hammerstad-bekkadal-roughness.ts';
import type { CrossSectionSource } from './cross-section.ts';
import type { LineOptions, LineResult } from './types.ts';

/** The microstrip analysis's own static-model range warnings do not apply to a field-solved line. */
const MICROSTRIP_STATIC_SOURCE = 'hammerstad-jensen-1980';

export function analyzeMadeLine(sub: SubstrateSpec, width: number, f: number, src: CrossSectionSource, opts?: LineOptions): LineResult {
  const plainOpts: LineOptions = { ...opts };
  delete plainOpts.crossSection;
  // The plain analysis checks every input and gives the mode thresholds, skin depth and dispersion-range warnings.
  const base = analyzeLine(sub, width, f, plainOpts);
  if (!(width >= src.widthRange.min * (1 - 1e-9) && width <= src.widthRange.max * (1 + 1e-9))) {
    throw new InputError('out-of-range', 'width', `a width from ${mmText(src.widthRange.min)} to ${mmText(src.widthRange.max)} mm, the range of the cross-section tables (${src.label})`, describe(width), 'widen the tables or choose another width');
  }
  const st = src.staticAt(width);
  const { er, tanDelta } = dielectricAt(sub, f);
  const h = sub.h;
  const u = width / h;
  const z0s = st.z0, ees = st.epsEff;
  let eef = ees, z0f = z0s;
  const disp = opts?.dispersion ?? 'kirschning-jansen';
  if (f > 0 && disp === 'kirschning-jansen') {
    const fn = f * h * 1e-6;
    eef = kirschningJansenEpsEff(u, er, ees, fn);
    z0f = jansenKirschningZ0(u, er, ees, eef, fn, z0s);
    if (!(z0f > 0 && z0f < Infinity)) z0f = z0s * Math.sqrt(ees / eef);
  } else if (f > 0 && disp === 'hammerstad-jensen') {
    eef = hjDispersionEpsEff(er, ees, z0s, h, f);
    z0f = hjDispersionZ0(ees, eef, z0s);
  }
  const sq = Math.sqrt(eef);
  const vp = C0 / sq;
  let alphaC = 0;
  if (f > 0) {
    const rs = Math.sqrt((Math.PI * f * MU0) / sub.sigma);
    const kr = sub.roughness === 0 ? 1 : hammerstadBekkadalKr(sub.roughness * sub.roughness * Math.PI * f * MU0 * sub.sigma);
    const skin = st.dLdn > 0 ? (kr * rs * st.dLdn) / (2 * MU0 * z0s) : base.alphaC * (base.z0Static / z0s);
    const dc = sub.t > 0 ? 1 / (2 * sub.sigma * width * sub.t * z0s) : 0;
    alphaC = st.dLdn > 0 && dc > 0 ? Math.sqrt(skin * skin + dc * dc) : skin;
  }
  const alphaD = f > 0 && tanDelta > 0 && er > 1 ? (Math.PI * f * er * (eef - 1) * tanDelta) / (C0 * sq * (er - 1)) : 0;
  const lambdaG = f > 0 ? vp / f : 0;
  const warnings: Warning[] = base.warnings.filter((w) => w.source !== MICROSTRIP_STATIC_SOURCE);
  for (const w of st.warnings) if (!warnings.some((x) => x.message === w.message)) warnings.push(w);
  return {
    width, f, z0: z0f, z0Static: z0s, epsEff: eef, epsEffStatic: ees, lambdaG, vp, delayPerM: sq / C0,
    alphaC, alphaD, alphaCdBPerM: alphaC * NP_TO_DB, alphaDdBPerM: alphaD * NP_TO_DB,
    lossDbPerWavelength: (alphaC + alphaD) * NP_TO_DB * lambdaG, skinDepth: base.skinDepth, thresholds: base.thresholds, warnings,
  };
}

/** The width whose Z0 at f (with dispersion) equals z0, by bisection on ln W over the source's range (Z0 falls with W). */
export function synthesizeMadeLine(sub: SubstrateSpec, z0: number, f: number, src: CrossSectionSource, opts?: LineOptions): LineResult {
  if (typeof z0 !== 'number' || !(z0 > 0 && z0 <= 1e4)) {
    throw new InputError(typeof z0 === 'number' && Number.isFinite(z0) ? 'out-of-range' : 'invalid-number', 'z0', 'a target impedance above 0 Ω and up to 10 kΩ', describe(z0));
  }
  let a = Math.log(src.widthRange.min) + 1e-12, b = Math.log(src.widthRange.max) - 1e-12;
  const zAt = (x: number) => analyzeMadeLine(sub, Math.exp(x), f, src, opts).z0;
  const zHi = zAt(a), zLo = zAt(b);
  if (!(z0 <= zHi && z0 >= zLo)) {
    throw new InputError('unreachable-target', 'z0', `an impedance from ${zLo.toFixed(2)} Ω to ${zHi.toFixed(2)} Ω, the range of the cross-section tables (${src.label})`, `${z0} Ω`, 'choose a target in that range');
  }
  for (let i = 0; i < 80 && b - a > 1e-12; i++) {
    const m = 0.5 * (a + b);
    if (zAt(m) > z0) a = m; else b = m;
  }
  return analyzeMadeLine(sub, Math.exp(0.5 * (a + b)), f, src, opts);
}

function mmText(m: number): string { return String(Number((m * 1e3).toPrecision(4))); }
