export { scaleByLearningRate } from './learningRate';
export { clipByGlobalNorm } from './clip';
export { addL2Penalty, addDecoupledWeightDecay } from './weightDecay';
export { traceMomentum, traceVelocity, type MomentumState } from './momentum';
export { scaleByAdagrad, type EpsilonPlacement } from './adagrad';
export { scaleByRms, type RmsOptions, type RmsState } from './rms';
export { scaleByAdam, type AdamEpsilonForm, type MomentsState } from './adam';
export { scaleByAmsgrad, type AmsgradForm, type AmsgradState } from './amsgrad';
export { scaleByNadam, type NadamForm, type NadamState } from './nadam';
