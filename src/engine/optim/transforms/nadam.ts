import type { GradientTransform } from '../transform';
import { biasCorrection } from '../../power';
import { updateMoments } from './moments';

/** The two forms of NAdam's first moment (below); the first is the default. */
export const NADAM_FORMS = ['rising-momentum', 'constant-momentum'] as const;
export type NadamForm = (typeof NADAM_FORMS)[number];

export interface NadamState {
  m: Float64Array;
  v: Float64Array;
  /** prod_{i <= t} mu_i of the momentum schedule (scheduled form). */
  muProduct: number;
}

/**
 * NAdam scaling (Dozat, "Incorporating Nesterov Momentum into Adam", ICLR 2016 workshop):
 * m_t = b1 m + (1 - b1) g, v_t = b2 v + (1 - b2) g^2, vhat = v_t / (1 - b2^t), u = mhat / (sqrt(vhat) + eps)
 * with the Nesterov-style first moment
 *   'rising-momentum' (Dozat; PyTorch NAdam): mu_t = b1 (1 - 0.5 * 0.96^(t psi)), psi = momentumDecay,
 *      mhat = mu_{t+1} m_t / (1 - prod_{i<=t+1} mu_i) + (1 - mu_t) g_t / (1 - prod_{i<=t} mu_i);
 *   'constant-momentum' (Optax nadam): mhat = b1 m_t / (1 - b1^(t+1)) + (1 - b1) g_t / (1 - b1^t).
 */
export function scaleByNadam(beta1: number, beta2: number, epsilon: number, momentumDecay: number, form: NadamForm): GradientTransform<NadamState> {
  const mu = (t: number) => beta1 * (1 - 0.5 * Math.pow(0.96, t * momentumDecay));
  const correction1 = biasCorrection(beta1);
  const correction2 = biasCorrection(beta2);
  return {
    name: 'scaleByNadam',
    elementwise: true,
    init: (p) => ({ m: new Float64Array(p.length), v: new Float64Array(p.length), muProduct: 1 }),
    update(u, s, _p, t) {
      const { m, v } = s;
      let a: number; // weight of m_t
      let b: number; // weight of g_t
      if (form === 'rising-momentum') {
        const muT = mu(t);
        const muNext = mu(t + 1);
        s.muProduct *= muT;
        a = muNext / (1 - s.muProduct * muNext);
        b = (1 - muT) / (1 - s.muProduct);
      } else {
        a = beta1 / correction1(t + 1);
        b = (1 - beta1) / correction1(t);
      }
      const c2 = correction2(t);
      for (let i = 0; i < u.length; i++) {
        const g = u[i];
        updateMoments(m, v, i, g, beta1, beta2);
        const d = Math.sqrt(v[i] / c2) + epsilon;
        u[i] = d > 0 ? (a * m[i] + b * g) / d : 0;
      }
      return s;
    },
  };
}
