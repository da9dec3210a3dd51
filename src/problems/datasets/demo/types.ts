import type { RngState } from '../../../engine';
import type { DemoDatasetId } from '../spec';

/** A seeded generator of demo data in a scenario of our own invention. */
export interface DemoDataset {
  id: DemoDatasetId;
  label: string;
  /** The invented scenario and the exact generating process. */
  description: string;
  columns: string[];
  /** Labels of class-coded columns. */
  categories?: Record<string, string[]>;
  /** The columns a first model would use. */
  defaultInputs: string[];
  defaultTarget: string;
  defaultRows: number;
  minRows: number;
  maxRows: number;
  /** Rows in `columns` order, drawn from `rng`. */
  generate(rng: RngState, rows: number): number[][];
}
