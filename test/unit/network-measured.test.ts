/**
 * Measured files beside the simulation (core/network/measured.ts): the port map puts a file's ports in the design's
 * order, the file is renormalised to the design's references, and compareResponses measures the difference.
 * A "measured" file is made here from the simulation itself with its ports shuffled (invented data for the test), so
 * the right map must give no difference and a wrong one a large one. The renormalisation is the Kurokawa (1965)
 * power-wave change of reference (conversions.ts), tested on its own elsewhere; here a file written at 25 Ω must read
 * back as the 50 Ω simulation.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, sizeDesign, netlistFromSized, sweepNetwork, writeTouchstone, guessPortMap, measuredForDesign, compareMeasured, measuredPortCount, InputError, type NetworkResponse, type MeasuredFile } from '../../core/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
let sim: NetworkResponse;

beforeAll(async () => {
  const p = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), 'utf8'));
  if (!p.ok) throw new Error('example does not load');
  const sized = sizeDesign(p.doc);
  sim = await sweepNetwork(netlistFromSized(sized), { start: 2.3e9, stop: 2.6e9, points: 31 });
});

/** The simulation with its ports in the order `order` (file port k = design port order[k]). */
function shuffled(r: NetworkResponse, order: number[]): NetworkResponse {
  const P = r.ports.length, s = new Float64Array(r.s.length);
  for (let k = 0; k < r.freqs.length; k++) for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
    const a = 2 * ((k * P + i) * P + j), b = 2 * ((k * P + order[i]!) * P + order[j]!);
    s[a] = r.s[b]!; s[a + 1] = r.s[b + 1]!;
  }
  return { freqs: r.freqs, ports: order.map((k) => r.ports[k]!), s, warnings: [] };
}

describe('measured files and their port maps', () => {
  it('guesses the map in order and leaves extra file ports out', () => {
    expect(guessPortMap(3, ['in', 'o1', 'o2'])).toEqual(['in', 'o1', 'o2']);
    expect(guessPortMap(4, ['in', 'o1'])).toEqual(['in', 'o1', '', '']);
  });

  it('with the right map, a file of the simulation with its ports shuffled shows no difference (1.1 and 2.0)', () => {
    const order = [2, 0, 1];
    for (const version of ['1.1', '2.0'] as const) {
      const text = writeTouchstone(shuffled(sim, order), { version });
      const m: MeasuredFile = { id: 'm1', name: 'board.s3p', touchstone: text, ports: order.map((k) => sim.ports[k]!.name) };
      expect(measuredPortCount(m)).toBe(3);
      const c = compareMeasured(sim, m);
      expect(c.diff.worst.vector.value).toBeLessThan(1e-9);
      // In order the guess is wrong for this file, and the difference says so.
      const wrong = compareMeasured(sim, { ...m, ports: guessPortMap(3, sim.ports.map((p) => p.name)) });
      expect(wrong.diff.worst.vector.value).toBeGreaterThan(0.1);
    }
  });

  it('renormalises a file measured at another reference to the design ports', () => {
    const text = writeTouchstone(sim, { zRef: 25 });
    expect(text).toMatch(/R 25/);
    const m: MeasuredFile = { id: 'm1', name: 'at25.s3p', touchstone: text, ports: sim.ports.map((p) => p.name) };
    const r = measuredForDesign(m, sim.ports);
    expect(r.warnings.some((w) => /renormalised/.test(w.message))).toBe(true);
    const c = compareMeasured(sim, m);
    expect(c.diff.worst.vector.value).toBeLessThan(1e-9);
  });

  it('gives per-frequency dB and vector differences (a board 0.9× in S21 shows −0.915 dB = 20·log10 0.9)', () => {
    const P = sim.ports.length, low = { ...sim, s: new Float64Array(sim.s) };
    for (let k = 0; k < sim.freqs.length; k++) { const t = 2 * ((k * P + 1) * P + 0); low.s[t]! *= 0.9; low.s[t + 1]! *= 0.9; }
    const m: MeasuredFile = { id: 'm', name: 'low.s3p', touchstone: writeTouchstone(low), ports: sim.ports.map((p) => p.name) };
    const e = compareMeasured(sim, m).diff.entries.find((x) => x.i === 1 && x.j === 0)!;
    for (const d of e.dbSeries) expect(d).toBeCloseTo(-20 * Math.log10(0.9), 9);
    expect(e.dbSeries.length).toBe(sim.freqs.length);
  });

  it('refuses a map that leaves a design port out or measures it twice, naming it', () => {
    const text = writeTouchstone(sim);
    const names = sim.ports.map((p) => p.name);
    const twice: MeasuredFile = { id: 'm', name: 'b.s3p', touchstone: text, ports: [names[0]!, names[0]!, names[2]!] };
    expect(() => measuredForDesign(twice, sim.ports)).toThrow(InputError);
    expect(() => measuredForDesign(twice, sim.ports)).toThrow(new RegExp(`design port ${names[0]}`));
    expect(() => measuredForDesign({ ...twice, ports: ['in'] }, sim.ports)).toThrow(/one entry per port of the file \(3\)/);
  });
});
