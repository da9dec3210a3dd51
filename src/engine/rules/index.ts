// Update rules: optimizers written as a few lines of state updates (see README.md here).
export type { RuleAst, Statement } from './ast';
export { RuleSyntaxError, type RuleError } from './errors';
export { parseRule, MAX_RULE_LINES, MAX_RULE_LENGTH } from './parse';
export { compileRule, ruleProblems, type CompiledRule } from './compile';
export { ruleOptimizer, type RuleOptimizerOptions, type RuleState } from './optimizer';
export { REDUCTIONS, RULE_FUNCTIONS, type ReductionName } from './functions';
export type { HyperInfo } from './ir';
export { RULE_LIBRARY, ruleExample, adamRule, rmspropRule, heavyBallRule, adadeltaRule, lionRule, signumRule, adabeliefRule, type RuleExample } from './library';
