/**
 * Line-model throughput on one core: full analyses per second (HJ static with thickness + KJ/JK dispersion +
 * Wheeler conductor loss with roughness + dielectric loss + thresholds and warnings), exact syntheses per second,
 * and — where Debian's python3-scikit-rf is installed — the same 100 000 analyses vectorised by that library
 * (timed inside Python, best of 3), printed as a ratio, and the machine's pace (ns per Math.exp call) for context.
 * Targets: ≥ 2 000 000 analyses/s, ≥ 300 000 syntheses/s, faster than the vectorised library.
 *
 * Each measure runs in a process of its own (this file with --measure NAME), as benchmark harnesses fork: the
 * compiler shapes a function's machine code by the calls it has seen, so one pattern timed after another measures
 * the mix. One extra measure does exactly that on purpose (random analyses after every other pattern), as a tool
 * that sizes, sweeps and analyses in one session would see. Figures vary with machine load; run it alone.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { getHeapSpaceStatistics } from 'node:v8';
import { analyzeLine, analyzeLines, synthesizeLine } from '../core/line/index.ts';
import type { SubstrateSpec } from '../core/substrate/types.ts';

const N = 100_000;
/** Rounds per measure; the best is kept (the machines this runs on share their cores, so the spread is wide). */
const ROUNDS = 9;
const SUB: SubstrateSpec = { er: 4.4, h: 0.79e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1e-6 };

function lcg(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
}

interface Timing { seconds: number; wall: number; sink: number }

/** Best of `rounds`, in CPU seconds of this process (user + system); the wall time of the best round is kept too. */
function timeBest(fn: () => number, rounds: number): Timing {
  const o: Timing = { seconds: Infinity, wall: Infinity, sink: 0 };
  for (let r = 0; r < rounds; r++) {
    const c0 = process.cpuUsage(); const t0 = performance.now();
    o.sink += fn();
    const c = process.cpuUsage(c0);
    const cpu = (c.user + c.system) / 1e6;
    if (cpu < o.seconds) { o.seconds = cpu; o.wall = (performance.now() - t0) / 1000; }
  }
  return o;
}

const rnd = lcg(1);
const widths = new Float64Array(N); const freqs = new Float64Array(N); const z0s = new Float64Array(N);
for (let i = 0; i < N; i++) {
  widths[i] = SUB.h * 10 ** (rnd() * 2 - 1); // W/h 0.1–10
  freqs[i] = 10 ** (8 + rnd() * 2); // 100 MHz – 10 GHz
  z0s[i] = 25 + rnd() * 100; // 25–125 Ω
}

/** The measures: each returns a number that depends on every result (so nothing is optimised away). */
const MEASURES = {
  ana: () => { let s = 0; for (let i = 0; i < N; i++) s += analyzeLine(SUB, widths[i]!, freqs[i]!).alphaC; return s; },
  // The batch form (one call, columns out), as a vectorised library is called.
  batch: () => analyzeLines(SUB, widths, freqs).alphaC[N - 1]!,
  // A frequency sweep of 100 lines (the network solver's pattern) and a width sweep at one frequency (sizing tables).
  fSweep: () => { let s = 0; for (let l = 0; l < 100; l++) for (let k = 0; k < N / 100; k++) s += analyzeLine(SUB, widths[l]!, 1e8 + k * 1e7).alphaC; return s; },
  wSweep: () => { let s = 0; for (let i = 0; i < N; i++) s += analyzeLine(SUB, widths[i]!, 5.8e9).alphaC; return s; },
  syn: () => { let s = 0; for (let i = 0; i < N; i++) s += synthesizeLine(SUB, z0s[i]!, freqs[i]!).width; return s; },
  synStatic: () => { let s = 0; for (let i = 0; i < N; i++) s += synthesizeLine(SUB, z0s[i]!, 0).width; return s; },
  // Random analyses after every pattern above has run in this process (mixed feedback, as in a working session).
  anaMixed: () => MEASURES.ana(),
} as const;
type MeasureName = keyof typeof MEASURES;

/** In the child: warm up on the measure (for anaMixed: on all of them), then time it. */
function measureHere(name: MeasureName): Timing {
  if (name === 'anaMixed') for (const k of Object.keys(MEASURES) as MeasureName[]) if (k !== 'anaMixed') MEASURES[k]();
  for (let r = 0; r < 3; r++) MEASURES[name]();
  return timeBest(MEASURES[name], ROUNDS);
}

/**
 * JS-heap bytes allocated per analysis, per call and in the batch form: the young generation's used size around a
 * loop short enough to fit in it (rounds where a collection ran show a drop and are skipped; the least is kept).
 */
function heapBytesPerAnalysis(): { perCall: number; batch: number } {
  const young = () => getHeapSpaceStatistics().find((x) => x.space_name === 'new_space')?.space_used_size ?? Number.NaN;
  const n = 2000; const w = widths.subarray(0, n); const fr = freqs.subarray(0, n);
  const least = (fn: () => void): number => {
    let best = Infinity;
    for (let r = 0; r < 15; r++) { const a = young(); fn(); const b = young(); if (b >= a) best = Math.min(best, (b - a) / n); }
    return best;
  };
  for (let r = 0; r < 20; r++) { MEASURES.ana(); }
  const perCall = least(() => { for (let i = 0; i < n; i++) analyzeLine(SUB, w[i]!, fr[i]!); });
  const batch = least(() => { analyzeLines(SUB, w, fr); });
  return { perCall, batch };
}

/** In the parent: one child process per measure. */
function measureInChild(name: MeasureName): Timing {
  const r = spawnSync(process.execPath, [...process.execArgv, fileURLToPath(import.meta.url), '--measure', name], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`line bench: measure ${name} failed: ${(r.stderr || r.error?.message || '').trim()}`);
  return JSON.parse(r.stdout.trim().split('\n').pop()!) as Timing;
}

/** The machine's pace: ns per Math.exp call in a plain loop (about 7–10 ns on an idle machine of the CI kind). */
function expPace(): number {
  const xs = new Float64Array(1 << 16);
  for (let i = 0; i < xs.length; i++) xs[i] = (i / xs.length) * 8 - 4;
  let best = Infinity; let s = 0;
  for (let r = 0; r < 20; r++) {
    const t0 = performance.now();
    for (let k = 0; k < 8; k++) for (let i = 0; i < xs.length; i++) s += Math.exp(xs[i]!);
    best = Math.min(best, ((performance.now() - t0) * 1e6) / (8 * xs.length));
  }
  return Number.isFinite(s) ? best : Number.NaN;
}

function pythonSkrf(n: number): { per_second: number; seconds: number; skrf: string } | string {
  const env = { ...process.env, PATH: spawnSync('getconf', ['PATH'], { encoding: 'utf8' }).stdout.trim() || '/usr/bin:/bin' };
  const r = spawnSync('python3', [join(import.meta.dirname, '..', 'scripts', 'reference', 'skrf_line.py'), '--bench', String(n)], { env, encoding: 'utf8' });
  if (r.status !== 0) return `not run: Debian python3-scikit-rf unavailable (${(r.stderr || r.error?.message || '').trim().split('\n').pop()})`;
  return JSON.parse(r.stdout.trim().split('\n').pop()!);
}

export async function run(): Promise<void> {
  const t = {} as Record<MeasureName, Timing>;
  for (const k of Object.keys(MEASURES) as MeasureName[]) t[k] = measureInChild(k);
  const { ana, batch, fSweep, wSweep, syn, synStatic, anaMixed } = t;
  const heap = spawnSync(process.execPath, [...process.execArgv, fileURLToPath(import.meta.url), '--heap'], { encoding: 'utf8' });
  const bytes = heap.status === 0 ? JSON.parse(heap.stdout.trim().split('\n').pop()!) as { perCall: number; batch: number } : undefined;
  const anaRate = N / ana.seconds; const batchRate = N / batch.seconds; const synRate = N / syn.seconds; const synStaticRate = N / synStatic.seconds;
  const pace = expPace();
  const py = pythonSkrf(N);

  const f = (x: number) => Math.round(x).toLocaleString('en-US');
  console.log(`| measure (${N.toLocaleString('en-US')} cases, one core, CPU time, best of runs) | per second | target | met |`);
  console.log('|---|---|---|---|');
  console.log(`| analyses, random W and f every call (static + KJ/JK dispersion + losses) | ${f(anaRate)} | ≥ 2,000,000 | ${anaRate >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| analyses in one batch call (analyzeLines), random W and f | ${f(batchRate)} | ≥ 2,000,000 | ${batchRate >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| analyses, random W and f, after every other pattern ran in the same process | ${f(N / anaMixed.seconds)} | — | — |`);
  console.log(`| analyses, frequency sweeps of fixed lines | ${f(N / fSweep.seconds)} | ≥ 2,000,000 | ${N / fSweep.seconds >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| analyses, width sweep at one frequency | ${f(N / wSweep.seconds)} | ≥ 2,000,000 | ${N / wSweep.seconds >= 2e6 ? 'yes' : 'no'} |`);
  console.log(`| exact syntheses at f (to 1e-10) | ${f(synRate)} | ≥ 300,000 | ${synRate >= 3e5 ? 'yes' : 'no'} |`);
  console.log(`| exact syntheses, static | ${f(synStaticRate)} | — | — |`);
  if (typeof py === 'string') console.log(`| scikit-rf vectorised analyses | ${py} | — | — |`);
  else {
    const ratio = anaRate / py.per_second;
    console.log(`| scikit-rf ${py.skrf} vectorised analyses (numpy, timed in Python) | ${f(py.per_second)} | slower than ours | ${ratio > 1 ? 'yes' : 'no'} |`);
    console.log(`\nratio ours / scikit-rf vectorised: ${ratio.toFixed(2)}× one call per analysis, ${(batchRate / py.per_second).toFixed(2)}× in one batch call (one run each; the library computes static, εe(f), Z0(f) and αd, no conductor loss or warnings)`);
  }
  if (bytes) console.log(`JS heap allocated per analysis: ${bytes.perCall.toFixed(0)} bytes one call each (the result record), ${bytes.batch.toFixed(0)} bytes in one batch call (column storage outside the JS heap)`);
  console.log(`machine pace: ${pace.toFixed(1)} ns per Math.exp call (about 7–10 on an idle machine of this kind; higher means a slow spell)`);
  console.log(`wall-clock rate of the random-case analyses: ${f(N / ana.wall)} per second (machine load affects it)`);
  if (!Object.values(t).every((x) => Number.isFinite(x.sink))) console.log('warning: a non-finite result appeared');
}

if (process.argv[2] === '--heap') console.log(JSON.stringify(heapBytesPerAnalysis()));
if (process.argv[2] === '--measure') {
  const name = process.argv[3] as MeasureName;
  if (!(name in MEASURES)) { console.error(`unknown measure ${name}; one of ${Object.keys(MEASURES).join(', ')}`); process.exit(2); }
  console.log(JSON.stringify(measureHere(name)));
}
