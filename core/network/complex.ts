/**
 * Complex numbers for the network layer. Public values use the small `Complex` record; hot loops work on
 * interleaved Float64Arrays (re at 2k, im at 2k + 1) and inline the arithmetic.
 */
import type { Complex } from '../line/line-constants.ts';

// The same record the line model returns, so its values pass straight in.
export type { Complex };

export const cx = (re: number, im = 0): Complex => ({ re, im });
export const cadd = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const csub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const cmul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const cscale = (a: Complex, k: number): Complex => ({ re: a.re * k, im: a.im * k });
export const cabs = (a: Complex): number => Math.hypot(a.re, a.im);
export const carg = (a: Complex): number => Math.atan2(a.im, a.re);

/** a / b, scaled to avoid overflow (Smith's method). */
export function cdiv(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re, d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im, d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

export const cinv = (b: Complex): Complex => cdiv({ re: 1, im: 0 }, b);

export function cexp(a: Complex): Complex {
  const m = Math.exp(a.re);
  return { re: m * Math.cos(a.im), im: m * Math.sin(a.im) };
}

/** Principal square root (branch cut on the negative real axis, result with re >= 0). */
export function csqrt(a: Complex): Complex {
  const m = cabs(a);
  if (m === 0) return { re: 0, im: 0 };
  const re = Math.sqrt((m + a.re) / 2);
  const im = Math.sqrt(Math.max(0, (m - a.re) / 2));
  return { re, im: a.im < 0 ? -im : im };
}

/** cosh and sinh of a together (one exp). */
export function ccoshSinh(a: Complex): { cosh: Complex; sinh: Complex } {
  const c = Math.cos(a.im), s = Math.sin(a.im);
  // cosh(x + jy) = cosh x cos y + j sinh x sin y; sinh(x + jy) = sinh x cos y + j cosh x sin y.
  // Math.sinh keeps full precision for the small attenuation of board lines (no e^x - e^-x cancellation).
  const sh = Math.sinh(a.re), ch = Math.cosh(a.re);
  return { cosh: { re: ch * c, im: sh * s }, sinh: { re: sh * c, im: ch * s } };
}
