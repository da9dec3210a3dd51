import { describe, expect, it } from 'vitest';
import { tokenize } from '../../../src/engine/expr/lexer';

const kinds = (text: string) => tokenize(text).tokens.map((t) => `${t.kind}:${t.text}`);

describe('tokenize', () => {
  it('reads every number form of the language', () => {
    for (const [text, value] of [
      ['123', 123],
      ['1.5', 1.5],
      ['.5', 0.5],
      ['1e-3', 1e-3],
      ['2.5E+4', 2.5e4],
      ['7.', 7],
      ['0.1e2', 10],
    ] as const) {
      const { tokens, errors } = tokenize(text);
      expect(errors).toEqual([]);
      expect(tokens[0]).toMatchObject({ kind: 'number', text, value, start: 0, end: text.length });
      expect(tokens[1].kind).toBe('end');
    }
  });

  it('splits names, operators and punctuation with their offsets', () => {
    expect(kinds(' x_1*(Y2 ^ -b),c ')).toEqual([
      'name:x_1', 'operator:*', 'lparen:(', 'name:Y2', 'operator:^', 'operator:-', 'name:b', 'rparen:)', 'comma:,', 'name:c', 'end:',
    ]);
    const { tokens } = tokenize('ab + 2');
    expect(tokens.map((t) => [t.start, t.end])).toEqual([[0, 2], [3, 4], [5, 6], [6, 6]]);
  });

  it('ends a number where an exponent has no digits, leaving the letters to a name', () => {
    expect(kinds('2e')).toEqual(['number:2', 'name:e', 'end:']);
    expect(kinds('3exp')).toEqual(['number:3', 'name:exp', 'end:']);
  });

  it('reports a number too large for a double', () => {
    const { errors } = tokenize('x + 1e999');
    expect(errors).toEqual([{ message: "number '1e999' is too large at column 5", start: 4, end: 9 }]);
  });

  it('reports a run of unexpected characters once, with code points for non-ASCII ones', () => {
    expect(tokenize('x # y').errors).toEqual([{ message: "unexpected character '#' at column 3", start: 2, end: 3 }]);
    expect(tokenize('x ;; y').errors[0].message).toBe("unexpected characters ';;' at column 3");
    expect(tokenize('x\u2212y').errors[0].message).toBe("unexpected character U+2212 '\u2212' at column 2; use '-'");
    expect(tokenize('\u0455in(x)').errors[0].message).toBe(
      "unexpected character U+0455 '\u0455' at column 1; names use the letters A-Z, a-z and _ only",
    );
    expect(tokenize('a\u00a0b').errors[0].message).toBe('unexpected character U+00A0 at column 2; that is a no-break space, use a plain one');
  });

  it('keeps a character outside the Basic Multilingual Plane whole', () => {
    const { errors, tokens } = tokenize('x\u{1d465}');
    expect(errors).toEqual([{ message: "unexpected character U+1D465 '\u{1d465}' at column 2; names use the letters A-Z, a-z and _ only", start: 1, end: 3 }]);
    expect(tokens.map((t) => t.kind)).toEqual(['name', 'invalid', 'end']);
  });

  it('treats a lone dot as unexpected', () => {
    expect(tokenize('x.y').errors).toEqual([{ message: "unexpected character '.' at column 2", start: 1, end: 2 }]);
  });
});
