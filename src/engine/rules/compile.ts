import { checkRule } from './check';
import { buildRuleKernels, generateRuleSource, type RuleKernels } from './codegen';
import { RuleSyntaxError, type RuleError } from './errors';
import type { CheckedRule, HyperInfo } from './ir';
import { parseRule } from './parse';
import { planSteps } from './plan';

/** A rule compiled once from its text: its settings, state variables, warnings and generated code. */
export interface CompiledRule {
  readonly text: string;
  /** Settings in declaration order, each with its default. */
  readonly hyperparameters: readonly HyperInfo[];
  /** State variable names in declaration order (the order of the run state's arrays). */
  readonly stateNames: readonly string[];
  /** Compile-time warnings (a division by a state that starts at 0), positioned like errors. */
  readonly warnings: readonly RuleError[];
  /** The generated JavaScript (allowlisted tokens only). */
  readonly source: string;
  readonly kernels: RuleKernels;
  /** How many let values need a scratch array per run. */
  readonly scratchCount: number;
  readonly checked: CheckedRule;
}

const CACHE_SIZE = 32;
const cache = new Map<string, CompiledRule>();

/**
 * Parses, checks and compiles rule text (see parse.ts for the syntax, README.md here).
 * Throws RuleSyntaxError listing every problem with its line and column. Compiled rules are cached by
 * text, so the page, the worker and each run of a sweep share one generated function.
 */
export function compileRule(text: string): CompiledRule {
  const hit = cache.get(text);
  if (hit) {
    cache.delete(text);
    cache.set(text, hit);
    return hit;
  }
  const parsed = parseRule(text);
  if (!parsed.ok) throw new RuleSyntaxError(parsed.errors);
  const checked = checkRule(parsed.ast, parsed.lines);
  if (!checked.ok) throw new RuleSyntaxError(checked.errors);
  const plan = planSteps(checked.rule);
  const source = generateRuleSource(checked.rule, plan);
  const compiled: CompiledRule = {
    text,
    hyperparameters: checked.rule.hypers,
    stateNames: checked.rule.states.map((s) => s.name),
    warnings: checked.warnings,
    source,
    kernels: buildRuleKernels(source),
    scratchCount: plan.localInArray.length,
    checked: checked.rule,
  };
  cache.set(text, compiled);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
  return compiled;
}

/** The problems with a rule text, without throwing: [] when it compiles. */
export function ruleProblems(text: string): RuleError[] {
  try {
    compileRule(text);
    return [];
  } catch (error) {
    if (error instanceof RuleSyntaxError) return error.errors;
    throw error;
  }
}
