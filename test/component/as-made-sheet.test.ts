/**
 * The piece sheet of a milled design sized as made (chosen in its file): it shows the line's Z0 and εeff as made and
 * the same copper as plain microstrip, with the shift in per cent. Outside fact checked: copper beside a line (a
 * grounded coplanar line) lowers Z0 against microstrip of the same width — Ghione & Naldi 1984's conformal-mapping
 * formulas and every field solution agree on the direction; the numbers themselves come from the sizing run inline.
 */
import { describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor } from '@testing-library/svelte';
import { editorOn, sized } from './harness.ts';
import { EditorState } from '../../renderer/src/state/editor.svelte.ts';
import PieceSheet from '../../renderer/src/components/PieceSheet.svelte';
import StackPanel from '../../renderer/src/components/StackPanel.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));

const numbers = (text: string) => [...text.matchAll(/-?\d+(?:\.\d+)?/g)].map((m) => Number(m[0]));

describe('piece sheet of a line sized as made', () => {
  it('open-stub match (V-bit milled): the shift from plain microstrip is shown, and it is the sized piece\'s', async () => {
    const ed = editorOn('open-stub-match');
    expect(ed.doc.asMade?.sizing).toBe('as-made');
    await sized(ed);
    ed.select(['toload']);
    render(PieceSheet, { editor: ed });
    const text = screen.getByTestId('as-made-shift').textContent!;
    expect(text).toMatch(/side copper/);
    expect(text).toMatch(/plain microstrip/);
    const piece = ed.layout!.sized.pieces.find((p) => p.id === 'toload')!;
    expect(text).toContain(`Z0 ${piece.asMade!.z0.toFixed(2)} Ω`);
    expect(text).toContain(`${piece.asMade!.z0Plain.toFixed(2)} Ω`);
    // The per-cent shift printed is the one between the two Z0s, and negative (side copper lowers Z0).
    const pct = numbers(text.split('(').pop()!)[0]!;
    expect(pct).toBeCloseTo((piece.asMade!.z0 / piece.asMade!.z0Plain - 1) * 100, 1);
    expect(pct).toBeLessThan(0);
  }, 120_000);
  it('a design sized as plain microstrip shows no shift (the demo says microstrip in its file)', async () => {
    const ed = editorOn('demo');
    await sized(ed);
    ed.select(['feed']);
    render(PieceSheet, { editor: ed });
    expect(screen.queryByTestId('as-made-shift')).toBeNull();
    render(StackPanel, { editor: ed });
    expect((screen.getByTestId('field-sizing') as HTMLSelectElement).value).toBe('microstrip');
  });
  it('a new design (milled with the default V-bit) is sized as made, and says so in its file and in Stack & band', () => {
    const ed = new EditorState();
    expect(ed.doc.asMade).toEqual({ sizing: 'as-made', sideCopper: 'stitched' });
    render(StackPanel, { editor: ed });
    expect((screen.getByTestId('field-sizing') as HTMLSelectElement).value).toBe('as-made');
    // The default 30° V-bit (0.127 mm cut) reaches its 0.7 mm clearance in 1 + ⌈(0.7 − 0.127)/(0.6 · 0.127)⌉ = 9 passes.
    expect(screen.getByTestId('clearance-passes').textContent).toMatch(/^9 isolation passes open 0\.735 mm/);
    expect(screen.queryByTestId('clearance-warning')).toBeNull();
  });
  it('a clearance that needs more passes than are milled is said under the field (ten open 0.811 mm)', async () => {
    const ed = new EditorState();
    // 2 mm with the default V-bit's 0.127 mm cut: 1 + ⌈(2 − 0.127)/(0.6 · 0.127)⌉ = 26 passes needed; ten open
    // 0.1268 + 9 · 0.6 · 0.1268 = 0.811 mm (the pass arithmetic of core/layout/process-cut.ts, by hand).
    ed.setProcess({ ...(ed.doc.process as Extract<typeof ed.doc.process, { kind: 'v-bit' }>), clearance: 2e-3 });
    render(StackPanel, { editor: ed });
    await waitFor(() => expect(screen.getByTestId('clearance-passes').textContent).toMatch(/^10 isolation passes open 0\.811 mm/));
    expect(screen.getByTestId('clearance-warning').textContent).toMatch(/needs 26 passes .* at most 10 are milled/);
  });
});
