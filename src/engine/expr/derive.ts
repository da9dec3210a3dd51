import type { Comparison, Graph, NodeId } from './graph';
import { isUnaryKernelName, UNARY_PRIMITIVES, VARIADIC_PRIMITIVES, type DerivativeTerms } from './primitives';

/**
 * Symbolic differentiation on the expression graph: d(node)/d(x_k) is built as new graph nodes by the
 * usual rules (each function's own rule is in the primitives table, primitives.ts), memoised per
 * (node, k), so the gradient reuses the value's subexpressions and each
 * Hessian entry d(d f/d x_i)/d x_j reuses the gradient's. Exact derivatives, no finite differences.
 *
 * Derivative terms are simplified with structural zeros and ones (0 * u -> 0, 1 * u -> u, u + 0 -> u,
 * u^1 -> u): the standard convention of automatic differentiation, where a term that does not depend
 * on x_k contributes nothing even if its value is infinite.
 *
 * Conventions at points where a function is not differentiable:
 * - abs'(0) = 0 (sign(0)), relu'(0) = 0, sign' = 0 everywhere;
 * - min(a, b) follows a when a <= b, max(a, b) follows a when a >= b: at a tie the first argument's
 *   derivative is taken (n-ary calls are nested pairs from the left, so the first tied argument wins);
 * - elu'(0) = 1 (both one-sided derivatives are 1 there);
 * - sqrt'(0) = 0.5 / 0 = Infinity, log'(0) = Infinity, and so on: such points give a non-finite
 *   gradient, which the run loop reports as divergence;
 * - a^b with b free of x_k uses b * a^(b-1) (so (-2)^2 differentiates fine); with a free of x_k it uses
 *   a^b * log(a); when both depend on x_k it uses a^b * (b' log(a) + b a' / a), which is NaN for a <= 0.
 */
export class Differentiator {
  private readonly memo: Map<NodeId, NodeId>[] = [];
  private readonly zero: NodeId;
  private readonly one: NodeId;

  /** The constructors the primitives' derivative rules build with (primitives.ts). */
  private readonly terms: DerivativeTerms<NodeId>;

  constructor(private readonly g: Graph) {
    this.zero = g.constant(0);
    this.one = g.constant(1);
    this.terms = {
      zero: this.zero,
      one: this.one,
      constant: (value) => g.constant(value),
      call: (fn, u) => {
        if (!isUnaryKernelName(fn)) throw new Error(`derivative rule: unknown function '${fn}'`);
        return g.call(fn, u);
      },
      add: (a, b) => this.add(a, b),
      sub: (a, b) => this.sub(a, b),
      mul: (a, b) => this.mul(a, b),
      div: (a, b) => this.div(a, b),
      neg: (a) => this.neg(a),
      select: (test, a, b, then, otherwise) => this.select(test, a, b, then, otherwise),
    };
  }

  /** d(node)/d(x_k). */
  derivative(node: NodeId, k: number): NodeId {
    const memo = (this.memo[k] ??= new Map());
    const known = memo.get(node);
    if (known !== undefined) return known;
    const result = this.rule(node, k);
    memo.set(node, result);
    return result;
  }

  /** [d f/d x_0, ..., d f/d x_{n-1}]. */
  gradient(f: NodeId, n: number): NodeId[] {
    return Array.from({ length: n }, (_, k) => this.derivative(f, k));
  }

  /** Upper triangle of the Hessian, row-major: entries (0,0), (0,1), ..., (0,n-1), (1,1), ... */
  hessianUpper(gradient: readonly NodeId[]): NodeId[] {
    const n = gradient.length;
    const upper: NodeId[] = [];
    for (let i = 0; i < n; i++) for (let j = i; j < n; j++) upper.push(this.derivative(gradient[i], j));
    return upper;
  }

  private rule(id: NodeId, k: number): NodeId {
    const node = this.g.node(id);
    switch (node.op) {
      case 'const':
      case 'input':
      case 'param':
        return this.zero;
      case 'var':
        return node.index === k ? this.one : this.zero;
      case 'add':
        return this.add(this.derivative(node.a, k), this.derivative(node.b, k));
      case 'sub':
        return this.sub(this.derivative(node.a, k), this.derivative(node.b, k));
      case 'neg':
        return this.neg(this.derivative(node.a, k));
      case 'mul':
        return this.add(this.mul(this.derivative(node.a, k), node.b), this.mul(node.a, this.derivative(node.b, k)));
      case 'div': {
        // (a/b)' = (a' - (a/b) b') / b
        const da = this.derivative(node.a, k);
        const db = this.derivative(node.b, k);
        return this.div(this.sub(da, this.mul(id, db)), node.b);
      }
      case 'pow':
        return this.power(id, node.a, node.b, k);
      case 'min':
      case 'max':
        return VARIADIC_PRIMITIVES[node.op].derivative(this.terms, node.a, node.b, this.derivative(node.a, k), this.derivative(node.b, k));
      case 'select':
        return this.select(node.test, node.a, node.b, this.derivative(node.then, k), this.derivative(node.otherwise, k));
      case 'call': {
        const da = this.derivative(node.a, k);
        if (this.isZero(da)) return this.zero;
        return this.mul(UNARY_PRIMITIVES[node.fn].derivative(this.terms, node.a, id), da);
      }
    }
  }

  private power(self: NodeId, a: NodeId, b: NodeId, k: number): NodeId {
    const da = this.derivative(a, k);
    const db = this.derivative(b, k);
    if (this.isZero(db)) {
      if (this.isZero(da)) return this.zero;
      return this.mul(this.mul(b, this.pow(a, this.g.sub(b, this.one))), da);
    }
    const logA = this.g.call('log', a);
    if (this.isZero(da)) return this.mul(this.mul(self, logA), db);
    return this.mul(self, this.add(this.mul(db, logA), this.div(this.mul(b, da), a)));
  }

  // Simplifying constructors for derivative terms (see the class comment).

  private isZero(id: NodeId): boolean {
    return this.g.constantValue(id) === 0;
  }

  private isOne(id: NodeId): boolean {
    return this.g.constantValue(id) === 1;
  }

  private add(a: NodeId, b: NodeId): NodeId {
    if (this.isZero(a)) return b;
    if (this.isZero(b)) return a;
    const na = this.g.node(a);
    const nb = this.g.node(b);
    if (nb.op === 'neg') return this.sub(a, nb.a); // a + (-u) = a - u
    if (na.op === 'neg') return this.sub(b, na.a);
    return this.g.add(a, b);
  }

  private sub(a: NodeId, b: NodeId): NodeId {
    if (this.isZero(b)) return a;
    if (this.isZero(a)) return this.neg(b);
    const nb = this.g.node(b);
    if (nb.op === 'neg') return this.add(a, nb.a); // a - (-u) = a + u
    return this.g.sub(a, b);
  }

  private neg(a: NodeId): NodeId {
    const node = this.g.node(a);
    if (node.op === 'neg') return node.a;
    if (node.op === 'sub') return this.g.sub(node.b, node.a); // -(u - w) = w - u, exactly
    const [k, rest] = this.split(a);
    if (rest !== undefined && k !== 1) return this.scaled(-k, rest); // -(k u) = (-k) u
    return this.g.neg(a);
  }

  /**
   * Products keep at most one numeric coefficient, in front: (k1 u) (k2 w) = (k1 k2) (u w), and a
   * negation counts as the coefficient -1. So 100 * (2 * (-(2 * x))) becomes -400 * x.
   */
  private mul(a: NodeId, b: NodeId): NodeId {
    if (this.isZero(a) || this.isZero(b)) return this.zero;
    const [ka, ra] = this.split(a);
    const [kb, rb] = this.split(b);
    const k = ka * kb;
    if (!Number.isFinite(k)) return this.g.mul(a, b);
    if (ra === undefined && rb === undefined) return this.g.constant(k);
    const rest = ra === undefined ? rb! : rb === undefined ? ra : this.g.mul(ra, rb);
    return this.scaled(k, rest);
  }

  /** k * u with the trivial coefficients written out. */
  private scaled(k: number, u: NodeId): NodeId {
    if (k === 1) return u;
    if (k === -1) return this.g.neg(u);
    if (k === 0) return this.zero;
    return this.g.mul(this.g.constant(k), u);
  }

  /** A node as coefficient * rest: a number is [k, none], k * u is [k, u], -u is [-k', u'], else [1, node]. */
  private split(id: NodeId): [number, NodeId | undefined] {
    const node = this.g.node(id);
    if (node.op === 'const') return [node.value, undefined];
    if (node.op === 'neg') {
      const [k, rest] = this.splitProduct(node.a);
      return [-k, rest];
    }
    return this.splitProduct(id);
  }

  private splitProduct(id: NodeId): [number, NodeId] {
    const node = this.g.node(id);
    if (node.op === 'mul') {
      const ka = this.g.constantValue(node.a);
      if (ka !== undefined) return [ka, node.b];
      const kb = this.g.constantValue(node.b);
      if (kb !== undefined) return [kb, node.a];
    }
    return [1, id];
  }

  private div(a: NodeId, b: NodeId): NodeId {
    if (this.isZero(a)) return this.zero;
    if (this.isOne(b)) return a;
    return this.g.div(a, b);
  }

  private pow(a: NodeId, b: NodeId): NodeId {
    if (this.isOne(b)) return a;
    if (this.isZero(b)) return this.one;
    return this.g.pow(a, b);
  }

  private select(test: Comparison, a: NodeId, b: NodeId, then: NodeId, otherwise: NodeId): NodeId {
    return this.g.select(test, a, b, then, otherwise);
  }
}
