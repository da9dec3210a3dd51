import { describe, expect, it } from 'vitest';
import { FormulaSyntaxError } from '../../src/engine';
import { buildSurface, catalogueEntry, catalogueIds, describeSurface, type SurfaceSpec } from '../../src/problems';

/** Specs arrive from JSON (experiment files, worker messages); the bad ones are typed loosely on purpose. */
const loose = (v: unknown) => v as SurfaceSpec;

describe('buildSurface', () => {
  it('builds a catalogue surface with its published constants', () => {
    const s = buildSurface({ kind: 'catalogue', id: 'rosenbrock' });
    expect(s.dimension).toBe(2);
    expect(s.variables).toEqual(['x', 'y']);
    // f(-1.2, 1) = 2.2^2 + 100 * (1 - 1.44)^2 = 4.84 + 19.36 = 24.2 (reference section 1)
    expect(s.value([-1.2, 1])).toBeCloseTo(24.2, 12);
  });

  it('applies constant overrides and keeps the other defaults', () => {
    const s = buildSurface({ kind: 'catalogue', id: 'rosenbrock', constants: { b: 10 } });
    expect(s.value([-1.2, 1])).toBeCloseTo(4.84 + 1.936, 12);
  });

  it('builds a typed formula with exact derivatives, variables alphabetical by default', () => {
    const s = buildSurface({ kind: 'formula', text: 'x^2 + 10*y^2' });
    expect(s.variables).toEqual(['x', 'y']);
    const g = new Float64Array(2);
    const h = new Float64Array(4);
    expect(s.valueGradientHessian([1, 1], g, h)).toBe(11);
    expect(Array.from(g)).toEqual([2, 20]);
    expect(Array.from(h)).toEqual([2, 0, 0, 20]);
  });

  it('passes variable order and constants to the compiler', () => {
    const s = buildSurface({ kind: 'formula', text: 'k*x + y', variables: ['y', 'x'], constants: { k: 3 } });
    expect(s.variables).toEqual(['y', 'x']);
    expect(s.value([1, 2])).toBe(7);
    expect(buildSurface({ kind: 'formula', text: 'k*x^2', constants: { k: 3 } }).variables).toEqual(['x']);
  });

  it('builds the same surface from a spec that went through JSON', () => {
    const spec: SurfaceSpec = { kind: 'catalogue', id: 'rastrigin', constants: { A: 3 } };
    const copy = JSON.parse(JSON.stringify(spec)) as SurfaceSpec;
    expect(buildSurface(copy).value([0.3, -1.7])).toBe(buildSurface(spec).value([0.3, -1.7]));
  });

  it('throws FormulaSyntaxError for bad formula text', () => {
    expect(() => buildSurface({ kind: 'formula', text: 'x^2 +' })).toThrow(FormulaSyntaxError);
  });

  it.each([
    ['null', null, "surface spec: expected an object with a 'kind', got null"],
    ['a string', 'rosenbrock', "surface spec: expected an object with a 'kind', got string"],
    ['an array', [], "surface spec: expected an object with a 'kind', got an array"],
    ['an unknown kind', { kind: 'dataset', id: 'x' }, 'surface spec: unknown kind "dataset"; known kinds: catalogue, formula, datafit'],
    ['no kind', { id: 'rosenbrock' }, 'surface spec: unknown kind undefined; known kinds: catalogue, formula, datafit'],
    ['a catalogue spec without id', { kind: 'catalogue' }, 'surface spec (catalogue): id must be a string, got nothing'],
    ['an unknown id', { kind: 'catalogue', id: 'banana' }, `catalogue: no surface with id 'banana'; known ids: ${catalogueIds().join(', ')}`],
    ['an unknown constant', { kind: 'catalogue', id: 'beale', constants: { a: 1 } }, "catalogue beale: unknown constant 'a'; it has no constants"],
    ['a non-numeric constant', { kind: 'catalogue', id: 'rosenbrock', constants: { a: '1' } }, 'surface spec (catalogue rosenbrock): constant a must be a finite number, got "1"'],
    ['constants as an array', { kind: 'catalogue', id: 'rosenbrock', constants: [1] }, 'surface spec (catalogue rosenbrock): constants must be an object of numbers, got an array'],
    ['formula text missing', { kind: 'formula' }, 'surface spec (formula): text must be a string, got nothing'],
    ['formula text a number', { kind: 'formula', text: 3 }, 'surface spec (formula): text must be a string, got number'],
    ['formula variables not names', { kind: 'formula', text: 'x', variables: 'x' }, 'surface spec (formula): variables must be an array of names'],
    ['an infinite formula constant', { kind: 'formula', text: 'k*x', constants: { k: null } }, 'surface spec (formula): constant k must be a finite number, got null'],
    ['a datafit spec without a dataset', { kind: 'datafit', model: { kind: 'linear', inputs: ['x'], target: 'y' } }, "surface spec (datafit): dataset: expected an object with a 'kind', got nothing"],
    ['a datafit spec without a model', { kind: 'datafit', dataset: { kind: 'iris' } }, "surface spec (datafit): model must be an object with a 'kind', got nothing"],
    ['a datafit spec with an unknown column', { kind: 'datafit', dataset: { kind: 'iris' }, model: { kind: 'linear', inputs: ['petal'], target: 'sepal_length' } }, "dataset iris: no column 'petal' for the input; columns: sepal_length, sepal_width, petal_length, petal_width, species"],
    ['a datafit spec with a negative l2', { kind: 'datafit', dataset: { kind: 'iris' }, model: { kind: 'softmax', inputs: ['petal_length'], target: 'species' }, l2: -1 }, 'surface spec (datafit): l2 must be a finite number >= 0, got -1'],
  ])('rejects %s with a clear message', (_, spec, message) => {
    expect(() => buildSurface(loose(spec))).toThrow(message);
    expect(() => describeSurface(loose(spec))).toThrow(message);
  });
});

describe('buildSurface (datafit)', () => {
  it('builds the loss of a model on a dataset, the same after a trip through JSON', () => {
    const spec: SurfaceSpec = { kind: 'datafit', dataset: { kind: 'iris' }, model: { kind: 'softmax', inputs: ['petal_length', 'petal_width'], target: 'species' }, standardise: true };
    const s = buildSurface(spec);
    expect(s.dimension).toBe(9);
    // At all-zero parameters every class has probability 1/3: the mean cross-entropy is log 3.
    expect(s.value(new Array(9).fill(0))).toBeCloseTo(Math.log(3), 14);
    const copy = JSON.parse(JSON.stringify(spec)) as SurfaceSpec;
    const p = [0.1, -0.2, 0.3, 0.4, -0.5, 0.6, 0.7, 0.8, -0.9];
    expect(buildSurface(copy).value(p)).toBe(s.value(p));
  });
});

describe('describeSurface', () => {
  it('describes a catalogue surface from its entry', () => {
    const entry = catalogueEntry('six-hump-camel');
    const d = describeSurface({ kind: 'catalogue', id: 'six-hump-camel' });
    expect(d).toEqual({
      label: 'Six-hump camel',
      variables: ['x', 'y'],
      view: entry.view,
      knownPoints: entry.knownPoints,
      suggestedStart: entry.suggestedStart,
      logScaleOffset: entry.logScaleOffset,
    });
  });

  it('names changed constants in the label and moves the known points', () => {
    const d = describeSurface({ kind: 'catalogue', id: 'rosenbrock', constants: { a: 2, b: 100 } });
    expect(d.label).toBe('Rosenbrock (a = 2)');
    expect(d.knownPoints.map((p) => p.point)).toEqual([[2, 4]]);
    expect(d.logScaleOffset).toBeUndefined();
  });

  it('describes a typed formula: its variables, a [-3, 3] box each and no known points', () => {
    expect(describeSurface({ kind: 'formula', text: ' a*u^2 + v ', constants: { a: 2 } })).toEqual({
      label: 'a*u^2 + v',
      variables: ['u', 'v'],
      view: [
        [-3, 3],
        [-3, 3],
      ],
      knownPoints: [],
    });
  });

  it('returns copies, so a caller cannot change the catalogue', () => {
    const d = describeSurface({ kind: 'catalogue', id: 'booth' });
    d.view[0][0] = 99;
    d.variables.push('z');
    expect(catalogueEntry('booth').view[0][0]).toBe(-10);
    expect(catalogueEntry('booth').variables).toEqual(['x', 'y']);
  });
});
