/**
 * The functions and constants of the formula language as the parser and the evaluator see them (names,
 * arity, summaries), built from the primitives table (primitives.ts).
 */
import { UNARY_PRIMITIVES, VARIADIC_PRIMITIVES } from './primitives';

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

const ALL: FunctionInfo[] = [
  ...Object.entries(UNARY_PRIMITIVES).map(([name, p]): FunctionInfo => ({
    name,
    minArgs: 1,
    maxArgs: 1,
    summary: p.summary,
    evaluate: (args) => p.kernel(args[0]),
  })),
  ...Object.entries(VARIADIC_PRIMITIVES).map(([name, p]): FunctionInfo => ({
    name,
    minArgs: 2,
    maxArgs: Infinity,
    summary: p.summary,
    evaluate: (args) => args.reduce((acc, v) => p.kernel(acc, v)),
  })),
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
