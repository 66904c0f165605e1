/**
 * CPU time of the browser's threads over a stretch of a benchmark, read from Linux's own counters
 * (/proc/PID/task/TID/stat: user + system time in clock ticks of 10 ms): the renderer's main thread (its thread id
 * is the process id), its workers, the rest of the renderer, and the GPU process (with --disable-gpu it rasterises
 * and composites the page in software, so its time is part of "on screen"). The processes are found with the
 * DevTools protocol (SystemInfo.getProcessInfo); the renderer is the one that did the most work meanwhile.
 * Chromium's own ThreadTime metric (Performance.getMetrics) reads a thread that is not the page's main thread in
 * headless chromium (it barely moves over seconds of work), so it is not used.
 * Not a bench itself (no `.bench.ts`).
 */
import type { Browser } from 'playwright-core';
import { readdirSync, readFileSync } from 'node:fs';

const TICK_MS = 10; // USER_HZ is 100 on Linux

interface Snapshot { byThread: Map<string, { name: string; ms: number }>; processes: { type: string; id: number }[] }

export interface ThreadCpu {
  /** Renderer main thread, its dedicated workers, the rest of that renderer, and the GPU process, ms. */
  main: number; workers: number; rendererOther: number; gpu: number;
  /** The rest of the renderer by thread name (V8's helper threads for garbage collection and compiling are there). */
  otherByName: Record<string, number>;
}

function threadsOf(pid: number): { tid: string; name: string; ms: number }[] {
  const out: { tid: string; name: string; ms: number }[] = [];
  let tids: string[] = [];
  try { tids = readdirSync(`/proc/${pid}/task`); } catch { return out; }
  for (const tid of tids) {
    try {
      const stat = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8');
      // The name may hold spaces: fields count from the closing parenthesis.
      const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      const name = readFileSync(`/proc/${pid}/task/${tid}/comm`, 'utf8').trim();
      out.push({ tid, name, ms: (Number(f[11]) + Number(f[12])) * TICK_MS });
    } catch { /* a thread that ended meanwhile */ }
  }
  return out;
}

async function snapshot(browser: Browser): Promise<Snapshot> {
  const s = await browser.newBrowserCDPSession();
  const info = (await s.send('SystemInfo.getProcessInfo')) as unknown as { processInfo: { type: string; id: number }[] };
  await s.detach();
  const byThread = new Map<string, { name: string; ms: number }>();
  for (const p of info.processInfo) for (const t of threadsOf(p.id)) byThread.set(`${p.id}/${t.tid}`, { name: t.name, ms: t.ms });
  return { byThread, processes: info.processInfo };
}

/** Starts counting; the returned function gives each part's CPU time since then (null where /proc is not there). */
export async function threadCpu(browser: Browser): Promise<() => Promise<ThreadCpu | null>> {
  let before: Snapshot;
  try { before = await snapshot(browser); } catch { return async () => null; }
  return async () => {
    const after = await snapshot(browser);
    const delta = (key: string) => (after.byThread.get(key)?.ms ?? 0) - (before.byThread.get(key)?.ms ?? 0);
    const sum = (pid: number, keep: (name: string, tid: string) => boolean) =>
      [...after.byThread].filter(([k, t]) => k.startsWith(`${pid}/`) && keep(t.name, k.split('/')[1]!)).reduce((a, [k]) => a + delta(k), 0);
    const renderers = after.processes.filter((p) => p.type === 'renderer');
    if (!renderers.length) return null;
    const busiest = renderers.map((p) => ({ p, ms: sum(p.id, () => true) })).sort((a, b) => b.ms - a.ms)[0]!.p;
    const gpu = after.processes.filter((p) => p.type === 'GPU').reduce((a, p) => a + sum(p.id, () => true), 0);
    const main = sum(busiest.id, (_n, tid) => tid === String(busiest.id));
    const workers = sum(busiest.id, (n) => /worker/i.test(n));
    const otherByName: Record<string, number> = {};
    for (const [k, t] of after.byThread) {
      const [pid, tid] = k.split('/');
      if (pid !== String(busiest.id) || tid === pid || /worker/i.test(t.name)) continue;
      const d = delta(k);
      if (d > 0) otherByName[t.name] = (otherByName[t.name] ?? 0) + d;
    }
    return { main, workers, rendererOther: sum(busiest.id, () => true) - main - workers, gpu, otherByName };
  };
}
