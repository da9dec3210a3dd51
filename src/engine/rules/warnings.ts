import { BUILTIN_CONSTANTS, type Expr } from '../expr';
import type { RuleAst } from './ast';
import { applyBinary, applyFunction, evaluateConstant } from './constant';
import { ruleErrorAt, type LineIndex, type RuleError } from './errors';
import { isReduction } from './functions';
import type { CheckedRule } from './ir';

/**
 * Compile-time warnings: a division whose denominator is exactly 0 on the first step because the
 * state variables it reads are still at their initial values (hyperparameters at their defaults),
 * e.g. `g / v` with `state v = 0` read before `v` is updated. Only what can be seen without the
 * gradient is reported; at run time the run loop reports the step where values went non-finite.
 */
export function divisionByZeroStateWarnings(ast: RuleAst, rule: CheckedRule, lines: LineIndex): RuleError[] {
  const hyper = new Map(rule.hypers.map((h) => [h.name, h.default]));
  const initial = new Map<string, number | undefined>(
    rule.states.map((s) => [s.name, evaluateConstant(s.init, (ref) => (ref.kind === 'hyper' ? rule.hypers[ref.index].default : undefined))]),
  );
  const assigned = new Set<string>();
  const warnings: RuleError[] = [];

  const value = (node: Expr): number | undefined => {
    switch (node.kind) {
      case 'number':
        return node.value;
      case 'name':
        return BUILTIN_CONSTANTS.get(node.name) ?? hyper.get(node.name) ?? (assigned.has(node.name) ? undefined : initial.get(node.name));
      case 'unary': {
        const a = value(node.operand);
        return a === undefined ? undefined : node.op === '-' ? -a : a;
      }
      case 'binary': {
        const a = value(node.left);
        const b = value(node.right);
        return a === undefined || b === undefined ? undefined : applyBinary(node.op, a, b);
      }
      case 'call': {
        if (isReduction(node.name)) return undefined;
        const args = node.args.map(value);
        return args.every((a): a is number => a !== undefined) ? applyFunction(node.name, args) : undefined;
      }
    }
  };
  const readsState = (node: Expr): boolean =>
    node.kind === 'name' ? initial.has(node.name) : node.kind === 'unary' ? readsState(node.operand) : node.kind === 'binary' ? readsState(node.left) || readsState(node.right) : node.kind === 'call' ? node.args.some(readsState) : false;
  const visit = (node: Expr): void => {
    if (node.kind === 'binary') {
      if (node.op === '/' && readsState(node.right) && value(node.right) === 0)
        warnings.push(ruleErrorAt(lines, 'division by zero on the first step: the denominator reads state that starts at 0', node.right.span.start, node.right.span.end, 'add a small constant (eps) or update the state first'));
      visit(node.left);
      visit(node.right);
    } else if (node.kind === 'unary') visit(node.operand);
    else if (node.kind === 'call') node.args.forEach(visit);
  };
  for (const s of ast.statements) {
    if (s.kind !== 'let' && s.kind !== 'assign') continue;
    visit(s.value);
    if (s.kind === 'assign') assigned.add(s.name);
  }
  return warnings;
}
