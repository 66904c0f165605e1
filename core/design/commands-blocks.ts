/**
 * Commands for blocks placed from a spec (format 8; the pieces themselves are made by core/blocks, above this
 * layer, and handed in as data): `block.put` adds a block's records, or replaces those of the placed block with the
 * same id (a re-generated spec); `block.detach` forgets the block record and keeps its pieces as plain pieces.
 * Both are checked with the file's own schemas and the cross-record check, so undo replays them like any edit.
 */
import * as v from 'valibot';
import { InputError, describe } from '../util/errors.ts';
import type { DesignDoc, DesignNode, DesignSegment, PhaseGroup, PlacedBlock, Target, Tolerance } from './types.ts';
import { nodeSchema, segmentSchema, phaseGroupSchema, placedBlockSchema, frequencySchema, vec2Schema } from './schema.ts';
import { targetsSchema, tolerancesSchema } from './targets-schema.ts';
import { checkWith, type Args, type DesignCommand } from './command-args.ts';
import { pasteClipboard } from './clipboard.ts';
import { crossCheck } from './crossref.ts';

type Command = DesignCommand;

function settled(id: string, doc: DesignDoc): DesignDoc {
  const e = crossCheck(doc).errors[0];
  if (e) throw new InputError('invalid-design', e.path, e.expected, `${e.found} after ${id}`, 'the edit was not made');
  return doc;
}

export interface BlockRecords {
  record: PlacedBlock; nodes: DesignNode[]; segments: DesignSegment[]; phaseGroups: PhaseGroup[]; targets: Target[];
  /** The band the block is looked at over, Hz: the design's band (and its own sweep settings) widen to cover it. */
  band?: { start: number; stop: number };
  /** Tolerances for a design that has none yet (a block placed into an empty design). */
  tolerances?: Tolerance[];
}

/**
 * The design with its band, and its own sweep settings if it has them, widened to cover `band` (never narrowed: what
 * the user had stays inside). The sweep keeps its points and spacing.
 */
export function coverBand(doc: DesignDoc, band: { start: number; stop: number }): DesignDoc {
  const b = doc.frequency.band;
  const start = Math.min(b.start, band.start), stop = Math.max(b.stop, band.stop);
  const next: DesignDoc = start === b.start && stop === b.stop ? doc : { ...doc, frequency: { ...doc.frequency, band: { start, stop } } };
  const sw = doc.sweep;
  if (!sw || (sw.start <= band.start && sw.stop >= band.stop)) return next;
  return { ...next, sweep: { ...sw, start: Math.min(sw.start, band.start), stop: Math.max(sw.stop, band.stop) } };
}

/** The design with the block's records added, replacing those of a placed block of the same id (its members, and its groups and targets, whose ids start with `id.`). */
export function withBlock(doc: DesignDoc, pl: BlockRecords): DesignDoc {
  const id = pl.record.id;
  const old = (doc.blocks ?? []).find((b) => b.id === id);
  const gone = new Set(old ? old.members : []);
  const mine = (x: string) => old !== undefined && x.startsWith(`${id}.`);
  const host = pl.band ? coverBand(doc, pl.band) : doc;
  return {
    ...host,
    ...(pl.tolerances && !(doc.tolerances ?? []).length ? { tolerances: pl.tolerances } : {}),
    nodes: [...doc.nodes.filter((n) => !gone.has(n.id)), ...pl.nodes],
    segments: [...doc.segments.filter((s) => !gone.has(s.id)), ...pl.segments],
    phaseGroups: [...doc.phaseGroups.filter((g) => !mine(g.id)), ...pl.phaseGroups],
    targets: [...doc.targets.filter((t) => !mine(t.id)), ...pl.targets],
    blocks: [...(doc.blocks ?? []).filter((b) => b.id !== id), pl.record],
  };
}

export const blockPut: Command = {
  id: 'block.put', label: 'Place block',
  run(doc, a) {
    const rec: BlockRecords = {
      record: checkWith(placedBlockSchema, a.record, 'args.record') as PlacedBlock,
      nodes: checkWith(v.array(nodeSchema), a.nodes, 'args.nodes') as DesignNode[],
      segments: checkWith(v.array(segmentSchema), a.segments, 'args.segments') as DesignSegment[],
      phaseGroups: checkWith(v.array(phaseGroupSchema), a.phaseGroups ?? [], 'args.phaseGroups') as PhaseGroup[],
      targets: checkWith(targetsSchema, a.targets ?? [], 'args.targets') as Target[],
      ...(a.band !== undefined ? { band: checkWith(frequencySchema.entries.band, a.band, 'args.band') as { start: number; stop: number } } : {}),
      ...(a.tolerances !== undefined ? { tolerances: checkWith(tolerancesSchema, a.tolerances, 'args.tolerances') as Tolerance[] } : {}),
    };
    return settled(this.id, withBlock(doc, rec));
  },
};

export const blockDetach: Command = {
  id: 'block.detach', label: 'Detach block',
  run(doc, a) {
    const id = a.id;
    const blocks = doc.blocks ?? [];
    if (typeof id !== 'string' || !blocks.some((b) => b.id === id)) throw new InputError('bad-choice', 'args.id', `a placed block of this design (${blocks.map((b) => b.id).join(', ') || 'none'})`, JSON.stringify(id));
    return { ...doc, blocks: blocks.filter((b) => b.id !== id) };
  },
};

/**
 * `block.paste`: the coupled-line blocks (coupler, band-pass: core/blocks' direct generators, pasted as plain pieces)
 * in one step with what a placed block brings: the design band widened to the block's, and for a design with no
 * pieces and no tolerances the block's default tolerances.
 */
export const blockPaste: Command = {
  id: 'block.paste', label: 'Place block',
  run(doc, a) {
    const clip = typeof a.clipboard === 'string' ? a.clipboard : '';
    if (!clip) throw new InputError('invalid-design', 'args.clipboard', 'the block\'s pieces as clipboard text', describe(a.clipboard));
    const offset = checkWith(vec2Schema, a.offset ?? { x: 0, y: 0 }, 'args.offset');
    const band = a.band === undefined ? null : checkWith(frequencySchema.entries.band, a.band, 'args.band') as { start: number; stop: number };
    const tolerances = a.tolerances === undefined ? null : checkWith(tolerancesSchema, a.tolerances, 'args.tolerances') as Tolerance[];
    const empty = !doc.nodes.length && !doc.segments.length && !(doc.tolerances ?? []).length;
    let next = pasteClipboard(doc, clip, offset).doc;
    if (band) next = coverBand(next, band);
    if (tolerances && empty) next = { ...next, tolerances };
    return settled(this.id, next);
  },
};
