/**
 * The response dock over the core's solver (run inline, as the worker would), on the demo four-way feed.
 * Outside facts: an ideal equal four-way split sends 1/4 of the power to each output, 10·log10(1/4) = −6.02 dB
 * (conservation of energy); the line loss on top is the path ledger's figure (the core's own loss model), so |S21|
 * at f0 ≈ −6.02 dB − loss, within 0.3 dB for the small mismatch. A passive network reflects no more than it
 * receives: every Γ drawn on the Smith chart lies inside the unit circle.
 */
import { describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor } from '@testing-library/svelte';
import { editorOn } from './harness.ts';
import { COARSE_POINTS, Compute, DIRECT_FULL_MS, LIVE_SWEEP_BUDGET_MS } from '../../renderer/src/state/compute.svelte.ts';
import { layoutJob, responseJob } from '../../renderer/src/worker/jobs.ts';
import { designSweepSettings } from '../../core/index.ts';
import ResponsePanel from '../../renderer/src/components/ResponsePanel.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));

describe('response dock', () => {
  it('shows S21 at f0 at the four-way split less the path loss, and Γ inside the unit circle', async () => {
    const ed = editorOn('demo');
    const compute = new Compute(ed, null);
    render(ResponsePanel, { editor: ed, compute });
    await waitFor(() => expect(screen.getByTestId('f0-S21')).toBeTruthy(), { timeout: 20_000 });
    const s21 = parseFloat(screen.getByTestId('f0-S21').textContent!.replace('S21', ''));
    const lay = await layoutJob({ doc: ed.doc }, () => {});
    const loss = lay.paths[0]!.paths[0]!.lossDb;
    expect(s21).toBeCloseTo(10 * Math.log10(1 / 4) - loss, 0);
    expect(Math.abs(s21 - (10 * Math.log10(1 / 4) - loss))).toBeLessThan(0.3);
    const r = compute.response!;
    for (const s of r.smith) s.re.forEach((re, k) => expect(Math.hypot(re, s.im[k]!)).toBeLessThanOrEqual(1 + 1e-9));
    expect(screen.getByTestId('smith').querySelectorAll('polyline').length).toBeGreaterThan(0);
    compute.destroy();
  });
});

describe('response dock on the two-way divider example', () => {
  it('shows an equal split (10·log10(1/2) = −3.01 dB less the line loss) and isolated outputs at f0 (Wilkinson, IRE Trans. MTT-8, 1960)', async () => {
    const ed = editorOn('wilkinson-2g45');
    const compute = new Compute(ed, null);
    render(ResponsePanel, { editor: ed, compute });
    await waitFor(() => expect(screen.getByTestId('f0-S32')).toBeTruthy(), { timeout: 20_000 });
    const val = (id: string) => parseFloat(screen.getByTestId(id).textContent!.replace(/^S\d\d/, ''));
    const lay = await layoutJob({ doc: ed.doc }, () => {});
    const loss = lay.paths[0]!.paths[0]!.lossDb;
    expect(Math.abs(val('f0-S21') - (10 * Math.log10(1 / 2) - loss))).toBeLessThan(0.3);
    expect(val('f0-S32')).toBeLessThan(-20);
    compute.destroy();
  });
});

describe('sweeps superseded and cancelled', () => {
  it('a newer sweep cancels the one it supersedes: the older never reaches the screen', async () => {
    const ed = editorOn('wilkinson-2g45');
    const compute = new Compute(ed, null);
    const base = { start: 1e9, stop: 4e9, log: false };
    const long = compute.sweep({ settings: { ...base, points: 100_001 } });
    const short = compute.sweep({ settings: { ...base, points: 21 } });
    await Promise.all([long, short]);
    expect(compute.response!.settings.points).toBe(21);
    expect(compute.responseCancelled).toBe(false);
    expect(compute.responseProgress).toBeNull();
    compute.destroy();
  });
  it('cancel stops a sweep by hand and keeps the last finished response', async () => {
    const ed = editorOn('wilkinson-2g45');
    const compute = new Compute(ed, null);
    await compute.sweep({ settings: { start: 2e9, stop: 3e9, points: 11, log: false } });
    const done = compute.sweep({ settings: { start: 1e9, stop: 4e9, points: 100_001, log: false } });
    compute.cancelSweep();
    await done;
    expect(compute.responseCancelled).toBe(true);
    // The cancelled sweep's 21-point first pass had finished (it runs before the full sweep looks at the signal), so
    // it is the last finished response of this design and stays; it is no longer shown as a first pass.
    expect(compute.response!.settings.points).toBe(COARSE_POINTS);
    expect(compute.responseCoarse).toBe(false);
    expect(compute.response!.settings.start).toBe(1e9);
    compute.destroy();
  });
});

describe('targets in the app are judged as `stripwright build` judges them', () => {
  it('every example carries targets, and the panel\'s pass/fail and worst values equal the core evaluation at build\'s frequencies', async () => {
    const { EXAMPLES } = await import('../../renderer/src/state/examples.ts');
    const { responseJob } = await import('../../renderer/src/worker/jobs.ts');
    const { sizeDesign } = await import('../../core/layout/index.ts');
    const { netlistFromSized, solveNetwork, targetFrequencies, evaluateTargets, designSweepSettings } = await import('../../core/network/index.ts');
    for (const ex of EXAMPLES) {
      const ed = editorOn(ex.id);
      expect(ed.doc.targets.length, ex.id).toBeGreaterThan(0);
      const app = await responseJob({ doc: ed.doc }, () => {});
      const sized = sizeDesign(ed.doc);
      const build = evaluateTargets(solveNetwork(netlistFromSized(sized), targetFrequencies(designSweepSettings(ed.doc), ed.doc.targets)), ed.doc);
      expect(app.targets!.results.map((t) => [t.id, t.pass, t.worst.value, t.worst.freq]), ex.id).toEqual(build.results.map((t) => [t.id, t.pass, t.worst.value, t.worst.freq]));
    }
  });
});

describe('response: a coarse pass first, then the full sweep', () => {
  it('shows a 21-point response before the full sweep at the design settings replaces it', async () => {
    const ed = editorOn('wilkinson-2g45');
    const compute = new Compute(ed, null);
    const shown: { points: number; coarse: boolean }[] = [];
    const set = Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.set!;
    Object.defineProperty(compute, 'response', {
      configurable: true,
      get: () => Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.get!.call(compute),
      set: (v) => { set.call(compute, v); if (v) shown.push({ points: v.settings.points, coarse: compute.responseCoarse }); },
    });
    const full = designSweepSettings(ed.doc);
    expect(full.points).toBeGreaterThan(COARSE_POINTS);
    await compute.sweep();
    expect(shown).toEqual([{ points: COARSE_POINTS, coarse: true }, { points: full.points, coarse: false }]);
    expect(compute.response!.settings.points).toBe(full.points);
    expect(compute.responseCoarse).toBe(false);
    // The coarse pass spans the same band: its first and last frequencies are the full sweep's.
    const coarse = await responseJob({ doc: ed.doc, settings: { ...full, points: COARSE_POINTS } }, () => {});
    expect(coarse.freqs[0]).toBe(compute.response!.freqs[0]);
    expect(coarse.freqs.at(-1)).toBe(compute.response!.freqs.at(-1));
    // A sweep asked at the coarse size or below has no separate first pass.
    shown.length = 0;
    await compute.sweep({ settings: { ...full, points: 11 } });
    expect(shown.map((s) => s.points)).toEqual([11]);
    compute.destroy();
  }, 120_000);
});

describe('the response follows edits (Compute.follow)', () => {
  it('edits made while a live sweep runs wait; the newest revision gets its full response, and its numbers are sweep()\'s', async () => {
    const ed = editorOn('demo');
    const compute = new Compute(ed, null);
    const shown: { revision: number | null; points: number }[] = [];
    const set = Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.set!;
    Object.defineProperty(compute, 'response', {
      configurable: true,
      get: () => Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.get!.call(compute),
      set: (v) => { set.call(compute, v); if (v) shown.push({ revision: compute.responseRevision, points: v.settings.points }); },
    });
    const vertex = ed.doc.nodes.find((n) => n.kind === 'vertex')!;
    compute.follow();
    // Three more edits while the first live sweep runs: they coalesce into one sweep of the newest.
    for (let k = 1; k <= 3; k++) {
      expect(ed.edit('node.move', { id: vertex.id, at: { x: vertex.at.x + k * 1e-4, y: vertex.at.y } })).toBe(true);
      compute.follow();
    }
    const last = ed.revision;
    await vi.waitFor(() => expect(compute.sweeping).toBe(false), { timeout: 60_000, interval: 20 });
    const full = designSweepSettings(ed.doc).points;
    expect(compute.responseError).toBeNull();
    expect(compute.responseRevision).toBe(last);
    expect(compute.responseCoarse).toBe(false);
    expect(compute.response!.settings.points).toBe(full);
    // Every revision shown comes coarse first, then full; the revisions between the first and the newest are skipped.
    const revisions = [...new Set(shown.map((s) => s.revision))];
    expect(revisions.length).toBeLessThanOrEqual(2);
    expect(revisions.at(-1)).toBe(last);
    // Its coarse pass is left out when the full sweep before it was quick (DIRECT_FULL_MS; the machine decides).
    expect([[COARSE_POINTS, full], [full]]).toContainEqual(shown.filter((s) => s.revision === last).map((s) => s.points));
    // The same numbers as an explicit sweep of the same design, to rounding: a live pass of a network of more than
    // four ports solves only the entries the panel reads (core viewEntries; the input's row from the transposed
    // factors), which may differ from the whole solve in the last digit (the core's bound: |ΔS| < 1e-12).
    const again = await responseJob({ doc: ed.doc }, () => {});
    const live = compute.response!.traces[1]!.db, whole = again.traces[1]!.db;
    expect(live.length).toBe(whole.length);
    live.forEach((x, k) => expect(Math.abs(x - whole[k]!)).toBeLessThan(1e-9));
    compute.destroy();
  }, 120_000);
});

describe('a long live sweep gives way to the newest edit', () => {
  it('over LIVE_SWEEP_BUDGET_MS, a newer revision stops the stale full sweep; the newest gets its full response', async () => {
    const ed = editorOn('demo');
    expect(ed.edit('design.setSweep', { sweep: { start: 1e9, stop: 4e9, points: 20_001, spacing: 'linear' } })).toBe(true);
    const compute = new Compute(ed, null);
    (compute as unknown as { lastFullMs: number }).lastFullMs = LIVE_SWEEP_BUDGET_MS + 1; // as if the last full sweep had been long
    const shown: { revision: number | null; points: number }[] = [];
    const set = Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.set!;
    Object.defineProperty(compute, 'response', {
      configurable: true,
      get: () => Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.get!.call(compute),
      set: (v) => { set.call(compute, v); if (v) shown.push({ revision: compute.responseRevision, points: v.settings.points }); },
    });
    const first = ed.revision;
    compute.follow();
    await vi.waitFor(() => expect(compute.responseCoarse).toBe(true), { timeout: 60_000, interval: 5 });
    // The full 20 001-point sweep of the first revision is running now; an edit stops it.
    const vertex = ed.doc.nodes.find((n) => n.kind === 'vertex')!;
    expect(ed.edit('node.move', { id: vertex.id, at: { x: vertex.at.x + 1e-4, y: vertex.at.y } })).toBe(true);
    compute.follow();
    await vi.waitFor(() => expect(compute.sweeping).toBe(false), { timeout: 120_000, interval: 50 });
    expect(shown).toEqual([{ revision: first, points: COARSE_POINTS }, { revision: ed.revision, points: COARSE_POINTS }, { revision: ed.revision, points: 20_001 }]);
    expect(compute.responseCancelled).toBe(false);
    compute.destroy();
  }, 180_000);
});

describe('live passes: a coarse pass only where it helps, the figure table only where it is shown', () => {
  function recording(compute: Compute) {
    const shown: { points: number; figures: boolean }[] = [];
    const set = Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.set!;
    Object.defineProperty(compute, 'response', {
      configurable: true,
      get: () => Object.getOwnPropertyDescriptor(Object.getPrototypeOf(compute), 'response')!.get!.call(compute),
      set: (v) => { set.call(compute, v); if (v) shown.push({ points: v.settings.points, figures: v.figures !== null }); },
    });
    return shown;
  }
  it('after a full sweep within DIRECT_FULL_MS the next revision is swept full at once; an unknown or slow one gets the coarse pass first', async () => {
    const ed = editorOn('wilkinson-2g45');
    const full = designSweepSettings(ed.doc).points;
    for (const [last, want] of [[0, [COARSE_POINTS, full]], [DIRECT_FULL_MS + 1, [COARSE_POINTS, full]], [DIRECT_FULL_MS, [full]]] as const) {
      const compute = new Compute(ed, null);
      const shown = recording(compute);
      (compute as unknown as { lastFullMs: number }).lastFullMs = last;
      compute.follow();
      await vi.waitFor(() => expect(compute.sweeping).toBe(false), { timeout: 60_000, interval: 20 });
      expect(shown.map((x) => x.points), `last full sweep ${last} ms`).toEqual(want);
      compute.destroy();
    }
  }, 120_000);
  it('live passes leave the figures out until the table is shown; then the same response comes with them, equal to an explicit sweep\'s', async () => {
    const ed = editorOn('wilkinson-2g45');
    const compute = new Compute(ed, null);
    const shown = recording(compute);
    compute.follow();
    await vi.waitFor(() => expect(compute.sweeping).toBe(false), { timeout: 60_000, interval: 20 });
    expect(shown.every((x) => !x.figures)).toBe(true);
    compute.showFigures(true);
    await vi.waitFor(() => expect(compute.response?.figures).not.toBeNull(), { timeout: 60_000, interval: 20 });
    await vi.waitFor(() => expect(compute.sweeping).toBe(false), { timeout: 60_000, interval: 20 });
    const explicit = await responseJob({ doc: ed.doc }, () => {});
    expect(compute.response!.figures).toEqual(explicit.figures);
    // Only the table differs between a pass with and without it.
    const without = await responseJob({ doc: ed.doc, figures: false }, () => {});
    expect(without.figures).toBeNull();
    expect({ ...without, figures: explicit.figures, cached: explicit.cached }).toEqual(explicit);
    compute.destroy();
  }, 120_000);
});
