/**
 * The block picker's preview (state/block-preview.ts over worker/block-preview-job.ts; happy-dom, the core
 * generating and sweeping for real, the job inline):
 * - its figures at f0 are the placed block's own sweep: after Place, the app's response job (the response panel's
 *   sweep of the design) at f0 gives the same match, levels, phases and isolation to 1e-9 — a Wilkinson divider
 *   (isolation between its outputs) and a branch-line hybrid (isolated port), Pozar, Microwave Engineering, 4th ed.,
 *   2012, §7.3 and §7.5: both split the input equally, about −3 dB each less the line loss;
 * - its plot has the match, one transmission per output and the isolation the block names, over the block's band;
 * - the newest spec wins: with a stand-in worker, an answer for an older spec is dropped, a spec typed while one runs
 *   waits (only the newest), and a long stale run is stopped by ending the worker.
 * Laminate: 0.8 mm glass-epoxy (values from memory); specs are scenarios of our own.
 */
import { describe, expect, it, vi } from 'vitest';
import { render, fireEvent, screen, waitFor } from '@testing-library/svelte';
import { thinGlassEpoxyEditor as editor } from './block-picker-editor.ts';
import { newDesign } from '../../core/index.ts';
import BlockPicker from '../../renderer/src/components/BlockPicker.svelte';
import { responseJob } from '../../renderer/src/worker/response-job.ts';
import { BlockPreviewer, type PreviewState } from '../../renderer/src/state/block-preview.ts';
import { PREVIEW_POINTS, type BlockPreviewInput } from '../../renderer/src/worker/block-preview-job.ts';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));


/** The figure rows beside the plot: label → dB (and degrees where given), at full precision. */
function figures(): Map<string, { db: number; deg?: number }> {
  const out = new Map<string, { db: number; deg?: number }>();
  for (const tr of screen.getByTestId('block-preview-response').querySelectorAll('tr')) {
    const cell = tr.querySelector('[data-db]');
    if (!cell) continue;
    const deg = cell.getAttribute('data-deg');
    out.set(tr.querySelector('td')!.textContent!, { db: Number(cell.getAttribute('data-db')), ...(deg !== null ? { deg: Number(deg) } : {}) });
  }
  return out;
}

const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

describe('the block preview shows the placed block\'s own response', () => {
  for (const c of [
    { kind: 'wilkinson', input: 'in', outs: ['o1', 'o2'], iso: ['o1', 'o2'] },
    { kind: 'branchline', input: 'p1', outs: ['p2', 'p3', 'p4'], iso: ['p1', 'p4'] },
  ]) {
    it(`${c.kind}: the figures at f0 equal the placed block's sweep at f0 to 1e-9; the plot has match, transmissions and isolation`, async () => {
      const ed = editor();
      render(BlockPicker, { editor: ed, kind: c.kind, onclose: () => {} });
      await waitFor(() => expect(screen.getByTestId('block-preview-response')).toBeTruthy(), { timeout: 20_000 });
      await waitFor(() => expect(screen.getByTestId('block-preview').getAttribute('data-working')).toBe('false'), { timeout: 20_000 });
      const fig = figures();
      // The plot: the match, a transmission per output, the isolation the block names, each over the coarse sweep.
      const plot = screen.getByTestId('block-preview-plot');
      const kinds = [...plot.querySelectorAll('path[data-trace]')].map((p) => p.getAttribute('data-trace'));
      expect(kinds.filter((k) => k === 'match')).toHaveLength(1);
      expect(kinds.filter((k) => k === 'transmission')).toHaveLength(c.outs.length);
      expect(kinds.filter((k) => k === 'isolation')).toHaveLength(1);
      for (const p of plot.querySelectorAll('path[data-trace]')) expect((p.getAttribute('d') ?? '').match(/[ML]/g)!.length).toBeGreaterThanOrEqual(PREVIEW_POINTS);

      await fireEvent.click(screen.getByTestId('block-place'));
      expect(ed.doc.blocks).toHaveLength(1);
      const f0 = ed.doc.frequency.f0;
      // The response panel's own sweep of the placed design, at f0.
      const r = await responseJob({ doc: ed.doc, settings: { start: f0, stop: f0, points: 1 }, figures: false }, () => {});
      // The targets' band edges join the frequencies asked for: find f0 among them.
      const k = r.freqs.indexOf(f0);
      expect(k).toBeGreaterThanOrEqual(0);
      const idx = (p: string) => r.ports.indexOf(`b1.${p}`);
      const trace = (i: number, j: number) => r.traces.find((t) => t.i === i && t.j === j)!;
      const input = idx(c.input);
      expect(r.input).toBe(input);
      expect(Math.abs(fig.get('input match')!.db - trace(input, input).db[k]!)).toBeLessThan(1e-9);
      for (const o of c.outs) {
        const got = fig.get(`to ${o}`)!, t = trace(idx(o), input);
        expect(Math.abs(got.db - t.db[k]!), o).toBeLessThan(1e-9);
        expect(Math.abs(wrap(got.deg! - t.phase[k]!)), o).toBeLessThan(1e-9);
      }
      const iso = fig.get(`isolation ${c.iso[0]}–${c.iso[1]}`)!;
      const it2 = trace(idx(c.iso[1]!), idx(c.iso[0]!)) ?? trace(idx(c.iso[0]!), idx(c.iso[1]!));
      expect(Math.abs(iso.db - it2.db[k]!)).toBeLessThan(1e-9);
      // The textbook split (Pozar §7.3, §7.5): −3.01 dB to each of the two outputs, less this laminate's line loss
      // (about 0.2–0.4 dB here), and isolated (below −20 dB).
      for (const o of c.outs.slice(0, 2)) expect(fig.get(`to ${o}`)!.db).toBeGreaterThan(-3.8), expect(fig.get(`to ${o}`)!.db).toBeLessThan(-3.0);
      expect(iso.db).toBeLessThan(-20);
    }, 60_000);
  }
});

/** A stand-in preview worker: it keeps the jobs it was sent, and the test answers them. */
class FakeWorker {
  static made: FakeWorker[] = [];
  onmessage: ((e: MessageEvent) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  jobs: { id: number; input: BlockPreviewInput }[] = [];
  ended = false;
  constructor() { FakeWorker.made.push(this); }
  postMessage(m: { type: string; id: number; input: BlockPreviewInput }): void { if (m.type === 'job') this.jobs.push({ id: m.id, input: m.input }); }
  terminate(): void { this.ended = true; }
  answer(k: number, name: string): void {
    const j = this.jobs[k]!;
    this.onmessage?.({ data: { type: 'result', id: j.id, value: { name }, ms: 1 } } as MessageEvent);
  }
}

describe('the newest spec wins', () => {
  const ask = (raw: string): BlockPreviewInput => ({ host: newDesign({ f0: 2.45e9 }), kind: 'wilkinson', raw: { feed: raw } });

  const settle = () => new Promise((ok) => setTimeout(ok, 0));

  it('a spec typed while one runs waits (only the newest), and the older answer is dropped', async () => {
    FakeWorker.made = [];
    const seen: PreviewState[] = [];
    const p = new BlockPreviewer((s) => seen.push(s), () => new FakeWorker() as unknown as Worker, 60_000);
    p.request(ask('10mm'));
    p.request(ask('11mm'));
    p.request(ask('12mm'));
    const w = FakeWorker.made[0]!;
    expect(w.jobs.map((j) => j.input.raw.feed)).toEqual(['10mm']);
    expect(seen.at(-1)!.working).toBe(true);
    w.answer(0, 'old');
    await settle();
    // The 10 mm answer is not shown; the newest waiting spec (12 mm) runs next, 11 mm never does.
    expect(seen.some((s) => s.preview?.name === 'old')).toBe(false);
    expect(w.jobs.map((j) => j.input.raw.feed)).toEqual(['10mm', '12mm']);
    w.answer(1, 'newest');
    await settle();
    expect(seen.at(-1)).toMatchObject({ working: false, preview: { name: 'newest' }, error: null });
    p.destroy();
  });

  it('a long stale run is stopped: the worker is ended and a fresh one takes the newest spec', async () => {
    FakeWorker.made = [];
    const seen: PreviewState[] = [];
    const p = new BlockPreviewer((s) => seen.push(s), () => new FakeWorker() as unknown as Worker, -1);
    p.request(ask('10mm'));
    p.request(ask('12mm'));
    expect(FakeWorker.made).toHaveLength(2);
    expect(FakeWorker.made[0]!.ended).toBe(true);
    expect(FakeWorker.made[1]!.jobs.map((j) => j.input.raw.feed)).toEqual(['12mm']);
    FakeWorker.made[1]!.answer(0, 'newest');
    await settle();
    expect(seen.at(-1)).toMatchObject({ working: false, preview: { name: 'newest' } });
    p.destroy();
  });
});
