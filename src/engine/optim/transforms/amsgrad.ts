import type { GradientTransform } from '../transform';
import { biasCorrection } from '../../power';

export type AmsgradForm = 'pytorch' | 'optax' | 'paper';

export interface AmsgradState {
  m: Float64Array;
  v: Float64Array;
  /** Running maximum (of v_t, or of the bias-corrected v_t in the Optax form). */
  vMax: Float64Array;
}

/**
 * AMSGrad scaling (Reddi, Kale & Kumar, ICLR 2018): Adam's moments m_t, v_t with a running maximum
 * in the denominator, so the per-coordinate step never grows.
 *   'pytorch': vMax = max(vMax, v_t), u = [m_t/(1 - b1^t)] / (sqrt(vMax/(1 - b2^t)) + eps);
 *   'optax':   vMax = max(vMax, v_t/(1 - b2^t)), u = [m_t/(1 - b1^t)] / (sqrt(vMax) + eps);
 *   'paper':   vMax = max(vMax, v_t), u = m_t / (sqrt(vMax) + eps): no bias correction; the paper has
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
    update(u, s, _p, t) {
      const { m, v, vMax } = s;
      const c1 = form === 'paper' ? 1 : correction1(t);
      const c2 = form === 'paper' ? 1 : correction2(t);
      for (let i = 0; i < u.length; i++) {
        const g = u[i];
        m[i] = beta1 * m[i] + (1 - beta1) * g;
        v[i] = beta2 * v[i] + (1 - beta2) * g * g;
        let d: number;
        if (form === 'optax') {
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
