export type { CsvParseOptions, FromPoolMember, FromWorker, Pace, RowRange, RunControl, RunOutcome, RunSpec, StudyCells, StudyThreshold, ToPoolMember, ToWorker } from './messages';
