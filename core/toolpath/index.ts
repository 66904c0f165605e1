/** Toolpaths for milling a board: isolation, clearing, drilling, cutout, ordering, the board as milled, readiness. */
// Re-exported under milling names: 'Tool' and 'Move' alone would be too general for the core's one namespace.
export type { Tool as MillTool, Move as MillMove, Vec3, OperationKind, ToolProgram, CutPath } from './types.ts';
export * from './options.ts';
export * from './isolation.ts';
export * from './drilling.ts';
export * from './cutout.ts';
export * from './order.ts';
export * from './program.ts';
export * from './swept.ts';
export * from './milled.ts';
export * from './readiness.ts';
export * from './plan.ts';
