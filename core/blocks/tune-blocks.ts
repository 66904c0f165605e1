/**
 * Tuning with block parameters: `tuneWithBlocks` is the core's `tuneDesign` (core/network/tune) with the block
 * registry plugged in, so a placed block's numeric parameters can be variables — each step re-generates the block
 * from its spec, as re-opening it in the block form would (placed.ts `respecPlacement`). The one function behind the
 * app's Tune tab and `stripwright tune`.
 */
import type { DesignDoc } from '../design/types.ts';
import { withBlock } from '../design/commands-blocks.ts';
import { InputError } from '../util/errors.ts';
import { tuneDesign, isBlockVariable, type BlockVariable, type TuneOptions, type TuneResult } from '../network/tune/index.ts';
import { blockDef } from './registry.ts';
import { handEdits, respecPlacement } from './placed.ts';

/** The design with placed block `id` re-generated from `spec` (same place, same ids). */
export function regenerateBlock(doc: DesignDoc, id: string, spec: Record<string, unknown>): DesignDoc {
  return withBlock(doc, respecPlacement(doc, id, spec).placement);
}

/** Every numeric parameter of every placed block, with the range its block declares (SI). */
export function blockVariables(doc: DesignDoc): (BlockVariable & { meaning: string; unit: string })[] {
  const out: (BlockVariable & { meaning: string; unit: string })[] = [];
  for (const b of doc.blocks ?? []) {
    let def;
    try { def = blockDef(b.kind); } catch { continue; } // a kind this version does not know stays as drawn
    for (const p of def.params) {
      if (p.type !== 'number' || typeof b.spec[p.name] !== 'number') continue;
      out.push({ block: b.id, param: p.name, min: p.min, max: p.max, meaning: p.meaning, unit: p.unit });
    }
  }
  return out;
}

/** Tunes `doc`; block variables re-generate their blocks. Refuses a block edited by hand inside (tuning would undo the edits). */
export async function tuneWithBlocks(doc: DesignDoc, opts: TuneOptions): Promise<TuneResult> {
  opts.variables.forEach((v, i) => {
    if (!isBlockVariable(v)) return;
    if (!(doc.blocks ?? []).some((b) => b.id === v.block)) return; // tuneDesign names the missing block
    const edits = handEdits(doc, v.block);
    if (edits.length) {
      throw new InputError('bad-choice', `variables[${i}].block`, `a block not edited by hand since it was made (re-generating it would undo ${edits.slice(0, 3).join(', ')}${edits.length > 3 ? ', …' : ''})`,
        v.block, 'detach the block (its pieces become plain pieces) and tune the pieces, or re-generate it first');
    }
  });
  return tuneDesign(doc, { ...opts, regenerateBlock: regenerateBlock });
}
