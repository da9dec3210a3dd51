import { BINARY_KERNELS, UNARY_KERNELS, type UnaryKernelName } from './primitives';

/**
 * The expression graph the compiler works on: a hash-consed DAG. Building a node that already exists
 * returns the existing one, so equal subexpressions (in the formula, in its derivatives, and between
 * the two) are one node, and the generated code computes each once: common-subexpression elimination
 * by construction.
 *
 * Node ids are array indices and every node's operands have smaller ids, so ascending id order is an
 * evaluation order.
 *
 * The constructors here preserve the value exactly as the tree-walking evaluator computes it: they fold
 * an operation whose operands are all numbers (with the same JavaScript arithmetic, so the folded value
 * is the one the code would compute, and only when it is finite), and order the operands of `+` and `*`
 * (IEEE addition and multiplication commute exactly). No algebra that could change a value (x*0 -> 0
 * fails for x = Infinity) happens here; the differentiator adds those simplifications for derivative
 * terms only (derive.ts).
 */

export type NodeId = number;

export type ArithmeticOp = 'add' | 'sub' | 'mul' | 'div' | 'pow' | 'min' | 'max';

/** `a <= b` or `a < b`. */
export type Comparison = '<=' | '<';

export type GraphNode =
  /** A finite number. */
  | { readonly op: 'const'; readonly value: number }
  /** x[index]: a differentiated variable (a surface coordinate or a model parameter). */
  | { readonly op: 'var'; readonly index: number }
  /** v[index]: a per-row data input of a model (not differentiated). */
  | { readonly op: 'input'; readonly index: number }
  /** c[index]: a named constant, read from an array so new values need no recompilation. */
  | { readonly op: 'param'; readonly index: number }
  | { readonly op: ArithmeticOp; readonly a: NodeId; readonly b: NodeId }
  | { readonly op: 'neg'; readonly a: NodeId }
  | { readonly op: 'call'; readonly fn: UnaryKernelName; readonly a: NodeId }
  /** `a <test> b ? then : otherwise`: the branch choice in derivatives of min, max, relu, elu. */
  | {
      readonly op: 'select';
      readonly test: Comparison;
      readonly a: NodeId;
      readonly b: NodeId;
      readonly then: NodeId;
      readonly otherwise: NodeId;
    };

function constantKey(value: number): string {
  return Object.is(value, -0) ? 'k-0' : `k${value}`;
}

function arithmetic(op: ArithmeticOp, a: number, b: number): number {
  switch (op) {
    case 'add':
      return a + b;
    case 'sub':
      return a - b;
    case 'mul':
      return a * b;
    case 'div':
      return a / b;
    case 'pow':
      return BINARY_KERNELS.pow(a, b);
    case 'min':
      return BINARY_KERNELS.min(a, b);
    case 'max':
      return BINARY_KERNELS.max(a, b);
  }
}

export class Graph {
  private readonly list: GraphNode[] = [];
  private readonly byKey = new Map<string, NodeId>();

  get nodes(): readonly GraphNode[] {
    return this.list;
  }

  node(id: NodeId): GraphNode {
    return this.list[id];
  }

  /** The number at `id` if it is a constant node. */
  constantValue(id: NodeId): number | undefined {
    const node = this.list[id];
    return node.op === 'const' ? node.value : undefined;
  }

  private intern(key: string, node: GraphNode): NodeId {
    const found = this.byKey.get(key);
    if (found !== undefined) return found;
    const id = this.list.length;
    this.list.push(node);
    this.byKey.set(key, id);
    return id;
  }

  constant(value: number): NodeId {
    if (!Number.isFinite(value)) throw new RangeError(`graph constants must be finite, got ${value}`);
    return this.intern(constantKey(value), { op: 'const', value });
  }

  variable(index: number): NodeId {
    return this.intern(`x${index}`, { op: 'var', index });
  }

  input(index: number): NodeId {
    return this.intern(`v${index}`, { op: 'input', index });
  }

  param(index: number): NodeId {
    return this.intern(`c${index}`, { op: 'param', index });
  }

  /** Folds to a constant when the value is finite; otherwise leaves the operation to run time. */
  private folded(value: number): NodeId | undefined {
    return Number.isFinite(value) ? this.constant(value) : undefined;
  }

  binary(op: ArithmeticOp, a: NodeId, b: NodeId): NodeId {
    const ka = this.constantValue(a);
    const kb = this.constantValue(b);
    if (ka !== undefined && kb !== undefined) {
      const folded = this.folded(arithmetic(op, ka, kb));
      if (folded !== undefined) return folded;
    }
    if ((op === 'add' || op === 'mul') && b < a) [a, b] = [b, a];
    return this.intern(`${op}:${a}:${b}`, { op, a, b });
  }

  add(a: NodeId, b: NodeId): NodeId {
    return this.binary('add', a, b);
  }

  sub(a: NodeId, b: NodeId): NodeId {
    return this.binary('sub', a, b);
  }

  mul(a: NodeId, b: NodeId): NodeId {
    return this.binary('mul', a, b);
  }

  div(a: NodeId, b: NodeId): NodeId {
    return this.binary('div', a, b);
  }

  pow(a: NodeId, b: NodeId): NodeId {
    return this.binary('pow', a, b);
  }

  neg(a: NodeId): NodeId {
    const ka = this.constantValue(a);
    if (ka !== undefined) return this.constant(-ka);
    return this.intern(`neg:${a}`, { op: 'neg', a });
  }

  call(fn: UnaryKernelName, a: NodeId): NodeId {
    const ka = this.constantValue(a);
    if (ka !== undefined) {
      const folded = this.folded(UNARY_KERNELS[fn](ka));
      if (folded !== undefined) return folded;
    }
    return this.intern(`${fn}(${a})`, { op: 'call', fn, a });
  }

  select(test: Comparison, a: NodeId, b: NodeId, then: NodeId, otherwise: NodeId): NodeId {
    const ka = this.constantValue(a);
    const kb = this.constantValue(b);
    if (ka !== undefined && kb !== undefined) return (test === '<=' ? ka <= kb : ka < kb) ? then : otherwise;
    if (then === otherwise) return then;
    return this.intern(`?${test}:${a}:${b}:${then}:${otherwise}`, { op: 'select', test, a, b, then, otherwise });
  }

  /** Operand ids of a node. */
  operands(id: NodeId): NodeId[] {
    const node = this.list[id];
    switch (node.op) {
      case 'const':
      case 'var':
      case 'input':
      case 'param':
        return [];
      case 'neg':
      case 'call':
        return [node.a];
      case 'select':
        return [node.a, node.b, node.then, node.otherwise];
      default:
        return [node.a, node.b];
    }
  }

  /** Marks every node that `roots` depend on (including the roots). */
  reachable(roots: readonly NodeId[]): Uint8Array {
    const seen = new Uint8Array(this.list.length);
    const stack = [...roots];
    while (stack.length > 0) {
      const id = stack.pop()!;
      if (seen[id]) continue;
      seen[id] = 1;
      stack.push(...this.operands(id));
    }
    return seen;
  }
}
