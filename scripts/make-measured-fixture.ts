/**
 * Writes test/fixtures/measured/demo-board.s5p: an invented "measured" file of the demo board for the Measured-tab
 * tests — the demo's own simulation with every transmission from the input scaled by 0.9 (−0.915 dB), to out2 by 0.7 (−3.098 dB), file ports 2
 * and 3 swapped (so the in-order guess of the port map is wrong), and written at 50 Ω on every port (so the app must
 * renormalise to the design's 100 Ω outputs). Run: npx tsx scripts/make-measured-fixture.ts
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseDesign, sizeDesign, netlistFromSized, sweepNetwork, writeTouchstone } from '../core/index.ts';

const p = parseDesign(readFileSync('assets/examples/demo.json', 'utf8'));
if (!p.ok) throw new Error('demo does not load');
const sized = sizeDesign(p.doc);
const net = netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {});
const r = await sweepNetwork(net, { start: 5.6e9, stop: 6.0e9, points: 101 });
const P = r.ports.length, order = [0, 2, 1, 3, 4];
const s = new Float64Array(r.s.length);
for (let k = 0; k < r.freqs.length; k++) for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
  const a = 2 * ((k * P + i) * P + j), b = 2 * ((k * P + order[i]!) * P + order[j]!);
  const through = order[i] !== order[j] && (order[i] === net.input || order[j] === net.input);
  const scale = !through ? 1 : r.ports[order[i] === net.input ? order[j]! : order[i]!]!.name === 'out2' ? 0.7 : 0.9;
  s[a] = r.s[b]! * scale; s[a + 1] = r.s[b + 1]! * scale;
}
const text = writeTouchstone({ freqs: r.freqs, ports: order.map((k) => r.ports[k]!), s, warnings: [] }, {
  zRef: 50, format: 'ma', comments: ['invented measured data for tests: the demo simulation, transmissions from the input x0.9 (to out2 x0.7), file ports 2 and 3 swapped'],
});
writeFileSync('test/fixtures/measured/demo-board.s5p', text);
console.log(`ports in file order: ${order.map((k) => r.ports[k]!.name).join(', ')}`);
