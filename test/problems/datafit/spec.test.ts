import { describe, expect, it } from 'vitest';
import { FormulaSyntaxError } from '../../../src/engine';
import { buildSurface, describeSurface, designFor, isCertifiedNonlinearFit, nistDataFitSpec, type DataFitSpec, type SurfaceSpec } from '../../../src/problems';
import { SPECS } from './specs';

const loose = (v: unknown) => v as SurfaceSpec;
const iris = { kind: 'iris' };

describe('data-fit spec validation', () => {
  it.each([
    [{ kind: 'datafit', dataset: iris, model: { kind: 'tree', inputs: ['a'], target: 'b' } }, 'surface spec (datafit): model: unknown kind "tree"; known kinds: linear, logistic, softmax, mlp, formula'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'linear', inputs: [], target: 'y' } }, 'surface spec (datafit): model (linear): inputs must be a non-empty array of column names, got an array'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'linear', inputs: ['a'] } }, 'surface spec (datafit): model (linear): target must be a column name, got nothing'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'linear', inputs: ['a'], target: 'b', loss: 'mae' } }, 'surface spec (datafit): model (linear): loss must be one of rss, mse, got "mae"'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'logistic', inputs: ['a'], target: 'b', loss: 'rss' } }, "surface spec (datafit): model (logistic): unknown field 'loss'; allowed: kind, inputs, target"],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'mlp', inputs: ['a'], target: 'b', hidden: [8, 8, 8], activation: 'tanh', head: 'binary' } }, 'surface spec (datafit): model (mlp): hidden must list 1 or 2 layer widths, each a whole number from 1 to 64, got [8,8,8]'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'mlp', inputs: ['a'], target: 'b', hidden: [8], activation: 'sigmoid', head: 'binary' } }, 'surface spec (datafit): model (mlp): activation must be one of tanh, relu, got "sigmoid"'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'mlp', inputs: ['a'], target: 'b', hidden: [8], activation: 'relu', head: 'poisson' } }, 'surface spec (datafit): model (mlp): head must be one of regression, binary, softmax, got "poisson"'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'formula', inputs: ['x'], target: 'y', parameters: ['b'] } }, 'surface spec (datafit): model (formula): text must be a string, got nothing'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'formula', inputs: ['x'], target: 'y', text: 'b*x', parameters: ['b'], start: [1, 2] } }, 'surface spec (datafit): model (formula): start must give one finite number per parameter (1), got [1,2]'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'formula', inputs: ['x'], target: 'y', text: 'b*x', parameters: ['b'], inputNames: [] } }, 'surface spec (datafit): model (formula): inputNames must give one name per input column (1), got an array'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'formula', inputs: ['x'], target: 'y', text: 'b*x', parameters: ['b'] }, standardise: true }, "surface spec (datafit): standardise is not offered for formula models (the formula's parameters refer to its inputs in their own units)"],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'softmax', inputs: ['sepal_length'], target: 'species' }, standardise: 'yes' }, 'surface spec (datafit): standardise must be true or false, got "yes"'],
    [{ kind: 'datafit', dataset: iris, model: { kind: 'softmax', inputs: ['sepal_length'], target: 'species' }, weights: [] }, "surface spec (datafit): unknown field 'weights'; allowed: kind, dataset, model, l2, standardise"],
    [{ kind: 'datafit', dataset: { kind: 'demo', id: 'x' }, model: { kind: 'linear', inputs: ['a'], target: 'b' } }, 'surface spec (datafit): dataset (demo): unknown id "x"; known ids: probe-calibration, seed-pods, pebbles, wave-boundary'],
  ])('rejects %j', (spec, message) => {
    expect(() => buildSurface(loose(spec))).toThrow(message);
    expect(() => describeSurface(loose(spec))).toThrow(message);
  });

  it.each([
    [{ kind: 'logistic', inputs: ['sepal_length'], target: 'species' }, 'dataset iris: target \'species\' has 3 classes; logistic regression needs 2 (use softmax for more)'],
    [{ kind: 'softmax', inputs: ['sepal_length'], target: 'petal_width' }, "dataset iris: target 'petal_width' must hold class codes 0, 1, 2, ... (below 100); row 1 has 0.2"],
    [{ kind: 'linear', inputs: ['species', 'species'], target: 'petal_width' }, 'dataset iris: an input column is listed twice (species, species)'],
    [{ kind: 'linear', inputs: ['species'], target: 'species' }, "dataset iris: column 'species' cannot be both an input and the target"],
  ])('checks the data against the model: %j', (model, message) => {
    expect(() => buildSurface(loose({ kind: 'datafit', dataset: iris, model }))).toThrow(message);
  });

  it('a formula with an unknown name is a FormulaSyntaxError', () => {
    const spec = { kind: 'datafit', dataset: { kind: 'demo', id: 'probe-calibration' }, model: { kind: 'formula', text: 'b1 * flow + c', parameters: ['b1'], inputs: ['flow'], target: 'signal' } };
    expect(() => buildSurface(loose(spec))).toThrow(FormulaSyntaxError);
  });
});

describe('describeSurface for data-fit specs', () => {
  const inBox = (view: [number, number][], p: number[]) => p.every((v, j) => view[j][0] <= v && v <= view[j][1]);

  it.each(Object.keys(SPECS))('%s: one box per parameter around the start, the start and any known point inside', (key) => {
    const d = describeSurface(SPECS[key]);
    const s = buildSurface(SPECS[key]);
    expect(d.variables).toEqual([...s.variables]);
    expect(d.view.length).toBe(s.dimension);
    for (const [lo, hi] of d.view) expect(lo).toBeLessThan(hi);
    expect(inBox(d.view, d.suggestedStart!)).toBe(true);
    for (const p of d.knownPoints) expect(inBox(d.view, p.point)).toBe(true);
  });

  it('linear: the exact least-squares solution is the global minimum, gradient zero there, Hessian eigenvalues listed', () => {
    const d = describeSurface(SPECS['linear mse, 2 inputs, l2, standardised']);
    expect(d.knownPoints.length).toBe(1);
    const [min] = d.knownPoints;
    expect(min.kind).toBe('global-min');
    expect(min.source).toBe('normal equations (closed form)');
    const s = buildSurface(SPECS['linear mse, 2 inputs, l2, standardised']);
    const g = new Float64Array(3);
    expect(s.valueGradient(min.point, g)).toBeCloseTo(min.value, 14);
    expect(Math.max(...g.map(Math.abs))).toBeLessThan(1e-12);
    expect(min.hessianEigenvalues!.length).toBe(3);
    expect(d.logScaleOffset).toBe(min.value);
    expect(d.label).toBe('Linear regression of ripe on length_mm, mass_g (mean squared error) - Ripe seed pods (made-up) (L2 0.3, standardised inputs)');
    expect(d.suggestedStart).toEqual([0, 0, 0]);
  });

  it('names parameters after the columns and classes', () => {
    expect(describeSurface(SPECS['logistic, raw inputs']).variables).toEqual(['intercept', 'w_u', 'w_v']);
    expect(describeSurface(SPECS['softmax on iris']).variables).toEqual([
      'setosa.intercept', 'setosa.w_sepal_length', 'setosa.w_petal_width',
      'versicolor.intercept', 'versicolor.w_sepal_length', 'versicolor.w_petal_width',
      'virginica.intercept', 'virginica.w_sepal_length', 'virginica.w_petal_width',
    ]);
    expect(describeSurface(SPECS['mlp tanh binary']).variables).toEqual([
      'h1.u1.w_u', 'h1.u1.w_v', 'h1.u2.w_u', 'h1.u2.w_v', 'h1.u3.w_u', 'h1.u3.w_v', 'h1.u1.b', 'h1.u2.b', 'h1.u3.b',
      'out.w1', 'out.w2', 'out.w3', 'out.b',
    ]);
    const twoLayers = describeSurface(SPECS['mlp tanh 2 layers softmax']).variables;
    expect(twoLayers.slice(9, 12)).toEqual(['h2.u1.w1', 'h2.u1.w2', 'h2.u1.w3']);
    expect(twoLayers.slice(-3)).toEqual(['out.north cove.b', 'out.long strand.b', 'out.south spit.b']);
  });

  it('network: a seeded start, the same for the same seed, not all zeros', () => {
    const a = describeSurface(SPECS['mlp tanh binary']).suggestedStart!;
    expect(describeSurface(SPECS['mlp tanh binary']).suggestedStart).toEqual(a);
    const spec = SPECS['mlp tanh binary'] as DataFitSpec & { model: { initSeed?: number } };
    const other = describeSurface({ ...spec, model: { ...spec.model, initSeed: 2 } } as SurfaceSpec).suggestedStart!;
    expect(other).not.toEqual(a);
    expect(a.some((v) => v !== 0)).toBe(true);
    // Biases start at 0.
    expect([a[6], a[7], a[8], a[12]]).toEqual([0, 0, 0, 0]);
  });

  it('NIST nonlinear: certified minimum only for the certified model without penalty', () => {
    const spec = nistDataFitSpec('boxbod');
    expect(isCertifiedNonlinearFit(spec)).toBe(true);
    expect(isCertifiedNonlinearFit({ ...spec, l2: 1 })).toBe(false);
    const changed = { ...spec, model: { ...spec.model, text: 'b1*(1-exp(-b2*x)) + 0' } } as DataFitSpec;
    expect(isCertifiedNonlinearFit(changed)).toBe(false);
    expect(describeSurface(changed).knownPoints).toEqual([]);
    // Same formula, spaced differently, mean squared error: still certified, value RSS / N.
    const mse = { ...spec, model: { ...spec.model, text: ' b1 * (1 - exp(-b2 * x)) ', loss: 'mse' } } as DataFitSpec;
    expect(describeSurface(mse).knownPoints[0].value).toBeCloseTo(1.1680088766e3 / 6, 9);
  });

  it('a typed formula without a start starts from ones', () => {
    const d = describeSurface(SPECS['formula rss with a constant']);
    expect(d.suggestedStart).toEqual([1, 1]);
    expect(d.knownPoints).toEqual([]);
    expect(d.label).toBe('signal = a + b * flow^k (residual sum of squares) - Flow probe calibration (made-up)');
  });

  it('caches the design: rebuilding from a fresh copy of the spec reuses the parsed data', () => {
    const spec = SPECS['softmax on iris'];
    const copy = JSON.parse(JSON.stringify(spec)) as DataFitSpec;
    expect(designFor(copy.dataset, copy.model.inputs, copy.model.target, false)).toBe(designFor(spec.dataset, spec.model.inputs, spec.model.target, false));
  });
});
