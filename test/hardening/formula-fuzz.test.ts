/**
 * Seeded fuzzing of the formula pipeline (parser, derivatives, code generation) with 12,000 token
 * strings: half are well-formed expressions with up to three random edits, half are random token
 * soup, plus 4,000 strings of random characters for the lexer. Each input must give either
 *  - a parse error (or compile error) with a span inside the text and "at column <start + 1>", or
 *  - a compiled surface whose exact gradient and Hessian agree with central finite differences
 *    wherever the function is smooth enough for finite differences to be trusted (two step sizes
 *    agree), and whose generated source is byte for byte the source of the same formula with every
 *    variable renamed to a neutral name (so no identifier of the input reaches `new Function`) and
 *    holds no string literal but the "use strict" prologue.
 * Bounds instead of timing: at most 40 tokens per input and a generated source of at most 400
 * characters per input character (an exponential blow-up of derivatives would fail that).
 */
import { describe, expect, it } from 'vitest';
import { FUNCTIONS, FormulaSyntaxError, parseFormula, type FormulaError } from '../../src/engine';
import { formulaProgram } from '../../src/engine/expr/compile';

/** mulberry32 (Tommy Ettinger's 32-bit generator): small, seeded, independent of the engine's rng. */
function generator(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (n: number) => Math.floor(next() * n);
  const pick = <T>(list: readonly T[]): T => list[int(list.length)];
  return { next, int, pick };
}
type Rng = ReturnType<typeof generator>;

/** Variable names, many of them meaningful to JavaScript; all are ordinary variables to the language. */
const VARIABLES = ['x', 'y', 'z', 'constructor', '__proto__', 'toString', 'process', 'alert', 'window', 'eval', 'Function', 'this', 'return', 'K', 'c', 'g', 't0', 'm_exp', 'NaN', 'Infinity', 'undefined', 'require'];
const NEUTRAL = (k: number) => `q${k}`;
const UNARY = [...FUNCTIONS.values()].filter((f) => f.maxArgs === 1).map((f) => f.name);
const OPERATORS = ['+', '-', '*', '/', '^', '**'];
const JUNK = [';', '.', '[', ']', '"', "'", '`', '=', '{', '}', '\\', '$', '#', '!', '&&', '||', '=>', '\u2212', '\u00a0', '\u0000', '\u{1F600}', '\n', '/*', '*/', '//', 'e', 'pi', '1e999', '0x10', '1.2.3', 'sin', 'max', 'foo'];

type Token = { text: string; variable?: number };

/** A well-formed expression as tokens, depth-limited. */
function expression(rng: Rng, depth: number, out: Token[]): void {
  const r = rng.next();
  if (depth <= 0 || r < 0.3) {
    if (rng.next() < 0.55) out.push({ text: '', variable: rng.int(VARIABLES.length) });
    else out.push({ text: rng.pick(['0', '1', '2', '0.5', '3', '1e-3', '2.5E+1', '.25', 'pi', 'e']) });
  } else if (r < 0.6) {
    expression(rng, depth - 1, out);
    out.push({ text: rng.pick(OPERATORS) });
    expression(rng, depth - 1, out);
  } else if (r < 0.85) {
    out.push({ text: rng.pick(UNARY) }, { text: '(' });
    expression(rng, depth - 1, out);
    out.push({ text: ')' });
  } else if (r < 0.93) {
    out.push({ text: rng.pick(['min', 'max']) }, { text: '(' });
    expression(rng, depth - 1, out);
    out.push({ text: ',' });
    expression(rng, depth - 1, out);
    out.push({ text: ')' });
  } else {
    out.push({ text: rng.pick(['-', '+', '(']) });
    const opened = out[out.length - 1].text === '(';
    expression(rng, depth - 1, out);
    if (opened) out.push({ text: ')' });
  }
}

function randomToken(rng: Rng): Token {
  const r = rng.next();
  if (r < 0.3) return { text: '', variable: rng.int(VARIABLES.length) };
  if (r < 0.5) return { text: rng.pick([...OPERATORS, '(', ')', ',']) };
  if (r < 0.65) return { text: rng.pick(UNARY) };
  if (r < 0.8) return { text: rng.pick(['0', '1', '2.5', '1e3', '.5']) };
  return { text: rng.pick(JUNK) };
}

function tokenString(rng: Rng): Token[] {
  if (rng.next() < 0.5) return Array.from({ length: 1 + rng.int(40) }, () => randomToken(rng));
  const tokens: Token[] = [];
  expression(rng, 1 + rng.int(5), tokens);
  for (let edits = rng.next() < 0.5 ? 0 : 1 + rng.int(3); edits > 0 && tokens.length > 0; edits--) {
    const at = rng.int(tokens.length);
    const kind = rng.int(3);
    if (kind === 0) tokens.splice(at, 1);
    else if (kind === 1) tokens.splice(at, 0, randomToken(rng));
    else tokens[at] = randomToken(rng);
  }
  return tokens.slice(0, 40);
}

/** The text, and the same text with every variable renamed to q<index of first use>. */
function render(tokens: Token[], rng: Rng): { text: string; neutral: string; variables: string[]; neutralVariables: string[] } {
  const order: number[] = [];
  const parts: string[] = [];
  const neutralParts: string[] = [];
  for (const t of tokens) {
    const space = rng.pick(['', '', ' ', '  ', '\t']);
    if (t.variable === undefined) {
      parts.push(space + t.text);
      neutralParts.push(space + t.text);
    } else {
      if (!order.includes(t.variable)) order.push(t.variable);
      parts.push(space + VARIABLES[t.variable]);
      neutralParts.push(space + NEUTRAL(order.indexOf(t.variable)));
    }
  }
  return { text: parts.join(''), neutral: neutralParts.join(''), variables: order.map((v) => VARIABLES[v]), neutralVariables: order.map((_, k) => NEUTRAL(k)) };
}

/** A failed check names the input (plain throws: thousands of expect() calls would dominate the run time). */
function check(ok: boolean, why: () => string): void {
  if (!ok) throw new Error(why());
}

function expectPositioned(errors: readonly FormulaError[], text: string): void {
  check(errors.length > 0, () => `${JSON.stringify(text)}: rejected without a message`);
  for (const e of errors) {
    const where = () => `${JSON.stringify(text)}: ${e.message} [${e.start}, ${e.end})`;
    check(e.start >= 0 && e.end >= e.start && e.end <= text.length, where);
    check(e.message.includes(`at column ${e.start + 1}`), where);
  }
}

/** Identifiers the generated source may contain (the generator's own vocabulary, never the user's). */
const SOURCE_WORD = /^(?:use|strict|const|return|function|value|valueGradient|valueGradientHessian|K|x|c|g|h|v|t\d+|m_[a-z0-9]+|[a-z0-9]+)$/;

describe('formula fuzz (seeded)', () => {
  it('12,000 token strings: positioned errors, or exact derivatives and source free of the input', () => {
    const rng = generator(20_260_402);
    let parsed = 0;
    let rejected = 0;
    let gradientChecks = 0;
    let hessianChecks = 0;
    for (let k = 0; k < 12_000; k++) {
      const { text, neutral, variables, neutralVariables } = render(tokenString(rng), rng);
      const result = parseFormula(text);
      if (!result.ok) {
        expectPositioned(result.errors, text);
        rejected++;
        continue;
      }
      let compiled: ReturnType<typeof formulaProgram>;
      try {
        compiled = formulaProgram(text, { variables });
      } catch (e) {
        if (!(e instanceof FormulaSyntaxError)) throw e;
        expectPositioned(e.errors, text);
        rejected++;
        continue;
      }
      parsed++;
      const source = compiled.program.source;
      check(source.length <= 400 * Math.max(10, text.length), () => `${text}: ${source.length} characters of source`);
      // No identifier or string of the input reaches the source: renaming every variable changes nothing.
      check(source === formulaProgram(neutral, { variables: neutralVariables }).program.source, () => `${text}: the source depends on the names`);
      check(!/["'`]/.test(source.replace(/^"use strict"/, '')), () => `${text}: a string literal in the source`);
      for (const word of source.match(/[A-Za-z_$][\w$]*/g) ?? []) check(SOURCE_WORD.test(word), () => `${word} in the source of ${text}`);

      const counts = checkDerivatives(text, compiled, variables.length, rng);
      gradientChecks += counts.gradient;
      hessianChecks += counts.hessian;
    }
    // The table must exercise both branches and really compare derivatives.
    expect(parsed).toBeGreaterThan(3_000);
    expect(rejected).toBeGreaterThan(3_000);
    expect(gradientChecks).toBeGreaterThan(3_000);
    expect(hessianChecks).toBeGreaterThan(1_000);
  });

  it('4,000 strings of random characters: every error is positioned and never thrown', () => {
    const rng = generator(7);
    const alphabet = [...'xyz019.+-*/^(),eE _;[]"\'`={}\\$#!\t\n', '\u2212', '\u00d7', '\u00b2', '\u03c0', '\u0000', '\u200b', '\u{1F600}', '\uD800'];
    for (let k = 0; k < 4_000; k++) {
      const text = Array.from({ length: rng.int(30) }, () => rng.pick(alphabet)).join('');
      const result = parseFormula(text);
      if (!result.ok) expectPositioned(result.errors, text);
    }
  });
});

/**
 * Central differences of the value (for the gradient) and of the compiled gradient (for the Hessian)
 * at one random point, compared only where two step sizes agree (the function is smooth there).
 */
function checkDerivatives(text: string, compiled: ReturnType<typeof formulaProgram>, n: number, rng: Rng): { gradient: number; hessian: number } {
  if (n === 0) return { gradient: 0, hessian: 0 };
  const f = compiled.program.instantiate(compiled.constants);
  const x = Float64Array.from({ length: n }, () => -1.5 + 3 * rng.next());
  const grad = new Float64Array(n);
  const hess = new Float64Array(n * n);
  const value = f.valueGradientHessian(x, grad, hess);
  if (!Number.isFinite(value) || !grad.every(Number.isFinite) || !hess.every(Number.isFinite)) return { gradient: 0, hessian: 0 };
  const counts = { gradient: 0, hessian: 0 };
  const scratch = new Float64Array(n);
  const at = (i: number, step: number, read: (y: Float64Array) => number) => {
    const y = Float64Array.from(x);
    y[i] += step;
    const up = read(y);
    y[i] = x[i] - step;
    return (up - read(y)) / (2 * step);
  };
  const agree = (a: number, b: number, scale: number) => Math.abs(a - b) <= 1e-4 * (1 + scale);
  // Rounding in f(x + h) - f(x - h) is about 1e-16 |f| / h: where that is not far below the tolerance
  // (a huge constant term beside a small varying one), differences cannot resolve the slope.
  const resolvable = (magnitude: number, step: number, slope: number) => (1e-15 * magnitude) / step < 1e-6 * (1 + Math.abs(slope));
  for (let i = 0; i < n; i++) {
    const h = 1e-4 * (1 + Math.abs(x[i]));
    const coarse = at(i, h, (y) => f.value(y));
    const fine = at(i, h / 4, (y) => f.value(y));
    if (Number.isFinite(coarse) && Number.isFinite(fine) && agree(coarse, fine, Math.abs(fine)) && resolvable(Math.abs(value), h / 4, fine)) {
      check(agree(grad[i], fine, Math.abs(fine)), () => `${text} at ${x.join(', ')}: d/dx${i}: exact ${grad[i]}, differences ${fine}`);
      counts.gradient++;
    }
    for (let j = 0; j < n; j++) {
      const gj = (y: Float64Array) => (f.valueGradient(y, scratch), scratch[j]);
      const hc = at(i, h, gj);
      const hf = at(i, h / 4, gj);
      if (Number.isFinite(hc) && Number.isFinite(hf) && agree(hc, hf, Math.abs(hf)) && resolvable(Math.abs(grad[j]), h / 4, hf)) {
        check(agree(hess[i * n + j], hf, Math.abs(hf)), () => `${text} at ${x.join(', ')}: d2/dx${i}dx${j}: exact ${hess[i * n + j]}, differences ${hf}`);
        counts.hessian++;
      }
    }
  }
  return counts;
}
