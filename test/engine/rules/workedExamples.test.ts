import { describe, expect, it } from 'vitest';
import { adabeliefRule, lionRule, signumRule } from '../../../src/engine';
import { bowl } from '../optim/surfaces';
import { runRule } from './run';

/**
 * Iterates worked by hand from the papers' algorithm boxes, on the bowl f = x^2 + 10 y^2 (gradient
 * (2x, 20y)), three steps each. The hand computations are written out below (marked HAND), one line
 * per quantity of the algorithm box, independent of the rule compiler.
 */
const close = (actual: number[], expected: number[], tol = 1e-12) => actual.forEach((v, i) => expect(Math.abs(v - expected[i])).toBeLessThan(tol));
const iterate = (points: Float64Array, k: number) => [points[2 * k], points[2 * k + 1]];

describe('Lion (Chen et al. 2023, "Symbolic Discovery of Optimization Algorithms", Algorithm 2)', () => {
  it('matches three steps worked by hand (lr 0.1, b1 0.9, b2 0.99, lambda 0.5, start (0.05, 1))', () => {
    // HAND. c = b1 m + (1 - b1) g;  x <- x - lr (sign(c) + lambda x);  m <- b2 m + (1 - b2) g;  m_0 = 0.
    // Step 1: g = (0.1, 20); c = (0.01, 2) -> sign (1, 1);
    //   x1 = 0.05 - 0.1 (1 + 0.025) = -0.0525,  y1 = 1 - 0.1 (1 + 0.5) = 0.85;  m1 = (0.001, 0.2).
    // Step 2: g = (-0.105, 17); c = (0.0009 - 0.0105, 0.18 + 1.7) = (-0.0096, 1.88) -> sign (-1, 1);
    //   x2 = -0.0525 - 0.1 (-1 - 0.02625) = 0.050125,  y2 = 0.85 - 0.1 (1 + 0.425) = 0.7075;
    //   m2 = (0.00099 - 0.00105, 0.198 + 0.17) = (-0.00006, 0.368).
    // Step 3: g = (0.10025, 14.15); c = (-0.000054 + 0.010025, 0.3312 + 1.415) = (0.009971, 1.7462) -> (1, 1);
    //   x3 = 0.050125 - 0.1 (1 + 0.0250625) = -0.05238125,  y3 = 0.7075 - 0.1 (1 + 0.35375) = 0.572125.
    const hand = [[0.05, 1], [-0.0525, 0.85], [0.050125, 0.7075], [-0.05238125, 0.572125]];
    const batch = runRule(bowl, lionRule.text, { learningRate: 0.1, hyper: { beta1: 0.9, beta2: 0.99, decay: 0.5 } }, [0.05, 1], 3);
    hand.forEach((p, k) => close(iterate(batch.points, k), p));
  });
});

describe('AdaBelief (Zhuang et al., NeurIPS 2020, Algorithm 2)', () => {
  it('matches three steps worked by hand (lr 0.1, b1 0.9, b2 0.999, eps 1e-8, start (1, 1))', () => {
    // HAND. m = b1 m + (1 - b1) g;  s = b2 s + (1 - b2) (g - m)^2 + eps;
    //       x <- x - lr (m / (1 - b1^t)) / (sqrt(s / (1 - b2^t)) + eps);  m_0 = s_0 = 0.
    // Step 1 in numbers: g = (2, 20); m = (0.2, 2); s = 0.001 (1.8^2, 18^2) + eps = (0.00324, 0.324) + eps;
    //   mhat = (2, 20); shat = (3.24, 324) + 1e-5, root ~ (1.8, 18);  x1 = y1 ~ 1 - 0.1 * 2 / 1.8 = 0.8888...
    // Steps 2 and 3 by the same lines, written out per coordinate:
    const [b1, b2, eps, lr] = [0.9, 0.999, 1e-8, 0.1];
    let [x, y, mx, my, sx, sy] = [1, 1, 0, 0, 0, 0];
    const hand: number[][] = [[x, y]];
    for (let t = 1; t <= 3; t++) {
      const gx = 2 * x;
      const gy = 20 * y;
      mx = b1 * mx + (1 - b1) * gx;
      my = b1 * my + (1 - b1) * gy;
      sx = b2 * sx + (1 - b2) * (gx - mx) * (gx - mx) + eps;
      sy = b2 * sy + (1 - b2) * (gy - my) * (gy - my) + eps;
      x = x - (lr * (mx / (1 - b1 ** t))) / (Math.sqrt(sx / (1 - b2 ** t)) + eps);
      y = y - (lr * (my / (1 - b1 ** t))) / (Math.sqrt(sy / (1 - b2 ** t)) + eps);
      hand.push([x, y]);
    }
    close(hand[1], [1 - 0.2 / 1.8, 1 - 2 / 18], 1e-6); // the step-1 numbers above
    const batch = runRule(bowl, adabeliefRule.text, { learningRate: lr, hyper: { beta1: b1, beta2: b2, eps } }, [1, 1], 3);
    hand.forEach((p, k) => close(iterate(batch.points, k), p));
  });
});

describe('signSGD with momentum (Bernstein et al. 2018)', () => {
  it('matches three steps worked by hand (lr 0.1, beta 0.5, start (0.04, 1))', () => {
    // HAND. m = beta m + (1 - beta) g;  x <- x - lr sign(m).
    // Step 1: g = (0.08, 20), m = (0.04, 10) -> x1 = (-0.06, 0.9).
    // Step 2: g = (-0.12, 18), m = (0.02 - 0.06, 5 + 9) = (-0.04, 14) -> x2 = (0.04, 0.8).
    // Step 3: g = (0.08, 16), m = (-0.02 + 0.04, 7 + 8) = (0.02, 15) -> x3 = (-0.06, 0.7).
    const hand = [[0.04, 1], [-0.06, 0.9], [0.04, 0.8], [-0.06, 0.7]];
    const batch = runRule(bowl, signumRule.text, { learningRate: 0.1, hyper: { beta: 0.5 } }, [0.04, 1], 3);
    hand.forEach((p, k) => close(iterate(batch.points, k), p));
  });
});
