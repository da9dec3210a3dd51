/**
 * Parameters of one affine unit b + sum_j w_j z_j fitted on standardised inputs z_j = (x_j - m_j) / s_j,
 * rewritten for the original inputs: b + sum_j w_j (x_j - m_j) / s_j = (b - sum_j w_j m_j / s_j) +
 * sum_j (w_j / s_j) x_j, so w'_j = w_j / s_j and b' = b - sum_j w_j m_j / s_j. Exact for linear,
 * logistic and softmax models (every class is such a unit) and for a network's first layer, whose units
 * are the only ones that see the inputs.
 */
export function unitToOriginal(out: number[], weightStart: number, biasIndex: number, means: ArrayLike<number>, sds: ArrayLike<number>): void {
  let shift = 0;
  for (let j = 0; j < means.length; j++) {
    const w = out[weightStart + j];
    out[weightStart + j] = w / sds[j];
    shift += (w * means[j]) / sds[j];
  }
  out[biasIndex] -= shift;
}

/** The inverse: w_j = w'_j s_j and b = b' + sum_j w'_j m_j. */
export function unitToStandardised(out: number[], weightStart: number, biasIndex: number, means: ArrayLike<number>, sds: ArrayLike<number>): void {
  let shift = 0;
  for (let j = 0; j < means.length; j++) {
    const w = out[weightStart + j];
    shift += w * means[j];
    out[weightStart + j] = w * sds[j];
  }
  out[biasIndex] += shift;
}
