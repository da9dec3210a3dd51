import { adamRule } from '../../rules/library';
import { compileRule } from '../../rules/compile';
import { RuleSyntaxError } from '../../rules/errors';
import { MAX_RULE_LENGTH } from '../../rules/parse';
import { ruleOptimizer } from '../../rules/optimizer';
import { isPlainObject, show } from '../checks';
import type { HyperparameterInfo } from '../settings';
import { defineMethod } from './method';

/** The spec's rule field checked, or the [field, message] saying what is wrong with it. */
function ruleField(raw: Record<string, unknown>): { name: string; text: string } | [string, string] {
  const rule = raw.rule;
  if (rule === undefined) return ['rule', 'a rule optimizer needs its rule: { name, text }'];
  if (!isPlainObject(rule)) return ['rule', `rule must be an object { name, text }, got ${show(rule)}`];
  for (const key of Object.keys(rule)) if (key !== 'name' && key !== 'text') return [`rule.${key}`, `unknown field 'rule.${key}'`];
  if (typeof rule.name !== 'string' || rule.name.trim() === '') return ['rule.name', `rule.name must be a non-empty string, got ${show(rule.name)}`];
  if (typeof rule.text !== 'string') return ['rule.text', `rule.text must be a string, got ${show(rule.text)}`];
  if (rule.text.length > MAX_RULE_LENGTH) return ['rule.text', `rule.text is too long (${rule.text.length} characters, at most ${MAX_RULE_LENGTH})`];
  return { name: rule.name, text: rule.text };
}

/**
 * Kind 'rule': an optimizer written as a few lines of state updates in the rule language (see
 * src/engine/rules and its README.md), compiled into one generated function. Its
 * settings are the rule's `hyper` lines (any finite number; the rule says what makes sense); the
 * learning-rate schedule, clipNorm and l2Penalty apply as for the built-in first-order kinds (the
 * rule reads the scheduled rate as `lr`, and `g` after clipping and the penalty). Decoupled weight
 * decay is written into the rule itself (as Lion's `decay`), so the top-level weightDecay is refused.
 */
export const rule = defineMethod({
    kind: 'rule',
    label: 'Own update rule',
    defaultLearningRate: adamRule.defaultLearningRate,
    family: 'first-order',
    settings: {},
    defaultWeightDecay: 0,
    summary: 'An optimizer written as a few lines of per-parameter state updates.',
    source: 'The rule text; the library rules cite their papers.',
  settingsOf(raw) {
    const field = ruleField(raw);
    if (Array.isArray(field)) return { field: field[0], message: field[1] };
    try {
      const settings = compileRule(field.text).hyperparameters.map(
        (h): HyperparameterInfo => ({ name: h.name, label: h.name, default: h.default, help: `Declared in the rule as hyper ${h.name} = ${h.default}.` }),
      );
      return { settings };
    } catch (error) {
      if (error instanceof RuleSyntaxError) return { field: 'rule.text', message: error.errors[0].message };
      throw error;
    }
  },
  crossChecks: (_settings, spec) => (spec.weightDecay > 0 ? [['weightDecay', 'weightDecay does not apply to a rule; write the decay into the rule (as Lion does)']] : []),
  // The rule's own settings are not declared (they come from its text), so they are read from the spec.
  build(_settings, spec) {
    const r = spec.rule!;
    return ruleOptimizer(compileRule(r.text), {
      label: r.name,
      hyper: spec.hyper as Record<string, number>,
      learningRate: spec.learningRate,
      schedule: spec.schedule,
      clipNorm: spec.clipNorm,
      l2Penalty: spec.l2Penalty,
    });
  },
});
