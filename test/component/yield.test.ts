/**
 * The yield panel over the core's Monte Carlo (run inline, as the worker would): the panel shows what the core
 * computed for the same design and seed; the tolerance and target tables edit the design through its commands,
 * one undo step each. Outside facts about the numbers live in test/reference/yield-*.test.ts.
 */
import { describe, expect, it, vi } from 'vitest';
import { fireEvent, render, screen, waitFor } from '@testing-library/svelte';
import { editorOn } from './harness.ts';
import { Compute } from '../../renderer/src/state/compute.svelte.ts';
import { runYield } from '../../core/index.ts';
import YieldPanel from '../../renderer/src/components/YieldPanel.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));

describe('yield panel', () => {
  it('makes the boards and shows the core\'s yield, interval and one histogram per target', async () => {
    const ed = editorOn('three-section-transformer');
    const compute = new Compute(ed, null);
    render(YieldPanel, { editor: ed, compute });
    await fireEvent.input(screen.getByTestId('yield-samples'), { target: { value: '30' } });
    await fireEvent.input(screen.getByTestId('yield-seed'), { target: { value: '4' } });
    await fireEvent.click(screen.getByTestId('yield-run'));
    await waitFor(() => expect(screen.getByTestId('yield-overall')).toBeTruthy(), { timeout: 30_000 });
    const core = await runYield(ed.doc, { samples: 30, seed: 4 });
    expect(screen.getByTestId('yield-overall').textContent).toContain(`${(100 * core.overall.yield.p).toFixed(1)} %`);
    expect(screen.getByTestId('yield-interval').textContent).toContain(`${(100 * core.overall.yield.lo).toFixed(1)} %`);
    expect(screen.getByTestId('yield-hist-match').querySelectorAll('rect.bar').length).toBe(24);
    compute.destroy();
  });
  it('a design without targets says so and offers no run', () => {
    const ed = editorOn('open-stub-match');
    ed.edit('design.setTargets', { targets: [] });
    const compute = new Compute(ed, null);
    render(YieldPanel, { editor: ed, compute });
    expect(screen.getByTestId('yield-no-targets')).toBeTruthy();
    expect((screen.getByTestId('yield-run') as HTMLButtonElement).disabled).toBe(true);
    compute.destroy();
  });
  it('the tables add and remove tolerances and targets as single undo steps', async () => {
    const ed = editorOn('open-stub-match');
    const compute = new Compute(ed, null);
    render(YieldPanel, { editor: ed, compute });
    await fireEvent.click(screen.getByTestId('yield-view-edit'));
    const before = ed.doc.tolerances.length;
    const add = screen.getByTestId('add-tolerance') as HTMLSelectElement;
    add.value = 'resistor';
    await fireEvent.change(add);
    expect(ed.doc.tolerances.map((t) => t.quantity)).toContain('resistor');
    expect(ed.doc.tolerances.length).toBe(before + 1);
    await fireEvent.click(screen.getByTestId('add-target'));
    expect(ed.doc.targets.length).toBe(2);
    ed.undo();
    expect(ed.doc.targets.length).toBe(1);
    ed.undo();
    expect(ed.doc.tolerances.length).toBe(before);
    compute.destroy();
  });
});
