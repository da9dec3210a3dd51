/**
 * The code-generation guarantee: no user text reaches `new Function`. Generated source is made only of
 * allowlisted tokens; hostile formulas are rejected by the parser or compiled into harmless indexed reads.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FormulaSyntaxError, compileFormula, evaluateFormula, parseFormula, printFormula, type Expr } from '../../../src/engine/expr';
import { assertSafeSource, formatNumber } from '../../../src/engine/expr/codegen';
import { formulaProgram, modelProgram } from '../../../src/engine/expr/compile';
import { name, numericFormula } from './arbitraries';

/**
 * An independent statement of the allowlist (codegen.ts checks its own): the whole source must be a
 * sequence of these tokens and nothing else.
 */
const ALLOWED_SOURCE =
  /^(?:[ \n]+|"use strict"|const\b|return\b|function\b|value(?:Gradient(?:Hessian)?)?\b|K\.[a-z0-9]+\b|m_[a-z0-9]+\b|t\d+\b|[xvcgh]\[\d+\]|\d+(?:\.\d+)?(?:e[+-]\d+)?|<=|[(){};,=+\-*/?:<]|[xvcgh]\b|K\b)*$/;

/** Names that mean something to JavaScript, the page or Node, used as variable names below. */
const HOSTILE_NAMES = [
  'constructor', '__proto__', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', 'process', 'require', 'globalThis',
  'window', 'eval', 'Function', 'alert', 'this', 'return', 'const', 'Math', 'K', 'c', 'g', 'h', 't0', 'm_exp', 'undefined', 'NaN',
];

/** Replaces x, y, z in a tree by other names. */
function rename(tree: Expr, names: readonly string[]): Expr {
  const map: Record<string, string> = { x: names[0], y: names[1], z: names[2] };
  const visit = (node: Expr): Expr => {
    switch (node.kind) {
      case 'number':
        return node;
      case 'name':
        return name(Object.prototype.hasOwnProperty.call(map, node.name) ? map[node.name] : node.name);
      case 'unary':
        return { ...node, operand: visit(node.operand) };
      case 'binary':
        return { ...node, left: visit(node.left), right: visit(node.right) };
      case 'call':
        return { ...node, args: node.args.map(visit) };
    }
  };
  return visit(tree);
}

function rejection(text: string): string[] {
  try {
    compileFormula(text);
  } catch (error) {
    if (error instanceof FormulaSyntaxError) return error.errors.map((e) => e.message);
    throw error;
  }
  throw new Error(`'${text}' compiled`);
}

describe('generated source', () => {
  it('contains only allowlisted tokens, and does not depend on the names in the formula (fast-check)', () => {
    const names = fc.uniqueArray(fc.constantFrom(...HOSTILE_NAMES), { minLength: 3, maxLength: 3 });
    fc.assert(
      fc.property(numericFormula('kinked', 3), names, (tree, chosen) => {
        const hostile = formulaProgram(printFormula(rename(tree, chosen)), { variables: chosen }).program.source;
        const plain = formulaProgram(printFormula(tree), { variables: ['x', 'y', 'z'] }).program.source;
        expect(hostile).toMatch(ALLOWED_SOURCE);
        // Byte for byte the same program as with x, y, z: no name reaches the source.
        expect(hostile).toBe(plain);
      }),
      { numRuns: 200 },
    );
  });

  it('of models too: inputs and constants become v[i] and c[i]', () => {
    const { program } = modelProgram('constructor * exp(-__proto__ * toString) + valueOf', {
      parameters: ['constructor', '__proto__'],
      inputs: ['toString'],
      constants: { valueOf: 1 },
    });
    expect(program.source).toMatch(ALLOWED_SOURCE);
    expect(program.source).toContain('v[0]');
    expect(program.source).toContain('c[0]');
    expect(program.source).not.toMatch(/constructor|__proto__|toString|valueOf/);
  });
});

describe('assertSafeSource', () => {
  it.each([
    'alert(1)',
    'return x["constructor"]',
    'const t1 = this;',
    'const t1 = K.constructor;',
    'const t1 = x[t0];',
    'const t1 = `x`;',
    'c.constructor',
    'process.exit()',
    'const t1 = x[0]; "use strict"',
    'm_eval(1)',
    'const t1 = 1;\u2028',
  ])('rejects %j', (source) => {
    expect(() => assertSafeSource(source)).toThrow(/codegen: disallowed/);
  });

  it('accepts the shapes the generator emits', () => {
    expect(() => assertSafeSource('"use strict";\nconst m_exp = K.exp;\nreturn { value: function (x) { const t1 = x[0]; const t2 = m_exp(t1); return t2 <= 1 ? t2 : (-2.5e-7); }, };')).not.toThrow();
  });
});

describe('formatNumber', () => {
  it('emits finite numbers only, round-tripping', () => {
    for (const v of [0, 1, 0.1, 1 / 3, 1e21, 5e-324, Number.MAX_VALUE, -2.5, -0]) {
      const text = formatNumber(v);
      // Reading the literal back with Number() (no evaluation) gives the same double.
      expect(Object.is(Number(text.replace(/^\(-(.*)\)$/, '-$1')), v)).toBe(true);
    }
    expect(formatNumber(-0)).toBe('(-0)');
    for (const v of [NaN, Infinity, -Infinity]) expect(() => formatNumber(v)).toThrow(/non-finite/);
  });
});

describe('hostile formulas', () => {
  it.each<[string, string[]]>([
    ['alert(1)', ["unknown function 'alert' at column 1"]],
    ['constructor(1)', ["unknown function 'constructor' at column 1"]],
    ['toString(x)', ["unknown function 'toString' at column 1"]],
    ['__proto__(x)', ["unknown function '__proto__' at column 1"]],
    ['x;process.exit()', [
      "unexpected character ';' at column 2",
      "unexpected character '.' at column 10",
      "unknown function 'exit' at column 11; did you mean 'exp'?",
    ]],
    ['x["constructor"]', ["unexpected characters '[\"' at column 2", "unexpected characters '\"]' at column 15"]],
    ['`${x}`', ["unexpected characters '`${' at column 1", "unexpected characters '}`' at column 5"]],
    ['\u0455in(x)', [
      "unexpected character U+0455 '\u0455' at column 1; names use the letters A-Z, a-z and _ only",
      "unknown function 'in' at column 2; did you mean 'sin'?",
    ]],
    ['x\u200b+ y', ['unexpected character U+200B at column 2']],
    ['x // y', ["missing operand after '/' at column 3"]],
    ['x /* y */', ["missing operand after '/' at column 3", "missing operand after '*' at column 8", "missing operand after '/' at column 9"]],
  ])('%j is rejected: %j', (text, messages) => {
    expect(rejection(text)).toEqual(messages);
  });

  it('compiles JavaScript-meaningful names as plain variables', () => {
    const surface = compileFormula('constructor^2 + __proto__ * toString + valueOf + hasOwnProperty');
    expect(surface.variables).toEqual(['__proto__', 'constructor', 'hasOwnProperty', 'toString', 'valueOf']);
    expect(surface.value([2, 3, 5, 7, 11])).toBe(9 + 2 * 7 + 11 + 5);
  });

  it('reads constants only from own keys, even for __proto__', () => {
    const constants = JSON.parse('{"__proto__": 4}') as Record<string, number>;
    const surface = compileFormula('__proto__ * x', { constants });
    expect(surface.variables).toEqual(['x']);
    expect(surface.value([2])).toBe(8);
    // An inherited key is not a constant: `constructor` here is an unknown variable, not Object.
    expect(() => compileFormula('constructor', { variables: [], constants: {} })).toThrow("unknown variable 'constructor' at column 1");
  });

  it('the evaluator does not see inherited properties of its environment either', () => {
    const parsed = parseFormula('constructor + 1');
    if (!parsed.ok) throw new Error('parse failed');
    expect(() => evaluateFormula(parsed.ast, {})).toThrow("unknown variable 'constructor' at column 1");
    expect(evaluateFormula(parsed.ast, { constructor: 2 } as unknown as Record<string, number>)).toBe(3);
  });
});
