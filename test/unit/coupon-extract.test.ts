/**
 * The laminate from a coupon: self-consistency of the extraction on lines made with our own line model (the
 * outside check against scikit-rf is test/reference/coupon-skrf.test.ts), the eigenvalue relation of the two-line
 * method (Marks 1991: the eigenvalues of M_j·M_i⁻¹ are e^{∓γΔl} whatever the error boxes), the Janezic–Jargon
 * relation ε_eff = −(γ/k0)², and the refusals of bad input.
 */
import { describe, expect, it } from 'vitest';
import {
  C0, InputError, eigenvalues2, extractLaminate, effectivePermittivityFromGamma, gammaFromEffectivePermittivity, sToT,
  type CouponExtractInput,
} from '../../core/index.ts';
import { cascade, flip, lineS, randomBox, rng, synthCoupon } from './coupon-synth.ts';

const err = (fn: () => unknown): InputError => {
  try { fn(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
};

const FR = { er: 4.3, h: 1.52e-3, t: 35e-6, tanDelta: 0.018, sigma: 5.8e7, roughness: 0 };
const FREQS = Array.from({ length: 121 }, (_, i) => 0.5e9 + i * 0.05e9);

function input(texts: string[], lengths: number[], extra: Partial<CouponExtractInput> = {}): CouponExtractInput {
  return { lines: texts.map((text, i) => ({ name: `line${i}.s2p`, text, length: lengths[i]! })), width: 2.9e-3, h: 1.52e-3, t: 35e-6, ...extra };
}

describe('two-line eigenvalues (Marks 1991)', () => {
  it('the eigenvalues of M_j·M_i⁻¹ are e^{∓γΔl} for any error boxes', () => {
    const r = rng(7);
    for (let trial = 0; trial < 20; trial++) {
      const a = randomBox(r, 0.3)(2e9), b = randomBox(r, 0.3)(2e9);
      const zc = { re: 40 + 30 * r(), im: -0.5 }, gamma = { re: 0.5 + r(), im: 40 + 80 * r() };
      const li = 0.01 + 0.02 * r(), lj = li + 0.005 + 0.02 * r();
      const T = (l: number) => { const [s11, s21, s12, s22] = cascade(cascade(a, lineS(zc, gamma, l)), flip(b)); return sToT(s11, s21, s12, s22); };
      const mi = T(li), mj = T(lj);
      // M_j·M_i⁻¹ by hand: its trace and determinant are those of diag(e^{−γΔl}, e^{γΔl}).
      const inv = (m: typeof mi) => { const d = { re: m.a.re * m.d.re - m.a.im * m.d.im - (m.b.re * m.c.re - m.b.im * m.c.im), im: m.a.re * m.d.im + m.a.im * m.d.re - (m.b.re * m.c.im + m.b.im * m.c.re) };
        const k = { re: d.re / (d.re ** 2 + d.im ** 2), im: -d.im / (d.re ** 2 + d.im ** 2) };
        const mul = (p: { re: number; im: number }, q: { re: number; im: number }) => ({ re: p.re * q.re - p.im * q.im, im: p.re * q.im + p.im * q.re });
        return { a: mul(m.d, k), b: mul({ re: -m.b.re, im: -m.b.im }, k), c: mul({ re: -m.c.re, im: -m.c.im }, k), d: mul(m.a, k) }; };
      const mul = (p: { re: number; im: number }, q: { re: number; im: number }) => ({ re: p.re * q.re - p.im * q.im, im: p.re * q.im + p.im * q.re });
      const add = (p: { re: number; im: number }, q: { re: number; im: number }) => ({ re: p.re + q.re, im: p.im + q.im });
      const y = inv(mi);
      const p = { a: add(mul(mj.a, y.a), mul(mj.b, y.c)), b: add(mul(mj.a, y.b), mul(mj.b, y.d)), c: add(mul(mj.c, y.a), mul(mj.d, y.c)), d: add(mul(mj.c, y.b), mul(mj.d, y.d)) };
      const ev = eigenvalues2(p);
      const dl = lj - li;
      const want = [Math.exp(-gamma.re * dl), Math.exp(gamma.re * dl)];
      const mags = ev.map((e) => Math.hypot(e.re, e.im)).sort((u, v) => u - v);
      expect(mags[0]).toBeCloseTo(want[0]!, 9);
      expect(mags[1]).toBeCloseTo(want[1]!, 9);
      const ph = Math.atan2(Math.sin(-gamma.im * dl), Math.cos(-gamma.im * dl));
      const small = ev.find((e) => Math.hypot(e.re, e.im) < 1)!;
      expect(Math.atan2(small.im, small.re)).toBeCloseTo(ph, 9);
    }
  });
});

describe('Janezic–Jargon 1999: ε_eff = −(γ/k0)²', () => {
  it('a lossless line: γ = jβ gives ε_eff = (β/k0)² and no loss', () => {
    const f = 3e9, k0 = (2 * Math.PI * f) / C0;
    const e = effectivePermittivityFromGamma({ re: 0, im: 2 * k0 }, f);
    expect(e.real).toBeCloseTo(4, 12);
    expect(e.loss).toBe(0);
  });
  it('round trip γ → ε_eff → γ', () => {
    const f = 5e9;
    const g = { re: 1.7, im: 190 };
    const e = effectivePermittivityFromGamma(g, f);
    const back = gammaFromEffectivePermittivity(e.real, e.loss, f);
    expect(back.re).toBeCloseTo(g.re, 9);
    expect(back.im).toBeCloseTo(g.im, 9);
    expect(e.loss).toBeGreaterThan(0); // a lossy line has ε'' > 0 in ε' − jε''
  });
});

describe('extraction on lines made with our own model (self-consistency)', () => {
  it('two lines, error boxes with 15 dB return loss, noise 1e-3: εr within 0.1 %, tanδ within 3 %', () => {
    const L = [0.025, 0.045];
    const texts = synthCoupon({ sub: FR, width: 2.9e-3, lengths: L, freqs: FREQS, seed: 3, noise: 1e-3 });
    const r = extractLaminate(input(texts, L, { dielectric: 'constant' }));
    expect(Math.abs(r.er / FR.er - 1)).toBeLessThan(1e-3);
    expect(Math.abs(r.tand / FR.tanDelta - 1)).toBeLessThan(0.03);
    // The stated uncertainty covers the actual error (within 3 standard uncertainties).
    expect(Math.abs(r.er - FR.er)).toBeLessThan(3 * r.uncertainty.er);
    expect(Math.abs(r.tand - FR.tanDelta)).toBeLessThan(3 * r.uncertainty.tand);
    expect(r.uncertainty.er).toBeGreaterThan(0);
    // β·Δl passes 180° inside this band: those frequencies are left out and reported.
    const dl = 0.02;
    for (const x of r.excluded) {
      if (x.f === 0) continue;
      const bdl = (2 * Math.PI * x.f / C0) * Math.sqrt(r.points.find((p) => p.f === x.f)!.fitEpsEff!) * dl;
      const off = Math.abs(bdl / Math.PI - Math.round(bdl / Math.PI)) * 180;
      expect(off).toBeLessThan(21);
    }
    expect(r.excluded.length).toBeGreaterThan(5);
    expect(r.points.filter((p) => p.used).length + r.excluded.length).toBe(FREQS.length);
  });

  it('four lines (multiline), wideband Debye laminate and rough copper: εr, tanδ and the roughness come back', () => {
    const sub = { er: 4.1, h: 0.8e-3, t: 18e-6, tanDelta: 0.015, sigma: 5.8e7, roughness: 1e-6, dielectricModel: { kind: 'wideband-debye' as const, fMeasure: 2e9 } };
    const freqs = Array.from({ length: 151 }, (_, i) => 0.2e9 + i * 0.08e9);
    const L = [0.02, 0.026, 0.05, 0.11];
    const texts = synthCoupon({ sub, width: 1.5e-3, lengths: L, freqs, seed: 5, noise: 1e-3 });
    const base = { width: 1.5e-3, h: 0.8e-3, t: 18e-6, roughness: 1e-6, fMeasure: 2e9, erGuess: 3.6 };
    const r = extractLaminate({ ...base, lines: texts.map((text, i) => ({ name: `l${i}.s2p`, text, length: L[i]! })) });
    expect(r.excluded).toEqual([]); // some pair is always well conditioned
    expect(Math.abs(r.er / 4.1 - 1)).toBeLessThan(1e-3);
    expect(Math.abs(r.tand / 0.015 - 1)).toBeLessThan(0.02);
    expect(r.substrate.dielectricModel).toEqual({ kind: 'wideband-debye', fMeasure: 2e9 });
    const rr = extractLaminate({ ...base, roughness: 0.5e-6, fitRoughness: true, lines: texts.map((text, i) => ({ name: `l${i}.s2p`, text, length: L[i]! })) });
    expect(Math.abs(rr.roughness! / 1e-6 - 1)).toBeLessThan(0.3);
    expect(rr.uncertainty.roughness).toBeGreaterThan(0);
  });

  it('the stated uncertainty matches the actual scatter: over 12 noisy coupons the error is about one uncertainty', () => {
    // With an exact model the error comes from the noise alone; the rms of error/uncertainty should be near 1
    // (the total, residuals and spread combined, is meant to be on the safe side of 1).
    const L = [0.025, 0.042];
    const freqs = FREQS.slice(0, 81);
    const z: number[][] = [];
    for (let seed = 1; seed <= 12; seed++) {
      const texts = synthCoupon({ sub: FR, width: 2.9e-3, lengths: L, freqs, seed, noise: 1e-3 });
      const r = extractLaminate(input(texts, L, { dielectric: 'constant' }));
      z.push([(r.er - FR.er) / r.uncertainty.er, (r.tand - FR.tanDelta) / r.uncertainty.tand]);
    }
    for (const k of [0, 1]) {
      const rms = Math.sqrt(z.reduce((s, v) => s + v[k]! ** 2, 0) / z.length);
      expect(rms).toBeGreaterThan(0.25);
      expect(rms).toBeLessThan(2);
    }
  });

  it('a file that reaches past the higher-order-mode threshold: those points are left out with the reason, the rest used', () => {
    // 1.52 mm, εr 4.3, 2.9 mm strip: the first transverse resonance c0/(√εr·(2W + 0.8h)) is about 20 GHz, and the
    // line model refuses frequencies above twice the TE1 onset (about 54 GHz at the εr 4.4 guess): the file goes to 61.
    const L = [0.02, 0.024];
    const freqs = Array.from({ length: 121 }, (_, i) => 1e9 + i * 0.5e9);
    const texts = synthCoupon({ sub: FR, width: 2.9e-3, lengths: L, freqs: freqs.filter((f) => f <= 20e9), seed: 2 });
    // The synthetic lines exist only below the threshold; above it, copy the last point (a measured file has data there).
    const extend = (text: string) => text + freqs.filter((f) => f > 20e9).map((f) => `${f / 1e9} ${text.trim().split('\n').pop()!.split(/\s+/).slice(1).join(' ')}`).join('\n') + '\n';
    const r = extractLaminate(input(texts.map(extend), L, { dielectric: 'constant' }));
    const high = r.excluded.filter((x) => /higher-order mode/.test(x.reason));
    expect(high.length).toBeGreaterThan(0);
    expect(high.every((x) => x.f > 15e9)).toBe(true);
    expect(r.points.filter((p) => p.f > high[0]!.f).every((p) => !p.used && p.fitEpsEff === undefined)).toBe(true);
    expect(Math.abs(r.er / FR.er - 1)).toBeLessThan(2e-3);
  });

  it('a poor first guess (εr 2.5 for a 4.3 laminate) still resolves the 2π multiple', () => {
    const L = [0.02, 0.032];
    const texts = synthCoupon({ sub: FR, width: 2.9e-3, lengths: L, freqs: FREQS, seed: 9, noise: 5e-4 });
    const r = extractLaminate(input(texts, L, { dielectric: 'constant', erGuess: 2.5, tanDeltaGuess: 0.001 }));
    expect(Math.abs(r.er / FR.er - 1)).toBeLessThan(2e-3);
  });
});

describe('bad input gets a clear InputError', () => {
  const L = [0.025, 0.045];
  const texts = synthCoupon({ sub: FR, width: 2.9e-3, lengths: L, freqs: FREQS.slice(0, 40), seed: 3 });
  it('a one-port file', () => {
    const e = err(() => extractLaminate({ ...input(texts, L), lines: [{ name: 'a.s1p', text: '# GHz S RI R 50\n1 0.1 0\n2 0.1 0\n', length: 0.02 }, { name: 'b.s2p', text: texts[1]!, length: 0.045 }] }));
    expect(e.field).toBe('a.s1p');
    expect(e.expected).toMatch(/two-port/);
    expect(e.got).toMatch(/1-port/);
  });
  it('different frequency grids', () => {
    const other = synthCoupon({ sub: FR, width: 2.9e-3, lengths: L, freqs: FREQS.slice(0, 39), seed: 3 });
    const e = err(() => extractLaminate(input([texts[0]!, other[1]!], L)));
    expect(e.field).toBe('line1.s2p');
    expect(e.expected).toMatch(/same frequencies as line0\.s2p/);
    expect(e.hint).toMatch(/same analyser settings/);
  });
  it('lines of equal length', () => {
    const e = err(() => extractLaminate(input(texts, [0.03, 0.03])));
    expect(e.field).toBe('lines[1].length');
    expect(e.expected).toMatch(/different/);
  });
  it('one line only, a missing width, a malformed file', () => {
    expect(err(() => extractLaminate(input([texts[0]!], [0.02]))).field).toBe('lines');
    expect(err(() => extractLaminate({ ...input(texts, L), width: Number.NaN })).field).toBe('width');
    expect(err(() => extractLaminate(input(['# GHz S RI R 50\n1 x\n', texts[1]!], L))).code).toBe('bad-file');
  });
  it('a band where every frequency is ill-conditioned', () => {
    // Δl = half a guided wavelength at 2 GHz, measured only over 1.98–2.02 GHz.
    const f = Array.from({ length: 9 }, (_, i) => 1.98e9 + i * 5e6);
    const dl = C0 / (2 * 2e9 * Math.sqrt(3.3));
    const t2 = synthCoupon({ sub: FR, width: 2.9e-3, lengths: [0.02, 0.02 + dl], freqs: f, seed: 1 });
    const e = err(() => extractLaminate(input(t2, [0.02, 0.02 + dl])));
    expect(e.expected).toMatch(/180°/);
  });
});
