/**
 * Property test over random simple designs (two parallel strips, random widths, gap and tool): when the gap is wider
 * than the cut the G-code passes every re-trace check of gcode-oracle-checks.ts (read back by gcode-toolpath, npm);
 * when it is narrower the export is refused naming both strips. fast-check picks the cases.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cutWidth, exportGcode, initPolygons, type FabProcess } from '../../core/index.ts';
import { twoStrips } from '../unit/toolpath-fixtures.ts';
import { checkExport, cutWidthMm } from './gcode-oracle-checks.ts';

beforeAll(() => initPolygons());
const INFO = { base: 'r', application: 'Stripwright', version: '0.1.0' };

const vbit = fc.record({ kind: fc.constant('v-bit' as const), tipWidth: fc.double({ min: 0.05e-3, max: 0.2e-3, noNaN: true }), angleDeg: fc.double({ min: 20, max: 90, noNaN: true }), depth: fc.double({ min: 0.06e-3, max: 0.15e-3, noNaN: true }) });
const endMill = fc.record({ kind: fc.constant('end-mill' as const), toolDiameter: fc.double({ min: 0.2e-3, max: 0.8e-3, noNaN: true }), depth: fc.double({ min: 0.06e-3, max: 0.2e-3, noNaN: true }) });

describe('random two-strip boards', () => {
  it('wide gaps mill cleanly (every re-trace check), narrow gaps are refused naming both strips', () => {
    fc.assert(fc.property(
      fc.oneof(vbit, endMill), fc.double({ min: 0.6e-3, max: 3e-3, noNaN: true }), fc.double({ min: 0.6e-3, max: 3e-3, noNaN: true }),
      fc.double({ min: 0.3, max: 3, noNaN: true }), fc.boolean(),
      (process: FabProcess, w1, w2, gapFactor, inch) => {
        const cut = cutWidth(process);
        const gap = gapFactor * cut;
        fc.pre(Math.abs(gap - cut) > 20e-6); // within 20 µm of the cut it may go either way (grid and arc tolerance)
        const doc = twoStrips(w1, w2, gap, process, 6e-3);
        if (gap < cut) {
          expect(() => exportGcode(doc, {}, INFO)).toThrow(/lower[\s\S]*upper|upper[\s\S]*lower/);
          return;
        }
        const ex = exportGcode(doc, { units: inch ? 'inch' : 'mm', passes: 1 }, INFO);
        const foot = cutWidthMm(doc, (process as { depth: number }).depth * 1e3 - doc.substrate.t * 1e3);
        const r = checkExport(doc, ex, inch ? 'inch' : 'mm', { workArea: [200, 150], boardAt: [5, 5], breakthrough: 0.3, cutoutTool: 1, raster: Math.min(0.02, foot / 5) });
        expect(r.problems).toEqual([]);
      },
    ), { numRuns: 12 });
  }, 300_000);
});
