import { parseFormula, type Expr, type Span } from '../expr';
import type { RuleAst, Statement } from './ast';
import { LineIndex, fromFormulaError, ruleErrorAt, type RuleError } from './errors';
import { RULE_FUNCTIONS } from './functions';

/**
 * The parser of the update-rule language. A rule is a list of lines; each holds one statement, a
 * comment (`#` to the end of the line) or nothing:
 *
 *   statement = [ "hyper" | "state" | "let" ] , name , "=" , expression ;
 *
 * where `expression` is the formula language (parser.ts of expr/, with the functions of functions.ts
 * here). Lines are split first; the right-hand side of each is parsed by the formula parser and its
 * spans shifted into the rule text, so every error names the line and column in the whole rule.
 * Errors are collected over all lines.
 */

/** Most lines a rule may have (a rule is a few lines of state updates). */
export const MAX_RULE_LINES = 400;
/** Longest rule text accepted, in UTF-16 code units. */
export const MAX_RULE_LENGTH = 20_000;

const HEAD = /^(\s*)(?:(hyper|state|let)(\s+))?([A-Za-z_][A-Za-z0-9_]*)\s*$/;

export function parseRule(text: string): { ok: true; ast: RuleAst; lines: LineIndex } | { ok: false; errors: RuleError[]; lines: LineIndex } {
  const lines = new LineIndex(text);
  if (lines.lineCount > MAX_RULE_LINES) {
    const start = lines.lineStart(MAX_RULE_LINES + 1);
    return {
      ok: false,
      lines,
      errors: [ruleErrorAt(lines, `rule is too long (${lines.lineCount} lines, at most ${MAX_RULE_LINES})`, start, text.length)],
    };
  }
  if (text.length > MAX_RULE_LENGTH) {
    return {
      ok: false,
      lines,
      errors: [ruleErrorAt(lines, `rule is too long (${text.length} characters, at most ${MAX_RULE_LENGTH})`, MAX_RULE_LENGTH, text.length)],
    };
  }
  const statements: Statement[] = [];
  const errors: RuleError[] = [];
  for (let line = 1; line <= lines.lineCount; line++) {
    const from = lines.lineStart(line);
    const to = line < lines.lineCount ? lines.lineStart(line + 1) - 1 : text.length;
    const statement = parseLine(text.slice(from, to), from, lines, errors);
    if (statement) statements.push(statement);
  }
  if (statements.length === 0 && errors.length === 0) errors.push(ruleErrorAt(lines, 'empty rule', 0, 0, 'a rule needs at least a line x = ...'));
  if (errors.length > 0) return { ok: false, errors: errors.sort((a, b) => a.start - b.start), lines };
  return { ok: true, ast: { statements }, lines };
}

function parseLine(raw: string, from: number, lines: LineIndex, errors: RuleError[]): Statement | undefined {
  const hash = raw.indexOf('#');
  const code = (hash >= 0 ? raw.slice(0, hash) : raw).replace(/\r$/, '');
  if (code.trim() === '') return undefined;
  const firstCharacter = from + code.search(/\S/);
  const eq = code.indexOf('=');
  const head = HEAD.exec(eq >= 0 ? code.slice(0, eq) : code);
  const report = (message: string, start: number, end: number, note?: string) => errors.push(ruleErrorAt(lines, message, start, end, note));

  if (eq < 0) {
    const end = from + code.trimEnd().length;
    if (head?.[2] === 'hyper') report(`hyperparameter '${head[4]}' needs a default value`, firstCharacter, end, `write hyper ${head[4]} = <number>`);
    else if (head?.[2] === 'state') report(`state '${head[4]}' needs an initial value`, firstCharacter, end, `write state ${head[4]} = 0`);
    else if (head?.[2] === 'let') report(`'let ${head[4]}' needs a value`, firstCharacter, end, `write let ${head[4]} = <expression>`);
    else report("expected a statement 'name = expression'", firstCharacter, end, "or 'hyper name = value', 'state name = initial value', 'let name = expression'");
    return undefined;
  }
  const compound = /^\s*([A-Za-z_][A-Za-z0-9_]*)\s*([-+*/^])$/.exec(code.slice(0, eq));
  if (compound) {
    const [, name, op] = compound;
    report(`'${op}=' is not an operator`, from + eq - 1, from + eq + 1, `write ${name} = ${name} ${op} ...`);
    return undefined;
  }
  if (!head) {
    const start = firstCharacter < from + eq ? firstCharacter : from + eq;
    report("expected a name before '='", start, from + eq, "statements read 'name = expression', 'hyper name = value', 'state name = initial value' or 'let name = expression'");
    return undefined;
  }
  const rhsOffset = from + eq + 1;
  const rhs = code.slice(eq + 1);
  if (rhs.trim() === '') {
    report("missing expression after '='", from + eq, from + eq + 1);
    return undefined;
  }
  const parsed = parseFormula(rhs, { functions: RULE_FUNCTIONS });
  if (!parsed.ok) {
    for (const e of parsed.errors) errors.push(fromFormulaError(lines, e, rhsOffset));
    return undefined;
  }
  const nameStart = from + head[1].length + (head[2] ? head[2].length + head[3].length : 0);
  const nameSpan = { start: nameStart, end: nameStart + head[4].length };
  const value = shiftSpans(parsed.ast, rhsOffset);
  const span = { start: firstCharacter, end: from + code.trimEnd().length };
  return { kind: (head[2] as 'hyper' | 'state' | 'let' | undefined) ?? 'assign', name: head[4], nameSpan, value, span };
}

function shift(span: Span, offset: number): Span {
  return { start: span.start + offset, end: span.end + offset };
}

/** The same tree with every span moved by `offset`. */
export function shiftSpans(node: Expr, offset: number): Expr {
  const span = shift(node.span, offset);
  switch (node.kind) {
    case 'number':
    case 'name':
      return { ...node, span };
    case 'unary':
      return { ...node, operand: shiftSpans(node.operand, offset), span };
    case 'binary':
      return { ...node, left: shiftSpans(node.left, offset), right: shiftSpans(node.right, offset), span };
    case 'call':
      return { ...node, args: node.args.map((a) => shiftSpans(a, offset)), span };
  }
}
