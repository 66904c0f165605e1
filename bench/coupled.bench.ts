/**
 * Coupled-line benchmark (`npm run bench -- coupled`): analyses per second of a coupled pair on one core (the
 * analysis core the network uses per frequency, coupledInto, and the public analyzeCoupled with its result record
 * and warnings), each pair a new geometry so no remembered geometry is reused; then a 1001-point sweep of a
 * fifth-order edge-coupled band-pass block (compile + solve), cold (first) and warm (best of 5).
 * Targets (issue 17): at least 300 000 analyses per second; the sweep under 50 ms.
 */
import { analyzeCoupled, coupledInto, coupledNumbers } from '../core/line/index.ts';
import { bandpassBlock } from '../core/blocks/index.ts';
import { sizeDesign } from '../core/layout/index.ts';
import { compileNetwork, netlistFromSized, solveNetwork, sweepFrequencies } from '../core/network/index.ts';
import { timed } from './timing.ts';

const SUB = { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 };

/** Calls per second by this process's CPU time (user + system): what one core does, whatever else shares the
 * machine (the wall-clock rate is printed beside it). */
function rate(n: number, body: (i: number) => void): { cpu: number; wall: number } {
  const c = process.cpuUsage(), t = performance.now();
  for (let i = 0; i < n; i++) body(i);
  const d = process.cpuUsage(c);
  return { cpu: n / ((d.user + d.system) / 1e6), wall: n / ((performance.now() - t) / 1000) };
}


export async function run(): Promise<void> {
  const N = 400_000;
  let sink = 0;
  // Widths 0.2–1.8 mm and gaps 0.05–0.85 mm cycling through 4001 × 997 values: a new geometry at every call.
  const w = (i: number) => 0.2e-3 + ((i % 4001) / 4000) * 1.6e-3, s = (i: number) => 0.05e-3 + ((i % 997) / 996) * 0.8e-3;
  rate(50_000, (i) => { coupledInto(SUB, w(i), s(i), 2.45e9, 1); sink += coupledNumbers.z0E; }); // warm-up
  const core: { cpu: number; wall: number }[] = [], pub: { cpu: number; wall: number }[] = [];
  for (let k = 0; k < 3; k++) {
    core.push(rate(N, (i) => { coupledInto(SUB, w(i), s(i), 2.45e9, 1); sink += coupledNumbers.z0E; }));
    pub.push(rate(N / 4, (i) => { sink += analyzeCoupled(SUB, w(i), s(i), 2.45e9).even.z0; }));
  }
  const best = (x: { cpu: number; wall: number }[]) => `${Math.max(...x.map((y) => y.cpu)).toFixed(0)} per CPU-second (wall clock ${Math.max(...x.map((y) => y.wall)).toFixed(0)}/s)`;
  console.log(`coupled-pair analysis (new width and gap each call, εr ${SUB.er}, h ${SUB.h * 1e3} mm, 2.45 GHz), best of 3:`);
  console.log(`  coupledInto (the network's per-frequency core)  ${best(core)}   (target ≥ 300000 on one core)`);
  console.log(`  analyzeCoupled (public: result record, warnings)  ${best(pub)}`);

  const doc = bandpassBlock({ order: 5, f0: 2.45e9, bw: 0.1, rippleDb: 0.5, substrate: SUB, process: { kind: 'etch', edgeBias: 0, minFeature: 0.02e-3 } });
  const net = netlistFromSized(sizeDesign(doc));
  const freqs = sweepFrequencies({ start: 1.5e9, stop: 3.5e9, points: 1001 });
  const cold = timed(() => solveNetwork(compileNetwork(net), freqs));
  const warm: { cpu: number; wall: number }[] = [];
  for (let k = 0; k < 7; k++) warm.push(timed(() => solveNetwork(compileNetwork(net), freqs)));
  const cpu = warm.map((x) => x.cpu).sort((a, b) => a - b), wall = warm.map((x) => x.wall).sort((a, b) => a - b);
  console.log(`fifth-order band-pass block (6 coupled sections), 1001 points, compile + solve, CPU time (wall clock):`);
  console.log(`  first ${cold.cpu.toFixed(1)} ms (${cold.wall.toFixed(1)} ms, includes the line model's one-time tables), then best ${cpu[0]!.toFixed(1)} ms (${wall[0]!.toFixed(1)}), median ${cpu[3]!.toFixed(1)} ms (${wall[3]!.toFixed(1)})   (target < 50 ms)`);
  console.log(`  machine load average now: ${(await import('node:os')).loadavg()[0]!.toFixed(1)} on ${(await import('node:os')).cpus().length} cores`);
  if (sink === 42) console.log('');
}
