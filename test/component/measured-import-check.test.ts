/**
 * The app takes measured data in only if the sweep can use it (issue: files passed the import and failed at the
 * sweep). A block whose data is an ideal short at one point (S = −1 has no admittance, Y = G⁻¹(I − S)(I + S)⁻¹G⁻¹,
 * Kurokawa 1965) or whose dB magnitudes overflow is refused when chosen, with the reason, and the design is unchanged.
 * Touchstone texts written here for the test.
 */
import { describe, expect, it, vi } from 'vitest';
import { editorOn } from './harness.ts';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));

const SHORT_AT_2GHZ = ['# GHz S RI R 50', '1 0.5 0 0.5 0 0.5 0 0.5 0', '2 -1 0 0 0 0 0 -1 0', '3 0.5 0 0.5 0 0.5 0 0.5 0'].join('\n');
const OVERFLOW = ['# GHz S DB R 50', '1 -6 0 -6 0 -6 0 -6 0', '2 9000 0 -6 0 -6 0 -6 0'].join('\n');

describe('measured data is checked as the sweep will use it', () => {
  for (const [what, text, reason] of [['an ideal short at 2 GHz', SHORT_AT_2GHZ, /2 GHz/], ['a dB magnitude that overflows', OVERFLOW, /x\.s2p:3/]] as const) {
    it(`${what}: refused when chosen, design unchanged`, () => {
      const ed = editorOn('wilkinson-2g45');
      const before = JSON.stringify(ed.doc);
      const r = ed.useMeasuredData('r1', 'x.s2p', text);
      expect(r).toMatch(reason);
      expect(JSON.stringify(ed.doc)).toBe(before);
    });
  }
});
