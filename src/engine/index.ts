// The engine's one public door: pure numerics, no DOM, no React, no worker globals.
export { hasParameterGroups, isRowwiseSurface, type GroupedSurface, type ParameterGroup, type RowwiseSurface, type Surface } from './surface';
export * from './vector';
export * from './rng';
export { power } from './power';
export * from './run';
export { SettingError, type Optimizer, type Oracle, type StepContext, type StepReport } from './optim/types';
export * from './slice';
export * from './optim';
export * from './linalg';
export * from './expr';
export * from './analysis';
export * from './study';
export * from './sweep';
export * from './rules';
