/**
 * The coupled pair's four-port rebuilt in Debian's scikit-rf 0.15.4 (scripts/reference/skrf_coupled.py): each mode a
 * line of the library (DefinedGammaZ0, renormalised to 50 Ω by the library), combined by the even/odd decomposition
 * of a symmetric four-port (Reed and Wheeler 1956). Mode figures from our coupled model for a real microstrip pair —
 * unequal mode velocities, losses in γ — with the real mode Z0 on both sides (the library's lines take a real Z0).
 */
import { describe, expect, it } from 'vitest';
import { analyzeCoupled, coupledPairY, modeConstants, solveNetwork, sAt, type Netlist } from '../../core/index.ts';
import { python } from './network-oracle.ts';

describe('coupled four-port against scikit-rf 0.15.4', () => {
  it('a 12 mm pair on glass-epoxy, 0.5–6 GHz: every S-parameter agrees to 1e-9', () => {
    const sub = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };
    const W = 2.6e-3, S = 0.3e-3, length = 12e-3;
    const freqs = Array.from({ length: 23 }, (_, i) => 0.5e9 + i * 0.25e9);
    const modes = freqs.map((f) => {
      const r = analyzeCoupled(sub, W, S, f);
      return { f, even: modeConstants(r.even.z0, r.even.epsEff, r.even.alphaC, r.even.alphaD, f), odd: modeConstants(r.odd.z0, r.odd.epsEff, r.odd.alphaC, r.odd.alphaD, f), z0e: r.even.z0, z0o: r.odd.z0 };
    });
    const z0e = modes[0]!.z0e, z0o = modes[0]!.z0o; // static mode impedances (the dispersion model keeps them)
    const at = new Map(modes.map((m) => [m.f, m]));
    const net: Netlist = {
      elements: [{ kind: 'nport', id: 'pair', nodes: ['p1', 'p2', 'p3', 'p4'], y: (f) => {
        const m = at.get(f)!;
        return coupledPairY({ zc: { re: z0e, im: 0 }, gamma: m.even.gamma }, { zc: { re: z0o, im: 0 }, gamma: m.odd.gamma }, length);
      } }],
      ports: ['p1', 'p2', 'p3', 'p4'].map((n) => ({ name: n, node: n, zRef: 50 })),
    };
    const ours = solveNetwork(net, freqs);
    const lib = JSON.parse(python('skrf_coupled.py', JSON.stringify({
      freqs, length, zref: 50,
      even: { z0: z0e, gamma: modes.map((m) => [m.even.gamma.re, m.even.gamma.im]) },
      odd: { z0: z0o, gamma: modes.map((m) => [m.odd.gamma.re, m.odd.gamma.im]) },
    }))) as { s: number[][][][] };
    let worst = 0;
    freqs.forEach((_, k) => {
      for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
        const a = sAt(ours, k, i, j), b = lib.s[k]![i]![j]!;
        worst = Math.max(worst, Math.hypot(a.re - b[0]!, a.im - b[1]!));
      }
    });
    expect(worst).toBeLessThan(1e-9);
    // The modes really differ here (so the check covers unequal phase velocities).
    expect(Math.abs(modes[10]!.even.gamma.im - modes[10]!.odd.gamma.im) / modes[10]!.odd.gamma.im).toBeGreaterThan(0.03);
  });
});
