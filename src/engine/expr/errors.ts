import type { Span } from './ast';

/**
 * One problem found in a formula: a message for people and the span of the offending characters
 * (0-based UTF-16 offsets, `end` exclusive). Messages about the text name the 1-based column of `start`.
 * Problems with the options rather than the text (a constant that is not finite, say) use the span 0..0.
 */
export interface FormulaError {
  message: string;
  start: number;
  end: number;
}

/** 1-based column of an offset, as the messages print it. */
export function columnOf(offset: number): number {
  return offset + 1;
}

/**
 * An error about the characters in `span`: "<message> at column N", then "; <note>" when a note (a
 * suggestion) is given.
 */
export function errorAt(message: string, span: Span, note?: string): FormulaError {
  const text = `${message} at column ${columnOf(span.start)}${note ? `; ${note}` : ''}`;
  return { message: text, start: span.start, end: span.end };
}

/** An error about the options passed beside the text (no position in the text). */
export function optionError(message: string): FormulaError {
  return { message, start: 0, end: 0 };
}

/** Thrown by the compilers; `errors` lists every problem found, in text order. */
export class FormulaSyntaxError extends Error {
  readonly errors: FormulaError[];

  constructor(errors: FormulaError[]) {
    super(errors.length > 0 ? errors.map((e) => e.message).join('; ') : 'invalid formula');
    this.name = 'FormulaSyntaxError';
    this.errors = errors;
  }
}
