/** Geometry layer: plain shared types and the polygon engine (union, difference, intersection, offset). */
export type * from './types.ts';
export * from './polygons.ts';
export { findSelfCrossing, segmentsCross } from './crossing.ts';
