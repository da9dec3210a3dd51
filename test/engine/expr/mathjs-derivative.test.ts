/**
 * Gradient and Hessian against an independent symbolic differentiator: mathjs 15.2.0 `derivative`
 * (npm package mathjs, a dev dependency), with its results evaluated by mathjs itself. Random formulas
 * over x, y, z are translated to mathjs text by mathjs-text.ts.
 */
import fc from 'fast-check';
import { derivative, parse, type EvalFunction } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { compileFormula, printFormula, type Expr } from '../../../src/engine/expr';
import { numericFormula, regularPoint } from './arbitraries';
import { toMathjsText } from './mathjs-text';

const VARIABLES = ['x', 'y', 'z'] as const;

/** mathjs's first and second derivatives of a formula, compiled by mathjs. */
function mathjsDerivatives(tree: Expr): { gradient: EvalFunction[]; hessian: EvalFunction[][] } {
  const node = parse(toMathjsText(tree));
  const first = VARIABLES.map((v) => derivative(node, v, { simplify: false }));
  return {
    gradient: first.map((d) => d.compile()),
    hessian: first.map((d) => VARIABLES.map((v) => derivative(d, v, { simplify: false }).compile())),
  };
}

/** A real, finite, not huge mathjs result (mathjs returns complex numbers for log(-1) and the like). */
function realResult(value: unknown): number | undefined {
  return typeof value === 'number' && Number.isFinite(value) && Math.abs(value) < 1e6 ? value : undefined;
}

/** Two evaluations of the same exact quantity along different rounding paths. */
function close(ours: number, theirs: number): boolean {
  return Math.abs(ours - theirs) <= 1e-8 * (1 + Math.abs(theirs));
}

describe('exact derivatives agree with mathjs 15.2.0 symbolic derivative', () => {
  it('on random formulas (fast-check)', () => {
    let compared = 0;
    let runs = 0;
    fc.assert(
      fc.property(numericFormula('mathjs', 4), regularPoint, (tree, { env, at }) => {
        runs++;
        const surface = compileFormula(printFormula(tree), { variables: [...VARIABLES] });
        const g = new Float64Array(3);
        const h = new Float64Array(9);
        surface.valueGradientHessian(at, g, h);
        const reference = mathjsDerivatives(tree);
        // Entries whose exact value is ill-conditioned here (see numeric-properties.test.ts) are skipped.
        const nudged = at.map((v, i) => v * (1 + [1e-11, -2e-11, 3e-11][i]));
        const g2 = new Float64Array(3);
        const h2 = new Float64Array(9);
        surface.valueGradientHessian(nudged, g2, h2);
        const steady = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * (1 + Math.abs(a));

        let any = false;
        VARIABLES.forEach((v, i) => {
          const theirs = realResult(reference.gradient[i].evaluate({ ...env }));
          if (theirs === undefined || !steady(g[i], g2[i])) return;
          expect(close(g[i], theirs), `${toMathjsText(tree)} at ${at}: d/d${v} ours ${g[i]}, mathjs ${theirs}`).toBe(true);
          any = true;
        });
        VARIABLES.forEach((_, i) =>
          VARIABLES.forEach((__, j) => {
            const theirs = realResult(reference.hessian[i][j].evaluate({ ...env }));
            if (theirs === undefined || !steady(h[i * 3 + j], h2[i * 3 + j])) return;
            expect(close(h[i * 3 + j], theirs), `${toMathjsText(tree)} at ${at}: H[${i}][${j}] ours ${h[i * 3 + j]}, mathjs ${theirs}`).toBe(true);
            any = true;
          }),
        );
        if (any) compared++;
      }),
      { numRuns: 300 },
    );
    expect(compared).toBeGreaterThan(runs * 0.5);
  }, 120_000);

  it('on the textbook surfaces, entry by entry', () => {
    // Rosenbrock (1960) and Himmelblau (1972), written as usual.
    for (const text of ['(1 - x)^2 + 100 * (y - x^2)^2', '(x^2 + y - 11)^2 + (x + y^2 - 7)^2']) {
      const surface = compileFormula(text, { variables: ['x', 'y'] });
      const node = parse(text);
      for (const at of [[-1.2, 1], [0.3, -0.7], [3, 2]]) {
        const scope = { x: at[0], y: at[1] };
        const g = new Float64Array(2);
        const h = new Float64Array(4);
        surface.valueGradientHessian(at, g, h);
        ['x', 'y'].forEach((a, i) => {
          const da = derivative(node, a);
          expect(g[i]).toBeCloseTo(da.evaluate(scope), 9);
          ['x', 'y'].forEach((b, j) => expect(h[i * 2 + j]).toBeCloseTo(derivative(da, b).evaluate(scope), 9));
        });
      }
    }
  });
});
