/**
 * Phase groups with wanted offsets: a branch-line hybrid's coupled port lags its through port by 90°, so its
 * path from the input is a quarter-wave longer (Pozar, Microwave Engineering, 4th ed., §7.5: S21 = −j/√2,
 * S31 = −1/√2). The example assets/examples/branchline-10g4.json asks for that with offsetsDeg [0, 90].
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, serializeDesign, type DesignDoc } from '../../core/design/index.ts';
import { designPaths, sizeDesign } from '../../core/layout/index.ts';

const text = readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'branchline-10g4.json'), 'utf8');
function load(): DesignDoc {
  const r = parseDesign(text);
  if (!r.ok) throw new Error(r.errors.map((e) => e.path).join(', '));
  return r.doc;
}

describe('phase groups with wanted offsets', () => {
  it('the branch-line paths meet their 90° quadrature target within ±2°', () => {
    const [report] = designPaths(sizeDesign(load()));
    expect(report!.paths.map((p) => p.to)).toEqual(['p2', 'p3']);
    const coupled = report!.paths[1]!;
    expect(coupled.targetDeg).toBe(90);
    // Each arm is 90° at f0 (the example's own spec); the coupled route runs one arm more than the through route.
    expect(coupled.phaseDiffDeg).toBeCloseTo(90, 0);
    expect(report!.paths.every((p) => p.withinTolerance)).toBe(true);
    expect(report!.warnings.filter((w) => w.code === 'phase' && w.severity === 'warning')).toEqual([]);
  });

  it('the same paths judged as in-phase are 90° out and the warning says by how much to change which', () => {
    const doc = load();
    const g = doc.phaseGroups[0]!;
    const { offsetsDeg: _dropped, ...inPhase } = g;
    const [report] = designPaths(sizeDesign({ ...doc, phaseGroups: [inPhase] }));
    expect(report!.paths[1]!.withinTolerance).toBe(false);
    const w = report!.warnings.find((x) => x.code === 'phase' && x.severity === 'warning');
    expect(w?.message).toMatch(/input → coupled is 90\.0° from input → through at f0, outside ±2°; shorten it by 90\.0°/);
  });

  it('a wrong wanted offset is flagged with the wanted value in the message', () => {
    const doc = load();
    const g = { ...doc.phaseGroups[0]!, offsetsDeg: [0, 45] };
    const [report] = designPaths(sizeDesign({ ...doc, phaseGroups: [g] }));
    expect(report!.paths[1]!.withinTolerance).toBe(false);
    expect(report!.warnings.find((x) => x.code === 'phase' && x.severity === 'warning')?.message).toMatch(/\(wanted 45\.0°\).*shorten it by 45\.0°/);
  });

  it('the design file refuses offsets that do not pair with the ports, naming the field', () => {
    const doc = load();
    const bad = serializeDesign({ ...doc, phaseGroups: [{ ...doc.phaseGroups[0]!, offsetsDeg: [0, 90, 180] }] });
    const r = parseDesign(bad);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => `${e.path}: expected ${e.expected}, found ${e.found}`)).toContain('phaseGroups[0].offsetsDeg: expected one offset per port in "to" (2), found 3');
  });
});
