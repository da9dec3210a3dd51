import type { BinaryOperator, Expr } from './ast';

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

const PRECEDENCE: Readonly<Record<BinaryOperator, number>> = { '+': 1, '-': 1, '*': 2, '/': 2, '^': 4 };
const UNARY_PRECEDENCE = 3;
const ATOM_PRECEDENCE = 5;

function precedenceOf(ast: Expr): number {
  if (ast.kind === 'binary') return PRECEDENCE[ast.op];
  if (ast.kind === 'unary') return UNARY_PRECEDENCE;
  return ATOM_PRECEDENCE;
}

/**
 * Prints a tree with only the parentheses the grammar needs, e.g. `-x^2 + sin(2 * y)`; it too parses
 * back to the same tree. Rules: the left operand of `+ - * /` is bracketed when it binds more loosely,
 * the right one also when it binds equally (the operators are left-associative); `^` brackets a left
 * operand that is a power or a signed expression (`(-x)^2`), and a right operand looser than a sign.
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
      const bracket = precedenceOf(ast.operand) <= UNARY_PRECEDENCE;
      return `${ast.op}${bracket ? `(${inner})` : inner}`;
    }
    case 'binary': {
      const own = PRECEDENCE[ast.op];
      const left = precedenceOf(ast.left);
      const right = precedenceOf(ast.right);
      const bracketLeft = ast.op === '^' ? left <= own : left < own;
      const bracketRight = ast.op === '^' ? right < UNARY_PRECEDENCE : right <= own;
      const l = bracketLeft ? `(${prettyFormula(ast.left)})` : prettyFormula(ast.left);
      const r = bracketRight ? `(${prettyFormula(ast.right)})` : prettyFormula(ast.right);
      return ast.op === '^' ? `${l}^${r}` : `${l} ${ast.op} ${r}`;
    }
  }
}
