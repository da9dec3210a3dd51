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
});
