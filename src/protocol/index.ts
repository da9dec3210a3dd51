export type { CsvParseOptions, FromPoolMember, FromWorker, Pace, RowRange, RunControl, RunOutcome, RunSpec, StudyCells, ToPoolMember, ToWorker } from './messages';
