import { describe, expect, it } from 'vitest';
import {
  buildOptimizer,
  defaultOptimizerSpec,
  OPTIMIZERS,
  optimizerInfo,
  SettingError,
  validateOptimizerSpec,
  type OptimizerKind,
  type OptimizerSpec,
} from '../../../src/engine';

/** Each optimizer's invalid settings and the exact message (DESIGN.md habit 3). */
type Bad = [spec: Record<string, unknown>, field: string, message: string];

const invalid: Record<OptimizerKind, Bad[]> = {
  gd: [
    [{ learningRate: 0 }, 'learningRate', 'gd: learningRate must be a finite number > 0, got 0'],
    [{ learningRate: -0.1 }, 'learningRate', 'gd: learningRate must be a finite number > 0, got -0.1'],
    [{ learningRate: Infinity }, 'learningRate', 'gd: learningRate must be a finite number > 0, got Infinity'],
    [{ learningRate: '0.1' }, 'learningRate', "gd: learningRate must be a number, got '0.1'"],
    [{ learningRate: undefined }, 'learningRate', 'gd: learningRate is required (a finite number > 0)'],
    [{ hyper: { momentum: 0.9 } }, 'hyper.momentum', "gd: unknown setting 'momentum' (this method has no settings of its own)"],
    [{ clipNorm: 0 }, 'clipNorm', 'gd: clipNorm must be a finite number > 0, got 0'],
    [{ l2Penalty: -1 }, 'l2Penalty', 'gd: l2Penalty must be a finite number >= 0, got -1'],
    [{ weightDecay: NaN }, 'weightDecay', 'gd: weightDecay must be a finite number >= 0, got NaN'],
    [{ lr: 0.1 }, 'lr', "gd: unknown field 'lr'"],
    [{ hyper: [1] }, 'hyper', 'gd: hyper must be an object of named settings, got [1]'],
    [{ schedule: { kind: 'linear' } }, 'schedule.kind', "gd: unknown schedule kind 'linear' (expected one of constant, step, exponential, inverse-time, cosine)"],
    [{ schedule: { kind: 'step', decayRate: 0.5 } }, 'schedule.decaySteps', 'gd: the step decay schedule needs decaySteps'],
    [{ schedule: { kind: 'step', decayRate: 1.5, decaySteps: 10 } }, 'schedule.decayRate', 'gd: step decay schedule decayRate must be in (0, 1], got 1.5'],
    [{ schedule: { kind: 'step', decayRate: 0.5, decaySteps: 2.5 } }, 'schedule.decaySteps', 'gd: step decay schedule decaySteps must be a whole number >= 1, got 2.5'],
    [{ schedule: { kind: 'exponential', decayRate: 0 } }, 'schedule.decayRate', 'gd: exponential schedule decayRate must be in (0, 1], got 0'],
    [{ schedule: { kind: 'exponential', decayRate: 0.9, decaySteps: 0 } }, 'schedule.decaySteps', 'gd: exponential schedule decaySteps must be a finite number > 0, got 0'],
    [{ schedule: { kind: 'inverse-time', decayRate: -1 } }, 'schedule.decayRate', 'gd: inverse time schedule decayRate must be a finite number >= 0, got -1'],
    [{ schedule: { kind: 'inverse-time', decayRate: 1, power: 0 } }, 'schedule.power', 'gd: inverse time schedule power must be a finite number > 0, got 0'],
    [{ schedule: { kind: 'cosine', horizon: 0 } }, 'schedule.horizon', 'gd: cosine schedule horizon must be a whole number >= 1, got 0'],
    [{ schedule: { kind: 'cosine', horizon: 100, floorFraction: 2 } }, 'schedule.floorFraction', 'gd: cosine schedule floorFraction must be in [0, 1], got 2'],
    [{ schedule: { kind: 'cosine', horizon: 100, warmupSteps: -1 } }, 'schedule.warmupSteps', 'gd: cosine schedule warmupSteps must be a whole number >= 0, got -1'],
    [{ schedule: { kind: 'constant', gamma: 0.5 } }, 'schedule.gamma', "gd: unknown setting 'gamma' for the constant schedule"],
    [{ schedule: 'cosine' }, 'schedule', "gd: schedule must be an object, got 'cosine'"],
    [{ rule: { name: 'Mine', text: 'x = x - lr * g' } }, 'rule', "gd: unknown field 'rule'"],
  ],
  momentum: [
    [{ hyper: { momentum: 1 } }, 'hyper.momentum', 'momentum: momentum must be in [0, 1), got 1'],
    [{ hyper: { momentum: -0.1 } }, 'hyper.momentum', 'momentum: momentum must be in [0, 1), got -0.1'],
    [{ hyper: { momentum: true } }, 'hyper.momentum', 'momentum: momentum must be a number, got true'],
    [{ hyper: { dampening: 1 } }, 'hyper.dampening', 'momentum: dampening must be in [0, 1), got 1'],
    [{ hyper: { nesterov: true } }, 'hyper.nesterov', "momentum: unknown setting 'nesterov' (known: momentum, dampening)"],
  ],
  nesterov: [
    [{ hyper: { momentum: 1.2 } }, 'hyper.momentum', 'nesterov: momentum must be in [0, 1), got 1.2'],
    [{ hyper: { form: 'torch' } }, 'hyper.form', "nesterov: form must be one of 'record-look-ahead', 'record-base-point', got 'torch'"],
    [{ hyper: { dampening: 0.1 } }, 'hyper.dampening', "nesterov: unknown setting 'dampening' (known: momentum, form)"],
  ],
  adagrad: [
    [{ hyper: { epsilon: -1e-10 } }, 'hyper.epsilon', 'adagrad: epsilon must be a finite number >= 0, got -1e-10'],
    [{ hyper: { epsilonPlacement: 'under' } }, 'hyper.epsilonPlacement', "adagrad: epsilonPlacement must be one of 'outside', 'inside', got 'under'"],
    [{ hyper: { initialAccumulator: -0.1 } }, 'hyper.initialAccumulator', 'adagrad: initialAccumulator must be a finite number >= 0, got -0.1'],
  ],
  rmsprop: [
    [{ hyper: { decay: 1 } }, 'hyper.decay', 'rmsprop: decay must be in [0, 1), got 1'],
    [{ hyper: { centered: 'yes' } }, 'hyper.centered', "rmsprop: centered must be true or false, got 'yes'"],
    [{ hyper: { momentum: 0.99999, rho: 0.9 } }, 'hyper.rho', "rmsprop: unknown setting 'rho' (known: decay, epsilon, epsilonPlacement, initialMeanSquare, centered, momentum)"],
    [{ hyper: { initialMeanSquare: -1 } }, 'hyper.initialMeanSquare', 'rmsprop: initialMeanSquare must be a finite number >= 0, got -1'],
  ],
  adam: [
    [{ hyper: { beta1: 1.2 } }, 'hyper.beta1', 'adam: beta1 must be in [0, 1), got 1.2'],
    [{ hyper: { beta2: 1 } }, 'hyper.beta2', 'adam: beta2 must be in [0, 1), got 1'],
    [{ hyper: { epsilon: -1 } }, 'hyper.epsilon', 'adam: epsilon must be a finite number >= 0, got -1'],
    [{ hyper: { beta3: 0.5 } }, 'hyper.beta3', "adam: unknown setting 'beta3' (known: beta1, beta2, epsilon, epsilonForm)"],
    [{ hyper: { epsilonForm: 'inside' } }, 'hyper.epsilonForm', "adam: epsilonForm must be one of 'eps-after-correction', 'eps-before-correction', got 'inside'"],
  ],
  adamw: [
    [{ weightDecay: -0.01 }, 'weightDecay', 'adamw: weightDecay must be a finite number >= 0, got -0.01'],
    [{ hyper: { decayForm: 'decoupled' } }, 'hyper.decayForm', "adamw: decayForm must be one of 'times-learning-rate', 'times-schedule', got 'decoupled'"],
    [{ hyper: { beta1: NaN } }, 'hyper.beta1', 'adamw: beta1 must be in [0, 1), got NaN'],
  ],
  amsgrad: [
    [{ hyper: { form: 'keras' } }, 'hyper.form', "amsgrad: form must be one of 'max-raw-moment', 'max-corrected-moment', 'no-bias-correction', got 'keras'"],
    [{ hyper: { beta2: -0.5 } }, 'hyper.beta2', 'amsgrad: beta2 must be in [0, 1), got -0.5'],
  ],
  nadam: [
    [{ hyper: { momentumDecay: -0.004 } }, 'hyper.momentumDecay', 'nadam: momentumDecay must be a finite number >= 0, got -0.004'],
    [{ hyper: { form: 'optax' } }, 'hyper.form', "nadam: form must be one of 'rising-momentum', 'constant-momentum', got 'optax'"],
  ],
  lbfgs: [
    [{ hyper: { historySize: 0 } }, 'hyper.historySize', 'lbfgs: historySize must be a whole number in [1, 1000], got 0'],
    [{ hyper: { historySize: 5.5 } }, 'hyper.historySize', 'lbfgs: historySize must be a whole number in [1, 1000], got 5.5'],
    [{ hyper: { c1: 0 } }, 'hyper.c1', 'lbfgs: c1 must be in (0, 1), got 0'],
    [{ hyper: { c2: 1 } }, 'hyper.c2', 'lbfgs: c2 must be in (0, 1), got 1'],
    [{ hyper: { c1: 0.5, c2: 0.1 } }, 'hyper.c1', 'lbfgs: c1 must be less than c2, got c1 = 0.5, c2 = 0.1'],
    [{ hyper: { lineSearch: 'wolfe' } }, 'hyper.lineSearch', "lbfgs: lineSearch must be one of 'strong-wolfe', 'none', got 'wolfe'"],
    [{ hyper: { maxLineSearchEvaluations: 0 } }, 'hyper.maxLineSearchEvaluations', 'lbfgs: maxLineSearchEvaluations must be a whole number in [1, 1000], got 0'],
    [{ schedule: { kind: 'constant' } }, 'schedule', 'lbfgs: schedule does not apply to L-BFGS, which chooses its own step lengths'],
    [{ clipNorm: 1 }, 'clipNorm', 'lbfgs: clipNorm does not apply to L-BFGS, which chooses its own step lengths'],
    [{ weightDecay: 0.01 }, 'weightDecay', 'lbfgs: weightDecay does not apply to L-BFGS, which chooses its own step lengths (use l2Penalty)'],
  ],
  newton: [
    [{ hyper: { variant: 'modified' } }, 'hyper.variant', "newton: variant must be one of 'plain', 'saddle-free', got 'modified'"],
    [{ hyper: { eigenvalueFloor: 0 } }, 'hyper.eigenvalueFloor', 'newton: eigenvalueFloor must be a finite number > 0, got 0'],
    [{ hyper: { backtrackingFactor: 1 } }, 'hyper.backtrackingFactor', 'newton: backtrackingFactor must be in (0, 1), got 1'],
    [{ hyper: { maxBacktracks: 0 } }, 'hyper.maxBacktracks', 'newton: maxBacktracks must be a whole number in [1, 1000], got 0'],
    [{ schedule: { kind: 'cosine', horizon: 10 } }, 'schedule', "newton: schedule does not apply to Newton's method, which chooses its own step lengths"],
  ],
  rule: [
    [{ rule: undefined }, 'rule', 'rule: a rule optimizer needs its rule: { name, text }'],
    [{ rule: 'x = x - lr * g' }, 'rule', "rule: rule must be an object { name, text }, got 'x = x - lr * g'"],
    [{ rule: { name: '', text: 'x = x - lr * g' } }, 'rule.name', "rule: rule.name must be a non-empty string, got ''"],
    [{ rule: { name: 'Mine', text: 'x = x - lr * g', extra: 1 } }, 'rule.extra', "rule: unknown field 'rule.extra'"],
    [{ rule: { name: 'Mine', text: 'x = x - lr * q' } }, 'rule.text', "rule: unknown name 'q' at line 1, column 14; did you mean 'g'?"],
    [{ hyper: { beta3: 0.5 } }, 'hyper.beta3', "rule: unknown setting 'beta3' (known: beta1, beta2, eps)"],
    [{ hyper: { beta1: Infinity } }, 'hyper.beta1', 'rule: beta1 must be a finite number, got Infinity'],
    [{ hyper: { eps: '1e-8' } }, 'hyper.eps', "rule: eps must be a number, got '1e-8'"],
    [{ weightDecay: 0.1 }, 'weightDecay', 'rule: weightDecay does not apply to a rule; write the decay into the rule (as Lion does)'],
  ],
};

describe('validateOptimizerSpec', () => {
  for (const info of OPTIMIZERS) {
    describe(info.kind, () => {
      it('accepts its default spec and builds it', () => {
        const spec = defaultOptimizerSpec(info.kind);
        expect(validateOptimizerSpec(spec)).toEqual([]);
        expect(buildOptimizer(spec).label.length).toBeGreaterThan(0);
        expect(structuredClone(spec)).toEqual(spec);
      });

      it.each(invalid[info.kind])('rejects %j', (patch, field, message) => {
        const spec = { ...defaultOptimizerSpec(info.kind), ...patch } as OptimizerSpec;
        if ('hyper' in patch && typeof patch.hyper === 'object' && !Array.isArray(patch.hyper)) spec.hyper = { ...defaultOptimizerSpec(info.kind).hyper, ...(patch.hyper as object) };
        const errors = validateOptimizerSpec(spec);
        expect(errors.map((e) => [e.field, e.message])).toEqual([[field, message]]);
        expect(errors[0]).toBeInstanceOf(SettingError);
        expect(() => buildOptimizer(spec)).toThrow(message);
      });
    });
  }

  it('has a list of invalid settings for every optimizer', () => {
    for (const info of OPTIMIZERS) expect(invalid[info.kind].length, info.kind).toBeGreaterThan(1);
  });

  it('reports every problem at once, each with its field', () => {
    const errors = validateOptimizerSpec({ kind: 'adam', learningRate: -1, hyper: { beta1: 2, beta3: 0 }, clipNorm: -1 });
    expect(errors.map((e) => e.field)).toEqual(['learningRate', 'clipNorm', 'hyper.beta1', 'hyper.beta3']);
  });

  it('rejects an unknown kind and a non-object', () => {
    expect(validateOptimizerSpec({ kind: 'sgd', learningRate: 0.1 } as unknown as OptimizerSpec).map((e) => e.message)).toEqual([
      "optimizer: unknown kind 'sgd' (expected one of gd, momentum, nesterov, adagrad, rmsprop, adam, adamw, amsgrad, nadam, lbfgs, newton, rule)",
    ]);
    expect(validateOptimizerSpec(null as unknown as OptimizerSpec)[0].field).toBe('kind');
  });
});

describe('optimizer metadata', () => {
  it('lists each kind once with defaults that pass their own ranges', () => {
    expect(new Set(OPTIMIZERS.map((o) => o.kind)).size).toBe(12);
    for (const o of OPTIMIZERS) {
      expect(optimizerInfo(o.kind)).toBe(o);
      expect(o.source.length).toBeGreaterThan(10);
      expect(o.defaultLearningRate).toBeGreaterThan(0);
      for (const h of o.hyperparameters) {
        expect(h.help.length, `${o.kind}.${h.name}`).toBeGreaterThan(5);
        if (h.choices) expect(h.choices).toContain(h.default);
      }
    }
  });

  it('AdamW carries its own weight-decay default (PyTorch 0.01), the others 0', () => {
    expect(defaultOptimizerSpec('adamw').weightDecay).toBe(0.01);
    expect(optimizerInfo('adam').defaultWeightDecay).toBe(0);
  });
});
