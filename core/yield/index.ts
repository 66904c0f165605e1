/**
 * Tolerances and yield: seeded Monte Carlo of made boards against the design's targets (yield.ts), the ledger's path
 * phases under board-wide tolerances (path-phase.ts), and the generator and statistics they rest on.
 */
export { runYield, madeBoardResponses, YIELD_GENERATOR, MAX_SAMPLES, type YieldOptions, type YieldResult, type TargetYield, type Envelope, type RankEntry } from './yield.ts';
export { Xoshiro128ss, streamId } from './prng.ts';
export { normalQuantile, lnExact } from './normal.ts';
export { wilson, histogram, summary, Z95, type Proportion, type Histogram, type Summary } from './stats.ts';
export { ToleranceDraws } from './draws.ts';
export { MadeBoard, applicableTolerances, widthGain } from './made-board.ts';
export { BatchSolver } from './batch-solver.ts';
export { pathPhaseMonteCarlo, type PathPhaseOptions, type PathPhaseResult } from './path-phase.ts';
