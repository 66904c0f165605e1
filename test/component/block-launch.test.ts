/**
 * The connector launch in the block form (happy-dom, the core generating and sweeping for real): its fields say their
 * meaning, unit and range; the pad width and taper length start empty (the block's own: the pad as wide as the line
 * where the line is the wider, common practice), the preview says so; a pad and taper that miss −25 dB (Pozar,
 * Microwave Engineering, 4th ed., 2012, §5.5: a short section of another impedance at the port) show the refusal
 * naming the nearest that meets it. Laminate: the new-design 1.6 mm glass-epoxy; the spec is a scenario of our own.
 */
import { describe, expect, it, vi } from 'vitest';
import { render, fireEvent, screen, waitFor } from '@testing-library/svelte';
import { EditorState } from '../../renderer/src/state/editor.svelte.ts';
import { newDesign, serializeDesign } from '../../core/index.ts';
import BlockPicker from '../../renderer/src/components/BlockPicker.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));

describe('the block form of the connector launch', () => {
  it('shows the pin, pad and taper with units and meaning, previews the pad on the line, and refuses a pad that misses', async () => {
    const ed = new EditorState();
    expect(ed.loadText(serializeDesign(newDesign()), null)).toBeNull();
    render(BlockPicker, { editor: ed, kind: 'launch', onclose: () => {} });
    const label = (id: string) => screen.getByTestId(id).closest('label')?.textContent ?? '';
    expect(label('block-pin-width')).toMatch(/Width of the connector's centre pin on the pad.*\(mm, 0\.2 to 5 mm\)/);
    expect(label('block-pad-width')).toMatch(/not given: the wider of the line and the pin.*\(mm, 0\.3 to 10 mm\)/);
    expect(label('block-taper-length')).toMatch(/not given: a 30° flare/);
    expect((screen.getByTestId('block-pin-width') as HTMLInputElement).value).toBe('1.27 mm');
    expect((screen.getByTestId('block-pad-width') as HTMLInputElement).value).toBe('');
    await waitFor(() => expect(screen.getByTestId('block-preview').textContent).toMatch(/pad on the [\d.]+ mm 50 Ω line itself/), { timeout: 10_000 });
    await fireEvent.input(screen.getByTestId('block-pad-width'), { target: { value: '1.5 mm' } });
    await fireEvent.input(screen.getByTestId('block-taper-length'), { target: { value: '3 mm' } });
    await waitFor(() => expect(screen.getByTestId('block-error').textContent).toMatch(/launch\.padWidth.*the nearest that meets it: no taper length/), { timeout: 10_000 });
  });
});
