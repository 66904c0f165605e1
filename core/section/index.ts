/**
 * 2-D quasi-static cross-section solver: a line with its side copper, trench, cover and lid as made, by finite
 * differences on a graded grid (quasi-static-fd.ts), its equipotentials for drawing, and the sizing tables it
 * serves to the line layer.
 */
export type { SectionSpec, SectionResult, SectionMode, SectionModeName, SideCopper, Trench, Cover, PotentialMap, SolveOptions } from './types.ts';
export { solveSection, ORDER as SECTION_ORDER } from './quasi-static-fd.ts';
export { checkSection } from './check-spec.ts';
export { sectionTable, buildSectionTable, describeTemplate, TABLE_POINTS, TABLE_U_MIN, TABLE_U_MAX } from './line-source.ts';
export type { SectionTable, SectionTemplate } from './line-source.ts';
export { equipotentials } from './contours.ts';
export type { Polyline } from './contours.ts';
export { sectionOutline } from './outline.ts';
export type { SectionOutline } from './outline.ts';
export { solvedSectionFamily } from './line-model.ts';
export type { SolvedSection } from './line-model.ts';
