export { cubicMinimizer, safeguardedCubic } from './cubic';
export { strongWolfeSearch, type LineFunction, type LinePoint, type LineSearchResult, type StrongWolfeOptions } from './strongWolfe';
export { backtrackingSearch } from './backtracking';
