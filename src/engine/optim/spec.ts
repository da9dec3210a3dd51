import type { ScheduleSpec } from './schedule';
import type { HyperparameterInfo, HyperValue } from './settings';

/**
 * The optimizer families Fall Line can run. First-order kinds are chains of gradient transforms
 * (transform.ts); 'lbfgs' and 'newton' take line-search or Hessian steps through the oracle.
 *
 * Written out rather than read from the registry (`keyof` of methods/index.ts's table): the methods
 * import this file's `ResolvedSpec` and `OptimizerInfo`, which carry the kind, so a kind read from the
 * registry would make spec.ts import methods/ and close an import cycle (type-only imports count,
 * scripts/lint/no-import-cycle.js). The registry's mapped type makes the compiler insist that the two
 * name the same kinds; test/engine/optim/kinds.test.ts checks it as well.
 */
export type OptimizerKind =
  | 'gd'
  | 'momentum'
  | 'nesterov'
  | 'adagrad'
  | 'rmsprop'
  | 'adam'
  | 'adamw'
  | 'amsgrad'
  | 'nadam'
  | 'lbfgs'
  | 'newton'
  | 'rule';

/**
 * An optimizer written in the update-rule language (src/engine/rules): its name (shown in the page,
 * the table and CSV files) and its text. Its settings are the rule's `hyper` lines; their values go in
 * the spec's `hyper` like any other kind's.
 */
export interface RuleSpec {
  name: string;
  text: string;
}

/**
 * A configured optimizer as plain JSON-serialisable data: what the page edits, the experiment file
 * stores and the worker receives. `buildOptimizer` turns it into a running `Optimizer`.
 */
export interface OptimizerSpec {
  kind: OptimizerKind;
  /**
   * Base learning rate. L-BFGS: the first trial step of each line search (1 for quasi-Newton steps);
   * Newton: the damping factor on the Newton step (1 = full step).
   */
  learningRate: number;
  /** Kind-specific settings by name (see OPTIMIZERS); missing ones take their defaults. */
  hyper?: Record<string, HyperValue>;
  /** Learning-rate schedule over steps (first-order kinds only); default constant. */
  schedule?: ScheduleSpec;
  /** Rescale the gradient to this Euclidean norm when it is longer (first-order kinds only). */
  clipNorm?: number;
  /** Coupled L2 penalty: the gradient becomes g + l2Penalty * x (for L-BFGS and Newton the whole
   * objective becomes f + l2Penalty/2 |x|^2, so the line search and the Hessian see it too). */
  l2Penalty?: number;
  /**
   * Decoupled weight decay: after the method's own scaling, the update gains weightDecay * x, and the
   * sum is multiplied by the (scheduled) learning rate: x <- x - lr_t (u + weightDecay x) (the PyTorch
   * and Optax convention). First-order kinds only; default 0, except AdamW's own default 0.01.
   */
  weightDecay?: number;
  /** Kind 'rule' only (and required there): the rule to run. */
  rule?: RuleSpec;
}

/**
 * How a kind takes its steps. 'first-order' kinds are chains of gradient transforms (or a rule): the
 * learning-rate schedule, clipNorm and weightDecay apply to them. 'line-search' (L-BFGS) and 'curvature'
 * (Newton) choose their own step lengths, so those three fields are refused.
 */
export type OptimizerFamily = 'first-order' | 'line-search' | 'curvature';

export interface OptimizerInfo {
  kind: OptimizerKind;
  label: string;
  defaultLearningRate: number;
  hyperparameters: HyperparameterInfo[];
  family: OptimizerFamily;
  /** Default of the top-level weightDecay field (0 except AdamW), so the settings panel can show it. */
  defaultWeightDecay: number;
  summary: string;
  /** The paper or book the method comes from. */
  source: string;
}

/** A spec with every default filled in, as the method builders receive it. */
export interface ResolvedSpec {
  kind: OptimizerKind;
  learningRate: number;
  hyper: Record<string, HyperValue>;
  schedule: ScheduleSpec;
  clipNorm: number | undefined;
  l2Penalty: number;
  weightDecay: number;
  rule?: RuleSpec;
}
