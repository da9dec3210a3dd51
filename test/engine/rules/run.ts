import { compileRule, concatBatches, ruleOptimizer, RunCursor, type RuleOptimizerOptions, type Surface, type TrajectoryBatch } from '../../../src/engine';

/** Runs a rule text through the real run loop for `steps` steps and returns the whole trajectory. */
export function runRule(surface: Surface, text: string, options: Omit<RuleOptimizerOptions, 'label'>, start: number[], steps: number): TrajectoryBatch {
  const optimizer = ruleOptimizer(compileRule(text), { label: 'rule', ...options });
  const cursor = new RunCursor(surface, optimizer, { start, seed: 1, stop: { maxSteps: steps } });
  return concatBatches(cursor.runToEnd(1000), surface.dimension);
}
