/**
 * Yield benchmark (README Benchmarks, `npm run bench -- yield`), CPU time of this process on one core:
 *  1. 1000 boards of the Wilkinson example (its own tolerances: board-wide εr, h, tanδ, t, etch bias, analysed
 *     exactly; the per-piece width error to first order in each piece's lines, batch-solver.ts; the per-piece
 *     resistor exactly) at 201 points, every board analysed in full and its four targets evaluated (ranking off; then
 *     the default 100-board ranking on its own). Target: ≤ 1 s.
 *  2. 10 000 boards of the generated 64-output corporate feed's 64 path phases with board-wide εr, h, t and tool width
 *     exact (every width re-analysed per board); no per-piece tolerance here (any per-piece tolerance — a piece's own
 *     width error, or a laminate quantity given per piece — would enter to first order, path-phase.ts). Target: ≤ 1 s.
 * A warm-up run precedes each measure (the engine compiles the hot loops on first use).
 */
import { readFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { corporateFeed, sizeDesign, designPaths, parseDesign, runYield, pathPhaseMonteCarlo } from '../core/index.ts';
import { cpuMs } from './timing.ts';


/** CPU time of this process (every thread: the engine's compiler and collector too) and wall time of one call. */
async function measure<T>(run: () => Promise<T>): Promise<{ value: T; cpu: number; wall: number }> {
  const t = process.cpuUsage(), w = performance.now();
  const value = await run();
  return { value, cpu: cpuMs(t), wall: performance.now() - w };
}

/** The machine's load (1-minute average over its cores): CPU time stretches on a busy machine, wall time more so. */
function load(): string { return `load ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} cores`; }

export async function run(): Promise<void> {
  const r = parseDesign(readFileSync(join(import.meta.dirname, '..', 'assets', 'examples', 'wilkinson-2g45.json'), 'utf8'));
  if (!r.ok) throw new Error('the Wilkinson example does not load');
  await runYield(r.doc, { samples: 100, seed: 1, rankingSamples: 0 });
  const main = await measure(() => runYield(r.doc, { samples: 1000, seed: 1, rankingSamples: 0 }));
  const y = main.value, tMain = main.cpu;
  // The same run again: the engine has compiled everything by now, so this is the steady figure.
  const again = await measure(() => runYield(r.doc, { samples: 1000, seed: 1, rankingSamples: 0 }));
  const t100 = (await measure(() => runYield(r.doc, { samples: 100, seed: 1, rankingSamples: 0 }))).cpu;
  const tRank = (await measure(() => runYield(r.doc, { samples: 100, seed: 1, rankingSamples: 100 }))).cpu - t100;
  console.log(`yield: Wilkinson, 1000 boards × ${y.freqs.length} points, ${y.targets.length} targets, ${y.tolerances.length} tolerances (per-piece width error to first order, the rest exact): ${tMain.toFixed(0)} ms CPU, ${main.wall.toFixed(0)} ms wall, ${load()} (target ≤ 1000 ms CPU; ${(tMain / 1000).toFixed(2)} ms per board; the same run again ${again.cpu.toFixed(0)} ms CPU); overall yield ${(100 * y.overall.yield.p).toFixed(1)} %`);
  console.log(`yield: its one-at-a-time ranking (${y.tolerances.length} tolerances × 100 boards): ${tRank.toFixed(0)} ms CPU`);

  const doc = corporateFeed({ outputs: 64 });
  doc.tolerances = [
    { quantity: 'er', distribution: 'normal', spread: 0.1, scope: 'board' },
    { quantity: 'h', distribution: 'normal', spread: 50e-6, scope: 'board' },
    { quantity: 't', distribution: 'normal', spread: 3e-6, scope: 'board' },
    { quantity: 'tool-width', distribution: 'uniform', spread: 20e-6, scope: 'board' },
  ];
  const sized = sizeDesign(doc);
  const reports = designPaths(sized, { sensitivities: false });
  await pathPhaseMonteCarlo(sized, { samples: 1000, seed: 1, reports });
  const phase = await measure(() => pathPhaseMonteCarlo(sized, { samples: 10_000, seed: 1, reports }));
  const p = phase.value, tPhase = phase.cpu;
  const g = p.groups[0]!;
  console.log(`yield: 64-output feed, 10 000 boards × ${g.paths.length} path phases (board-wide εr, h, t, tool width, exact; per-piece errors, none here, would be first order): ${tPhase.toFixed(0)} ms CPU, ${phase.wall.toFixed(0)} ms wall, ${load()} (target ≤ 1000 ms CPU); phase σ ${g.paths[0]!.stats.sd.toFixed(1)}° of ${g.paths[0]!.nominalDeg.toFixed(0)}°, balance within ±${g.toleranceDeg}° on ${(100 * g.balance.within.p).toFixed(1)} %`);
}
