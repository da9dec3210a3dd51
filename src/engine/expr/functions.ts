import { UNARY_KERNELS, type UnaryKernelName } from './kernels';

/** How many arguments a function takes. */
export interface Arity {
  readonly minArgs: number;
  /** `Infinity` for the variadic `min` and `max`. */
  readonly maxArgs: number;
}

/** A function the formula language knows: its name, how many arguments it takes, what it computes. */
export interface FunctionInfo extends Arity {
  readonly name: string;
  /** One line for help texts. */
  readonly summary: string;
  /** The value, used by the tree-walking evaluator and by constant folding. */
  readonly evaluate: (args: readonly number[]) => number;
}

const UNARY_SUMMARIES: Record<UnaryKernelName, string> = {
  sin: 'sine (radians)',
  cos: 'cosine (radians)',
  tan: 'tangent (radians)',
  asin: 'inverse sine, argument in [-1, 1]',
  acos: 'inverse cosine, argument in [-1, 1]',
  atan: 'inverse tangent',
  sinh: 'hyperbolic sine',
  cosh: 'hyperbolic cosine',
  tanh: 'hyperbolic tangent',
  exp: 'exponential e^x',
  expm1: 'exp(x) - 1, accurate near 0',
  log: 'natural logarithm',
  log1p: 'log(1 + x), accurate near 0',
  sqrt: 'square root',
  abs: 'absolute value (derivative 0 at 0)',
  sign: 'sign: -1, 0 or 1 (derivative 0)',
  sigmoid: 'logistic 1 / (1 + exp(-x))',
  softplus: 'log(1 + exp(x)), computed without overflow',
  relu: 'max(x, 0) (derivative 0 at 0)',
  elu: 'x for x > 0, exp(x) - 1 otherwise',
};

function unary(name: UnaryKernelName): FunctionInfo {
  const kernel = UNARY_KERNELS[name];
  return { name, minArgs: 1, maxArgs: 1, summary: UNARY_SUMMARIES[name], evaluate: (args) => kernel(args[0]) };
}

const ALL: FunctionInfo[] = [
  ...(Object.keys(UNARY_KERNELS) as UnaryKernelName[]).map(unary),
  {
    name: 'min',
    minArgs: 2,
    maxArgs: Infinity,
    summary: 'smallest argument (the derivative follows the first smallest one)',
    evaluate: (args) => Math.min(...args),
  },
  {
    name: 'max',
    minArgs: 2,
    maxArgs: Infinity,
    summary: 'largest argument (the derivative follows the first largest one)',
    evaluate: (args) => Math.max(...args),
  },
];

/** Every function of the language by name. A Map, so `constructor` or `toString` never resolve. */
export const FUNCTIONS: ReadonlyMap<string, FunctionInfo> = new Map(ALL.map((f) => [f.name, f]));

/** The built-in constants. */
export const BUILTIN_CONSTANTS: ReadonlyMap<string, number> = new Map([
  ['pi', Math.PI],
  ['e', Math.E],
]);

/** Names people often reach for, with what to write instead. */
export const FUNCTION_HINTS: ReadonlyMap<string, string> = new Map([
  ['ln', 'log'],
  ['arcsin', 'asin'],
  ['arccos', 'acos'],
  ['arctan', 'atan'],
  ['logistic', 'sigmoid'],
  ['pow', 'a^b'],
  ['sqr', 'x^2'],
  ['square', 'x^2'],
  ['log10', 'log(x) / log(10)'],
  ['log2', 'log(x) / log(2)'],
]);

/** "1 argument", "2 or more arguments", "1 to 3 arguments". */
export function describeArity(f: Arity): string {
  if (f.minArgs === f.maxArgs) return `${f.minArgs} argument${f.minArgs === 1 ? '' : 's'}`;
  if (f.maxArgs === Infinity) return `${f.minArgs} or more arguments`;
  return `${f.minArgs} to ${f.maxArgs} arguments`;
}
