export type { CsvParseOptions, FromPoolMember, FromWorker, LinkPing, LinkPong, Pace, RowRange, RunControl, RunOutcome, RunSpec, StudyCells, StudyThreshold, ToPoolMember, ToWorker } from './messages';
