export { RunCursor, type RunState } from './cursor';
export { createMinibatchState, nextMinibatch, stepsForEpochs, validateMinibatch, type MinibatchSettings, type MinibatchState } from './minibatch';
export { describeOutcome, outcomeLabel, type RunOutcome } from './outcome';
export {
  validateRunSettings,
  validateStopRules,
  DEFAULT_BLOW_UP_FACTOR,
  DEFAULT_LOSS_CHANGE_PATIENCE,
  MAX_STEPS_LIMIT,
  type RunSettings,
  type StopRules,
} from './settings';
export { allocateBatch, concatBatches, trimBatch, type TrajectoryBatch } from './trajectory';
