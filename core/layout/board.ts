/**
 * The one way from a sized design to its united copper and its findings, shared by every face (the CLI's build and
 * export, the app's compute worker). Sizing problems come first: a design that cannot be sized as drawn gets its
 * sizing problems as findings and no geometry, because copper built from a half-sized network only adds errors
 * about pieces that are not there (or fails inside the polygon engine with a message about rings and regions).
 * Needs the polygon engine: `await initPolygons()` (core/geometry) once before calling.
 */
import type { BoardGeometry } from '../geometry/types.ts';
import { InputError } from '../util/errors.ts';
import { buildBoardGeometry } from './geometry.ts';
import { checkFabrication, problemFindings, type CheckOptions, type Finding } from './checks.ts';
import type { SizedDesign } from './types.ts';

/** The united board geometry; an InputError listing the sizing problems when there are any. */
export function boardGeometryOf(sized: SizedDesign): BoardGeometry {
  if (sized.problems.length) {
    const first = sized.problems[0]!;
    throw new InputError('impossible-layout', first.subjects[0] ?? 'design', 'a design that can be sized as drawn',
      sized.problems.map((p) => p.message).join('; '), 'fix the pieces named here first; the copper is built once sizing has no problems');
  }
  return buildBoardGeometry(sized);
}

/** Findings for a sized design: its sizing problems alone when it has any, else the fabrication checks on its copper. */
export function checkBoard(sized: SizedDesign, opts: CheckOptions = {}): { geometry: BoardGeometry | null; findings: Finding[] } {
  if (sized.problems.length) return { geometry: null, findings: problemFindings(sized) };
  const geometry = buildBoardGeometry(sized);
  return { geometry, findings: checkFabrication(sized, geometry, opts) };
}
