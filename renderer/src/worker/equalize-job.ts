/**
 * Worker jobs for the path ledger's Equalize button and the Tune panel: the core's `equalizeGroup` and `tuneDesign`
 * (the same functions as `stripwright equalize` and `stripwright tune`). Each returns the new nodes and segments
 * (the editor applies them as one undo step) and what the panels show.
 */
import type { DesignDoc, DesignNode, DesignSegment } from '../../../core/index.ts';
import { equalizeGroup, tuneWithBlocks, type MeanderStyle, type TuneVariable, type TunedVariable, type TargetEvaluation, type PlacedBlock, type PhaseGroup, type Target } from '../../../core/index.ts';
import type { Progress } from './client.ts';

/** `style`: the meander shape, as `stripwright equalize --style` takes it (default auto). */
export interface EqualizeInput { doc: DesignDoc; group: string; pieces?: string[]; style?: MeanderStyle }
export interface EqualizeOutput {
  nodes: DesignNode[];
  segments: DesignSegment[];
  /** One line per meander, and the spreads, in words. */
  lines: string[];
  spreadDeg: number;
  bandSpreadDeg: [number, number];
}

export function equalizeJob(input: EqualizeInput): EqualizeOutput {
  const r = equalizeGroup(input.doc, { group: input.group, ...(input.pieces ? { pieces: input.pieces } : {}), ...(input.style ? { style: input.style } : {}) });
  const lines = r.meanders.map((m) => {
    const shape = m.shape.kind === 'serpentine' ? (m.shape.bumps === 1 ? 'trombone' : `serpentine, ${m.shape.bumps} bumps`) : 'dogleg';
    return `${m.piece}: +${m.addedDeg.toFixed(2)}° (${(m.extraLength * 1e3).toFixed(2)} mm, ${shape}; legs' coupling ${m.couplingDeg[1].toFixed(2)}°)`;
  });
  lines.push(`spread at f0 ${r.spreadDeg.toFixed(2)}°, at the band edges ${r.bandSpreadDeg[0].toFixed(2)}° / ${r.bandSpreadDeg[1].toFixed(2)}°${r.group.offsetsDeg ? ' (the band-edge error the offsets imply)' : ''}`);
  if (r.sweepSpreadDeg) lines.push(`the sweep's S21 phase spread ${r.sweepSpreadDeg.map((x) => x.toFixed(2)).join(' / ')}° at band start / f0 / stop`);
  for (const w of r.warnings) lines.push(w.message);
  return { nodes: r.doc.nodes, segments: r.doc.segments, lines, spreadDeg: r.spreadDeg, bandSpreadDeg: r.bandSpreadDeg };
}

/** `weights`: one per design target, in the targets' order (default 1 each), as the CLI's goals file's `weight`. */
export interface TuneInput { doc: DesignDoc; variables: TuneVariable[]; seed: number; weights?: number[] }
export interface TuneOutput {
  nodes: DesignNode[];
  segments: DesignSegment[];
  variables: TunedVariable[];
  before: TargetEvaluation;
  after: TargetEvaluation;
  evaluations: number;
  layoutProblems: string[];
  /** When a block was tuned: the re-generated block records, groups and targets (whole lists, for the one undo step). */
  blocks?: PlacedBlock[];
  phaseGroups?: PhaseGroup[];
  targets?: Target[];
}

export async function tuneJob(input: TuneInput, progress: (p: Progress) => void, signal?: AbortSignal): Promise<TuneOutput> {
  const goals = input.weights ? input.doc.targets.map((target, i) => ({ target, weight: input.weights![i] ?? 1 })) : undefined;
  const r = await tuneWithBlocks(input.doc, {
    variables: input.variables, seed: input.seed, ...(goals ? { goals } : {}), ...(signal ? { signal } : {}),
    onProgress: (f) => progress({ done: Math.round(f * 1000), total: 1000, label: 'tuning' }),
    yieldTo: () => new Promise((ok) => setTimeout(ok, 0)),
  });
  const blocks = input.variables.some((v) => 'block' in v) ? { blocks: r.doc.blocks ?? [], phaseGroups: r.doc.phaseGroups, targets: r.doc.targets } : {};
  return { nodes: r.doc.nodes, segments: r.doc.segments, variables: r.variables, before: r.before, after: r.after, evaluations: r.evaluations, layoutProblems: r.layoutProblems, ...blocks };
}
