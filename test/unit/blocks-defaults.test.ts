/**
 * What a block brings to the design it lands in, besides its pieces:
 * - default tolerances (core/blocks/tolerance-defaults.ts: common practice for home-made boards, values from memory)
 *   for a design made from a block or a block placed into an empty design, so a yield run shows a spread; a design
 *   that has tolerances, or any pieces, keeps what it has;
 * - the design band (and its own sweep settings) widened to cover the block's band, never narrowed, in the same
 *   `block.put` step (one undo step in the app).
 * The spread is checked against the same design with its tolerances removed (which must give σ = 0), so the check
 * can fail. Designs and bands are scenarios of our own.
 */
import { describe, expect, it } from 'vitest';
import {
  makeBlockDesign, blockPlacement, placeBlock, runCommand, runYield, newDesign, applicableTolerances, sizeDesign, validateDesign,
  defaultTolerances, type DesignDoc, type SubstrateSpec,
} from '../../core/index.ts';

const FR4: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const F0 = 2.45e9;
const MICROSTRIP = { sizing: 'microstrip', sideCopper: 'stitched' } as const;

describe('default tolerances of a block-made design', () => {
  it('a design made from a block carries εr, h, t, the process\'s width tolerance and a per-piece width error, with their reasons in its notes', () => {
    const doc = makeBlockDesign('wilkinson', {}, { f0: F0, substrate: FR4, asMade: MICROSTRIP });
    const q = doc.tolerances.map((t) => t.quantity);
    for (const x of ['er', 'h', 't', 'tool-width', 'mill-depth', 'width', 'resistor']) expect(q).toContain(x);
    expect(doc.tolerances.find((t) => t.quantity === 'width')!.scope).toBe('piece');
    for (const t of doc.tolerances) expect(t.spread).toBeGreaterThan(0);
    expect(String(doc.notes)).toMatch(/Default tolerances .*edit them/);
    expect(String(doc.notes)).toMatch(/laminate εr σ 2 %/);
    expect(validateDesign(doc, { complete: true }).ok).toBe(true);
    // Every default applies to the design's own process: none is listed as ignored by the yield code.
    expect(applicableTolerances(sizeDesign(doc)).ignored).toEqual([]);
  });
  it('an etched design gets an etch bias instead of the cutter\'s tolerances; a block without a resistor gets no resistor tolerance', () => {
    const etch = { kind: 'etch', edgeBias: 0, minFeature: 0.15e-3 } as const;
    const doc = makeBlockDesign('branchline', {}, { f0: F0, substrate: FR4, process: etch });
    const q = doc.tolerances.map((t) => t.quantity);
    expect(q).toContain('etch-bias');
    expect(q).not.toContain('tool-width');
    expect(q).not.toContain('resistor');
    expect(applicableTolerances(sizeDesign(doc)).ignored).toEqual([]);
  });
  it('a laminate given with t = 0 gets no copper-thickness tolerance (a zero spread would only clutter the list)', () => {
    const d = defaultTolerances({ ...FR4, t: 0 }, newDesign().process, { resistors: false });
    expect(d.tolerances.map((t) => t.quantity)).not.toContain('t');
    expect(d.reasons).toHaveLength(d.tolerances.length);
  });
  it('yield of a block design shows a spread; without its tolerances it shows none', async () => {
    const doc = makeBlockDesign('branchline', {}, { f0: F0, substrate: FR4, asMade: MICROSTRIP });
    const r = await runYield(doc, { samples: 24, seed: 3, rankingSamples: 0, points: 21 });
    expect(Math.max(...r.targets.map((t) => t.stats.sd))).toBeGreaterThan(0.01);
    const bare = await runYield({ ...doc, tolerances: [] }, { samples: 4, seed: 3, rankingSamples: 0, points: 21 });
    expect(Math.max(...bare.targets.map((t) => t.stats.sd))).toBe(0);
  }, 60_000);
  it('a block placed into an empty design brings the defaults; into a drawn design, or one with its own list, it adds none', () => {
    const empty = newDesign({ f0: F0, substrate: FR4, asMade: MICROSTRIP });
    expect(blockPlacement(empty, 'ratrace', {}, { x: 0, y: 0 }).tolerances?.length).toBeGreaterThan(3);
    const own = { ...empty, tolerances: [{ quantity: 'er' as const, distribution: 'normal' as const, spread: 0.05, scope: 'board' as const }] };
    expect(placeBlock(own, 'ratrace', {}, { x: 0, y: 0 }).tolerances).toEqual(own.tolerances);
    const drawn = placeBlock(empty, 'transformer', {}, { x: 0, y: 0 });
    const bare = { ...drawn, tolerances: [] };
    expect(placeBlock(bare, 'ratrace', {}, { x: 0.05, y: 0 }).tolerances).toEqual([]);
  });
});

describe('placing a block widens the design band to cover the block\'s', () => {
  const host = (): DesignDoc => ({ ...newDesign({ f0: F0, substrate: FR4, asMade: MICROSTRIP, band: { start: 2.4e9, stop: 2.5e9 } }), tolerances: [], sweep: { start: 2.3e9, stop: 2.6e9, points: 301, spacing: 'linear' } });
  it('a low-pass filter placed by the block.put command: band and sweep settings cover its band, the sweep keeps its points', () => {
    const doc = host();
    const pl = blockPlacement(doc, 'lowpass', { cutoff: '2 GHz' }, { x: 0, y: 0 });
    expect(pl.band.start).toBeLessThan(2.3e9);
    const next = runCommand(doc, 'block.put', { record: pl.record, nodes: pl.nodes, segments: pl.segments, phaseGroups: pl.phaseGroups, targets: pl.targets, band: pl.band });
    expect(next.frequency.band).toEqual({ start: Math.min(2.4e9, pl.band.start), stop: Math.max(2.5e9, pl.band.stop) });
    expect(next.sweep).toEqual({ start: Math.min(2.3e9, pl.band.start), stop: Math.max(2.6e9, pl.band.stop), points: 301, spacing: 'linear' });
    expect(next.frequency.f0).toBe(F0);
  });
  it('never narrows: a wide band the user set stays as it was', () => {
    const doc = { ...host(), frequency: { f0: F0, band: { start: 0.5e9, stop: 8e9 } }, sweep: { start: 0.1e9, stop: 9e9, points: 101, spacing: 'log' as const } };
    const next = placeBlock(doc, 'wilkinson', {}, { x: 0, y: 0 });
    expect(next.frequency.band).toEqual(doc.frequency.band);
    expect(next.sweep).toEqual(doc.sweep);
  });
  it('a bad band in the command is refused with the field named', () => {
    const doc = host();
    const pl = blockPlacement(doc, 'wilkinson', {}, { x: 0, y: 0 });
    expect(() => runCommand(doc, 'block.put', { record: pl.record, nodes: pl.nodes, segments: pl.segments, band: { start: -1, stop: 2e9 } })).toThrow(/args\.band/);
  });
});

describe('block.paste (the coupled-line blocks placed as plain pieces)', () => {
  it('widens the band and, into an empty design, brings the block\'s tolerances, in one step', async () => {
    const { buildBlock, copySelection } = await import('../../core/index.ts');
    const block = buildBlock({ kind: 'bandpass', order: 3, bw: 0.1, f0: 5.8e9, substrate: FR4, process: { kind: 'etch', edgeBias: 0, minFeature: 0.05e-3 } });
    expect(block.tolerances.length).toBeGreaterThan(3);
    const clipboard = copySelection(block, [...block.nodes.map((n) => n.id), ...block.segments.map((s) => s.id)]);
    const empty = newDesign({ f0: F0, substrate: FR4 });
    const next = runCommand(empty, 'block.paste', { clipboard, band: block.frequency.band, tolerances: block.tolerances });
    expect(next.frequency.band.stop).toBe(Math.max(empty.frequency.band.stop, block.frequency.band.stop));
    expect(next.tolerances).toEqual(block.tolerances);
    const again = runCommand(next, 'block.paste', { clipboard, offset: { x: 0, y: 0.03 }, band: block.frequency.band, tolerances: [] });
    expect(again.tolerances).toEqual(block.tolerances);
  });
});
