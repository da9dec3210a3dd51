import { nextUniform } from '../../../engine';
import type { DemoDataset } from './types';

/**
 * Two kinds of readings separated by a wave (a made-up scenario for the small network): u uniform on
 * [-3, 3], v uniform on [-2, 2], kind 1 when v > 1.2 sin(1.4 u), else 0, with 5% of the labels flipped.
 * No straight line separates the kinds well; a hidden layer of a few units does.
 */
export const waveBoundary: DemoDataset = {
  id: 'wave-boundary',
  label: 'Wave-shaped class boundary (made-up)',
  description: 'Made-up readings: u ~ U(-3, 3), v ~ U(-2, 2), kind = 1 when v > 1.2 sin(1.4 u), else 0, 5% of labels flipped.',
  columns: ['u', 'v', 'kind'],
  categories: { kind: ['below', 'above'] },
  defaultInputs: ['u', 'v'],
  defaultTarget: 'kind',
  defaultRows: 300,
  minRows: 10,
  maxRows: 100_000,
  generate(rng, rows) {
    const out: number[][] = [];
    for (let i = 0; i < rows; i++) {
      const u = -3 + 6 * nextUniform(rng);
      const v = -2 + 4 * nextUniform(rng);
      let kind = v > 1.2 * Math.sin(1.4 * u) ? 1 : 0;
      if (nextUniform(rng) < 0.05) kind = 1 - kind;
      out.push([u, v, kind]);
    }
    return out;
  },
};
