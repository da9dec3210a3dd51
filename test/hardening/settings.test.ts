/**
 * Bad hyperparameters and run settings, one row per input, with the message the run editor shows
 * under the field (NumberField's own parse check first, then the optimizer's or the run's validation,
 * rewritten with the page's labels by ui/messages.ts). Values that are legal but hopeless (a learning
 * rate of 1e308) are accepted and must end the run with an outcome that says what happened.
 */
import { describe, expect, it } from 'vitest';
import { RunCursor, buildOptimizer, validateOptimizerSpec, validateRunSettings, type OptimizerSpec, type RunSettings } from '../../src/engine';
import { buildSurface } from '../../src/problems';
import { optimizerMessage, runSettingsMessage } from '../../src/ui/messages';
import { parseNumber } from '../../src/ui/fields/NumberField';

/** What typing `text` into a field labelled `label` shows before anything is applied, or the number. */
function typed(label: string, text: string): number | string {
  const parsed = parseNumber(text.trim());
  return typeof parsed === 'string' ? `${label}: ${parsed}` : parsed;
}

describe('number fields: text that is not a finite number', () => {
  it.each([
    ['', 'learning rate: a number is needed here'],
    ['abc', 'learning rate: "abc" is not a number'],
    ['NaN', 'learning rate: "NaN" is not a number'],
    ['Infinity', 'learning rate: "Infinity" is not a number'],
    ['-Infinity', 'learning rate: "-Infinity" is not a number'],
    ['1e999', 'learning rate: 1e999 is too large'],
    ['0x10', 'learning rate: "0x10" is not a number'],
    ['1,5', 'learning rate: "1,5" is not a number'],
    ['0.01; alert(1)', 'learning rate: "0.01; alert(1)" is not a number'],
    ['1e-3e2', 'learning rate: "1e-3e2" is not a number'],
  ])('%j', (text, message) => {
    expect(typed('learning rate', text)).toBe(message);
  });
});

const adam = (patch: Partial<OptimizerSpec> & Record<string, unknown>): OptimizerSpec => ({ kind: 'adam', learningRate: 0.01, ...patch }) as OptimizerSpec;

describe('optimizer settings: numbers outside their range', () => {
  it.each<[string, OptimizerSpec, string]>([
    ['learning rate 0', adam({ learningRate: 0 }), 'Adam: learning rate must be a finite number > 0, got 0'],
    ['learning rate negative', adam({ learningRate: -0.1 }), 'Adam: learning rate must be a finite number > 0, got -0.1'],
    ['learning rate NaN (from a file)', adam({ learningRate: Number.NaN }), 'Adam: learning rate must be a finite number > 0, got NaN'],
    ['learning rate Infinity (from a file)', adam({ learningRate: Infinity }), 'Adam: learning rate must be a finite number > 0, got Infinity'],
    ['learning rate as text (from a file)', adam({ learningRate: '0.1' as never }), "Adam: learning rate must be a number, got '0.1'"],
    ['beta1 = 1', adam({ hyper: { beta1: 1 } }), /^Adam: beta1 must be in \[0, 1\), got 1$/ as never],
    ['beta1 = 1e308', adam({ hyper: { beta1: 1e308 } }), /^Adam: beta1 must be in \[0, 1\), got 1e\+308$/ as never],
    ['beta2 negative', adam({ hyper: { beta2: -1 } }), /^Adam: beta2 must be in \[0, 1\), got -1$/ as never],
    ['epsilon negative', adam({ hyper: { epsilon: -1e-8 } }), 'Adam: epsilon must be a finite number >= 0, got -1e-8'],
    ['a choice that is not offered', adam({ hyper: { epsilonForm: 'eval' } }), "Adam: epsilon form must be one of 'eps-after-correction', 'eps-before-correction', got 'eval'"],
    ['an unknown setting', adam({ hyper: { gamma: 1 } }), /^Adam: unknown setting 'gamma' \(known: .*beta1.*\)$/ as never],
    ['a prototype key as a setting', adam({ hyper: JSON.parse('{"__proto__": 1}') }), /^Adam: unknown setting '__proto__'/ as never],
    ['momentum negative', { kind: 'momentum', learningRate: 0.01, hyper: { momentum: -0.5 } }, /^Momentum \(heavy ball\): momentum must be in \[0, 1\), got -0\.5$/ as never],
    ['clip norm 0', adam({ clipNorm: 0 }), 'Adam: clip gradient norm at must be a finite number > 0, got 0'],
    ['weight decay NaN', adam({ weightDecay: Number.NaN }), 'Adam: weight decay (decoupled) must be a finite number >= 0, got NaN'],
  ])('%s', (_what, spec, message) => {
    const problems = validateOptimizerSpec(spec);
    expect(problems.length).toBeGreaterThan(0);
    const shown = optimizerMessage(problems[0].message, spec.kind);
    if (typeof message === 'string') expect(shown).toBe(message);
    else expect(shown).toMatch(message);
  });
});

const settings = (patch: Omit<Partial<RunSettings>, 'stop'> & { stop?: Partial<RunSettings['stop']> }): RunSettings =>
  ({ start: [-1.2, 1], seed: 1, ...patch, stop: { maxSteps: 100, ...patch.stop } }) as RunSettings;

function runSettingsProblem(s: RunSettings): string {
  try {
    validateRunSettings(s, 2);
  } catch (e) {
    return runSettingsMessage((e as Error).message);
  }
  return 'accepted';
}

describe('run settings: numbers outside their range', () => {
  it.each<[string, RunSettings, string]>([
    ['1e9 steps', settings({ stop: { maxSteps: 1e9 } }), 'max steps must be a whole number from 1 to 10000000, got 1000000000'],
    ['0 steps', settings({ stop: { maxSteps: 0 } }), 'max steps must be a whole number from 1 to 10000000, got 0'],
    ['negative steps', settings({ stop: { maxSteps: -5 } }), 'max steps must be a whole number from 1 to 10000000, got -5'],
    ['fractional steps', settings({ stop: { maxSteps: 2.5 } }), 'max steps must be a whole number from 1 to 10000000, got 2.5'],
    ['Infinity steps', settings({ stop: { maxSteps: Infinity } }), 'max steps must be a whole number from 1 to 10000000, got Infinity'],
    ['negative loss tolerance', settings({ stop: { lossChangeTolerance: -1 } }), 'loss change below must be a finite number >= 0, got -1'],
    ['NaN gradient tolerance', settings({ stop: { gradientNormTolerance: Number.NaN } }), 'gradient norm below must be a finite number >= 0, got NaN'],
    ['NaN start', settings({ start: [Number.NaN, 0] }), 'start point: coordinate 1 must be a finite number, got NaN'],
    ['Infinity start', settings({ start: [0, -Infinity] }), 'start point: coordinate 2 must be a finite number, got -Infinity'],
    ['start of the wrong length', settings({ start: [0, 0, 0] }), 'start point: expected 2 coordinates, got 3'],
    ['Infinity seed', settings({ seed: Infinity }), 'seed must be a finite number, got Infinity'],
    ['negative gradient noise', settings({ gradientNoise: -1 }), 'gradient noise (std) must be a finite number >= 0, got -1'],
  ])('%s', (_what, s, message) => {
    expect(runSettingsProblem(s)).toBe(message);
  });
});

describe('legal but hopeless values end the run with an outcome that says so', () => {
  const rosenbrock = buildSurface({ kind: 'catalogue', id: 'rosenbrock' });

  it('a learning rate of 1e308 diverges at step 1 (the point overflows)', () => {
    const cursor = new RunCursor(rosenbrock, buildOptimizer({ kind: 'gd', learningRate: 1e308 }), settings({}));
    cursor.advance(100);
    expect(cursor.outcome).toMatchObject({ kind: 'diverged', step: 1 });
  });

  it('a start at 1e308 is refused as a start where the loss does not exist', () => {
    // Rosenbrock's value there is 100 (y - x^2)^2 + (1 - x)^2 = Infinity.
    const cursor = new RunCursor(rosenbrock, buildOptimizer({ kind: 'gd', learningRate: 1e-3 }), settings({ start: [1e308, 0] }));
    expect(cursor.outcome?.kind).toMatch(/^(undefined|diverged)$/);
    expect(cursor.outcome?.step).toBe(0);
  });
});
