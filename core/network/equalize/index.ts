export { equalizeGroup, findGroup, type EqualizeOptions, type EqualizeResult, type MeanderReport, type EqualizedPath, type MeanderStyle } from './equalize.ts';
export { meanderCorners, meanderExtra, meanderSpan, doglegHeight, type MeanderShape, type MeanderPlacement } from './meander.ts';
export { meanderCouplingDeg, meanderFold } from './coupling.ts';
export { allocate, branchesOf, type TreePath, type Branch, type Allocation } from './allocate.ts';
