import { learningRateAt, type ScheduleSpec } from '../optim/schedule';
import { addL2Penalty, clipByGlobalNorm } from '../optim/transforms';
import type { Optimizer, StepReport } from '../optim/types';
import type { CompiledRule } from './compile';

/** A rule run's state: one Float64Array per state variable (in declaration order). Plain data. */
export interface RuleState {
  states: Float64Array[];
}

export interface RuleOptimizerOptions {
  label: string;
  /** Values of the rule's settings by name; missing ones take the rule's defaults. */
  hyper?: Readonly<Record<string, number>>;
  learningRate: number;
  schedule?: ScheduleSpec;
  /** Rescale g to this norm when longer, before the rule sees it. */
  clipNorm?: number;
  /** Coupled L2 penalty: the rule sees g + l2Penalty x. */
  l2Penalty?: number;
}

/**
 * An `Optimizer` running a compiled rule: per step, g (optionally clipped and penalised as the
 * built-in chains do, in the same order) and lr_t = learningRateAt(schedule, base, t) go to the
 * generated step function, which updates the state arrays and moves x in place. One surface
 * evaluation per step (the run loop's own). Scratch arrays for let values read across loops belong
 * to the optimizer and are refilled every step, so they are not state.
 */
export function ruleOptimizer(rule: CompiledRule, options: RuleOptimizerOptions): Optimizer<RuleState> {
  const h = new Float64Array(rule.hyperparameters.map((p) => options.hyper?.[p.name] ?? p.default));
  const { learningRate, schedule } = options;
  const clip = options.clipNorm !== undefined ? clipByGlobalNorm(options.clipNorm) : undefined;
  const l2 = options.l2Penalty ? addL2Penalty(options.l2Penalty) : undefined;
  const kernels = rule.kernels;
  let scratch: Float64Array[] = [];
  return {
    label: options.label,
    init(x0) {
      const states = rule.stateNames.map(() => new Float64Array(x0.length));
      kernels.init(x0, states, h);
      return { states };
    },
    step(x, grad, state, ctx): StepReport {
      if (clip) clip.update(grad, null, x, ctx.t);
      if (l2) l2.update(grad, null, x, ctx.t);
      if (rule.scratchCount > 0 && (scratch.length === 0 || scratch[0].length !== x.length))
        scratch = Array.from({ length: rule.scratchCount }, () => new Float64Array(x.length));
      const lr = learningRateAt(schedule, learningRate, ctx.t);
      kernels.step(x, grad, state.states, scratch, h, ctx.t, lr);
      return { learningRate: lr, extraEvaluations: 0 };
    },
  };
}
