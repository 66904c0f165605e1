/**
 * Source: test/fixtures/line/line-reference.csv — 30 cases computed by the general-purpose RF library scikit-rf
 * (main branch, commit bae3832, skrf/media/mline.py, MLine; provenance in test/fixtures/line/README.md), which
 * follows the published equations: Hammerstad–Jensen 1980 static with thickness, Kirschning–Jansen 1982 εe(f),
 * Jansen–Kirschning 1983 Z0(f), filling-factor dielectric loss with εe(f), current-distribution conductor loss.
 * Tolerance 3e-4 relative: that library evaluates the static formulas with complex εr·(1 − j tanδ), which moves
 * the real parts by about tanδ² (1.4e-4 at tanδ 0.02); rows with tanδ ≤ 0.004 must agree to 1e-5.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyzeLine } from '../../core/index.ts';
import { currentDistributionAlphaC } from '../../core/line/current-distribution-loss.ts';
import { hammerstadBekkadalKr } from '../../core/line/hammerstad-bekkadal-roughness.ts';

const text = readFileSync(join(import.meta.dirname, '..', 'fixtures', 'line', 'line-reference.csv'), 'utf8');
const [header, ...lines] = text.trim().split('\n');
const cols = header!.split(',');
const rows = lines.map((l) => {
  const cells = l.split(',');
  const get = (name: string) => cells[cols.indexOf(name)]!;
  const num = (name: string) => (get(name) === '' ? undefined : Number(get(name)));
  return {
    er: num('er')!, h: num('h_m')!, w: num('w_m')!, t: num('t_m')!, f: num('f_hz')!, tand: num('tand')!, rho: num('rho')!,
    z0s: num('z0_static')!, ees: num('eps_eff_static')!, eef: num('eps_eff_f')!, z0f: num('z0_f')!,
    ac: num('alpha_c_np_per_m'), ad: num('alpha_d_np_per_m')!,
  };
});
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('line model vs scikit-rf main (test/fixtures/line/line-reference.csv)', () => {
  it('has the 30 cases', () => { expect(rows.length).toBe(30); });
  for (const [i, r] of rows.entries()) {
    const name = `row ${i + 2}: εr ${r.er}, h ${r.h * 1e3} mm, W ${r.w * 1e3} mm, t ${r.t * 1e6} µm, ${r.f / 1e9} GHz`;
    it(name, () => {
      const sub = { er: r.er, h: r.h, t: r.t, tanDelta: r.tand, sigma: 1 / r.rho, roughness: 0 };
      const a = analyzeLine(sub, r.w, r.f, { conductorLoss: 'current-distribution' });
      const tol = r.tand <= 0.004 ? 1e-5 : 3e-4;
      expect(rel(a.z0Static, r.z0s)).toBeLessThan(tol);
      expect(rel(a.epsEffStatic, r.ees)).toBeLessThan(tol);
      expect(rel(a.epsEff, r.eef)).toBeLessThan(tol);
      expect(rel(a.z0, r.z0f)).toBeLessThan(tol);
      expect(rel(a.alphaD, r.ad)).toBeLessThan(tol);
      if (r.ac !== undefined) {
        // The library's skin-effect value, without our DC/thin-metal blend: compare the model function itself.
        const rs = Math.sqrt(Math.PI * r.f * 1.25663706212e-6 * r.rho);
        const model = currentDistributionAlphaC(rs, a.z0, r.w) * hammerstadBekkadalKr(0);
        expect(rel(model, r.ac)).toBeLessThan(tol);
        // The analysis adds the DC term in quadrature: never below the skin value, and close to it when t ≥ 3δ.
        expect(a.alphaC).toBeGreaterThanOrEqual(model * (1 - 1e-12));
        if (r.t >= 3 * a.skinDepth) expect(rel(a.alphaC, model)).toBeLessThan(0.02);
      }
    });
  }
});
