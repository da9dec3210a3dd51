import { describe, expect, it } from 'vitest';
import { buildSurface, DEMO_DATASETS, type DatasetSpec } from '../../../src/problems';
import { draftFor, specOfDraft } from '../../../src/ui/surface/datafit/draft';

describe('data-fit drafts', () => {
  it("the model-formula template uses the dataset's own input, so it builds as offered", () => {
    const datasets: DatasetSpec[] = [...Object.keys(DEMO_DATASETS).map((id) => ({ kind: 'demo', id }) as DatasetSpec), { kind: 'iris' }];
    for (const dataset of datasets) {
      const draft = { ...draftFor(dataset), model: 'formula' as const };
      expect(draft.formula).toContain(draft.inputs[0]);
      const result = specOfDraft(draft);
      if (!('spec' in result)) throw new Error(result.message);
      expect(() => buildSurface(result.spec), JSON.stringify(dataset)).not.toThrow();
    }
  });

  it('each refusal names its field as the form labels it (Inputs, Target, Hidden widths, Parameters, Start)', () => {
    const base = draftFor({ kind: 'demo', id: 'seed-pods' });
    const cases: [Partial<typeof base>, string, RegExp][] = [
      [{ inputs: [] }, 'inputs', /^inputs: /],
      [{ model: 'mlp', hidden: '8, x' }, 'hidden', /^Hidden widths: must be whole numbers/],
      [{ model: 'formula', parameters: ' ' }, 'parameters', /^parameters: /],
      [{ model: 'formula', parameters: 'b1, b2', start: '1' }, 'start', /^start: give 2 numbers/],
    ];
    for (const [patch, field, message] of cases) {
      const result = specOfDraft({ ...base, ...patch });
      expect('field' in result && result.field).toBe(field);
      if ('field' in result) expect(result.message).toMatch(message);
    }
  });
});
