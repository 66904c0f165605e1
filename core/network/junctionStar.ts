/**
 * A junction as one n-port: arms that meet at a point J, each arm a short length of its own line (from the arm's
 * node to its reference plane) followed, on a tee's branch, by the ideal transformer of the tee model
 * (core/discontinuity/hammerstad1981TeeJunction.ts). The arm lengths may change with frequency (the reference
 * planes move), which a fixed-length line element cannot do; an ideal transformer has no admittance form of its
 * own, so arm lines and transformer are folded into the n-port's admittance matrix here.
 *
 * Algebra (two-port chains, D. M. Pozar, Microwave Engineering, 4th ed., §4.4): arm k from its node (port k) to J
 * has ABCD [A_k B_k; C_k D_k] with A_k D_k − B_k C_k = 1. With V_J common and the arm currents into J summing to the
 * current of an optional shunt admittance Y_J at J:
 *   V_J = Σ (V_k / B_k) / S,   S = Σ A_m / B_m + Y_J
 *   Y_kk = D_k / B_k − 1 / (B_k² S),   Y_kj = −1 / (B_k B_j S)   (k ≠ j)
 * Arm line of length ℓ, constants Zc, γ: [cosh γℓ, Zc sinh γℓ; sinh γℓ / Zc, cosh γℓ]; times the transformer
 * [n, 0; 0, 1/n] (V_plane = n·V_J: the branch is driven by n times the junction voltage, its admittance seen at J
 * is n²·Y, its impedance Z/n²) gives
 *   A = n cosh γℓ,  B = Zc sinh γℓ / n,  D = cosh γℓ / n.
 * Arm lengths are kept well above zero by the caller (B_k ≠ 0).
 */
import type { LineModel } from './netlist.ts';

export interface StarArm {
  /** The arm's line (its own width). */
  model: LineModel;
}

/** Per frequency: each arm's line length (m, > 0) and turns ratio n (1 for a direct arm), and Y_J (S, re/im). */
export interface StarState { lengths: number[]; n: number[]; yJ?: [number, number] }

/** Work space for `starAdmittance` with m arms, reused across frequencies. */
export interface StarBuffers { aRe: Float64Array; aIm: Float64Array; bRe: Float64Array; bIm: Float64Array; dRe: Float64Array; dIm: Float64Array; uRe: Float64Array; uIm: Float64Array; y: Float64Array }

export function starBuffers(m: number): StarBuffers {
  const a = () => new Float64Array(m);
  return { aRe: a(), aIm: a(), bRe: a(), bIm: a(), dRe: a(), dIm: a(), uRe: a(), uIm: a(), y: new Float64Array(2 * m * m) };
}

/**
 * The admittance matrix (m×m, row-major, interleaved re/im) of the star at frequency f, written into `buf.y` and
 * returned: it is valid until the next call with the same buffers (the solver uses an n-port's matrix only for the
 * frequency it asked it for).
 */
export function starAdmittance(arms: StarArm[], state: StarState, f: number, buf: StarBuffers = starBuffers(arms.length)): Float64Array {
  const m = arms.length;
  const { aRe, aIm, bRe, bIm, dRe, dIm, uRe, uIm } = buf;
  let sRe = state.yJ?.[0] ?? 0, sIm = state.yJ?.[1] ?? 0;
  for (let k = 0; k < m; k++) {
    const { zc, gamma } = arms[k]!.model(f);
    const l = state.lengths[k]!, n = state.n[k]!;
    const xr = gamma.re * l, xi = gamma.im * l;
    const c = Math.cos(xi), s = Math.sin(xi), sh = Math.sinh(xr), ch = Math.cosh(xr);
    const coR = ch * c, coI = sh * s, siR = sh * c, siI = ch * s;
    aRe[k] = coR * n; aIm[k] = coI * n;
    dRe[k] = coR / n; dIm[k] = coI / n;
    bRe[k] = (zc.re * siR - zc.im * siI) / n; bIm[k] = (zc.re * siI + zc.im * siR) / n;
    // S += A/B
    const bm = bRe[k]! * bRe[k]! + bIm[k]! * bIm[k]!;
    sRe += (aRe[k]! * bRe[k]! + aIm[k]! * bIm[k]!) / bm;
    sIm += (aIm[k]! * bRe[k]! - aRe[k]! * bIm[k]!) / bm;
  }
  // u_k = 1/B_k
  for (let k = 0; k < m; k++) { const bm = bRe[k]! * bRe[k]! + bIm[k]! * bIm[k]!; uRe[k] = bRe[k]! / bm; uIm[k] = -bIm[k]! / bm; }
  const sm = sRe * sRe + sIm * sIm, isRe = sRe / sm, isIm = -sIm / sm; // 1/S
  const y = buf.y;
  for (let k = 0; k < m; k++) {
    for (let j = 0; j < m; j++) {
      // −u_k u_j / S
      const pRe = uRe[k]! * uRe[j]! - uIm[k]! * uIm[j]!, pIm = uRe[k]! * uIm[j]! + uIm[k]! * uRe[j]!;
      let re = -(pRe * isRe - pIm * isIm), im = -(pRe * isIm + pIm * isRe);
      if (k === j) { re += dRe[k]! * uRe[k]! - dIm[k]! * uIm[k]!; im += dRe[k]! * uIm[k]! + dIm[k]! * uRe[k]!; }
      y[2 * (k * m + j)] = re; y[2 * (k * m + j) + 1] = im;
    }
  }
  return y;
}
