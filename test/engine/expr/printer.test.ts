import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { freeNames, parseFormula, prettyFormula, printFormula, sameTree, type Expr } from '../../../src/engine/expr';
import { childrenOf } from '../../../src/engine/expr/ast';
import { formatLiteral } from '../../../src/engine/expr/printer';
import { anyFormula, bin, call, name, num, un } from './arbitraries';

function reparse(text: string): Expr {
  const result = parseFormula(text);
  if (!result.ok) throw new Error(`${text}: ${result.errors.map((e) => e.message).join('; ')}`);
  return result.ast;
}

describe('printFormula', () => {
  it('parenthesises every operation', () => {
    expect(printFormula(bin('+', un('-', bin('^', name('x'), num(2))), call('max', name('x'), num(0.5), name('pi'))))).toBe(
      '((-(x ^ 2)) + max(x, 0.5, pi))',
    );
  });

  it('prints round-tripping literals, extremes included', () => {
    expect([0.1, 1e21, 1e-7, 5e-324, Number.MAX_VALUE, 123456789.125].map(formatLiteral)).toEqual([
      '0.1', '1e+21', '1e-7', '5e-324', '1.7976931348623157e+308', '123456789.125',
    ]);
    expect(formatLiteral(-2.5)).toBe('(-2.5)');
    expect(() => formatLiteral(Infinity)).toThrow(/non-finite/);
  });

  it('round-trips random trees: parse(print(ast)) equals ast (fast-check)', () => {
    fc.assert(
      fc.property(anyFormula, (tree) => {
        expect(sameTree(reparse(printFormula(tree)), tree)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe('prettyFormula', () => {
  it.each([
    ['-x^2 + sin(2 * y)', '-x^2 + sin(2 * y)'],
    ['(-x)^2', '(-x)^2'],
    ['(2^3)^2', '(2^3)^2'],
    ['2^3^2', '2^3^2'],
    ['2^-x', '2^-x'],
    ['a - (b - c)', 'a - (b - c)'],
    ['(a - b) - c', 'a - b - c'],
    ['a + (b + c)', 'a + (b + c)'],
    ['a / (b * c)', 'a / (b * c)'],
    ['-(a * b)', '-(a * b)'],
    ['-(-x)', '-(-x)'],
    ['(-a) * b', '-a * b'],
    ['a * -b', 'a * -b'],
    ['2^(x + 1)', '2^(x + 1)'],
  ])('%s prints as %s', (text, expected) => {
    expect(prettyFormula(reparse(text))).toBe(expected);
  });

  it('round-trips random trees with minimal parentheses (fast-check)', () => {
    fc.assert(
      fc.property(anyFormula, (tree) => {
        expect(sameTree(reparse(prettyFormula(tree)), tree)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe('parser properties', () => {
  it('gives every node a span whose text parses back to that node (fast-check)', () => {
    fc.assert(
      fc.property(anyFormula, fc.boolean(), (tree, pretty) => {
        const text = pretty ? prettyFormula(tree) : printFormula(tree);
        const visit = (node: Expr) => {
          expect(sameTree(reparse(text.slice(node.span.start, node.span.end)), node)).toBe(true);
          childrenOf(node).forEach(visit);
        };
        visit(reparse(text));
      }),
      { numRuns: 200 },
    );
  });

  it('never throws on arbitrary text, and every error names the column of its span (fast-check)', () => {
    const alphabet = fc.constantFrom(...'xy12.e+-*/^(),  sin\u2212#;');
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.string({ unit: alphabet, maxLength: 30 })), (text) => {
        const result = parseFormula(text);
        if (result.ok) return;
        expect(result.errors.length).toBeGreaterThan(0);
        for (const e of result.errors) {
          expect(e.start).toBeGreaterThanOrEqual(0);
          expect(e.end).toBeGreaterThanOrEqual(e.start);
          expect(e.end).toBeLessThanOrEqual(text.length);
          expect(e.message).toContain(`at column ${e.start + 1}`);
        }
      }),
      { numRuns: 1000 },
    );
  });
});

describe('freeNames', () => {
  it('lists variables and constants once, sorted, without functions, pi or e', () => {
    expect(freeNames(reparse('y * sin(x) + a*x + pi*e + exp(b)'))).toEqual(['a', 'b', 'x', 'y']);
    expect(freeNames(reparse('2 + pi'))).toEqual([]);
  });
});

describe('naturalNameOrder', () => {
  it('orders digit runs by value: x1, x2, ..., x10, x11', async () => {
    const { naturalNameOrder } = await import('../../../src/engine/expr');
    const names = Array.from({ length: 12 }, (_, k) => `x${k + 1}`);
    expect([...names].sort()).not.toEqual(names);
    expect([...names].reverse().sort(naturalNameOrder)).toEqual(names);
    expect(['w_10', 'w_9', 'B', 'a', 'x01', 'x1', 'x'].sort(naturalNameOrder)).toEqual(['B', 'a', 'w_9', 'w_10', 'x', 'x1', 'x01']);
    expect(freeNames(reparse('x10 + x2 + x1'))).toEqual(['x1', 'x2', 'x10']);
  });
});
