/**
 * The nodal solver on ideal circuits with published closed-form answers.
 * Sources named beside each check. Pozar = D. M. Pozar, Microwave Engineering, 4th ed., Wiley, 2012.
 */
import { describe, expect, it } from 'vitest';
import {
  compileNetwork, idealLine, temLengthForDegrees, solveAt, solveNetwork, sweepFrequencies, magnitudeDb, phaseDeg,
  type Netlist, type NetElement,
} from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

const f0 = 2.45e9;
const quarter = temLengthForDegrees(90, f0);
const line = (id: string, a: string, b: string, z: number, deg: number, eeff = 1): NetElement =>
  ({ kind: 'line', id, a, b, length: temLengthForDegrees(deg, f0, eeff), model: idealLine(z, eeff) });
const port = (name: string, node: string, zRef = 50) => ({ name, node, zRef });
const S = (r: { s: Float64Array; ports: unknown[] }, k: number, i: number, j: number) => {
  const P = r.ports.length, t = 2 * ((k * P + i) * P + j);
  return { re: r.s[t], im: r.s[t + 1] };
};

describe('quarter-wave transformer (Pozar §5.4)', () => {
  const net: Netlist = { elements: [line('t', 'a', 'b', Math.sqrt(50 * 100), 90, 2.8)], ports: [port('1', 'a', 50), port('2', 'b', 100)] };
  it('matches exactly at f0: Z1 = √(Z0·ZL) gives Γ = 0', () => {
    const r = solveNetwork(net, [f0]);
    expect(Math.hypot(S(r, 0, 0, 0).re, S(r, 0, 0, 0).im)).toBeLessThan(1e-14);
    // Lossless: all power reaches the load.
    expect(Math.hypot(S(r, 0, 1, 0).re, S(r, 0, 1, 0).im)).toBeCloseTo(1, 14);
  });
  it('off f0 follows |Γ| = |ZL − Z0| / √((ZL + Z0)² + 4·Z0·ZL·tan²θ) (Pozar §5.4, eq. for the single-section transformer; written from memory)', () => {
    const freqs = sweepFrequencies({ start: 1e9, stop: 4e9, points: 31 });
    const r = solveNetwork(net, freqs);
    for (let k = 0; k < freqs.length; k++) {
      const th = (Math.PI / 2) * (freqs[k] / f0);
      const want = 50 / Math.sqrt(150 ** 2 + 4 * 50 * 100 * Math.tan(th) ** 2);
      expect(Math.hypot(S(r, k, 0, 0).re, S(r, k, 0, 0).im)).toBeCloseTo(want, 12);
    }
  });
});

describe('equal two-way Wilkinson divider (Wilkinson 1960; Pozar §7.3)', () => {
  const z = 50 * Math.SQRT2;
  const net: Netlist = {
    elements: [line('a2', 'in', 'o2', z, 90), line('a3', 'in', 'o3', z, 90), { kind: 'resistor', id: 'r', a: 'o2', b: 'o3', value: 100 }],
    ports: [port('1', 'in'), port('2', 'o2'), port('3', 'o3')],
  };
  const r = solveNetwork(net, [f0]);
  it('−3.01 dB to each output with S21 = S31 = −j/√2', () => {
    for (const i of [1, 2]) {
      expect(S(r, 0, i, 0).re).toBeCloseTo(0, 14);
      expect(S(r, 0, i, 0).im).toBeCloseTo(-Math.SQRT1_2, 14);
      expect(magnitudeDb(r, i, 0)[0]).toBeCloseTo(-3.0103, 4);
    }
  });
  it('all ports matched and outputs isolated at f0', () => {
    for (const [i, j] of [[0, 0], [1, 1], [2, 2], [1, 2], [2, 1]]) {
      expect(Math.hypot(S(r, 0, i, j).re, S(r, 0, i, j).im)).toBeLessThan(1e-14);
    }
  });
  it('without the isolation resistor the outputs are no longer isolated (the resistor is what isolates, Pozar §7.3)', () => {
    const open = solveNetwork({ ...net, elements: net.elements.slice(0, 2) }, [f0]);
    expect(Math.hypot(S(open, 0, 1, 2).re, S(open, 0, 1, 2).im)).toBeCloseTo(0.5, 12);
  });
});

describe('3 dB branch-line hybrid (Reed & Wheeler 1956 even/odd analysis; Pozar §7.5)', () => {
  const zs = 50 / Math.SQRT2;
  const net: Netlist = {
    elements: [line('s12', 'n1', 'n2', zs, 90), line('s43', 'n4', 'n3', zs, 90), line('p14', 'n1', 'n4', 50, 90), line('p23', 'n2', 'n3', 50, 90)],
    ports: [port('1', 'n1'), port('2', 'n2'), port('3', 'n3'), port('4', 'n4')],
  };
  const r = solveNetwork(net, [f0]);
  it('S21 = −j/√2, S31 = −1/√2, S41 = 0, S11 = 0', () => {
    expect(S(r, 0, 1, 0).re).toBeCloseTo(0, 14); expect(S(r, 0, 1, 0).im).toBeCloseTo(-Math.SQRT1_2, 14);
    expect(S(r, 0, 2, 0).re).toBeCloseTo(-Math.SQRT1_2, 14); expect(S(r, 0, 2, 0).im).toBeCloseTo(0, 14);
    expect(Math.hypot(S(r, 0, 3, 0).re, S(r, 0, 3, 0).im)).toBeLessThan(1e-14);
    expect(Math.hypot(S(r, 0, 0, 0).re, S(r, 0, 0, 0).im)).toBeLessThan(1e-14);
  });
  it('both outputs at −3.01 dB, 90° apart', () => {
    expect(magnitudeDb(r, 1, 0)[0]).toBeCloseTo(-3.0103, 4);
    expect(magnitudeDb(r, 2, 0)[0]).toBeCloseTo(-3.0103, 4);
    expect(phaseDeg(r, 1, 0)[0] - phaseDeg(r, 2, 0)[0]).toBeCloseTo(90, 10);
  });
});

describe('cases a plain Y-stamp solver gets wrong', () => {
  it('a lossless half-wave line is transparent between equal ports: S21 = −1, S11 = 0 (Pozar §2.3: Zin = ZL at λ/2)', () => {
    const r = solveNetwork({ elements: [line('h', 'a', 'b', 80, 180)], ports: [port('1', 'a'), port('2', 'b')] }, [f0]);
    expect(S(r, 0, 1, 0).re).toBeCloseTo(-1, 12);
    expect(Math.hypot(S(r, 0, 0, 0).re, S(r, 0, 0, 0).im)).toBeLessThan(1e-12);
  });
  it('a full-wave line: S21 = +1', () => {
    const r = solveNetwork({ elements: [line('w', 'a', 'b', 30, 360)], ports: [port('1', 'a'), port('2', 'b')] }, [f0]);
    expect(S(r, 0, 1, 0).re).toBeCloseTo(1, 12);
  });
  it('an open quarter-wave stub shorts its node at f0: S11 = −1, S21 = 0 (Pozar §2.3: Zin = −jZ0·cot βl)', () => {
    const r = solveNetwork({ elements: [line('t', 'a', 'b', 50, 90), line('s', 'a', 'x', 50, 90)], ports: [port('1', 'a'), port('2', 'b')] }, [f0]);
    expect(S(r, 0, 0, 0).re).toBeCloseTo(-1, 12);
    expect(Math.hypot(S(r, 0, 1, 0).re, S(r, 0, 1, 0).im)).toBeLessThan(1e-12);
  });
  it('zero-length lines are wires: three 50 Ω ports joined by them form an ideal junction', () => {
    // Each port sees the other two in parallel, 25 Ω: S11 = (25 − 50)/(25 + 50) = −1/3; S21 = 1 + S11 = 2/3 (the node
    // voltage is common; circuit theory, common practice).
    const r = solveNetwork({ elements: [{ kind: 'line', id: 'w1', a: 'a', b: 'b', length: 0, model: idealLine(50) }, { kind: 'line', id: 'w2', a: 'b', b: 'c', length: 0, model: idealLine(50) }], ports: [port('1', 'a'), port('2', 'b'), port('3', 'c')] }, [f0]);
    expect(S(r, 0, 0, 0).re).toBeCloseTo(-1 / 3, 14);
    expect(S(r, 0, 1, 0).re).toBeCloseTo(2 / 3, 14);
  });
  it('a zero-length loop of wires is harmless', () => {
    const w = (id: string, a: string, b: string): NetElement => ({ kind: 'line', id, a, b, length: 0, model: idealLine(50) });
    const r = solveNetwork({ elements: [w('1', 'a', 'b'), w('2', 'b', 'c'), w('3', 'c', 'a'), line('t', 'c', 'd', 50, 37)], ports: [port('1', 'a'), port('2', 'd')] }, [f0]);
    expect(Math.hypot(S(r, 0, 1, 0).re, S(r, 0, 1, 0).im)).toBeCloseTo(1, 14);
  });
  it('pivoting path and fast path agree where both apply', () => {
    const net: Netlist = { elements: [line('t', 'a', 'b', 35, 77), line('s', 'a', 'x', 70, 50), line('u', 'b', 'y', 90, 133), { kind: 'resistor', id: 'r', a: 'x', b: 'y', value: 33 }], ports: [port('1', 'a'), port('2', 'b', 75)] };
    const cn = compileNetwork(net);
    const fast = solveAt(cn, 1.7e9);
    const dense = solveAt(cn, 1.7e9, undefined, { method: 'dense' });
    expect(fast.robust).toBe(false);
    for (let t = 0; t < fast.s.length; t++) expect(fast.s[t]).toBeCloseTo(dense.s[t], 13);
  });
});

describe('bad networks get clear errors', () => {
  const err = (fn: () => unknown): InputError => {
    try { fn(); } catch (e) { if (e instanceof InputError) return e; throw e; }
    throw new Error('expected an InputError');
  };
  it('a floating piece is named', () => {
    const e = err(() => compileNetwork({ elements: [line('t', 'a', 'b', 50, 90), line('lost', 'x', 'y', 50, 30)], ports: [port('1', 'a'), port('2', 'b')] }));
    expect(e.code).toBe('singular-network');
    expect(e.message).toMatch(/x, y floating/);
  });
  it('a port shorted to ground by a wire', () => {
    const e = err(() => compileNetwork({ elements: [{ kind: 'resistor', id: 'r0', a: 'a', b: 'gnd', value: 0 }], ports: [port('1', 'a')] }));
    expect(e.code).toBe('singular-network');
    expect(e.field).toMatch(/ports\[0\]/);
  });
  it('a negative length, a zero reference impedance, no ports', () => {
    expect(err(() => compileNetwork({ elements: [line('t', 'a', 'b', 50, -10)], ports: [port('1', 'a')] })).field).toMatch(/length/);
    expect(err(() => compileNetwork({ elements: [line('t', 'a', 'b', 50, 10)], ports: [port('1', 'a', 0)] })).field).toMatch(/zRef/);
    expect(err(() => compileNetwork({ elements: [line('t', 'a', 'b', 50, 10)], ports: [] })).field).toBe('ports');
  });
  it('a lossless resonance no port can damp is reported singular, naming the frequency and a node', () => {
    // Node x hangs between two parallel LC tanks resonant at f0: at f0 both are open, so x is connected to nothing.
    const l = 10e-9, c = 1 / ((2 * Math.PI * f0) ** 2 * l);
    const net: Netlist = {
      elements: [
        { kind: 'inductor', id: 'L1', a: 'p', b: 'x', value: l }, { kind: 'capacitor', id: 'C1', a: 'p', b: 'x', value: c },
        { kind: 'inductor', id: 'L2', a: 'x', b: 'gnd', value: l }, { kind: 'capacitor', id: 'C2', a: 'x', b: 'gnd', value: c },
      ],
      ports: [port('1', 'p')],
    };
    const e = err(() => solveNetwork(net, [f0]));
    expect(e.code).toBe('singular-network');
    expect(e.message).toMatch(/2450000000 Hz near node x/);
    // Slightly off resonance it solves: the tanks then pass a little current.
    expect(() => solveNetwork(net, [f0 * 1.01])).not.toThrow();
  });
  it('duplicate element ids', () => {
    expect(err(() => compileNetwork({ elements: [line('t', 'a', 'b', 50, 10), line('t', 'b', 'c', 50, 10)], ports: [port('1', 'a')] })).code).toBe('invalid-design');
  });
});

describe('unequal Wilkinson, power ratio P3/P2 = K² = 2 (Parad & Moynihan 1965; Pozar §7.3)', () => {
  const K = Math.SQRT2, z0 = 50;
  const z03 = z0 * Math.sqrt((1 + K * K) / K ** 3), z02 = K * K * z03, R = z0 * (K + 1 / K);
  const r2 = z0 * K, r3 = z0 / K;
  const net: Netlist = {
    elements: [
      line('a2', 'in', 'x2', z02, 90), line('a3', 'in', 'x3', z03, 90), { kind: 'resistor', id: 'r', a: 'x2', b: 'x3', value: R },
      line('t2', 'x2', 'o2', Math.sqrt(z0 * r2), 90), line('t3', 'x3', 'o3', Math.sqrt(z0 * r3), 90),
    ],
    ports: [port('1', 'in'), port('2', 'o2'), port('3', 'o3')],
  };
  it('the design values match the worked example: Z02 = 102.99, Z03 = 51.49, R = 106.07 Ω', () => {
    expect(z02).toBeCloseTo(102.99, 2); expect(z03).toBeCloseTo(51.49, 2); expect(R).toBeCloseTo(106.07, 2);
  });
  it('|S21|² = 1/3, |S31|² = 2/3, all ports matched and S23 = 0 at f0', () => {
    const r = solveNetwork(net, [f0]);
    const m2 = (i: number, j: number) => S(r, 0, i, j).re ** 2 + S(r, 0, i, j).im ** 2;
    expect(m2(1, 0)).toBeCloseTo(1 / 3, 13);
    expect(m2(2, 0)).toBeCloseTo(2 / 3, 13);
    for (const [i, j] of [[0, 0], [1, 1], [2, 2], [1, 2]]) expect(m2(i, j)).toBeLessThan(1e-26);
  });
});

describe('multi-section transformers, 50 → 100 Ω (Pozar, Microwave Engineering, 4th ed., §5.5–5.6, from memory)', () => {
  const chain = (zs: number[]): Netlist => ({
    elements: zs.map((z, i) => line(`s${i}`, `n${i}`, `n${i + 1}`, z, 90)),
    ports: [port('1', 'n0', 50), port('2', `n${zs.length}`, 100)],
  });
  it('binomial N = 3 (54.53, 70.71, 91.70 Ω; Pozar §5.6): matched at f0, maximally flat around it', () => {
    const r = solveNetwork(chain([54.53, 70.71, 91.7]), [f0 * 0.8, f0, f0 * 1.2]);
    expect(Math.hypot(S(r, 1, 0, 0).re, S(r, 1, 0, 0).im)).toBeLessThan(2e-4); // the published values are rounded to 0.01 Ω
    // Small-reflection estimate |Γ| ≈ 2^N·|A|·|cos θ|³ with the log form A = 2^−N·ln(ZL/Z0)/2 (Pozar §5.6),
    // within 10 % (an approximation: it neglects multiple reflections).
    for (const k of [0, 2]) {
      const th = (Math.PI / 2) * (k === 0 ? 0.8 : 1.2);
      const est = (Math.log(2) / 2) * Math.abs(Math.cos(th)) ** 3;
      expect(Math.hypot(S(r, k, 0, 0).re, S(r, k, 0, 0).im) / est).toBeGreaterThan(0.9);
      expect(Math.hypot(S(r, k, 0, 0).re, S(r, k, 0, 0).im) / est).toBeLessThan(1.1);
    }
  });
  it('Chebyshev N = 2, Γm = 0.05 (60.97, 82.01 Ω; Collin 1955): in-band peak |S11| ≈ 0.05 across 0.665–1.335 f0', () => {
    const freqs = sweepFrequencies({ start: 0.665 * f0, stop: 1.335 * f0, points: 201 });
    const r = solveNetwork(chain([60.97, 82.01]), freqs);
    let peak = 0;
    for (let k = 0; k < freqs.length; k++) peak = Math.max(peak, Math.hypot(S(r, k, 0, 0).re, S(r, k, 0, 0).im));
    expect(peak).toBeGreaterThan(0.048);
    expect(peak).toBeLessThan(0.052);
    // Outside the band the ripple bound no longer holds.
    const out = solveNetwork(chain([60.97, 82.01]), [0.5 * f0]);
    expect(Math.hypot(out.s[0], out.s[1])).toBeGreaterThan(0.06);
  });
});
