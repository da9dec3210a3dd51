import { KERNEL_TABLE, isKernelName } from '../expr';
import { power } from '../power';
import { clip } from './functions';
import type { Node, Ref } from './ir';

/** The value of a kernel or `clip` at numeric arguments; `min`/`max` fold from the left. */
export function applyFunction(fn: string, args: readonly number[]): number | undefined {
  if (fn === 'clip') return clip(args[0], args[1], args[2]);
  if (!isKernelName(fn)) return undefined;
  const kernel = KERNEL_TABLE[fn];
  if (fn === 'min' || fn === 'max' || fn === 'pow') return args.slice(1).reduce((acc, v) => kernel(acc, v), args[0]);
  return kernel(args[0]);
}

export function applyBinary(o: string, a: number, b: number): number {
  switch (o) {
    case '+':
      return a + b;
    case '-':
      return a - b;
    case '*':
      return a * b;
    case '/':
      return a / b;
    default:
      // As the generated code computes a^b (codegen.ts: a * a, else the pow kernel, which gives
      // power's doubles): products only, so a folded value is the same in every engine.
      return power(a, b);
  }
}

/**
 * The value of a node when everything it reads is known (`lookup` answers undefined for unknowns),
 * else undefined. Reductions are never known here. Computed as the generated code computes it.
 */
export function evaluateConstant(node: Node, lookup: (ref: Ref) => number | undefined = () => undefined): number | undefined {
  switch (node.op) {
    case 'num':
      return node.value;
    case 'ref':
      return lookup(node.ref);
    case 'neg': {
      const a = evaluateConstant(node.a, lookup);
      return a === undefined ? undefined : -a;
    }
    case 'bin': {
      const a = evaluateConstant(node.a, lookup);
      const b = evaluateConstant(node.b, lookup);
      return a === undefined || b === undefined ? undefined : applyBinary(node.o, a, b);
    }
    case 'call': {
      const args = node.args.map((a) => evaluateConstant(a, lookup));
      return args.every((a): a is number => a !== undefined) ? applyFunction(node.fn, args) : undefined;
    }
    case 'reduce':
      return undefined;
  }
}
