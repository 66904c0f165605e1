/**
 * The response layer: netlists, the nodal solve, sweeps, derived figures and Touchstone in and out.
 *
 * @example
 *   const q = temLengthForDegrees(90, 1e9);
 *   const r = solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'p1', b: 'p2', length: q, model: idealLine(70.71) }],
 *                            ports: [{ name: '1', node: 'p1', zRef: 50 }, { name: '2', node: 'p2', zRef: 100 }] }, [1e9]);
 *   magnitudeDb(r, 0, 0); // → [-400]: matched at f0
 */
export * from './complex.ts';
export * from './netlist.ts';
export { compileNetwork, solveAt, planEntries, type CompiledNetwork, type PointSolution, type SolveEntries, type EntryPlan } from './mna.ts';
export * from './conversions.ts';
export * from './response.ts';
export * from './sweep.ts';
export { SweepValues } from './sweepValues.ts';
export { viewEntries } from './entries.ts';
export * from './figures.ts';
export * from './touchstoneWrite.ts';
export * from './touchstoneRead.ts';
export * from './sparamsPart.ts';
export * from './lineTwoPort.ts';
export { netlistFromSized, sweepRangeWarnings, pairNetworkFigures, type FromSizedOptions, type SizedNetlist, type PairNetworkFigures } from './fromSized.ts';
export { starAdmittance, type StarArm, type StarState } from './junctionStar.ts';
export { compareResponses, type ResponseDifference, type EntryDifference } from './compare.ts';
export { guessPortMap, measuredPortCount, measuredForDesign, compareMeasured } from './measured.ts';
export { responseCacheKey } from './cacheKey.ts';
export { designSweepSettings, DEFAULT_SWEEP_POINTS } from './designSweep.ts';
export { figureTable, MAX_ISOLATION_ROWS, type FigureTable, type FigureRow, type FigureKind } from './figureTable.ts';
export { evaluateTargets, evaluateTarget, prepareTargets, targetFrequencies, targetText, limitText, type TargetEvaluation, type TargetResult } from './targets.ts';
export { coupledPairY, modeConstants } from './coupledPair.ts';
export * from './coupon/index.ts';
export * from './equalize/index.ts';
export * from './tune/index.ts';
