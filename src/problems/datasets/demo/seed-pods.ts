import { nextGaussian, nextUniform } from '../../../engine';
import type { DemoDataset } from './types';

/**
 * Seed pods of an invented plant (a made-up scenario): pod length (mm) ~ N(40, 7^2), pod mass (g) =
 * 0.06 length + N(0, 0.35^2), and whether the pod had ripened (1) or not (0), drawn as
 * Bernoulli(sigmoid(-12 + 0.22 length + 1.6 mass)). The classes overlap, so the logistic loss has a
 * finite minimiser (on separable data it has none: the weights grow without bound).
 */
export const seedPods: DemoDataset = {
  id: 'seed-pods',
  label: 'Ripe seed pods (made-up)',
  description:
    'Made-up pods: length (mm) ~ N(40, 7^2), mass (g) = 0.06 length + N(0, 0.35^2); ripe ~ Bernoulli(sigmoid(-12 + 0.22 length + 1.6 mass)).',
  columns: ['length_mm', 'mass_g', 'ripe'],
  categories: { ripe: ['unripe', 'ripe'] },
  defaultInputs: ['length_mm', 'mass_g'],
  defaultTarget: 'ripe',
  defaultRows: 200,
  minRows: 10,
  maxRows: 100_000,
  generate(rng, rows) {
    const out: number[][] = [];
    for (let i = 0; i < rows; i++) {
      const length = 40 + 7 * nextGaussian(rng);
      const mass = 0.06 * length + 0.35 * nextGaussian(rng);
      const logit = -12 + 0.22 * length + 1.6 * mass;
      const ripe = nextUniform(rng) < 1 / (1 + Math.exp(-logit)) ? 1 : 0;
      out.push([length, mass, ripe]);
    }
    return out;
  },
};
