/**
 * The one operator table of the formula language, read by the parser (binding powers) and by the
 * printer (where parentheses are needed): each binary operator's precedence and associativity, and the
 * precedence of the prefix signs. Higher binds tighter.
 *
 * Prefix `-` and `+` sit between `* /` and `^`: `-x^2` is `-(x^2)`, `-x*y` is `(-x)*y`, and the right
 * operand of `^` may itself start with a sign (`2^-1` is `2^(-1)`).
 */
import type { BinaryOperator } from './ast';

export interface OperatorInfo {
  readonly precedence: number;
  readonly associativity: 'left' | 'right';
}

export const BINARY_OPERATORS: Readonly<Record<BinaryOperator, OperatorInfo>> = {
  '+': { precedence: 1, associativity: 'left' },
  '-': { precedence: 1, associativity: 'left' },
  '*': { precedence: 2, associativity: 'left' },
  '/': { precedence: 2, associativity: 'left' },
  '^': { precedence: 4, associativity: 'right' },
};

/** Prefix `-` and `+`. */
export const PREFIX_PRECEDENCE = 3;

/** Numbers, names, calls and parenthesised expressions: tighter than any operator. */
export const ATOM_PRECEDENCE = 5;
