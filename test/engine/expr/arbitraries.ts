/**
 * Tree builders and fast-check generators of random formulas for the formula-language tests.
 */
import fc from 'fast-check';
import type { BinaryOperator, Expr, UnaryOperator } from '../../../src/engine/expr';
import { FUNCTIONS, UNARY_PRIMITIVES, VARIADIC_PRIMITIVES } from '../../../src/engine/expr';

const NO_SPAN = { start: 0, end: 0 };

export const num = (value: number): Expr => ({ kind: 'number', value, span: NO_SPAN });
export const name = (n: string): Expr => ({ kind: 'name', name: n, span: NO_SPAN });
export const un = (op: UnaryOperator, operand: Expr): Expr => ({ kind: 'unary', op, operand, span: NO_SPAN });
export const bin = (op: BinaryOperator, left: Expr, right: Expr): Expr => ({ kind: 'binary', op, left, right, span: NO_SPAN });
export const call = (fn: string, ...args: Expr[]): Expr => ({ kind: 'call', name: fn, args, span: NO_SPAN });

const BINARY_OPERATORS: BinaryOperator[] = ['+', '-', '*', '/', '^'];

/** Identifiers that are not function names (the parser reads `sin` alone as a misused function). */
const identifier = fc
  .stringMatching(/^[A-Za-z_][A-Za-z0-9_]{0,6}$/)
  .filter((s) => !FUNCTIONS.has(s));

/** Any non-negative finite double, weighted towards everyday literals but reaching 5e-324 and 1.8e308. */
const literal = fc.oneof(
  { arbitrary: fc.integer({ min: 0, max: 1000 }), weight: 4 },
  { arbitrary: fc.double({ min: 0, max: 1e6, noNaN: true, noDefaultInfinity: true }), weight: 2 },
  { arbitrary: fc.double({ min: 0, max: Number.MAX_VALUE, noNaN: true, noDefaultInfinity: true }), weight: 1 },
  { arbitrary: fc.constantFrom(0.5, 1e-7, 1e21, 2.5e-8, 5e-324), weight: 1 },
).map((v) => Math.abs(v));

/**
 * A tree of at most `depth` levels: a leaf, or (three times in four) a node over smaller trees. Written
 * out by hand rather than with fc.letrec so that trees are usually several levels deep.
 */
function treeOf(depth: number, leaf: fc.Arbitrary<Expr>, node: (sub: fc.Arbitrary<Expr>) => fc.Arbitrary<Expr>[]): fc.Arbitrary<Expr> {
  if (depth <= 1) return leaf;
  const sub = treeOf(depth - 1, leaf, node);
  return fc.oneof({ arbitrary: leaf, weight: 1 }, ...node(sub).map((arbitrary) => ({ arbitrary, weight: 3 })));
}

/** Every syntactically valid tree: any names, literals, operators, and calls with a valid argument count. */
export const anyFormula: fc.Arbitrary<Expr> = treeOf(
  5,
  fc.oneof(
    { arbitrary: literal.map(num), weight: 1 },
    { arbitrary: fc.oneof(identifier, fc.constantFrom('x', 'y', 'pi', 'e')).map(name), weight: 2 },
  ),
  (sub) => [
    fc.tuple(fc.constantFrom<UnaryOperator>('-', '+'), sub).map(([op, e]) => un(op, e)),
    fc.tuple(fc.constantFrom(...BINARY_OPERATORS), sub, sub).map(([op, l, r]) => bin(op, l, r)),
    fc.tuple(fc.constantFrom(...FUNCTIONS.keys()), fc.array(sub, { minLength: 1, maxLength: 3 })).map(([fn, args]) => {
      const info = FUNCTIONS.get(fn)!;
      const count = Math.min(Math.max(args.length, info.minArgs), info.maxArgs);
      while (args.length < count) args.push(args[0]);
      return call(fn, ...args.slice(0, count));
    }),
  ],
);

/** Function families for the numeric generator. */
export type FunctionFamily = 'smooth' | 'kinked' | 'mathjs';

const UNARY_NAMES = Object.keys(UNARY_PRIMITIVES) as (keyof typeof UNARY_PRIMITIVES)[];
/** Smooth everywhere on their (wrapped) domains (the primitives table's `smooth`). */
const SMOOTH_UNARY = UNARY_NAMES.filter((name) => UNARY_PRIMITIVES[name].smooth);
/** Not differentiable (or not twice) at isolated points. */
const KINKED_UNARY = UNARY_NAMES.filter((name) => !UNARY_PRIMITIVES[name].smooth);
/** What mathjs 15.2.0 `derivative` can handle after the translation in mathjs-text.ts (no sign, no elu). */
const MATHJS_UNARY = [...SMOOTH_UNARY, 'abs', 'relu'];

/** u^2 + 0.5 > 0: keeps log, sqrt and log1p's argument in their domain. */
const positive = (u: Expr) => bin('+', bin('^', u, num(2)), num(0.5));
/** 0.9 tanh(u) in (-0.9, 0.9): inside the domain of asin and acos, away from their infinite slopes. */
const unitInterval = (u: Expr) => bin('*', num(0.9), call('tanh', u));

function wrapArgument(fn: string, u: Expr): Expr {
  if (fn === 'log' || fn === 'sqrt' || fn === 'log1p') return positive(u);
  if (fn === 'asin' || fn === 'acos') return unitInterval(u);
  return u;
}

/**
 * Random formulas over x, y, z with small literals, for numeric checks: arguments of log, sqrt, asin...
 * are wrapped to stay in the domain; exponents of `^` are small integers, or the base is made positive.
 * Values can still be huge or non-finite (exp(exp(...)), 1/0); the tests skip such points.
 */
export function numericFormula(family: FunctionFamily, maxDepth = 4): fc.Arbitrary<Expr> {
  const unary = family === 'smooth' ? SMOOTH_UNARY : family === 'kinked' ? [...SMOOTH_UNARY, ...KINKED_UNARY] : MATHJS_UNARY;
  // min and max are left out of the mathjs family: their translation (a + b -/+ |a - b|) / 2 cancels
  // catastrophically when |a| >> |b|, so mathjs's own numbers are then wrong in the last digits.
  const variadic = family === 'kinked' ? Object.keys(VARIADIC_PRIMITIVES) : [];
  const smallLiteral = fc.oneof(fc.integer({ min: 0, max: 5 }), fc.constantFrom(0.5, 1.5, 0.25, 3.7));
  const leaf = fc.oneof(
    { arbitrary: smallLiteral.map(num), weight: 1 },
    { arbitrary: fc.constantFrom('x', 'y', 'z', 'x', 'y', 'z', 'pi', 'e').map(name), weight: 4 },
  );
  return treeOf(maxDepth, leaf, (sub) => [
    sub.map((e) => un('-', e)),
    fc.tuple(fc.constantFrom<BinaryOperator>('+', '-', '*', '/'), sub, sub).map(([op, l, r]) => bin(op, l, r)),
    fc.tuple(fc.constantFrom<BinaryOperator>('+', '-', '*', '/'), sub, sub).map(([op, l, r]) => bin(op, l, r)),
    fc.tuple(sub, fc.constantFrom(0, 1, 2, 3, -1)).map(([base, k]) => bin('^', base, k < 0 ? un('-', num(-k)) : num(k))),
    fc.tuple(sub, sub).map(([base, exponent]) => bin('^', positive(base), exponent)),
    fc.tuple(fc.constantFrom(...unary), sub).map(([fn, u]) => call(fn, wrapArgument(fn, u))),
    fc.tuple(fc.constantFrom(...unary), sub).map(([fn, u]) => call(fn, wrapArgument(fn, u))),
    ...(variadic.length > 0
      ? [fc.tuple(fc.constantFrom(...variadic), fc.array(sub, { minLength: 2, maxLength: 3 })).map(([fn, args]) => call(fn, ...args))]
      : []),
  ]);
}

/** A point in [-2, 2]^3 as an environment and as an array (x, y, z). */
export const point = fc
  .tuple(
    fc.double({ min: -2, max: 2, noNaN: true }),
    fc.double({ min: -2, max: 2, noNaN: true }),
    fc.double({ min: -2, max: 2, noNaN: true }),
  )
  .map(([x, y, z]) => ({ env: { x, y, z }, at: [x, y, z] }));

/**
 * A point in [-2, 2]^3 with every coordinate at least 1e-3 from 0. Derivative formulas evaluated
 * next to a removable singularity (sin(y)/y at y = 5e-324) lose all precision to rounding, so such
 * points say nothing about the differentiation rules; the finite-difference and mathjs checks use these.
 */
const awayFromZero = fc.double({ min: -2, max: 2, noNaN: true }).filter((v) => Math.abs(v) >= 1e-3);
export const regularPoint = fc
  .tuple(awayFromZero, awayFromZero, awayFromZero)
  .map(([x, y, z]) => ({ env: { x, y, z }, at: [x, y, z] }));
