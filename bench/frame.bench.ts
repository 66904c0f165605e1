/**
 * Frame time of the board editor while dragging a bend of the 64-output corporate feed (core/layout/generators),
 * in Debian chromium against the built renderer under the app's CSP. Target: median under 16 ms (one 60 Hz frame).
 * First, without the browser, the drag's own work per move in Node (liveLayoutInNode).
 *
 * Per pointer move it measures the main-thread work from the event to the board's DOM being updated and laid out:
 * the pointer handler, the live History edit, Svelte's effects, the svg.js redraw and a forced style/layout. The
 * sizing and copper of each revision run in the worker meanwhile and are counted separately (worker job time).
 * Also printed: the interval between animation frames during a drag driven by real input events (headless chromium
 * paces frames at its own rate, so this is context, not the figure of merit).
 *   npm run bench -- frame        (builds the renderer first; FRAME_BENCH_ONLY=edit for section 3 alone)
 */
import { median, pct, withBuiltApp } from './built-app.ts';
import { editToScreen, type EditLatency } from './edit-latency.ts';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { corporateFeed, liveLayout, pieceOutlines, sizeDesign } from '../core/layout/index.ts';
import { runCommand, serializeDesign } from '../core/design/index.ts';
import { regionsPath } from '../renderer/src/board/paths.ts';

const OUTPUTS = 64;
const MOVES = 120;

/**
 * The drag's own work in Node, without the browser: per pointer move, the translate command and the core's live
 * layout (core liveLayout) plus the path text of the outlines it made afresh, as renderer/src/state/live-layout.ts
 * does it on the page. CPU time of this process, so other jobs on the machine barely change it.
 */
export function liveLayoutInNode(): void {
  const start = corporateFeed({ outputs: OUTPUTS, pitch: 12e-3 });
  const bend = start.nodes.find((n) => n.kind === 'vertex')!.id;
  const opts = {};
  let doc = start;
  let live = liveLayout(null, doc, opts);
  const cpu: number[] = [], wall: number[] = [], full: number[] = [];
  const cpuMs = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1000; };
  for (let k = 1; k <= 40; k++) {
    const c0 = cpuMs(), t0 = performance.now();
    doc = runCommand(doc, 'selection.translate', { ids: [bend], by: { x: 5e-5, y: (k % 3) * 1e-5 } });
    const was = new Set(live.outlines);
    live = liveLayout(live, doc, opts);
    for (const o of live.outlines) if (!was.has(o)) regionsPath(o.regions);
    cpu.push(cpuMs() - c0); wall.push(performance.now() - t0);
    const c1 = cpuMs();
    pieceOutlines(sizeDesign(doc, { cache: live.memo.cache }));
    full.push(cpuMs() - c1);
  }
  const load = readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
  console.log(`live layout of one pointer move in Node (translate command + core liveLayout + path text of the outlines it changed), 40 moves of bend ${bend}: CPU median ${median(cpu).toFixed(1)} ms, p90 ${pct(cpu, 0.9).toFixed(1)} ms; wall median ${median(wall).toFixed(1)} ms; last move redid ${live.redone.ends} ends, drew ${live.redone.drawn}, moved ${live.redone.moved}, kept ${live.redone.kept} outlines; a full sizing + outlines: CPU median ${median(full).toFixed(1)} ms (load average ${load})`);
}

export async function run(): Promise<void> {
  liveLayoutInNode();
  await withBuiltApp(async (page) => {
    // A pitch that keeps the 64-output row inside the 1 m board limit (sizing refuses larger boards).
    const doc = corporateFeed({ outputs: OUTPUTS, pitch: 12e-3 });
    const file = join(mkdtempSync(join(tmpdir(), 'sw-bench-')), 'feed64.json');
    writeFileSync(file, serializeDesign(doc));
    await page.getByTestId('menu-file').click();
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('menu-file.open').click();
    await (await chooser).setFiles(file);
    await page.getByTestId('design-name').filter({ hasText: `${OUTPUTS}-way` }).waitFor();
    await page.locator('[data-piece]').first().waitFor({ timeout: 60_000 });
    await page.waitForTimeout(500);
    const vertex = doc.nodes.find((n) => n.kind === 'vertex')!.id;
    const counts = (await page.evaluate(`({ pieces: document.querySelectorAll('[data-piece]').length, nodes: document.querySelectorAll('[data-node]').length, lines: document.querySelectorAll('[data-seg]').length })`)) as { pieces: number; nodes: number; lines: number };

    // FRAME_BENCH_ONLY=edit measures the whole edit alone (section 3).
    if (process.env.FRAME_BENCH_ONLY === 'edit') {
      console.log(`design: ${OUTPUTS}-output corporate feed, ${doc.nodes.length} nodes, ${doc.segments.length} segments; board shows ${counts.pieces} copper pieces`);
      printEdit(await editToScreen(page, vertex));
      return;
    }

    // 1. Main-thread work per move, measured in the page.
    // In-page code is a string: tsx would otherwise wrap functions in helpers the page does not have.
    const work = (await page.evaluate(`(async (id, moves) => {
      const svg = document.querySelector('[data-testid="board-canvas"]');
      const el = document.querySelector('[data-node="' + id + '"]');
      const r = el.getBoundingClientRect();
      const x0 = r.left + r.width / 2, y0 = r.top + r.height / 2;
      const ev = (type, x, y) => new PointerEvent(type, { clientX: x, clientY: y, button: 0, buttons: 1, bubbles: true, pointerId: 1, isPrimary: true });
      const flush = async () => { for (let i = 0; i < 4; i++) await Promise.resolve(); };
      svg.dispatchEvent(ev('pointerdown', x0, y0));
      const times = [];
      for (let k = 1; k <= moves; k++) {
        const t0 = performance.now();
        svg.dispatchEvent(ev('pointermove', x0 + k * 2, y0 + (k % 2)));
        await flush();
        svg.getBoundingClientRect();
        document.body.offsetHeight;
        times.push(performance.now() - t0);
        await new Promise((ok) => requestAnimationFrame(() => ok(null)));
      }
      svg.dispatchEvent(ev('pointerup', x0 + moves * 2, y0));
      return times;
    })(${JSON.stringify(vertex)}, ${MOVES})`)) as number[];

    // 2. Frame intervals with real input events from the browser.
    await page.keyboard.press('Control+z');
    await page.waitForTimeout(400);
    await page.evaluate(`(() => {
      window.__frames = []; window.__run = true;
      let last = performance.now();
      const tick = (t) => { window.__frames.push(t - last); last = t; if (window.__run) requestAnimationFrame(tick); };
      requestAnimationFrame(tick);
    })()`);
    const box = await page.locator(`[data-node="${vertex}"]`).boundingBox();
    if (box) {
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
      await page.mouse.down();
      for (let k = 1; k <= 60; k++) await page.mouse.move(box.x + box.width / 2 + k * 2, box.y + box.height / 2);
      await page.mouse.up();
    }
    const frames = (await page.evaluate(`(() => { window.__run = false; return window.__frames.slice(2); })()`)) as number[];
    await page.waitForTimeout(800);
    const workerMs = await page.getByTestId('layout-ms').innerText().catch(() => 'layout ? ms');

    // 3. The whole edit, pointer move → copper and response on screen (the Response tab open). Section 2's drag is
    // undone first: dragged on from there, the bend would fold back past what a miter can make, and sizing refuses it.
    await page.keyboard.press('Control+z');
    await page.waitForTimeout(400);
    const edit = await editToScreen(page, vertex);

    console.log(`design: ${OUTPUTS}-output corporate feed, ${doc.nodes.length} nodes, ${doc.segments.length} segments; board shows ${counts.pieces} copper pieces, ${counts.lines} centrelines, ${counts.nodes} node marks`);
    console.log(`drag of bend ${vertex}, ${MOVES} moves: main-thread work per frame median ${median(work).toFixed(2)} ms, p90 ${pct(work, 0.9).toFixed(2)} ms, max ${Math.max(...work).toFixed(2)} ms (target < 16 ms)`);
    console.log(`worker (off the main thread): ${workerMs} for one revision (sizing, per-piece copper, paths)`);
    console.log(`animation-frame interval during a real-input drag: median ${median(frames).toFixed(2)} ms, p90 ${pct(frames, 0.9).toFixed(2)} ms over ${frames.length} frames`);
    printEdit(edit);
  });
}

function printEdit(e: EditLatency): void {
  const row = (xs: number[]) => (xs.length ? `median ${median(xs).toFixed(1)} ms, p90 ${pct(xs, 0.9).toFixed(1)} ms` : 'never');
  const miss = (n: number) => (n ? ` (${n} of ${e.moves} moves never shown)` : '');
  console.log(`edit to screen, ${e.moves} pointer moves one per animation frame with the Response tab open (${e.draws.coarse} coarse and ${e.draws.full} full response draws):`);
  console.log(`  pointer move → copper on screen:          ${row(e.copper)} (target < 16.7 ms)${miss(e.missing.copper)}; ${e.ownCopper} of ${e.moves} moves showed their own revision's copper, the rest a later move's (the measure ends when the main thread has painted the frame showing that move's copper or a later one's)`);
  console.log(`  pointer move → copper in the DOM:         ${row(e.copperDom)} (script only: before the browser's style, layout and paint)`);
  console.log(`  pointer move → first response drawn:      ${row(e.first)}${miss(e.missing.first)}`);
  console.log(`  pointer move → ${e.fullPoints}-point response drawn:  ${row(e.full)} (target < 150 ms)${miss(e.missing.full)}`);
  if (e.tail) console.log(`  last moves and screen updates: ${e.tail}`);
  const c = e.cpu;
  const cpu = c ? `CPU (Linux per-thread counters, 10 ms ticks): page main thread ${c.main} ms, its workers ${c.workers} ms, rest of the renderer ${c.rendererOther} ms (${Object.entries(c.otherByName).map(([n, ms]) => `${n} ${ms}`).join(', ')}), GPU process (software raster and compositing) ${c.gpu} ms` : 'CPU: n/a (no /proc)';
  console.log(`  over ${e.wallMs.toFixed(0)} ms of wall time (${(e.wallMs / e.moves).toFixed(1)} ms per move): ${cpu}; load average ${e.load.before} before, ${e.load.after} after (2 cores shared with other jobs: wall times above include waiting for a core)`);
}
