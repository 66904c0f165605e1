/**
 * Generator of equal-split corporate feeds: a binary tree of T-junctions feeding N = 2^k outputs in a row.
 * Used by the benchmarks (layout, network, renderer) and as a starting point for array feeds. An invented design of
 * our own (no measured board behind it).
 *
 * Topology per split (the usual equal corporate split, quarter-wave transformer Z = √(Z0 Z_L) per Pozar, Microwave Engineering, 4th ed., §5.4):
 *   junction ─ 2·Z0 run (drawn length, horizontal) ─ optimal-miter bend ─ √2·Z0 quarter-wave (vertical, 90° at f0)
 *   ─ next junction (or, at the last level, a Z0 run to the output port).
 * Two 2·Z0 arms in parallel present Z0 at the junction; each √2·Z0 quarter wave turns the next level's Z0 into 2·Z0.
 * Outputs sit on a row at `pitch`; the input port is above the root junction.
 */
import type { DesignDoc, DesignNode, DesignSegment, BendStyle } from '../../design/types.ts';
import { newDesign, type NewDesignOptions } from '../../design/defaults.ts';
import { InputError } from '../../util/errors.ts';

export interface CorporateFeedOptions extends NewDesignOptions {
  /** Number of outputs, a power of two from 2 to 4096. */
  outputs: number;
  /** Distance between neighbouring outputs, m (default 20 mm). */
  pitch?: number;
  /** System impedance, Ω (default 50). */
  z0?: number;
  /** Length of the input and output runs, m (default 8 mm). */
  feedLength?: number;
  bend?: BendStyle;
  /** Phase tolerance of the generated phase group, degrees (default 5). */
  toleranceDeg?: number;
}

export function corporateFeed(opts: CorporateFeedOptions): DesignDoc {
  const n = opts.outputs;
  if (!Number.isInteger(n) || n < 2 || n > 4096 || (n & (n - 1)) !== 0) {
    throw new InputError('out-of-range', 'outputs', 'a power of two from 2 to 4096', String(n));
  }
  const pitch = opts.pitch ?? 20e-3;
  const z0 = opts.z0 ?? 50;
  const feed = opts.feedLength ?? 8e-3;
  const bend: BendStyle = opts.bend ?? { style: 'miter-optimal' };
  // Plain microstrip unless asked: its 100 Ω branches cannot be had beside one isolation cut on usual laminates (a V-bit
  // pass on 1.6 mm FR-4 reaches about 88 Ω), so such a feed is milled with the rest of the copper cleared.
  const doc = newDesign({ name: `${n}-way corporate feed`, asMade: { sizing: 'microstrip', sideCopper: 'stitched' }, ...opts });
  const nodes: DesignNode[] = [];
  const segments: DesignSegment[] = [];
  // Drawn drop of one level: only the direction matters for quarter-wave pieces (sizing fixes their length).
  const drop = 10e-3;
  nodes.push({ id: 'in', kind: 'port', zRef: z0, heading: -Math.PI / 2, at: { x: 0, y: feed } });
  nodes.push({ id: 'j', kind: 'junction', at: { x: 0, y: 0 } });
  segments.push({ id: 'feed', a: 'in', b: 'j', kind: 'line', width: { by: 'z0', z0 }, length: { by: 'length', length: feed } });
  const outputs: string[] = [];
  let seq = 0;
  const grow = (jid: string, x: number, y: number, count: number): void => {
    const half = (count * pitch) / 4;
    for (const side of [-1, 1] as const) {
      const k = seq++;
      const v = `v${k}`, t = `t${k}`;
      const xs = x + side * half;
      nodes.push({ id: v, kind: 'vertex', bend, at: { x: xs, y } });
      segments.push({ id: `arm${k}`, a: jid, b: v, kind: 'line', width: { by: 'z0', z0: 2 * z0 }, length: { by: 'drawn' } });
      if (count === 2) {
        nodes.push({ id: t, kind: 'vertex', bend: { style: 'square' }, at: { x: xs, y: y - drop } });
        segments.push({ id: `qw${k}`, a: v, b: t, kind: 'line', width: { by: 'z0', z0: Math.SQRT2 * z0 }, length: { by: 'degrees', deg: 90 } });
        const o = `out${outputs.length + 1}`;
        nodes.push({ id: o, kind: 'port', zRef: z0, heading: Math.PI / 2, at: { x: xs, y: y - drop - feed } });
        segments.push({ id: `run${k}`, a: t, b: o, kind: 'line', width: { by: 'z0', z0 }, length: { by: 'length', length: feed } });
        outputs.push(o);
      } else {
        const jn = `j${k}`;
        nodes.push({ id: jn, kind: 'junction', at: { x: xs, y: y - drop } });
        segments.push({ id: `qw${k}`, a: v, b: jn, kind: 'line', width: { by: 'z0', z0: Math.SQRT2 * z0 }, length: { by: 'degrees', deg: 90 } });
        grow(jn, xs, y - drop, count / 2);
      }
    }
  };
  grow('j', 0, 0, n);
  // Outputs left to right (the recursion visits them in that order already).
  doc.nodes = nodes;
  doc.segments = segments;
  doc.phaseGroups = [{ id: 'outputs', name: 'all outputs in phase', from: 'in', to: outputs, toleranceDeg: opts.toleranceDeg ?? 5 }];
  return doc;
}
