import { nextGaussian, nextUniform } from '../../../engine';
import type { DemoDataset } from './types';

/** True response of the invented probe: signal = A (1 - exp(-K flow)). */
export const PROBE_AMPLITUDE = 4.8;
export const PROBE_RATE = 0.021;
export const PROBE_NOISE = 0.04;

/**
 * Calibration of a made-up thermal flow probe on a test rig (an invented scenario): the rig sets the
 * flow rate (L/min) at evenly spaced points from 2 to 150, each jittered by up to +-1; the probe's
 * signal (V) saturates as 4.8 (1 - exp(-0.021 flow)) plus Gaussian noise with standard deviation
 * 0.04 V. Good for the typed model formula `b1 * (1 - exp(-b2 * flow))` and for seeing how badly a
 * straight line fits a saturating curve.
 */
export const probeCalibration: DemoDataset = {
  id: 'probe-calibration',
  label: 'Flow probe calibration (made-up)',
  description:
    'A made-up flow probe: signal (V) = 4.8 (1 - exp(-0.021 flow)) + Gaussian noise (sd 0.04), flow (L/min) evenly spaced from 2 to 150 with jitter of up to 1.',
  columns: ['flow', 'signal'],
  defaultInputs: ['flow'],
  defaultTarget: 'signal',
  defaultRows: 40,
  minRows: 5,
  maxRows: 100_000,
  generate(rng, rows) {
    const out: number[][] = [];
    for (let i = 0; i < rows; i++) {
      const flow = 2 + (148 * i) / Math.max(1, rows - 1) + (2 * nextUniform(rng) - 1);
      const signal = PROBE_AMPLITUDE * (1 - Math.exp(-PROBE_RATE * flow)) + PROBE_NOISE * nextGaussian(rng);
      out.push([flow, signal]);
    }
    return out;
  },
};
