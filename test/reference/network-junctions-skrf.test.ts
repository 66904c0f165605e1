/**
 * Junctions in the response against scikit-rf (Debian python3-scikit-rf 0.15.4, scripts/reference/skrf_network.py,
 * copper thickness t = 0): sized designs with tees are swept by our solver (tees as junctionStar n-ports, steps as
 * L–C–L), and the same networks are rebuilt in the library from the same element values — each piece a line from
 * reference plane to reference plane, the planes and turns ratio taken at every frequency from the test's own
 * transcription of Hammerstad 1981 (junction-oracle.ts), the branch joined through an ideal transformer, every
 * junction point the library's ideal splitter. Lines carry the real part of Zc from our line model (the library's line
 * media take a real Z0) and the full complex γ, on both sides.
 */
import { describe, expect, it } from 'vitest';
import { sizeDesign } from '../../core/layout/index.ts';
import { lineConstants } from '../../core/line/index.ts';
import { netlistFromSized, solveNetwork, sweepFrequencies, type LineModel } from '../../core/network/index.ts';
import type { DesignDoc } from '../../core/design/index.ts';
import type { SizedDesign } from '../../core/layout/types.ts';
import { python } from './network-oracle.ts';
import { oracleTee } from './junction-oracle.ts';
import { design, port, junction, line, z, degs, lenOf, RO_LIKE } from '../unit/layout-fixtures.ts';

interface SkrfLine { id: string; a: string; b: string; lengths: number[]; z0: number[]; gamma: [number, number][] }

function rebuild(sized: SizedDesign, freqs: Float64Array) {
  const sub = sized.doc.substrate, h = sub.h;
  const lines: SkrfLine[] = [];
  const transformers: { id: string; a: string; b: string; n: number[] }[] = [];
  const tees = new Map(sized.nodes.filter((n) => n.tee?.modelled).map((n) => [n.id, n.tee!]));
  /** The plane shift of `piece` at tee `node` at f, and whether it is the branch. */
  const shift = (piece: string, node: string, f: number): { d: number; branch: boolean; n2: number } => {
    const t = tees.get(node)!;
    const [m0, m1] = t.arms.main, br = t.arms.branch;
    const a = oracleTee(m0.z, br.z, m0.ee, br.ee, h, f), b = oracleTee(m1.z, br.z, m1.ee, br.ee, h, f);
    const n2 = (a.n2 + b.n2) / 2;
    if (piece === t.main[0]) return { d: a.d1, branch: false, n2 };
    if (piece === t.main[1]) return { d: b.d1, branch: false, n2 };
    return { d: (a.d2 + b.d2) / 2, branch: true, n2 };
  };
  for (const p of sized.pieces) {
    const ends = [p.a, p.b].map((node) => {
      if (!tees.has(node)) return node;
      const probe = shift(p.id, node, freqs[0]!);
      if (!probe.branch) return node;
      const inner = `${node}~branch`;
      transformers.push({ id: `${node}:n`, a: node, b: inner, n: Array.from(freqs, (f) => Math.sqrt(shift(p.id, node, f).n2)) });
      return inner;
    });
    const lengths = Array.from(freqs, (f) => p.length - [p.a, p.b].reduce((s, node) => s + (tees.has(node) ? shift(p.id, node, f).d : 0), 0));
    const z0: number[] = [], gamma: [number, number][] = [];
    for (const f of freqs) { const c = lineConstants(sub, p.width, f); z0.push(c.zc.re); gamma.push([c.gamma.re, c.gamma.im]); }
    lines.push({ id: p.id, a: ends[0]!, b: ends[1]!, lengths, z0, gamma });
  }
  const ports = sized.nodes.filter((n) => n.port).map((n) => ({ name: n.id, node: n.id, zRef: n.port!.zRef }));
  return { lines, transformers, ports };
}

function compareWithSkrf(doc: DesignDoc, freqs: Float64Array): number {
  const sized = sizeDesign(doc);
  expect(sized.problems).toEqual([]);
  const sub = doc.substrate;
  const realZ = (w: number): LineModel => (f) => { const c = lineConstants(sub, w, f); return { zc: { re: c.zc.re, im: 0 }, gamma: c.gamma }; };
  const net = netlistFromSized(sized, { lineModel: realZ });
  const ours = solveNetwork(net, freqs);
  const spec = rebuild(sized, freqs);
  // Same port order on both sides.
  expect(ours.ports.map((p) => p.name)).toEqual(spec.ports.map((p) => p.name));
  const out = JSON.parse(python('skrf_network.py', JSON.stringify({ freqs: Array.from(freqs), ...spec, resistors: [], mode: 'graph' }))) as { s: number[][][][] };
  const P = ours.ports.length;
  let worst = 0, worstMag = 0;
  out.s.forEach((m, k) => m.forEach((row, i) => row.forEach(([re, im], j) => {
    const t = 2 * ((k * P + i) * P + j);
    worst = Math.max(worst, Math.hypot(ours.s[t]! - re!, ours.s[t + 1]! - im!));
    worstMag = Math.max(worstMag, Math.abs(Math.hypot(ours.s[t]!, ours.s[t + 1]!) - Math.hypot(re!, im!)));
  })));
  expect(worstMag).toBeLessThan(1e-9);
  expect(worst).toBeLessThan(1e-9);
  return worst;
}

const sub0 = { ...RO_LIKE, t: 0 };

describe('tee junctions in the response agree with scikit-rf 0.15.4 rebuilt from the same element values', () => {
  it('one tee with unequal main arms (50 / 35 Ω) and a 60 Ω branch, three ports, 1–20 GHz', () => {
    const doc = design({
      substrate: sub0, f0: 10e9,
      nodes: [port('p', 0, 0), junction('t', 0.008, 0), port('q', 0.02, 0, Math.PI), port('r', 0.008, 0.012, -Math.PI / 2)],
      segments: [line('in', 'p', 't', z(50), lenOf(0.008)), line('out', 't', 'q', z(35), degs(70)), line('br', 't', 'r', z(60), degs(50))],
    });
    compareWithSkrf(doc, sweepFrequencies({ start: 1e9, stop: 20e9, points: 39 }));
  });
  it('a branch-line loop of four tees (shunt arms through transformers at both ends), four ports, 8–13 GHz', () => {
    const L = 0.0045, W = 0.0055, feed = 0.004;
    const doc = design({
      substrate: sub0, f0: 10.368e9,
      nodes: [junction('j1', 0, 0), junction('j2', L, 0), junction('j3', L, W), junction('j4', 0, W),
        port('p1', -feed, 0), port('p2', L + feed, 0, Math.PI), port('p3', L + feed, W, Math.PI), port('p4', -feed, W)],
      segments: [line('t1', 'j1', 'j2', z(35.36), degs(90)), line('s2', 'j2', 'j3', z(48.1), degs(90)), line('t2', 'j3', 'j4', z(35.36), degs(90)), line('s1', 'j4', 'j1', z(48.1), degs(90)),
        line('f1', 'p1', 'j1', z(50), lenOf(feed)), line('f2', 'j2', 'p2', z(50), lenOf(feed)), line('f3', 'j3', 'p3', z(50), lenOf(feed)), line('f4', 'p4', 'j4', z(50), lenOf(feed))],
    });
    compareWithSkrf(doc, sweepFrequencies({ start: 8e9, stop: 13e9, points: 26 }));
  });
});
