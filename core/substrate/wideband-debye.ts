/**
 * Wideband Debye (constant-loss) dielectric model: carries εr and tanδ measured at one frequency to another.
 *
 * Source: A. R. Djordjevic, R. M. Biljić, V. D. Likar-Smiljanić and T. K. Sarkar, "Wideband frequency-domain
 * characterization of FR-4 and time-domain causality", IEEE Trans. Electromagnetic Compatibility, vol. 43, no. 4,
 * pp. 662–667, Nov. 2001, eq. (4) (form as recalled from memory; the model is also used by C. Svensson and
 * G. E. Dermer, IEEE Trans. Advanced Packaging, 2001):
 *
 *     ε(f) = ε∞ + Δε / ((m2 − m1)·ln 10) · ln( (f2 + j f) / (f1 + j f) ),   f1 = 10^m1, f2 = 10^m2  [Hz]
 *
 * with ε = ε' − jε''. Between f1 and f2 the loss ε'' is nearly flat and ε' falls by about (2·ln10/π)·ε'' per decade,
 * the causal (Kramers–Kronig) partner of a constant loss. Given εr and tanδ at `fMeasure` the two constants follow
 * exactly: K = Δε/ln(f2/f1) = εr·tanδ / (atan(f0/f1) − atan(f0/f2)), ε∞ = εr − K·Re ln((f2 + j f0)/(f1 + j f0)).
 * Units: hertz in, plain numbers out. Validity: f1 < f < f2 (defaults 1 kHz and 1 THz); outside, the model is only
 * its own extrapolation.
 */

/** Default corners of the loss band, Hz. */
export const DEBYE_F_LOW = 1e3;
export const DEBYE_F_HIGH = 1e12;

export interface DielectricAt { er: number; tanDelta: number }

/**
 * εr and tanδ at `f` from values measured at `fMeasure` (all Hz, fLow < fMeasure < fHigh, f ≥ 0).
 * Inputs are assumed validated (core/substrate/validate.ts).
 */
export function widebandDebyeAt(
  er0: number, tanDelta0: number, fMeasure: number, f: number,
  fLow: number = DEBYE_F_LOW, fHigh: number = DEBYE_F_HIGH,
): DielectricAt {
  if (tanDelta0 === 0) return { er: er0, tanDelta: 0 };
  const im0 = Math.atan(fMeasure / fLow) - Math.atan(fMeasure / fHigh);
  const K = (er0 * tanDelta0) / im0;
  const re0 = 0.5 * Math.log((fHigh * fHigh + fMeasure * fMeasure) / (fLow * fLow + fMeasure * fMeasure));
  const epsInf = er0 - K * re0;
  const re = 0.5 * Math.log((fHigh * fHigh + f * f) / (fLow * fLow + f * f));
  const im = Math.atan(f / fLow) - Math.atan(f / fHigh);
  const epsReal = epsInf + K * re;
  const epsImag = K * im;
  return { er: epsReal, tanDelta: epsImag / epsReal };
}

/** The model's high-frequency permittivity ε∞ for the measured values (≥ 1 for a physical fit). */
export function widebandDebyeEpsInf(er0: number, tanDelta0: number, fMeasure: number, fLow = DEBYE_F_LOW, fHigh = DEBYE_F_HIGH): number {
  if (tanDelta0 === 0) return er0;
  const im0 = Math.atan(fMeasure / fLow) - Math.atan(fMeasure / fHigh);
  const K = (er0 * tanDelta0) / im0;
  return er0 - K * 0.5 * Math.log((fHigh * fHigh + fMeasure * fMeasure) / (fLow * fLow + fMeasure * fMeasure));
}
