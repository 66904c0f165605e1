/**
 * What the design's fabrication process cuts: the one place the tool's cut width and the isolation gap come from.
 * The shop check (checks.ts), the milling planner (core/toolpath) and the export pipeline's isolation outlines all
 * read it, so the app and the CLI never ask the user again for a tool the design already holds.
 *
 * - End mill: the cut is its diameter.
 * - V-bit: the V's width at the cutting depth, tip + 2·depth·tan(angle/2) (plain geometry).
 * - Etching: no tool; the narrowest gap the artwork can open is the minimum feature grown by the edge bias on both
 *   sides (artwork gaps shrink by 2 × bias).
 * The isolation gap (the channel a single isolation pass opens between copper and the rest) is one cut width, and
 * the tool-centre outline runs half a cut from the copper (common practice for isolation routing).
 */
import type { FabProcess } from '../design/types.ts';
import { exhaustive } from '../util/errors.ts';

/** Width of the cut the process makes (the narrowest gap it can open), m. */
export function cutWidth(p: FabProcess): number {
  switch (p.kind) {
    case 'end-mill': return p.toolDiameter;
    case 'v-bit': return p.tipWidth + 2 * p.depth * Math.tan(((p.angleDeg * Math.PI) / 180) / 2);
    case 'etch': return p.minFeature + 2 * Math.max(0, p.edgeBias);
    default: return exhaustive(p, 'process kind');
  }
}

export interface ProcessCut {
  /** The tool's cut width at its depth, m. */
  cutWidth: number;
  /** Width of the channel one isolation pass opens, m (the tool-centre outline sits half of it from the copper). */
  isolationGap: number;
  /** Words for notes and file comments, e.g. "V-bit 30°, 0.10 mm tip, 0.080 mm deep". */
  label: string;
}

/** The cut of a milling process: end mill or V-bit; null for etching, which has no tool. */
export function processCut(p: FabProcess): ProcessCut | null {
  if (p.kind === 'etch') return null;
  const w = cutWidth(p);
  const mm = (m: number) => (m * 1e3).toFixed(3);
  const label = p.kind === 'v-bit'
    ? `V-bit ${p.angleDeg}°, ${mm(p.tipWidth)} mm tip, ${mm(p.depth)} mm deep`
    : `${mm(p.toolDiameter)} mm end mill, ${mm(p.depth)} mm deep`;
  return { cutWidth: w, isolationGap: w, label };
}
