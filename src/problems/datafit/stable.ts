/**
 * Numerically stable pieces of the classification losses.
 *
 * softplus(z) = log(1 + e^z) = max(z, 0) + log1p(e^-|z|): never overflows, and keeps full relative
 * precision for large negative z. The binary cross-entropy of a logit z and a label y in {0, 1} is
 * -y log sigmoid(z) - (1 - y) log(1 - sigmoid(z)) = softplus(z) - y z.
 * logSumExp(z) = m + log sum_k e^(z_k - m) with m = max_k z_k (the usual shift; every term <= 1).
 */
export function softplus(z: number): number {
  return Math.max(z, 0) + Math.log1p(Math.exp(-Math.abs(z)));
}

/** 1 / (1 + e^-z), computed from e^-|z| so neither branch overflows. */
export function sigmoid(z: number): number {
  if (z >= 0) return 1 / (1 + Math.exp(-z));
  const e = Math.exp(z);
  return e / (1 + e);
}

/**
 * log sum_k e^(z[k]) over z[0..k), and writes the softmax probabilities e^(z_k - lse) into `probs`.
 */
export function logSumExpSoftmax(z: Float64Array, k: number, probs: Float64Array): number {
  let m = -Infinity;
  for (let c = 0; c < k; c++) if (z[c] > m) m = z[c];
  let s = 0;
  for (let c = 0; c < k; c++) {
    const e = Math.exp(z[c] - m);
    probs[c] = e;
    s += e;
  }
  for (let c = 0; c < k; c++) probs[c] /= s;
  return m + Math.log(s);
}

/** log sum_k e^(z[k]) over z[0..k), without the probabilities (the value-only path). */
export function logSumExp(z: Float64Array, k: number): number {
  let m = -Infinity;
  for (let c = 0; c < k; c++) if (z[c] > m) m = z[c];
  let s = 0;
  for (let c = 0; c < k; c++) s += Math.exp(z[c] - m);
  return m + Math.log(s);
}
