import type { GradientTransform } from '../transform';
import type { EpsilonPlacement } from './adagrad';

export interface RmsState {
  meanSquare: Float64Array;
  /** Running mean of g (centred form only). */
  meanGrad: Float64Array | null;
  /** Momentum buffer (only when momentum > 0). */
  buffer: Float64Array | null;
}

export interface RmsOptions {
  decay: number;
  epsilon: number;
  placement: EpsilonPlacement;
  initialMeanSquare: number;
  centered: boolean;
  momentum: number;
}

/**
 * RMSProp scaling: v_t = rho v_{t-1} + (1 - rho) g^2 (v_0 = initialMeanSquare); centred:
 * gbar_t = rho gbar_{t-1} + (1 - rho) g and w = v - gbar^2 (clamped at 0 against rounding), else w = v;
 * r = g / (sqrt(w) + eps) ('outside', PyTorch) or g / sqrt(w + eps) ('inside', Keras/TF, Optax
 * default); with momentum mu > 0: b_t = mu b_{t-1} + r, u = b_t (PyTorch; learning rate outside the
 * buffer. TF and tfjs put the learning rate inside, b = mu b + lr r, the same for a constant rate).
 */
export function scaleByRms(o: RmsOptions): GradientTransform<RmsState> {
  return {
    name: 'scaleByRms',
    elementwise: true,
    init: (p) => ({
      meanSquare: new Float64Array(p.length).fill(o.initialMeanSquare),
      meanGrad: o.centered ? new Float64Array(p.length) : null,
      buffer: o.momentum > 0 ? new Float64Array(p.length) : null,
    }),
    // update's operations on one entry, in its order (lockstep.ts): s = [v, gbar if centred, buffer if
    // momentum], k = [rho, eps, mu].
    lockstep: {
      arrays: [o.initialMeanSquare, ...(o.centered ? [0] : []), ...(o.momentum > 0 ? [0] : [])],
      constants: [o.decay, o.epsilon, o.momentum],
      steps: 0,
      code: ({ u, s: [v, ...rest], k: [rho, eps, mu] }) => {
        const gbar = o.centered ? rest[0] : null;
        const b = o.momentum > 0 ? rest[rest.length - 1] : null;
        return (
          `${v} = ${rho} * ${v} + (1 - ${rho}) * ${u} * ${u}; let w = ${v}; ` +
          (gbar ? `${gbar} = ${rho} * ${gbar} + (1 - ${rho}) * ${u}; w = Math.max(0, w - ${gbar} * ${gbar}); ` : '') +
          `const d = ${o.placement === 'outside' ? `Math.sqrt(w) + ${eps}` : `Math.sqrt(w + ${eps})`}; const scaled = d > 0 ? ${u} / d : 0; ` +
          (b ? `${b} = ${mu} * ${b} + scaled; ${u} = ${b};` : `${u} = scaled;`)
        );
      },
    },
    update(u, s) {
      const { meanSquare: v, meanGrad: gbar, buffer: b } = s;
      const rho = o.decay;
      for (let i = 0; i < u.length; i++) {
        const g = u[i];
        v[i] = rho * v[i] + (1 - rho) * g * g;
        let w = v[i];
        if (gbar) {
          gbar[i] = rho * gbar[i] + (1 - rho) * g;
          w = Math.max(0, w - gbar[i] * gbar[i]);
        }
        const d = o.placement === 'outside' ? Math.sqrt(w) + o.epsilon : Math.sqrt(w + o.epsilon);
        const r = d > 0 ? g / d : 0;
        if (b) u[i] = b[i] = o.momentum * b[i] + r;
        else u[i] = r;
      }
      return s;
    },
  };
}
