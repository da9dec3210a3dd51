/**
 * The formula language's code-generation guarantee, extended to rules (test/engine/expr/safety.test.ts
 * is the formula version): fuzzed rule texts never throw anything but a positioned RuleSyntaxError,
 * never hang, and no character of the rule text reaches the generated source.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileRule, printFormula, RULE_LIBRARY, RuleSyntaxError, type Expr } from '../../../src/engine';
import { assertSafeRuleSource } from '../../../src/engine/rules/codegen';
import { numericFormula } from '../expr/arbitraries';

/** An independent statement of the rule allowlist (codegen.ts checks its own). */
const ALLOWED_SOURCE =
  /^(?:[ \n]+|"use strict"|const\b|let\b|for\b|return\b|function\b|step\b|init\b|K\.[a-z0-9]+\b|x\.length\b|m_[a-z0-9]+\b|[swhklr]\d+\b|(?:[xgswh]|[sw]\d+)\[(?:\d+|i)\]|\d+(?:\.\d+)?(?:e[+-]\d+)?|\+\+|\+=|[(){};,:=+\-*/<]|[xgswhnikK]\b|lr\b|t\b)*$/;

const HOSTILE_NAMES = [
  'constructor', '__proto__', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', 'process', 'require', 'globalThis',
  'window', 'eval', 'Function', 'alert', 'this', 'return', 'const', 'Math', 'K', 'h0', 's1', 'k0', 'w', 'n', 'i', 'm_exp', 'undefined', 'NaN', 'Infinity',
];

/** Compiles, and checks that any failure is a RuleSyntaxError whose every entry is positioned in the text. */
function compileOrPositioned(text: string): string | null {
  try {
    return compileRule(text).source;
  } catch (error) {
    if (!(error instanceof RuleSyntaxError)) throw error;
    expect(error.errors.length).toBeGreaterThan(0);
    for (const e of error.errors) {
      expect(e.start).toBeGreaterThanOrEqual(0);
      expect(e.end).toBeLessThanOrEqual(text.length);
      expect(e.message).toContain(` at line ${e.line}, column ${e.column}`);
      const before = text.slice(0, e.start).split('\n');
      expect([before.length, before[before.length - 1].length + 1]).toEqual([e.line, e.column]);
    }
    return null;
  }
}

const PIECES = [
  'hyper ', 'state ', 'let ', 'x', 'g', 't', 'lr', 'm', 'v', 'beta', ' = ', '=', '+', '-', '*', '/', '^', '(', ')', ',', ' ', '\n', '\n',
  '#', '# note\n', '0', '1', '0.9', '1e-8', '1e999', '.', 'sqrt(', 'norm(', 'dot(', 'sum(', 'largest(', 'clip(', 'sign(', 'max(', 'min(',
  'constructor', '__proto__', '"', "'", '`', '${', '}', ';', '\\', '\u2212', '\u00d7', 'é', '\ud83d\ude00', '\r\n', '\t', '**', '+=',
];

describe('fuzzed rule texts', () => {
  it('token soups: compile, or fail with positioned RuleSyntaxErrors only, quickly (fast-check)', () => {
    const soup = fc.array(fc.constantFrom(...PIECES), { maxLength: 60 }).map((p) => p.join(''));
    fc.assert(
      fc.property(soup, (text) => {
        const t0 = performance.now();
        const source = compileOrPositioned(text);
        expect(performance.now() - t0).toBeLessThan(250);
        if (source !== null) expect(source).toMatch(ALLOWED_SOURCE);
      }),
      { numRuns: 3000 },
    );
  });

  it('rule-shaped texts with random statements mostly compile, and every source is allowlisted (fast-check)', () => {
    const target = fc.constantFrom('x', 'x', 'm', 'm', 'v', 'v', 'let b', 'state m', 'q');
    const line = fc.tuple(target, fc.array(fc.constantFrom('x', 'g', 't', 'lr', 'm', 'v', 'a', 'beta', '2', '0.5', 'norm(g)', 'sum(x*g)', 'clip(g, -1, 1)', 'sign(m)', 'sqrt(v + 1)'), { minLength: 1, maxLength: 4 }), fc.constantFrom(' + ', ' * ', ' - ', ' / '));
    const rule = fc.array(line, { minLength: 1, maxLength: 8 }).map((lines) => 'hyper beta = 0.9\nstate m = 0\nstate v = 1\nlet a = g\n' + lines.map(([lhs, terms, op]) => `${lhs} = ${terms.join(op)}`).join('\n') + '\nx = x - lr * g');
    let compiled = 0;
    fc.assert(
      fc.property(rule, (text) => {
        const source = compileOrPositioned(text);
        if (source !== null) {
          compiled++;
          expect(source).toMatch(ALLOWED_SOURCE);
          // The generated functions run (no name out of scope, no loop that reads a let of another loop).
          const rule = compileRule(text);
          const x = Float64Array.of(0.5, -1, 2);
          const states = rule.stateNames.map(() => new Float64Array(3));
          const scratch = Array.from({ length: rule.scratchCount }, () => new Float64Array(3));
          const h = Float64Array.from(rule.hyperparameters, (p) => p.default);
          rule.kernels.init(x, states, h);
          for (let t = 1; t <= 3; t++) rule.kernels.step(x, Float64Array.of(1, 2, 3), states, scratch, h, t, 0.1);
        }
      }),
      { numRuns: 2000 },
    );
    expect(compiled).toBeGreaterThan(200);
  });

  it('arbitrary strings (any code points) never throw anything else (fast-check)', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 200 }), (text) => void compileOrPositioned(text)), { numRuns: 2000 });
  });
});

/** A tree over x, y, z with y and z renamed to the gradient and a state variable. */
function renamed(tree: Expr, names: Record<string, string>): string {
  const visit = (node: Expr): Expr => {
    switch (node.kind) {
      case 'number':
        return node;
      case 'name':
        return Object.prototype.hasOwnProperty.call(names, node.name) ? { ...node, name: names[node.name] } : node;
      case 'unary':
        return { ...node, operand: visit(node.operand) };
      case 'binary':
        return { ...node, left: visit(node.left), right: visit(node.right) };
      case 'call':
        return { ...node, args: node.args.map(visit) };
    }
  };
  return printFormula(visit(tree));
}

describe('generated rule source', () => {
  it('does not depend on the names a rule declares, and holds only allowlisted tokens (fast-check)', () => {
    const names = fc.uniqueArray(fc.constantFrom(...HOSTILE_NAMES), { minLength: 3, maxLength: 3 });
    fc.assert(
      fc.property(numericFormula('kinked', 3), names, (tree, [state, hyper, local]) => {
        const text = (s: string, h: string, l: string) =>
          `hyper ${h} = 0.5\nstate ${s} = x * ${h}\nlet ${l} = ${renamed(tree, { x: 'x', y: 'g', z: s })}\n${s} = ${h} * ${s} + ${l}\nx = x - lr * (${s} + norm(g) * ${h})`;
        const hostile = compileRule(text(state, hyper, local)).source;
        const plain = compileRule(text('m', 'b', 'a')).source;
        expect(hostile).toMatch(ALLOWED_SOURCE);
        expect(hostile).toBe(plain);
      }),
      { numRuns: 300 },
    );
  });

  it('of the library rules matches the allowlist', () => {
    for (const r of RULE_LIBRARY) expect(compileRule(r.text).source).toMatch(ALLOWED_SOURCE);
  });

  it('the allowlist refuses anything else', () => {
    const good = compileRule('x = x - lr * g').source;
    expect(() => assertSafeRuleSource(good)).not.toThrow();
    for (const bad of ['alert(1);', 'x.constructor', 'K["sqrt"]', 'g[i + 1]', 'this', '`x`', 'globalThis', 'K.constructor', 'x = 1; "use strict"'])
      expect(() => assertSafeRuleSource(good + '\n' + bad), bad).toThrow(/rule codegen/);
  });

  it('hostile names in a rule are just names: no property of any object is reached', () => {
    const rule = compileRule('hyper constructor = 2\nstate __proto__ = 1\nlet toString = g * constructor\n__proto__ = __proto__ + toString\nx = x - lr * __proto__');
    expect(rule.hyperparameters.map((h) => h.name)).toEqual(['constructor']);
    expect(rule.stateNames).toEqual(['__proto__']);
    expect(rule.source).not.toMatch(/constructor|__proto__|toString/);
  });
});
