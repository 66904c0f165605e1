/**
 * The group-delay flatness target (core/network/targets.ts), checked against the closed form of a series inductor
 * between two matched ports: S21 = 2Z0 / (2Z0 + jωL) (the S-parameters of a series impedance, D. M. Pozar, Microwave
 * Engineering, 4th ed., 2012, §4.3), so φ = −atan(ωL/2Z0) and τg = −dφ/dω = (L/2Z0) / (1 + (ωL/2Z0)²), which falls
 * with frequency: over a band its flatness is τg(start) − τg(stop). The scenario is our own.
 */
import { describe, expect, it } from 'vitest';
import { evaluateTarget, solveNetwork, sweepFrequencies, parseDesign, serializeDesign, TARGET_FIGURES, type Target, type DesignDoc } from '../../core/index.ts';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

const Z0 = 50, L = 5e-9;
const tau = (f: number) => { const a = L / (2 * Z0), x = 2 * Math.PI * f * a; return a / (1 + x * x); };
const response = () => solveNetwork({
  elements: [{ kind: 'inductor', id: 'L1', a: 'p1', b: 'p2', value: L }],
  ports: [{ name: 'p1', node: 'p1', zRef: Z0 }, { name: 'p2', node: 'p2', zRef: Z0 }],
}, sweepFrequencies({ start: 0.5e9, stop: 3.5e9, points: 3001 }));
const target = (max: number): Target => ({ id: 'gd', figure: 'group-delay-flatness', ports: ['p1', 'p2'], band: { start: 1e9, stop: 3e9 }, limit: { max } });

describe('group-delay flatness target', () => {
  const r = response();
  it('reads the band\'s peak-to-peak group delay of a series inductor, in ns (closed form, 0.1 %)', () => {
    const want = (tau(1e9) - tau(3e9)) * 1e9;
    const got = evaluateTarget(r, target(1), { phaseGroups: [] });
    expect(got.unit).toBe('ns');
    expect(got.worst.value).toBeGreaterThan(0.01); // a real variation to read
    expect(Math.abs(got.worst.value - want) / want).toBeLessThan(1e-3);
    expect(got.worst.freq).toBeCloseTo(1e9, -6); // the largest delay is at the band's low edge
    expect(got.limitText).toBe('≤ 1 ns');
  });
  it('fails a limit tighter than the variation and passes a looser one', () => {
    const want = (tau(1e9) - tau(3e9)) * 1e9;
    expect(evaluateTarget(r, target(want * 0.9), { phaseGroups: [] }).pass).toBe(false);
    expect(evaluateTarget(r, target(want * 1.1), { phaseGroups: [] }).pass).toBe(true);
  });
  it('is part of the design\'s one target schema: a design with it loads and saves unchanged', () => {
    expect(TARGET_FIGURES).toContain('group-delay-flatness');
    const r0 = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'wilkinson-2g45.json'), 'utf8'));
    if (!r0.ok) throw new Error('example refused');
    const g = r0.doc.phaseGroups[0]!;
    const doc: DesignDoc = { ...r0.doc, targets: [...r0.doc.targets, { id: 'gd1', figure: 'group-delay-flatness', ports: [g.from, g.to[0]!], band: r0.doc.frequency.band, limit: { max: 0.05 } }] };
    const back = parseDesign(serializeDesign(doc));
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.doc.targets.at(-1)).toEqual(doc.targets.at(-1));
    const bad = parseDesign(serializeDesign({ ...doc, targets: [...r0.doc.targets, { id: 'gd2', figure: 'group-delay-flatness', ports: [g.from], band: r0.doc.frequency.band, limit: { max: 0.05 } }] }));
    expect(bad.ok).toBe(false); // two ports, like the other transmission figures
  });
});
