/**
 * Redraw time of a response-plot marker drag with 5 traces of 1001 points (the demo four-way feed: S11 and the four
 * transmissions, swept at 1001 points through the app's own sweep settings), in Debian chromium against the built
 * renderer under the app's CSP. Target: median under 16.7 ms (one 60 Hz frame).
 *
 * Per pointer move it measures the main-thread work from the event to the marker layer redrawn and the readout table
 * laid out: the pointer handler, Svelte's effects (marker state, readout cells, Smith-chart marker dots) and the
 * canvas drawing, plus a forced style/layout. Printing figures, never a pass/fail test.
 *   npm run bench -- marker        (builds the renderer first)
 */
import { median, pct, withBuiltApp } from './built-app.ts';

const MOVES = 120;

export async function run(): Promise<void> {
  await withBuiltApp(async (page) => {
    await page.getByTestId('dock-response').click();
    await page.getByTestId('sweep-settings').click();
    await page.getByTestId('sweep-start').fill('5.5');
    await page.getByTestId('sweep-stop').fill('6.1');
    await page.getByTestId('sweep-points').fill('1001');
    await page.getByTestId('sweep-apply').click();
    await page.getByTestId('sweep-summary').filter({ hasText: '1001 points' }).waitFor({ timeout: 60_000 });
    const traces = await page.getByTestId('plot-legend').locator('.lg').count();
    const points = await page.getByTestId('sweep-summary').innerText();
    const box = (await page.getByTestId('response-plot-surface').boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.2, box.y + box.height / 2);
    await page.waitForTimeout(300);
    // In-page code is a string: tsx would otherwise wrap functions in helpers the page does not have.
    const work = (await page.evaluate(`(async (moves) => {
      const c = document.querySelector('[data-testid="response-plot-surface"]');
      const r = c.getBoundingClientRect();
      const x0 = r.left + r.width * 0.2, y0 = r.top + r.height / 2;
      const ev = (type, x) => new PointerEvent(type, { clientX: x, clientY: y0, button: 0, buttons: 1, bubbles: true, pointerId: 1, isPrimary: true });
      // A task after the event: Svelte's effects (queued as microtasks) have run by then.
      const settle = () => new Promise((ok) => { const ch = new MessageChannel(); ch.port1.onmessage = () => ok(null); ch.port2.postMessage(0); });
      c.dispatchEvent(ev('pointerdown', x0));
      const times = [];
      for (let k = 1; k <= moves; k++) {
        const t0 = performance.now();
        c.dispatchEvent(ev('pointermove', x0 + k * 3));
        await settle();
        document.body.offsetHeight;
        times.push(performance.now() - t0);
        await new Promise((ok) => requestAnimationFrame(() => ok(null)));
      }
      c.dispatchEvent(ev('pointerup', x0 + moves * 3));
      return times;
    })(${MOVES})`)) as number[];
    console.log(`design: demo four-way feed; ${points}; ${traces} traces in the legend`);
    console.log(`marker drag, ${MOVES} moves: main-thread work per move median ${median(work).toFixed(2)} ms, p90 ${pct(work, 0.9).toFixed(2)} ms, max ${Math.max(...work).toFixed(2)} ms (target < 16.7 ms, one 60 Hz frame)`);
  });
}
