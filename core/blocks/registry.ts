/**
 * The block registry: every block the faces offer, by kind. A block declares its parameters (params.ts), checks a
 * spec against them, and generates sized, placed pieces with ports, phase groups and targets (context.ts).
 * To add a block: write kinds/<name>.ts exporting a BlockDef (its doc comment names the published design
 * equations), add it to BLOCKS below, and add its checks to test/unit/blocks-*.test.ts (see DEVELOPERS.md).
 */
import { InputError, describe } from '../util/errors.ts';
import type { BlockDef } from './context.ts';
import { corporateBlock } from './kinds/corporate.ts';
import { wilkinsonBlock, branchlineBlock, ratraceBlock } from './kinds/splitters.ts';
import { transformerBlock, taperBlock } from './kinds/transformer.ts';
import { stubMatchBlock } from './kinds/stubMatch.ts';
import { lowpassBlock, bandstopBlock } from './kinds/filters.ts';
import { launchBlock } from './kinds/launch.ts';

export const BLOCKS: readonly BlockDef[] = [
  corporateBlock, wilkinsonBlock, branchlineBlock, ratraceBlock, transformerBlock, taperBlock, stubMatchBlock,
  lowpassBlock, bandstopBlock, launchBlock,
];

export function blockDef(kind: string): BlockDef {
  const b = BLOCKS.find((x) => x.kind === kind);
  if (!b) throw new InputError('bad-choice', 'block', `one of ${BLOCKS.map((x) => x.kind).join(', ')}`, describe(kind), "see 'stripwright block list'");
  return b;
}
