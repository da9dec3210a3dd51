import { checkSetting, describeRange, isPlainObject, show } from './checks';
import { METHODS, methodFor } from './methods';
import { scheduleProblems } from './schedule';
import type { OptimizerSpec, ResolvedSpec } from './spec';
import { SettingError } from './types';

const TOP_LEVEL = ['kind', 'learningRate', 'hyper', 'schedule', 'clipNorm', 'l2Penalty', 'weightDecay', 'rule'];

/**
 * Every problem with a spec, each a SettingError naming its field ('learningRate', 'hyper.beta1',
 * 'schedule.decayRate', ...) with a message such as "adam: beta1 must be in [0, 1), got 1.2".
 * Accepts any value (specs arrive as JSON); an empty list means `buildOptimizer` will succeed.
 */
export function validateOptimizerSpec(spec: OptimizerSpec): SettingError[] {
  const raw: unknown = spec;
  if (!isPlainObject(raw)) return [new SettingError('kind', `optimizer: the spec must be an object, got ${show(raw)}`)];
  const method = typeof raw.kind === 'string' ? methodFor(raw.kind as OptimizerSpec['kind']) : undefined;
  if (!method)
    return [new SettingError('kind', `optimizer: unknown kind ${show(raw.kind)} (expected one of ${METHODS.map((m) => m.info.kind).join(', ')})`)];
  const { info } = method;
  const errors: SettingError[] = [];
  const fail = (field: string, message: string) => errors.push(new SettingError(field, `${info.kind}: ${message}`));

  for (const key of Object.keys(raw)) if (!TOP_LEVEL.includes(key) || (key === 'rule' && !method.settingsOf)) fail(key, `unknown field '${key}'`);
  let settings = info.hyperparameters;
  if (method.settingsOf) {
    const own = method.settingsOf(raw);
    if ('message' in own) {
      fail(own.field, own.message);
      return errors;
    }
    settings = own.settings;
  }

  const positive = { min: 0, minExclusive: true };
  const nonNegative = { min: 0 };
  const numberField = (field: string, range: { min: number; minExclusive?: boolean }) => {
    const v = raw[field];
    if (v === undefined) return;
    const problem = checkSetting({ name: field, label: field, default: 0, help: '', ...range }, v);
    if (problem) fail(field, problem);
  };
  if (raw.learningRate === undefined) fail('learningRate', `learningRate is required (${describeRange(positive)})`);
  numberField('learningRate', positive);
  numberField('clipNorm', positive);
  numberField('l2Penalty', nonNegative);
  numberField('weightDecay', nonNegative);

  if (info.family !== 'first-order') {
    const why = `does not apply to ${info.label}, which chooses its own step lengths`;
    if (raw.schedule !== undefined) fail('schedule', `schedule ${why}`);
    if (raw.clipNorm !== undefined) fail('clipNorm', `clipNorm ${why}`);
    if (raw.weightDecay !== undefined) fail('weightDecay', `weightDecay ${why} (use l2Penalty)`);
  } else if (raw.schedule !== undefined) {
    for (const [field, message] of scheduleProblems(raw.schedule)) fail(field, message);
  }

  const hyper = raw.hyper;
  if (hyper !== undefined && !isPlainObject(hyper)) fail('hyper', `hyper must be an object of named settings, got ${show(hyper)}`);
  else if (hyper) {
    for (const [name, value] of Object.entries(hyper)) {
      const h = settings.find((p) => p.name === name);
      if (!h) {
        const known = settings.map((p) => p.name);
        fail(`hyper.${name}`, `unknown setting '${name}'${known.length ? ` (known: ${known.join(', ')})` : ' (this method has no settings of its own)'}`);
        continue;
      }
      const problem = checkSetting(h, value);
      if (problem) fail(`hyper.${name}`, problem);
    }
  }

  if (errors.length === 0 && method.crossChecks)
    for (const [field, message] of method.crossChecks(resolveSpec(spec))) fail(field, message);
  return errors;
}

/** Fills in every default. Assumes a valid spec. */
export function resolveSpec(spec: OptimizerSpec): ResolvedSpec {
  const method = methodFor(spec.kind);
  if (!method) throw new SettingError('kind', `optimizer: unknown kind ${show(spec.kind)}`);
  const hyper: ResolvedSpec['hyper'] = {};
  const own = method.settingsOf?.(spec as unknown as Record<string, unknown>);
  const settings = own && 'settings' in own ? own.settings : method.info.hyperparameters;
  for (const h of settings) hyper[h.name] = spec.hyper?.[h.name] ?? h.default;
  return {
    kind: spec.kind,
    learningRate: spec.learningRate,
    hyper,
    schedule: spec.schedule ?? { kind: 'constant' },
    clipNorm: spec.clipNorm,
    l2Penalty: spec.l2Penalty ?? 0,
    weightDecay: spec.weightDecay ?? method.info.defaultWeightDecay,
    ...(spec.rule ? { rule: { name: spec.rule.name, text: spec.rule.text } } : {}),
  };
}
