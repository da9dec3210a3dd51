import type { GradientTransform } from '../transform';

/** Where epsilon goes: g / (sqrt(s) + eps) or g / sqrt(s + eps). The first is the default. */
export const EPSILON_PLACEMENTS = ['outside', 'inside'] as const;
export type EpsilonPlacement = (typeof EPSILON_PLACEMENTS)[number];

/**
 * AdaGrad scaling: G_t = G_{t-1} + g_t^2 (G_0 = initialAccumulator), then
 *   u = g / (sqrt(G_t) + eps)  ('outside': Duchi et al., PyTorch)  or  u = g / sqrt(G_t + eps)
 *   ('inside': Optax, tfjs). A zero denominator (g and G both 0) gives u = 0.
 */
export function scaleByAdagrad(epsilon: number, placement: EpsilonPlacement, initialAccumulator: number): GradientTransform<{ sumSquares: Float64Array }> {
  return {
    name: 'scaleByAdagrad',
    elementwise: true,
    init: (p) => ({ sumSquares: new Float64Array(p.length).fill(initialAccumulator) }),
    // update's operations on one entry, in its order (lockstep.ts): s = [G], k = [eps].
    lockstep: {
      arrays: [initialAccumulator],
      constants: [epsilon],
      steps: 0,
      code: ({ u, s: [G], k: [eps] }) =>
        `${G} += ${u} * ${u}; const d = ${placement === 'outside' ? `Math.sqrt(${G}) + ${eps}` : `Math.sqrt(${G} + ${eps})`}; ${u} = d > 0 ? ${u} / d : 0;`,
    },
    update(u, s) {
      const G = s.sumSquares;
      for (let i = 0; i < u.length; i++) {
        G[i] += u[i] * u[i];
        const d = placement === 'outside' ? Math.sqrt(G[i]) + epsilon : Math.sqrt(G[i] + epsilon);
        u[i] = d > 0 ? u[i] / d : 0;
      }
      return s;
    },
  };
}
