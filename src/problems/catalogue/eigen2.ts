/**
 * Eigenvalues of the symmetric 2x2 matrix [[p, q], [q, r]], ascending:
 * (p + r)/2 -/+ hypot((p - r)/2, q). Used for the closed-form curvature of constant-dependent points.
 */
export function symmetricEigenvalues2(p: number, q: number, r: number): [number, number] {
  const mean = (p + r) / 2;
  const radius = Math.hypot((p - r) / 2, q);
  return [mean - radius, mean + radius];
}
