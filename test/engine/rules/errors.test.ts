import { describe, expect, it } from 'vitest';
import { compileRule, MAX_RULE_LINES, ruleProblems, RuleSyntaxError, FormulaSyntaxError } from '../../../src/engine';
import { rosenbrock } from '../optim/surfaces';
import { runRule } from './run';

/** Bad rules: each a message naming the problem at its line and column (1-based), with the span. */
const cases: { name: string; text: string; message: string; line: number; column: number }[] = [
  { name: 'unknown name, with the nearest known one', text: 'hyper beta1 = 0.9\nstate m = 0\nm = bta1 * m + g\nx = x - lr * m', message: "unknown name 'bta1' at line 3, column 5; did you mean 'beta1'?", line: 3, column: 5 },
  { name: 'state read before it is declared', text: 'let d = m * g\nstate m = 0\nx = x - lr * d', message: "state 'm' is used before it is declared (on line 2) at line 1, column 9; move the declaration up", line: 1, column: 9 },
  { name: 'state assigned before it is declared', text: 'm = 0.5 * g\nstate m = 0\nx = x - lr * m', message: "state 'm' is assigned before it is declared (on line 2) at line 1, column 1; move the declaration up", line: 1, column: 1 },
  { name: 'a rule that never updates the point', text: 'state m = 0\nm = m + g', message: "the rule never updates the point at line 2, column 10; add a line such as 'x = x - lr * g'", line: 2, column: 10 },
  { name: 'hyperparameter without a default', text: 'hyper beta1\nx = x - lr * beta1 * g', message: "hyperparameter 'beta1' needs a default value at line 1, column 1; write hyper beta1 = <number>", line: 1, column: 1 },
  { name: 'hyperparameter with a non-finite default', text: '  hyper b = 1/0\nx = x - lr * b * g', message: "hyperparameter 'b' must have a finite default, got Infinity at line 1, column 13", line: 1, column: 13 },
  { name: 'hyperparameter with a literal too large', text: 'hyper b = 1e999\nx = x - lr * b * g', message: "number '1e999' is too large at line 1, column 11", line: 1, column: 11 },
  { name: 'hyperparameter default that is not a number', text: 'hyper b = c\nx = x - lr * b * g', message: "a default must be a number, not 'c' at line 1, column 11", line: 1, column: 11 },
  { name: 'formula syntax error, positioned in the rule', text: '# plain descent\n\nx = x - lr * * g', message: "missing operand after '*' at line 3, column 12", line: 3, column: 12 },
  { name: 'initial value reading the gradient', text: 'state m = g\nx = x - lr * m', message: "'g' has no value before the first step at line 1, column 11; an initial value may use numbers, hyperparameters and x", line: 1, column: 11 },
  { name: 'assigning an input', text: 'g = 2\nx = x - lr * g', message: "'g' is an input and cannot be assigned at line 1, column 1; assign x (the new point) or a state variable", line: 1, column: 1 },
  { name: 'declaring a built-in name', text: 'hyper lr = 1\nx = x - lr * g', message: "'lr' is built in and cannot be declared at line 1, column 7; x is the point, g the gradient, t the step, lr the learning rate", line: 1, column: 7 },
  { name: 'declaring twice', text: 'state m = 0\nstate m = 1\nx = x - lr * g', message: "'m' is already declared (on line 1) at line 2, column 7", line: 2, column: 7 },
  { name: 'nested reductions', text: 'x = x - lr * norm(norm(g))', message: "reductions do not nest ('norm' inside another reduction) at line 1, column 19", line: 1, column: 19 },
  { name: 'clip with two arguments', text: 'x = x - lr * clip(g, -1)', message: 'clip takes 3 arguments, got 2 at line 1, column 14', line: 1, column: 14 },
  { name: 'state without an initial value', text: 'state q\nx = x - g', message: "state 'q' needs an initial value at line 1, column 1; write state q = 0", line: 1, column: 1 },
  { name: 'assigning a hyperparameter', text: 'hyper b = 1\nb = 2\nx = x - lr * g', message: "hyperparameter 'b' cannot be assigned; it is fixed during a run at line 2, column 1", line: 2, column: 1 },
  { name: 'assigning an undeclared state', text: 'state mom = 0\nmon = g\nx = x - lr * mom', message: "unknown state 'mon' at line 2, column 1; did you mean 'mom'?", line: 2, column: 1 },
  { name: 'a line that is not a statement', text: 'x = x - lr * g\n2 * m = g', message: "expected a name before '=' at line 2, column 1; statements read 'name = expression', 'hyper name = value', 'state name = initial value' or 'let name = expression'", line: 2, column: 1 },
  { name: 'a compound assignment', text: 'state m = 0\nm += g\nx = x - lr * m', message: "'+=' is not an operator at line 2, column 3; write m = m + ...", line: 2, column: 3 },
  { name: 'empty rule', text: '# nothing yet\n', message: 'empty rule at line 1, column 1; a rule needs at least a line x = ...', line: 1, column: 1 },
];

describe('rule errors name the line and column', () => {
  it.each(cases)('$name', ({ text, message, line, column }) => {
    const problems = ruleProblems(text);
    expect(problems[0].message).toBe(message);
    expect(problems[0]).toMatchObject({ line, column });
    // The span starts at that line and column.
    const lines = text.slice(0, problems[0].start).split('\n');
    expect(lines.length).toBe(line);
    expect(lines[lines.length - 1].length + 1).toBe(column);
  });

  it('throws a RuleSyntaxError (a FormulaSyntaxError) listing every problem, in text order', () => {
    // Syntax errors of all lines are listed together; name checks follow once every line parses.
    expect(ruleProblems('hyper a\nx = (g\nx = x - * g').map((e) => e.line)).toEqual([1, 2, 3]);
    const text = 'state m = g\nx = x - lr * zz\nb = 1';
    let caught: unknown;
    try {
      compileRule(text);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(RuleSyntaxError);
    expect(caught).toBeInstanceOf(FormulaSyntaxError);
    expect((caught as RuleSyntaxError).errors.map((e) => e.line)).toEqual([1, 2, 3]);
  });

  it('a 10,000-line rule is refused at the first line over the limit, quickly', () => {
    const text = 'x = x - lr * g\n'.repeat(10_000);
    const t0 = performance.now();
    const problems = ruleProblems(text);
    expect(performance.now() - t0).toBeLessThan(1000);
    expect(problems).toHaveLength(1);
    expect(problems[0].message).toBe(`rule is too long (10001 lines, at most ${MAX_RULE_LINES}) at line ${MAX_RULE_LINES + 1}, column 1`);
  });

  it('a long single line is refused by its length', () => {
    const text = `x = x - lr * (${'g + '.repeat(6000)}g)`;
    expect(ruleProblems(text)[0].message).toBe(`rule is too long (${text.length} characters, at most 20000) at line 1, column 20001`);
  });
});

describe('compile-time warnings', () => {
  it('a division by a state that is still at its initial 0 on the first step', () => {
    const { warnings } = compileRule('state v = 0\nx = x - lr * g / sqrt(v)\nv = v + g * g');
    expect(warnings.map((w) => w.message)).toEqual(['division by zero on the first step: the denominator reads state that starts at 0 at line 2, column 18; add a small constant (eps) or update the state first']);
  });

  it('no warning once the state is updated before the division, or with an epsilon, or a non-zero start', () => {
    expect(compileRule('state v = 0\nv = v + g * g\nx = x - lr * g / sqrt(v)').warnings).toEqual([]);
    expect(compileRule('hyper eps = 1e-8\nstate v = 0\nx = x - lr * g / (sqrt(v) + eps)\nv = v + g * g').warnings).toEqual([]);
    expect(compileRule('state v = 1\nx = x - lr * g / v\nv = v + g * g').warnings).toEqual([]);
  });

  it('a hyperparameter default of 0 in the denominator with a zero state counts too', () => {
    const { warnings } = compileRule('hyper eps = 0\nstate v = 0\nx = x - lr * g / (v + eps)\nv = v + g * g');
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ line: 3, column: 19 }); // the v of (v + eps)
  });
});

describe('at run time', () => {
  it('a division by a state still at 0 makes the run loop report divergence at step 1 (the warning foretold it)', () => {
    const text = 'state v = 0\nx = x - lr * g / v\nv = v + g * g';
    expect(compileRule(text).warnings).toHaveLength(1);
    const batch = runRule(rosenbrock, text, { learningRate: 0.01 }, [-1.2, 1], 10);
    expect(batch.outcome).toMatchObject({ kind: 'diverged', step: 1 });
  });
});

