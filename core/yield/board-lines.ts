/**
 * The one place the yield turns a made board's copper into lines: the line-model interface (core/line/line-model.ts)
 * with the models and line options the nominal design was sized with. A design sized as made (design `asMade`)
 * carries its cross-section tables in `sized.lineOptions`, and a caller's planted families in `sized.lineModels`;
 * the per-board tables (batch-solver.ts), the re-evaluated open ends (made-board.ts) and the fast path-phase
 * estimate (path-phase.ts) all ask here, so every made board is analysed with the lines its nominal was sized with.
 * No model of its own: the project's own seam; the models it reaches cite their published sources in core/line.
 */
import {
  lineModels as coreLineModels, stripAt, stripColumns,
  type LineAt, type LineColumns, type LineModels, type LineOptions, type StripLineFamily,
} from '../line/index.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import type { SizedDesign } from '../layout/types.ts';

export interface BoardLines {
  /** The set the design was sized with (coupled pairs in the network ask it too). */
  models: LineModels;
  /** Its strip family. */
  strip: StripLineFamily;
  /** The line options the design was sized with (as made: with the cross-section tables), or undefined. */
  sizedWith: LineOptions | undefined;
  /** Many strips on one laminate (the family's batch form when it has one; same numbers as `at`). */
  columns(sub: SubstrateSpec, widths: ArrayLike<number>, freqs: ArrayLike<number> | number, options?: LineOptions, into?: LineColumns): LineColumns;
  /** One strip at f. */
  at(sub: SubstrateSpec, width: number, f: number, options?: LineOptions): LineAt;
}

export function boardLines(sized: SizedDesign): BoardLines {
  const models = sized.lineModels ?? coreLineModels;
  const strip = models.strip();
  return {
    models, strip, sizedWith: sized.lineOptions,
    // A family's own batch form called straight (the path-phase estimate asks once per board).
    columns: strip.columns ? (sub, widths, freqs, options, into) => strip.columns!(sub, widths, freqs, options, into)
      : (sub, widths, freqs, options, into) => stripColumns(strip, sub, widths, freqs, options, into),
    at: (sub, width, f, options) => stripAt(strip, sub, width, f, options),
  };
}
