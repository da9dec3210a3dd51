import type { GradientTransform } from '../transform';
import { biasCorrection } from '../../power';
import { momentsCode, updateMoments } from './moments';

/** The three forms of AMSGrad's maximum (below); the first is the default. */
export const AMSGRAD_FORMS = ['max-raw-moment', 'max-corrected-moment', 'no-bias-correction'] as const;
export type AmsgradForm = (typeof AMSGRAD_FORMS)[number];

export interface AmsgradState {
  m: Float64Array;
  v: Float64Array;
  /** Running maximum (of v_t, or of the bias-corrected v_t in the Optax form). */
  vMax: Float64Array;
}

/**
 * AMSGrad scaling (Reddi, Kale & Kumar, ICLR 2018): Adam's moments m_t, v_t with a running maximum
 * in the denominator, so the per-coordinate step never grows.
 *   'max-raw-moment': vMax = max(vMax, v_t), u = [m_t/(1 - b1^t)] / (sqrt(vMax/(1 - b2^t)) + eps);
 *   'max-corrected-moment':   vMax = max(vMax, v_t/(1 - b2^t)), u = [m_t/(1 - b1^t)] / (sqrt(vMax) + eps);
 *   'no-bias-correction':   vMax = max(vMax, v_t), u = m_t / (sqrt(vMax) + eps): no bias correction; the paper has
 *              no epsilon (set epsilon = 0 for the literal rule) and analyses alpha_t = alpha/sqrt(t)
 *              (the inverse-time schedule with power 0.5).
 */
export function scaleByAmsgrad(beta1: number, beta2: number, epsilon: number, form: AmsgradForm): GradientTransform<AmsgradState> {
  const correction1 = biasCorrection(beta1);
  const correction2 = biasCorrection(beta2);
  return {
    name: 'scaleByAmsgrad',
    elementwise: true,
    init: (p) => ({ m: new Float64Array(p.length), v: new Float64Array(p.length), vMax: new Float64Array(p.length) }),
    // update's operations on one entry, in its order (lockstep.ts): s = [m, v, vMax], q = [c1, c2].
    lockstep: {
      arrays: [0, 0, 0],
      constants: [beta1, beta2, epsilon],
      steps: 2,
      step(t, out, at) {
        out[at] = form === 'no-bias-correction' ? 1 : correction1(t);
        out[at + 1] = form === 'no-bias-correction' ? 1 : correction2(t);
      },
      code: ({ u, s: [m, v, vMax], k: [b1, b2, eps], q: [c1, c2] }) =>
        momentsCode(m, v, u, b1, b2) +
        (form === 'max-corrected-moment' ? `${vMax} = Math.max(${vMax}, ${v} / ${c2}); const d = Math.sqrt(${vMax}) + ${eps}; ` : `${vMax} = Math.max(${vMax}, ${v}); const d = Math.sqrt(${vMax} / ${c2}) + ${eps}; `) +
        `${u} = d > 0 ? ${m} / ${c1} / d : 0;`,
    },
    update(u, s, _p, t) {
      const { m, v, vMax } = s;
      const c1 = form === 'no-bias-correction' ? 1 : correction1(t);
      const c2 = form === 'no-bias-correction' ? 1 : correction2(t);
      for (let i = 0; i < u.length; i++) {
        const g = u[i];
        updateMoments(m, v, i, g, beta1, beta2);
        let d: number;
        if (form === 'max-corrected-moment') {
          vMax[i] = Math.max(vMax[i], v[i] / c2);
          d = Math.sqrt(vMax[i]) + epsilon;
        } else {
          vMax[i] = Math.max(vMax[i], v[i]);
          d = Math.sqrt(vMax[i] / c2) + epsilon;
        }
        u[i] = d > 0 ? m[i] / c1 / d : 0;
      }
      return s;
    },
  };
}
