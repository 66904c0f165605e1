/**
 * Junction models in the response: the demo design (assets/examples/demo.json: three tees, two width steps) swept
 * the way the app does it — sizing, netlist, 1001-point sweep — with its junctions modelled (Hammerstad 1981 tees as
 * n-ports re-evaluated at every point, Garg–Bahl steps) and with ideal junctions (the comparison choice, the same
 * work as before junction models existed). Prints median and fastest CPU time of several warm runs of each and their ratio.
 * Target (issue 16): with junctions no slower than twice the ideal sweep.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, type DesignDoc, type JunctionChoice } from '../core/design/index.ts';
import { sizeDesign } from '../core/layout/index.ts';
import { netlistFromSized, solveNetwork, sweepFrequencies } from '../core/network/index.ts';

/** CPU time (user + system) of one response, ms: steadier than wall time on a shared machine. */
function response(doc: DesignDoc, junctions: JunctionChoice, freqs: Float64Array): number {
  const t0 = process.cpuUsage();
  const sized = sizeDesign(doc, { junctions });
  solveNetwork(netlistFromSized(sized), freqs);
  const d = process.cpuUsage(t0);
  return (d.user + d.system) / 1000;
}

export async function run(): Promise<void> {
  const parsed = parseDesign(readFileSync(join(import.meta.dirname, '..', 'assets', 'examples', 'demo.json'), 'utf8'));
  if (!parsed.ok) throw new Error('demo.json does not load');
  const doc = parsed.doc;
  const points = 1001;
  const freqs = sweepFrequencies({ start: 4e9, stop: 8e9, points });
  const stats = (choice: JunctionChoice) => {
    for (let i = 0; i < 3; i++) response(doc, choice, freqs); // warm up
    const t: number[] = [];
    for (let i = 0; i < 9; i++) t.push(response(doc, choice, freqs));
    t.sort((a, b) => a - b);
    return { median: t[4]!, fastest: t[0]! };
  };
  // Interleaved order would mix compiler feedback; each choice is measured in a block, ideal first.
  const ideal = stats('ideal');
  const modelled = stats('modelled');
  const sized = sizeDesign(doc);
  const tees = sized.nodes.filter((n) => n.tee?.modelled).length, steps = sized.nodes.filter((n) => n.step?.modelled).length;
  console.log(`junctions: demo design (${sized.pieces.length} pieces, ${tees} tees, ${steps} width steps), sizing + netlist + ${points}-point sweep`);
  console.log(`  CPU time per response (user + system)`);
  console.log(`  ideal junctions:    median ${ideal.median.toFixed(1)} ms, fastest ${ideal.fastest.toFixed(1)} ms`);
  console.log(`  modelled junctions: median ${modelled.median.toFixed(1)} ms, fastest ${modelled.fastest.toFixed(1)} ms`);
  console.log(`  ratio (median): ${(modelled.median / ideal.median).toFixed(2)}× — target ≤ 2×`);
}
