import type { Pace } from '../protocol';

/** Streaming paces offered on the page, in steps per second per run. */
export const PACES: readonly Pace[] = [100, 300, 1000, 3000, 'max'];
export const DEFAULT_PACE: Pace = 1000;
