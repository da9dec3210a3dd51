export { drawStarts, networkLayers, MAX_STARTS, type NetworkLayer, type StartDistribution } from './starts';
export { lossBands, quantile, type LossBands } from './quantiles';
export { summariseStarts, type MultiStartSummary, type StartResult } from './multistart';
export { cellStart, validateStartMap, START_MAP_RESOLUTIONS, type StartMapSpec } from './start-map';
export { assignBasins, BasinTracker, type BasinAssignment, type KnownPoint } from './basins';
export { validateLearningRateSweep, validateMultiStart, MAX_MULTI_STARTS, MAX_SWEEP_RATES, type LearningRateSweepSpec, type MultiStartSpec, type StudySpec } from './spec';
export { predictedStabilityLimit } from './stability';
export { cellPlans, runStudyCells, studyOrder, studySize, validateStudy, type CellPlan, type StudyCellResults, type ToleranceTarget } from './cells';
export { sweepThresholds, type SweepThreshold } from './thresholds';
