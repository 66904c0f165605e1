/**
 * The line model's impedance and permittivity path, shared by analysis and synthesis so that synthesis inverts
 * exactly the numbers the analysis reports. One straight function, plain numbers, no allocation: results go to a
 * module-level scratch record (the core is single-threaded; nothing calls back into it during a run).
 *
 * The models' one-variable terms come from tables fitted to their formulas (term-tables.ts), which agree with the
 * formulas to about 1e-14 relative; outside the tabulated ranges the formulas themselves are used.
 */
import { hjDeltaUrFactor, hjEpsEffExponent, hjEpsEffFromExponent, hjThickness, hjThicknessFromFields, hjThicknessTerms, hjZ01, hjZ01Derivative } from './hammerstad-jensen-1980.ts';
import { kirschningJansenEpsEffWithTerms, kjFnPower, kjP1WidthTerm, kjP3FrequencyFactor, kjP3WidthTerm, type KjTerms } from './kirschning-jansen-1982.ts';
import { jansenKirschningZ0WithTerms, type JkTerms, jkExpMinusR6, jkR15FrequencyFactor, jkR16WidthFactor, jkR17FrequencyFactor, jkR3, jkR7WidthFactor, jkR8FrequencyFactor } from './jansen-kirschning-1983.ts';
import { hjDispersionEpsEff, hjDispersionZ0 } from './hammerstad-jensen-1980-dispersion.ts';
import { readOctaveTable } from '../util/smooth-table.ts';
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

/**
 * What evaluateModel is asked: u = W/h, tn = t/h, εr, h (m), f (Hz), dispersion code. Callers fill this record and
 * pass it: a double passed to a call that the compiler does not inline is boxed on the heap (one allocation per
 * argument per call), a field of a long-lived record is updated in place.
 */
export interface ModelQuery { u: number; tn: number; er: number; h: number; f: number; disp: DispersionCode }
export const modelQuery: ModelQuery = { u: 0.5, tn: 0.5, er: 0.5, h: 0.5, f: 0.5, disp: 0 };

// The static part depends only on (u, tn, εr): a frequency sweep of one line reuses it, with ln εe0 and the
// dispersion models' width terms at ur (filled when first needed). The frequency terms depend on fn alone: a width
// search at one frequency reuses them. The whole result is reused when the same line is asked again at the same
// frequency (a synthesis ends that way). Number fields of one object: V8 boxes a double written to a module-level
// `let` on every write, and updates an object's double field in place.
const m = { u: Number.NaN, tn: Number.NaN, er: Number.NaN, f: Number.NaN, h: Number.NaN, disp: -1, widthTermsReady: false };

// The dispersion models' inputs and outputs (both models' records in one object; `u` is ur).
const d: KjTerms & JkTerms = {
  u: 0.5, er: 0.5, ee0: 0.5, lnEe0: 0.5, eef: 0.5, fn: Number.NaN, z00: 0.5, z0f: 0.5,
  p1Width: 0.5, p3Width: 0.5, p3Freq: 0.5, fnPower: 0.5,
  r3: 0.5, r7Width: 0.5, expMinusR6: 0.5, r16Width: 0.5, r8Freq: 0.5, r15Freq: 0.5, r17Freq: 0.5,
};

// Table values land here (a Float64Array write does not box a double), and where the tables are read.
const tv = new Float64Array(10);
const at = { x: 0.5 };

/** The static model at (q.u, q.tn, q.er); with `dispersive`, also the dispersion models' width terms (one lookup). */
function staticPart(q: ModelQuery, dispersive: boolean): void {
  const u = q.u; const tn = q.tn; const er = q.er;
  const W = widthTerms();
  if (tn > 0) {
    // Thickness correction (HJ eq. 6) with tanh √(6.517u) from the table.
    const s = Math.sqrt(6.517 * u);
    at.x = u;
    if (u > WIDTH_U_MAX.tanh) { hjThickness.s = s; hjThickness.T = 1; hjThicknessFromFields(tn); }
    else if (readOctaveTable(W, at, W_TANH, 1, tv)) { hjThickness.s = s; hjThickness.T = tv[0]!; hjThicknessFromFields(tn); }
    else hjThicknessTerms(u, tn);
  } else hjThickness.du1 = 0;
  const du1 = hjThickness.du1;
  const u1 = u + du1;
  const ur = du1 === 0 ? u : u + hjDeltaUrFactor(er) * du1;
  let z01r: number; let exponent: number;
  at.x = ur;
  const inTable = readOctaveTable(W, at, W_Z01, (dispersive ? W_JK_R16 : W_EE_EXPONENT) - W_Z01 + 1, tv);
  if (inTable) {
    z01r = tv[W_Z01 - W_Z01]!; exponent = tv[W_EE_EXPONENT - W_Z01]!;
    if (dispersive) { d.u = ur; widthTermsFromTable(W_Z01); }
  } else {
    z01r = hjZ01(ur); exponent = hjEpsEffExponent(ur);
  }
  const eer = hjEpsEffFromExponent(exponent, er);
  let ees = eer;
  if (du1 !== 0) {
    let z01u1: number;
    at.x = u1;
    if (readOctaveTable(W, at, W_Z01_SLOPE, 2, tv)) { // W_Z01_SLOPE, W_Z01
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
  if (m.widthTermsReady) d.lnEe0 = Math.log(ees);
}

/** The width terms at d.u from tv, where column c sits at tv[c − shift]; past its tabulated range (WIDTH_U_MAX) a
 * term comes from the formula or its limit. (The P1, R7 and R6 terms need no test here: the model files apply their
 * own limits above those ranges, so the table's value there is never used.) */
function widthTermsFromTable(shift: number): void {
  const ur = d.u;
  d.p1Width = tv[W_KJ_P1 - shift]!;
  d.p3Width = ur > WIDTH_U_MAX.p3 ? kjP3WidthTerm(ur) : tv[W_KJ_P3 - shift]!;
  d.r3 = ur > WIDTH_U_MAX.r3 ? jkR3(ur) : tv[W_JK_R3 - shift]!;
  d.r7Width = tv[W_JK_R7 - shift]!;
  d.expMinusR6 = tv[W_JK_R6 - shift]!;
  d.r16Width = ur > WIDTH_U_MAX.r16 ? 1 : tv[W_JK_R16 - shift]!;
}

/** The dispersion models' width terms at ur = scratch.ur (table, or formula where the table does not reach). */
function dispersionWidthTerms(): void {
  const ur = scratch.ur;
  d.u = ur;
  d.lnEe0 = Math.log(scratch.ees);
  at.x = ur;
  if (readOctaveTable(widthTerms(), at, W_KJ_P1, W_JK_R16 - W_KJ_P1 + 1, tv)) {
    widthTermsFromTable(W_KJ_P1);
  } else {
    d.p1Width = kjP1WidthTerm(ur); d.p3Width = kjP3WidthTerm(ur); d.r3 = jkR3(ur);
    d.r7Width = jkR7WidthFactor(ur); d.expMinusR6 = jkExpMinusR6(ur); d.r16Width = jkR16WidthFactor(ur);
  }
  m.widthTermsReady = true;
}

/** The dispersion models' frequency terms at d.fn (table, or formula outside it). */
function dispersionFrequencyTerms(): void {
  const fn = d.fn;
  at.x = fn;
  if (readOctaveTable(frequencyTerms(), at, 0, FREQUENCY_COLUMNS, tv)) {
    d.p3Freq = tv[F_KJ_P3]!; d.fnPower = tv[F_KJ_POWER]!;
    d.r8Freq = tv[F_JK_R8]!; d.r15Freq = tv[F_JK_R15]!; d.r17Freq = tv[F_JK_R17]!;
  } else {
    d.p3Freq = kjP3FrequencyFactor(fn); d.fnPower = kjFnPower(fn);
    d.r8Freq = jkR8FrequencyFactor(fn); d.r15Freq = jkR15FrequencyFactor(fn); d.r17Freq = jkR17FrequencyFactor(fn);
  }
}

function undefinedFit(er: number, fn: number): never {
  throw new InputError('out-of-range', 'f',
    `a frequency where the Jansen–Kirschning Z0(f) fit has a value for εr = ${Number(er.toPrecision(4))} (it has none at f·h = ${Number(fn.toPrecision(3))} GHz·mm, far beyond the 15 GHz·mm it was made for)`,
    `f·h = ${Number(fn.toPrecision(3))} GHz·mm`, "use dispersion 'hammerstad-jensen' or 'none' for this substrate, a lower frequency or a thinner substrate");
}

/**
 * Static HJ model with thickness, then dispersion at q.f (Hz), for q.u = W/h, q.tn = t/h, q.h in m (fill `modelQuery`
 * and pass it). Writes scratch (Z0 at f in scratch.z0f, Ω); returns nothing, for the same reason.
 */
export function evaluateModel(q: ModelQuery): void {
  const u = q.u; const tn = q.tn; const er = q.er; const h = q.h; const f = q.f; const disp = q.disp;
  // The frequency part is compared on its own, not only after the static part matched: the yield loop never got that
  // far, so a later sizing found those loads without engine feedback and deoptimised this function (node --trace-deopt).
  const sameStatic = u === m.u && tn === m.tn && er === m.er, sameRest = f === m.f && h === m.h && disp === m.disp;
  if (sameStatic && sameRest) return;
  if (!sameStatic) staticPart(q, f > 0 && disp === 1);
  const z0s = scratch.z0s; const ees = scratch.ees;
  let z0f = z0s;
  let eef = ees;
  if (f > 0 && disp !== 0) {
    if (disp === 1) {
      const fn = f * h * 1e-6;
      if (fn !== d.fn) { d.fn = fn; dispersionFrequencyTerms(); }
      if (!m.widthTermsReady) dispersionWidthTerms();
      d.er = er; d.ee0 = ees; d.z00 = z0s;
      kirschningJansenEpsEffWithTerms(d);
      eef = d.eef;
      jansenKirschningZ0WithTerms(d);
      z0f = d.z0f;
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
