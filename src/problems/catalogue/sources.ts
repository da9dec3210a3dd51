/**
 * Short citations shared by the catalogue entries. The numbers were taken from the project's reference
 * notes on standard test functions, which record for every value whether it was read in a published
 * source or computed (Newton refinement of the published location in 40-digit arithmetic).
 */

/** SciPy's global-optimization benchmark suite, benchmarks/go_benchmark_functions (commit 3dbf660a). */
export const SCIPY_GO = 'SciPy global-optimization benchmarks (go_benchmark_functions)';

/** The survey most SciPy docstrings cite; values attributed to it are as SciPy copied them. */
export const JAMIL_YANG =
  'Jamil & Yang (2013), "A literature survey of benchmark functions for global optimisation problems", ' +
  'Int. J. Math. Modelling and Numerical Optimisation 4(2), 150-194';

export const SCIPY_GO_CITING_JY = `${SCIPY_GO}, citing ${JAMIL_YANG}`;

/** Surjanovic & Bingham, Virtual Library of Simulation Experiments, Simon Fraser University. */
export const SFU_LIBRARY = 'Surjanovic & Bingham, Virtual Library of Simulation Experiments (Simon Fraser University)';

export const WIKIPEDIA_HIMMELBLAU = 'Wikipedia, "Himmelblau\'s function"';

/** Digits refined by Newton's method on the exact gradient in 40-digit arithmetic (not a published value). */
export const COMPUTED_IN_REFERENCE = 'computed in reference file (Newton refinement, 40 digits)';

/** Derived by hand from the formula; exact for any value of the constants. */
export const CLOSED_FORM = 'closed form';
