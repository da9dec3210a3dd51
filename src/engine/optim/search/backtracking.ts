/**
 * Backtracking (Armijo) line search (Nocedal & Wright, Numerical Optimization, 2nd ed., Alg. 3.1):
 * starting from a0, shrink a <- shrink * a until phi(a) <= phi(0) + c1 a phi'(0).
 * `phi(a)` returns the value at x + a p (the caller keeps whatever else it computed there).
 * Returns the accepted step, or 0 when `maxEvaluations` trials all failed.
 */
export function backtrackingSearch(
  phi: (a: number) => number,
  phi0: number,
  dphi0: number,
  a0: number,
  c1: number,
  shrink: number,
  maxEvaluations: number,
): { step: number; value: number; evaluations: number } {
  let a = a0;
  for (let k = 1; k <= maxEvaluations; k++) {
    const f = phi(a);
    if (Number.isFinite(f) && f <= phi0 + c1 * a * dphi0) return { step: a, value: f, evaluations: k };
    a *= shrink;
  }
  return { step: 0, value: phi0, evaluations: maxEvaluations };
}
