/**
 * Floating side copper in one solve: with the strip at 1 V and the floating copper held at a potential w, the energy
 * form E(w) = K_ss + 2w·K_sf + w²·K_ff is a quadratic whose minimum, at zero net charge on the floating copper, is
 * the mode's capacitance K_ss − K_sf²/K_ff (the Schur complement of the Maxwell capacitance matrix: eliminating a
 * conductor that carries no net charge; e.g. C. R. Paul, "Analysis of Multiconductor Transmission Lines", 2nd ed.,
 * Wiley 2008, ch. 5). So E(w) − Q_f²/K_ff gives it from one solution at any w, Q_f that solution's floating charge.
 * Checked here against the two solutions per grid it replaces, on the same grid, with the potential w and K_ff taken
 * off on purpose (as a coarser grid gives them).
 */
import { describe, expect, it } from 'vitest';
import { solveConfig, type Config } from '../../core/section/config-solve.ts';
import { buildShapes, FLOATING, STRIP_1 } from '../../core/section/shapes.ts';
import { materialOf } from '../../core/section/materials.ts';
import { gradedAxis } from '../../core/section/grid.ts';
import type { SectionSpec } from '../../core/section/types.ts';

const SPEC: SectionSpec = { er: 4.4, h: 1.6e-3, width: 2.6e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.3e-3, width: Infinity, connection: 'floating' }, trench: { depth: 20e-6, angleDeg: 30 } };

function grid(spec: SectionSpec) {
  const X = 30 * spec.h;
  const shapes = buildShapes(spec, 0, X);
  const edge = 10e-6, iface = 0.1e-3;
  const keysX = [...shapes.keysX.map((k) => ({ at: k.at, size: k.edge ? edge : iface })), { at: 0, size: iface }, { at: X, size: X / 4 }];
  const keysY = [...shapes.keysY.map((k) => ({ at: k.at, size: k.edge ? edge : iface })), { at: X, size: X / 4 }];
  return { shapes, material: materialOf(spec, shapes, 1e-9 * spec.h), x: Float64Array.from(gradedAxis(0, X, keysX, 1.3)), y: Float64Array.from(gradedAxis(0, X, keysY, 1.3)) };
}

describe('floating side copper in one solve (Schur complement)', () => {
  const { shapes, material, x, y } = grid(SPEC);
  const cfg: Config = { mode: 'single', ids: [STRIP_1, FLOATING], wall: false, scale: 2 };
  for (const [what, mat] of [['with the substrate', material], ['in vacuum', null]] as const) {
    it(`${what}: one solve at a potential and K_ff 10 % and 5 % off gives the two-solve capacitance`, () => {
      const exact = solveConfig(x, y, shapes, mat, cfg, [], [], false);
      const K = exact.K!;
      // The eliminated form from the two solutions, written out (the test's own arithmetic).
      const schur = 2 * (K[0]![0]! - (K[0]![1]! * K[1]![0]!) / K[1]![1]!);
      expect(exact.c / schur - 1).toBeCloseTo(0, 12);
      const w = exact.hint!.volts, kff = exact.hint!.kff;
      expect(w).toBeGreaterThan(0); // the floating copper takes up part of the strip's potential
      expect(w).toBeLessThan(1);
      const one = solveConfig(x, y, shapes, mat, cfg, [], [], false, { volts: 1.1 * w, kff: 1.05 * kff });
      expect(one.sols).toHaveLength(1);
      // Left over: Q_f²·(1/K_ff' − 1/K_ff), with Q_f = 0.1·w·K_ff: 1e-4 of the floating copper's share at most.
      expect(Math.abs(one.c / exact.c - 1)).toBeLessThan(3e-5);
      // Without the charge term the error would be K_ff·(0.1·w)² (first order in the potential's error squared).
      const naive = 2 * (K[0]![0]! + 2 * 1.1 * w * K[0]![1]! + (1.1 * w) ** 2 * K[1]![1]!);
      expect(Math.abs(naive / exact.c - 1)).toBeGreaterThan(10 * Math.abs(one.c / exact.c - 1));
      // Newton's step on E(w) puts the next grid's potential back on the zero-charge one.
      expect(Math.abs(one.hint!.volts / w - 1)).toBeLessThan(0.01);
    });
  }
});
