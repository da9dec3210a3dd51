import type { Expr, Span } from '../expr';

/**
 * The syntax tree of an update rule: a list of statements, one per line, each with spans into the
 * whole rule text (the right-hand sides are formula-language trees whose spans are shifted likewise).
 */

/** `hyper beta1 = 0.9`: a setting with its default (an expression of numbers only). */
export interface HyperStatement {
  readonly kind: 'hyper';
  readonly name: string;
  readonly nameSpan: Span;
  readonly value: Expr;
  readonly span: Span;
}

/** `state m = 0`: a per-parameter state variable and its initial value (numbers, settings and `x`). */
export interface StateStatement {
  readonly kind: 'state';
  readonly name: string;
  readonly nameSpan: Span;
  readonly value: Expr;
  readonly span: Span;
}

/** `let c = ...`: a per-parameter value computed afresh on every step (not kept between steps). */
export interface LetStatement {
  readonly kind: 'let';
  readonly name: string;
  readonly nameSpan: Span;
  readonly value: Expr;
  readonly span: Span;
}

/** `m = ...` (a state variable) or `x = ...` (the new point). */
export interface AssignStatement {
  readonly kind: 'assign';
  readonly name: string;
  readonly nameSpan: Span;
  readonly value: Expr;
  readonly span: Span;
}

export type Statement = HyperStatement | StateStatement | LetStatement | AssignStatement;

export interface RuleAst {
  readonly statements: readonly Statement[];
}
