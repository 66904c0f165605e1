/**
 * The cross-section view's job: one field solution of the selected line as made (core/section), its outline and
 * equipotential lines, as plain data for the renderer's SVG. All physics in the core; this file only packs it.
 */
import { solveSection, sectionOutline, equipotentials, type SectionSpec, type SectionMode, type SectionOutline, type Polyline } from '../../../core/index.ts';

export interface SectionInput { spec: SectionSpec }
export interface SectionOutput {
  spec: SectionSpec;
  modes: SectionMode[];
  warnings: string[];
  outline: SectionOutline;
  /** Equipotentials of the first mode at 5 %, 15 %, … 95 % of the strip's potential. */
  contours: Polyline[];
}

export const CONTOUR_LEVELS = [0.05, 0.15, 0.25, 0.35, 0.45, 0.55, 0.65, 0.75, 0.85, 0.95];

export function sectionJob(input: SectionInput): SectionOutput {
  const r = solveSection(input.spec, { potential: true });
  const outline = sectionOutline(input.spec);
  const contours = r.potential ? equipotentials(r.potential, CONTOUR_LEVELS, outline.window) : [];
  // A symmetric cross-section is solved on its right half: mirror the lines for the picture.
  if (r.potential && r.potential.x[0]! >= 0) {
    for (const c of contours) {
      const n = c.segments.length;
      for (let k = 0; k < n; k += 2) c.segments.push(-c.segments[k]!, c.segments[k + 1]!);
    }
  }
  return { spec: input.spec, modes: r.modes, warnings: r.warnings.map((w) => w.message), outline, contours };
}
