/**
 * FRAME_BENCH_TRACE=1: where the page's main thread spends a stretch of a benchmark, from a chromium trace
 * (devtools.timeline categories): self time per kind of work — script, style, layout, paint, layerize/commit,
 * garbage collection — so the browser's own work on the board can be told from the app's script.
 * Not a bench itself (no `.bench.ts`).
 */
import type { Browser, Page } from 'playwright-core';

interface TraceEvent { ph: string; name: string; ts: number; dur?: number; tdur?: number; pid: number; tid: number; args?: { name?: string } }

const CATEGORIES = ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'v8', 'blink.user_timing', 'disabled-by-default-v8.gc', 'cc', 'toplevel'];

export async function startTrace(browser: Browser, page: Page): Promise<() => Promise<string>> {
  await browser.startTracing(page, { categories: CATEGORIES });
  return async () => summarize(JSON.parse((await browser.stopTracing()).toString('utf8')) as { traceEvents: TraceEvent[] });
}

function summarize(trace: { traceEvents: TraceEvent[] }): string {
  const ev = trace.traceEvents;
  const main = ev.find((e) => e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain');
  if (!main) return 'trace: no renderer main thread found';
  const mine = ev.filter((e) => e.pid === main.pid && e.tid === main.tid && e.ph === 'X' && typeof e.dur === 'number').sort((a, b) => a.ts - b.ts || (b.dur! - a.dur!));
  // Self time per event name: an event's time less that of the events nested in it.
  const self = new Map<string, number>();
  const stack: { end: number; name: string }[] = [];
  let top = 0;
  for (const e of mine) {
    while (stack.length && stack[stack.length - 1]!.end <= e.ts) stack.pop();
    const parent = stack[stack.length - 1];
    if (parent) self.set(parent.name, (self.get(parent.name) ?? 0) - e.dur!);
    else top += e.dur!;
    self.set(e.name, (self.get(e.name) ?? 0) + e.dur!);
    stack.push({ end: e.ts + e.dur!, name: e.name });
  }
  // The renderer's pool threads (raster, V8's helpers): their busiest kinds of work.
  const poolTids = new Set(ev.filter((e) => e.ph === 'M' && e.name === 'thread_name' && e.pid === main.pid && /ThreadPool/.test(e.args?.name ?? '')).map((e) => e.tid));
  const pool = new Map<string, number>();
  for (const e of ev) if (e.pid === main.pid && poolTids.has(e.tid) && e.ph === 'X' && e.dur) pool.set(e.name, (pool.get(e.name) ?? 0) + e.dur);
  const poolRows = [...pool].sort((a, b) => b[1] - a[1]).slice(0, 14).map(([n, us]) => `${n} ${(us / 1000).toFixed(0)} ms`).join(', ');
  const rows = [...self].filter(([, us]) => us > 2000).sort((a, b) => b[1] - a[1]).slice(0, 18);
  return `main-thread trace over the drag (self time; ${(top / 1000).toFixed(0)} ms in top-level tasks):\n` +
    rows.map(([n, us]) => `  ${(us / 1000).toFixed(1).padStart(8)} ms  ${n}`).join('\n') +
    `\nrenderer pool threads (raster, V8's background work; time per kind of event, nested ones included): ${poolRows}`;
}
