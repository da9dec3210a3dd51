import { describe, expect, it } from 'vitest';
import { parseFormula, printFormula, sameTree, type Expr, type FormulaError } from '../../../src/engine/expr';
import { MAX_FORMULA_LENGTH, MAX_NESTING, MAX_TREE_DEPTH } from '../../../src/engine/expr/parser';
import { bin, call, name, num, un } from './arbitraries';

function ast(text: string): Expr {
  const result = parseFormula(text);
  if (!result.ok) throw new Error(result.errors.map((e) => e.message).join('; '));
  return result.ast;
}

function errors(text: string): FormulaError[] {
  const result = parseFormula(text);
  if (result.ok) throw new Error(`'${text}' parsed as ${printFormula(result.ast)}`);
  return result.errors;
}

/** The fully parenthesised reading of a formula: the clearest way to state precedence and associativity. */
const reading = (text: string) => printFormula(ast(text));

describe('parseFormula: precedence and associativity', () => {
  it.each([
    ['1 + 2 * 3', '(1 + (2 * 3))'],
    ['1 - 2 - 3', '((1 - 2) - 3)'],
    ['8 / 4 / 2', '((8 / 4) / 2)'],
    ['2 ^ 3 ^ 2', '(2 ^ (3 ^ 2))'],
    ['-x^2', '(-(x ^ 2))'],
    ['-2^2', '(-(2 ^ 2))'],
    ['2^-1', '(2 ^ (-1))'],
    ['2^-x^2', '(2 ^ (-(x ^ 2)))'],
    ['2^-x*3', '((2 ^ (-x)) * 3)'],
    ['-x*y', '((-x) * y)'],
    ['a - -b', '(a - (-b))'],
    ['+x', '(+x)'],
    ['--x', '(-(-x))'],
    ['(1 + 2) * 3', '((1 + 2) * 3)'],
    ['x^(1/2)', '(x ^ (1 / 2))'],
    ['max(x, y, 0) + sin(2*pi*x)', '(max(x, y, 0) + sin(((2 * pi) * x)))'],
    ['  e  ', 'e'],
    // '**' is a synonym of '^': the same precedence and right associativity.
    ['x**2', '(x ^ 2)'],
    ['2 ** 3 ** 2', '(2 ^ (3 ^ 2))'],
    ['2 ** 3 ^ 2', '(2 ^ (3 ^ 2))'],
    ['-x**2', '(-(x ^ 2))'],
    ['2**-x*3', '((2 ^ (-x)) * 3)'],
    ['a * b ** 2', '(a * (b ^ 2))'],
    ['a ** 2 * b', '((a ^ 2) * b)'],
  ])('%s reads as %s', (text, expected) => {
    expect(reading(text)).toBe(expected);
  });

  it('builds the documented node kinds', () => {
    expect(sameTree(ast('-sin(x) * 2.5'), bin('*', un('-', call('sin', name('x'))), num(2.5)))).toBe(true);
  });
});

describe('parseFormula: spans', () => {
  it('gives every node the span of its own characters (parentheses around an operand excluded)', () => {
    const tree = ast('(x + 1) * sin(y)');
    expect(tree.span).toEqual({ start: 0, end: 16 });
    if (tree.kind !== 'binary') throw new Error('expected a product');
    expect(tree.left.span).toEqual({ start: 1, end: 6 });
    expect(tree.right.span).toEqual({ start: 10, end: 16 });
    if (tree.right.kind !== 'call') throw new Error('expected a call');
    expect(tree.right.args[0].span).toEqual({ start: 14, end: 15 });
  });

  it('starts a unary node at its sign and a power at its base', () => {
    const tree = ast(' -x^2');
    expect(tree.span).toEqual({ start: 1, end: 5 });
    if (tree.kind !== 'unary') throw new Error('expected a negation');
    expect(tree.operand.span).toEqual({ start: 2, end: 5 });
  });
});

describe('parseFormula: errors with exact columns', () => {
  const single = (text: string) => {
    const list = errors(text);
    expect(list, JSON.stringify(list)).toHaveLength(1);
    return list[0];
  };

  it.each<[string, string, number, number]>([
    ['', 'empty formula at column 1', 0, 0],
    ['   ', 'empty formula at column 1', 0, 3],
    ['2x', "missing operator between '2' and 'x' at column 2", 1, 2],
    ['(x+1)(y)', "missing operator between ')' and '(' at column 6", 5, 6],
    ['x y', "missing operator between 'x' and 'y' at column 3", 2, 3],
    ['sinn(x)', "unknown function 'sinn' at column 1; did you mean 'sin'?", 0, 4],
    ['2 * Exp(x)', "unknown function 'Exp' at column 5; did you mean 'exp'?", 4, 7],
    ['ln(x)', "unknown function 'ln' at column 1; write log", 0, 2],
    ['pow(x, 2)', "unknown function 'pow' at column 1; write a^b", 0, 3],
    ['frobnicate(x)', "unknown function 'frobnicate' at column 1", 0, 10],
    ['x +', "missing operand after '+' at column 3", 2, 3],
    ['x + * y', "missing operand after '+' at column 3", 2, 3],
    ['* y', "missing operand before '*' at column 1", 0, 1],
    ['(^ y)', "missing operand before '^' at column 2", 1, 2],
    ['2 * -', "missing operand after '-' at column 5", 4, 5],
    ['(x + 1', "unmatched '(' at column 1", 0, 1],
    ['((x) + 1', "unmatched '(' at column 1", 0, 1],
    ['sin((x)', "unmatched '(' at column 4", 3, 4],
    ['x + 1)', "unmatched ')' at column 6", 5, 6],
    [')', "unmatched ')' at column 1", 0, 1],
    ['()', 'empty parentheses at column 1', 0, 2],
    ['sin(x, y)', 'sin takes 1 argument, got 2 at column 1', 0, 9],
    ['cos()', 'cos takes 1 argument, got 0 at column 1', 0, 5],
    ['1 + max(x)', 'max takes 2 or more arguments, got 1 at column 5', 4, 10],
    ['max(x,)', "missing argument after ',' at column 6", 5, 6],
    ['max(,x)', "missing argument before ',' at column 5", 4, 5],
    ['x, y', "unexpected ',' at column 2; commas only separate the arguments of a function", 1, 2],
    ['x # y', "unexpected character '#' at column 3", 2, 3],
    ['sin x', "function 'sin' needs its arguments in parentheses at column 1; write sin(...)", 0, 3],
    ['1 + exp', "function 'exp' needs its arguments in parentheses at column 5; write exp(...)", 4, 7],
    ['x* *2', "missing operand after '*' at column 2", 1, 2],
    ['1e400 * x', "number '1e400' is too large at column 1", 0, 5],
  ])('%j: %s', (text, message, start, end) => {
    expect(single(text)).toEqual({ message, start, end });
  });

  it('collects independent mistakes in one pass, in text order', () => {
    expect(errors('sinn(x) + 2y + (z').map((e) => e.message)).toEqual([
      "unknown function 'sinn' at column 1; did you mean 'sin'?",
      "missing operator between '2' and 'y' at column 12",
      "unmatched '(' at column 16",
    ]);
  });

  it('reports each piece of an injection attempt and goes on past it', () => {
    expect(errors('x;process.exit()').map((e) => e.message)).toEqual([
      "unexpected character ';' at column 2",
      "unexpected character '.' at column 10",
      "unknown function 'exit' at column 11; did you mean 'exp'?",
    ]);
  });

  it('limits nesting and length instead of overflowing the stack', () => {
    const deep = `${'('.repeat(MAX_NESTING + 5)}x${')'.repeat(MAX_NESTING + 5)}`;
    expect(errors(deep)[0].message).toMatch(/^formula is nested too deeply \(more than 200 levels\) at column \d+$/);
    const signs = `${'-'.repeat(MAX_NESTING + 1)}x`;
    expect(errors(signs)[0].message).toMatch(/nested too deeply/);
    const chain = Array.from({ length: MAX_TREE_DEPTH + 1 }, () => 'x').join('+');
    expect(errors(chain)[0].message).toBe(`formula is nested too deeply (more than ${MAX_TREE_DEPTH} levels) at column 1`);
    expect(errors('x'.repeat(MAX_FORMULA_LENGTH + 1))[0].message).toBe(
      `formula is too long (${MAX_FORMULA_LENGTH + 1} characters, at most ${MAX_FORMULA_LENGTH}) at column ${MAX_FORMULA_LENGTH + 1}`,
    );
    expect(parseFormula(Array.from({ length: 400 }, () => 'x').join('+')).ok).toBe(true);
  });
});
