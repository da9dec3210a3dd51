// Demo datasets: seeded generators in scenarios of our own invention.
import type { DemoDatasetId } from '../spec';
import { pebbles } from './pebbles';
import { probeCalibration } from './probe-calibration';
import { seedPods } from './seed-pods';
import type { DemoDataset } from './types';
import { waveBoundary } from './wave-boundary';

export type { DemoDataset } from './types';
export { PROBE_AMPLITUDE, PROBE_NOISE, PROBE_RATE } from './probe-calibration';

export const DEMO_DATASETS: Readonly<Record<DemoDatasetId, DemoDataset>> = Object.freeze({
  'probe-calibration': probeCalibration,
  'seed-pods': seedPods,
  pebbles,
  'wave-boundary': waveBoundary,
});
