export { RunCursor, type RunState } from './cursor';
export { createMinibatchState, nextMinibatch, stepsForEpochs, validateMinibatch, type MinibatchSettings, type MinibatchState } from './minibatch';
export { describeOutcome, outcomeDetail, outcomeLabel, pointText, OUTCOME_KINDS, type EndPoint, type OutcomeKind, type RunOutcome, type StopRule } from './outcome';
export { judgeEnd, describeEndPoint, type EndFacts, type EndTrigger } from './end-state';
export { DEFAULT_STATIONARITY_TOLERANCE, stationarityThreshold } from './stationarity';
export {
  validateRunSettings,
  validateStopRules,
  DEFAULT_BLOW_UP_FACTOR,
  DEFAULT_LOSS_CHANGE_PATIENCE,
  MAX_STEPS_LIMIT,
  type RunSettings,
  type StopRules,
} from './settings';
export { allocateBatch, concatBatches, stepOfRow, trimBatch, type TrajectoryBatch } from './trajectory';
export { movingAway, nextCalmSteps, pointFinding, pointFindingAt, pointOutcome, progressTrigger, startOutcome, type PointFinding } from './checks';
export { addNoise, countingSurface, noisyOracle } from './oracle';
export { createRecentPath, recordRecent, recordRecentAt, MILESTONES, RECENT_POINTS, type RecentPath } from './recent';
