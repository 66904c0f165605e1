/**
 * A design sized as made (design `asMade`, the milled branch-line example: its lines sized from the field solver's
 * tables of the end mill's cut) has its yield analysed with those same lines, through the line-model interface
 * (core/yield/board-lines.ts), not with plain microstrip:
 *  - the yield's nominal figures are, to the last bit, the targets (core/network/targets.ts, the one evaluation
 *    `build` uses) read on the design's own network from the pipeline — the netlist every sweep solves;
 *  - with every tolerance's spread set to 0, every made board's figures are the nominal ones exactly, in the network
 *    yield and in the fast path-phase estimate (which gives the path ledger's phases, and not plain microstrip's).
 * These are consistency checks of one design through two routes; the numbers themselves are checked against
 * outside sources in test/reference/yield-skrf.test.ts (scikit-rf) and test/unit/section-*.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  DesignPipeline, designPaths, evaluateTargets, madeBoardResponses, parseDesign, pathPhaseMonteCarlo, runYield, sizeDesign,
  solveNetwork, type DesignDoc,
} from '../../core/index.ts';

function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', `${name}.json`), 'utf8'), { complete: true });
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
  return r.doc;
}

const withoutSpread = (doc: DesignDoc): DesignDoc => ({ ...doc, tolerances: doc.tolerances.map((t) => ({ ...t, spread: 0 })) });

describe('the yield of a design sized as made uses its as-made lines', () => {
  const doc = example('branchline-10g4');

  it('the example is milled and sized as made (the premise of the checks below)', () => {
    expect(doc.process.kind).toBe('end-mill');
    expect(doc.asMade?.sizing).toBe('as-made');
    expect(sizeDesign(doc).lineOptions?.crossSection).toBeDefined();
  });

  it('its nominal figures equal the targets read on the pipeline\'s network, bit for bit', async () => {
    const y = await runYield(doc, { samples: 2, seed: 3, rankingSamples: 0 });
    const sweep = solveNetwork(new DesignPipeline().netlist(doc), y.freqs);
    const ev = evaluateTargets(sweep, doc);
    y.targets.forEach((t, i) => {
      expect(Object.is(t.nominal.worst.value, ev.results[i]!.worst.value)).toBe(true);
      expect(t.nominal.worst.freq).toBe(ev.results[i]!.worst.freq);
    });
    // The envelopes' nominal traces are the same network's |S| in dB (20·log10|S|, Pozar, Microwave Engineering, §4.3).
    expect(y.envelopes.length).toBeGreaterThan(0);
    const P = sweep.ports.length;
    for (const e of y.envelopes) e.nominal.forEach((db, k) => {
      const q = 2 * ((k * P + e.i) * P + e.j);
      expect(db).toBeCloseTo(20 * Math.log10(Math.hypot(sweep.s[q]!, sweep.s[q + 1]!)), 12);
    });
  });

  it('with zero tolerances every board is the nominal board exactly (network yield and made boards\' S)', async () => {
    const flat = withoutSpread(doc);
    const y = await runYield(flat, { samples: 5, seed: 9, rankingSamples: 0 });
    for (const t of y.targets) for (const v of t.values) expect(Object.is(v, t.nominal.worst.value)).toBe(true);
    const boards = madeBoardResponses(flat, { samples: 2, seed: 9 });
    const nominal = solveNetwork(new DesignPipeline().netlist(flat), boards.freqs);
    for (const b of boards.boards) expect(Array.from(b.s)).toEqual(Array.from(nominal.s));
  });

  it('the fast path-phase estimate gives the ledger\'s phases with zero tolerances, not plain microstrip\'s', async () => {
    const sized = sizeDesign(withoutSpread(doc));
    const ledger = designPaths(sized, { sensitivities: false });
    expect(ledger.length).toBeGreaterThan(0);
    const est = await pathPhaseMonteCarlo(sized, { samples: 4, seed: 1 });
    // Plain microstrip (no cross-section tables) at the same widths and lengths, for contrast.
    const plain = await pathPhaseMonteCarlo(sized, { samples: 1, seed: 1, line: {} });
    est.groups.forEach((g, i) => g.paths.forEach((p, k) => {
      const want = ledger[i]!.paths[k]!.degAtF0;
      expect(p.nominalDeg).toBe(want);
      expect(p.stats.min).toBeCloseTo(want, 9);
      expect(p.stats.max).toBeCloseTo(want, 9);
      expect(Math.abs(plain.groups[i]!.paths[k]!.stats.mean - want)).toBeGreaterThan(0.1);
    }));
  });
});
