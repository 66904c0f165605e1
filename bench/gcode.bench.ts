/**
 * G-code benchmark: the milling job for generated corporate feeds (16, 32 and 64 outputs; the 64-output feed is 1.3 m wide), in stages:
 *   toolpaths + G-code   planMilling without the board-as-milled analysis, then toGcode for every tool
 *   board as milled      the swept area, copper left, islands, widths and Z0 as milled, gap findings
 *   whole export         exportGcode from the design (sizing and copper included), what the CLI and the app run
 * Target: toolpaths and G-code of the 64-output feed under 1 s. Prints the median and the fastest of several runs
 * after a warm-up; other jobs sharing the cores inflate wall times, the fastest run is the least disturbed one.
 */
import { initPolygons } from '../core/geometry/polygons.ts';
import { corporateFeed } from '../core/layout/generators/corporateFeed.ts';
import { sizeDesign } from '../core/layout/sizing.ts';
import { buildBoardGeometry } from '../core/layout/geometry.ts';
import { planMilling } from '../core/toolpath/plan.ts';
import { toGcode } from '../core/export/gcode.ts';
import { exportGcode } from '../core/pipeline/gcode.ts';

const median = (xs: number[]) => { const s = xs.slice().sort((a, b) => a - b); return s[Math.floor(s.length / 2)]!; };
const f1 = (x: number, w: number) => x.toFixed(1).padStart(w);
// The feeds are wide (20 mm pitch): a large gantry's travel, so the work-area check passes.
const OPTIONS = { workArea: { width: 2, height: 1 } };
const INFO = { application: 'Stripwright', version: 'bench', designName: 'feed', designHash: '0' };

export async function run(): Promise<void> {
  await initPolygons();
  console.log('outputs  pieces  isolation pts  G-code kB  toolpaths+G-code ms (median/fastest)  board as milled ms  whole export ms  machining');
  for (const n of [16, 32, 64]) {
    const doc = corporateFeed({ outputs: n, f0: 5.8e9 });
    const sized = sizeDesign(doc);
    const g = buildBoardGeometry(sized);
    const runs = 7;
    for (let i = 0; i < 2; i++) planMilling(sized, g, OPTIONS); // warm-up
    const tp: number[] = [], an: number[] = [], all: number[] = [];
    let bytes = 0, pts = 0, minutes = 0;
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      const plan = planMilling(sized, g, OPTIONS, { analyse: false });
      bytes = plan.programs.reduce((s, p) => s + toGcode(plan, p, INFO).length, 0);
      const t1 = performance.now();
      planMilling(sized, g, OPTIONS);
      const t2 = performance.now();
      const ex = exportGcode(doc, OPTIONS, { base: 'feed', application: 'Stripwright', version: 'bench' });
      const t3 = performance.now();
      tp.push(t1 - t0); an.push(t2 - t1 - (t1 - t0)); all.push(t3 - t2);
      pts = plan.programs[0]!.moves.length; minutes = ex.plan.seconds / 60;
    }
    console.log(`${String(n).padStart(7)}  ${String(sized.pieces.length).padStart(6)}  ${String(pts).padStart(13)}  ${f1(bytes / 1024, 9)}  ${f1(median(tp), 18)} / ${f1(Math.min(...tp), 8)}          ${f1(median(an), 18)}  ${f1(median(all), 15)}  ${f1(minutes, 6)} min`);
    if (n === 64) console.log(`64 outputs: toolpaths + G-code median ${median(tp).toFixed(0)} ms, fastest ${Math.min(...tp).toFixed(0)} ms (target 1000 ms)`);
  }
}
