/**
 * A measured block from a Touchstone file, added from the piece sheet (happy-dom, the core sizing and sweeping for
 * real). Outside reference: a series impedance Z between two Z0 ports has S11 = S22 = Z/(Z + 2Z0) and
 * S21 = S12 = 2Z0/(Z + 2Z0) (D. M. Pozar, Microwave Engineering, 4th ed., 2012, §4.4, the series-impedance two-port);
 * for 100 Ω in 50 Ω both are 0.5. A block holding that data must act as the lumped 100 Ω resistor it replaces.
 * The Touchstone text is written here for the test (Touchstone 1.1 layout: S11 S21 S12 S22 per line).
 */
import { describe, expect, it, vi } from 'vitest';
import { render, fireEvent, screen, waitFor } from '@testing-library/svelte';
import { flushSync } from 'svelte';
import { responseJob } from '../../renderer/src/worker/jobs.ts';
import { designSweepSettings } from '../../core/network/index.ts';
import { sizeDesign } from '../../core/layout/index.ts';
import { netlistFromSized } from '../../core/network/index.ts';
import { editorOn, sized } from './harness.ts';
import PieceSheet from '../../renderer/src/components/PieceSheet.svelte';

vi.mock('uplot', () => ({ default: class { destroy() {} } }));

const SERIES_100_OHM = [
  '! series 100 ohm between 50 ohm ports: S11 = S22 = 0.5, S21 = S12 = 0.5',
  '# GHz S RI R 50',
  ...[0.5, 1, 2, 3, 4, 6].map((f) => `${f} 0.5 0 0.5 0 0.5 0 0.5 0`),
].join('\n');

const wilkinson = () => editorOn('wilkinson-2g45');

describe('measured block from a Touchstone file', () => {
  it('replaces the lumped resistor in one undo step, keeps its pad pitch as the length, and undoes back', () => {
    const ed = wilkinson();
    expect(ed.useMeasuredData('r1', 'r100.s2p', SERIES_100_OHM)).toBeNull();
    const seg = ed.doc.segments.find((s) => s.id === 'r1')!;
    expect(seg.kind).toBe('sparams');
    if (seg.kind !== 'sparams') return;
    expect(seg.name).toBe('r100.s2p');
    expect(seg.touchstone).toBe(SERIES_100_OHM);
    expect(seg.length).toEqual({ by: 'length', length: 1.6e-3 }); // the 0603 pad pitch
    ed.undo();
    expect(ed.doc.segments.find((s) => s.id === 'r1')!.kind).toBe('lumped');
  });

  it('enters the network as the 100 Ω it measures: Y = (1/R)·[[1, −1], [−1, 1]] across the band (Pozar §4.4)', () => {
    const ed = wilkinson();
    expect(ed.useMeasuredData('r1', 'r100.s2p', SERIES_100_OHM)).toBeNull();
    const net = netlistFromSized(sizeDesign(ed.doc));
    const el = net.elements.find((e) => e.id === 'r1');
    expect(el?.kind).toBe('nport');
    if (el?.kind !== 'nport') return;
    for (const f of [2.4e9, 2.45e9, 2.5e9]) {
      const y = el.y(f); // complex 2×2, re/im interleaved, row-major
      const want = [0.01, 0, -0.01, 0, -0.01, 0, 0.01, 0];
      want.forEach((v, k) => expect(Math.abs(y[k]! - v)).toBeLessThan(1e-12));
    }
  });

  it('the design with the block sweeps like the one with the part, apart from the pads the part keeps', async () => {
    const ed = wilkinson();
    const lumped = await responseJob({ doc: ed.doc, settings: { ...designSweepSettings(ed.doc), points: 21 } }, () => {});
    expect(ed.useMeasuredData('r1', 'r100.s2p', SERIES_100_OHM)).toBeNull();
    const measured = await responseJob({ doc: ed.doc, settings: { ...designSweepSettings(ed.doc), points: 21 } }, () => {});
    // A part's pads shorten the lines that meet it; a measured block's reference planes are its ends, so the arms
    // differ by the pad length and the responses by a few thousandths, not more.
    for (const t of lumped.traces) {
      const m = measured.traces.find((x) => x.i === t.i && x.j === t.j)!;
      const linear = (db: number) => 10 ** (db / 20);
      t.db.forEach((db, k) => expect(Math.abs(linear(m.db[k]!) - linear(db))).toBeLessThan(0.01));
    }
  });

  it('refuses a file that is not 1- or 2-port Touchstone with the reason, and leaves the design as it was', () => {
    const ed = wilkinson();
    const rev = ed.revision;
    const threePort = ['# GHz S RI R 50', '1 ' + Array(18).fill('0').join(' ')].join('\n');
    expect(ed.useMeasuredData('r1', 'three.s3p', threePort)).toMatch(/1- or 2-port/);
    expect(ed.useMeasuredData('r1', 'junk.s2p', 'not a touchstone file')).toMatch(/expected/);
    expect(ed.useMeasuredData('feed', 'r100.s2p', SERIES_100_OHM)).toMatch(/Select a part/);
    expect(ed.revision).toBe(rev);
    expect(ed.doc.segments.find((s) => s.id === 'r1')!.kind).toBe('lumped');
  });

  /** The browser platform's file picker answers with `file` (as the user choosing it would). */
  function pickerAnswers(file: File): void {
    vi.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) {
      Object.defineProperty(this, 'files', { value: [file], configurable: true });
      this.dispatchEvent(new Event('change'));
    });
  }

  it('the piece sheet asks the platform for the file, shows what the data holds, and edits the block length', async () => {
    const ed = wilkinson();
    await sized(ed);
    ed.select(['r1']);
    render(PieceSheet, { editor: ed });
    pickerAnswers(new File([SERIES_100_OHM], 'r100.s2p', { type: 'text/plain' }));
    await fireEvent.click(screen.getByTestId('load-touchstone'));
    await waitFor(() => expect(ed.doc.segments.find((s) => s.id === 'r1')!.kind).toBe('sparams'));
    flushSync();
    expect(screen.getByTestId('block-summary').textContent).toMatch(/2-port data, 6 points from 0\.5 GHz to 6 GHz/);
    const field = screen.getByTestId('field-block-length') as HTMLInputElement;
    await fireEvent.focus(field);
    await fireEvent.input(field, { target: { value: '2.5 mm' } });
    await fireEvent.keyDown(field, { key: 'Enter' }); // an entry is committed with Enter
    const seg = ed.doc.segments.find((s) => s.id === 'r1')!;
    expect(seg.kind === 'sparams' && seg.length.length).toBeCloseTo(2.5e-3, 12);
    vi.restoreAllMocks();
  });

  it('shows the reason beside the button when the chosen file is refused, by the platform or by the check', async () => {
    const ed = wilkinson();
    ed.select(['r1']);
    render(PieceSheet, { editor: ed });
    pickerAnswers(new File(['hello'], 'bad.s2p'));
    await fireEvent.click(screen.getByTestId('load-touchstone'));
    await waitFor(() => expect(screen.getByTestId('touchstone-error').textContent).toMatch(/bad\.s2p/));
    pickerAnswers(new File([new Uint8Array([0xff, 0xd8, 0xff, 0x00])], 'photo.s2p'));
    await fireEvent.click(screen.getByTestId('load-touchstone'));
    await waitFor(() => expect(screen.getByTestId('touchstone-error').textContent).toMatch(/photo\.s2p is not UTF-8 text/));
    expect(ed.doc.segments.find((s) => s.id === 'r1')!.kind).toBe('lumped');
    vi.restoreAllMocks();
  });
});
