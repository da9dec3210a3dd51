/**
 * Our tree as mathjs 15.2.0 expression text, for checks against mathjs's symbolic `derivative`.
 * Built on printFormula (fully parenthesised, the same operators and precedence as mathjs); functions
 * mathjs lacks, or cannot differentiate, are written out by their definitions:
 *   sigmoid(u) = 1 / (1 + exp(-u)),  softplus(u) = log(1 + exp(u)),  relu(u) = (u + abs(u)) / 2,
 *   min(a, b) = (a + b - abs(a - b)) / 2,  max(a, b) = (a + b + abs(a - b)) / 2  (nested from the left),
 *   log1p(u) = log(1 + u),  expm1(u) = exp(u) - 1.
 * These identities hold everywhere; their derivatives agree with ours away from ties and kinks.
 */
import type { Expr } from '../../../src/engine/expr';
import { printFormula } from '../../../src/engine/expr';
import { bin, call, num, un } from './arbitraries';

function rewrite(ast: Expr): Expr {
  switch (ast.kind) {
    case 'number':
    case 'name':
      return ast;
    case 'unary':
      return un(ast.op, rewrite(ast.operand));
    case 'binary':
      return bin(ast.op, rewrite(ast.left), rewrite(ast.right));
    case 'call': {
      const args = ast.args.map(rewrite);
      const [u] = args;
      switch (ast.name) {
        case 'sigmoid':
          return bin('/', num(1), bin('+', num(1), call('exp', un('-', u))));
        case 'softplus':
          return call('log', bin('+', num(1), call('exp', u)));
        case 'relu':
          return bin('/', bin('+', u, call('abs', u)), num(2));
        case 'log1p':
          return call('log', bin('+', num(1), u));
        case 'expm1':
          return bin('-', call('exp', u), num(1));
        case 'min':
        case 'max': {
          const sign = ast.name === 'min' ? '-' : '+';
          return args.slice(1).reduce((a, b) => bin('/', bin(sign, bin('+', a, b), call('abs', bin('-', a, b))), num(2)), args[0]);
        }
        case 'sign':
        case 'elu':
          throw new Error(`no mathjs translation for ${ast.name}`);
        default:
          return call(ast.name, ...args);
      }
    }
  }
}

export function toMathjsText(ast: Expr): string {
  return printFormula(rewrite(ast));
}
