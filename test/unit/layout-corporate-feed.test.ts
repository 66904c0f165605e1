import { beforeAll, describe, expect, it } from 'vitest';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { corporateFeed } from '../../core/layout/generators/corporateFeed.ts';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { buildBoardGeometry } from '../../core/layout/geometry.ts';
import { checkFabrication } from '../../core/layout/checks.ts';
import { designPaths } from '../../core/layout/paths.ts';
import { placeDesign } from '../../core/layout/place.ts';
import { validateDesign } from '../../core/design/validate.ts';
import { InputError } from '../../core/util/errors.ts';
import { selfIntersects, shoelace } from './geometry-test-helpers.ts';

beforeAll(async () => { await initPolygons(); });

describe('corporate-feed generator', () => {
  for (const n of [2, 4, 16, 32]) {
    it(`${n} outputs: a valid design, 5N − 3 pieces, outputs on a row at the pitch, all paths in phase`, () => {
      const doc = corporateFeed({ outputs: n, f0: 5.8e9, pitch: 24e-3 });
      expect(validateDesign(doc).ok).toBe(true);
      const s = sizeDesign(doc);
      expect(s.problems).toEqual([]);
      expect(s.pieces).toHaveLength(5 * n - 3);
      const outs = doc.phaseGroups[0]!.to.map((id) => s.nodes.find((x) => x.id === id)!.pos);
      expect(outs).toHaveLength(n);
      for (let i = 1; i < n; i++) {
        expect(outs[i]!.x - outs[i - 1]!.x).toBeCloseTo(24e-3, 9);
        expect(outs[i]!.y).toBeCloseTo(outs[0]!.y, 9);
      }
      const placed = placeDesign(s);
      expect(placed.anchor).toBe('in');
      expect(placed.centrelines).toHaveLength(s.pieces.length);
      expect(placed.nodes.find((x) => x.id === 'in')!.pos).toEqual(doc.nodes[0]!.at); // the anchor keeps its drawn position
      const rep = designPaths(s)[0]!;
      expect(rep.paths).toHaveLength(n);
      expect(rep.spreadDeg).toBeLessThan(1e-6);
      const g = buildBoardGeometry(s);
      expect(g.copper).toHaveLength(1);
      expect(shoelace(g.copper[0]!.outer)).toBeGreaterThan(0);
      expect(selfIntersects(g.copper[0]!.outer)).toBe(false);
      expect(checkFabrication(s, g, { paths: [rep] }).filter((f) => f.severity === 'error')).toEqual([]);
    });
  }
  it('each split is matched: two 2·Z0 arms in parallel give Z0, the λ/4 √2·Z0 section turns Z0 into 2·Z0 (Z1 = √(Z0·ZL), Pozar, Microwave Engineering, 4th ed., §2.5)', () => {
    const doc = corporateFeed({ outputs: 8, z0: 50 });
    const z = (id: string) => (doc.segments.find((s) => s.id === id) as { width: { z0: number } }).width.z0;
    for (const j of doc.nodes.filter((x) => x.kind === 'junction')) {
      const arms = doc.segments.filter((s) => s.a === j.id);
      expect(arms).toHaveLength(2);
      expect(1 / (1 / z(arms[0]!.id) + 1 / z(arms[1]!.id))).toBeCloseTo(50, 9);
    }
    for (const q of doc.segments.filter((s) => s.id.startsWith('qw'))) expect(z(q.id)).toBeCloseTo(Math.sqrt(50 * 100), 9);
  });
  it('refuses an output count that is not a power of two', () => {
    expect(() => corporateFeed({ outputs: 3 })).toThrow(InputError);
    expect(() => corporateFeed({ outputs: 3 })).toThrow(/power of two/);
  });
});
