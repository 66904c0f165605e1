/**
 * Blocks: the registry of parametric blocks (registry.ts) made from a small spec, and the older direct generators
 * (coupler, band-pass). Each block names its design equations in its own file.
 */
export { prototypeValues, type PrototypeKind } from './lowpassPrototype.ts';
export { couplerBlock, type CouplerOptions } from './coupler.ts';
export { bandpassBlock, bandpassSections, type BandpassOptions } from './bandpassEdgeCoupled.ts';
export type { BlockBase } from './common.ts';
export { BLOCKS, blockDef } from './registry.ts';
export { readSpec, optionName, rangeText, defaultText, displayScale, parseComplex, UNIT_WORDS, type ParamDef, type ParamValue } from './params.ts';
export type { BlockDef, BlockContext, BlockPieces } from './context.ts';
export { generateBlock, makeBlockDesign, blockPlacement, placeBlock, handEdits, respecPlacement, freshBlockId, contextOf, fingerprint, bandChangeWords, type BlockPlacement } from './placed.ts';
export { defaultTolerances, defaultTolerancesFor, DEFAULT_TOLERANCES_NOTE, type DefaultTolerances } from './tolerance-defaults.ts';
export { transformerSections, chebyshevT } from './kinds/transformer.ts';
export { wilkinsonValues, branchlineValues } from './kinds/splitters.ts';
export { equalRippleRow, rowLossDb, optimumLossDb, prototypeLossDb, type StubRow } from './bandstopRichards.ts';
export { singleStubSolutions, doubleStubSolutions, throughLine, stubDegrees, loadFromTouchstone, type StubSolution } from './kinds/stubMatch.ts';

import { couplerBlock, type CouplerOptions } from './coupler.ts';
import { bandpassBlock, type BandpassOptions } from './bandpassEdgeCoupled.ts';
import type { DesignDoc } from '../design/types.ts';
import { InputError, describe } from '../util/errors.ts';
import { DEFAULT_TOLERANCES_NOTE, defaultTolerancesFor } from './tolerance-defaults.ts';

/** A block asked for by name, as the faces (CLI `block`, the app's block form) pass it. */
export type BlockSpec = ({ kind: 'coupler' } & CouplerOptions) | ({ kind: 'bandpass' } & BandpassOptions);
export const BLOCK_KINDS = ['coupler', 'bandpass'] as const;

/** The complete design of a coupler or band-pass block. Throws InputError naming the field at fault. */
export function buildBlock(spec: BlockSpec): DesignDoc {
  if (spec === null || typeof spec !== 'object') throw new InputError('bad-choice', 'block', `one of ${BLOCK_KINDS.join(', ')}`, describe(spec));
  if (typeof spec.f0 !== 'number' || !(spec.f0 >= 1e6 && spec.f0 <= 300e9)) throw new InputError(typeof spec.f0 === 'number' && Number.isFinite(spec.f0) ? 'out-of-range' : 'invalid-number', 'f0', 'a centre frequency from 1 MHz to 300 GHz', describe(spec.f0));
  let doc: DesignDoc;
  switch (spec.kind) {
    case 'coupler': doc = couplerBlock(spec); break;
    case 'bandpass': doc = bandpassBlock(spec); break;
    default: throw new InputError('bad-choice', 'block', `one of ${BLOCK_KINDS.join(', ')}`, describe((spec as { kind?: unknown }).kind));
  }
  // A whole design made from a block starts with the default tolerances of its laminate and process (tolerance-defaults.ts).
  if ((doc.tolerances ?? []).length) return doc;
  const d = defaultTolerancesFor(doc);
  return { ...doc, tolerances: d.tolerances, notes: [doc.notes ?? '', DEFAULT_TOLERANCES_NOTE, ...d.reasons.map((r) => `- ${r}`)].filter((x) => x).join('\n') };
}
export { tuneWithBlocks, regenerateBlock, blockVariables } from './tune-blocks.ts';
export { nameFromBlock, placedWords } from './placed-words.ts';
