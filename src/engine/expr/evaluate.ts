import type { BinaryOperator, Expr } from './ast';
import { FormulaSyntaxError, errorAt } from './errors';
import { BUILTIN_CONSTANTS, FUNCTIONS, describeArity } from './functions';
import { power } from '../power';

/** Values for the free names of a formula: a plain record (own keys only) or a Map. */
export type Environment = Readonly<Record<string, number>> | ReadonlyMap<string, number>;

function lookup(env: Environment, name: string): number | undefined {
  if (env instanceof Map) return env.get(name);
  return Object.prototype.hasOwnProperty.call(env, name) ? (env as Record<string, number>)[name] : undefined;
}

/**
 * Evaluates a tree by walking it, with plain JavaScript arithmetic, `Math.pow` for `^` and the same
 * kernels as the compiled code. Slow but obviously right: the tests use it as the oracle for the
 * compiler. `pi` and `e` are built in and cannot be overridden. Throws FormulaSyntaxError for a name
 * missing from `env` or an unknown function.
 */
export function evaluateFormula(ast: Expr, env: Environment): number {
  switch (ast.kind) {
    case 'number':
      return ast.value;
    case 'name': {
      const builtin = BUILTIN_CONSTANTS.get(ast.name);
      if (builtin !== undefined) return builtin;
      const value = lookup(env, ast.name);
      if (value === undefined) throw new FormulaSyntaxError([errorAt(`unknown variable '${ast.name}'`, ast.span)]);
      return value;
    }
    case 'unary': {
      const v = evaluateFormula(ast.operand, env);
      return ast.op === '-' ? -v : v;
    }
    case 'binary':
      return applyBinary(ast.op, evaluateFormula(ast.left, env), evaluateFormula(ast.right, env));
    case 'call': {
      const info = FUNCTIONS.get(ast.name);
      if (!info) throw new FormulaSyntaxError([errorAt(`unknown function '${ast.name}'`, ast.span)]);
      if (ast.args.length < info.minArgs || ast.args.length > info.maxArgs) {
        throw new FormulaSyntaxError([errorAt(`${ast.name} takes ${describeArity(info)}, got ${ast.args.length}`, ast.span)]);
      }
      return info.evaluate(ast.args.map((arg) => evaluateFormula(arg, env)));
    }
  }
}

function applyBinary(op: BinaryOperator, a: number, b: number): number {
  switch (op) {
    case '+':
      return a + b;
    case '-':
      return a - b;
    case '*':
      return a * b;
    case '/':
      return a / b;
    case '^':
      return power(a, b);
  }
}
