/**
 * What the faces say and do when a block is placed (core/blocks/placed-words.ts; the project's own rules): the status
 * line carries how placing widened the band in the same words the CLI prints (bandChangeWords), and a design with
 * nothing drawn that nobody named takes the block's name and design frequency.
 */
import { describe, expect, it } from 'vitest';
import { newDesign, placeBlock, makeBlockDesign, nameFromBlock, placedWords, bandChangeWords, processCautions } from '../../core/index.ts';

describe('placing a block: the status words and the design name', () => {
  it('into a new unnamed design: named after the block; the band widening said in the CLI\'s words', () => {
    const before = newDesign({ name: 'Untitled feed', asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
    expect(nameFromBlock(before, 'Branch-line hybrid')).toBe('Branch-line hybrid 2.45 GHz');
    const after = placeBlock(before, 'lowpass', { cutoff: '2 GHz' }, { x: 0, y: 0 });
    const words = placedWords('Order 5 low-pass', before, after, true);
    expect(words).toBe(`Placed: Order 5 low-pass; ${bandChangeWords(before, after)}; default tolerances added`);
    expect(words).toMatch(/design band widened from 2\.4 GHz–2\.5 GHz to 0\.1 GHz–4 GHz/);
  });
  it('a named design, or one with pieces, keeps its name; no widening, no words about it', () => {
    const named = newDesign({ name: 'Mast feed' });
    expect(nameFromBlock(named, 'Wilkinson divider')).toBeNull();
    const drawn = placeBlock(newDesign({ name: 'Untitled design', asMade: { sizing: 'microstrip', sideCopper: 'stitched' } }), 'wilkinson', {}, { x: 0, y: 0 });
    expect(nameFromBlock(drawn, 'Wilkinson divider')).toBeNull();
    expect(placedWords('Wilkinson', drawn, drawn, false)).toBe('Placed: Wilkinson');
  });
});

describe('the cautions a block-made design carries follow its process (common practice)', () => {
  it('etched: etchant cautions and the dust of drilling and cutting; milled: dust, no etchant', () => {
    const etched = makeBlockDesign('lowpass', { cutoff: '2 GHz' }, { f0: 2.45e9, process: { kind: 'etch', edgeBias: 0, minFeature: 0.15e-3 }, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
    expect(etched.notes).toMatch(/Etchants .* corrosive/);
    expect(etched.notes).toMatch(/dust/);
    const milled = makeBlockDesign('lowpass', { cutoff: '2 GHz' }, { f0: 2.45e9, process: { kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3 }, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
    expect(milled.notes).toMatch(/dust/);
    expect(milled.notes).not.toMatch(/[Ee]tchant/);
    expect(processCautions({ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 })).not.toContainEqual(expect.stringMatching(/Etchant/));
  });
});
