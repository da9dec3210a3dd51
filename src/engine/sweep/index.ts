export { Sweep } from './engine';
export { validateSweepPlan, type SweepPlan, type SweepProgress, type SweepResult } from './plan';
