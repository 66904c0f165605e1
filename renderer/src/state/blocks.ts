/**
 * Placing a block (core/blocks, through core buildBlock) into the open design: the block is made for the design's
 * substrate, process and f0, then pasted beside what is already drawn as one undo step.
 */
import { buildBlock, InputError, errorWords, type BlockSpec } from '../../../core/index.ts';
import type { EditorState } from './editor.svelte.ts';

export type BlockKind = BlockSpec['kind'];

/** What the form asks; numbers in SI (couplingDb in dB, bw as a fraction). */
export type BlockAsk = { kind: 'coupler'; couplingDb: number } | { kind: 'bandpass'; order: number; bw: number; rippleDb?: number };

/** Places the block; returns null, or the reason it was not placed (in the user's words). */
export function placeBlock(ed: EditorState, ask: BlockAsk): string | null {
  const doc = ed.doc;
  let block;
  try {
    block = buildBlock({ ...ask, f0: doc.frequency.f0, substrate: doc.substrate, process: doc.process });
  } catch (e) {
    if (e instanceof InputError) return errorWords(e);
    throw e;
  }
  // Beside the drawing: 5 mm right of its rightmost node, top edges level.
  const xs = doc.nodes.map((n) => n.at.x), ys = block.nodes.map((n) => n.at.y);
  const bx = Math.min(...block.nodes.map((n) => n.at.x));
  const offset = doc.nodes.length ? { x: Math.max(...xs) + 5e-3 - bx, y: Math.max(...doc.nodes.map((n) => n.at.y)) - Math.max(...ys) } : { x: 0, y: 0 };
  const clipboard = JSON.stringify({ format: 'stripwright-clipboard', version: 1, nodes: block.nodes, segments: block.segments, areas: [] });
  const before = new Set([...doc.nodes.map((n) => n.id), ...doc.segments.map((s) => s.id)]);
  const ok = ed.edit('selection.paste', { clipboard, offset }, ask.kind === 'coupler' ? 'Place coupler' : 'Place band-pass filter');
  if (!ok) return ed.status;
  const added = [...ed.doc.nodes.map((n) => n.id), ...ed.doc.segments.map((s) => s.id)].filter((id) => !before.has(id));
  ed.selectAndFrame(added);
  ed.status = `Placed: ${block.name}`;
  return null;
}
