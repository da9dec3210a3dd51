import { checkSetting, isPlainObject, show } from './checks';
import type { HyperparameterInfo } from './settings';
import { power } from '../power';

/**
 * Learning-rate schedules as plain data. Every schedule maps the 1-based step counter t to a rate;
 * inside a schedule, k = t - 1 counts the steps already taken, so the first step uses the base rate
 * (as PyTorch's schedulers and Optax's step count from 0 do).
 *
 * Linear warm-up composes with any schedule: with warmupSteps = W > 0, steps t = 1..W use
 * base * t / (W + 1) (a straight ramp that never wastes a step at rate 0), and the schedule proper
 * starts at step W + 1 with k = t - 1 - W, i.e. the decay is shifted to begin when the warm-up ends
 * (the join of Optax's `warmup_*_schedule`). Optax and Hugging Face ramps start at rate 0 on the
 * first step instead (common practice, from memory).
 */
export type ScheduleSpec =
  /** lr_t = base. */
  | { kind: 'constant'; warmupSteps?: number }
  /** Step decay: lr_t = base * decayRate^floor(k / decaySteps) (PyTorch StepLR(step_size, gamma);
   * Keras ExponentialDecay with staircase=True). */
  | { kind: 'step'; decayRate: number; decaySteps: number; warmupSteps?: number }
  /** Exponential: lr_t = base * decayRate^(k / decaySteps), decaySteps default 1 (PyTorch
   * ExponentialLR(gamma) is decaySteps = 1; Keras ExponentialDecay; Optax exponential_decay). */
  | { kind: 'exponential'; decayRate: number; decaySteps?: number; warmupSteps?: number }
  /** Inverse time: lr_t = base / (1 + decayRate * k / decaySteps)^power, decaySteps and power default
   * 1 (Keras InverseTimeDecay is power 1; PyTorch Adagrad's lr_decay is this with decaySteps 1;
   * power 0.5 with decayRate 1 gives the base / sqrt(t) of the AdaGrad and AMSGrad analyses). */
  | { kind: 'inverse-time'; decayRate: number; decaySteps?: number; power?: number; warmupSteps?: number }
  /** Cosine: lr_t = base * (f + (1 - f) (1 + cos(pi min(k, horizon) / horizon)) / 2), f = floorFraction
   * (default 0), constant at base * f after the horizon (Loshchilov & Hutter, "SGDR", ICLR 2017,
   * without restarts; PyTorch CosineAnnealingLR has eta_min = base * f; Optax cosine_decay_schedule's
   * alpha is f). */
  | { kind: 'cosine'; horizon: number; floorFraction?: number; warmupSteps?: number };

export type ScheduleKind = ScheduleSpec['kind'];

export interface ScheduleInfo {
  kind: ScheduleKind;
  label: string;
  /** Settings besides warmupSteps; `default` is used when an optional one is missing. */
  fields: (HyperparameterInfo & { required: boolean })[];
}

const warmupField: HyperparameterInfo = {
  name: 'warmupSteps',
  label: 'warm-up steps',
  default: 0,
  min: 0,
  integer: true,
  help: 'Steps of linear ramp up to the base rate before the schedule starts (0 = none).',
};

const decayRate = (help: string, max?: number): HyperparameterInfo & { required: boolean } => ({
  name: 'decayRate',
  label: 'decay rate',
  default: 0.5,
  min: 0,
  minExclusive: true,
  ...(max === undefined ? {} : { max }),
  required: true,
  help,
});

const decaySteps = (required: boolean, def: number): HyperparameterInfo & { required: boolean } => ({
  name: 'decaySteps',
  label: 'decay steps',
  default: def,
  min: 0,
  minExclusive: true,
  required,
  help: 'Steps over which one factor of the decay rate applies.',
});

export const SCHEDULES: readonly ScheduleInfo[] = [
  { kind: 'constant', label: 'constant', fields: [] },
  {
    kind: 'step',
    label: 'step decay',
    fields: [
      decayRate('Factor applied at each drop.', 1),
      { ...decaySteps(true, 100), integer: true, min: 1, minExclusive: false, help: 'Steps between drops.' },
    ],
  },
  { kind: 'exponential', label: 'exponential', fields: [decayRate('Factor applied per decaySteps steps.', 1), decaySteps(false, 1)] },
  {
    kind: 'inverse-time',
    label: 'inverse time',
    fields: [
      { ...decayRate('How fast the rate falls: with power 1 it has halved when decayRate * k / decaySteps = 1.'), min: 0, minExclusive: false, default: 1 },
      decaySteps(false, 1),
      { name: 'power', label: 'power', default: 1, min: 0, minExclusive: true, required: false, help: 'Exponent of the denominator (0.5 for 1/sqrt(t) decay).' },
    ],
  },
  {
    kind: 'cosine',
    label: 'cosine',
    fields: [
      { name: 'horizon', label: 'horizon (steps)', default: 1000, min: 1, integer: true, required: true, help: 'Steps from the base rate down to the floor.' },
      { name: 'floorFraction', label: 'floor (fraction of base)', default: 0, min: 0, max: 1, required: false, help: 'Final rate as a fraction of the base rate.' },
    ],
  },
];

export function scheduleInfo(kind: ScheduleKind): ScheduleInfo {
  const info = SCHEDULES.find((s) => s.kind === kind);
  if (!info) throw new Error(`unknown schedule kind '${kind}'`);
  return info;
}

/**
 * The learning rate at 1-based step t under `schedule` (undefined = constant) with base rate `base`.
 * Assumes a valid schedule (see `scheduleProblems`).
 */
export function learningRateAt(schedule: ScheduleSpec | undefined, base: number, t: number): number {
  if (!schedule) return base;
  const w = schedule.warmupSteps ?? 0;
  if (t <= w) return (base * t) / (w + 1);
  const k = Math.max(0, t - 1 - w);
  switch (schedule.kind) {
    case 'constant':
      return base;
    case 'step':
      return base * power(schedule.decayRate, Math.floor(k / schedule.decaySteps));
    case 'exponential':
      return base * power(schedule.decayRate, k / (schedule.decaySteps ?? 1));
    case 'inverse-time':
      return base / power(1 + (schedule.decayRate * k) / (schedule.decaySteps ?? 1), schedule.power ?? 1);
    case 'cosine': {
      const f = schedule.floorFraction ?? 0;
      const progress = Math.min(k, schedule.horizon) / schedule.horizon;
      return base * (f + ((1 - f) * (1 + Math.cos(Math.PI * progress))) / 2);
    }
  }
}

/** Every problem with a schedule spec, as [field, message] pairs (message without the kind prefix). */
export function scheduleProblems(schedule: unknown): [string, string][] {
  if (!isPlainObject(schedule)) return [['schedule', `schedule must be an object, got ${show(schedule)}`]];
  const kind = schedule.kind;
  const info = SCHEDULES.find((s) => s.kind === kind);
  if (!info)
    return [['schedule.kind', `unknown schedule kind ${show(kind)} (expected one of ${SCHEDULES.map((s) => s.kind).join(', ')})`]];
  const problems: [string, string][] = [];
  const fields = [...info.fields, { ...warmupField, required: false }];
  for (const key of Object.keys(schedule)) {
    if (key !== 'kind' && !fields.some((f) => f.name === key))
      problems.push([`schedule.${key}`, `unknown setting '${key}' for the ${info.label} schedule`]);
  }
  for (const f of fields) {
    const value = schedule[f.name];
    if (value === undefined) {
      if (f.required) problems.push([`schedule.${f.name}`, `the ${info.label} schedule needs ${f.name}`]);
      continue;
    }
    const problem = checkSetting(f, value, `${info.label} schedule ${f.name}`);
    if (problem) problems.push([`schedule.${f.name}`, problem]);
  }
  return problems;
}
