/**
 * What the faces say when a block is placed, in one set of words for the app and the CLI: the status line (with how
 * placing widened the design's band, bandChangeWords) and the name a design takes from the first block placed into it.
 */
import type { DesignDoc } from '../design/types.ts';
import { bandChangeWords } from './placed.ts';

/** Names a design has before anyone names it: the core's new design and the app's new feed. */
const UNNAMED = new Set(['Untitled design', 'Untitled feed', '']);

/**
 * The name a design takes when a block is placed into it: the block's title and the design frequency
 * ("Branch-line hybrid 2.45 GHz"), but only into a design with nothing drawn yet that nobody has named.
 */
export function nameFromBlock(before: DesignDoc, title: string): string | null {
  if (before.nodes.length || before.segments.length || !UNNAMED.has(before.name.trim())) return null;
  return `${title} ${+(before.frequency.f0 / 1e9).toFixed(4)} GHz`;
}

/** The status line after placing: the block's name, how the band widened (if it did), and default tolerances (if added). */
export function placedWords(name: string, before: DesignDoc, after: DesignDoc, tolerancesAdded: boolean): string {
  const band = bandChangeWords(before, after);
  return `Placed: ${name}${band ? `; ${band}` : ''}${tolerancesAdded ? '; default tolerances added' : ''}`;
}
