export { tuneDesign, defaultVariables, goalsOf, withValues, currentValue, type TuneOptions, type TuneResult, type TuneVariable, type TuneGoal, type TuneQuantity, type TunedVariable } from './tune.ts';
export { minimiseInBox, seededUniform, type SimplexOptions, type SimplexResult } from './nelder-mead.ts';
