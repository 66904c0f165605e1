/**
 * Block parameters as tuning variables (core/blocks tune-blocks.ts over core/network/tune): a placed Wilkinson block
 * (our own scenario) is tuned by its split ratio to a −4.0 dB output, the block re-generated at every step. Outside
 * check: the power split of an unequal divider, |S_o1|² = k/(1 + k) with k = P_o1/P_o2 (D. M. Pozar, Microwave
 * Engineering, 4th ed., 2012, §7.3, unequal-split Wilkinson), with the line loss the untuned block shows taken out.
 */
import { describe, expect, it } from 'vitest';
import { makeBlockDesign, tuneWithBlocks, blockVariables, History, serializeDesign, InputError, type DesignDoc, type Target } from '../../core/index.ts';

// Plain microstrip sizing, so the result can be read against the textbook power-split relation.
const doc = makeBlockDesign('wilkinson', { ratioDb: 0 }, { f0: 2.45e9, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
const g = doc.phaseGroups[0]!;
const goal: Target = { id: 'split', figure: 'transmission', ports: [g.from, g.to[0]!], band: { start: 2.45e9, stop: 2.45e9 }, limit: { min: -4.1, max: -3.9 } };
const variables = [{ block: 'b1', param: 'ratioDb', min: -4, max: 4 }];

describe('tuning a placed block\'s parameter', () => {
  it('lists the blocks\' number parameters with their declared ranges', () => {
    expect(blockVariables(doc).map((v) => `${v.block}@${v.param}`)).toEqual(expect.arrayContaining(['b1@ratioDb', 'b1@z0']));
  });
  it('meets the goal by the split ratio the power split gives (Pozar §7.3), re-generating the block', async () => {
    const r = await tuneWithBlocks(doc, { variables, goals: [{ target: goal, weight: 1 }], seed: 1 });
    expect(r.before.results[0]!.pass).toBe(false);
    expect(r.after.results[0]!.pass).toBe(true);
    const lossDb = -10 * Math.log10(0.5) + r.before.results[0]!.worst.value; // the untuned block's line loss (negative)
    const share = 10 ** ((-4.0 - lossDb) / 10); // |S_o1|² the lossless split must give
    const ratioDb = 10 * Math.log10(share / (1 - share));
    expect(Math.abs(r.variables[0]!.after - ratioDb)).toBeLessThan(0.3);
    // The block record carries the new value, and its pieces are the generator's for it.
    expect(r.doc.blocks![0]!.spec.ratioDb).toBeCloseTo(r.variables[0]!.after, 12);
    expect(r.doc.segments).not.toEqual(doc.segments);
    // One undo step in the app: network.tune with the block lists.
    const h = new History(doc);
    h.apply('network.tune', { nodes: r.doc.nodes, segments: r.doc.segments, blocks: r.doc.blocks, phaseGroups: r.doc.phaseGroups, targets: r.doc.targets });
    h.mark();
    expect(serializeDesign(h.doc)).toBe(serializeDesign(r.doc));
    expect(h.undo()).toBe(true);
    expect(serializeDesign(h.doc)).toBe(serializeDesign(doc));
  });
  it('refuses a block edited by hand inside, naming the edit', async () => {
    const edited: DesignDoc = { ...doc, segments: doc.segments.map((s, i) => (i === 0 && s.kind === 'line' ? { ...s, label: 'mine' } : s)) };
    await expect(tuneWithBlocks(edited, { variables, goals: [{ target: goal, weight: 1 }] })).rejects.toThrow(InputError);
    await expect(tuneWithBlocks(edited, { variables, goals: [{ target: goal, weight: 1 }] })).rejects.toThrow(/changed/);
  });
});
