import * as math from 'mathjs';
import { compileFormula } from '../src/engine';
import { HIMMELBLAU, himmelblauGrad, MIXED, mixed, mixedGrad, rosenbrock, ROSENBROCK, rosenbrockGrad } from './handwritten';
import { opsPerMs } from './measure';

const POINTS = 1024;

function points(): Float64Array[] {
  const out: Float64Array[] = [];
  let s = 12345;
  const u = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648) * 4 - 2;
  for (let k = 0; k < POINTS; k++) out.push(Float64Array.of(u(), u()));
  return out;
}

type Grad = (p: ArrayLike<number>, g: Float64Array) => number;

/** Compiled value+gradient throughput over hand-written value+gradient of the same function. */
export function formulaGradRatios() {
  const pts = points();
  const cases: [string, string, Grad][] = [
    ['rosenbrock', ROSENBROCK, rosenbrockGrad],
    ['himmelblau', HIMMELBLAU, himmelblauGrad],
    ['mixed-35-node', MIXED, mixedGrad],
  ];
  return cases.map(([name, text, hand]) => {
    const surface = compileFormula(text);
    const g1 = new Float64Array(2);
    const g2 = new Float64Array(2);
    for (const p of pts.slice(0, 50)) {
      const a = surface.valueGradient(p, g1);
      const b = hand(p, g2);
      if (Math.abs(a - b) > 1e-9 * (1 + Math.abs(b)) || Math.abs(g1[0] - g2[0]) > 1e-8 * (1 + Math.abs(g2[0])) || Math.abs(g1[1] - g2[1]) > 1e-8 * (1 + Math.abs(g2[1])))
        throw new Error(`bench: compiled and hand-written ${name} disagree at (${p[0]}, ${p[1]})`);
    }
    const compiled = opsPerMs((k) => surface.valueGradient(pts[k & (POINTS - 1)], g1));
    const handwritten = opsPerMs((k) => hand(pts[k & (POINTS - 1)], g2));
    return { name, compiled, handwritten, ratio: compiled / handwritten };
  });
}

/** Compiled value throughput over mathjs's compiled evaluate of the same text. */
export function formulaVsMathjs() {
  const pts = points();
  const cases: [string, string, (x: number, y: number) => number][] = [
    ['rosenbrock', ROSENBROCK, rosenbrock],
    ['mixed-35-node', MIXED, mixed],
  ];
  return cases.map(([name, text, hand]) => {
    const surface = compileFormula(text);
    const code = math.compile(text);
    const scope = { x: 0, y: 0 };
    const check = pts[7];
    scope.x = check[0];
    scope.y = check[1];
    if (Math.abs(code.evaluate(scope) - surface.value(check)) > 1e-9 * (1 + Math.abs(hand(check[0], check[1])))) throw new Error(`bench: mathjs and compiled ${name} disagree`);
    const ours = opsPerMs((k) => surface.value(pts[k & (POINTS - 1)]));
    const theirs = opsPerMs((k) => {
      const p = pts[k & (POINTS - 1)];
      scope.x = p[0];
      scope.y = p[1];
      return code.evaluate(scope) as number;
    });
    const handwritten = opsPerMs((k) => {
      const p = pts[k & (POINTS - 1)];
      return hand(p[0], p[1]);
    });
    return { name, compiled: ours, mathjs: theirs, handwritten, ratio: ours / theirs, handwrittenRatio: handwritten / theirs };
  });
}
