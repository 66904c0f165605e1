/**
 * The design-to-files pipeline (core/pipeline), three figures:
 *  1. Edit frame: a pointer move while dragging a bend of the 64-output corporate feed, timed from the new revision to
 *     its copper (the worker's layout job: sizing + each piece's outline) and to its 201-point response (the response
 *     job of the response worker: its own pipeline sizing each revision from the one before, the design sent as a
 *     change), alone or after a coarse 21-point response that could be drawn first. Median and p90 over the moves. Targets: copper
 *     under one 60 Hz frame (16.7 ms), the 201-point response under 150 ms. These run the worker's own job functions
 *     in Node with their transport as the app has it (the layout as changes, the response packed, each cloned by v8
 *     serialize as postMessage clones it, live passes without the figure table; no browser: frame.bench.ts times
 *     the page's side of a drag).
 *  2. Growth of sizing + board geometry from 256 to 1024 outputs (fresh pipeline per run, line cache shared as a face
 *     shares it): the exponent of time against pieces (1.0 = linear; target ≤ 1.1).
 *  3. Reuse: every job the app runs for one revision (layout, check, preview, export of DXF + Gerber + drill,
 *     milling plan, response network) on one pipeline, against a fresh pipeline per job (the old worker's way).
 * The feeds are sized to fit the 1 m board limit (pitch scaled, 24 GHz on a 0.127 mm laminate for the large ones).
 * Other jobs sharing the cores inflate wall times; the fastest runs are the least disturbed.
 */
import { readFileSync } from 'node:fs';
import { corporateFeed, designSweepSettings, type DesignDoc } from '../core/index.ts';
import { initPolygons } from '../core/geometry/polygons.ts';
import { DesignPipeline, exportDesign } from '../core/pipeline/index.ts';
import { layoutPostJob, responseJob, pipeline as workerPipeline } from '../renderer/src/worker/jobs.ts';
import { LayoutReceiver, type LayoutPost } from '../renderer/src/worker/layout-post.ts';
import { packResponse } from '../renderer/src/worker/response-post.ts';
import { responseSeries } from '../renderer/src/worker/response-job.ts';
import { DesignReplica, DesignSender, type DesignPost } from '../renderer/src/worker/response-doc.ts';
import { deserialize, serialize } from 'node:v8';

/** CPU time of this process, ms (user + system): unlike wall time, other jobs on the machine barely change it. */
const cpuMs = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1000; };
const median = (xs: number[]) => { const s = xs.slice().sort((a, b) => a - b); return s[Math.floor(s.length / 2)]!; };
const p90 = (xs: number[]) => { const s = xs.slice().sort((a, b) => a - b); return s[Math.min(s.length - 1, Math.floor(s.length * 0.9))]!; };
const f = (x: number) => x.toFixed(1);
const none = () => {};

/** The 64-output feed at its usual 2.45 GHz, with a pitch that keeps the row inside the board limit. */
const feed64 = () => corporateFeed({ outputs: 64, pitch: 12e-3 });
const bigFeed = (n: number) => corporateFeed({ outputs: n, f0: 24e9, pitch: Math.min(20e-3, 0.85 / n), substrate: { er: 3.0, h: 0.127e-3, t: 0 } });

/** The drawn position of one bend moved by a pointer step: a new document, as the editor makes one per move. */
function moved(doc: DesignDoc, id: string, k: number): DesignDoc {
  return { ...doc, nodes: doc.nodes.map((n) => (n.id === id ? { ...n, at: { x: n.at.x + k * 5e-5, y: n.at.y } } : n)) };
}

async function editFrame(): Promise<void> {
  const doc = feed64();
  const bend = doc.nodes.find((n) => n.kind === 'vertex')!.id;
  const moves = 12;
  const page = new LayoutReceiver();
  // The response worker's side as the app has it: its own pipeline sizing each revision from the one before (live),
  // the design arriving as a change from the revision sent before (response-doc.ts), cloned as postMessage clones.
  const respPipeline = new DesignPipeline({ capacity: 48, live: true });
  const sender = new DesignSender(), replica = new DesignReplica();
  const received = (d: DesignDoc) => replica.receive(deserialize(serialize(sender.post(d))) as DesignPost);
  const respond = async (d: DesignDoc, points: number) =>
    deserialize(serialize(packResponse(await responseSeries({ doc: received(d), settings: { ...designSweepSettings(d), points }, figures: false }, none, undefined, respPipeline))));
  // As it was before: the whole design cloned per revision (new records) and sized from scratch in the worker.
  const wholePipeline = new DesignPipeline({ capacity: 48 });
  const respondWhole = async (d: DesignDoc, points: number) =>
    deserialize(serialize(packResponse(await responseJob({ doc: deserialize(serialize(d)) as DesignDoc, settings: { ...designSweepSettings(d), points }, figures: false }, none, undefined, wholePipeline))));
  page.decode(await layoutPostJob({ doc, base: page.token }, none)); // warm the line cache and the JIT, as an open editor is
  await respond(doc, 21);
  await respond(doc, 201);
  await respondWhole(doc, 201);
  const wall = { copper: [] as number[], alone: [] as number[], coarse: [] as number[], full: [] as number[], whole: [] as number[] };
  const cpu = { copper: [] as number[], alone: [] as number[], coarse: [] as number[], full: [] as number[], whole: [] as number[] };
  for (let k = 1; k <= 2 * moves; k++) {
    const d = moved(doc, bend, k);
    const t0 = performance.now(), c0 = cpuMs();
    // As the page gets them: the layout as changes against the last one, cloned as postMessage clones (v8
    // serialize), decoded; the response's series packed in one block and cloned the same way.
    page.decode(deserialize(serialize(await layoutPostJob({ doc: d, base: page.token }, none))) as LayoutPost);
    const t1 = performance.now(), c1 = cpuMs();
    wall.copper.push(t1 - t0); cpu.copper.push(c1 - c0);
    if (k % 2) {
      // Odd moves: the 201-point response alone, as the app sweeps a drag (no coarse pass: see compute.svelte.ts).
      await respond(d, 201);
      wall.alone.push(performance.now() - t1); cpu.alone.push(cpuMs() - c1);
      const t4 = performance.now(), c4 = cpuMs();
      await respondWhole(moved(doc, bend, k + 0.5), 201);
      wall.whole.push(performance.now() - t4); cpu.whole.push(cpuMs() - c4);
      continue;
    }
    // Even moves: a coarse 21-point pass first, then the 201 points (sharing the revision's sizing and network).
    await respond(d, 21);
    const t2 = performance.now(), c2 = cpuMs();
    await respond(d, 201);
    const t3 = performance.now(), c3 = cpuMs();
    wall.coarse.push(t2 - t1); wall.full.push(t3 - t2);
    cpu.coarse.push(c2 - c1); cpu.full.push(c3 - c2);
  }
  const both = (k: keyof typeof wall) => `wall median ${f(median(wall[k]))} ms, p90 ${f(p90(wall[k]))} ms; CPU median ${f(median(cpu[k]))} ms, p90 ${f(p90(cpu[k]))} ms`;
  console.log(`edit frame, 64-output feed (${doc.segments.length} pieces), drag of bend ${bend}, ${2 * moves} moves (the workers' jobs in Node; load average ${loadAvg()}):`);
  console.log(`  to copper (sizing + outlines):            ${both('copper')} (target < 16.7 ms)`);
  console.log(`  201-point response of the moved revision: ${both('alone')} (target < 150 ms; the response worker's own live sizing, network and sweep)`);
  console.log(`  the same as before (whole design cloned, sized from scratch): ${both('whole')}`);
  console.log(`  or a coarse 21-point response first:      ${both('coarse')}`);
  console.log(`     and the 201 points after it:           ${both('full')} (the sizing and network reused from the coarse pass)`);
}

function loadAvg(): string { try { return readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' '); } catch { return 'unknown'; } }

async function growth(): Promise<void> {
  const rows: { n: number; pieces: number; ms: number; cpu: number }[] = [];
  for (const n of [256, 1024]) {
    const doc = bigFeed(n);
    const shared = new DesignPipeline({ capacity: 4 });
    shared.board(doc); // warm the line cache
    const times: number[] = [], cpus: number[] = [];
    for (let i = 0; i < (n >= 1024 ? 5 : 9); i++) {
      const p = new DesignPipeline({ capacity: 4 });
      (p as unknown as { lines: unknown }).lines = (shared as unknown as { lines: unknown }).lines;
      const t0 = performance.now(), c0 = cpuMs();
      p.board(doc);
      times.push(performance.now() - t0); cpus.push(cpuMs() - c0);
    }
    rows.push({ n, pieces: doc.segments.length, ms: Math.min(...times), cpu: Math.min(...cpus) });
  }
  const [a, b] = rows as [typeof rows[0], typeof rows[0]];
  const exponent = (x: number, y: number) => (Math.log(y / x) / Math.log(b.pieces / a.pieces)).toFixed(2);
  for (const r of rows) console.log(`sizing + board geometry, ${r.n} outputs (${r.pieces} pieces): fastest ${f(r.ms)} ms wall, ${f(r.cpu)} ms CPU, ${((r.cpu / r.pieces) * 1000).toFixed(1)} µs CPU/piece`);
  console.log(`growth exponent 256 → 1024 outputs: ${exponent(a.cpu, b.cpu)} in CPU time, ${exponent(a.ms, b.ms)} in wall time (target ≤ 1.1; load average ${loadAvg()}: wall time counts waiting for a core)`);
}

function jobsOfOneRevision(pick: () => DesignPipeline, doc: DesignDoc): void {
  pick().sized(doc); pick().paths(doc);                                                    // layout
  pick().findings(doc);                                                                    // shop check
  exportDesign(pick(), doc, { formats: [], base: 'b', version: 'bench', layers: ['copper'] });   // live preview
  exportDesign(pick(), doc, { formats: ['dxf', 'gerber', 'drill'], base: 'b', version: 'bench' });     // export
  pick().plan(doc, {});                                                                    // milling plan
  pick().netlist(doc);                                                                     // response network
}

function reuse(): void {
  const doc = feed64();
  const one = new DesignPipeline();
  jobsOfOneRevision(() => one, doc); // warm
  const shared: number[] = [], fresh: number[] = [];
  for (let i = 0; i < 3; i++) {
    const d = moved(doc, doc.nodes.find((n) => n.kind === 'vertex')!.id, i + 1);
    let t0 = performance.now();
    const p = new DesignPipeline();
    jobsOfOneRevision(() => p, d);
    shared.push(performance.now() - t0);
    t0 = performance.now();
    const made: DesignPipeline[] = [];
    jobsOfOneRevision(() => { const q = new DesignPipeline(); made.push(q); return q; }, d);
    fresh.push(performance.now() - t0);
    if (i === 0) {
      const sum = (s: 'sized' | 'board' | 'findings') => made.reduce((acc, q) => acc + q.count(s), 0);
      console.log(`stage runs for one revision: one pipeline sized ${p.count('sized')}, board ${p.count('board')}, shop check ${p.count('findings')}; fresh per job sized ${sum('sized')}, board ${sum('board')}, shop check ${sum('findings')}`);
    }
  }
  console.log(`one revision of the 64-output feed, all seven jobs: one pipeline ${f(Math.min(...shared))} ms, a fresh pipeline per job ${f(Math.min(...fresh))} ms (saving ${f(100 * (1 - Math.min(...shared) / Math.min(...fresh)))} %)`);
}

export async function run(): Promise<void> {
  await initPolygons();
  workerPipeline.memo.clear();
  await editFrame();
  // PIPELINE_BENCH_ONLY=edit: the edit frame alone.
  if (process.env.PIPELINE_BENCH_ONLY === 'edit') return;
  await growth();
  reuse();
}
