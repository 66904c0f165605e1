/**
 * Tuning (core/network/tune): a deliberately detuned shunt single-stub match and a detuned branch-line coupler are
 * tuned back, and their response at f0 is compared with the untuned designs, whose lengths and impedances are the
 * textbook ones (D. M. Pozar, Microwave Engineering, 4th ed., 2012: §5.2 shunt single-stub equations; §7.5 the
 * quadrature hybrid, Z0/√2 through arms and Z0 shunt arms of λ/4, S21 = −j/√2, S31 = −1/√2). The test rebuilds
 * the §5.2 solution from the equations itself. Responses come from a fresh nodal solve of each design.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, sizeDesign, netlistFromSized, solveNetwork, tuneDesign, minimiseInBox, type DesignDoc, type Target } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const load = (name: string): DesignDoc => {
  const r = parseDesign(readFileSync(join(EX, name), 'utf8'));
  if (!r.ok) throw new Error(`${name} refused`);
  return r.doc;
};
const setSeg = (d: DesignDoc, f: (s: DesignDoc['segments'][number]) => DesignDoc['segments'][number]): DesignDoc => ({ ...d, segments: d.segments.map(f) });

/** |S(to, from)| in dB at f. */
function sDb(doc: DesignDoc, to: string, from: string, f: number): number {
  const s = sizeDesign(doc);
  const r = solveNetwork(netlistFromSized(s.problems.length ? { ...s, problems: [] } : s, { line: s.lineOptions }), [f]);
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === from), j = r.ports.findIndex((p) => p.name === to);
  const x = 2 * (j * P + i);
  return 20 * Math.log10(Math.hypot(r.s[x]!, r.s[x + 1]!));
}

describe('tuning a detuned single-stub match back (Pozar §5.2)', () => {
  const ideal = load('open-stub-match.json');
  const f0 = ideal.frequency.f0;
  it('the untuned example is the textbook solution (Pozar §5.2, eqs. for t, d and the open stub, rebuilt here)', () => {
    // R_L = 100 Ω, X_L = 0, Z0 = 50 Ω: t = ±√(R_L((Z0 − R_L)² + X_L²)/Z0)/(R_L − Z0); the t < 0 root: d/λ = (π + atan t)/2π.
    const RL = 100, Z0 = 50;
    const t = -Math.sqrt(RL * ((Z0 - RL) ** 2) / Z0) / (RL - Z0);
    const dDeg = ((Math.PI + Math.atan(t)) / (2 * Math.PI)) * 360;
    const B = (RL * RL * t - Z0 * (Z0 * t)) / (Z0 * (RL * RL + (Z0 * t) ** 2));
    const lDeg = (-Math.atan(B * Z0) / (2 * Math.PI)) * 360;
    const seg = (id: string) => ideal.segments.find((s) => s.id === id)!;
    const deg = (id: string) => { const s = seg(id); return s.kind === 'line' && s.length.by === 'degrees' ? s.length.deg : NaN; };
    expect(deg('toload')).toBeCloseTo(dDeg, 3);
    expect(deg('stub')).toBeCloseTo(lDeg < 0 ? lDeg + 180 : lDeg, 3);
  });
  it('comes back within 0.2 dB of the untuned ideal at f0, and repeats for a seed', async () => {
    const detuned = setSeg(ideal, (s) => (s.kind === 'line' && s.id === 'toload' ? { ...s, length: { by: 'degrees', deg: 140 } } : s.kind === 'line' && s.id === 'stub' ? { ...s, length: { by: 'degrees', deg: 44 } } : s));
    const goal: Target = { id: 'g', figure: 'return-loss', ports: ['src'], band: { start: f0, stop: f0 }, limit: { min: 35 } };
    const opts = { variables: [{ segments: ['toload'], quantity: 'degrees' as const, min: 90, max: 170 }, { segments: ['stub'], quantity: 'degrees' as const, min: 20, max: 70 }], goals: [{ target: goal, weight: 1 }], seed: 4, points: 21 };
    expect(sDb(detuned, 'src', 'src', f0)).toBeGreaterThan(-15);
    const r = await tuneDesign(detuned, opts);
    expect(sDb(r.doc, 'src', 'src', f0)).toBeLessThan(-30);
    expect(Math.abs(sDb(r.doc, 'load', 'src', f0) - sDb(ideal, 'load', 'src', f0))).toBeLessThanOrEqual(0.2);
    expect(r.after.pass).toBe(true);
    const again = await tuneDesign(detuned, opts);
    expect(again.variables.map((v) => v.after)).toEqual(r.variables.map((v) => v.after));
  }, 60_000);
});

describe('tuning a detuned branch-line coupler back (Pozar §7.5)', () => {
  // Sized as plain microstrip, as when this check was written (the example is sized as made, where the same detuning
  // moves the split less than the 0.25 dB this check starts from).
  const ideal: DesignDoc = { ...load('branchline-10g4.json'), asMade: { sizing: 'microstrip', sideCopper: 'stitched' } };
  const f0 = ideal.frequency.f0;
  it('comes back within 0.2 dB of the untuned ideal at f0 on both outputs', async () => {
    const detuned = setSeg(ideal, (s) => {
      if (s.kind !== 'line' || s.length.by !== 'degrees' || s.width.by !== 'z0') return s;
      return { ...s, width: { by: 'z0', z0: s.width.z0 * 1.2 }, length: { by: 'degrees', deg: 99 } };
    });
    const at = { start: f0, stop: f0 };
    const goals: { target: Target; weight: number }[] = [
      { target: { id: 'rl', figure: 'return-loss', ports: ['p1'], band: at, limit: { min: 30 } }, weight: 1 },
      { target: { id: 'iso', figure: 'isolation', ports: ['p1', 'p4'], band: at, limit: { min: 30 } }, weight: 1 },
      { target: { id: 'bal', figure: 'amplitude-balance', group: 'quadrature', band: at, limit: { max: 0.05 } }, weight: 4 },
    ];
    const r = await tuneDesign(detuned, {
      variables: [
        { segments: ['thru1', 'thru2'], quantity: 'z0', min: 28, max: 45 },
        { segments: ['shunt1', 'shunt2'], quantity: 'z0', min: 38, max: 62 },
        { segments: ['thru1', 'thru2'], quantity: 'degrees', min: 75, max: 105 },
        { segments: ['shunt1', 'shunt2'], quantity: 'degrees', min: 75, max: 105 },
      ],
      goals, seed: 1, points: 21,
    });
    const miss = (d: DesignDoc) => Math.max(...['p2', 'p3'].map((o) => Math.abs(sDb(d, o, 'p1', f0) - sDb(ideal, o, 'p1', f0))));
    expect(miss(detuned)).toBeGreaterThan(0.25);
    expect(sDb(detuned, 'p1', 'p1', f0)).toBeGreaterThan(-20);
    for (const out of ['p2', 'p3']) {
      expect(Math.abs(sDb(r.doc, out, 'p1', f0) - sDb(ideal, out, 'p1', f0)), `tuned ${out}`).toBeLessThanOrEqual(0.2);
      // Pozar §7.5: |S21| = |S31| = 1/√2 (−3.01 dB) for the lossless hybrid; our lines lose a little.
      expect(sDb(r.doc, out, 'p1', f0)).toBeGreaterThan(-3.01 - 0.5);
    }
  }, 120_000);
});

describe('cancelling a tune', () => {
  it('stops with an AbortError when the signal fires', async () => {
    const d = load('open-stub-match.json');
    const ctl = new AbortController();
    ctl.abort(Object.assign(new Error('stopped'), { name: 'AbortError' }));
    await expect(tuneDesign(d, { variables: [{ segments: ['stub'], quantity: 'degrees', min: 20, max: 70 }], signal: ctl.signal, points: 11 })).rejects.toThrow('stopped');
  });
});

describe('the simplex search (Nelder & Mead 1965)', () => {
  it('finds the minimum of a smooth bowl in the box, and the same point for the same seed', async () => {
    const bowl = (x: number[]) => (x[0]! - 0.3) ** 2 + 2 * (x[1]! - 0.7) ** 2 + (x[2]! - 0.5) ** 2;
    const a = await minimiseInBox(bowl, [0.9, 0.1, 0.9], { maxEvaluations: 2000, costTolerance: 1e-14, sizeTolerance: 1e-8, seed: 5 });
    expect(a.x[0]).toBeCloseTo(0.3, 4); expect(a.x[1]).toBeCloseTo(0.7, 4); expect(a.x[2]).toBeCloseTo(0.5, 4);
    const b = await minimiseInBox(bowl, [0.9, 0.1, 0.9], { maxEvaluations: 2000, costTolerance: 1e-14, sizeTolerance: 1e-8, seed: 5 });
    expect(b).toEqual(a);
  });
  it('stays in the box when the minimum lies outside it', async () => {
    const r = await minimiseInBox((x) => (x[0]! - 1.5) ** 2, [0.2], { maxEvaluations: 500, costTolerance: 1e-14, sizeTolerance: 1e-9, seed: 1 });
    expect(r.x[0]).toBeCloseTo(1, 6);
  });
  it('stops when told to (cancel)', async () => {
    const r = await minimiseInBox((x) => (x[0]! - 0.37) ** 2 + 1, [0.8], { maxEvaluations: 500, costTolerance: 0, sizeTolerance: 0, seed: 1, onIteration: (_, n) => n < 10 });
    expect(r.stopped).toBe('cancelled');
  });
});
