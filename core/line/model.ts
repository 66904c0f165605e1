/**
 * The line model's impedance and permittivity path, shared by analysis and synthesis so that synthesis inverts
 * exactly the numbers the analysis reports. One straight function, plain numbers, no allocation: results go to a
 * module-level scratch record (the core is single-threaded; nothing calls back into it during a run).
 *
 * The models' one-variable terms come from tables fitted to their formulas (term-tables.ts), which agree with the
 * formulas to about 1e-14 relative; outside the tabulated ranges the formulas themselves are used.
 */
import { hjDeltaUrFactor, hjEpsEffExponent, hjEpsEffFromExponent, hjThickness, hjThicknessTerms, hjThicknessTermsWith, hjZ01, hjZ01Derivative } from './hammerstad-jensen-1980.ts';
import { kirschningJansenEpsEffWithTerms, kjFnPower, kjP1WidthTerm, kjP3FrequencyFactor, kjP3WidthTerm } from './kirschning-jansen-1982.ts';
import { jansenKirschningZ0WithTerms, jkExpMinusR6, jkR15FrequencyFactor, jkR16WidthFactor, jkR17FrequencyFactor, jkR3, jkR7WidthFactor, jkR8FrequencyFactor } from './jansen-kirschning-1983.ts';
import { hjDispersionEpsEff, hjDispersionZ0 } from './hammerstad-jensen-1980-dispersion.ts';
import { evaluateOctaveTable } from '../util/smooth-table.ts';
import {
  F_JK_R15, F_JK_R17, F_JK_R8, F_KJ_P3, F_KJ_POWER, FREQUENCY_COLUMNS, frequencyTerms,
  W_EE_EXPONENT, W_JK_R16, W_JK_R3, W_JK_R6, W_JK_R7, W_KJ_P1, W_KJ_P3, W_TANH, W_Z01, W_Z01_SLOPE, WIDTH_U_MAX, widthTerms,
} from './term-tables.ts';
import type { DispersionModel } from './types.ts';
import { InputError } from '../util/errors.ts';

/** 0 = none, 1 = Kirschning–Jansen, 2 = Hammerstad–Jensen. */
export type DispersionCode = 0 | 1 | 2;

export function dispersionCode(d: DispersionModel): DispersionCode {
  return d === 'kirschning-jansen' ? 1 : d === 'hammerstad-jensen' ? 2 : 0;
}

export interface ModelScratch {
  z0s: number; ees: number; u1: number; ur: number; z0f: number; eef: number;
  /** Thickness-correction intermediates and dZ01/du at u1, for Wheeler's rule (valid when tn > 0). */
  s: number; T: number; X: number; lnX1: number; slopeU1: number;
}

/** Filled by evaluateModel. */
export const scratch: ModelScratch = { z0s: 0, ees: 0, u1: 0, ur: 0, z0f: 0, eef: 0, s: 0, T: 0, X: 0, lnX1: 0, slopeU1: 0 };

// The static part depends only on (u, tn, εr): a frequency sweep of one line reuses it, with ln εe0 and the
// dispersion models' width terms at ur (filled when first needed). The frequency terms depend on fn alone: a width
// search at one frequency reuses them. The whole result is reused when the same line is asked again at the same
// frequency (a synthesis ends that way). Number fields of one object: V8 boxes a double written to a module-level
// `let` on every write, and updates an object's double field in place.
const m = {
  u: Number.NaN, tn: Number.NaN, er: Number.NaN, lnEes: 0.5, f: Number.NaN, h: Number.NaN, disp: -1,
  widthTermsReady: false, p1: 0.5, p3: 0.5, r3: 0.5, r7: 0.5, r6: 0.5, r16: 0.5,
  fn: Number.NaN, p3f: 0.5, fnPower: 0.5, r8f: 0.5, r15f: 0.5, r17f: 0.5,
};

// Table values land here (a Float64Array write does not box a double).
const tv = new Float64Array(10);

/** The static model at (u, tn, εr); with `dispersive`, also the dispersion models' width terms (one table lookup). */
function staticPart(u: number, tn: number, er: number, dispersive: boolean): void {
  const W = widthTerms();
  if (tn > 0) {
    // Thickness correction (HJ eq. 6) with tanh √(6.517u) from the table.
    const s = Math.sqrt(6.517 * u);
    if (u > WIDTH_U_MAX.tanh) hjThicknessTermsWith(tn, s, 1);
    else if (evaluateOctaveTable(W, u, W_TANH, 1, tv)) hjThicknessTermsWith(tn, s, tv[0]!);
    else hjThicknessTerms(u, tn);
  } else hjThickness.du1 = 0;
  const du1 = hjThickness.du1;
  const u1 = u + du1;
  const ur = du1 === 0 ? u : u + hjDeltaUrFactor(er) * du1;
  let z01r: number; let exponent: number;
  const inTable = evaluateOctaveTable(W, ur, W_Z01, (dispersive ? W_JK_R16 : W_EE_EXPONENT) - W_Z01 + 1, tv);
  if (inTable) {
    z01r = tv[W_Z01 - W_Z01]!; exponent = tv[W_EE_EXPONENT - W_Z01]!;
    if (dispersive) widthTermsFromTable(ur, W_Z01);
  } else {
    z01r = hjZ01(ur); exponent = hjEpsEffExponent(ur);
  }
  const eer = hjEpsEffFromExponent(exponent, er);
  let ees = eer;
  if (du1 !== 0) {
    let z01u1: number;
    if (evaluateOctaveTable(W, u1, W_Z01_SLOPE, 2, tv)) { // W_Z01_SLOPE, W_Z01
      z01u1 = tv[W_Z01 - W_Z01_SLOPE]!; scratch.slopeU1 = tv[0]!;
    } else {
      z01u1 = hjZ01(u1); scratch.slopeU1 = hjZ01Derivative(u1);
    }
    const k = z01u1 / z01r;
    ees = eer * k * k;
    scratch.s = hjThickness.s; scratch.T = hjThickness.T; scratch.X = hjThickness.X; scratch.lnX1 = hjThickness.lnX1;
  }
  scratch.z0s = z01r / Math.sqrt(eer); scratch.ees = ees; scratch.u1 = u1; scratch.ur = ur;
  m.u = u; m.tn = tn; m.er = er;
  m.widthTermsReady = dispersive && inTable;
  if (m.widthTermsReady) m.lnEes = Math.log(ees);
}

/** The width terms from tv, where column c sits at tv[c − shift]; each past its tabulated range from the formula
 * or the limit (WIDTH_U_MAX). */
function widthTermsFromTable(ur: number, shift: number): void {
  m.p1 = ur > WIDTH_U_MAX.p1 ? 0 : tv[W_KJ_P1 - shift]!;
  m.p3 = ur > WIDTH_U_MAX.p3 ? kjP3WidthTerm(ur) : tv[W_KJ_P3 - shift]!;
  m.r3 = ur > WIDTH_U_MAX.r3 ? jkR3(ur) : tv[W_JK_R3 - shift]!;
  m.r7 = ur > WIDTH_U_MAX.r7 ? 1 : tv[W_JK_R7 - shift]!;
  m.r6 = ur > WIDTH_U_MAX.r6 ? 0 : tv[W_JK_R6 - shift]!;
  m.r16 = ur > WIDTH_U_MAX.r16 ? 1 : tv[W_JK_R16 - shift]!;
}

/** The dispersion models' width terms at ur (table, or formula where the table does not reach). */
function dispersionWidthTerms(ur: number): void {
  m.lnEes = Math.log(scratch.ees);
  if (evaluateOctaveTable(widthTerms(), ur, W_KJ_P1, W_JK_R16 - W_KJ_P1 + 1, tv)) {
    widthTermsFromTable(ur, W_KJ_P1);
  } else {
    m.p1 = kjP1WidthTerm(ur); m.p3 = kjP3WidthTerm(ur); m.r3 = jkR3(ur);
    m.r7 = jkR7WidthFactor(ur); m.r6 = jkExpMinusR6(ur); m.r16 = jkR16WidthFactor(ur);
  }
  m.widthTermsReady = true;
}

/** The dispersion models' frequency terms at fn (table, or formula outside it). */
function dispersionFrequencyTerms(fn: number): void {
  m.fn = fn;
  if (evaluateOctaveTable(frequencyTerms(), fn, 0, FREQUENCY_COLUMNS, tv)) {
    m.p3f = tv[F_KJ_P3]!; m.fnPower = tv[F_KJ_POWER]!;
    m.r8f = tv[F_JK_R8]!; m.r15f = tv[F_JK_R15]!; m.r17f = tv[F_JK_R17]!;
  } else {
    m.p3f = kjP3FrequencyFactor(fn); m.fnPower = kjFnPower(fn);
    m.r8f = jkR8FrequencyFactor(fn); m.r15f = jkR15FrequencyFactor(fn); m.r17f = jkR17FrequencyFactor(fn);
  }
}

function undefinedFit(er: number, fn: number): never {
  throw new InputError('out-of-range', 'f',
    `a frequency where the Jansen–Kirschning Z0(f) fit has a value for εr = ${Number(er.toPrecision(4))} (it has none at f·h = ${Number(fn.toPrecision(3))} GHz·mm, far beyond the 15 GHz·mm it was made for)`,
    `f·h = ${Number(fn.toPrecision(3))} GHz·mm`, "use dispersion 'hammerstad-jensen' or 'none' for this substrate, a lower frequency or a thinner substrate");
}

/**
 * Static HJ model with thickness, then dispersion at f (Hz). u = W/h, tn = t/h, h in m.
 * Writes scratch (Z0 at f in scratch.z0f, Ω). Returns nothing: a returned double would be boxed on the heap when the
 * call is not inlined, and this is the hottest call of the core.
 */
export function evaluateModel(u: number, tn: number, er: number, h: number, f: number, disp: DispersionCode): void {
  if (u === m.u && tn === m.tn && er === m.er && f === m.f && h === m.h && disp === m.disp) return;
  if (u !== m.u || tn !== m.tn || er !== m.er) staticPart(u, tn, er, f > 0 && disp === 1);
  const z0s = scratch.z0s; const ees = scratch.ees; const ur = scratch.ur;
  let z0f = z0s;
  let eef = ees;
  if (f > 0 && disp !== 0) {
    if (disp === 1) {
      const fn = f * h * 1e-6;
      if (fn !== m.fn) dispersionFrequencyTerms(fn);
      if (!m.widthTermsReady) dispersionWidthTerms(ur);
      eef = kirschningJansenEpsEffWithTerms(ur, er, ees, fn, m.p1, m.p3, m.p3f, m.fnPower);
      z0f = jansenKirschningZ0WithTerms(ur, er, m.lnEes, eef, fn, z0s, m.r3, m.r7, m.r6, m.r16, m.r8f, m.r15f, m.r17f);
      // The fit's R13 and R14 both pass through zero near εe^R8 = 1.0207 (εr barely above 1): far outside its
      // f·h ≤ 15 GHz·mm range their ratio can turn negative, and the power has no value. Say so instead of a NaN.
      if (!(z0f > 0 && z0f < Infinity)) undefinedFit(er, fn);
    } else {
      eef = hjDispersionEpsEff(er, ees, z0s, h, f);
      z0f = hjDispersionZ0(ees, eef, z0s);
    }
  }
  scratch.z0f = z0f; scratch.eef = eef;
  m.f = f; m.h = h; m.disp = disp;
}
