/**
 * The syntax tree of a formula. Every node carries the source span it was parsed from, so errors found
 * after parsing (unknown variable, wrong argument count) can point at the exact characters.
 *
 * Parentheses leave no node of their own: `(x + 1)` and `x + 1` give the same tree.
 */

/** A half-open range of UTF-16 offsets into the formula text: 0-based `start`, exclusive `end`. */
export interface Span {
  start: number;
  end: number;
}

/** A numeric literal as written. Parsed literals are finite and non-negative (a minus sign is a unary node). */
export interface NumberExpr {
  readonly kind: 'number';
  readonly value: number;
  readonly span: Span;
}

/** An identifier used as a value: a variable, a named constant, or one of the built-ins `pi` and `e`. */
export interface NameExpr {
  readonly kind: 'name';
  readonly name: string;
  readonly span: Span;
}

export type UnaryOperator = '-' | '+';

export interface UnaryExpr {
  readonly kind: 'unary';
  readonly op: UnaryOperator;
  readonly operand: Expr;
  readonly span: Span;
}

export type BinaryOperator = '+' | '-' | '*' | '/' | '^';

export interface BinaryExpr {
  readonly kind: 'binary';
  readonly op: BinaryOperator;
  readonly left: Expr;
  readonly right: Expr;
  readonly span: Span;
}

/** A call of a built-in function, e.g. `max(x, y, 0)`. */
export interface CallExpr {
  readonly kind: 'call';
  readonly name: string;
  readonly args: readonly Expr[];
  readonly span: Span;
}

export type Expr = NumberExpr | NameExpr | UnaryExpr | BinaryExpr | CallExpr;

/** True when two trees have the same shape, operators, names and numbers; spans are ignored. */
export function sameTree(a: Expr, b: Expr): boolean {
  switch (a.kind) {
    case 'number':
      return b.kind === 'number' && Object.is(a.value, b.value);
    case 'name':
      return b.kind === 'name' && a.name === b.name;
    case 'unary':
      return b.kind === 'unary' && a.op === b.op && sameTree(a.operand, b.operand);
    case 'binary':
      return b.kind === 'binary' && a.op === b.op && sameTree(a.left, b.left) && sameTree(a.right, b.right);
    case 'call':
      return (
        b.kind === 'call' &&
        a.name === b.name &&
        a.args.length === b.args.length &&
        a.args.every((arg, i) => sameTree(arg, b.args[i]))
      );
  }
}

/** The direct children of a node, left to right. */
export function childrenOf(node: Expr): readonly Expr[] {
  switch (node.kind) {
    case 'number':
    case 'name':
      return [];
    case 'unary':
      return [node.operand];
    case 'binary':
      return [node.left, node.right];
    case 'call':
      return node.args;
  }
}
