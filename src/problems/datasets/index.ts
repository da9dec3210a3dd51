// Datasets: built-in demo data, iris, NIST StRD sets, imported tables; the CSV import.
export type { DatasetKind, DatasetSpec, DemoDatasetId, DemoDatasetSpec, IrisDatasetSpec, NistDatasetId, NistDatasetSpec, TableDatasetSpec } from './spec';
export { columnIndex, columnValues, makeTable, type DataTable } from './table';
export { DEMO_DATASETS, PROBE_AMPLITUDE, PROBE_NOISE, PROBE_RATE, type DemoDataset } from './demo';
export { IRIS_COLUMNS, irisTable } from './iris';
export { parseNistFile, type NistFile } from './nist-format';
export { NIST_DATASET_IDS, isNistDatasetId, nistFile, nistTable } from './nist-sets';
export { datasetKey, datasetTable, validateDatasetSpec } from './resolve';
export { CsvTableBuilder, MAX_REPORTED_PROBLEMS, csvTooLargeMessage, parseDatasetCsv, utf8Length, type CsvImport, type CsvImportOptions, type CsvProblem } from './csv-import';
export { MAX_CSV_BYTES, MAX_TABLE_COLUMNS, MAX_TABLE_ROWS } from './limits';
export { LruCache } from './lru';
