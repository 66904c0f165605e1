/**
 * Smooth phase traces come from sweeping densely enough, never from interpolating: at every example's own default
 * sweep (core designSweepSettings, what the app's response panel and `stripwright sweep` use), no S-parameter's
 * phase changes by more than PHASE_STEP_LIMIT_DEG between adjacent swept points, so the plot joins points that are
 * close and reads as a curve, not as stairs. The limit is the project's own rule for this check (20° is 1/18 of the
 * plot's 360° axis: about 13 px on a 240 px plot). The same measure does catch stairs: the coarse first pass
 * (21 points) of the widest-band example breaks it.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, type DesignDoc } from '../../core/design/index.ts';
import { sizeDesign } from '../../core/layout/index.ts';
import { designSweepSettings, netlistFromSized, solveNetwork, sweepFrequencies, type NetworkResponse, type SweepSettings } from '../../core/network/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const EXAMPLES = ['demo', 'branchline-10g4', 'open-stub-match', 'shorted-stub-match', 'three-section-transformer', 'wilkinson-2g45'];
const PHASE_STEP_LIMIT_DEG = 20;

function load(name: string): DesignDoc {
  const parsed = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', `${name}.json`), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => e.message).join('; '));
  return parsed.doc;
}

function sweep(doc: DesignDoc, settings: SweepSettings): NetworkResponse {
  const sized = sizeDesign(doc);
  return solveNetwork(netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {}), sweepFrequencies(settings));
}

/** The largest change of arg S_ij between adjacent points over every i, j, wrapped to (−180°, 180°]. */
function largestPhaseStepDeg(r: NetworkResponse): { deg: number; where: string } {
  const P = r.ports.length, F = r.freqs.length;
  let deg = 0, where = '';
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) for (let k = 1; k < F; k++) {
    const a = 2 * (((k - 1) * P + i) * P + j), b = 2 * ((k * P + i) * P + j);
    const d = (Math.atan2(r.s[b + 1], r.s[b]) - Math.atan2(r.s[a + 1], r.s[a])) * (180 / Math.PI);
    const step = Math.abs(((((d + 180) % 360) + 360) % 360) - 180);
    if (step > deg) { deg = step; where = `S${i + 1}${j + 1} at ${(r.freqs[k] / 1e9).toFixed(4)} GHz`; }
  }
  return { deg, where };
}

describe('phase traces at the default sweep are smooth (dense sweep, no interpolation)', () => {
  for (const name of EXAMPLES) {
    it(`${name}: adjacent points differ by less than ${PHASE_STEP_LIMIT_DEG}° in every S-parameter`, () => {
      const doc = load(name);
      const { deg, where } = largestPhaseStepDeg(sweep(doc, designSweepSettings(doc)));
      expect(deg, where).toBeLessThan(PHASE_STEP_LIMIT_DEG);
    });
  }
  it('the measure catches stairs: 21 points over the widest example band step by more than the limit', () => {
    const doc = load('three-section-transformer');
    const { deg } = largestPhaseStepDeg(sweep(doc, { ...designSweepSettings(doc), points: 21 }));
    expect(deg).toBeGreaterThan(PHASE_STEP_LIMIT_DEG);
  });
});
