/**
 * The large design the kill test saves: invented test data, a long meandering 50 Ω run of `segments` pieces on the
 * default substrate (about 0.9 MiB of JSON at the default size), valid for core/design's parser.
 */
import { newDesign } from '../core/design/defaults.ts';
import type { DesignDoc } from '../core/design/types.ts';

export const KILL_TEST_FILE = 'kill-test.stripwright';

export function killTestDesign(segments = 4000): DesignDoc {
  const doc = newDesign({ name: 'Kill-test meander (invented test data)', f0: 2.45e9 });
  const pitch = 0.002;
  const at = (i: number) => ({ x: (i % 50) * pitch * (Math.floor(i / 50) % 2 === 0 ? 1 : -1) + 0.1, y: Math.floor(i / 50) * pitch + 0.01 });
  doc.nodes.push({ id: 'n0', kind: 'port', at: at(0), zRef: 50, heading: 0 });
  for (let i = 1; i < segments; i++) doc.nodes.push({ id: `n${i}`, kind: 'vertex', at: at(i), bend: { style: 'miter-optimal' }, label: `bend ${i} of the meander` });
  doc.nodes.push({ id: `n${segments}`, kind: 'open', at: { x: at(segments - 1).x, y: at(segments - 1).y + pitch } });
  for (let i = 0; i < segments; i++) doc.segments.push({ id: `s${i}`, a: `n${i}`, b: `n${i + 1}`, kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } });
  return doc;
}
