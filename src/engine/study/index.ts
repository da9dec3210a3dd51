export { drawStarts, networkLayers, MAX_STARTS, type NetworkLayer, type StartDistribution } from './starts';
export { lossBands, quantile, type LossBands } from './quantiles';
export { summariseStarts, type MultiStartSummary, type StartResult } from './multistart';
