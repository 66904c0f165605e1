/**
 * Layout: sizing (design → sized pieces with compensations and placed nodes), copper geometry, paths and phase,
 * fabrication checks, and the corporate-feed generator. See core/layout/types.ts for the data a network needs.
 */
export type * from './types.ts';
export { sizeDesign, pieceBeta, CLOSE_TOL, DEFAULT_TAPER_RIPPLE_DB } from './sizing.ts';
export type { SizeOptions } from './sizing.ts';
export { LineCache } from './lineCache.ts';
export { smdFootprint } from './footprints.ts';
export { klopfensteinProfile, grossbergPhi } from './klopfenstein1956Taper.ts';
export { corporateFeed } from './generators/corporateFeed.ts';
export type { CorporateFeedOptions } from './generators/corporateFeed.ts';
