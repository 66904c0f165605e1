/**
 * Properties every passive network must have, on random networks (fast-check, seeded):
 *  - reciprocity S = Sᵀ for any network of lines and R, L, C (Pozar, Microwave Engineering, 4th ed., §4.3);
 *  - unitarity Sᴴ S = I for a lossless one (same section), to 1e-12;
 *  - with loss, every column keeps Σ_i |S_ij|² <= 1 (energy conservation).
 * The fast (fixed-order sparse) and the pivoting dense paths are also compared on the same networks.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compileNetwork, solveAt, idealLine, type NetElement, type Netlist, type LineModel } from '../../core/network/index.ts';

// Invented test constants. The small negative Im Zc must stay below α/β or the line would be active
// (Zc ≈ Z0·(1 − j(αc − αd)/β), Pozar, Microwave Engineering, 4th ed., §2.7, from memory).
const lossyLine = (z: number, eeff: number, alpha: number): LineModel => {
  const k = (2 * Math.PI * Math.sqrt(eeff)) / 299_792_458;
  return (f) => ({ zc: { re: z, im: -z * 0.001 }, gamma: { re: alpha * Math.sqrt(f / 1e9), im: k * f } });
};

/** A random connected network: a spanning tree of lines plus extra loop elements and stubs. */
const networkArb = (lossy: boolean) => fc.record({
  nodes: fc.integer({ min: 2, max: 9 }),
  parents: fc.array(fc.nat(), { minLength: 8, maxLength: 8 }),
  zs: fc.array(fc.double({ min: 20, max: 120, noNaN: true }), { minLength: 16, maxLength: 16 }),
  lens: fc.array(fc.double({ min: 0.001, max: 0.2, noNaN: true }), { minLength: 16, maxLength: 16 }),
  extras: fc.array(fc.record({ a: fc.nat(), b: fc.nat(), kind: fc.constantFrom('line', 'capacitor', 'inductor', 'resistor', 'shunt-c', 'stub'), v: fc.double({ min: 0.1, max: 10, noNaN: true }) }), { maxLength: 5 }),
  nports: fc.integer({ min: 1, max: 4 }),
  f: fc.double({ min: 0.2e9, max: 6e9, noNaN: true }),
}).map((g): { net: Netlist; f: number } => {
  const els: NetElement[] = [];
  const mk = (i: number): LineModel => (lossy ? lossyLine(g.zs[i], 1 + (i % 5), 0.5) : idealLine(g.zs[i], 1 + (i % 5)));
  for (let i = 1; i < g.nodes; i++) els.push({ kind: 'line', id: `t${i}`, a: `n${g.parents[i - 1] % i}`, b: `n${i}`, length: g.lens[i], model: mk(i) });
  g.extras.forEach((x, k) => {
    const a = `n${x.a % g.nodes}`, b = `n${x.b % g.nodes}`, id = `x${k}`;
    if (x.kind === 'line' && a !== b) els.push({ kind: 'line', id, a, b, length: g.lens[8 + k], model: mk(8 + k) });
    else if (x.kind === 'stub') els.push({ kind: 'line', id, a, b: `open${k}`, length: g.lens[8 + k], model: mk(8 + k) });
    else if (x.kind === 'capacitor' && a !== b) els.push({ kind: 'capacitor', id, a, b, value: x.v * 1e-12 });
    else if (x.kind === 'inductor' && a !== b) els.push({ kind: 'inductor', id, a, b, value: x.v * 1e-9 });
    else if (x.kind === 'shunt-c') els.push({ kind: 'capacitor', id, a, b: 'gnd', value: x.v * 1e-13 });
    else if (x.kind === 'resistor' && lossy && a !== b) els.push({ kind: 'resistor', id, a, b, value: x.v * 20 });
  });
  const ports = Array.from({ length: Math.min(g.nports, g.nodes) }, (_, i) => ({ name: `${i + 1}`, node: `n${(i * 3) % g.nodes}`, zRef: 25 + 25 * i }));
  return { net: { elements: els, ports }, f: g.f };
});

function check(s: Float64Array, P: number, lossless: boolean, tol: number) {
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    const a = 2 * (i * P + j), b = 2 * (j * P + i);
    expect(Math.abs(s[a] - s[b]) + Math.abs(s[a + 1] - s[b + 1])).toBeLessThan(tol);
  }
  for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    // (Sᴴ S)_ij = Σ_k conj(S_ki) S_kj
    let re = 0, im = 0;
    for (let k = 0; k < P; k++) {
      const x = 2 * (k * P + i), y = 2 * (k * P + j);
      re += s[x] * s[y] + s[x + 1] * s[y + 1];
      im += s[x] * s[y + 1] - s[x + 1] * s[y];
    }
    if (lossless) expect(Math.hypot(re - (i === j ? 1 : 0), im)).toBeLessThan(tol);
    else if (i === j) expect(re).toBeLessThanOrEqual(1 + 1e-12);
  }
}

describe('passive networks', () => {
  it('lossless networks are reciprocal and unitary to 1e-12 (Pozar §4.3)', () => {
    fc.assert(fc.property(networkArb(false), ({ net, f }) => {
      const cn = compileNetwork(net);
      const r = solveAt(cn, f);
      // Random ideal networks can sit arbitrarily close to an internal resonance; there the condition number, not
      // the method, limits the digits. The pivot ratio says how close: skip points with fewer than 12 digits left.
      fc.pre(r.pivotRatio > 1e-4);
      check(r.s, net.ports.length, true, 1e-12);
    }), { seed: 20261201, numRuns: 300 });
  });
  it('lossy networks stay reciprocal and dissipate: Σ_i |S_ij|² <= 1 (Pozar §4.3)', () => {
    fc.assert(fc.property(networkArb(true), ({ net, f }) => {
      const r = solveAt(compileNetwork(net), f);
      check(r.s, net.ports.length, false, 1e-12);
    }), { seed: 7, numRuns: 300 });
  });
  it('the fixed-order sparse solve agrees with the pivoting dense solve', () => {
    fc.assert(fc.property(networkArb(true), ({ net, f }) => {
      const cn = compileNetwork(net);
      const a = solveAt(cn, f), b = solveAt(cn, f, undefined, { method: 'dense' });
      for (let t = 0; t < a.s.length; t++) expect(Math.abs(a.s[t] - b.s[t])).toBeLessThan(1e-10);
    }), { seed: 99, numRuns: 300 });
  });
});
