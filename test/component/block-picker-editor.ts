/**
 * The editor both block-picker component tests start from: an empty design on 0.8 mm glass-epoxy at 2.45 GHz
 * (laminate values from memory), sized as plain microstrip with stitched side copper.
 */
import { expect } from 'vitest';
import { EditorState } from '../../renderer/src/state/editor.svelte.ts';
import { newDesign, serializeDesign } from '../../core/index.ts';

export function thinGlassEpoxyEditor(): EditorState {
  const ed = new EditorState();
  const doc = newDesign({ f0: 2.45e9, substrate: { er: 4.4, h: 0.8e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 }, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
  expect(ed.loadText(serializeDesign(doc), null)).toBeNull();
  return ed;
}
