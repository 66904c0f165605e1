/**
 * Synthetic coupon measurements for the unit tests (our own line model, so a self-consistency check only; the
 * outside check is test/reference/coupon-skrf.test.ts). Lines of one width and several lengths between identical
 * error boxes, written as Touchstone text.
 */
import { lineConstants, writeTouchstone, type NetworkResponse } from '../../core/index.ts';
import type { SubstrateSpec } from '../../core/index.ts';

type C = { re: number; im: number };
const c = (re: number, im = 0): C => ({ re, im });
const add = (a: C, b: C): C => c(a.re + b.re, a.im + b.im);
const sub = (a: C, b: C): C => c(a.re - b.re, a.im - b.im);
const mul = (a: C, b: C): C => c(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
const div = (a: C, b: C): C => { const d = b.re * b.re + b.im * b.im; return c((a.re * b.re + a.im * b.im) / d, (a.im * b.re - a.re * b.im) / d); };
const exp = (a: C): C => { const m = Math.exp(a.re); return c(m * Math.cos(a.im), m * Math.sin(a.im)); };
type S = [C, C, C, C]; // s11, s21, s12, s22

/** S of a line (Zc, γ, l) in a real reference R (the usual line formulas). */
export function lineS(zc: C, gamma: C, l: number, R = 50): S {
  const e1 = exp(c(-gamma.re * l, -gamma.im * l));
  const e2 = mul(e1, e1);
  const G = div(sub(zc, c(R)), add(zc, c(R)));
  const G2 = mul(G, G);
  const den = sub(c(1), mul(G2, e2));
  const s11 = div(mul(G, sub(c(1), e2)), den);
  const s21 = div(mul(sub(c(1), G2), e1), den);
  return [s11, s21, s21, s11];
}

/** Cascade of two-ports (a then b), S form. */
export function cascade(a: S, b: S): S {
  const [a11, a21, a12, a22] = a; const [b11, b21, b12, b22] = b;
  const d = sub(c(1), mul(a22, b11));
  return [
    add(a11, div(mul(mul(a12, a21), b11), d)),
    div(mul(a21, b21), d),
    div(mul(a12, b12), d),
    add(b22, div(mul(mul(b21, b12), a22), d)),
  ];
}

export const flip = (s: S): S => [s[3], s[2], s[1], s[0]];

/** A seeded random number generator (mulberry32). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => { a = (a + 0x6d2b79f5) >>> 0; let t = a; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296; };
}

/** A reciprocal, passive-looking connector box: |S11|, |S22| up to `gMax`, transmission 0.8–0.97 with a delay. */
export function randomBox(r: () => number, gMax: number): (f: number) => S {
  const g1 = gMax * (0.5 + 0.5 * r()), g2 = gMax * (0.5 + 0.5 * r());
  const p1 = 2 * Math.PI * r(), p2 = 2 * Math.PI * r();
  const t = 0.8 + 0.17 * r(); const delay = 20e-12 + 60e-12 * r();
  return (f) => {
    const ph = -2 * Math.PI * f * delay;
    const s11 = c(g1 * Math.cos(p1 + ph), g1 * Math.sin(p1 + ph));
    const s22 = c(g2 * Math.cos(p2 + 1.3 * ph), g2 * Math.sin(p2 + 1.3 * ph));
    const s21 = c(t * Math.cos(ph), t * Math.sin(ph));
    return [s11, s21, s21, s22];
  };
}

export interface SynthOptions {
  sub: SubstrateSpec; width: number; lengths: number[]; freqs: number[];
  seed?: number; gMax?: number; noise?: number;
}

/** Touchstone texts (RI, GHz) of each line between the same two random boxes, with Gaussian noise of `noise` rms. */
export function synthCoupon(o: SynthOptions): string[] {
  const r = rng(o.seed ?? 1);
  const boxA = randomBox(r, o.gMax ?? 0.178), boxB = randomBox(r, o.gMax ?? 0.178);
  const gauss = () => { const u = Math.max(r(), 1e-12), v = r(); return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v); };
  return o.lengths.map((l) => {
    const s = new Float64Array(8 * o.freqs.length);
    o.freqs.forEach((f, k) => {
      const { zc, gamma } = lineConstants(o.sub, o.width, f);
      const m = cascade(cascade(boxA(f), lineS(zc, gamma, l)), flip(boxB(f)));
      const n = o.noise ?? 0;
      const [s11, s21, s12, s22] = m;
      const put = (i: number, v: C) => { s[8 * k + i] = v.re + n * gauss() / Math.SQRT2; s[8 * k + i + 1] = v.im + n * gauss() / Math.SQRT2; };
      put(0, s11); put(2, s12); put(4, s21); put(6, s22);
    });
    const resp: NetworkResponse = { freqs: Float64Array.from(o.freqs), ports: [{ name: '1', zRef: 50 }, { name: '2', zRef: 50 }], s, warnings: [] };
    return writeTouchstone(resp, { format: 'ri' });
  });
}
