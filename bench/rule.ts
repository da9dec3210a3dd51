import { adamRule, buildOptimizer, compileRule, defaultOptimizerSpec, RunCursor, ruleOptimizer, type Optimizer } from '../src/engine';
import { buildSurface } from '../src/problems';

const LR = 0.001;
const STEPS = 200_000;

/** Steps per millisecond of an optimizer on 2-D Rosenbrock through the run loop (recording every step). */
function stepsPerMs(make: () => Optimizer): { rate: number; last: number[] } {
  const cursor = new RunCursor(buildSurface({ kind: 'catalogue', id: 'rosenbrock' }), make(), { start: [-1.2, 1], seed: 1, stop: { maxSteps: STEPS } });
  const t0 = performance.now();
  let last: number[] = [];
  while (!cursor.outcome) {
    const batch = cursor.advance(10_000);
    if (batch.count > 0) last = Array.from(batch.points.subarray((batch.count - 1) * 2, batch.count * 2));
  }
  return { rate: STEPS / (performance.now() - t0), last };
}

/**
 * Adam written as a rule (src/engine/rules/library/adam.ts) against the built-in Adam, both through
 * `RunCursor` on Rosenbrock at lr 0.001. Both sides must end at the same point bit for bit before
 * timing counts; rounds alternate so both see the same background load; the best round of each counts.
 */
export function ruleVsBuiltin() {
  const builtin = () => buildOptimizer({ ...defaultOptimizerSpec('adam'), learningRate: LR });
  const rule = () => ruleOptimizer(compileRule(adamRule.text), { label: 'Adam (rule)', learningRate: LR });
  const a = stepsPerMs(builtin);
  const b = stepsPerMs(rule);
  if (a.last.join() !== b.last.join()) throw new Error(`bench: Adam as a rule ended at ${b.last} but the built-in at ${a.last}`);
  let best = { builtin: a.rate, rule: b.rate };
  for (let round = 0; round < 5; round++) {
    best = { builtin: Math.max(best.builtin, stepsPerMs(builtin).rate), rule: Math.max(best.rule, stepsPerMs(rule).rate) };
  }
  return { builtinStepsPerMs: best.builtin, ruleStepsPerMs: best.rule, ratio: best.rule / best.builtin };
}
