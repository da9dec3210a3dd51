import { SettingError } from '../optim/types';
import { shuffleInPlace, type RngState } from '../rng';

/**
 * Minibatch order for runs on data-fit surfaces (RowwiseSurface).
 *
 * Each epoch is one pass over a fresh random permutation of the rows (Fisher-Yates with the run's own
 * rng, so the same seed gives the same batches); the permutation is cut into consecutive batches of
 * `size` rows, and the last batch of an epoch holds the remainder when `size` does not divide the
 * number of rows (PyTorch's DataLoader default, drop_last = False). So every row is used exactly once
 * per epoch and an epoch takes ceil(rows / size) steps.
 */
export interface MinibatchSettings {
  /** Rows per batch, a whole number from 1 to the surface's rows. */
  size: number;
}

/** Where a run is in its epoch, as plain data (part of RunState). */
export interface MinibatchState {
  /** The current epoch's row order. */
  order: Int32Array;
  /** Position in `order` of the next batch's first row (order.length: the epoch is used up). */
  next: number;
  /** Epochs begun so far (1 during the first epoch, 0 before the first batch). */
  epoch: number;
}

export function validateMinibatch(minibatch: MinibatchSettings, rows: number | undefined): void {
  if (rows === undefined) throw new SettingError('minibatch', 'minibatch: this surface has no data rows, so it cannot be split into batches');
  const { size } = minibatch;
  if (!Number.isInteger(size) || size < 1 || size > rows)
    throw new SettingError('minibatch', `minibatch: size must be a whole number from 1 to ${rows} (the number of rows), got ${size}`);
}

export function createMinibatchState(rows: number): MinibatchState {
  const order = new Int32Array(rows);
  for (let i = 0; i < rows; i++) order[i] = i;
  return { order, next: rows, epoch: 0 };
}

/**
 * Copies the next batch's row indices into `batch` (length >= size) and returns how many there are,
 * starting a new epoch with a fresh shuffle when the current one is used up.
 */
export function nextMinibatch(state: MinibatchState, size: number, rng: RngState, batch: Int32Array): number {
  const rows = state.order.length;
  if (state.next >= rows) {
    shuffleInPlace(rng, state.order);
    state.next = 0;
    state.epoch += 1;
  }
  const count = Math.min(size, rows - state.next);
  for (let k = 0; k < count; k++) batch[k] = state.order[state.next + k];
  state.next += count;
  return count;
}

/** Steps that make `epochs` full passes over `rows` rows in batches of `batchSize`: epochs * ceil(rows / batchSize). */
export function stepsForEpochs(rows: number, batchSize: number, epochs: number): number {
  for (const [name, v] of [['rows', rows], ['batchSize', batchSize], ['epochs', epochs]] as const)
    if (!Number.isInteger(v) || v < 1) throw new RangeError(`stepsForEpochs: ${name} must be a whole number >= 1, got ${v}`);
  if (batchSize > rows) throw new RangeError(`stepsForEpochs: batchSize must be at most rows (${rows}), got ${batchSize}`);
  return epochs * Math.ceil(rows / batchSize);
}
