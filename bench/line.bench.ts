/**
 * Line-model throughput on one core: full analyses per second (HJ static with thickness + KJ/JK dispersion +
 * Wheeler conductor loss with roughness + dielectric loss + thresholds and warnings), exact syntheses per second,
 * and — where Debian's python3-scikit-rf is installed — the same 100 000 analyses vectorised by that library
 * (timed inside Python, best of 3), printed as a ratio. Targets: ≥ 2 000 000 analyses/s, ≥ 300 000 syntheses/s,
 * faster than the vectorised library. Figures vary with machine load; run it alone.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { analyzeLine, synthesizeLine } from '../core/line/index.ts';
import type { SubstrateSpec } from '../core/substrate/types.ts';

const N = 100_000;
const SUB: SubstrateSpec = { er: 4.4, h: 0.79e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1e-6 };

function lcg(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
}

/**
 * Best of `rounds`, in CPU seconds of this process (user + system): on a machine shared with other jobs, wall time
 * mostly measures the others. The wall time of the best round is kept for the record.
 */
function timeBest(fn: () => number, rounds: number): { seconds: number; wall: number; sink: number } {
  let best = Infinity; let wall = Infinity; let sink = 0;
  for (let r = 0; r < rounds; r++) {
    const c0 = process.cpuUsage(); const t0 = performance.now();
    sink += fn();
    const c = process.cpuUsage(c0);
    const cpu = (c.user + c.system) / 1e6;
    if (cpu < best) { best = cpu; wall = (performance.now() - t0) / 1000; }
  }
  return { seconds: best, wall, sink };
}

function pythonSkrf(n: number): { per_second: number; seconds: number; skrf: string } | string {
  const env = { ...process.env, PATH: spawnSync('getconf', ['PATH'], { encoding: 'utf8' }).stdout.trim() || '/usr/bin:/bin' };
  const r = spawnSync('python3', [join(import.meta.dirname, '..', 'scripts', 'reference', 'skrf_line.py'), '--bench', String(n)], { env, encoding: 'utf8' });
  if (r.status !== 0) return `not run: Debian python3-scikit-rf unavailable (${(r.stderr || r.error?.message || '').trim().split('\n').pop()})`;
  return JSON.parse(r.stdout.trim().split('\n').pop()!);
}

export async function run(): Promise<void> {
  const rnd = lcg(1);
  const widths = new Float64Array(N); const freqs = new Float64Array(N); const z0s = new Float64Array(N);
  for (let i = 0; i < N; i++) {
    widths[i] = SUB.h * 10 ** (rnd() * 2 - 1); // W/h 0.1–10
    freqs[i] = 10 ** (8 + rnd() * 2); // 100 MHz – 10 GHz
    z0s[i] = 25 + rnd() * 100; // 25–125 Ω
  }
  // Warm up the JIT on the same code path.
  for (let i = 0; i < 20_000; i++) analyzeLine(SUB, widths[i]!, freqs[i]!);
  for (let i = 0; i < 5_000; i++) synthesizeLine(SUB, z0s[i]!, freqs[i]!);

  const ana = timeBest(() => { let s = 0; for (let i = 0; i < N; i++) s += analyzeLine(SUB, widths[i]!, freqs[i]!).alphaC; return s; }, 5);
  // A frequency sweep of 100 lines (the network solver's pattern) and a width sweep at one frequency (sizing tables).
  const fSweep = timeBest(() => { let s = 0; for (let l = 0; l < 100; l++) for (let k = 0; k < N / 100; k++) s += analyzeLine(SUB, widths[l]!, 1e8 + k * 1e7).alphaC; return s; }, 5);
  const wSweep = timeBest(() => { let s = 0; for (let i = 0; i < N; i++) s += analyzeLine(SUB, widths[i]!, 5.8e9).alphaC; return s; }, 5);
  const syn = timeBest(() => { let s = 0; for (let i = 0; i < N; i++) s += synthesizeLine(SUB, z0s[i]!, freqs[i]!).width; return s; }, 3);
  const synStatic = timeBest(() => { let s = 0; for (let i = 0; i < N; i++) s += synthesizeLine(SUB, z0s[i]!, 0).width; return s; }, 3);
  const anaRate = N / ana.seconds; const synRate = N / syn.seconds; const synStaticRate = N / synStatic.seconds;
  const py = pythonSkrf(N);

  const f = (x: number) => Math.round(x).toLocaleString('en-US');
  console.log(`| measure (${N.toLocaleString('en-US')} cases, one core, CPU time, best of runs) | per second | target | met |`);
  console.log('|---|---|---|---|');
  console.log(`| analyses, random W and f every call (static + KJ/JK dispersion + losses) | ${f(anaRate)} | ≥ 2,000,000 | ${anaRate >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| analyses, frequency sweeps of fixed lines | ${f(N / fSweep.seconds)} | ≥ 2,000,000 | ${N / fSweep.seconds >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| analyses, width sweep at one frequency | ${f(N / wSweep.seconds)} | ≥ 2,000,000 | ${N / wSweep.seconds >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| exact syntheses at f (to 1e-10) | ${f(synRate)} | ≥ 300,000 | ${synRate >= 3e5 ? 'yes' : 'no'} |`);
  console.log(`| exact syntheses, static | ${f(synStaticRate)} | — | — |`);
  if (typeof py === 'string') console.log(`| scikit-rf vectorised analyses | ${py} | — | — |`);
  else {
    const ratio = anaRate / py.per_second;
    console.log(`| scikit-rf ${py.skrf} vectorised analyses (numpy, timed in Python) | ${f(py.per_second)} | slower than ours | ${ratio > 1 ? 'yes' : 'no'} |`);
    console.log(`\nratio ours / scikit-rf vectorised: ${ratio.toFixed(2)}× (one run each; the library computes static, εe(f), Z0(f) and αd, no conductor loss or warnings)`);
  }
  console.log(`wall-clock rate of the random-case analyses: ${f(N / ana.wall)} per second (machine load affects it)`);
  if (!Number.isFinite(ana.sink + fSweep.sink + wSweep.sink + syn.sink + synStatic.sink)) console.log('warning: a non-finite result appeared');
}
