import type { BinaryOperator, Expr, Span } from './ast';
import { errorAt, type FormulaError } from './errors';
import { FUNCTIONS, FUNCTION_HINTS, describeArity, type Arity } from './functions';
import { BINARY_OPERATORS, PREFIX_PRECEDENCE } from './operators';
import { tokenize, type Token } from './lexer';
import { nearestName } from './suggest';

/**
 * The parser of the formula language: a Pratt (top-down operator precedence) parser over the tokens of
 * lexer.ts, producing an AST (ast.ts) whose every node carries its source span.
 *
 * Grammar (EBNF; whitespace is space, tab, CR or LF and may appear between any two tokens):
 *
 *   formula    = expression ;
 *   expression = term , { ( "+" | "-" ) , term } ;                 (* left-associative *)
 *   term       = unary , { ( "*" | "/" ) , unary } ;               (* left-associative *)
 *   unary      = ( "-" | "+" ) , unary | power ;
 *   power      = primary , [ ( "^" | "**" ) , unary ] ;            (* right-associative; "**" is "^" *)
 *   primary    = number | name | call | "(" , expression , ")" ;
 *   call       = name , "(" , [ expression , { "," , expression } ] , ")" ;
 *   number     = ( digits , [ "." , [ digits ] ] | "." , digits ) , [ ( "e" | "E" ) , [ "+" | "-" ] , digits ] ;
 *   digits     = digit , { digit } ;
 *   name       = letter , { letter | digit } ;
 *   letter     = "A" | ... | "Z" | "a" | ... | "z" | "_" ;
 *   digit      = "0" | ... | "9" ;
 *
 * Consequences worth knowing: `-x^2` is `-(x^2)`; `2^-1` is `2^(-1)`; `2^3^2` is `2^(3^2)`; `-x*y` is
 * `(-x)*y`. There is no implicit multiplication: `2x` is an error ("missing operator").
 *
 * Binding powers are ten times the precedences of the operator table (operators.ts): `+ -` 10,
 * `* /` 20, prefix `- +` 30 (their operand stops before `*` but takes `^`), `^` 40; the right operand of
 * a right-associative operator (`^`) is parsed one below its power, 39, so it associates to the right
 * and may itself start with a sign.
 *
 * Errors are collected, not thrown: after each problem the parser resynchronises (treats two adjacent
 * operands as multiplied, skips a stray `)` and so on) so one pass reports every independent mistake.
 */

/** Deepest recursion of the parser (nested parentheses, chains of signs), kept well inside the JS stack. */
export const MAX_NESTING = 200;
/** Deepest tree accepted; evaluating, printing and differentiating recurse over the tree. */
export const MAX_TREE_DEPTH = 500;
/** Longest formula text accepted, in UTF-16 code units. */
export const MAX_FORMULA_LENGTH = 10_000;

const INFIX_POWER = Object.fromEntries(Object.entries(BINARY_OPERATORS).map(([op, info]) => [op, 10 * info.precedence])) as Readonly<
  Record<BinaryOperator, number>
>;
const PREFIX_POWER = 10 * PREFIX_PRECEDENCE;
/** Adjacent operands are reported and then parsed as if multiplied. */
const IMPLICIT_POWER = INFIX_POWER['*'];
/** A run of invalid characters is parsed as if it were an operator of the lowest precedence. */
const INVALID_POWER = INFIX_POWER['+'];

/** A parsed operand: the node and its outer extent (including any parentheses around it), and its depth. */
interface Parsed {
  readonly node: Expr;
  readonly start: number;
  readonly end: number;
  readonly depth: number;
}

class NestingTooDeep extends Error {
  constructor(readonly at: Token) {
    super('nesting too deep');
  }
}

class Parser {
  private position = 0;
  private previous: Token | undefined;
  private recursion = 0;
  /** Open groupings, innermost last: a parenthesised expression or the arguments of a call. */
  private readonly groups: ('paren' | 'call')[] = [];
  readonly errors: FormulaError[] = [];

  constructor(
    private readonly tokens: Token[],
    private readonly functions: ReadonlyMap<string, Arity>,
  ) {}

  parseFormula(): Expr {
    const parsed = this.expression(0);
    if (parsed.depth > MAX_TREE_DEPTH) {
      this.errors.push(errorAt(`formula is nested too deeply (more than ${MAX_TREE_DEPTH} levels)`, { start: 0, end: 0 }));
    }
    return parsed.node;
  }

  private peek(offset = 0): Token {
    return this.tokens[Math.min(this.position + offset, this.tokens.length - 1)];
  }

  private advance(): Token {
    const token = this.peek();
    if (token.kind !== 'end') this.position++;
    this.previous = token;
    return token;
  }

  private report(message: string, span: Span, note?: string): void {
    this.errors.push(errorAt(message, span, note));
  }

  /** Parses operators binding tighter than `rightPower` (Pratt's loop). */
  private expression(rightPower: number): Parsed {
    if (++this.recursion > MAX_NESTING) throw new NestingTooDeep(this.peek());
    try {
      let left = this.prefix();
      for (;;) {
        const token = this.peek();
        if (token.kind === 'operator') {
          const op = this.isDoubleStar(token) ? '^' : (token.text as BinaryOperator);
          const power = INFIX_POWER[op];
          if (power <= rightPower) break;
          this.advance();
          if (token.text === '*' && op === '^') this.advance(); // the second '*' of '**'
          left = this.infix(left, op);
        } else if (token.kind === 'invalid') {
          if (INVALID_POWER <= rightPower) break;
          this.advance(); // already reported by the lexer
          const right = this.expression(INVALID_POWER);
          left = this.combine('+', left, right);
        } else if (token.kind === 'number' || token.kind === 'name' || token.kind === 'lparen') {
          if (IMPLICIT_POWER <= rightPower) break;
          const before = this.previous;
          this.report(`missing operator between '${before?.text ?? ''}' and '${token.text}'`, token);
          const right = this.expression(IMPLICIT_POWER);
          left = this.combine('*', left, right);
        } else if (token.kind === 'rparen' && this.groups.length === 0) {
          if (rightPower > 0) break;
          this.report("unmatched ')'", this.advance());
        } else if (token.kind === 'comma' && this.groups.at(-1) !== 'call') {
          if (rightPower > 0) break;
          this.report("unexpected ','", this.advance(), 'commas only separate the arguments of a function');
          this.expression(0);
        } else {
          break;
        }
      }
      return left;
    } finally {
      this.recursion--;
    }
  }

  /** `**` (two adjacent stars) is a synonym of `^`: same precedence, right-associative. */
  private isDoubleStar(token: Token): boolean {
    const next = this.tokens[this.position + 1];
    return token.text === '*' && next !== undefined && next.kind === 'operator' && next.text === '*' && next.start === token.end;
  }

  private infix(left: Parsed, op: BinaryOperator): Parsed {
    // A right-associative operator's right operand may contain the same operator ('^': power 40 > 39).
    const right = this.expression(BINARY_OPERATORS[op].associativity === 'right' ? INFIX_POWER[op] - 1 : INFIX_POWER[op]);
    return this.combine(op, left, right);
  }

  private combine(op: BinaryOperator, left: Parsed, right: Parsed): Parsed {
    const span = { start: left.start, end: right.end };
    return {
      node: { kind: 'binary', op, left: left.node, right: right.node, span },
      ...span,
      depth: 1 + Math.max(left.depth, right.depth),
    };
  }

  /** An operand: number, name, call, parenthesised expression, or a signed operand. */
  private prefix(): Parsed {
    const token = this.peek();
    switch (token.kind) {
      case 'number':
        this.advance();
        return leaf({ kind: 'number', value: token.value, span: spanOf(token) });
      case 'name':
        this.advance();
        if (this.peek().kind === 'lparen') return this.call(token);
        return this.bareName(token);
      case 'lparen':
        return this.parenthesised();
      case 'operator':
        if (token.text === '-' || token.text === '+') {
          this.advance();
          const operand = this.expression(PREFIX_POWER);
          const span = { start: token.start, end: operand.end };
          return {
            node: { kind: 'unary', op: token.text, operand: operand.node, span },
            ...span,
            depth: operand.depth + 1,
          };
        }
        return this.missingOperand(token);
      case 'invalid': {
        this.advance(); // already reported by the lexer
        const operand = this.expression(PREFIX_POWER);
        return { ...operand, start: token.start };
      }
      default:
        return this.missingOperand(token);
    }
  }

  /** A name not followed by '(': a variable or constant, or a function used without its parentheses. */
  private bareName(token: Token): Parsed {
    const node: Expr = { kind: 'name', name: token.text, span: spanOf(token) };
    if (!this.functions.has(token.text)) return leaf(node);
    this.report(`function '${token.text}' needs its arguments in parentheses`, token, `write ${token.text}(...)`);
    const next = this.peek();
    if (next.kind === 'number' || next.kind === 'name') {
      // Read `sin x` as `sin(x)` to go on checking the rest without a second error here.
      const argument = this.expression(PREFIX_POWER);
      return { node, start: token.start, end: argument.end, depth: argument.depth + 1 };
    }
    return leaf(node);
  }

  private parenthesised(): Parsed {
    const open = this.advance();
    if (this.peek().kind === 'rparen') {
      const close = this.advance();
      this.report('empty parentheses', { start: open.start, end: close.end });
      return leaf(placeholder(open.start, close.end));
    }
    this.groups.push('paren');
    const inner = this.expression(0);
    this.groups.pop();
    if (this.peek().kind === 'rparen') {
      const close = this.advance();
      return { ...inner, start: open.start, end: close.end };
    }
    this.report("unmatched '('", open);
    return { ...inner, start: open.start };
  }

  private call(nameToken: Token): Parsed {
    const open = this.advance();
    const args: Parsed[] = [];
    let end = open.end;
    if (this.peek().kind === 'rparen') {
      end = this.advance().end;
    } else {
      this.groups.push('call');
      for (;;) {
        args.push(this.expression(0));
        const next = this.peek();
        if (next.kind === 'comma') {
          this.advance();
          continue;
        }
        if (next.kind === 'rparen') {
          end = this.advance().end;
        } else {
          this.report("unmatched '('", open);
          end = args[args.length - 1].end;
        }
        break;
      }
      this.groups.pop();
    }
    const span = { start: nameToken.start, end };
    this.checkCall(nameToken, args.length, span);
    return {
      node: { kind: 'call', name: nameToken.text, args: args.map((a) => a.node), span },
      ...span,
      depth: 1 + Math.max(0, ...args.map((a) => a.depth)),
    };
  }

  private checkCall(nameToken: Token, count: number, span: Span): void {
    const name = nameToken.text;
    const info = this.functions.get(name);
    if (!info) {
      const hint = FUNCTION_HINTS.get(name);
      const nearest = nearestName(name, this.functions.keys());
      const note = hint ? `write ${hint}` : nearest ? `did you mean '${nearest}'?` : undefined;
      this.report(`unknown function '${name}'`, nameToken, note);
      return;
    }
    if (count < info.minArgs || count > info.maxArgs) {
      this.report(`${name} takes ${describeArity(info)}, got ${count}`, span);
    }
  }

  /** Reports why no operand stands at `token` (unless another report covers it), without consuming it. */
  private missingOperand(token: Token): Parsed {
    const before = this.previous;
    const inCall = this.groups.at(-1) === 'call';
    if (before?.kind === 'invalid') {
      // The lexer has already reported this spot.
    } else if (before === undefined && token.kind === 'end') {
      this.report('empty formula', { start: 0, end: token.start });
    } else if (before?.kind === 'operator') {
      this.report(`missing operand after '${before.text}'`, before);
    } else if (token.kind === 'operator') {
      this.report(`missing operand before '${token.text}'`, token);
    } else if (before?.kind === 'comma') {
      if (inCall) this.report("missing argument after ','", before);
    } else if (token.kind === 'comma') {
      if (inCall) this.report("missing argument before ','", token);
    } else if (token.kind === 'rparen' && this.groups.length === 0) {
      // The loop in expression() reports the unmatched ')'.
    } else if (before?.kind === 'lparen' && token.kind === 'end') {
      // The group reports the unmatched '('.
    } else {
      this.report(`unexpected '${token.text || 'end of formula'}'`, token);
    }
    return leaf(placeholder(token.start, token.start));
  }
}

function spanOf(token: Token): Span {
  return { start: token.start, end: token.end };
}

function leaf(node: Expr): Parsed {
  return { node, start: node.span.start, end: node.span.end, depth: 1 };
}

/** Stands where an operand is missing; the parse has failed, so its value never matters. */
function placeholder(start: number, end: number): Expr {
  return { kind: 'number', value: 0, span: { start, end } };
}

/** Options of `parseFormula` for languages built on the formula language (the update rules). */
export interface ParseOptions {
  /** The functions calls may name, with their argument counts. Default: the formula language's FUNCTIONS. */
  functions?: ReadonlyMap<string, Arity>;
}

/**
 * Parses formula text. On success the tree's spans index into `text`; on failure every problem found
 * is listed in text order, each with its span and a message naming the 1-based column.
 */
export function parseFormula(text: string, options: ParseOptions = {}): { ok: true; ast: Expr } | { ok: false; errors: FormulaError[] } {
  if (text.length > MAX_FORMULA_LENGTH) {
    return {
      ok: false,
      errors: [errorAt(`formula is too long (${text.length} characters, at most ${MAX_FORMULA_LENGTH})`, { start: MAX_FORMULA_LENGTH, end: text.length })],
    };
  }
  const { tokens, errors: lexErrors } = tokenize(text);
  const parser = new Parser(tokens, options.functions ?? FUNCTIONS);
  let ast: Expr | undefined;
  try {
    ast = parser.parseFormula();
  } catch (error) {
    if (!(error instanceof NestingTooDeep)) throw error;
    parser.errors.push(errorAt(`formula is nested too deeply (more than ${MAX_NESTING} levels)`, spanOf(error.at)));
  }
  const errors = [...lexErrors, ...parser.errors].sort((a, b) => a.start - b.start || a.end - b.end);
  if (errors.length > 0 || ast === undefined) return { ok: false, errors };
  return { ok: true, ast };
}
