import type { OptimizerSpec } from '../optim/spec';

/**
 * The learning rate above which a method is predicted to diverge on the local quadratic model with
 * largest Hessian eigenvalue lambdaMax (standard quadratic stability results, common practice):
 *   gradient descent: the error along the top eigenvector is multiplied by |1 - lr lambda| per step,
 *     so lr < 2 / lambda;
 *   heavy-ball momentum mu (Polyak 1964) with PyTorch's dampening tau, v <- mu v + (1 - tau) g:
 *     the modes are the roots of z^2 - (1 + mu - lr (1 - tau) lambda) z + mu, inside the unit circle
 *     exactly when lr (1 - tau) lambda < 2 (1 + mu).
 * A coupled L2 penalty or decoupled weight decay adds its coefficient to every eigenvalue. For other
 * methods, a schedule other than constant, or gradient clipping, there is no such prediction: null.
 */
export function predictedStabilityLimit(spec: OptimizerSpec, lambdaMax: number): number | null {
  if (!(lambdaMax > 0 && Number.isFinite(lambdaMax))) return null;
  if ((spec.schedule && spec.schedule.kind !== 'constant') || spec.clipNorm !== undefined) return null;
  const lambda = lambdaMax + (spec.l2Penalty ?? 0) + (spec.weightDecay ?? 0);
  if (spec.kind === 'gd') return 2 / lambda;
  if (spec.kind === 'momentum') {
    const mu = Number(spec.hyper?.momentum ?? 0.9);
    const tau = Number(spec.hyper?.dampening ?? 0);
    return tau < 1 ? (2 * (1 + mu)) / ((1 - tau) * lambda) : null;
  }
  return null;
}
