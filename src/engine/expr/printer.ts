import type { Expr } from './ast';
import { ATOM_PRECEDENCE, BINARY_OPERATORS, PREFIX_PRECEDENCE } from './operators';

/**
 * Formula text for a number: the shortest decimal that reads back as the same double (JavaScript's
 * Number-to-String is round-tripping), in the language's number syntax. A negative number, which the
 * parser never produces as a literal, prints as a parenthesised negation `(-2.5)`, and -0 as `(-0)`.
 */
export function formatLiteral(value: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`cannot print the non-finite number ${value}`);
  if (value < 0 || Object.is(value, -0)) return `(-${String(-value)})`;
  return String(value);
}

/**
 * Prints a tree with every operation in parentheses, e.g. `((-(x ^ 2)) + sin((2 * y)))`.
 * parseFormula(printFormula(ast)) gives back the same tree (spans aside).
 */
export function printFormula(ast: Expr): string {
  switch (ast.kind) {
    case 'number':
      return formatLiteral(ast.value);
    case 'name':
      return ast.name;
    case 'unary':
      return `(${ast.op}${printFormula(ast.operand)})`;
    case 'binary':
      return `(${printFormula(ast.left)} ${ast.op} ${printFormula(ast.right)})`;
    case 'call':
      return `${ast.name}(${ast.args.map(printFormula).join(', ')})`;
  }
}

function precedenceOf(ast: Expr): number {
  if (ast.kind === 'binary') return BINARY_OPERATORS[ast.op].precedence;
  if (ast.kind === 'unary') return PREFIX_PRECEDENCE;
  return ATOM_PRECEDENCE;
}

/**
 * Prints a tree with only the parentheses the grammar needs, e.g. `-x^2 + sin(2 * y)`; it too parses
 * back to the same tree. Rules (from the operator table, operators.ts): a left-associative operator
 * (`+ - * /`) brackets its left operand when it binds more loosely, the right one also when it binds
 * equally; a right-associative one (`^`) brackets a left operand that binds equally or more loosely
 * (a power, or a signed expression: `(-x)^2`), and a right operand looser than a sign (the parser
 * reads that operand as one that may start with a sign).
 */
export function prettyFormula(ast: Expr): string {
  switch (ast.kind) {
    case 'number':
      return formatLiteral(ast.value);
    case 'name':
      return ast.name;
    case 'call':
      return `${ast.name}(${ast.args.map(prettyFormula).join(', ')})`;
    case 'unary': {
      const inner = prettyFormula(ast.operand);
      // `-(-x)` rather than `--x`, which reads like a decrement.
      const bracket = precedenceOf(ast.operand) <= PREFIX_PRECEDENCE;
      return `${ast.op}${bracket ? `(${inner})` : inner}`;
    }
    case 'binary': {
      const { precedence: own, associativity } = BINARY_OPERATORS[ast.op];
      const left = precedenceOf(ast.left);
      const right = precedenceOf(ast.right);
      const bracketLeft = associativity === 'right' ? left <= own : left < own;
      const bracketRight = associativity === 'right' ? right < PREFIX_PRECEDENCE : right <= own;
      const l = bracketLeft ? `(${prettyFormula(ast.left)})` : prettyFormula(ast.left);
      const r = bracketRight ? `(${prettyFormula(ast.right)})` : prettyFormula(ast.right);
      return ast.op === '^' ? `${l}^${r}` : `${l} ${ast.op} ${r}`;
    }
  }
}
