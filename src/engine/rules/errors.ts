import { FormulaSyntaxError, type FormulaError } from '../expr';

/**
 * One problem (or warning) in an update rule: the span of the offending characters in the whole rule
 * text (0-based UTF-16 offsets, `end` exclusive), its 1-based line and column, and a message ending in
 * "at line L, column C" (then "; <hint>" when there is one).
 */
export interface RuleError extends FormulaError {
  line: number;
  column: number;
}

/** Finds the line and column of offsets in a text (both 1-based). */
export class LineIndex {
  private readonly starts: number[] = [0];

  constructor(text: string) {
    for (let i = 0; i < text.length; i++) if (text[i] === '\n') this.starts.push(i + 1);
  }

  get lineCount(): number {
    return this.starts.length;
  }

  /** Offset of the first character of a 1-based line. */
  lineStart(line: number): number {
    return this.starts[line - 1];
  }

  position(offset: number): { line: number; column: number } {
    let lo = 0;
    let hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.starts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: offset - this.starts[lo] + 1 };
  }
}

/** An error about the characters in [start, end): "<message> at line L, column C[; note]". */
export function ruleErrorAt(lines: LineIndex, message: string, start: number, end: number, note?: string): RuleError {
  const { line, column } = lines.position(start);
  return { message: `${message} at line ${line}, column ${column}${note ? `; ${note}` : ''}`, start, end, line, column };
}

/**
 * Re-positions an error the formula parser reported about a right-hand side that starts at `offset` in
 * the rule text: the span is shifted and "at column N" becomes "at line L, column C". The formula
 * messages put the position right after the message proper (errors.ts of the formula language), and
 * no quoted token can contain a space, so the last " at column N" is the position.
 */
export function fromFormulaError(lines: LineIndex, error: FormulaError, offset: number): RuleError {
  const start = error.start + offset;
  const end = error.end + offset;
  const marker = ` at column ${error.start + 1}`;
  const at = error.message.lastIndexOf(marker);
  if (at < 0) return ruleErrorAt(lines, error.message, start, end);
  const rest = error.message.slice(at + marker.length);
  const { line, column } = lines.position(start);
  return { message: `${error.message.slice(0, at)} at line ${line}, column ${column}${rest}`, start, end, line, column };
}

/**
 * Thrown by `compileRule`; `errors` lists every problem found, in text order. A FormulaSyntaxError, so
 * code that shows formula errors under the offending column shows these too.
 */
export class RuleSyntaxError extends FormulaSyntaxError {
  declare readonly errors: RuleError[];

  constructor(errors: RuleError[]) {
    super(errors);
    this.name = 'RuleSyntaxError';
  }
}
