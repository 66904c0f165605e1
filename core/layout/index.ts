/**
 * Layout: sizing (design → sized pieces with compensations and placed nodes), copper geometry, paths and phase,
 * fabrication checks, and the corporate-feed generator. See core/layout/types.ts for the data a network needs.
 */
export type * from './types.ts';
export { sizeDesign, pieceBeta, CLOSE_TOL, DEFAULT_TAPER_RIPPLE_DB, BOARD_SIZE_LIMIT } from './sizing.ts';
export type { SizeOptions } from './sizing.ts';
export { LineCache } from './lineCache.ts';
export { smdFootprint } from './footprints.ts';
export { klopfensteinProfile, grossbergPhi } from './klopfenstein1956Taper.ts';
export { corporateFeed } from './generators/corporateFeed.ts';
export type { CorporateFeedOptions } from './generators/corporateFeed.ts';
export { laminateCoupon, planCoupon, couponForDesign } from './generators/coupon.ts';
export type { CouponOptions, CouponPlan, CouponLinePlan } from './generators/coupon.ts';
export { buildBoardGeometry, pieceOutlines, defaultGroundClearance, BOARD_MARGIN } from './geometry.ts';
export type { PieceOutline } from './geometry.ts';
export { tracePaths, designPaths, pathLength, phaseLength, DEFAULT_PHASE_TOLERANCE_DEG } from './paths.ts';
export type { PathEntry, PathReport, PathOptions } from './paths.ts';
export { boardGeometryOf, checkBoard } from './board.ts';
export { processCut, isolationPlan, isolationClearance, isolationGapOf, passesFor, passesNeeded, MAX_ISOLATION_PASSES, ISOLATION_OVERLAP, DEFAULT_ISOLATION_CLEARANCE, type IsolationPlan } from './process-cut.ts';
export type { ProcessCut } from './process-cut.ts';
export { processCautions, DUST_CAUTION, ETCHANT_CAUTION } from './cautions.ts';
export { checkFabrication, problemFindings, cutWidth, referenceGroundShiftPct, untoolableCopper, DEFAULT_LOSS_LIMIT_DB } from './checks.ts';
export type { Finding, FindingCode, CheckOptions } from './checks.ts';
export { proximityHits, proximityLimitFrom, DEFAULT_PROXIMITY_LIMIT_H } from './proximity.ts';
export type { ProximityHit } from './proximity.ts';
export { placeDesign } from './place.ts';
export type { PlacedDesign } from './place.ts';
export { asMadeTemplate, asMadeLineOptions } from './as-made.ts';
export { fencePitchLimit, fenceFindings } from './fence-check.ts';
export { foldsOf, foldShareRad, foldsOnPathRad, foldLegs, FOLD_GAP_MAX_H } from './folds.ts';
export type { Fold, FoldShape } from './folds.ts';
export { liveLayout, liveSizing } from './incremental.ts';
export type { LiveLayout, LiveOutline, LiveSizing } from './incremental.ts';
