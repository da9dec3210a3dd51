import type { GradientTransform } from '../transform';
import { biasCorrection } from '../../power';
import { momentsCode, updateMoments } from './moments';

export interface MomentsState {
  m: Float64Array;
  v: Float64Array;
}

/** The two forms of Adam's denominator (below); the first is the default. */
export const ADAM_EPSILON_FORMS = ['eps-after-correction', 'eps-before-correction'] as const;
export type AdamEpsilonForm = (typeof ADAM_EPSILON_FORMS)[number];

/**
 * Adam scaling (Kingma & Ba, ICLR 2015): m_t = b1 m + (1 - b1) g, v_t = b2 v + (1 - b2) g^2,
 *   'eps-after-correction': u = mhat / (sqrt(vhat) + eps), mhat = m_t / (1 - b1^t), vhat = v_t / (1 - b2^t)
 *                 (the paper's Algorithm 1; PyTorch, Optax, tfjs);
 *   'eps-before-correction':        u = [sqrt(1 - b2^t) / (1 - b1^t)] m_t / (sqrt(v_t) + eps)
 *                 (the paper's "efficient" form with epsilon-hat; Keras/TF). The two agree when
 *                 eps_hat = eps sqrt(1 - b2^t).
 */
export function scaleByAdam(beta1: number, beta2: number, epsilon: number, form: AdamEpsilonForm = 'eps-after-correction'): GradientTransform<MomentsState> {
  // 1 - beta^t, the same doubles as 1 - power(beta, t) (power.ts), with the powers' squares made once.
  const correction1 = biasCorrection(beta1);
  const correction2 = biasCorrection(beta2);
  return {
    name: 'scaleByAdam',
    elementwise: true,
    init: (p) => ({ m: new Float64Array(p.length), v: new Float64Array(p.length) }),
    // update's operations on one entry, in its order (lockstep.ts): s = [m, v], k = [b1, b2, eps].
    lockstep: {
      arrays: [0, 0],
      constants: [beta1, beta2, epsilon],
      steps: form === 'eps-after-correction' ? 2 : 1,
      step(t, out, at) {
        const c1 = correction1(t);
        const c2 = correction2(t);
        if (form === 'eps-after-correction') {
          out[at] = c1;
          out[at + 1] = c2;
        } else out[at] = Math.sqrt(c2) / c1;
      },
      code: ({ u, s: [m, v], k: [b1, b2, eps], q }) =>
        momentsCode(m, v, u, b1, b2) +
        (form === 'eps-after-correction'
          ? `const d = Math.sqrt(${v} / ${q[1]}) + ${eps}; ${u} = d > 0 ? ${m} / ${q[0]} / d : 0;`
          : `const d = Math.sqrt(${v}) + ${eps}; ${u} = d > 0 ? (${q[0]} * ${m}) / d : 0;`),
    },
    update(u, s, _p, t) {
      const { m, v } = s;
      const c1 = correction1(t);
      const c2 = correction2(t);
      const hatScale = Math.sqrt(c2) / c1;
      if (form === 'eps-after-correction')
        for (let i = 0; i < u.length; i++) {
          const g = u[i];
          updateMoments(m, v, i, g, beta1, beta2);
          const d = Math.sqrt(v[i] / c2) + epsilon;
          u[i] = d > 0 ? m[i] / c1 / d : 0;
        }
      else
        for (let i = 0; i < u.length; i++) {
          const g = u[i];
          updateMoments(m, v, i, g, beta1, beta2);
          const d = Math.sqrt(v[i]) + epsilon;
          u[i] = d > 0 ? (hatScale * m[i]) / d : 0;
        }
      return s;
    },
  };
}
