export type { CsvParseOptions, FromPoolMember, FromWorker, LinkPing, LinkPong, Pace, RowRange, RunControl, RunOutcome, RunSpec, StudyCells, StudyPart, StudyThreshold, ToPoolMember, ToWorker } from './messages';
export { GridRequestCancelled } from './errors';
export { PREVIEW_SIDES, previewSidesFor } from './grid-previews';
export type { EngineLink } from './link';
