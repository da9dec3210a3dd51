import { describe, expect, it } from 'vitest';
import { validateOptimizerSpec, defaultOptimizerSpec, validateRunSettings, SettingError } from '../../src/engine';
import { buildSurface, parseDatasetCsv } from '../../src/problems';
import { noticeMessage, csvFailureText, csvProblemText, optimizerMessage, runErrorMessage, runSettingsMessage, surfaceMessage } from '../../src/ui/messages';

function firstProblem(spec: object): string {
  return validateOptimizerSpec(spec as never)[0].message;
}

describe('page messages', () => {
  it('name optimizer fields as the run editor labels them', () => {
    const raw = firstProblem({ ...defaultOptimizerSpec('adam'), learningRate: -1 });
    expect(raw).toBe('adam: learningRate must be a finite number > 0, got -1');
    expect(optimizerMessage(raw, 'adam')).toBe('Adam: learning rate must be a finite number > 0, got -1');
    const decay = firstProblem({ ...defaultOptimizerSpec('rmsprop'), hyper: { decay: 1.5, initialMeanSquare: -1 } });
    expect(decay).toMatch(/^rmsprop: decay must be/);
    expect(optimizerMessage(decay, 'rmsprop')).toMatch(/^RMSProp: decay \(rho\) must be/);
    expect(optimizerMessage(firstProblem({ ...defaultOptimizerSpec('adam'), clipNorm: -2 }), 'adam')).toMatch(/^Adam: clip gradient norm at must be/);
    expect(optimizerMessage(firstProblem({ ...defaultOptimizerSpec('lbfgs'), learningRate: 0 }), 'lbfgs')).toMatch(/^L-BFGS: first trial step must be/);
    expect(runErrorMessage(raw, 'adam')).toBe('Adam: learning rate must be a finite number > 0, got -1');
  });
  it('name run settings by their labels', () => {
    let message = '';
    try {
      validateRunSettings({ start: [0, 0], seed: 1, stop: { maxSteps: 0 } }, 2);
    } catch (e) {
      message = (e as SettingError).message;
    }
    expect(message).toMatch(/^stop: maxSteps/);
    expect(runSettingsMessage(message)).toMatch(/^max steps must be a whole number/);
  });
  it('name data-fit fields by their labels', () => {
    let message = '';
    try {
      buildSurface({ kind: 'datafit', dataset: { kind: 'demo', id: 'seed-pods' }, model: { kind: 'mlp', inputs: ['length_mm'], target: 'ripe', hidden: [8, 4, 2], activation: 'tanh', head: 'binary' } });
    } catch (e) {
      message = (e as Error).message;
    }
    expect(message).toMatch(/^surface spec \(datafit\): model \(mlp\): hidden must list/);
    expect(surfaceMessage(message)).toMatch(/^Model on data: small neural network: Hidden widths must list 1 or 2 layer widths/);
    expect(surfaceMessage('the map needs two or more variables')).toBe('the map needs two or more variables');
  });
  it('say which row has too many fields without an empty column name', () => {
    const r = parseDatasetCsv('dose,response\n1,2\n2,4,7\n', { name: 'f.csv' });
    expect(r.ok).toBe(false);
    expect(r.problems[0].column).toBe('');
    expect(csvProblemText(r.problems[0])).toBe('row 3: more fields than the header has ("7")');
    if (!r.ok) expect(csvFailureText(r)).toBe('1 value could not be read (first: row 3: more fields than the header has ("7")); fix them or tick "drop rows that cannot be read"');
  });
  it('rewrite a surface error quoted in a notice', () => {
    expect(noticeMessage("The experiment's surface could not be built (surface spec (datafit): model (mlp): hidden must list 1 or 2 layer widths, got [1,2,3]); nothing was changed.")).toBe(
      "The experiment's surface could not be built (Model on data: small neural network: Hidden widths must list 1 or 2 layer widths, got [1,2,3]); nothing was changed.",
    );
    expect(noticeMessage('Storage is full.')).toBe('Storage is full.');
  });
});
