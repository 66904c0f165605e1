/**
 * Commands that put a computed network in place of the design's nodes and segments in one step: the result of
 * equalizing a phase group (meanders replace chosen runs) or of tuning (new lengths and widths). The computation
 * lives above the design layer (core/network/equalize, core/network/tune); these commands only carry its result as
 * data, check it with the file's own schemas and the cross-record check, and so make it one undo step.
 */
import * as v from 'valibot';
import { InputError } from '../util/errors.ts';
import type { DesignDoc, DesignNode, DesignSegment, PhaseGroup, PlacedBlock, Target } from './types.ts';
import { nodeSchema, segmentSchema, phaseGroupSchema, placedBlockSchema } from './schema.ts';
import { targetsSchema } from './targets-schema.ts';
import { checkWith, type Args, type DesignCommand } from './command-args.ts';
import { crossCheck } from './crossref.ts';
import { DESIGN_LIMITS } from './limits.ts';

type Command = DesignCommand;

function settled(id: string, doc: DesignDoc): DesignDoc {
  if (doc.nodes.length > DESIGN_LIMITS.nodes) throw new InputError('out-of-range', 'args.nodes', `at most ${DESIGN_LIMITS.nodes} nodes`, String(doc.nodes.length));
  if (doc.segments.length > DESIGN_LIMITS.segments) throw new InputError('out-of-range', 'args.segments', `at most ${DESIGN_LIMITS.segments} segments`, String(doc.segments.length));
  const e = crossCheck(doc).errors[0];
  if (e) throw new InputError('invalid-design', e.path, e.expected, `${e.found} after ${id}`, 'the edit was not made');
  return doc;
}

/** Keeps the identity of records that did not change, so the undo diff lists only what the result changed. */
function keepSame<T extends { id: string }>(old: readonly T[], next: T[]): T[] {
  const byId = new Map(old.map((r) => [r.id, r]));
  return next.map((r) => {
    const o = byId.get(r.id);
    return o && JSON.stringify(o) === JSON.stringify(r) ? o : r;
  });
}

function networkCommand(id: string, label: string): Command {
  return {
    id, label,
    run(doc, a) {
      const nodes = checkWith(v.array(nodeSchema, 'a list of nodes'), a.nodes, 'args.nodes') as DesignNode[];
      const segments = checkWith(v.array(segmentSchema, 'a list of segments'), a.segments, 'args.segments') as DesignSegment[];
      const next: DesignDoc = { ...doc, nodes: keepSame(doc.nodes, nodes), segments: keepSame(doc.segments, segments) };
      // Tuning a placed block's parameters re-generates it: its record, groups and targets come along (whole lists).
      if (a.blocks !== undefined) next.blocks = keepSame(doc.blocks ?? [], checkWith(v.array(placedBlockSchema, 'a list of placed blocks'), a.blocks, 'args.blocks') as PlacedBlock[]);
      if (a.phaseGroups !== undefined) next.phaseGroups = keepSame(doc.phaseGroups, checkWith(v.array(phaseGroupSchema, 'a list of phase groups'), a.phaseGroups, 'args.phaseGroups') as PhaseGroup[]);
      if (a.targets !== undefined) next.targets = keepSame(doc.targets, checkWith(targetsSchema, a.targets, 'args.targets') as Target[]);
      return settled(id, next);
    },
  };
}

/** The nodes and segments after equalizing a phase group (core/network/equalize). */
export const applyEqualize = networkCommand('network.equalize', 'Equalize phase group');
/** The nodes and segments after tuning (core/network/tune). */
export const applyTune = networkCommand('network.tune', 'Apply tuning');
