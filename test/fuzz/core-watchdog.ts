/**
 * Runs core fuzz cases in a worker thread under a watchdog: each case gets WATCHDOG_MS; a case that runs past it is
 * a hang — the thread is stopped and a fresh one takes the next case. A thread that dies (an uncaught error, the
 * wasm engine aborting) is a crash of the case it was running. Returns the tally the tests judge and report.
 */
import { Worker } from 'node:worker_threads';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { FuzzCase, FuzzOutcome } from './core-worker.ts';

export const WATCHDOG_MS = 10_000;

export interface FuzzFault { id: number; input: string; detail: string }
export interface FuzzTally {
  inputs: number;
  crashes: FuzzFault[];
  hangs: FuzzFault[];
  nonFinite: FuzzFault[];
  wording: FuzzFault[];
  /** How many cases ended at each stage ('refused', 'loaded', 'done', or the pipeline stage that refused them). */
  stages: Record<string, number>;
  messages: number;
}

const BOOT = fileURLToPath(new URL('./core-boot.mjs', import.meta.url));
const ENTRY = pathToFileURL(fileURLToPath(new URL('./core-worker.ts', import.meta.url))).href;

function startWorker(): Promise<Worker> {
  return new Promise((ok, fail) => {
    const w = new Worker(BOOT, { workerData: { entry: ENTRY } });
    const onMessage = (m: { ready?: boolean }) => { if (m.ready) { w.off('error', fail); w.off('message', onMessage); ok(w); } };
    w.on('message', onMessage);
    w.once('error', fail);
  });
}

type Reply = { kind: 'outcome'; o: FuzzOutcome } | { kind: 'hang' } | { kind: 'died'; error: string };

function runOne(w: Worker, c: FuzzCase, ms: number): Promise<Reply> {
  return new Promise((ok) => {
    const done = (r: Reply) => { clearTimeout(timer); w.off('message', onMessage); w.off('error', onError); w.off('exit', onExit); ok(r); };
    const onMessage = (o: FuzzOutcome) => { if (o.id === c.id) done({ kind: 'outcome', o }); };
    const onError = (e: Error) => done({ kind: 'died', error: `${e.name}: ${e.message}` });
    const onExit = (code: number) => done({ kind: 'died', error: `the worker exited (${code})` });
    const timer = setTimeout(() => done({ kind: 'hang' }), ms);
    w.on('message', onMessage);
    w.on('error', onError);
    w.on('exit', onExit);
    w.postMessage(c);
  });
}

export async function runCases(cases: FuzzCase[], opts: { watchdogMs?: number } = {}): Promise<FuzzTally> {
  const ms = opts.watchdogMs ?? WATCHDOG_MS;
  const t: FuzzTally = { inputs: 0, crashes: [], hangs: [], nonFinite: [], wording: [], stages: {}, messages: 0 };
  const short = (s: string) => (s.length > 400 ? `${s.slice(0, 400)}… (${s.length} characters)` : s);
  let w = await startWorker();
  try {
    for (const c of cases) {
      t.inputs++;
      const r = await runOne(w, c, ms);
      if (r.kind === 'outcome') {
        const o = r.o;
        t.stages[o.stage] = (t.stages[o.stage] ?? 0) + 1;
        t.messages += o.messages;
        if (o.crash) t.crashes.push({ id: c.id, input: short(c.text), detail: o.crash });
        if (o.nonFinite.length) t.nonFinite.push({ id: c.id, input: short(c.text), detail: o.nonFinite.join('; ') });
        if (o.wording.length) t.wording.push({ id: c.id, input: short(c.text), detail: o.wording.join(' | ') });
        continue;
      }
      (r.kind === 'hang' ? t.hangs : t.crashes).push({ id: c.id, input: short(c.text), detail: r.kind === 'hang' ? `still running after ${ms} ms (${c.kind})` : r.error });
      await w.terminate();
      w = await startWorker();
    }
  } finally {
    await w.terminate();
  }
  return t;
}

/** One line of figures for the log (the README's reliability section quotes them). */
export function summary(name: string, t: FuzzTally): string {
  const stages = Object.entries(t.stages).sort((a, b) => b[1] - a[1]).map(([k, n]) => `${k} ${n}`).join(', ');
  return `${name}: ${t.inputs} inputs, ${t.crashes.length} crashes, ${t.hangs.length} hangs, ${t.nonFinite.length} non-finite outputs, ${t.wording.length} in library wording; ${t.messages} messages checked; ended at: ${stages}`;
}
