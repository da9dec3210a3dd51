import type { Span } from './ast';
import { errorAt, type FormulaError } from './errors';

/**
 * Tokens of the formula language. `invalid` is a run of characters that start no token; the lexer has
 * already reported it, and the parser treats it as an unknown operator so the rest of the text is
 * still checked.
 */
export type TokenKind = 'number' | 'name' | 'operator' | 'lparen' | 'rparen' | 'comma' | 'invalid' | 'end';

export interface Token extends Span {
  readonly kind: TokenKind;
  /** The characters as written ('' for `end`). */
  readonly text: string;
  /** For `number` tokens: the value (finite). */
  readonly value: number;
}

const NUMBER = /(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/y;
const NAME = /[A-Za-z_][A-Za-z0-9_]*/y;
const WHITESPACE = new Set([' ', '\t', '\n', '\r']);
const OPERATORS = new Set(['+', '-', '*', '/', '^']);

/** Characters that look like operators, with the ASCII one to type instead. */
const LOOKALIKE_HINTS: ReadonlyMap<string, string> = new Map([
  ['\u2212', "use '-'"],
  ['\u2013', "use '-'"],
  ['\u00d7', "use '*'"],
  ['\u00b7', "use '*'"],
  ['\u22c5', "use '*'"],
  ['\u2217', "use '*'"],
  ['\u00f7', "use '/'"],
  ['\u00a0', 'that is a no-break space, use a plain one'],
  ['\u00b2', "use '^2'"],
  ['\u03c0', "use 'pi'"],
]);

/** 2 for the first half of a surrogate pair (a character outside the Basic Multilingual Plane), else 1. */
function characterLength(text: string, offset: number): number {
  return text.codePointAt(offset)! > 0xffff ? 2 : 1;
}

function startsToken(ch: string): boolean {
  return WHITESPACE.has(ch) || OPERATORS.has(ch) || '(),'.includes(ch) || /[A-Za-z0-9_.]/.test(ch);
}

function describeCharacters(run: string): string {
  const printable = [...run].every((ch) => {
    const code = ch.codePointAt(0)!;
    return code >= 0x21 && code <= 0x7e;
  });
  const codes = [...run].map((ch) => `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`).join(' ');
  const quoted = printable ? `'${run}'` : `${codes}${/^[\p{L}\p{N}\p{P}\p{S}]+$/u.test(run) ? ` '${run}'` : ''}`;
  return `unexpected character${[...run].length > 1 ? 's' : ''} ${quoted}`;
}

/** Splits formula text into tokens; the last token is always `end`. Never throws. */
export function tokenize(text: string): { tokens: Token[]; errors: FormulaError[] } {
  const tokens: Token[] = [];
  const errors: FormulaError[] = [];
  let i = 0;
  const push = (kind: TokenKind, start: number, end: number, value = NaN) =>
    tokens.push({ kind, text: text.slice(start, end), start, end, value });

  while (i < text.length) {
    const ch = text[i];
    if (WHITESPACE.has(ch)) {
      i++;
      continue;
    }
    NUMBER.lastIndex = i;
    const number = NUMBER.exec(text);
    if (number) {
      const end = i + number[0].length;
      const value = Number(number[0]);
      if (!Number.isFinite(value)) {
        errors.push(errorAt(`number '${number[0]}' is too large`, { start: i, end }));
        push('number', i, end, 0);
      } else {
        push('number', i, end, value);
      }
      i = end;
      continue;
    }
    NAME.lastIndex = i;
    const name = NAME.exec(text);
    if (name) {
      push('name', i, i + name[0].length);
      i += name[0].length;
      continue;
    }
    const single: TokenKind | undefined = OPERATORS.has(ch)
      ? 'operator'
      : ch === '('
        ? 'lparen'
        : ch === ')'
          ? 'rparen'
          : ch === ','
            ? 'comma'
            : undefined;
    if (single) {
      push(single, i, i + 1);
      i++;
    } else {
      // A run of characters that start no token (a lone '.' too): one token, one error.
      let end = i + characterLength(text, i);
      while (end < text.length && !startsToken(text.slice(end, end + characterLength(text, end)))) {
        end += characterLength(text, end);
      }
      const run = text.slice(i, end);
      const hint = LOOKALIKE_HINTS.get(run) ?? (/\p{L}/u.test(run) ? 'names use the letters A-Z, a-z and _ only' : undefined);
      errors.push(errorAt(describeCharacters(run), { start: i, end }, hint));
      push('invalid', i, end);
      i = end;
    }
  }
  push('end', text.length, text.length);
  return { tokens, errors };
}
