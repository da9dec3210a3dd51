export { scaleByLearningRate } from './learningRate';
export { clipByGlobalNorm } from './clip';
export { addL2Penalty, addDecoupledWeightDecay } from './weightDecay';
export { traceMomentum, traceVelocity, type MomentumState } from './momentum';
export { EPSILON_PLACEMENTS, scaleByAdagrad, type EpsilonPlacement } from './adagrad';
export { scaleByRms, type RmsOptions, type RmsState } from './rms';
export { ADAM_EPSILON_FORMS, scaleByAdam, type AdamEpsilonForm, type MomentsState } from './adam';
export { AMSGRAD_FORMS, scaleByAmsgrad, type AmsgradForm, type AmsgradState } from './amsgrad';
export { NADAM_FORMS, scaleByNadam, type NadamForm, type NadamState } from './nadam';
