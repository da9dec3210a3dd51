export { Sweep } from './engine';
export { validateSweepPlan, type SweepPlan, type SweepProgress, type SweepResult } from './plan';
export { bandPlan, mergeBandResults, splitBands, type SweepBand } from './bands';
export { coarseToFineOrder, gridCellStart, permuteStarts, startGrid, type StartBox, type StartGrid } from './grid';
export { basinOf, basinsOf, clusterEndPoints, type EndPointClusters } from './basins';
export { logSpaced, refineDivergenceThreshold, unstableRates, type DivergenceThreshold, type RateSweepConfig, type RateTrial } from './rates';
