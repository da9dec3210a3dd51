import { BUILTIN_CONSTANTS, FUNCTIONS, nearestName, type Expr } from '../expr';
import type { RuleAst, Statement } from './ast';
import { ruleErrorAt, type LineIndex, type RuleError } from './errors';
import { RULE_FUNCTIONS, isReduction } from './functions';
import type { CheckedRule, HyperInfo, Node, Ref, StateInfo, StepStatement } from './ir';
import { divisionByZeroStateWarnings } from './warnings';
import { evaluateConstant } from './constant';

/**
 * Name resolution and the rule-level checks: every name declared before it is used, assignments only
 * to state variables and the point, defaults that are finite numbers, reductions only in per-step
 * statements and not nested, and at least one update of the point. Also the compile-time warnings
 * (a division by a state variable that is still at an initial value of 0 on the first step).
 */

/** The inputs every rule can read, with what they are. */
export const INPUTS: ReadonlyMap<string, Ref> = new Map<string, Ref>([
  ['g', { kind: 'grad' }],
  ['x', { kind: 'point' }],
  ['t', { kind: 'step' }],
  ['lr', { kind: 'rate' }],
]);

type Context = 'hyper' | 'init' | 'step';

interface Declared {
  readonly kind: 'hyper' | 'state' | 'local';
  readonly index: number;
  readonly line: number;
}

export function checkRule(ast: RuleAst, lines: LineIndex): { ok: true; rule: CheckedRule; warnings: RuleError[] } | { ok: false; errors: RuleError[] } {
  const errors: RuleError[] = [];
  const report = (message: string, span: { start: number; end: number }, note?: string) => errors.push(ruleErrorAt(lines, message, span.start, span.end, note));
  const declared = new Map<string, Declared>();
  /** Every declaration in the rule, to tell "used before it is declared" from "unknown". */
  const declaredLater = new Map<string, Statement>();
  for (const s of ast.statements) if (s.kind !== 'assign' && !declaredLater.has(s.name)) declaredLater.set(s.name, s);

  const hypers: HyperInfo[] = [];
  const states: StateInfo[] = [];
  const steps: StepStatement[] = [];
  let localCount = 0;
  const lineOf = (offset: number) => lines.position(offset).line;

  const resolve = (node: Expr, context: Context, inReduction = false): Node => {
    switch (node.kind) {
      case 'number':
        return { op: 'num', value: node.value };
      case 'name': {
        const builtin = BUILTIN_CONSTANTS.get(node.name);
        if (builtin !== undefined) return { op: 'num', value: builtin };
        const input = INPUTS.get(node.name);
        const known = declared.get(node.name);
        if (context === 'hyper') {
          report(`a default must be a number, not '${node.name}'`, node.span);
        } else if (input) {
          if (context === 'init' && input.kind !== 'point')
            report(`'${node.name}' has no value before the first step`, node.span, 'an initial value may use numbers, hyperparameters and x');
          else return { op: 'ref', ref: input };
        } else if (known) {
          if (context === 'init' && known.kind !== 'hyper') report(`an initial value may not use '${node.name}'`, node.span, 'only numbers, hyperparameters and x');
          else return { op: 'ref', ref: { kind: known.kind, index: known.index } };
        } else {
          const later = declaredLater.get(node.name);
          if (later) {
            const what = later.kind === 'hyper' ? 'hyperparameter' : later.kind === 'state' ? 'state' : 'value';
            report(`${what} '${node.name}' is used before it is declared (on line ${lineOf(later.span.start)})`, node.span, 'move the declaration up');
          } else {
            const nearest = nearestName(node.name, [...declared.keys(), ...INPUTS.keys()]);
            report(`unknown name '${node.name}'`, node.span, nearest ? `did you mean '${nearest}'?` : 'declare it with hyper, state or let');
          }
        }
        return { op: 'num', value: 0 };
      }
      case 'unary': {
        const a = resolve(node.operand, context, inReduction);
        return node.op === '-' ? { op: 'neg', a } : a;
      }
      case 'binary':
        return { op: 'bin', o: node.op, a: resolve(node.left, context, inReduction), b: resolve(node.right, context, inReduction) };
      case 'call': {
        if (isReduction(node.name)) {
          if (context !== 'step') report(`'${node.name}' (a reduction over all parameters) is only allowed in per-step lines`, node.span);
          else if (inReduction) report(`reductions do not nest ('${node.name}' inside another reduction)`, node.span);
          return { op: 'reduce', fn: node.name, args: node.args.map((a) => resolve(a, context, true)) };
        }
        if (!RULE_FUNCTIONS.has(node.name)) report(`unknown function '${node.name}'`, node.span);
        return { op: 'call', fn: node.name, args: node.args.map((a) => resolve(a, context, inReduction)) };
      }
    }
  };

  const declare = (s: Statement, kind: Declared['kind'], index: number): boolean => {
    if (INPUTS.has(s.name) || BUILTIN_CONSTANTS.has(s.name)) {
      report(`'${s.name}' is built in and cannot be declared`, s.nameSpan, s.name === 'x' || s.name === 'g' || s.name === 't' || s.name === 'lr' ? 'x is the point, g the gradient, t the step, lr the learning rate' : undefined);
      return false;
    }
    if (RULE_FUNCTIONS.has(s.name)) {
      report(`'${s.name}' is a function name`, s.nameSpan, 'choose another name');
      return false;
    }
    const before = declared.get(s.name);
    if (before) {
      report(`'${s.name}' is already declared (on line ${before.line})`, s.nameSpan);
      return false;
    }
    declared.set(s.name, { kind, index, line: lineOf(s.span.start) });
    return true;
  };

  for (const s of ast.statements) {
    switch (s.kind) {
      case 'hyper': {
        const value = resolve(s.value, 'hyper');
        const number = evaluateConstant(value);
        if (number === undefined || !Number.isFinite(number))
          report(`hyperparameter '${s.name}' must have a finite default, got ${number ?? 'no number'}`, s.value.span);
        if (declare(s, 'hyper', hypers.length)) hypers.push({ name: s.name, default: number ?? 0, span: s.nameSpan });
        break;
      }
      case 'state': {
        const init = resolve(s.value, 'init');
        if (declare(s, 'state', states.length)) states.push({ name: s.name, init, span: s.nameSpan });
        break;
      }
      case 'let': {
        const value = resolve(s.value, 'step');
        const index = localCount;
        if (declare(s, 'local', index)) {
          localCount++;
          steps.push({ target: { kind: 'local', index }, value, line: lineOf(s.span.start) });
        }
        break;
      }
      case 'assign': {
        const value = resolve(s.value, 'step');
        const target = assignTarget(s, declared, declaredLater, lineOf, report);
        if (target) steps.push({ target, value, line: lineOf(s.span.start) });
        break;
      }
    }
  }
  if (!steps.some((s) => s.target.kind === 'point')) {
    const end = ast.statements.length > 0 ? ast.statements[ast.statements.length - 1].span.end : 0;
    report('the rule never updates the point', { start: end, end }, "add a line such as 'x = x - lr * g'");
  }
  if (errors.length > 0) return { ok: false, errors: errors.sort((a, b) => a.start - b.start) };
  const rule: CheckedRule = { hypers, states, localCount, steps };
  return { ok: true, rule, warnings: divisionByZeroStateWarnings(ast, rule, lines) };
}

function assignTarget(
  s: Statement,
  declared: ReadonlyMap<string, Declared>,
  declaredLater: ReadonlyMap<string, Statement>,
  lineOf: (offset: number) => number,
  report: (message: string, span: { start: number; end: number }, note?: string) => void,
): StepStatement['target'] | undefined {
  if (s.name === 'x') return { kind: 'point' };
  const input = INPUTS.get(s.name);
  if (input) {
    report(`'${s.name}' is an input and cannot be assigned`, s.nameSpan, "assign x (the new point) or a state variable");
    return undefined;
  }
  const known = declared.get(s.name);
  if (known?.kind === 'state') return { kind: 'state', index: known.index };
  if (known?.kind === 'hyper') report(`hyperparameter '${s.name}' cannot be assigned; it is fixed during a run`, s.nameSpan);
  else if (known?.kind === 'local') report(`'${s.name}' is a let value and is set once per step`, s.nameSpan, 'declare it with state to keep it between steps');
  else if (declaredLater.has(s.name)) report(`state '${s.name}' is assigned before it is declared (on line ${lineOf(declaredLater.get(s.name)!.span.start)})`, s.nameSpan, 'move the declaration up');
  else if (FUNCTIONS.has(s.name) || isReduction(s.name)) report(`'${s.name}' is a function name and cannot be assigned`, s.nameSpan);
  else {
    const nearest = nearestName(s.name, [...declared.keys()].filter((n) => declared.get(n)!.kind === 'state'));
    report(`unknown state '${s.name}'`, s.nameSpan, nearest ? `did you mean '${nearest}'?` : `declare it first: state ${s.name} = 0`);
  }
  return undefined;
}
