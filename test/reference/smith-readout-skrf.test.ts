/**
 * The Smith-chart hover readout (renderer/src/lib/smith-math.ts) against Debian's scikit-rf 0.15.4: Z from Γ
 * (skrf.network.s2z) and VSWR (Network.s_vswr), for reflections spread over the chart, on 50 Ω and 75 Ω references.
 */
import { describe, expect, it } from 'vitest';
import { python } from './network-oracle.ts';
import { readout } from '../../renderer/src/lib/smith-math.ts';

describe('Smith readout against scikit-rf', () => {
  for (const z0 of [50, 75]) {
    it(`Γ → Z and VSWR agree on a ${z0} Ω reference`, () => {
      const gamma: [number, number][] = [];
      for (let k = 0; k < 24; k++) { const m = 0.04 * (k % 8) + 0.02 + 0.6 * (k / 24), a = (k * 47 * Math.PI) / 180; gamma.push([m * Math.cos(a), m * Math.sin(a)]); }
      const out = JSON.parse(python('skrf_smith.py', JSON.stringify({ z0, gamma }))) as { z: [number, number][]; vswr: number[] };
      gamma.forEach(([re, im], k) => {
        const r = readout(re, im, z0);
        expect(r.z!.re).toBeCloseTo(out.z[k]![0], 9);
        expect(r.z!.im).toBeCloseTo(out.z[k]![1], 9);
        expect(r.vswr!).toBeCloseTo(out.vswr[k]!, 9);
      });
    });
  }
});
