/**
 * Bad and hostile formula text, one row per input: what the formula field under "Your formula" shows
 * (the page lists each FormulaSyntaxError message with a marker under its span, FormulaEditor.tsx).
 * Every rejection must name a column inside the text (or just past its end), and nothing may reach
 * JavaScript's globals: after the table, Object.prototype is checked for pollution.
 */
import { describe, expect, it } from 'vitest';
import { FormulaSyntaxError, compileFormula } from '../../src/engine';
import { MAX_FORMULA_LENGTH, MAX_NESTING, MAX_TREE_DEPTH } from '../../src/engine/expr/parser';
import { buildSurface } from '../../src/problems';

interface Row {
  what: string;
  text: string;
  /** The first message the formula field lists. */
  first: RegExp;
}

const nested = (depth: number) => '('.repeat(depth) + 'x' + ')'.repeat(depth);

const REJECTED: Row[] = [
  { what: 'unbalanced: an open parenthesis', text: '(x + y', first: /^unmatched '\(' at column 1$/ },
  { what: 'unbalanced: a closing parenthesis', text: 'x + y)', first: /^unmatched '\)' at column 6$/ },
  { what: 'unbalanced: inside a call', text: 'sin(x + cos(y)', first: /^unmatched '\(' at column 4$/ },
  { what: 'empty parentheses', text: 'x * ()', first: /empty parentheses at column 5/ },
  { what: 'unknown function, with the nearest name', text: 'sine(x)', first: /^unknown function 'sine' at column 1; did you mean 'sin'\?$/ },
  { what: 'unknown function (code-like)', text: 'alert(1)', first: /^unknown function 'alert' at column 1$/ },
  { what: 'prototype name called', text: 'constructor(x)', first: /^unknown function 'constructor' at column 1$/ },
  { what: 'prototype name called', text: '__proto__(x)', first: /^unknown function '__proto__' at column 1$/ },
  { what: 'property access', text: 'x.constructor', first: /^unexpected character '\.' at column 2$/ },
  { what: 'indexing with a string', text: 'x["__proto__"]', first: /^unexpected characters '\["' at column 2$/ },
  { what: 'statement separator and call', text: 'x; process.exit(1)', first: /^unexpected character ';' at column 2$/ },
  { what: 'template literal', text: '`${x}`', first: /^unexpected characters '`\$\{' at column 1$/ },
  { what: 'assignment', text: 'x = 1', first: /^unexpected character '=' at column 3$/ },
  { what: 'arrow function', text: '(x) => x', first: /^unexpected characters? '=>?' at column 5$/ },
  { what: 'comment', text: 'x // y', first: /^missing operand after '\/' at column 3$/ },
  { what: 'missing operator (implicit product)', text: '2x', first: /^missing operator between '2' and 'x' at column 2$/ },
  { what: 'doubled operator', text: 'x +* y', first: /^missing operand after '\+' at column 3$/ },
  { what: 'empty text', text: '', first: /^empty formula at column 1$/ },
  { what: 'blank text', text: '   \t', first: /^empty formula at column 1$/ },
  { what: 'function without parentheses', text: 'sin + x', first: /^function 'sin' needs its arguments in parentheses at column 1; write sin\(\.\.\.\)$/ },
  { what: 'wrong argument count', text: 'max(x)', first: /^max takes 2 or more arguments, got 1 at column 1$/ },
  { what: 'number that overflows', text: '1e999 * x', first: /^number '1e999' is too large at column 1$/ },
  { what: 'NUL character', text: 'x\u0000', first: /^unexpected character U\+0000 at column 2$/ },
  { what: 'lookalike minus sign', text: 'x \u2212 y', first: /^unexpected character U\+2212 '\u2212' at column 3; use '-'$/ },
  { what: 'zero-width space', text: 'x\u200b+ y', first: /^unexpected character U\+200B at column 2$/ },
  { what: '100 KB of text', text: 'x+'.repeat(50_000) + 'x', first: new RegExp(`^formula is too long \\(100001 characters, at most ${MAX_FORMULA_LENGTH}\\) at column ${MAX_FORMULA_LENGTH + 1}$`) },
  { what: '10,000-deep parentheses (also too long)', text: nested(10_000), first: /^formula is too long \(20001 characters, at most 10000\) at column 10001$/ },
  { what: 'deep parentheses inside the length limit', text: nested(4_999), first: new RegExp(`^formula is nested too deeply \\(more than ${MAX_NESTING} levels\\) at column ${MAX_NESTING + 1}$`) },
  { what: '10,000-deep chain of signs (also too long)', text: '-'.repeat(10_000) + 'x', first: /^formula is too long/ },
  { what: 'deep chain of signs inside the limit', text: '-'.repeat(9_000) + 'x', first: /^formula is nested too deeply \(more than 200 levels\) at column \d+$/ },
  { what: 'deep call nesting', text: 'sin('.repeat(1_500) + 'x' + ')'.repeat(1_500), first: /^formula is nested too deeply \(more than 200 levels\) at column \d+$/ },
  { what: 'a long right-associative power chain', text: 'x^'.repeat(3_000) + 'x', first: /^formula is nested too deeply \(more than 200 levels\) at column \d+$/ },
  { what: 'a flat sum deeper than the tree limit', text: Array.from({ length: MAX_TREE_DEPTH + 10 }, (_, k) => `x${k % 10}`).join('+'), first: new RegExp(`^formula is nested too deeply \\(more than ${MAX_TREE_DEPTH} levels\\) at column 1$`) },
];

function formulaFieldMessages(text: string): { message: string; start: number; end: number }[] {
  try {
    buildSurface({ kind: 'formula', text });
  } catch (error) {
    if (error instanceof FormulaSyntaxError) return error.errors;
    throw error;
  }
  throw new Error('the formula was accepted');
}

describe('formula field: bad and hostile text', () => {
  it.each(REJECTED)('$what', ({ text, first }) => {
    const errors = formulaFieldMessages(text);
    expect(errors[0].message).toMatch(first);
    for (const e of errors) {
      // Positioned: the span lies in the text (an error at the end of the text may sit just past it).
      expect(e.start).toBeGreaterThanOrEqual(0);
      expect(e.end).toBeGreaterThanOrEqual(e.start);
      expect(e.end).toBeLessThanOrEqual(text.length);
      expect(e.message).toMatch(/ at column \d+/);
    }
  });

  it('at most a page of messages for 10,000 characters of nonsense', () => {
    const errors = formulaFieldMessages(';'.repeat(MAX_FORMULA_LENGTH));
    // One run of characters that start no token is one message, not 10,000.
    expect(errors.map((e) => e.message)).toEqual([`unexpected characters '${';'.repeat(MAX_FORMULA_LENGTH)}' at column 1`]);
  });
});

describe('formula field: hostile names are ordinary variables', () => {
  it.each([
    ['constructor + __proto__', ['__proto__', 'constructor'], [1, 2], 3],
    ['toString * valueOf - hasOwnProperty', ['hasOwnProperty', 'toString', 'valueOf'], [1, 2, 3], 5],
    ['prototype^2 + this', ['prototype', 'this'], [3, 1], 10],
  ] as const)('%j', (text, variables, at, value) => {
    const surface = compileFormula(text);
    expect(surface.variables).toEqual(variables);
    expect(surface.value(Float64Array.from(at))).toBe(value);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.getPrototypeOf({})).toBe(Object.prototype);
  });
});
