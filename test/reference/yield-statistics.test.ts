/**
 * The yield estimate's statistics against outside references:
 *  - normal quantiles (AS 241, Wichura 1988) against scipy.special.ndtri (Debian python3-scipy);
 *  - the Wilson score interval (Wilson 1927) against scipy.stats.binomtest(...).proportion_ci(method='wilson');
 *  - coverage on a case with a closed-form answer: one 50 Ω line made as drawn, εr normal with σ = 0.1, and a
 *    limit on its transmission phase at f0. The phase falls monotonically with εr, so the true yield is
 *    P(εr ≥ εr*) = 1 − Φ((εr* − εr0)/σ), εr* being where the phase meets the limit (found by bisection on the
 *    nominal solver, Φ from scipy.stats.norm.cdf). The 95 % interval must hold it in at least 90 of 100 seeds
 *    (the brief's criterion; about 95 are expected).
 *  - the ledger's first-order sensitivities: with small tolerances the spread of a path's phase over made boards is
 *    φ·√Σ(S_x·σ_x/x)² (first-order propagation of independent errors; S_x from core/layout/paths.ts).
 */
import { describe, expect, it } from 'vitest';
import { execSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  normalQuantile, wilson, runYield, newDesign, sizeDesign, netlistFromSized, solveNetwork, designPaths, pathPhaseMonteCarlo, parseDesign,
  type DesignDoc,
} from '../../core/index.ts';

const PATH = execSync('getconf PATH', { encoding: 'utf8' }).trim();
function py(code: string, input = ''): string {
  const r = spawnSync('python3', ['-c', code], { input, encoding: 'utf8', env: { PATH, HOME: process.env.HOME ?? '/tmp' } });
  if (r.status !== 0) throw new Error(r.stderr);
  return r.stdout;
}

describe('normal quantiles and the Wilson interval against scipy (Debian python3-scipy)', () => {
  it('Φ⁻¹(p) agrees with scipy.special.ndtri to 1e-14 (relative) over 1e-12 … 1 − 1e-12', () => {
    const ps: number[] = [];
    for (let e = -12; e <= -1; e += 0.25) { ps.push(10 ** e, 1 - 10 ** e); }
    for (let p = 0.01; p < 1; p += 0.0137) ps.push(p);
    const want = JSON.parse(py('import json,sys\nfrom scipy.special import ndtri\nprint(json.dumps([float(ndtri(p)) for p in json.load(sys.stdin)]))', JSON.stringify(ps))) as number[];
    ps.forEach((p, i) => expect(Math.abs(normalQuantile(p) - want[i]!)).toBeLessThanOrEqual(1e-14 * Math.max(1, Math.abs(want[i]!))));
  });
  it('Wilson 95 % intervals agree with scipy to 1e-12', () => {
    const cases = [[0, 10], [1, 10], [7, 20], [50, 100], [99, 100], [100, 100], [3, 1000], [731, 1000]];
    const want = JSON.parse(py('import json,sys\nfrom scipy.stats import binomtest\nprint(json.dumps([[r.low, r.high] for r in [binomtest(k, n).proportion_ci(confidence_level=0.95, method="wilson") for k, n in json.load(sys.stdin)]]))', JSON.stringify(cases))) as [number, number][];
    cases.forEach(([k, n], i) => {
      const w = wilson(k!, n!);
      expect(w.lo).toBeCloseTo(want[i]![0], 12);
      expect(w.hi).toBeCloseTo(want[i]![1], 12);
    });
  });
});

/** One 50 Ω line between two ports, as copper numbers (so a change of εr re-sizes nothing). */
function oneLine(er: number): DesignDoc {
  const d = newDesign({ name: 'one line', f0: 2e9, band: { start: 1.9e9, stop: 2.1e9 }, substrate: { er, t: 0 }, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } }); // plain microstrip, as the closed forms here
  d.nodes = [
    { id: 'p1', kind: 'port', at: { x: 0, y: 0 }, zRef: 50, heading: 0 },
    { id: 'p2', kind: 'port', at: { x: 0.02, y: 0 }, zRef: 50, heading: Math.PI },
  ];
  d.segments = [{ id: 'l', kind: 'line', a: 'p1', b: 'p2', width: { by: 'width', width: 3.0e-3 }, length: { by: 'length', length: 0.02 } }];
  return d;
}

function phaseAt(er: number): number {
  const r = solveNetwork(netlistFromSized(sizeDesign(oneLine(er))), [2e9]);
  return (Math.atan2(r.s[5]!, r.s[4]!) * 180) / Math.PI; // S21 (index 1,0)
}

describe('yield interval coverage on a closed-form case', () => {
  it('holds the true yield in at least 90 of 100 seeds (200 boards each)', async () => {
    const er0 = 4.4, sigma = 0.1;
    const limit = phaseAt(er0 + 0.05); // phase ≤ limit ⟺ εr ≥ εr* (the phase falls with εr)
    expect(phaseAt(er0 + 0.1)).toBeLessThan(limit);
    let lo = er0 - 1, hi = er0 + 1;
    for (let i = 0; i < 60; i++) { const m = (lo + hi) / 2; if (phaseAt(m) > limit) lo = m; else hi = m; }
    const erStar = (lo + hi) / 2;
    const pTrue = 1 - Number(py(`from scipy.stats import norm\nprint(repr(float(norm.cdf(${(erStar - er0) / sigma}))))`));
    expect(pTrue).toBeGreaterThan(0.2);
    expect(pTrue).toBeLessThan(0.4);
    const doc: DesignDoc = {
      ...oneLine(er0),
      targets: [{ id: 'phase', figure: 'transmission-phase', ports: ['p1', 'p2'], band: { start: 2e9, stop: 2e9 }, limit: { max: limit } }],
      tolerances: [{ quantity: 'er', distribution: 'normal', spread: sigma, scope: 'board' }],
    };
    let covered = 0;
    for (let seed = 1; seed <= 100; seed++) {
      const y = await runYield(doc, { samples: 200, seed, points: 2, rankingSamples: 0 });
      if (y.overall.yield.lo <= pTrue && pTrue <= y.overall.yield.hi) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(90);
  }, 300_000);
});

describe('path phases of made boards against the ledger\'s first-order sensitivities', () => {
  it('open-stub match, src → load (one width): mean within 4 standard errors, σ within 5 % of φ·√Σ(S_x·σ_x/x)²', async () => {
    const r = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'open-stub-match.json'), 'utf8'), { complete: true });
    if (!r.ok) throw new Error('refused');
    const sx = { er: 0.02, h: 8e-6, W: 10e-6 };
    // Plain microstrip: the ledger's sensitivities are of the line model to εr and h, which field-solution tables of the
    // nominal laminate (the example is sized as made) do not follow.
    const doc: DesignDoc = { ...r.doc, asMade: { sizing: 'microstrip', sideCopper: 'stitched' }, tolerances: [
      { quantity: 'er', distribution: 'normal', spread: sx.er, scope: 'board' },
      { quantity: 'h', distribution: 'normal', spread: sx.h, scope: 'board' },
      { quantity: 'width', distribution: 'normal', spread: sx.W, scope: 'board' },
    ] };
    const sized = sizeDesign(doc);
    const ledger = designPaths(sized, { sensitivities: true })[0]!.paths[0]!;
    const piece = sized.pieces.find((p) => p.id === ledger.pieces[0])!;
    expect(new Set(ledger.pieces.map((id) => sized.pieces.find((p) => p.id === id)!.width)).size).toBe(1);
    const N = 4000;
    const mc = await pathPhaseMonteCarlo(sized, { samples: N, seed: 99 });
    const got = mc.groups[0]!.paths[0]!.stats;
    const s = ledger.sensitivity, phi = ledger.degAtF0;
    const want = phi * Math.hypot(s.er * sx.er / doc.substrate.er, s.h * sx.h / doc.substrate.h, s.W * sx.W / piece.width);
    expect(Math.abs(got.sd - want) / want).toBeLessThan(0.05);
    expect(Math.abs(got.mean - phi)).toBeLessThan(4 * want / Math.sqrt(N));
  });
  it('with zero spreads every board\'s path phase is the ledger\'s, exactly', async () => {
    const r = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'demo.json'), 'utf8'), { complete: true });
    if (!r.ok) throw new Error('refused');
    const doc = { ...r.doc, tolerances: r.doc.tolerances.map((t) => ({ ...t, spread: 0 })) };
    const sized = sizeDesign(doc);
    const mc = await pathPhaseMonteCarlo(sized, { samples: 5, seed: 1 });
    const ledger = designPaths(sized, { sensitivities: false });
    mc.groups.forEach((g, i) => g.paths.forEach((p, k) => {
      expect(p.stats.min).toBe(ledger[i]!.paths[k]!.degAtF0);
      expect(p.stats.max).toBe(ledger[i]!.paths[k]!.degAtF0);
    }));
  });
});
