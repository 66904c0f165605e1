/**
 * The block picker's footprint field on a branched block (happy-dom, the core generating, folding and sweeping for
 * real): a Wilkinson divider with 15 mm port lines asked to fit 45 × 24 mm shows its folded copper in the live
 * preview (more pieces than laid out flat, the note saying what was folded), its response at f0 the same equal
 * split as laid out flat (both outputs alike, Wilkinson 1960 / Pozar, Microwave Engineering, 4th ed., 2012, §7.3,
 * each within 0.1 dB of the flat block's), and placing it puts the folded pieces into the design with the footprint in the block's
 * spec. A footprint too small shows the refusal naming the smallest that fits. Laminate: 0.8 mm glass-epoxy
 * (values from memory); the spec is a scenario of our own.
 */
import { describe, expect, it, vi } from 'vitest';
import { render, fireEvent, screen, waitFor } from '@testing-library/svelte';
import { thinGlassEpoxyEditor as editor } from './block-picker-editor.ts';
import BlockPicker from '../../renderer/src/components/BlockPicker.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));


const paths = () => screen.getByTestId('block-preview-copper').querySelectorAll('path').length;
/** The preview's levels to each output, dB. */
const levels = () => [...screen.getByTestId('block-preview-response').querySelectorAll('tr')]
  .filter((r) => /^to /.test(r.textContent ?? '')).map((r) => Number(r.querySelector('[data-db]')!.getAttribute('data-db')));

describe('the block form folds a branched block into its footprint', () => {
  it('a Wilkinson in 45 × 24 mm: the preview shows the folded copper and the same split, and Place puts it in', async () => {
    const ed = editor();
    render(BlockPicker, { editor: ed, kind: 'wilkinson', onclose: () => {} });
    await fireEvent.input(screen.getByTestId('block-feed'), { target: { value: '15 mm' } });
    await waitFor(() => expect(screen.getByTestId('block-preview').textContent).toMatch(/Wilkinson divider/), { timeout: 10_000 });
    const flat = paths(), flatLevels = levels();
    await fireEvent.input(screen.getByTestId('block-footprint'), { target: { value: '45mm, 24mm' } });
    await waitFor(() => expect(screen.getByTestId('block-preview').textContent).toMatch(/Folded \d+ lines? \(mitered bends/), { timeout: 10_000 });
    expect(paths()).toBeGreaterThan(flat);
    expect(screen.queryByTestId('block-error')).toBeNull();
    const now = levels();
    expect(now).toHaveLength(2);
    // The same split as laid out flat (the preview sweeps with the laminate's loss: the same lines, the same loss).
    now.forEach((db, k) => expect(Math.abs(db - flatLevels[k]!)).toBeLessThan(0.1));
    expect(Math.abs(now[0]! - now[1]!)).toBeLessThan(0.1);
    await fireEvent.click(screen.getByTestId('block-place'));
    expect(ed.doc.nodes.some((n) => n.id.includes('.fold'))).toBe(true);
    expect(ed.doc.blocks?.[0]?.spec.footprint).toEqual([45e-3, 24e-3]);
  }, 30_000);

  it('a footprint too small shows the refusal, naming the footprint the block needs', async () => {
    const ed = editor();
    render(BlockPicker, { editor: ed, kind: 'wilkinson', onclose: () => {} });
    await fireEvent.input(screen.getByTestId('block-footprint'), { target: { value: '10mm, 10mm' } });
    await waitFor(() => expect(screen.getByTestId('block-error').textContent).toMatch(/wilkinson\.footprint: expected a footprint of at least \d+\.\d mm × \d+\.\d mm/), { timeout: 10_000 });
  }, 30_000);
});
