/**
 * The hybrids with losses: in a ring the loss does not sit on one path (power reaches an output both ways round),
 * so "the ideal less its path's loss" is defined here as the textbook hybrid whose every arm carries the loss our
 * line model gives that arm's sized pieces:
 * - branch-line: D. M. Pozar, Microwave Engineering, 4th ed., 2012, §7.5 (series arms Z0/√2, shunt arms Z0, each
 *   90° at f0);
 * - rat-race: Pozar §7.8 (a ring of √2·Z0, arms of 90°, 90°, 90° and 270° between the ports);
 * each arm (and each port line, of Z0) a line of that impedance, of exactly its textbook electrical length at f0 and
 * of the attenuation (dB → Np) the core's line model gives the pieces it is made of (lossDbPerM × the length the
 * network models), joined at ideal junctions. The network is connected and solved by Debian's scikit-rf 0.15.4
 * (scripts/reference/skrf_network.py, "graph": ideal splitters and innerconnect), not by our solver.
 * Our lossy sweep of the sized block (junction and bend models included) must give every transmission within 0.1 dB
 * of that reference at f0: the figure. A lossless copy of the same reference meets the ideal split (−3.01 dB),
 * which checks the reference itself. FR-4 (tanδ 0.02) and 2.45 GHz are a scenario of our own, chosen lossy so the
 * check has something to see.
 */
import { describe, expect, it } from 'vitest';
import { makeBlockDesign, sizeDesign, netlistFromSized, solveNetwork, type DesignDoc, type SubstrateSpec } from '../../core/index.ts';
import { python } from './network-oracle.ts';

const FR4: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const F0 = 2.45e9;
const NP_PER_DB = Math.LN10 / 20;

interface Arm { id: string; a: string; b: string; z0: number; deg: number; pieces: string[] }

/** The reference's |S| in dB (to, from) and ours, with and without the arms' losses. */
function compare(doc: DesignDoc, arms: Arm[], ports: string[]) {
  const sized = sizeDesign(doc);
  expect(sized.problems).toEqual([]);
  const lossDb = (id: string) => {
    const p = sized.pieces.find((x) => x.id === `b1.${id}`);
    if (!p?.line) throw new Error(`no sized line b1.${id}`);
    return p.line.lossDbPerM * p.length;
  };
  const lines = (lossy: boolean) => arms.map((a) => {
    const np = lossy ? a.pieces.reduce((s, id) => s + lossDb(id), 0) * NP_PER_DB : 0;
    // A 1 m line of propagation constant (attenuation in Np, phase in rad) is the arm itself.
    return { id: a.id, a: `b1.${a.a}`, b: `b1.${a.b}`, length: 1, z0: [a.z0], gamma: [[np, (a.deg * Math.PI) / 180]] };
  });
  const spec = (lossy: boolean) => JSON.stringify({ freqs: [F0], lines: lines(lossy), resistors: [], ports: ports.map((p) => ({ name: `b1.${p}`, node: `b1.${p}`, zRef: 50 })), mode: 'graph' });
  const ref = (lossy: boolean) => (JSON.parse(python('skrf_network.py', spec(lossy))) as { s: [number, number][][][] }).s[0]!;
  const ours = solveNetwork(netlistFromSized(sized), [F0]);
  const P = ours.ports.length;
  const oursDb = (to: string, from: string) => {
    const i = ours.ports.findIndex((p) => p.name === `b1.${to}`), j = ours.ports.findIndex((p) => p.name === `b1.${from}`);
    const t = 2 * (i * P + j);
    return 20 * Math.log10(Math.hypot(ours.s[t]!, ours.s[t + 1]!));
  };
  const lossy = ref(true), ideal = ref(false);
  const refDb = (m: [number, number][][], to: string, from: string) => {
    const [re, im] = m[ports.indexOf(to)]![ports.indexOf(from)]!;
    return 20 * Math.log10(Math.hypot(re, im));
  };
  return { ours: oursDb, lossy: (to: string, from: string) => refDb(lossy, to, from), ideal: (to: string, from: string) => refDb(ideal, to, from), lossDb };
}

const MICROSTRIP = { sizing: 'microstrip', sideCopper: 'stitched' } as const;
const make = (kind: string) => makeBlockDesign(kind, {}, { f0: F0, substrate: FR4, asMade: MICROSTRIP });

describe('hybrids with losses, at f0, against the textbook hybrid with each arm\'s line loss (scikit-rf)', () => {
  it('branch-line 3 dB (Pozar §7.5): through and coupled within 0.1 dB of the reference', () => {
    const z = 50 / Math.SQRT2;
    const arms: Arm[] = [
      { id: 'thru1', a: 'j1', b: 'j2', z0: z, deg: 90, pieces: ['thru1'] },
      { id: 'shunt2', a: 'j2', b: 'j3', z0: 50, deg: 90, pieces: ['shunt2'] },
      { id: 'thru2', a: 'j3', b: 'j4', z0: z, deg: 90, pieces: ['thru2'] },
      { id: 'shunt1', a: 'j4', b: 'j1', z0: 50, deg: 90, pieces: ['shunt1'] },
      ...[1, 2, 3, 4].map((i) => ({ id: `f${i}`, a: `p${i}`, b: `j${i}`, z0: 50, deg: 90, pieces: [`f${i}a`, `f${i}b`] })),
    ];
    const c = compare(make('branchline'), arms, ['p1', 'p2', 'p3', 'p4']);
    for (const to of ['p2', 'p3']) {
      // The reference itself: lossless it is the ideal 3 dB split (Pozar eq. 7.51), lossy it is lower.
      expect(Math.abs(c.ideal(to, 'p1') + 3.0103), `ideal ${to}`).toBeLessThan(0.01);
      expect(c.lossy(to, 'p1')).toBeLessThan(c.ideal(to, 'p1') - 0.1);
      expect(Math.abs(c.ours(to, 'p1') - c.lossy(to, 'p1')), to).toBeLessThan(0.1);
    }
  }, 60_000);
  it('rat-race (Pozar §7.8): Σ and Δ to both outputs within 0.1 dB of the reference', () => {
    const zr = 50 * Math.SQRT2;
    const arms: Arm[] = [
      { id: 'r1', a: 'j1', b: 'j2', z0: zr, deg: 90, pieces: ['r1a', 'r1b'] },
      { id: 'r2', a: 'j2', b: 'j3', z0: zr, deg: 90, pieces: ['r2'] },
      { id: 'r3', a: 'j3', b: 'j4', z0: zr, deg: 90, pieces: ['r3a', 'r3b'] },
      { id: 'r4', a: 'j4', b: 'j1', z0: zr, deg: 270, pieces: ['r4a', 'r4b', 'r4c'] },
      ...([['d', 'j1'], ['o1', 'j2'], ['s', 'j3'], ['o2', 'j4']] as const).map(([p, j]) => ({ id: `f${p}`, a: p, b: j, z0: 50, deg: 90, pieces: [`f${p}`] })),
    ];
    const c = compare(make('ratrace'), arms, ['d', 'o1', 's', 'o2']);
    for (const from of ['s', 'd']) for (const to of ['o1', 'o2']) {
      expect(Math.abs(c.ideal(to, from) + 3.0103), `ideal ${from}→${to}`).toBeLessThan(0.01);
      expect(c.lossy(to, from)).toBeLessThan(c.ideal(to, from) - 0.1);
      expect(Math.abs(c.ours(to, from) - c.lossy(to, from)), `${from}→${to}`).toBeLessThan(0.1);
    }
  }, 60_000);
});
