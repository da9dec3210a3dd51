export type { FromWorker, Pace, RunControl, RunOutcome, RunSpec, ToWorker } from './messages';
