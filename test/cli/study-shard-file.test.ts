import { describe, expect, it } from 'vitest';
import type { RunOutcome } from '../../src/engine';
import { readStudyShard, studyShardText } from '../../src/cli/study-shard-file';
import { demoWorkspace } from '../../src/store/demo';

describe('a shard\'s study cells file', () => {
  it('reads back every double bit for bit, NaN, infinities and -0 included', () => {
    const diverged: RunOutcome = { kind: 'diverged', step: 4, reason: 'non-finite', detail: 'the loss is NaN' };
    const limit: RunOutcome = { kind: 'step-limit', step: 9, point: { gradNorm: Infinity, gradThreshold: 1e-4, stationary: false, curvature: null, newtonStep: null } };
    const cells = {
      indices: Int32Array.from([5, 2]),
      steps: Int32Array.from([4, 9]),
      loss: Float64Array.from([Number.NaN, 0.1 + 0.2]),
      endPoints: Float64Array.from([Infinity, -Infinity, -0, 5e-324]),
      stepsToTolerance: Int32Array.from([-1, 7]),
      outcomes: [diverged, limit],
    };
    const file = { format: 'fall-line-study-cells' as const, hash: 'sha256:x', shard: { index: 1, count: 3 }, experiment: demoWorkspace(), studies: [cells] };
    const back = readStudyShard(studyShardText(file));
    expect(back.studies[0]).toEqual(cells);
    expect(Object.is(back.studies[0].endPoints[2], -0)).toBe(true);
    expect(back.studies[0].loss[1]).toBe(0.30000000000000004);
    expect(back.studies[0].outcomes[1]).toEqual(limit);
    expect(back.experiment).toEqual(demoWorkspace());
    expect(back.shard).toEqual({ index: 1, count: 3 });
  });

  it('refuses a shard without steps to tolerance rather than write them empty', () => {
    const text = studyShardText({ format: 'fall-line-study-cells', hash: 'sha256:x', shard: { index: 0, count: 2 }, experiment: demoWorkspace(), studies: [{ indices: Int32Array.of(0), steps: Int32Array.of(1), loss: Float64Array.of(1), endPoints: Float64Array.of(0, 0), stepsToTolerance: Int32Array.of(-1), outcomes: [{ kind: 'diverged', step: 1, reason: 'non-finite', detail: 'x' }] }] });
    const old = JSON.parse(text);
    delete old.studies[0].stepsToTolerance;
    expect(() => readStudyShard(JSON.stringify(old))).toThrow('no steps to tolerance');
  });

  it('refuses other JSON', () => {
    expect(() => readStudyShard('{"format":"fall-line-summary"}')).toThrow('not a shard study-cells file');
  });
});
