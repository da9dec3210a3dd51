import type { GradientTransform } from '../transform';

export interface MomentumState {
  buffer: Float64Array;
  steps: number;
}

/**
 * Heavy-ball momentum in the PyTorch buffer form (learning rate outside the buffer):
 *   b_1 = g_1,  b_t = mu b_{t-1} + (1 - tau) g_t  (t > 1),
 *   u_t = b_t  (heavy ball)   or   u_t = g_t + mu b_t  (Nesterov, library form).
 * tau is PyTorch's dampening (skipped on the first step, as PyTorch does); Optax and tfjs keep no
 * dampening: b_t = mu b_{t-1} + g_t with b_0 = 0, which is the same thing when tau = 0.
 */
export function traceMomentum(mu: number, dampening = 0, nesterov = false): GradientTransform<MomentumState> {
  return {
    name: nesterov ? 'traceNesterov' : 'traceMomentum',
    elementwise: true,
    init: (p) => ({ buffer: new Float64Array(p.length), steps: 0 }),
    // update's operations on one entry (lockstep.ts), for a state fresh at t = 1 (the kernel's runs
    // all start together), so "the first update" is q = [t === 1 ? 1 : 0]; s = [buffer].
    lockstep: {
      arrays: [0],
      constants: [mu, dampening],
      steps: 1,
      step(t, out, at) {
        out[at] = t === 1 ? 1 : 0;
      },
      code: ({ u, s: [b], k: [m, damp], q: [first] }) =>
        `${b} = ${first} !== 0 ? ${u} : ${m} * ${b} + (1 - ${damp}) * ${u}; ${u} = ${nesterov ? `${u} + ${m} * ${b}` : b};`,
    },
    update(u, s) {
      const b = s.buffer;
      const first = s.steps === 0;
      for (let i = 0; i < u.length; i++) {
        b[i] = first ? u[i] : mu * b[i] + (1 - dampening) * u[i];
        u[i] = nesterov ? u[i] + mu * b[i] : b[i];
      }
      s.steps += 1;
      return s;
    },
  };
}

/**
 * Velocity with the learning rate inside, placed after `scaleByLearningRate` (u is already -lr_t g):
 * v_t = mu v_{t-1} + u_t, u_t <- v_t. Sutskever, Martens, Dahl & Hinton (ICML 2013) "classical
 * momentum"; the Keras SGD form. Used by Nesterov momentum's 'record-base-point' form, whose gradient is
 * taken at the look-ahead point x + mu v.
 */
export function traceVelocity(mu: number): GradientTransform<{ velocity: Float64Array }> {
  return {
    name: 'traceVelocity',
    elementwise: true,
    init: (p) => ({ velocity: new Float64Array(p.length) }),
    update(u, s) {
      const v = s.velocity;
      for (let i = 0; i < u.length; i++) u[i] = v[i] = mu * v[i] + u[i];
      return s;
    },
  };
}
