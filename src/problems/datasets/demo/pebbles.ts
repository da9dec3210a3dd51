import { nextGaussian } from '../../../engine';
import type { DemoDataset } from './types';

/** Class centres (roundness, density in g/cm^3) and spreads of the three invented beaches. */
const BEACHES = [
  { label: 'north cove', roundness: 0.35, density: 2.62, sdRoundness: 0.09, sdDensity: 0.07 },
  { label: 'long strand', roundness: 0.58, density: 2.72, sdRoundness: 0.1, sdDensity: 0.06 },
  { label: 'south spit', roundness: 0.74, density: 2.5, sdRoundness: 0.08, sdDensity: 0.08 },
];

/**
 * Pebbles picked up on three invented beaches (a made-up scenario): roundness (0 to 1) and density
 * (g/cm^3), each Gaussian around the beach's centre; row i comes from beach i mod 3. A three-class
 * problem for softmax regression.
 */
export const pebbles: DemoDataset = {
  id: 'pebbles',
  label: 'Pebbles from three beaches (made-up)',
  description: `Made-up pebbles; row i from beach i mod 3, roundness and density Gaussian: ${BEACHES.map(
    (b) => `${b.label} (${b.roundness} +- ${b.sdRoundness}, ${b.density} +- ${b.sdDensity})`,
  ).join(', ')}.`,
  columns: ['roundness', 'density', 'beach'],
  categories: { beach: BEACHES.map((b) => b.label) },
  defaultInputs: ['roundness', 'density'],
  defaultTarget: 'beach',
  defaultRows: 180,
  minRows: 6,
  maxRows: 100_000,
  generate(rng, rows) {
    const out: number[][] = [];
    for (let i = 0; i < rows; i++) {
      const k = i % BEACHES.length;
      const b = BEACHES[k];
      out.push([b.roundness + b.sdRoundness * nextGaussian(rng), b.density + b.sdDensity * nextGaussian(rng), k]);
    }
    return out;
  },
};
