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
});
