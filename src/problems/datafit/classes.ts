import type { Design } from './design';

/** Most classes a softmax model or head accepts. */
export const MAX_CLASSES = 100;

/**
 * The class labels of a classification target: the table's labels when the column is class-coded,
 * else 'class 0' .. 'class K-1' with K = 1 + the largest code. Every target must be a whole number
 * from 0 to K-1.
 */
export function classLabelsOf(design: Design): string[] {
  const { table, target, y } = design;
  const known = table.categories[target];
  let largest = 0;
  for (let i = 0; i < y.length; i++) {
    const v = y[i];
    if (!(Number.isInteger(v) && v >= 0 && (known ? v < known.length : v < MAX_CLASSES)))
      throw new Error(
        `dataset ${table.name}: target '${target}' must hold class codes ${known ? `0 to ${known.length - 1}` : `0, 1, 2, ... (below ${MAX_CLASSES})`}; row ${i + 1} has ${v}`,
      );
    largest = Math.max(largest, v);
  }
  return known ? [...known] : Array.from({ length: largest + 1 }, (_, k) => `class ${k}`);
}

/** Checks a binary target (codes 0 and 1 only). */
export function checkBinaryTarget(design: Design, model: string): void {
  const { table, target, y } = design;
  const known = table.categories[target];
  if (known && known.length !== 2)
    throw new Error(`dataset ${table.name}: target '${target}' has ${known.length} classes; ${model} needs 2 (use softmax for more)`);
  for (let i = 0; i < y.length; i++)
    if (y[i] !== 0 && y[i] !== 1) throw new Error(`dataset ${table.name}: ${model} needs a target of 0s and 1s; row ${i + 1} of '${target}' has ${y[i]}`);
}
