import { describe, expect, it } from 'vitest';
import { makeTable } from '../../../src/problems/datasets/table';
import { drawDataScene, MAX_DRAWN_ROWS, rowStride } from '../../../src/ui/data/data-plot';
import { RecordingContext } from '../plot/recording-context';

/** A made-up table of `rows` rows: y = 2 x + 1 and a 0/1 class column. */
function table(rows: number) {
  return makeTable('made-up', 'test', ['x', 'z', 'y', 'c'], Array.from({ length: rows }, (_, i) => [i, i % 7, 2 * i + 1, i % 2]));
}
/** Each point is one filled marker; the only other fill is the chart's background. */
const markers = (ctx: RecordingContext) => ctx.paints.filter((p) => p.op === 'fill').length - 1;

describe('the data view', () => {
  it('draws every row of a small table and says nothing about thinning', () => {
    const ctx = new RecordingContext();
    const caption = drawDataScene(ctx, { width: 400, height: 300 }, { table: table(150), inputs: ['x'], target: 'y', task: 'regression', predict: null });
    expect(markers(ctx)).toBe(150);
    expect(caption).not.toMatch(/drawn/);
  });

  it.each([
    ['one input', ['x'], 'y', 'regression'],
    ['several inputs', ['x', 'z'], 'y', 'regression'],
    ['classes', ['x', 'z'], 'c', 'binary'],
  ] as const)('with %s, draws MAX_DRAWN_ROWS rows of a 50,000-row table and says so', (_, inputs, target, task) => {
    let predictions = 0;
    const predict = () => (predictions++, 0.5);
    const ctx = new RecordingContext();
    const caption = drawDataScene(ctx, { width: 400, height: 300 }, { table: table(50_000), inputs, target, task, predict: task === 'binary' ? null : predict });
    expect(rowStride(50_000)).toBe(25);
    expect(markers(ctx)).toBe(MAX_DRAWN_ROWS);
    expect(predictions).toBeLessThanOrEqual(MAX_DRAWN_ROWS + 201); // the rows drawn, or the 201 points of the curve
    expect(caption).toContain('(1 row in 25 of 50000 drawn)');
  });
});
