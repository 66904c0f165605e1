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
  // One step with the block's band (widening the design's) and, for an empty design, its default tolerances.
  const was = ed.doc;
  const named = nameFromBlock(was, ask.kind === 'coupler' ? 'Coupled-line coupler' : 'Edge-coupled band-pass');
  const ok = ed.editAll([
    { id: 'block.paste', args: { clipboard, offset, band: block.frequency.band, tolerances: block.tolerances } },
    ...(named ? [{ id: 'design.setInfo', args: { name: named } }] : []),
  ], ask.kind === 'coupler' ? 'Place coupler' : 'Place band-pass filter');
  if (!ok) return ed.status;
  const added = [...ed.doc.nodes.map((n) => n.id), ...ed.doc.segments.map((s) => s.id)].filter((id) => !before.has(id));
  ed.selectAndFrame(added);
  ed.status = placedWords(block.name, was, ed.doc, !(was.tolerances ?? []).length && (ed.doc.tolerances ?? []).length > 0);
  return null;
}

// ---- blocks of the registry (core/blocks/registry.ts), placed with their spec (block.put) -------------------------

import { BLOCKS, blockPlacement, respecPlacement, nameFromBlock, placedWords, type BlockPlacement, type PlacedBlock } from '../../../core/index.ts';

/** The placed block a record (node or segment id) belongs to, if any. */
export function blockOf(ed: EditorState, id: string | null): PlacedBlock | null {
  if (!id) return null;
  return (ed.doc.blocks ?? []).find((b) => b.members.includes(id)) ?? null;
}

/** Where a new block goes: at the pointer when it is over the board, else 10 mm right of the drawing. */
export function placementPoint(ed: EditorState): { x: number; y: number } {
  if (ed.hoverAt) return { ...ed.hoverAt };
  const xs = ed.doc.nodes.map((n) => n.at.x), ys = ed.doc.nodes.map((n) => n.at.y);
  return xs.length ? { x: Math.max(...xs) + 10e-3, y: Math.max(...ys) } : { x: 0, y: 0 };
}

function put(ed: EditorState, pl: BlockPlacement, label: string, name: string | null = null): boolean {
  // One step: the pieces, the design band widened to the block's (never narrowed), for an empty design the default
  // tolerances of its laminate and process, and for an empty unnamed design its name from the block.
  return ed.editAll([
    { id: 'block.put', args: { record: pl.record, nodes: pl.nodes, segments: pl.segments, phaseGroups: pl.phaseGroups, targets: pl.targets, band: pl.band, ...(pl.tolerances ? { tolerances: pl.tolerances } : {}) } },
    ...(name ? [{ id: 'design.setInfo', args: { name } }] : []),
  ], label);
}

/** Places a block of the registry at `at`; returns null, or the reason it was not placed (in the user's words). */
export function placeRegistered(ed: EditorState, kind: string, raw: Record<string, unknown>, at = placementPoint(ed)): string | null {
  let pl: BlockPlacement;
  try { pl = blockPlacement(ed.doc, kind, raw, at); } catch (e) { if (e instanceof InputError) return words(e); throw e; }
  const title = BLOCKS.find((b) => b.kind === kind)?.title ?? kind;
  const before = ed.doc;
  if (!put(ed, pl, `Place ${title.toLowerCase()}`, nameFromBlock(before, title))) return ed.status;
  ed.selectAndFrame(pl.record.members);
  ed.status = placedWords(pl.name, before, ed.doc, !!pl.tolerances);
  return null;
}

/**
 * Re-generates placed block `id` from a new spec. With hand edits inside it, `keep` decides: 'regenerate' replaces
 * them, 'detach' keeps the pieces as they are and forgets the block; without `keep` the edits are returned to ask.
 */
export function respecBlock(ed: EditorState, id: string, raw: Record<string, unknown>, keep?: 'regenerate' | 'detach'): string | null | { handEdits: string[] } {
  let r;
  try { r = respecPlacement(ed.doc, id, raw); } catch (e) { if (e instanceof InputError) return words(e); throw e; }
  if (r.handEdits.length && !keep) return { handEdits: r.handEdits };
  if (keep === 'detach') { ed.edit('block.detach', { id }, 'Detach block'); return null; }
  if (!put(ed, r.placement, 'Change block spec')) return ed.status;
  ed.selectAndFrame(r.placement.record.members);
  ed.status = `Re-made: ${r.placement.name}`;
  return null;
}

export function words(e: InputError): string { return `${e.field}: expected ${e.expected}, got ${e.got}${e.hint ? ` (${e.hint})` : ''}`; }
