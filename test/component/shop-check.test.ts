/**
 * The shop check dock on the demo feed, checks run inline by the same job the worker runs.
 * Outside reference: our own scenario S1 (common practice estimate) expects each input-to-patch path of this FR-4 board to lose ≈1.5–2 dB
 * and so to trip the 1 dB loss budget; with a low-loss laminate (tanδ 0.002, a tenth) the dielectric part, which
 * scales with tanδ (Pozar, Microwave Engineering, 4th ed., eq. 3.198), drops and the warning goes.
 */
import { describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor, fireEvent } from '@testing-library/svelte';
import { join } from 'node:path';
import { editorOn } from './harness.ts';
import { Compute } from '../../renderer/src/state/compute.svelte.ts';
import { setPolygonInit } from '../../renderer/src/worker/jobs.ts';
import { initPolygons } from '../../core/geometry/index.ts';
import ShopCheck from '../../renderer/src/components/ShopCheck.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));
const wasm = join(process.cwd(), 'node_modules/clipper2-wasm/dist/es/clipper2z.wasm');
setPolygonInit(() => initPolygons({ locateFile: () => wasm }));

describe('shop check dock', () => {
  it('lists the loss-budget finding, selects its pieces on click, and clears it after the fix', async () => {
    const ed = editorOn('demo');
    const compute = new Compute(ed, null);
    render(ShopCheck, { editor: ed, compute });
    // The App runs the check after each edit; here the test does.
    void compute.check();
    await waitFor(() => expect(screen.getAllByTestId('finding-loss-budget').length).toBeGreaterThan(0), { timeout: 20_000 });
    expect(screen.getByTestId('shop-check').textContent).toMatch(/Fix: a low-loss laminate/);
    await fireEvent.click(screen.getAllByTestId('finding-loss-budget')[0]!);
    const f = compute.findings!.find((x) => x.code === 'loss-budget')!;
    expect([...ed.selection].sort()).toEqual([...f.subjects].sort());
    expect(f.subjects.every((id) => ed.flagged.has(id))).toBe(true);
    ed.setSubstrate({ tanDelta: 0.002 });
    void compute.check();
    await waitFor(() => expect(screen.queryAllByTestId('finding-loss-budget').length).toBe(0), { timeout: 20_000 });
    compute.destroy();
  });
  it('the proximity limit is a design setting: typing 7h brings the two shunt arms\' finding (named, marked), undo takes it away in one step', async () => {
    // The branch-line example's shunt arms lie about 6.2 substrate heights apart (edge to edge), so the default
    // limit of 3 h (common practice) passes them and 7 h catches them. The coupling figure itself is checked in
    // test/unit/layout-proximity.test.ts against Pozar's coupled-section formula.
    const ed = editorOn('branchline-10g4');
    const compute = new Compute(ed, null);
    render(ShopCheck, { editor: ed, compute });
    void compute.check();
    await waitFor(() => expect(compute.findings).not.toBeNull(), { timeout: 20_000 });
    expect(screen.queryAllByTestId('finding-proximity')).toHaveLength(0);
    const field = screen.getByTestId('proximity-limit') as HTMLInputElement;
    expect(field.value).toBe('3h');
    const steps = ed.history.undoLabels.length;
    await fireEvent.input(field, { target: { value: '7h' } });
    await fireEvent.change(field);
    expect(ed.doc.proximityLimit).toEqual({ by: 'heights', heights: 7 });
    expect(ed.history.undoLabels.length).toBe(steps + 1);
    expect(screen.getByTestId('proximity-limit-metres').textContent).toMatch(/3\.56 mm/); // 7 × 0.508 mm
    void compute.check();
    await waitFor(() => expect(screen.queryAllByTestId('finding-proximity').length).toBeGreaterThan(0), { timeout: 20_000 });
    const f = compute.findings!.find((x) => x.code === 'proximity' && x.subjects.includes('shunt1'))!;
    expect([...f.subjects].sort()).toEqual(['shunt1', 'shunt2']);
    expect(f.message).toMatch(/shunt arm \(shunt\d\) and shunt arm \(shunt\d\)/);
    expect(f.subjects.every((id) => ed.near.has(id))).toBe(true);
    // A slip is refused in the user's words and changes nothing.
    await fireEvent.input(field, { target: { value: '3 furlongs' } });
    await fireEvent.change(field);
    expect(screen.getByTestId('proximity-limit-error').textContent).toMatch(/proximity limit: expected a multiple of the substrate height/);
    expect(ed.doc.proximityLimit).toEqual({ by: 'heights', heights: 7 });
    ed.undo();
    expect(ed.doc.proximityLimit).toBeUndefined();
    await waitFor(() => expect((screen.getByTestId('proximity-limit') as HTMLInputElement).value).toBe('3h'));
    void compute.check();
    await waitFor(() => expect(screen.queryAllByTestId('finding-proximity')).toHaveLength(0), { timeout: 20_000 });
    expect(ed.near.size).toBe(0);
    compute.destroy();
  });
});
