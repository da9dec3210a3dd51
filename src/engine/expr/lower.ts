import type { BinaryOperator, Expr } from './ast';
import { BUILTIN_CONSTANTS } from './functions';
import type { Graph, NodeId } from './graph';
import { isUnaryKernelName } from './primitives';

/**
 * Translates a validated tree into graph nodes. `resolve` maps each free name to its leaf (a variable,
 * an input or a named constant); `pi` and `e` become numbers. n-ary min and max become nested pairs
 * from the left: min(a, b, c) = min(min(a, b), c). Unary plus is the operand itself.
 */
export function lowerFormula(g: Graph, ast: Expr, resolve: (name: string) => NodeId): NodeId {
  const visit = (node: Expr): NodeId => {
    switch (node.kind) {
      case 'number':
        return g.constant(node.value);
      case 'name': {
        const builtin = BUILTIN_CONSTANTS.get(node.name);
        return builtin !== undefined ? g.constant(builtin) : resolve(node.name);
      }
      case 'unary': {
        const operand = visit(node.operand);
        return node.op === '-' ? g.neg(operand) : operand;
      }
      case 'binary':
        return lowerBinary(g, node.op, visit(node.left), visit(node.right));
      case 'call': {
        const args = node.args.map(visit);
        if (node.name === 'min' || node.name === 'max') {
          const op = node.name;
          return args.slice(1).reduce((acc, arg) => g.binary(op, acc, arg), args[0]);
        }
        if (!isUnaryKernelName(node.name) || args.length !== 1) {
          throw new Error(`lowerFormula: unvalidated call '${node.name}' with ${args.length} arguments`);
        }
        return g.call(node.name, args[0]);
      }
    }
  };
  return visit(ast);
}

function lowerBinary(g: Graph, op: BinaryOperator, a: NodeId, b: NodeId): NodeId {
  switch (op) {
    case '+':
      return g.add(a, b);
    case '-':
      return g.sub(a, b);
    case '*':
      return g.mul(a, b);
    case '/':
      return g.div(a, b);
    case '^':
      return g.pow(a, b);
  }
}
