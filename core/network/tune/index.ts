export { tuneDesign, defaultVariables, goalsOf, withValues, currentValue, blockValue, isBlockVariable, type TuneOptions, type TuneResult, type TuneVariable, type PieceVariable, type BlockVariable, type BlockRegenerator, type TuneGoal, type TuneQuantity, type TunedVariable } from './tune.ts';
export { minimiseInBox, seededUniform, type SimplexOptions, type SimplexResult } from './nelder-mead.ts';
