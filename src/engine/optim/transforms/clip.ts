import { norm2 } from '../../vector';
import type { GradientTransform } from '../transform';

/**
 * Clipping by global norm: when ||u|| > maxNorm, u <- u * maxNorm / ||u|| (the direction is kept).
 * Pascanu, Mikolov & Bengio, "On the difficulty of training recurrent neural networks", ICML 2013.
 * Optax `clip_by_global_norm` is exactly this; PyTorch `clip_grad_norm_` scales by
 * maxNorm / (||u|| + 1e-6), so its clipped norm is a hair below maxNorm; Keras `clipnorm` clips each
 * variable separately, `global_clipnorm` all together (from memory).
 */
export function clipByGlobalNorm(maxNorm: number): GradientTransform<null> {
  return {
    name: 'clipByGlobalNorm',
    init: () => null,
    update(u) {
      const n = norm2(u);
      if (n > maxNorm) {
        const scale = maxNorm / n;
        for (let i = 0; i < u.length; i++) u[i] *= scale;
      }
      return null;
    },
  };
}
