/**
 * The moment update shared by the Adam family (Adam, AMSGrad, NAdam): exponential running means of
 * the gradient and of its square, entry i (Kingma & Ba, "Adam", ICLR 2015, Algorithm 1):
 *   m_t = b1 m_{t-1} + (1 - b1) g_t,   v_t = b2 v_{t-1} + (1 - b2) g_t^2.
 */
export function updateMoments(m: Float64Array, v: Float64Array, i: number, g: number, beta1: number, beta2: number): void {
  m[i] = beta1 * m[i] + (1 - beta1) * g;
  v[i] = beta2 * v[i] + (1 - beta2) * g * g;
}

/**
 * The same update as source for the fused sweep kernel (sweep/fused.ts, optim/lockstep.ts): the names
 * are the kernel's own variables and constants, never user text.
 */
export function momentsCode(m: string, v: string, g: string, beta1: string, beta2: string): string {
  return `${m} = ${beta1} * ${m} + (1 - ${beta1}) * ${g}; ${v} = ${beta2} * ${v} + (1 - ${beta2}) * ${g} * ${g}; `;
}
