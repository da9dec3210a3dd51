import type { Span } from '../expr';
import type { ReductionName } from './functions';

/**
 * The checked form of a rule: every name resolved to what it refers to, ready for code generation.
 * Nothing here holds user text except `name` fields kept for messages and the page; code generation
 * reads only the kinds, indices, operators and numbers.
 */

/** What a name in a rule refers to. */
export type Ref =
  | { readonly kind: 'hyper'; readonly index: number }
  | { readonly kind: 'state'; readonly index: number }
  | { readonly kind: 'local'; readonly index: number }
  /** g: the gradient at the point (after any clipping or L2 penalty of the spec). */
  | { readonly kind: 'grad' }
  /** x: the point (before the step until the rule assigns it). */
  | { readonly kind: 'point' }
  /** t: the 1-based step counter. */
  | { readonly kind: 'step' }
  /** lr: the scheduled learning rate at step t. */
  | { readonly kind: 'rate' };

export type BinaryOp = '+' | '-' | '*' | '/' | '^';

export type Node =
  | { readonly op: 'num'; readonly value: number }
  | { readonly op: 'ref'; readonly ref: Ref }
  | { readonly op: 'neg'; readonly a: Node }
  | { readonly op: 'bin'; readonly o: BinaryOp; readonly a: Node; readonly b: Node }
  /** An element-wise function: a kernel of the formula language or `clip`. */
  | { readonly op: 'call'; readonly fn: string; readonly args: readonly Node[] }
  | { readonly op: 'reduce'; readonly fn: ReductionName; readonly args: readonly Node[] };

export interface HyperInfo {
  readonly name: string;
  readonly default: number;
  readonly span: Span;
}

export interface StateInfo {
  readonly name: string;
  readonly init: Node;
  readonly span: Span;
}

/** One per-step statement: `target = value`, element-wise. */
export interface StepStatement {
  readonly target: Ref & { kind: 'state' | 'local' | 'point' };
  readonly value: Node;
  readonly line: number;
}

export interface CheckedRule {
  readonly hypers: readonly HyperInfo[];
  readonly states: readonly StateInfo[];
  readonly localCount: number;
  readonly steps: readonly StepStatement[];
}

/** Whether a node reads anything that differs between parameters (x, g, a state or a let value). */
export function isElementwise(node: Node): boolean {
  switch (node.op) {
    case 'num':
      return false;
    case 'ref':
      return node.ref.kind === 'grad' || node.ref.kind === 'point' || node.ref.kind === 'state' || node.ref.kind === 'local';
    case 'neg':
      return isElementwise(node.a);
    case 'bin':
      return isElementwise(node.a) || isElementwise(node.b);
    case 'call':
      return node.args.some(isElementwise);
    case 'reduce':
      return false;
  }
}

/** Every reduction in a node, outermost first, left to right. */
export function reductionsIn(node: Node, out: Node[] = []): Node[] {
  switch (node.op) {
    case 'reduce':
      out.push(node);
      break;
    case 'neg':
      reductionsIn(node.a, out);
      break;
    case 'bin':
      reductionsIn(node.a, out);
      reductionsIn(node.b, out);
      break;
    case 'call':
      node.args.forEach((a) => reductionsIn(a, out));
      break;
  }
  return out;
}

/** Every reference a node reads. */
export function refsIn(node: Node, out: Ref[] = []): Ref[] {
  switch (node.op) {
    case 'ref':
      out.push(node.ref);
      break;
    case 'neg':
      refsIn(node.a, out);
      break;
    case 'bin':
      refsIn(node.a, out);
      refsIn(node.b, out);
      break;
    case 'call':
    case 'reduce':
      node.args.forEach((a) => refsIn(a, out));
      break;
  }
  return out;
}
