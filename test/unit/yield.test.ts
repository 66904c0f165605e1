/**
 * The yield estimate (core/yield) and the target evaluation (core/network/targets.ts): generator streams, draws,
 * exactness with zero tolerances, determinism, cancellation and progress, and the targets on hand-made responses.
 * Outside references: xoshiro128**'s reference C code (D. Blackman and S. Vigna, ACM TOMS 47(4), 2021), transcribed
 * to Python below and run by Debian's python3; return loss and insertion loss as in D. M. Pozar, Microwave
 * Engineering, 4th ed., §4.3; the ideal quarter-wave transformer (Pozar §2.5) for a matched line.
 */
import { describe, expect, it } from 'vitest';
import { execSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  Xoshiro128ss, ToleranceDraws, runYield, evaluateTargets, parseDesign, sizeDesign, netlistFromSized, solveNetwork, targetFrequencies,
  bandSweep, lnExact, summary, idealLine, temLengthForDegrees, type DesignDoc, type NetworkResponse, type Target, type Tolerance,
} from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(EX, `${name}.json`), 'utf8'), { complete: true });
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
  return r.doc;
}
const NAMES = ['demo', 'wilkinson-2g45', 'branchline-10g4', 'open-stub-match', 'shorted-stub-match', 'three-section-transformer'];

describe('xoshiro128** generator', () => {
  it('gives the outputs of the reference C code for state {1, 2, 3, 4} (transcribed to Python, Debian python3)', () => {
    const py = `
M = 0xffffffff
s = [1, 2, 3, 4]
rotl = lambda x, k: ((x << k) | (x >> (32 - k))) & M
out = []
for _ in range(20):
    r = (rotl((s[1] * 5) & M, 7) * 9) & M
    t = (s[1] << 9) & M
    s[2] ^= s[0]; s[3] ^= s[1]; s[1] ^= s[2]; s[0] ^= s[3]; s[2] ^= t; s[3] = rotl(s[3], 11)
    out.append(r)
print(out)`;
    const PATH = execSync('getconf PATH', { encoding: 'utf8' }).trim();
    const r = spawnSync('python3', ['-c', py], { encoding: 'utf8', env: { PATH } });
    const want = JSON.parse(r.stdout) as number[];
    const g = new Xoshiro128ss(1, 2, 3, 4);
    expect(want.map(() => g.nextU32())).toEqual(want);
  });
  it('a seed and stream fix the numbers; other streams and seeds give others', () => {
    const take = (seed: number, stream: number) => { const g = Xoshiro128ss.fromSeed(seed, stream); return Array.from({ length: 8 }, () => g.uniform()); };
    expect(take(7, 3)).toEqual(take(7, 3));
    expect(take(7, 3)).not.toEqual(take(7, 4));
    expect(take(8, 3)).not.toEqual(take(7, 3));
    for (const u of take(1, 1)) { expect(u).toBeGreaterThan(0); expect(u).toBeLessThan(1); }
  });
  it('uniforms have mean ½ and variance 1/12 (10 000 draws, within 4 standard errors)', () => {
    const g = Xoshiro128ss.fromSeed(123, 9);
    const u = Float64Array.from({ length: 10_000 }, () => g.uniform());
    const s = summary(u);
    expect(Math.abs(s.mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / 1e4));
    expect(Math.abs(s.sd * s.sd - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / 1e4));
  });
  it('lnExact agrees with Math.log to 1e-15 (relative) from 1e-300 to 1e300', () => {
    for (let e = -300; e <= 300; e += 7) for (const m of [1, 1.3, 2.9, 7.7]) {
      const x = m * 10 ** e;
      expect(Math.abs(lnExact(x) - Math.log(x))).toBeLessThanOrEqual(1e-15 * Math.max(1, Math.abs(Math.log(x))));
    }
  });
});

describe('tolerance draws', () => {
  const tols: Tolerance[] = [
    { quantity: 'er', distribution: 'normal', spread: 0.1, scope: 'board' },
    { quantity: 'width', distribution: 'uniform', spread: 1e-5, scope: 'piece' },
  ];
  it('normal draws have σ = spread, uniform draws stay within ±spread with variance a²/3 (4000 boards)', () => {
    const d = new ToleranceDraws(tols, 5, 11);
    const er: number[] = [], w: number[] = [];
    for (let n = 0; n < 4000; n++) { d.next(); er.push(d.at(0, 3)); for (let i = 0; i < 5; i++) w.push(d.at(1, i)); }
    const se = summary(er), sw = summary(w);
    expect(Math.abs(se.mean)).toBeLessThan(4 * 0.1 / Math.sqrt(4000));
    expect(Math.abs(se.sd - 0.1) / 0.1).toBeLessThan(0.05);
    expect(sw.max).toBeLessThanOrEqual(1e-5);
    expect(sw.min).toBeGreaterThanOrEqual(-1e-5);
    expect(Math.abs(sw.sd * sw.sd - 1e-10 / 3) / (1e-10 / 3)).toBeLessThan(0.05);
  });
  it('a board-wide draw is shared by every piece; a per-piece one differs between pieces', () => {
    const d = new ToleranceDraws(tols, 4, 2);
    d.next();
    expect(new Set([0, 1, 2, 3].map((i) => d.at(0, i))).size).toBe(1);
    expect(new Set([0, 1, 2, 3].map((i) => d.at(1, i))).size).toBe(4);
  });
  it('adding a tolerance leaves the other tolerances\' draws unchanged (one stream each)', () => {
    const a = new ToleranceDraws([tols[0]!], 3, 5), b = new ToleranceDraws([{ quantity: 'h', distribution: 'normal', spread: 1e-5, scope: 'board' }, tols[0]!], 3, 5);
    for (let n = 0; n < 10; n++) { a.next(); b.next(); expect(b.at(1, 0)).toBe(a.at(0, 0)); }
  });
});

describe('zero tolerances give exactly the nominal figures', () => {
  for (const name of NAMES) {
    it(`${name}: every board's worst values equal the nominal board's, bit for bit`, async () => {
      const doc = example(name);
      const zero = { ...doc, tolerances: doc.tolerances.map((t) => ({ ...t, spread: 0 })) };
      const y = await runYield(zero, { samples: 3, seed: 1, rankingSamples: 0 });
      const freqs = targetFrequencies(bandSweep(doc.frequency.band, doc.frequency.f0, 201), doc.targets);
      const nominal = evaluateTargets(solveNetwork(netlistFromSized(sizeDesign(doc)), freqs), doc);
      y.targets.forEach((t, i) => { for (const v of t.values) expect(Object.is(v, nominal.results[i]!.worst.value)).toBe(true); });
      // The envelopes collapse onto the nominal curve.
      for (const e of y.envelopes) { expect(e.min).toEqual(e.nominal); expect(e.max).toEqual(e.nominal); }
    });
  }
});

describe('every example meets its own targets on the nominal board', () => {
  for (const name of NAMES) {
    it(name, () => {
      const doc = example(name);
      expect(doc.targets.length).toBeGreaterThan(0);
      expect(doc.tolerances.length).toBeGreaterThan(0);
      const freqs = targetFrequencies(bandSweep(doc.frequency.band, doc.frequency.f0, 201), doc.targets);
      const ev = evaluateTargets(solveNetwork(netlistFromSized(sizeDesign(doc)), freqs), doc);
      expect(ev.results.filter((r) => !r.pass).map((r) => r.name)).toEqual([]);
    });
  }
});

describe('runYield', () => {
  const doc = example('three-section-transformer');
  it('the same seed gives the same result; another seed other boards', async () => {
    const a = await runYield(doc, { samples: 40, seed: 5, rankingSamples: 10 });
    const b = await runYield(doc, { samples: 40, seed: 5, rankingSamples: 10 });
    const c = await runYield(doc, { samples: 40, seed: 6, rankingSamples: 10 });
    expect(b).toEqual(a);
    expect(c.targets[0]!.values).not.toEqual(a.targets[0]!.values);
  });
  it('yield counts passing boards, its interval holds it, and a stricter limit never passes more boards', async () => {
    const a = await runYield(doc, { samples: 60, seed: 3, rankingSamples: 0 });
    const strict = { ...doc, targets: doc.targets.map((t) => ({ ...t, limit: { min: (t.limit.min ?? 0) + 2 } })) };
    const b = await runYield(strict, { samples: 60, seed: 3, rankingSamples: 0 });
    const t = a.targets[0]!;
    expect(t.passes).toBe(t.values.filter((v) => v >= doc.targets[0]!.limit.min!).length);
    expect(t.yield.lo).toBeLessThanOrEqual(t.yield.p);
    expect(t.yield.hi).toBeGreaterThanOrEqual(t.yield.p);
    expect(b.targets[0]!.passes).toBeLessThanOrEqual(t.passes);
    expect(t.histogram.counts.reduce((x, y) => x + y, 0)).toBe(60);
  });
  it('ranks the tolerances: shares per target sum to 1, and a tolerance with no spread is not ranked', async () => {
    const d = { ...doc, tolerances: [...doc.tolerances.filter((x) => x.quantity !== 'tanDelta'), { quantity: 'tanDelta' as const, distribution: 'normal' as const, spread: 0, scope: 'board' as const }] };
    const r = await runYield(d, { samples: 30, seed: 2, rankingSamples: 30 });
    const sum = r.ranking.entries.reduce((s, e) => s + e.shares[0]!, 0);
    expect(sum).toBeCloseTo(1, 12);
    expect(r.ranking.entries.map((e) => e.quantity)).not.toContain('tanDelta');
    for (let i = 1; i < r.ranking.entries.length; i++) expect(r.ranking.entries[i]!.score).toBeLessThanOrEqual(r.ranking.entries[i - 1]!.score);
  });
  it('reports progress up to the total and stops with an AbortError when cancelled', async () => {
    const seen: number[] = [];
    await runYield(doc, { samples: 32, seed: 1, rankingSamples: 0, chunk: 8, onProgress: (d, t) => { seen.push(d); expect(t).toBe(32); } });
    expect(seen).toEqual([8, 16, 24, 32]);
    const ctl = new AbortController();
    const run = runYield(doc, { samples: 400, seed: 1, chunk: 4, signal: ctl.signal, onProgress: (d) => { if (d >= 8) ctl.abort(); } });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
  });
  it('refuses what it cannot estimate: no targets, a bad sample count or seed', async () => {
    await expect(runYield({ ...doc, targets: [] }, { samples: 5, seed: 1 })).rejects.toThrow(/targets: expected at least one target/);
    await expect(runYield(doc, { samples: 0, seed: 1 })).rejects.toThrow(/samples/);
    await expect(runYield(doc, { samples: 5, seed: -1 })).rejects.toThrow(/seed/);
  });
  it('names a tolerance that does not apply to the process instead of using it', async () => {
    const d = { ...doc, tolerances: [...doc.tolerances, { quantity: 'etch-bias' as const, distribution: 'normal' as const, spread: 1e-5, scope: 'board' as const }] };
    const r = await runYield(d, { samples: 4, seed: 1, rankingSamples: 0 });
    expect(r.ignored.map((x) => x.quantity)).toEqual(['etch-bias']);
  });
});

describe('evaluateTargets', () => {
  // A 70.71 Ω quarter-wave from 50 Ω to 100 Ω: matched at f0, |S11| rising away from it (Pozar §2.5).
  const f0 = 1e9;
  const net = { elements: [{ kind: 'line' as const, id: 't', a: 'p1', b: 'p2', length: temLengthForDegrees(90, f0), model: idealLine(Math.SQRT2 * 50) }],
    ports: [{ name: 'p1', node: 'p1', zRef: 50 }, { name: 'p2', node: 'p2', zRef: 100 }] };
  const r: NetworkResponse = solveNetwork(net, [0.8e9, 0.9e9, 1e9, 1.1e9, 1.2e9]);
  const t = (x: Partial<Target>): Target => ({ id: 'x', figure: 'return-loss', ports: ['p1'], band: { start: 0.9e9, stop: 1.1e9 }, limit: { min: 10 }, ...x });
  const doc = (targets: Target[]) => ({ targets, phaseGroups: [] });
  it('return loss: the worst point of the band is its edge, where |S11| is largest', () => {
    const ev = evaluateTargets(r, doc([t({})]));
    const rl = (k: number) => -20 * Math.log10(Math.hypot(r.s[8 * k]!, r.s[8 * k + 1]!));
    const res = ev.results[0]!;
    expect(res.points).toBe(3);
    expect(res.worst.value).toBeCloseTo(Math.min(rl(1), rl(3)), 12);
    expect(res.margin).toBeCloseTo(res.worst.value - 10, 12);
    expect(res.pass).toBe(res.worst.value >= 10);
  });
  it('insertion loss and transmission are the same |S21| read two ways; a two-sided limit takes the nearer side', () => {
    const il = evaluateTargets(r, doc([t({ figure: 'insertion-loss', ports: ['p1', 'p2'], limit: { max: 0.5 } })])).results[0]!;
    const tr = evaluateTargets(r, doc([t({ figure: 'transmission', ports: ['p1', 'p2'], limit: { min: -0.5 } })])).results[0]!;
    expect(tr.worst.value).toBeCloseTo(-il.worst.value, 12);
    expect(il.pass && tr.pass).toBe(true);
    // Between −0.5 and −0.001 dB the matched centre (|S21| = 1, 0 dB) is nearest the upper side and misses it.
    const two = evaluateTargets(r, doc([t({ figure: 'transmission', ports: ['p1', 'p2'], limit: { min: -0.5, max: -0.001 } })])).results[0]!;
    expect(two.worst.freq).toBe(f0);
    expect(two.pass).toBe(false);
    expect(two.margin).toBeCloseTo(-0.001 - two.worst.value, 12);
  });
  it('transmission phase at f0 of a 90° line reads −90°', () => {
    const res = evaluateTargets(r, doc([t({ figure: 'transmission-phase', ports: ['p1', 'p2'], band: { start: f0, stop: f0 }, limit: { min: -91, max: -89 } })])).results[0]!;
    expect(res.worst.value).toBeCloseTo(-90, 9);
    expect(res.pass).toBe(true);
  });
  it('a band with no sweep point is an error naming the target', () => {
    expect(() => evaluateTargets(r, doc([t({ band: { start: 2e9, stop: 3e9 } })]))).toThrow(/targets\[0\]\.band: expected a band that holds at least one sweep point/);
  });
  it('targetFrequencies adds the band edges to the sweep', () => {
    const f = targetFrequencies({ start: 1e9, stop: 2e9, points: 3 }, [t({ band: { start: 1.2e9, stop: 1.2e9 } })]);
    expect([...f]).toEqual([1e9, 1.2e9, 1.5e9, 2e9]);
  });
});
