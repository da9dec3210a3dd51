/**
 * Property tests of the compiler on random formulas over x, y, z (fast-check):
 * the compiled value equals the tree-walking evaluator exactly, and the exact gradient and Hessian
 * agree with central finite differences.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileFormula, evaluateFormula, printFormula, type Expr, type FormulaSurface } from '../../../src/engine/expr';
import { numericFormula, point, regularPoint, type FunctionFamily } from './arbitraries';

const VARIABLES = ['x', 'y', 'z'];

function compile(tree: Expr): FormulaSurface {
  return compileFormula(printFormula(tree), { variables: VARIABLES });
}

/** Largest magnitude at which a point is still checked; beyond it rounding swamps any tolerance. */
const HUGE = 1e6;
const sane = (values: ArrayLike<number>) => Array.from(values).every((v) => Number.isFinite(v) && Math.abs(v) < HUGE);

/** Five-point central difference (error O(h^4)) of a scalar function of one coordinate. */
function centralDifference(f: (p: number[]) => number, at: readonly number[], i: number, h: number): number {
  const shifted = (d: number) => {
    const p = [...at];
    p[i] += d;
    return f(p);
  };
  return (-shifted(2 * h) + 8 * shifted(h) - 8 * shifted(-h) + shifted(-2 * h)) / (12 * h);
}

/**
 * Checks `exact` against finite differences of `f` along coordinate i, over a ladder of steps
 * h = 1e-2, 2.5e-3, ..., 3.9e-5. Agreement at any step passes. Otherwise the exact value is wrong only
 * if the ladder has converged (the two smallest steps agree with each other); if it has not, the point
 * is too near a singularity, a kink or a fast oscillation for differences to mean anything, and is
 * skipped. `magnitude` is |f| at the point.
 */
function agreesWithDifferences(f: (p: number[]) => number, at: readonly number[], i: number, exact: number, magnitude: number): boolean | 'skipped' {
  // Rounding error of the quotient is about 1.5 eps |f| / h < 1e-11 |f| here, inside the second term.
  const tolerance = 1e-6 * (1 + Math.abs(exact)) + 1e-8 * magnitude;
  const estimates = [1e-2, 2.5e-3, 6.25e-4, 1.5625e-4, 3.90625e-5].map((h) => centralDifference(f, at, i, h));
  if (estimates.some((d) => Math.abs(d - exact) <= tolerance)) return true;
  const [previous, last] = estimates.slice(-2);
  // A huge or non-finite quotient means a jump or a pole within the stencil.
  if (!sane([previous, last])) return 'skipped';
  return Math.abs(previous - last) <= tolerance ? false : 'skipped';
}

/** Smallest distance of a kink argument from its kink at this point (Infinity without kinks). */
function kinkDistance(tree: Expr, env: Record<string, number>): number {
  switch (tree.kind) {
    case 'number':
    case 'name':
      return Infinity;
    case 'unary':
      return kinkDistance(tree.operand, env);
    case 'binary':
      return Math.min(kinkDistance(tree.left, env), kinkDistance(tree.right, env));
    case 'call': {
      const inner = Math.min(...tree.args.map((a) => kinkDistance(a, env)));
      const values = tree.args.map((a) => evaluateFormula(a, env));
      let own = Infinity;
      if (['abs', 'sign', 'relu', 'elu'].includes(tree.name)) own = Math.abs(values[0]);
      if (tree.name === 'min' || tree.name === 'max') {
        for (let i = 0; i < values.length; i++) for (let j = i + 1; j < values.length; j++) own = Math.min(own, Math.abs(values[i] - values[j]));
      }
      return Math.min(inner, Number.isNaN(own) ? 0 : own);
    }
  }
}

describe('compiled value equals the tree-walking evaluator', () => {
  it.each<FunctionFamily>(['smooth', 'kinked'])('on random %s formulas, bit for bit (fast-check)', (family) => {
    fc.assert(
      fc.property(numericFormula(family), point, (tree, { env, at }) => {
        const surface = compile(tree);
        const expected = evaluateFormula(tree, env);
        const g = new Float64Array(3);
        const h = new Float64Array(9);
        expect(Object.is(surface.value(at), expected), `${surface.value(at)} vs ${expected}`).toBe(true);
        expect(Object.is(surface.valueGradient(at, g), expected)).toBe(true);
        expect(Object.is(surface.valueGradientHessian(at, g, h), expected)).toBe(true);
      }),
      { numRuns: 300 },
    );
  }, 60_000);
});

describe('exact derivatives agree with finite differences', () => {
  for (const family of ['smooth', 'kinked'] as const) {
    it(`gradient and Hessian of random ${family} formulas (fast-check)`, () => {
      let checked = 0;
      let runs = 0;
      fc.assert(
        fc.property(numericFormula(family), regularPoint, (tree, { env, at }) => {
          runs++;
          if (family === 'kinked' && kinkDistance(tree, env) < 0.05) return;
          const surface = compile(tree);
          const g = new Float64Array(3);
          const h = new Float64Array(9);
          const value = surface.valueGradientHessian(at, g, h);
          if (!sane([value]) || !sane(g) || !sane(h)) return;

          for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(h[i * 3 + j]).toBe(h[j * 3 + i]);

          // The exact derivatives, evaluated in floating point, are only comparable where they are
          // well-conditioned: next to a removable singularity of an intermediate term (1/(u^-1) with
          // u = x + z near 0) rounding noise dominates them. A relative nudge of about 1e-11 to the point
          // reveals such noise; those entries are skipped. (The factors differ per coordinate so that
          // sums such as x + z move too.)
          const nudged = at.map((v, i) => v * (1 + [1e-11, -2e-11, 3e-11][i]));
          const g2 = new Float64Array(3);
          const h2 = new Float64Array(9);
          surface.valueGradientHessian(nudged, g2, h2);
          const steady = (a: number, b: number) => Math.abs(a - b) <= 1e-8 * (1 + Math.abs(a));

          const f = (p: number[]) => surface.value(p);
          let pointChecked = false;
          for (let i = 0; i < 3; i++) {
            if (!steady(g[i], g2[i])) continue;
            const verdict = agreesWithDifferences(f, at, i, g[i], Math.abs(value));
            if (verdict === 'skipped') continue;
            expect(verdict, `${printFormula(tree)} at ${at}: d/d${VARIABLES[i]} = ${g[i]}`).toBe(true);
            pointChecked = true;
          }
          for (let i = 0; i < 3; i++) {
            const gi = (p: number[]) => {
              const buffer = new Float64Array(3);
              surface.valueGradient(p, buffer);
              return buffer[i];
            };
            for (let j = 0; j < 3; j++) {
              if (!steady(h[i * 3 + j], h2[i * 3 + j])) continue;
              const verdict = agreesWithDifferences(gi, at, j, h[i * 3 + j], Math.abs(g[i]));
              if (verdict === 'skipped') continue;
              expect(verdict, `${printFormula(tree)} at ${at}: H[${i}][${j}] = ${h[i * 3 + j]}`).toBe(true);
              pointChecked = true;
            }
          }
          if (pointChecked) checked++;
        }),
        { numRuns: 400 },
      );
      // Guard against a generator or a skip rule that leaves nothing to check.
      expect(checked).toBeGreaterThan(runs * 0.5);
    }, 60_000);
  }
});
