import type { Optimizer } from '../../../src/engine';

/**
 * Plain descent x <- x - lr g, written out here so the run loop is tested apart from the optimizer
 * library (shared by the run-loop tests).
 */
export function plainDescent(lr: number): Optimizer<null> {
  return {
    label: 'test descent',
    init: () => null,
    step(x, g) {
      for (let i = 0; i < x.length; i++) x[i] -= lr * g[i];
      return { learningRate: lr, extraEvaluations: 0 };
    },
  };
}
