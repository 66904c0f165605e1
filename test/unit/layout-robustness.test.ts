/**
 * Reliability: whatever graph a user has drawn so far — unfinished, tangled or with odd values — sizing, copper,
 * paths and checks either succeed or raise an InputError; they never crash with a TypeError or return NaN lengths
 * for pieces they call sized.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { initPolygons } from '../../core/geometry/polygons.ts';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { buildBoardGeometry } from '../../core/layout/geometry.ts';
import { checkFabrication } from '../../core/layout/checks.ts';
import { designPaths } from '../../core/layout/paths.ts';
import { InputError } from '../../core/util/errors.ts';
import type { DesignNode, DesignSegment } from '../../core/design/types.ts';
import { design } from './layout-fixtures.ts';

beforeAll(async () => { await initPolygons(); });

const ids = ['n0', 'n1', 'n2', 'n3', 'n4', 'n5'];
const nodeArb = fc.record({
  kind: fc.constantFrom('port', 'vertex', 'junction', 'open', 'short'),
  x: fc.integer({ min: 0, max: 4 }), y: fc.integer({ min: 0, max: 4 }),
  bend: fc.constantFrom({ style: 'square' }, { style: 'miter-optimal' }, { style: 'arc', radius: 2e-3 }, { style: 'miter', fraction: 0.5 }),
});
const segArb = fc.record({
  a: fc.constantFrom(...ids), b: fc.constantFrom(...ids),
  kind: fc.constantFrom('line', 'line', 'taper', 'lumped'),
  z0: fc.constantFrom(20, 50, 100, 150),
  length: fc.constantFrom({ by: 'drawn' }, { by: 'degrees', deg: 90 }, { by: 'length', length: 3e-3 }, { by: 'degrees', deg: 1 }),
});

describe('sizing never crashes on a drawn graph', () => {
  it('random small graphs: success or InputError; sized pieces have finite lengths', () => {
    fc.assert(fc.property(fc.array(nodeArb, { minLength: 6, maxLength: 6 }), fc.array(segArb, { minLength: 0, maxLength: 8 }), (ns, ss) => {
      const nodes = ns.map((n, i): DesignNode => {
        const base = { id: ids[i]!, at: { x: n.x * 5e-3, y: n.y * 5e-3 } };
        switch (n.kind) {
          case 'port': return { ...base, kind: 'port', zRef: 50, heading: 0 };
          case 'vertex': return { ...base, kind: 'vertex', bend: n.bend as never };
          case 'junction': return { ...base, kind: 'junction' };
          case 'open': return { ...base, kind: 'open' };
          default: return { ...base, kind: 'short', via: { drill: 0.4e-3, pad: 0.8e-3, count: 1 } };
        }
      });
      const segments = ss.map((s, i): DesignSegment => {
        const base = { id: `s${i}`, a: s.a, b: s.b };
        if (s.kind === 'taper') return { ...base, kind: 'taper', profile: 'klopfenstein', from: { by: 'z0', z0: s.z0 }, to: { by: 'z0', z0: 50 }, length: s.length as never };
        if (s.kind === 'lumped') return { ...base, kind: 'lumped', part: 'resistor', value: 100, size: '0603', width: { by: 'z0', z0: s.z0 } };
        return { ...base, kind: 'line', width: { by: 'z0', z0: s.z0 }, length: s.length as never };
      });
      try {
        const sized = sizeDesign(design({ nodes, segments }));
        for (const p of sized.pieces) if (Number.isFinite(p.width)) expect(Number.isFinite(p.length)).toBe(true);
        const g = buildBoardGeometry(sized);
        checkFabrication(sized, g, { paths: designPaths(sized, { sensitivities: false }) });
      } catch (e) {
        if (!(e instanceof InputError)) throw e;
      }
    }), { numRuns: 200 });
  });
});
