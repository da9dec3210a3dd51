// The optimizers' one public door.
export { SettingError, type Optimizer, type Oracle, type StepContext, type StepReport } from './types';
export type { OptimizerFamily, OptimizerKind, OptimizerSpec, OptimizerInfo, ResolvedSpec, RuleSpec } from './spec';
export type { HyperparameterInfo, HyperValue } from './settings';
export { learningRateAt, SCHEDULES, scheduleInfo, type ScheduleSpec, type ScheduleKind, type ScheduleInfo } from './schedule';
export { OPTIMIZERS, optimizerInfo, defaultOptimizerSpec, optimizerLabel, optimizerSettings } from './catalogue';
export { validateOptimizerSpec, resolveSpec } from './validate';
export { buildOptimizer } from './build';
export { chain, applyTransforms, initTransforms, isChainOptimizer, learningRateStage, type ChainOptimizer, type GradientTransform, type ChainState } from './transform';
export * from './transforms';
export { strongWolfeSearch, backtrackingSearch, cubicMinimizer, safeguardedCubic, type LineFunction, type LinePoint, type LineSearchResult, type StrongWolfeOptions } from './search';
export { createHistory, clearHistory, pushPair, twoLoopDirection, type CurvatureHistory } from './quasiNewton/history';
