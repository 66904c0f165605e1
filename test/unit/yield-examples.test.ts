/**
 * The yield estimate on every example with the example's own targets and tolerances, through the one core function
 * the app's worker and `stripwright yield` call (runYield). What is checked does not come from runYield itself:
 *  - each board's worst values equal the targets evaluated (core/network/targets.ts, the function `build` uses) on
 *    that board's full S from madeBoardResponses: runYield excites only the ports whose S columns its targets read,
 *    and this shows the columns it skips change nothing;
 *  - the counts, the 95 % Wilson interval (E. B. Wilson, "Probable inference, the law of succession, and statistical
 *    inference", JASA 22(158), 1927: the interval holds the observed share) and the histogram agree with the values;
 *  - the envelopes hold every board's |S| in dB (20·log10|S|, D. M. Pozar, Microwave Engineering, 4th ed., §4.3).
 * Outside references for the numbers themselves: test/reference/yield-skrf.test.ts and yield-statistics.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { evaluateTargets, madeBoardResponses, parseDesign, runYield, toDb, type DesignDoc } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const NAMES = readdirSync(EX).filter((f) => f.endsWith('.json')).map((f) => f.replace(/\.json$/, '')).sort();

function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(EX, `${name}.json`), 'utf8'), { complete: true });
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
  return r.doc;
}

describe('yield on every example with its own targets and tolerances', () => {
  it('covers every example in assets/examples', () => {
    expect(NAMES.length).toBeGreaterThanOrEqual(6);
  });
  for (const name of NAMES) {
    it(`${name}: every board's worst values are the targets read on its full S; counts, intervals, histograms and envelopes agree`, async () => {
      const doc = example(name);
      expect(doc.targets.length).toBeGreaterThan(0);
      expect(doc.tolerances.length).toBeGreaterThan(0);
      const N = 12;
      const y = await runYield(doc, { samples: N, seed: 4, rankingSamples: 3 });
      const boards = madeBoardResponses(doc, { samples: N, seed: 4 });
      expect(y.freqs).toEqual([...boards.freqs]);
      expect(y.targets.map((t) => t.id)).toEqual(doc.targets.map((t) => t.id));
      let all = 0;
      boards.boards.forEach((b, n) => {
        const ev = evaluateTargets({ freqs: boards.freqs, ports: boards.ports, s: b.s, warnings: [] }, doc);
        ev.results.forEach((r, t) => expect(Object.is(y.targets[t]!.values[n], r.worst.value)).toBe(true));
        if (ev.pass) all++;
      });
      expect(y.overall.passes).toBe(all);
      for (const t of y.targets) {
        const ok = t.values.filter((v) => (t.limit.min === undefined || v >= t.limit.min) && (t.limit.max === undefined || v <= t.limit.max)).length;
        expect(t.passes).toBe(ok);
        expect(t.yield.p).toBe(ok / N);
        expect(t.yield.lo).toBeLessThanOrEqual(t.yield.p);
        expect(t.yield.hi).toBeGreaterThanOrEqual(t.yield.p);
        expect(t.histogram.counts.reduce((a, b) => a + b, 0)).toBe(N);
        for (const v of t.values) expect(Number.isFinite(v)).toBe(true);
      }
      const P = boards.ports.length;
      for (const e of y.envelopes) {
        for (let k = 0; k < y.freqs.length; k++) {
          for (const b of boards.boards) {
            const q = 2 * ((k * P + e.i) * P + e.j);
            const d = toDb(Math.hypot(b.s[q]!, b.s[q + 1]!));
            expect(d).toBeGreaterThanOrEqual(e.min[k]!);
            expect(d).toBeLessThanOrEqual(e.max[k]!);
          }
          expect(e.mean[k]!).toBeGreaterThanOrEqual(e.min[k]! - 1e-9);
          expect(e.mean[k]!).toBeLessThanOrEqual(e.max[k]! + 1e-9);
        }
      }
      expect(y.ranking.entries.length).toBeGreaterThan(0);
    });
  }
});
