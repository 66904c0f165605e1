/**
 * The meander's own coupling in its electrical length. Neighbouring legs of a serpentine run side by side at an edge
 * gap s, each neighbouring pair a U (a fold) joined at one end by the short stretch between them. The coupling's share
 * of one fold comes from `foldShareRad` (core/layout folds.ts: even and odd modes of the coupled-line model in
 * core/line), the one function the ledger and the sweep use too, so equalize, the ledger and the sweep agree.
 *
 * A serpentine of k bumps has 2k − 1 folds (k joined at the top, k − 1 along the run); their shares add (first order,
 * see folds.ts). A dogleg's ramps diverge and are not coupled. The coupled run of a leg is its straight copper: the
 * leg's centreline less a strip width taken by the two corners.
 */
import type { SubstrateSpec } from '../../substrate/types.ts';
import { foldShareRad, type FoldShape } from '../../layout/index.ts';
import type { MeanderShape } from './meander.ts';

/** The fold every neighbouring pair of a serpentine's legs makes (null for a shape without folds). */
export function meanderFold(width: number, shape: MeanderShape): FoldShape | null {
  if (shape.kind !== 'serpentine') return null;
  const gap = shape.pitch - width, coupled = shape.height - width;
  return gap > 0 && coupled > 0 ? { width, gap, coupled, join: shape.pitch } : null;
}

/** Extra phase delay the coupling of the meander's legs adds at f, degrees (positive = electrically longer). */
export function meanderCouplingDeg(sub: SubstrateSpec, width: number, shape: MeanderShape, f: number): number {
  const fold = meanderFold(width, shape);
  if (!fold || shape.kind !== 'serpentine') return 0;
  return ((2 * shape.bumps - 1) * foldShareRad(sub, fold, f) * 180) / Math.PI;
}
