/**
 * The yield solve's angle-sum step (core/yield/point-solve.ts): a made line's cos, sin, sinh and cosh of γl are
 * reached from the nominal board's by cos(x + d) = cos x cos d − sin x sin d, sin(x + d) = sin x cos d + cos x sin d,
 * sinh(x + d) = sinh x cosh d + cosh x sinh d, cosh(x + d) = cosh x cosh d + sinh x sinh d (M. Abramowitz and
 * I. A. Stegun, Handbook of Mathematical Functions, 1964, 4.3.16, 4.3.17 and 4.5.24, 4.5.25, from memory), with
 * cos d, sin d, cosh d, sinh d from their Taylor series. Checked against the library functions themselves: the
 * same boards solved with every line's values taken from Math (the solver's path for lines far from nominal).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, sizeDesign, targetFrequencies, bandSweep, type DesignDoc } from '../../core/index.ts';
import { BatchSolver } from '../../core/yield/batch-solver.ts';
import { ToleranceDraws } from '../../core/yield/draws.ts';
import { MadeBoard, applicableTolerances } from '../../core/yield/made-board.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(EX, `${name}.json`), 'utf8'), { complete: true });
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
  return r.doc;
}

/** A solver whose point solver takes every line's values from Math (one NaN row: no line is near its nominal). */
function libraryOnly(s: BatchSolver): BatchSolver {
  const inner = (s as unknown as { points: { nominal: Float64Array; nominalAll: boolean }; cn: { stamped: unknown[] } });
  inner.points.nominalAll = false;
  inner.points.nominal = new Float64Array(6 * inner.cn.stamped.length).fill(NaN);
  return s;
}

describe('the angle-sum step of the yield solve', () => {
  for (const name of ['wilkinson-2g45', 'three-section-transformer', 'branchline-10g4']) {
    it(`${name}: made boards (three times the example's spreads) give the S of the library functions to 1e-11`, () => {
      const doc = example(name), sized = sizeDesign(doc);
      const freqs = targetFrequencies(bandSweep(doc.frequency.band, doc.frequency.f0, 101), doc.targets ?? []);
      const fast = new BatchSolver(sized, freqs, sized.lineOptions), plain = libraryOnly(new BatchSolver(sized, freqs, sized.lineOptions));
      const tolerances = applicableTolerances(sized).tolerances.map((t) => ({ ...t, spread: 3 * t.spread }));
      const draws = new ToleranceDraws(tolerances, sized.pieces.length, 11);
      const board = new MadeBoard(sized, draws);
      const n = 2 * fast.ports.length ** 2 * freqs.length;
      const a = new Float64Array(n), b = new Float64Array(n);
      let worst = 0, differing = 0;
      for (let i = 0; i < 12; i++) {
        draws.next();
        const { made, laminate, pieceDw } = board.make();
        fast.solve(made, laminate, pieceDw, a);
        plain.solve(made, laminate, pieceDw, b);
        for (let j = 0; j < n; j += 2) {
          const d = Math.hypot(a[j]! - b[j]!, a[j + 1]! - b[j + 1]!);
          if (d > worst) worst = d;
          if (d !== 0) differing++;
        }
      }
      // The step was taken (the numbers are not the library's to the bit) and agrees to far below any figure shown.
      expect(differing).toBeGreaterThan(0);
      expect(worst).toBeLessThan(1e-11);
    });
  }
});
