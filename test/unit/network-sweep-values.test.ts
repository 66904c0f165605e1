/**
 * The faster sweep gives the present solver's numbers:
 *  - some entries only (mna.ts SolveEntries: asked columns, rows by the transposed factors, the diagonal by the
 *    selected inverse of Erisman & Tinney, Communications of the ACM 18(3), 1975): every computed entry within 1e-12
 *    of the whole solve (|ΔS|, S being at most about 1 for these passive networks), on every example design, the
 *    64-output feed and random networks; the entries left out are refused, never read as zeros;
 *  - element values and elimination orders kept across revisions (sweepValues.ts): bit-identical to a fresh
 *    netlist and solve, while dragging a bend of the 64-output feed and on every example;
 *  - the entries a live view asks (viewEntries) are those the response panel and the targets read.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, type DesignDoc } from '../../core/design/index.ts';
import { corporateFeed, sizeDesign } from '../../core/layout/index.ts';
import {
  compileNetwork, designSweepSettings, idealLine, sAt, magnitudeDb, netlistFromSized, solveAt, solveNetwork, sweepFrequencies, smith, viewEntries,
  writeTouchstone, SweepValues, type LineModel, type NetElement, type Netlist, type NetworkResponse, type SolveEntries,
} from '../../core/network/index.ts';
import { DesignPipeline, sweepDesign } from '../../core/pipeline/index.ts';

const dir = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const examples = (): [string, DesignDoc][] => readdirSync(dir).filter((f) => f.endsWith('.json')).map((f) => {
  const p = parseDesign(readFileSync(join(dir, f), 'utf8'));
  if (!p.ok) throw new Error(f);
  return [f, p.doc];
});
const feed = () => corporateFeed({ outputs: 64, pitch: 12e-3 });

/** The largest |ΔS| over the entries `part` computed, and how many it computed. */
function worstOver(part: NetworkResponse, whole: NetworkResponse): { worst: number; count: number } {
  const P = part.ports.length, F = part.freqs.length;
  let worst = 0, count = 0;
  for (let k = 0; k < F; k++) for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    if (part.computed && !part.computed[i * P + j]) continue;
    count++;
    const a = sAt(part, k, i, j), b = sAt(whole, k, i, j);
    worst = Math.max(worst, Math.hypot(a.re - b.re, a.im - b.im));
  }
  return { worst, count };
}

describe('some entries only', () => {
  it('the input column and row and every reflection match the whole solve to 1e-12 on every example and the 64-output feed', () => {
    for (const [name, doc] of [...examples(), ['feed64', feed()] as [string, DesignDoc]]) {
      const net = netlistFromSized(sizeDesign(doc));
      const cn = compileNetwork(net);
      const freqs = sweepFrequencies({ ...designSweepSettings(doc), points: 21 });
      const whole = solveNetwork(cn, freqs);
      const entries: SolveEntries = { columns: [net.input], rows: [net.input], diagonal: true };
      const part = solveNetwork(cn, freqs, { entries });
      const P = net.ports.length;
      const { worst, count } = worstOver(part, whole);
      expect(worst, name).toBeLessThan(1e-12);
      // Every reflection, the input's row and column: 3P − 2 entries per point (the whole matrix when P ≤ 2).
      expect(count, name).toBe(freqs.length * Math.min(P * P, 3 * P - 2));
    }
  }, 120_000);

  it('random networks (loops, stubs, lumped parts; fast-check, seeded): any columns, rows and the diagonal to 1e-12', () => {
    const arb = fc.record({
      nodes: fc.integer({ min: 2, max: 12 }),
      parents: fc.array(fc.nat(), { minLength: 12, maxLength: 12 }),
      zs: fc.array(fc.double({ min: 20, max: 120, noNaN: true }), { minLength: 20, maxLength: 20 }),
      lens: fc.array(fc.double({ min: 0.001, max: 0.2, noNaN: true }), { minLength: 20, maxLength: 20 }),
      extras: fc.array(fc.record({ a: fc.nat(), b: fc.nat(), kind: fc.constantFrom('line', 'capacitor', 'resistor', 'shunt-c', 'stub'), v: fc.double({ min: 0.1, max: 10, noNaN: true }) }), { maxLength: 6 }),
      nports: fc.integer({ min: 1, max: 6 }),
      cols: fc.array(fc.nat(5), { maxLength: 3 }),
      rows: fc.array(fc.nat(5), { maxLength: 3 }),
      diagonal: fc.boolean(),
      f: fc.double({ min: 0.2e9, max: 6e9, noNaN: true }),
    });
    // Invented test constants: a lossy line whose Zc has a small negative imaginary part (passive, below α/β).
    const lossy = (z: number, eeff: number): LineModel => {
      const k = (2 * Math.PI * Math.sqrt(eeff)) / 299_792_458;
      return (f) => ({ zc: { re: z, im: -z * 0.001 }, gamma: { re: 0.5 * Math.sqrt(f / 1e9), im: k * f } });
    };
    fc.assert(fc.property(arb, (g) => {
      const els: NetElement[] = [];
      for (let i = 1; i < g.nodes; i++) els.push({ kind: 'line', id: `t${i}`, a: `n${g.parents[i - 1]! % i}`, b: `n${i}`, length: g.lens[i]!, model: lossy(g.zs[i]!, 1 + (i % 5)) });
      g.extras.forEach((x, k) => {
        const a = `n${x.a % g.nodes}`, b = `n${x.b % g.nodes}`, id = `x${k}`;
        if (x.kind === 'line' && a !== b) els.push({ kind: 'line', id, a, b, length: g.lens[12 + k]!, model: lossy(g.zs[12 + k]!, 2) });
        else if (x.kind === 'stub') els.push({ kind: 'line', id, a, b: `open${k}`, length: g.lens[12 + k]!, model: idealLine(g.zs[12 + k]!, 3) });
        else if (x.kind === 'capacitor' && a !== b) els.push({ kind: 'capacitor', id, a, b, value: x.v * 1e-12 });
        else if (x.kind === 'shunt-c') els.push({ kind: 'capacitor', id, a, b: 'gnd', value: x.v * 1e-13 });
        else if (x.kind === 'resistor' && a !== b) els.push({ kind: 'resistor', id, a, b, value: x.v * 20 });
      });
      const P = Math.min(g.nports, g.nodes);
      const net: Netlist = { elements: els, ports: Array.from({ length: P }, (_, i) => ({ name: `${i + 1}`, node: `n${(i * 5) % g.nodes}`, zRef: 25 + 25 * i })) };
      const cn = compileNetwork(net);
      const entries = { columns: g.cols.filter((c) => c < P), rows: g.rows.filter((r) => r < P), diagonal: g.diagonal };
      const whole = solveNetwork(cn, [g.f]);
      const part = solveNetwork(cn, [g.f], { entries });
      expect(worstOver(part, whole).worst).toBeLessThan(1e-12);
    }), { seed: 17, numRuns: 300 });
  });

  it('the selected inverse gives every driving-point value the pivoting dense solve gives (Erisman & Tinney 1975), on the feed at 9 points', () => {
    const net = netlistFromSized(sizeDesign(feed()));
    const cn = compileNetwork(net);
    const P = cn.ports.length;
    const freqs = sweepFrequencies({ ...designSweepSettings(feed()), points: 9 });
    const part = solveNetwork(cn, freqs, { entries: { columns: [], rows: [], diagonal: true } });
    for (const [k, f] of freqs.entries()) {
      const dense = solveAt(cn, f, undefined, { method: 'dense' }).s;
      for (let i = 0; i < P; i++) {
        const t = 2 * (i * P + i), u = sAt(part, k, i, i);
        expect(Math.hypot(dense[t]! - u.re, dense[t + 1]! - u.im)).toBeLessThan(1e-12);
      }
    }
  }, 60_000);

  it('an entry left out is refused, not read as zero; a whole-matrix writer refuses the response', () => {
    const net = netlistFromSized(sizeDesign(feed()));
    const r = solveNetwork(net, [2.45e9], { entries: { columns: [0], rows: [], diagonal: true } });
    expect(() => magnitudeDb(r, 0, 5)).toThrow(/computed/);
    expect(magnitudeDb(r, 5, 0)[0]).toBeLessThan(0);
    expect(smith(r, 7).re.length).toBe(1);
    // Kept compactly: the column (65) and the other reflections (64) of one point.
    expect(r.s.length).toBe(2 * (65 + 64));
    expect(() => writeTouchstone(r)).toThrow(/computed/);
    expect(() => solveNetwork(net, [2.45e9], { entries: { columns: [65], rows: [], diagonal: false } })).toThrow(/port index/);
  }, 60_000);
});

describe('values kept across revisions', () => {
  const moved = (d: DesignDoc, id: string, k: number): DesignDoc => ({ ...d, nodes: d.nodes.map((n) => (n.id === id ? { ...n, at: { x: n.at.x + k * 5e-5, y: n.at.y } } : n)) });

  it('dragging a bend of the 64-output feed: each revision bit-identical to a fresh netlist and solve', async () => {
    const doc = feed();
    const bend = doc.nodes.find((n) => n.kind === 'vertex')!.id;
    const pipeline = new DesignPipeline();
    const freqs = sweepFrequencies({ ...designSweepSettings(doc), points: 5 });
    for (let k = 0; k < 3; k++) {
      const d = moved(doc, bend, k);
      const { response } = await sweepDesign(pipeline, d, freqs);
      const fresh = solveNetwork(netlistFromSized(sizeDesign(d)), freqs);
      expect(new Uint8Array(response.s.buffer)).toEqual(new Uint8Array(fresh.s.buffer));
    }
  }, 120_000);

  it('every example, swept twice on one pipeline (the second from kept values): bit-identical to a fresh solve', async () => {
    const pipeline = new DesignPipeline();
    for (const [name, doc] of examples()) {
      const freqs = sweepFrequencies({ ...designSweepSettings(doc), points: 15 });
      const fresh = solveNetwork(netlistFromSized(sizeDesign(doc)), freqs);
      for (let pass = 0; pass < 2; pass++) {
        const { response } = await sweepDesign(pipeline, doc, freqs);
        expect(new Uint8Array(response.s.buffer), `${name} pass ${pass}`).toEqual(new Uint8Array(fresh.s.buffer));
      }
    }
  }, 120_000);

  it('kept values are used: the second sweep computes no line model value and no element again', () => {
    let calls = 0;
    const counted = (z: number): LineModel => Object.assign((f: number) => { calls++; return idealLine(z, 2)(f); }, { key: `ideal ${z}` });
    const net: Netlist = {
      elements: [
        { kind: 'line', id: 'a', a: 'p1', b: 'm', length: 0.02, model: counted(50) },
        { kind: 'line', id: 'b', a: 'm', b: 'p2', length: 0.03, model: counted(70) },
      ],
      ports: [{ name: '1', node: 'p1', zRef: 50 }, { name: '2', node: 'p2', zRef: 50 }],
    };
    const values = new SweepValues();
    const freqs = [1e9, 2e9, 3e9];
    const first = solveNetwork(net, freqs, { values });
    expect(calls).toBe(6);
    const second = solveNetwork(net, freqs, { values });
    expect(calls).toBe(6);
    expect(second.s).toEqual(first.s);
    // A changed length is a new key: that line alone is computed again.
    solveNetwork({ ...net, elements: [net.elements[0]!, { ...net.elements[1]!, length: 0.031 } as NetElement] }, freqs, { values });
    expect(calls).toBe(9);
  });
});

describe('the entries a live view reads (viewEntries)', () => {
  const ports = (n: number) => Array.from({ length: n }, (_, i) => ({ name: `p${i}` }));
  it('a network of up to four ports is swept whole; a feed asks for its input column and row and every reflection', () => {
    expect(viewEntries({ ports: ports(4), input: 0 }, { targets: [], phaseGroups: [] })).toBeUndefined();
    expect(viewEntries({ ports: ports(9), input: 0 }, { targets: [], phaseGroups: [] })).toEqual({ columns: [0], rows: [0], diagonal: true });
  });
  it('targets add the columns they read; a target on an unknown port asks for every entry', () => {
    const band = { start: 1e9, stop: 2e9 };
    const targets = [
      { id: 'a', figure: 'isolation' as const, ports: ['p3', 'p5'], band, limit: { min: 20 } },
      { id: 'b', figure: 'insertion-loss' as const, ports: ['p2', 'p7'], band, limit: { max: 1 } },
      { id: 'c', figure: 'phase-balance' as const, group: 'g', band, limit: { max: 5 } },
    ];
    const groups = [{ id: 'g', name: 'g', from: 'p1', to: ['p6', 'p8'], toleranceDeg: 5 }];
    expect(viewEntries({ ports: ports(9), input: 0 }, { targets, phaseGroups: groups })).toEqual({ columns: [0, 5, 2, 1], rows: [0], diagonal: true });
    expect(viewEntries({ ports: ports(9), input: 0 }, { targets: [{ ...targets[0]!, ports: ['p3', 'nowhere'] }], phaseGroups: [] })).toBeUndefined();
  });
});
