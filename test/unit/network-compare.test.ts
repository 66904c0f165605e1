/**
 * compareResponses: differences between two responses of the same ports (arithmetic on hand-made data).
 */
import { describe, expect, it } from 'vitest';
import { compareResponses, type NetworkResponse } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

const one = (freqs: number[], s: number[], zRef = 50): NetworkResponse => ({ freqs: Float64Array.from(freqs), ports: [{ name: '1', zRef }], s: Float64Array.from(s), warnings: [] });

describe('compareResponses', () => {
  it('interpolates the first response at the second one’s frequencies (linear in re/im)', () => {
    const sim = one([1e9, 2e9], [0.2, 0, 0.4, 0]);
    const meas = one([1.5e9], [0.3, 0]);
    expect(compareResponses(sim, meas).worst.vector.value).toBeCloseTo(0, 15);
  });
  it('dB and phase count only above the floor; the vector difference always', () => {
    // |S| 0.5 vs 0.25: 6.02 dB; at the second point both are below −30 dB (0.01, 0.02): only |ΔS| = 0.01 counts.
    const d = compareResponses(one([1e9, 2e9], [0.5, 0, 0.01, 0]), one([1e9, 2e9], [0.25, 0, 0, 0.02]));
    expect(d.entries[0].db.value).toBeCloseTo(20 * Math.log10(2), 12);
    expect(d.entries[0].db.freq).toBe(1e9);
    expect(d.entries[0].deg.value).toBe(0);
    expect(d.entries[0].vector.value).toBeCloseTo(0.25, 15);
  });
  it('refuses different reference impedances or port counts', () => {
    expect(() => compareResponses(one([1e9], [0, 0]), one([1e9], [0, 0], 75))).toThrow(InputError);
    const two: NetworkResponse = { freqs: Float64Array.of(1e9), ports: [{ name: '1', zRef: 50 }, { name: '2', zRef: 50 }], s: new Float64Array(8), warnings: [] };
    expect(() => compareResponses(one([1e9], [0, 0]), two)).toThrow(/1 port/);
  });
  it('refuses frequencies the first response does not cover', () => {
    expect(() => compareResponses(one([1e9, 2e9], [0, 0, 0, 0]), one([3e9], [0, 0]))).toThrow(/frequency inside the first response/);
  });
});
