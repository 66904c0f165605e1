/**
 * The line models' one-variable terms as tabulated (core/line/term-tables.ts) against the formulas they are fitted
 * from (the model files, transcribing Hammerstad & Jensen, IEEE MTT-S IMS Digest 1980, pp. 407–409; Kirschning &
 * Jansen, Electronics Letters 18(6), 1982; Jansen & Kirschning, AEÜ 37, 1983 — as in the methods notes §1–2), and the
 * whole analysis against a second, independent transcription of those papers (test/unit/layout-oracle.ts).
 * Tolerances: each column to 1e-13 of the quantity it enters (relative where the value itself is used, absolute where
 * it is added to a number of order one), far below the papers' stated accuracies (0.01 %–0.6 %).
 */
import { describe, expect, it } from 'vitest';
import { evaluateOctaveTable } from '../../core/util/smooth-table.ts';
import {
  F_JK_R15, F_JK_R17, F_JK_R8, F_KJ_P3, F_KJ_POWER, FREQUENCY_OCTAVES, frequencyTerms,
  W_EE_EXPONENT, W_JK_R16, W_JK_R3, W_JK_R6, W_JK_R7, W_KJ_P1, W_KJ_P3, W_TANH, W_Z01, W_Z01_SLOPE, WIDTH_OCTAVES, WIDTH_U_MAX, widthTerms,
} from '../../core/line/term-tables.ts';
import { hjEpsEffExponent, hjZ01, hjZ01Derivative } from '../../core/line/hammerstad-jensen-1980.ts';
import { kjFnPower, kjP1WidthTerm, kjP3FrequencyFactor, kjP3WidthTerm } from '../../core/line/kirschning-jansen-1982.ts';
import { jkExpMinusR6, jkR15FrequencyFactor, jkR16WidthFactor, jkR17FrequencyFactor, jkR3, jkR7WidthFactor, jkR8FrequencyFactor } from '../../core/line/jansen-kirschning-1983.ts';
import { analyzeLine, InputError } from '../../core/index.ts';
import { oracleLine } from './layout-oracle.ts';

const out = new Float64Array(1);
function column(table: ReturnType<typeof widthTerms>, k: number, x: number): number {
  if (!evaluateOctaveTable(table, x, k, 1, out)) throw new Error(`x = ${x} outside the table`);
  return out[0]!;
}
function logGrid(lo: number, hi: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => lo * (hi / lo) ** (i / (n - 1)));
}

describe('width terms (over u = W/h) against their formulas', () => {
  const W = widthTerms();
  // [column, formula, upper end in u, 'rel' or 'abs', tolerance]
  const cases: [string, number, (u: number) => number, number, 'rel' | 'abs', number][] = [
    ['Z01(u), HJ eq. 1', W_Z01, hjZ01, 2000, 'rel', 2e-13],
    ['dZ01/du', W_Z01_SLOPE, hjZ01Derivative, 2000, 'rel', 2e-14],
    ['a(u)·ln(1 + 10/u), HJ eqs. 3–4', W_EE_EXPONENT, hjEpsEffExponent, 2000, 'rel', 1e-13],
    ['tanh √(6.517u), HJ eq. 6', W_TANH, (u) => Math.tanh(Math.sqrt(6.517 * u)), WIDTH_U_MAX.tanh, 'rel', 1e-14],
    ['KJ P1 width term (added to P1 ≥ 0.27)', W_KJ_P1, kjP1WidthTerm, WIDTH_U_MAX.p1, 'abs', 1e-15],
    ['KJ P3 width term (added to 0.1844 via P3·P4)', W_KJ_P3, kjP3WidthTerm, WIDTH_U_MAX.p3, 'abs', 5e-16],
    ['JK R3', W_JK_R3, jkR3, WIDTH_U_MAX.r3, 'rel', 5e-13],
    ['JK 1 − exp(−R2)', W_JK_R7, jkR7WidthFactor, WIDTH_U_MAX.r7, 'rel', 1e-13],
    ['JK exp(−R6) (subtracted from 0.9408)', W_JK_R6, jkExpMinusR6, WIDTH_U_MAX.r6, 'abs', 1e-14],
    ['JK R16 width factor (in 1 + 0.0503 εr² R11 ·)', W_JK_R16, jkR16WidthFactor, WIDTH_U_MAX.r16, 'abs', 1e-13],
  ];
  for (const [name, k, fn, uMax, kind, tol] of cases) {
    it(`${name}: within ${tol} (${kind}) from u = 0.001 to ${uMax}`, () => {
      let worst = 0;
      for (const u of logGrid(1e-3, uMax, 40_001)) {
        const a = fn(u); const b = column(W, k, u);
        worst = Math.max(worst, kind === 'rel' ? Math.abs(b / a - 1) : Math.abs(b - a));
      }
      expect(worst).toBeLessThan(tol);
    });
  }

  it('above each tabulated range the limit the analysis uses holds in double precision', () => {
    for (const u of logGrid(WIDTH_U_MAX.r7, 1000, 200)) expect(jkR7WidthFactor(u)).toBe(1);
    for (const u of logGrid(WIDTH_U_MAX.r16, 1000, 200)) expect(jkR16WidthFactor(u)).toBe(1);
    for (const u of logGrid(WIDTH_U_MAX.tanh, 1000, 200)) expect(Math.tanh(Math.sqrt(6.517 * u))).toBe(1);
    // exp(−R6) times R9 < 1.01 and the P1 term are below half an ulp of what they are subtracted from.
    for (const u of logGrid(WIDTH_U_MAX.r6, 1000, 200)) expect(0.9408 - 1.01 * jkExpMinusR6(u)).toBe(0.9408);
    for (const u of logGrid(WIDTH_U_MAX.p1, 1000, 200)) expect(0.27488 + 0.6315 * u - kjP1WidthTerm(u)).toBe(0.27488 + 0.6315 * u);
  });

  it('covers the accepted W/h range with the thickness increment (0.001 to 2048)', () => {
    expect(2 ** WIDTH_OCTAVES[0]).toBeLessThanOrEqual(1e-3);
    expect(2 ** WIDTH_OCTAVES[1]).toBeGreaterThanOrEqual(1000 + 1);
  });
});

describe('frequency terms (over fn = f·h in GHz·mm) against their formulas', () => {
  const F = frequencyTerms();
  const cases: [string, number, (fn: number) => number][] = [
    ['KJ 1 − exp(−(fn/38.7)^4.97)', F_KJ_P3, kjP3FrequencyFactor],
    ['KJ fn^1.5763', F_KJ_POWER, kjFnPower],
    ['JK (fn/18.365)^2.745', F_JK_R8, jkR8FrequencyFactor],
    ['JK (fn/12.3)^1.097', F_JK_R15, jkR15FrequencyFactor],
    ['JK exp(−0.026·fn^1.15656)', F_JK_R17, jkR17FrequencyFactor],
  ];
  for (const [name, k, fn] of cases) {
    it(`${name}: within 1e-13 relative over the whole table`, () => {
      let worst = 0;
      for (const x of logGrid(2 ** FREQUENCY_OCTAVES[0], 2 ** FREQUENCY_OCTAVES[1] * (1 - 1e-12), 40_001)) {
        worst = Math.max(worst, Math.abs(column(F, k, x) / fn(x) - 1));
      }
      expect(worst).toBeLessThan(1e-13);
    });
  }
});

describe('the analysis against an independent transcription of the papers', () => {
  let s = 11;
  const rnd = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);

  it('Z0(f), εe(f) and the static values agree to 1e-11 over εr 1.5–20, W/h 0.01–100, t 0–0.3h, f·h to 30 GHz·mm', () => {
    let wz = 0; let we = 0; let wzs = 0; let wes = 0;
    for (let i = 0; i < 20_000; i++) {
      const er = 1.5 + rnd() * 18.5; const h = 1e-4 * 10 ** (rnd() * 1.5); const u = 0.01 * 10 ** (rnd() * 4);
      const t = rnd() < 0.2 ? 0 : h * 0.3 * rnd();
      const fMax = Math.min((2 * 299_792_458) / (4 * h * Math.sqrt(er - 1)), 30e9 / (h * 1e3));
      const f = rnd() < 0.1 ? 0 : fMax * rnd();
      const r = analyzeLine({ er, h, t, tanDelta: 0.001, sigma: 5.8e7, roughness: 0 }, u * h, f);
      const o = oracleLine(u * h, h, t, er, f);
      wz = Math.max(wz, Math.abs(r.z0 / o.z0 - 1)); we = Math.max(we, Math.abs(r.epsEff / o.ee - 1));
      wzs = Math.max(wzs, Math.abs(r.z0Static / o.z0s - 1)); wes = Math.max(wes, Math.abs(r.epsEffStatic / o.ees - 1));
    }
    expect(wz).toBeLessThan(1e-11); expect(we).toBeLessThan(1e-11);
    expect(wzs).toBeLessThan(1e-11); expect(wes).toBeLessThan(1e-11);
  });

  it('outside the frequency table (f·h below 6e-5 or above 256 GHz·mm) the formulas give the same agreement', () => {
    const cases: [number, number, number, number][] = [ // er, h, W, f
      [4.4, 0.79e-3, 1.5e-3, 10], [4.4, 0.79e-3, 1.5e-3, 50e3], [2.2, 0.5e-3, 1.5e-3, 1],
      [1.05, 0.03, 0.02, 20e9], [1.2, 0.02, 0.03, 10e9],
    ];
    for (const [er, h, W, f] of cases) {
      const r = analyzeLine({ er, h, t: 35e-6, tanDelta: 0, sigma: 5.8e7, roughness: 0 }, W, f);
      const o = oracleLine(W, h, 35e-6, er, f);
      expect(Math.abs(r.z0 / o.z0 - 1)).toBeLessThan(1e-11);
      expect(Math.abs(r.epsEff / o.ee - 1)).toBeLessThan(1e-11);
    }
  });
});

describe('no NaN where the Z0(f) fit has no value (εr barely above 1, f·h far beyond its range)', () => {
  it('a foam-like substrate swept to 100 GHz gives finite numbers or a typed error naming f, never NaN', () => {
    let errors = 0;
    for (const er of [1.001, 1.01, 1.03, 1.05, 1.1, 1.5]) for (const h of [0.5e-3, 2e-3, 5e-3, 10e-3]) for (const w of [0.5, 2, 8]) {
      for (let k = 0; k < 60; k++) {
        const f = 1e8 * 10 ** (k / 20);
        try {
          const r = analyzeLine({ er, h, t: 35e-6, tanDelta: 0.001, sigma: 5.8e7, roughness: 0 }, w * h, f);
          for (const v of [r.z0, r.epsEff, r.alphaC, r.alphaD, r.lambdaG]) expect(Number.isFinite(v)).toBe(true);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          expect((e as InputError).field).toBe('f');
          errors++;
        }
      }
    }
    expect(errors).toBeGreaterThan(0); // εr 1.01, h 5–10 mm above ~50 GHz: the fit's R13/R14 turns negative there
  });
});
