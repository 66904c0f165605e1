/**
 * Microstrip T-junction: reference-plane shifts and the branch transformer (parallel-plate model).
 *
 * Source: E. Hammerstad, "Computer-aided design of microstrip couplers with accurate discontinuity models",
 * IEEE MTT-S International Microwave Symposium Digest, 1981, pp. 54–56; the same model is reproduced in
 * K. C. Gupta, R. Garg, I. Bahl, P. Bhartia, "Microstrip Lines and Slotlines", 2nd ed., Artech House, 1996
 * (chapter 3, T-junction). Main line of impedance Z1 on both sides, branch Z2; ee1, ee2 their effective
 * permittivities; h the substrate height:
 *   D1 = η0 h / (√ee1 Z1),  D2 = η0 h / (√ee2 Z2)                     widths of the parallel-plate equivalents
 *   fp1 = Z1 / (2 μ0 h),    r = Z1/Z2,   F = (f/fp1)²                 fp1: first higher mode of the main guide
 *   d1 = 0.055 D2 r (1 − 2 r F)                                          main-arm planes, from the branch centreline
 *   d2 = D1 (0.5 − r (0.05 + 0.7 e^(−1.6 r) + 0.25 r F − 0.17 ln r))      branch plane, from the main centreline
 *   n² = 1 − π F (r²/12 + (0.5 − d2/D1)²)                              turns ratio of the branch transformer
 * Units: h in m, Z in Ω, f in Hz; shifts in m (positive: the plane lies out along the arm, away from the centre).
 *
 * Choices made here (documented in docs/junctions.md):
 * - Static line values feed it (Z0 and εeff of the quasi-static model at the arm's width): the model's own
 *   (f/fp1)² terms carry its frequency dependence, and fp1 is defined from the static Z1; feeding dispersive values
 *   as well would count the widening of the parallel-plate equivalent twice.
 * - The turns ratio belongs to the branch: an ideal transformer between the junction point and the branch's
 *   reference plane that drives the branch with n times the junction voltage, so the branch's admittance seen at the
 *   junction is n²·Y (its impedance Z/n²): as f rises and n² falls below 1 the branch couples more weakly. The two
 *   main arms join the junction point directly. n → 1 as f → 0. (A branch with transformers at both ends, such as a
 *   branch-line hybrid's shunt arm, looks like a line of Z/n².)
 * - Unequal main arms (a branch-line hybrid's feed and through arm) are outside the paper's form, which has one Z1.
 *   Our extension: each main arm's shift d1 uses its own Z1 (and its own fp1); d2 and n² are the means of the
 *   paper's values taken with each main arm's Z1. Equal arms give the paper exactly, and swapping the two main arms
 *   swaps their shifts — a symmetric split always gets symmetric shifts.
 * - The junction's shunt susceptance, also given in the paper, is not at hand in a checked form and is OMITTED
 *   (it stays out of the network; the residual report says so).
 * Validity: the paper's own statement of range is not at hand. The tool flags (our own rule) F > 0.25, i.e. f above
 * half the main guide's cutoff fp1, where the first-order frequency terms stop being small, and refuses a
 * frequency where n² falls below 0.05 (far beyond any sensible use).
 */
import { InputError, requireRange } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';

export const TEE_SOURCE = 'hammerstad-1981-tee';
export const TEE_CITATION = 'Hammerstad, IEEE MTT-S IMS Digest 1981, pp. 54–56 (also Gupta, Garg, Bahl, Bhartia 1996, ch. 3)';
/** Largest F = (f/fp1)² inside our validity flag. */
export const TEE_F_LIMIT = 0.25;
/** Smallest n² the network accepts. */
export const TEE_N2_MIN = 0.05;
const MU0 = 1.25663706212e-6;
const ETA0 = 376.730313668;

/** One arm as the model sees it: static impedance (Ω) and static effective permittivity. */
export interface TeeArm { z: number; ee: number }

/** The paper's quantities for equal main arms. */
export interface TeePlanes { D1: number; D2: number; fp1: number; r: number; F: number; d1: number; d2: number; n2: number }

/** The paper's equations, as printed, for main arms of one impedance. */
export function teeReferencePlanes(p: { z1: number; z2: number; ee1: number; ee2: number; h: number; f: number }): TeePlanes {
  const z1 = requireRange('z1', p.z1, 0, Infinity, 'a main-arm impedance above 0 Ω', { minExclusive: true });
  const z2 = requireRange('z2', p.z2, 0, Infinity, 'a branch impedance above 0 Ω', { minExclusive: true });
  const ee1 = requireRange('ee1', p.ee1, 1, Infinity, 'an effective permittivity of at least 1');
  const ee2 = requireRange('ee2', p.ee2, 1, Infinity, 'an effective permittivity of at least 1');
  const h = requireRange('h', p.h, 0, Infinity, 'a substrate height above 0 m', { minExclusive: true });
  const f = requireRange('f', p.f, 0, Infinity, 'a frequency of 0 Hz or more');
  const D1 = (ETA0 * h) / (Math.sqrt(ee1) * z1);
  const D2 = (ETA0 * h) / (Math.sqrt(ee2) * z2);
  const fp1 = z1 / (2 * MU0 * h);
  const r = z1 / z2;
  const F = (f / fp1) ** 2;
  const d1 = 0.055 * D2 * r * (1 - 2 * r * F);
  const d2 = D1 * (0.5 - r * (0.05 + 0.7 * Math.exp(-1.6 * r) + 0.25 * r * F - 0.17 * Math.log(r)));
  const n2 = 1 - Math.PI * F * ((r * r) / 12 + (0.5 - d2 / D1) ** 2);
  return { D1, D2, fp1, r, F, d1, d2, n2 };
}

export interface TeeJunction {
  /** Shift of each main arm's reference plane from the branch centreline, m (order of `main`). */
  d1: [number, number];
  /** Shift of the branch's reference plane from the main-line centreline, m. */
  d2: number;
  /** Square of the branch transformer's turns ratio. */
  n2: number;
  /** Largest F = (f/fp1)² of the two main arms. */
  F: number;
  /** The paper's values with each main arm's impedance. */
  perArm: [TeePlanes, TeePlanes];
  warnings: Warning[];
}

/** The tee at frequency f (Hz, ≥ 0) with main arms `main` and branch `branch` (static values). */
export function teeJunction(p: { main: [TeeArm, TeeArm]; branch: TeeArm; h: number; f: number }): TeeJunction {
  const at = (m: TeeArm) => teeReferencePlanes({ z1: m.z, z2: p.branch.z, ee1: m.ee, ee2: p.branch.ee, h: p.h, f: p.f });
  const a = at(p.main[0]), b = at(p.main[1]);
  const warnings: Warning[] = [];
  const F = Math.max(a.F, b.F);
  if (F > TEE_F_LIMIT) {
    warnings.push(warn('validity', `at ${(p.f / 1e9).toFixed(3)} GHz the tee is at ${Math.sqrt(F).toFixed(2)} of its main line's parallel-plate cutoff (${(Math.min(a.fp1, b.fp1) / 1e9).toFixed(2)} GHz); above 0.5 (our own limit) its frequency terms are no longer small`, { source: TEE_SOURCE }));
  }
  const zr = Math.max(p.main[0].z, p.main[1].z) / Math.min(p.main[0].z, p.main[1].z);
  if (zr > 1 + 1e-9) {
    warnings.push(warn('note', `main arms of unequal impedance (${p.main[0].z.toFixed(1)} and ${p.main[1].z.toFixed(1)} Ω): each arm's plane uses its own impedance and the branch takes the mean of the two (our extension of the paper's equal-arm form)`, { source: TEE_SOURCE, severity: 'info' }));
  }
  return { d1: [a.d1, b.d1], d2: (a.d2 + b.d2) / 2, n2: (a.n2 + b.n2) / 2, F, perArm: [a, b], warnings };
}

/** The frequency-independent part of a tee (per main arm: D1, fp1, r and the ln/exp term of d2), for the network. */
export interface TeePrepared { D2: number; D1: Float64Array; fp1: Float64Array; r: Float64Array; g: Float64Array }

export function prepareTee(main: [TeeArm, TeeArm], branch: TeeArm, h: number): TeePrepared {
  const p: TeePrepared = { D2: (ETA0 * h) / (Math.sqrt(branch.ee) * branch.z), D1: new Float64Array(2), fp1: new Float64Array(2), r: new Float64Array(2), g: new Float64Array(2) };
  for (let k = 0; k < 2; k++) {
    const m = main[k]!;
    const r = m.z / branch.z;
    p.D1[k] = (ETA0 * h) / (Math.sqrt(m.ee) * m.z);
    p.fp1[k] = m.z / (2 * MU0 * h);
    p.r[k] = r;
    p.g[k] = 0.05 + 0.7 * Math.exp(-1.6 * r) - 0.17 * Math.log(r);
  }
  return p;
}

/**
 * The same shifts and n² as `teeJunction`, without checks or warnings, written into `out` — for the network, which
 * asks for them at every sweep frequency (inputs already checked by the sizing's `teeJunction` at f0).
 * out = [d1 of main arm 0, d1 of main arm 1, d2, n²].
 */
export function teeShiftsInto(p: TeePrepared, f: number, out: Float64Array): void {
  let d2Sum = 0, n2Sum = 0;
  for (let k = 0; k < 2; k++) {
    const r = p.r[k]!, D1 = p.D1[k]!, x = f / p.fp1[k]!;
    const F = x * x;
    out[k] = 0.055 * p.D2 * r * (1 - 2 * r * F);
    const q = r * (p.g[k]! + 0.25 * r * F); // 0.5 − d2/D1
    d2Sum += D1 * (0.5 - q);
    n2Sum += 1 - Math.PI * F * ((r * r) / 12 + q * q);
  }
  out[2] = d2Sum / 2;
  out[3] = n2Sum / 2;
}

/** n² at f for the network, refused (not clamped) where the model has no meaning left. */
export function teeTurnsRatioSquared(n2: number, f: number, where: string): number {
  if (!(n2 >= TEE_N2_MIN)) {
    throw new InputError('out-of-range', where, `a frequency where the tee model holds (n² ≥ ${TEE_N2_MIN})`, `n² = ${n2.toFixed(3)} at ${(f / 1e9).toFixed(3)} GHz`,
      'sweep to a lower frequency, or choose ideal junctions for the design');
  }
  return n2;
}
