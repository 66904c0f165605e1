/**
 * The whole edit as a person sees it, for the frame benchmark: per pointer move while dragging a bend, the time until
 * the board shows copper of that revision (or a newer one) and until the response plot shows a response of it — the
 * first one drawn (the quick coarse pass when there is one) and the full sweep. The app says what it drew through
 * two attributes (`data-copper-revision` on the board drawing, `data-drawn` = "revision:points" on the response
 * plot); a MutationObserver in the page notes when each changes, so nothing inside the app is timed or patched.
 *
 * Moves are paced one per animation frame, as Chromium delivers pointer moves (at the start of a frame, before its
 * animation-frame callbacks). "On screen" for the copper is the end of the main thread's work on the frame that
 * shows it: a change made while a frame's callbacks run (a move's own live layout) is painted by that frame, which
 * ends when a task posted from its first callback runs (style, layout, paint and commit are done by then); a change
 * made in a task between frames (a worker's layout) by the next frame. Rasterising and compositing then happen off
 * the main thread (in the GPU process, in software here) and are not in the figure; their CPU time is printed.
 * CPU time comes from Linux's counters per thread (renderer-threads.ts), so a busy machine can be told from slow code.
 * Not a bench itself (no `.bench.ts`): frame.bench.ts calls it.
 */
import type { Page } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { threadCpu, type ThreadCpu } from './renderer-threads.ts';
import { startTrace } from './main-trace.ts';

export interface EditLatency {
  moves: number;
  /** Per move, ms from the pointer event to the copper / first response / full response of its revision on screen. */
  copper: number[];
  /** Per move, ms from the pointer event until that copper was in the board's DOM (before style, layout and paint). */
  copperDom: number[];
  first: number[];
  full: number[];
  /** Moves whose copper on screen was their own revision's (the rest were shown a later move's copper first). */
  ownCopper: number;
  /** Moves whose revision never reached the screen before the drag settled (superseded by a newer one is fine). */
  missing: { copper: number; first: number; full: number };
  fullPoints: number;
  /** Coarse and full response draws seen during the drag. */
  draws: { coarse: number; full: number };
  wallMs: number;
  /** CPU time of the browser's threads over the drag, ms (null where /proc cannot be read). */
  cpu: ThreadCpu | null;
  load: { before: string; after: string };
  /** The last moves and screen updates, when some move never reached the screen (to see why). */
  tail: string;
}

interface PageRecord { moves: { t0: number; rev: number }[]; events: { kind: 'copper' | 'response'; rev: number; points: number; t: number; shown?: number }[]; t1: number; panel: string }

const loadAvg = () => { try { return readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' '); } catch { return 'unknown'; } };

/** Opens the Response tab, waits for the full response of the design as it stands, then drags the bend `vertex`. */
export async function editToScreen(page: Page, vertex: string, moves = 60, fullPoints = 201): Promise<EditLatency> {
  await page.getByTestId('dock-response').click();
  // Polled from here: waitForFunction evaluates its text with eval, which the app's CSP forbids.
  const settled = `(() => {
    const rev = document.querySelector('[data-testid="board-canvas"]')?.getAttribute('data-revision');
    return document.querySelector('[data-testid="response-plot"]')?.getAttribute('data-drawn') === rev + ':' + ${fullPoints};
  })()`;
  for (let i = 0; i < 600 && !(await page.evaluate(settled)); i++) await page.waitForTimeout(200);
  await page.waitForTimeout(300);
  const load0 = loadAvg();
  const browser = page.context().browser();
  const cpu = browser ? await threadCpu(browser) : async () => null;
  const profiler = process.env.FRAME_BENCH_PROFILE ? await startProfile(page) : null;
  const tracer = process.env.FRAME_BENCH_TRACE && browser ? await startTrace(browser, page) : null;
  // In-page code is a string: tsx would otherwise wrap functions in helpers the page does not have.
  const rec = (await page.evaluate(`(async (id, moves, fullPoints) => {
    const svg = document.querySelector('[data-testid="board-canvas"]');
    const panel = document.querySelector('[data-testid="response-panel"]');
    const events = [];
    // Frame bookkeeping for "on screen" (see the file comment): each frame's first callback opens it and posts the
    // task that closes it; copper seen while a frame is open is painted by it, copper seen between frames by the next.
    let inFrame = false, thisFrame = [], nextFrame = [], ticking = true;
    const ch = new MessageChannel();
    ch.port1.onmessage = () => { inFrame = false; const t = performance.now(); for (const e of thisFrame) e.shown = t; thisFrame = []; };
    const tick = () => {
      inFrame = true;
      if (nextFrame.length) { for (const e of nextFrame) thisFrame.push(e); nextFrame = []; }
      ch.port2.postMessage(0);
      if (ticking) requestAnimationFrame(tick);
    };
    requestAnimationFrame(tick);
    let lastCopper = svg.getAttribute('data-copper-revision');
    let lastDrawn = document.querySelector('[data-testid="response-plot"]')?.getAttribute('data-drawn') ?? null;
    const seen = new MutationObserver((list) => {
      const t = performance.now();
      for (const m of list) {
        if (m.attributeName === 'data-copper-revision') {
          const v = svg.getAttribute('data-copper-revision');
          if (v !== lastCopper) { lastCopper = v; const e = { kind: 'copper', rev: Number(v), points: 0, t }; events.push(e); (inFrame ? thisFrame : nextFrame).push(e); }
        } else if (m.attributeName === 'data-drawn') {
          // A redraw of the same response (a window or theme change) is not a new response on screen.
          const v = m.target.getAttribute('data-drawn');
          if (v === lastDrawn) continue;
          lastDrawn = v;
          const [rev, points] = v.split(':').map(Number);
          events.push({ kind: 'response', rev, points, t });
        }
      }
    });
    seen.observe(svg, { attributes: true, attributeFilter: ['data-copper-revision'] });
    seen.observe(panel, { attributes: true, subtree: true, attributeFilter: ['data-drawn'] });
    await new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(ok)));
    const el = document.querySelector('[data-node="' + id + '"]');
    const r = el.getBoundingClientRect();
    const x0 = r.left + r.width / 2, y0 = r.top + r.height / 2;
    const ev = (type, x, y) => new PointerEvent(type, { clientX: x, clientY: y, button: 0, buttons: 1, bubbles: true, pointerId: 1, isPrimary: true });
    const frame = () => new Promise((ok) => requestAnimationFrame(() => ok(null)));
    svg.dispatchEvent(ev('pointerdown', x0, y0));
    await frame();
    const log = [];
    for (let k = 1; k <= moves; k++) {
      const t0 = performance.now();
      svg.dispatchEvent(ev('pointermove', x0 + k * 2, y0 + (k % 3)));
      await frame();
      log.push({ t0, rev: Number(svg.getAttribute('data-revision')) });
    }
    svg.dispatchEvent(ev('pointerup', x0 + moves * 2, y0 + (moves % 3)));
    // Settle: the last move's full response on screen (or give up after 60 s and count the misses).
    const last = log[log.length - 1].rev;
    const end = performance.now() + 60000;
    while (performance.now() < end && !events.some((e) => e.kind === 'response' && e.points >= fullPoints && e.rev >= last)) await new Promise((ok) => setTimeout(ok, 20));
    seen.disconnect();
    ticking = false;
    ch.port1.close();
    const words = (id) => document.querySelector('[data-testid="' + id + '"]')?.textContent?.trim() ?? '';
    return { moves: log, events, t1: performance.now(), panel: [words('sweep-summary'), words('response-error'), words('sweep-cancelled')].filter(Boolean).join(' / ') };
  })(${JSON.stringify(vertex)}, ${moves}, ${fullPoints})`)) as PageRecord;
  const cpuUsed = await cpu();
  if (profiler) console.log(await profiler());
  if (tracer) console.log(await tracer());
  const load1 = loadAvg();

  const after = (t0: number, rev: number, ok: (e: PageRecord['events'][number]) => boolean) =>
    rec.events.find((e) => e.t >= t0 && e.rev >= rev && ok(e));
  const out: EditLatency = {
    moves: rec.moves.length, ownCopper: 0, copper: [], copperDom: [], first: [], full: [], missing: { copper: 0, first: 0, full: 0 }, fullPoints,
    draws: { coarse: rec.events.filter((e) => e.kind === 'response' && e.points < fullPoints).length, full: rec.events.filter((e) => e.kind === 'response' && e.points >= fullPoints).length },
    wallMs: rec.t1 - (rec.moves[0]?.t0 ?? rec.t1),
    cpu: cpuUsed,
    load: { before: load0, after: load1 },
    tail: '',
  };
  for (const m of rec.moves) {
    const c = after(m.t0, m.rev, (e) => e.kind === 'copper');
    const f = after(m.t0, m.rev, (e) => e.kind === 'response');
    const g = after(m.t0, m.rev, (e) => e.kind === 'response' && e.points >= fullPoints);
    // On screen: the first copper of this revision or a later one whose frame was painted.
    const shown = rec.events.filter((e) => e.kind === 'copper' && e.t >= m.t0 && e.rev >= m.rev && e.shown !== undefined).sort((a, b) => a.shown! - b.shown!)[0];
    if (c) out.copperDom.push(c.t - m.t0);
    if (shown) out.copper.push(shown.shown! - m.t0); else out.missing.copper++;
    if (c && c.rev === m.rev) out.ownCopper++;
    if (f) out.first.push(f.t - m.t0); else out.missing.first++;
    if (g) out.full.push(g.t - m.t0); else out.missing.full++;
  }
  if (out.missing.copper || out.missing.full) {
    const t00 = rec.moves[0]?.t0 ?? 0;
    out.tail = [...rec.moves.slice(-3).map((m) => `move rev ${m.rev} at ${(m.t0 - t00).toFixed(0)} ms`),
      ...rec.events.slice(-6).map((e) => `${e.kind} rev ${e.rev}${e.points ? `:${e.points}` : ''} at ${(e.t - t00).toFixed(0)} ms`),
      `response panel: ${rec.panel}`].join('; ');
  }
  return out;
}

/**
 * FRAME_BENCH_PROFILE=1: the page's main-thread CPU profile over the drag (CDP Profiler), as the functions with the
 * most self time — where a slow move spends its time.
 */
export async function startProfile(page: Page): Promise<() => Promise<string>> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
  await cdp.send('Profiler.start');
  return async () => {
    const { profile } = (await cdp.send('Profiler.stop')) as { profile: { nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; children?: number[] }[]; samples: number[]; timeDeltas: number[] } };
    await cdp.detach();
    const byId = new Map(profile.nodes.map((n) => [n.id, n]));
    const parent = new Map<number, number>();
    for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
    const name = (id: number | undefined) => {
      const f = id === undefined ? null : byId.get(id)?.callFrame;
      return f ? `${f.functionName || '(anonymous)'} ${f.url.split('/').pop() ?? ''}:${f.lineNumber}` : '(root)';
    };
    const self = new Map<string, number>();
    // Built-in functions (setAttribute, getBBox, ...) say little alone: their callers say who asked.
    const callers = new Map<string, Map<string, number>>();
    profile.samples.forEach((id, i) => {
      const key = name(id);
      const ms = (profile.timeDeltas[i] ?? 0) / 1000;
      self.set(key, (self.get(key) ?? 0) + ms);
      const by = callers.get(key) ?? new Map<string, number>();
      callers.set(key, by);
      const up = name(parent.get(id));
      by.set(up, (by.get(up) ?? 0) + ms);
    });
    const total = [...self.values()].reduce((a, b) => a + b, 0);
    return `main-thread profile over the drag (self time, ${total.toFixed(0)} ms sampled; after a built-in, its callers):\n` +
      [...self].sort((a, b) => b[1] - a[1]).slice(0, 25).map(([k, ms]) => {
        const up = k.includes(':-1') && !k.startsWith('(') ? `  ← ${[...callers.get(k)!].sort((a, b) => b[1] - a[1]).slice(0, 3).map(([c, t]) => `${c} ${t.toFixed(0)} ms`).join(', ')}` : '';
        return `  ${ms.toFixed(1).padStart(8)} ms  ${k}${up}`;
      }).join('\n');
  };
}
