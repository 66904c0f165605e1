/**
 * Element values g0 … g(N+1) of the low-pass prototype filters, computed from their closed forms.
 *
 * Source: G. L. Matthaei, L. Young and E. M. T. Jones, "Microwave Filters, Impedance-Matching Networks, and
 * Coupling Structures", McGraw-Hill, 1964, §4.05 (eqs. 4.05-1 maximally flat and 4.05-2 Chebyshev); the same forms
 * in D. M. Pozar, Microwave Engineering, 4th ed., Wiley, 2012, §8.3. g0 = 1; cut-off at ω' = 1.
 *   Maximally flat (3 dB at ω' = 1):  g_k = 2·sin((2k − 1)π/(2N)), g(N+1) = 1.
 *   Equal ripple of L_Ar dB:  β = ln(coth(L_Ar/17.37)), γ = sinh(β/(2N)), a_k = sin((2k − 1)π/(2N)),
 *     b_k = γ² + sin²(kπ/N); g1 = 2a1/γ, g_k = 4·a(k−1)·a_k/(b(k−1)·g(k−1)); g(N+1) = 1 (N odd), coth²(β/4) (N even).
 */
import { InputError, describe } from '../util/errors.ts';

export type PrototypeKind = 'maximally-flat' | 'equal-ripple';

/** [g0, g1, …, gN, g(N+1)] for order n (1–10). `rippleDb` (0.01–3 dB) is for equal ripple. */
export function prototypeValues(kind: PrototypeKind, n: number, rippleDb = 0.5): number[] {
  if (!Number.isInteger(n) || n < 1 || n > 10) throw new InputError('out-of-range', 'order', 'a whole filter order from 1 to 10', describe(n));
  const g = [1];
  if (kind === 'maximally-flat') {
    for (let k = 1; k <= n; k++) g.push(2 * Math.sin(((2 * k - 1) * Math.PI) / (2 * n)));
    g.push(1);
    return g;
  }
  if (kind !== 'equal-ripple') throw new InputError('bad-choice', 'response', "'maximally-flat' or 'equal-ripple'", describe(kind));
  if (typeof rippleDb !== 'number' || !(rippleDb >= 0.01 && rippleDb <= 3)) throw new InputError('out-of-range', 'rippleDb', 'a pass-band ripple from 0.01 dB to 3 dB', describe(rippleDb));
  const beta = Math.log(1 / Math.tanh(rippleDb / 17.37));
  const gam = Math.sinh(beta / (2 * n));
  const a = (k: number) => Math.sin(((2 * k - 1) * Math.PI) / (2 * n));
  const b = (k: number) => gam * gam + Math.sin((k * Math.PI) / n) ** 2;
  g.push((2 * a(1)) / gam);
  for (let k = 2; k <= n; k++) g.push((4 * a(k - 1) * a(k)) / (b(k - 1) * g[k - 1]!));
  g.push(n % 2 === 1 ? 1 : 1 / Math.tanh(beta / 4) ** 2);
  return g;
}
