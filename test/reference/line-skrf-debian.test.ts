/**
 * Source: Debian's python3-scikit-rf (0.15.4), run live by scripts/reference/skrf_line.py on an 840-point grid
 * (εr 2.2–10.2, W/h 0.1–10, h 0.254–1.52 mm, f 0.1–24 GHz). That release follows the published Hammerstad–Jensen
 * 1980 static equations and the Kirschning–Jansen 1982 εe(f) exactly when t = 0; its thickness term, its Z0(f) and
 * its conductor loss deviate from the papers (the project's own comparison of that release's source with the papers), so only t = 0 and the static Z0 and
 * εe, εe(f) and the dielectric loss (published form with the static εe) are compared. Tolerance 1e-6 relative
 * (agreement found there: ≤ 4e-7).
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { analyzeLine } from '../../core/index.ts';
import { fillingFactorAlphaD } from '../../core/line/filling-factor-dielectric-loss.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const env = { ...process.env, PATH: spawnSync('getconf', ['PATH'], { encoding: 'utf8' }).stdout.trim() || '/usr/bin:/bin' };
const probe = spawnSync('python3', ['-c', 'import skrf.media'], { env, encoding: 'utf8' });
const haveSkrf = probe.status === 0;

describe.skipIf(!haveSkrf)('line model vs Debian scikit-rf 0.15.4 (skipped only when Debian python3-scikit-rf is missing)', () => {
  it('840 grid points: static Z0, εe, KJ εe(f) and dielectric loss to 1e-6', () => {
    const r = spawnSync('python3', [join(ROOT, 'scripts', 'reference', 'skrf_line.py')], { env, encoding: 'utf8', maxBuffer: 1 << 24 });
    expect(r.status, r.stderr).toBe(0);
    const lines = r.stdout.split('\n').filter((l) => l !== '' && !l.startsWith('#'));
    const cols = lines[0]!.split(',');
    expect(cols).toEqual(['er', 'h_m', 'w_m', 'f_hz', 'tand', 'z0_static', 'eps_eff_static', 'eps_eff_f', 'alpha_d_np_per_m']);
    const rows = lines.slice(1).map((l) => l.split(',').map(Number));
    expect(rows.length).toBe(840);
    const worst = { z0: 0, ee: 0, eef: 0, ad: 0 };
    for (const [er, h, w, f, tand, z0, ee, eef, ad] of rows as number[][]) {
      const a = analyzeLine({ er: er!, h: h!, t: 0, tanDelta: tand!, sigma: 1 / 1.72e-8, roughness: 0 }, w!, f!);
      worst.z0 = Math.max(worst.z0, Math.abs(a.z0Static - z0!) / z0!);
      worst.ee = Math.max(worst.ee, Math.abs(a.epsEffStatic - ee!) / ee!);
      worst.eef = Math.max(worst.eef, Math.abs(a.epsEff - eef!) / eef!);
      worst.ad = Math.max(worst.ad, Math.abs(fillingFactorAlphaD(f!, er!, a.epsEffStatic, tand!) - ad!) / ad!);
    }
    console.info('worst relative difference vs Debian scikit-rf:', JSON.stringify(worst));
    expect(worst.z0).toBeLessThan(1e-6);
    expect(worst.ee).toBeLessThan(1e-6);
    expect(worst.eef).toBeLessThan(1e-6);
    expect(worst.ad).toBeLessThan(1e-6);
  });
});
