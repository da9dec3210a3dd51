export type { CsvParseOptions, FromPoolMember, FromWorker, Pace, RowRange, RunControl, RunOutcome, RunSpec, ToPoolMember, ToWorker } from './messages';
