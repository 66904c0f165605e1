/**
 * The examples' notes state the project's own figures (issue 14, fault 13): the demo's path length and loss are
 * what the path report gives, and the transformer's band is what its sweep gives. The ideal-line bandwidth is the
 * binomial transformer's |Γ| ≈ 2^N·|A|·|cos θ|^N with A = 2^−(N+1)·ln(ZL/Z0) (D. M. Pozar, Microwave Engineering,
 * 4th ed., §5.6); |Γ| = 0.05 is −26.02 dB return loss (20·log10 0.05).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, sizeDesign, designPaths, netlistFromSized, solveNetwork, returnLoss, sweepFrequencies, type DesignDoc } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(EX, `${name}.json`), 'utf8'));
  if (!r.ok) throw new Error(r.errors[0]!.message);
  return r.doc;
}

describe('example notes say what the project computes', () => {
  it('demo: the path length and loss in its notes are the path report\'s', () => {
    const doc = example('demo');
    const m = /each path is about (\d+) mm of FR-4 at 5\.8 GHz and loses about ([\d.]+) dB in its lines \(`stripwright build`: ([\d.]+) mm, ([\d.]+) dB\)/.exec(doc.notes ?? '');
    expect(m).not.toBeNull();
    const [rep] = designPaths(sizeDesign(doc));
    for (const p of rep!.paths) {
      expect((p.physicalLength * 1e3).toFixed(2)).toBe(m![3]);
      expect(p.lossDb.toFixed(2)).toBe(m![4]);
      expect(Math.round(p.physicalLength * 1e3)).toBe(Number(m![1]));
      expect(p.lossDb.toFixed(1)).toBe(m![2]);
    }
  });
  it('three-section transformer: the ideal-line bandwidth and the swept band in its notes', () => {
    const doc = example('three-section-transformer');
    const notes = doc.notes ?? '';
    const ideal = /across about ±(\d+) % of f0 with ideal lines/.exec(notes);
    const swept = /keeps it below −26 dB from ([\d.]+) to ([\d.]+) GHz/.exec(notes);
    expect(ideal).not.toBeNull();
    expect(swept).not.toBeNull();
    // Binomial formula, N = 3, 50 Ω → 12.5 Ω: |cos θ|³ = 0.05 / (2³·|A|) at the band edge.
    const N = 3, A = Math.abs(2 ** -(N + 1) * Math.log(12.5 / 50));
    const theta = Math.acos(Math.cbrt(0.05 / (2 ** N * A)));
    expect(Math.round(100 * (1 - theta / (Math.PI / 2)))).toBe(Number(ideal![1]));
    // The project's own sweep, 1 MHz steps: the band around f0 where |S11| stays below 0.05.
    const sized = sizeDesign(doc);
    const freqs = sweepFrequencies({ start: 1e9, stop: 4e9, points: 3001 });
    const rl = returnLoss(solveNetwork(netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {}), freqs), 0);
    const limit = -20 * Math.log10(0.05);
    let k = 0;
    freqs.forEach((f, i) => { if (Math.abs(f - doc.frequency.f0) < Math.abs(freqs[k]! - doc.frequency.f0)) k = i; });
    let lo = k, hi = k;
    while (lo > 0 && rl[lo - 1]! >= limit) lo--;
    while (hi < freqs.length - 1 && rl[hi + 1]! >= limit) hi++;
    expect((freqs[lo]! / 1e9).toFixed(2)).toBe(swept![1]);
    expect((freqs[hi]! / 1e9).toFixed(2)).toBe(swept![2]);
  });
});
